/**
 * Wire medium as a cell family: parallel metal wires of radius r on a square or hexagonal lattice of
 * pitch a (f = πr²/A), up to r = 0.3a (square) or 0.2a (hex), the thickest wire whose lattice cut-off is solved
 * (wireCutoff/). Along the wires: the Drude response of wireMedium.ts with the lattice plasma
 * frequency (needs pitch and frequency in the context); across them: Maxwell Garnett for cylinders
 * with the metal's ε (a small correction for thin wires).
 */
import type { Complex } from "../../core/complex.js";
import { ProgrammerError } from "../../core/errors.js";
import { getMixingRule } from "../../media/mixing/registry.js";
import type { CellContext, CellFamily, FillResult } from "../cellFamily.js";
import { EPS0 } from "../physicalConstants.js";
import { radiusForTarget, wireMediumResponse } from "../wireMedium.js";

import { cellAreaM2, type Lattice } from "../lattice.js";
import { wireTableMaxRatio } from "../wireMedium.js";

const wireLattice = (l: Lattice): "square" | "hex" => (l === "hex" ? "hex" : "square");
/** largest fill: the thickest wire with a solved cut-off (0.3a square, 0.2a hex) */
const maxFill = (l: Lattice): number => (Math.PI * wireTableMaxRatio(wireLattice(l)) ** 2) / cellAreaM2(1, l);

/** Pitch, frequency and metal conductivity from the context (σ falls back to ωε₀·Im ε_metal). */
export function resonantContext(context: CellContext | undefined, inclusion: Complex, familyId: string): { pitchM: number; frequencyHz: number; conductivitySPerM: number } {
  const pitchM = context?.pitchM;
  const frequencyHz = context?.frequencyHz;
  if (!(pitchM! > 0) || !(frequencyHz! > 0)) throw new ProgrammerError(`${familyId} needs pitchM and frequencyHz in its context`, context);
  const sigma = context?.conductivitySPerM ?? 2 * Math.PI * frequencyHz! * EPS0 * inclusion.im;
  if (!(sigma > 0)) throw new ProgrammerError(`${familyId} needs a conducting inclusion (σ > 0)`, { inclusion, context });
  return { pitchM: pitchM!, frequencyHz: frequencyHz!, conductivitySPerM: sigma };
}

export const wireMediumFamily: CellFamily = {
  id: "wire-medium",
  description: "parallel thin metal wires, square or hexagonal lattice: ε below the host's along the wires (resonant, Drude with the lattice cut-off)",
  resonant: true,
  lattices: ["square", "hex"],
  dimension: 2,
  isotropic: false,
  defaultAxis: "parallel",
  fabricatedPhase: "inclusion",
  fillRange: (l) => [0, maxFill(l)],
  dimensionsFromFill: (fill, pitchM, l) => ({ radiusM: Math.sqrt((fill * cellAreaM2(pitchM, l)) / Math.PI) }),
  fillFromDimensions: (dims, pitchM, l) => (Math.PI * dims.radiusM ** 2) / cellAreaM2(pitchM, l),
  smallestFeatureM(fill, pitchM, l) {
    const d = 2 * Math.sqrt((fill * cellAreaM2(pitchM, l)) / Math.PI);
    return { featureM: d, gapM: Math.max(0, pitchM - d) };
  },
  effectivePermittivity(host, inclusion, fill, lattice, context) {
    const { pitchM, frequencyHz, conductivitySPerM } = resonantContext(context, inclusion, "wire-medium");
    const radiusM = Math.sqrt((fill * cellAreaM2(pitchM, lattice)) / Math.PI);
    const par = wireMediumResponse({ pitchM, radiusM, frequencyHz, hostEps: host, conductivitySPerM, lattice: wireLattice(lattice) }).eps;
    const perp = getMixingRule("mg-cylinder").forward(host, inclusion, fill);
    return { parallel: par, perpendicular: perp, rules: { parallel: "wire-medium", perpendicular: "mg-cylinder" } };
  },
  fillForTarget(host, inclusion, targetRe, axis, lattice, context): FillResult {
    if (axis === "perpendicular") {
      const inv = getMixingRule("mg-cylinder").inverse(host, inclusion, targetRe);
      const inRange = inv.fill >= 0 && inv.fill <= maxFill(lattice);
      return { ...inv, fill: inRange ? inv.fill : NaN, ruleFill: inv.fill, inRange, ...(inRange ? {} : { reason: inv.reason ?? `ε' = ${targetRe} across the wires needs fill ${inv.fill}, beyond touching wires` }) };
    }
    const { pitchM, frequencyHz, conductivitySPerM } = resonantContext(context, inclusion, "wire-medium");
    const r = radiusForTarget(targetRe, pitchM, frequencyHz, host, conductivitySPerM, wireLattice(lattice));
    const fill = (Math.PI * r.radiusM ** 2) / cellAreaM2(pitchM, lattice);
    const inRange = Number.isFinite(fill) && fill <= maxFill(lattice) * (1 + 1e-9);
    return { fill: inRange ? fill : NaN, achieved: r.achieved, converged: r.converged, iterations: r.iterations, ruleFill: fill, inRange, ...(r.reason ? { reason: r.reason } : {}) };
  },
};
