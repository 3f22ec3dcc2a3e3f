/**
 * Spatial dispersion of a chosen recipe: for rods or holes standing along z on a square or
 * hexagonal lattice, the lowest band at the design frequency (cells/band/lowestBand.ts) along the
 * two principal directions, for the field the polarization puts on the cell (Ez: along the
 * circles; Hz: across them). The `coarse` flag then rests on this number: a cell between λ/10 and
 * λ/4 whose band index stays within the tolerance of its long-wavelength value (and is isotropic
 * within it) is fine; one whose band departs by more is coarse. Beyond λ/4 the recipe was already
 * refused. Other families keep the λ/10 rule.
 */
import type { Polarization } from "../planTypes.js";
import { bandIndex, type BandIndex } from "../../cells/band/lowestBand.js";
import type { Candidate } from "./levelCandidates.js";
import type { EvaluatedMaterial } from "./matchContext.js";

const CIRCLE_FAMILIES = new Set(["rods-in-host", "holes-in-slab"]);

export interface BandVerdict {
  band: BandIndex;
  /** "ok" when the band stays within the tolerance of the quasi-static index */
  status: "ok" | "warn";
}

/** Band check of one candidate, or null when it does not apply (family, orientation, lattice, metal). */
export function bandVerdict(c: Candidate, materials: readonly EvaluatedMaterial[], polarization: Polarization, pitchM: number, frequencyHz: number, tolerance: number): BandVerdict | null {
  if (!CIRCLE_FAMILIES.has(c.family) || c.orientation !== "z") return null;
  if (c.lattice !== "square" && c.lattice !== "hex") return null;
  const host = materials.find((m) => m.material.id === c.host);
  const inc = materials.find((m) => m.material.id === c.inclusion);
  if (!host || !inc || !(host.eps.re > 0) || !(inc.eps.re > 0)) return null;
  const k0a = (2 * Math.PI * frequencyHz * pitchM) / 299_792_458;
  const band = bandIndex({ lattice: c.lattice, epsHost: host.eps.re, epsCircle: inc.eps.re, fill: c.fillFraction }, polarization === "Ez" ? "parallel" : "perpendicular", k0a);
  const ok = band.inBand && band.deviation <= tolerance && band.anisotropy <= tolerance;
  return { band, status: ok ? "ok" : "warn" };
}
