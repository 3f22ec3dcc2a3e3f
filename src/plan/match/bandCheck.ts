/**
 * Spatial dispersion of a chosen recipe: for rods or holes standing along z on a square, hexagonal
 * or rectangular lattice, the lowest band at the design frequency (cells/band/lowestBand.ts) along
 * the principal directions (square Γ–X, Γ–M; hex Γ–M, Γ–K; rect Γ–X, Γ–Y, Γ–S), for the field the
 * polarization puts on the cell (Ez: along the circles; Hz: across them). The `coarse` flag then
 * rests on this number: a cell between λ/10 and λ/4 whose band index stays within the tolerance of
 * its long-wavelength value along every direction (and adds no anisotropy beyond the tolerance) is
 * fine; one whose band departs by more is coarse. Beyond λ/4 the recipe was already refused. A rect
 * recipe of aspect m/n has the spacing a = pitch/m along its x axis (levelCandidates.ts), so its
 * band is solved at k₀a with that a. Other families keep the λ/10 rule.
 */
import type { Polarization } from "../planTypes.js";
import { bandIndex, type BandIndex } from "../../cells/band/lowestBand.js";
import { anchoredBandIndex, type AnchoredBand } from "../../cells/band/anchoredBandIndex.js";
import { SPEED_OF_LIGHT_M_PER_S } from "../../core/physicalConstants.js";
import { rectTiling } from "../../cells/lattice.js";
import type { Candidate } from "./levelCandidates.js";
import type { EvaluatedMaterial } from "./matchContext.js";

const CIRCLE_FAMILIES = new Set(["rods-in-host", "holes-in-slab"]);

export interface BandVerdict {
  band: BandIndex;
  /** the band index anchored on the recipe's solved long-wavelength values (anchoredBandIndex.ts) */
  anchored: AnchoredBand;
  /** "ok" when the band stays within the tolerance of the quasi-static index */
  status: "ok" | "warn";
}

/** Band check of one candidate, or null when it does not apply (family, orientation, lattice, metal). */
export function bandVerdict(c: Candidate, materials: readonly EvaluatedMaterial[], polarization: Polarization, pitchM: number, frequencyHz: number, tolerance: number): BandVerdict | null {
  if (!CIRCLE_FAMILIES.has(c.family) || c.orientation !== "z") return null;
  if (c.lattice !== "square" && c.lattice !== "hex" && c.lattice !== "rect") return null;
  const tiling = c.lattice === "rect" ? rectTiling(c.aspect ?? NaN) : null;
  if (c.lattice === "rect" && !tiling) return null;
  const host = materials.find((m) => m.material.id === c.host);
  const inc = materials.find((m) => m.material.id === c.inclusion);
  if (!host || !inc || !(host.eps.re > 0) || !(inc.eps.re > 0)) return null;
  const spacingM = tiling ? pitchM / tiling.m : pitchM;
  const k0a = (2 * Math.PI * frequencyHz * spacingM) / SPEED_OF_LIGHT_M_PER_S;
  const cell = { lattice: c.lattice, epsHost: host.eps.re, epsCircle: inc.eps.re, fill: c.fillFraction, ...(tiling ? { aspect: c.aspect! } : {}) };
  const pol = polarization === "Ez" ? "parallel" : "perpendicular";
  const band = bandIndex(cell, pol, k0a);
  const ok = band.inBand && band.deviation <= tolerance && band.excessAnisotropy <= tolerance;
  // the recipe's achieved values: Ez [ε_z, μ_1, μ_2], Hz [μ_z, ε_1, ε_2] (ε_1 along the lattice's x)
  const solved = polarization === "Ez" ? { zz: c.achieved[0] } : { xx: c.achieved[1], yy: c.achieved[2] };
  const anchored = anchoredBandIndex(band, c.lattice, pol, solved, c.aspect ?? 1) ?? { index: band.index, quasiStaticIndex: band.quasiStaticIndex };
  return { band, anchored, status: ok ? "ok" : "warn" };
}
