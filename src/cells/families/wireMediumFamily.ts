/**
 * Wire medium as a cell family: parallel metal wires of radius r on a square lattice of pitch a
 * (f = πr²/a², up to touching wires at π/4). Along the wires: the Drude response of wireMedium.ts
 * (needs pitch and frequency in the context); across them: Maxwell Garnett for cylinders with the
 * metal's ε (a small correction for thin wires).
 */
import type { Complex } from "../../core/complex.js";
import { ProgrammerError } from "../../core/errors.js";
import { getMixingRule } from "../../media/mixing/registry.js";
import type { CellContext, CellFamily, FillResult } from "../cellFamily.js";
import { EPS0 } from "../physicalConstants.js";
import { radiusForTarget, wireMediumResponse } from "../wireMedium.js";

const MAX_FILL = Math.PI / 4;

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
  description: "parallel thin metal wires, square lattice: ε below the host's along the wires (resonant, Drude)",
  resonant: true,
  lattices: ["square"],
  dimension: 2,
  isotropic: false,
  defaultAxis: "parallel",
  fabricatedPhase: "inclusion",
  fillRange: () => [0, MAX_FILL],
  dimensionsFromFill: (fill, pitchM) => ({ radiusM: pitchM * Math.sqrt(fill / Math.PI) }),
  fillFromDimensions: (dims, pitchM) => (Math.PI * dims.radiusM ** 2) / (pitchM * pitchM),
  smallestFeatureM(fill, pitchM) {
    const d = 2 * pitchM * Math.sqrt(fill / Math.PI);
    return { featureM: d, gapM: Math.max(0, pitchM - d) };
  },
  effectivePermittivity(host, inclusion, fill, _lattice, context) {
    const { pitchM, frequencyHz, conductivitySPerM } = resonantContext(context, inclusion, "wire-medium");
    const radiusM = pitchM * Math.sqrt(fill / Math.PI);
    const par = wireMediumResponse({ pitchM, radiusM, frequencyHz, hostEps: host, conductivitySPerM }).eps;
    const perp = getMixingRule("mg-cylinder").forward(host, inclusion, fill);
    return { parallel: par, perpendicular: perp, rules: { parallel: "wire-medium", perpendicular: "mg-cylinder" } };
  },
  fillForTarget(host, inclusion, targetRe, axis, lattice, context): FillResult {
    if (axis === "perpendicular") {
      const inv = getMixingRule("mg-cylinder").inverse(host, inclusion, targetRe);
      const inRange = inv.fill >= 0 && inv.fill <= MAX_FILL;
      return { ...inv, fill: inRange ? inv.fill : NaN, ruleFill: inv.fill, inRange, ...(inRange ? {} : { reason: inv.reason ?? `ε' = ${targetRe} across the wires needs fill ${inv.fill}, beyond touching wires` }) };
    }
    const { pitchM, frequencyHz, conductivitySPerM } = resonantContext(context, inclusion, "wire-medium");
    const r = radiusForTarget(targetRe, pitchM, frequencyHz, host, conductivitySPerM);
    const fill = (Math.PI * r.radiusM ** 2) / (pitchM * pitchM);
    const inRange = Number.isFinite(fill) && fill <= MAX_FILL;
    return { fill: inRange ? fill : NaN, achieved: r.achieved, converged: r.converged, iterations: r.iterations, ruleFill: fill, inRange, ...(r.reason ? { reason: r.reason } : {}) };
  },
};
