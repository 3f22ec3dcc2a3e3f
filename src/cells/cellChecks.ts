/** Checks every cell design shares: target error, process reach, homogenization. */
import { cAbs, type Complex, cSqrt } from "../core/complex.js";
import type { FabricatedPhase, SmallestFeature } from "./cellFamily.js";
import type { CellPhase } from "./cellDesignTypes.js";
import { homogenizationCheck, type HomogenizationCheck } from "./homogenization.js";
import { checkProcess, type Process, type ProcessCheck } from "./process.js";

/** |Re achieved − target| / max(|target|, 1): relative above 1, absolute near zero (so ε ≈ 0 targets are not held to an impossible relative precision). */
export function matchError(achieved: Complex, target: number): number {
  return Math.abs(achieved.re - target) / Math.max(Math.abs(target), 1);
}

/** The ±band a tolerance allows around a target: tolerance·max(|target|, 1). */
export const toleranceAbs = (tolerance: number, target: number): number => tolerance * Math.max(Math.abs(target), 1);

const isFluid = (materialClass: string): boolean => materialClass === "gas" || materialClass === "liquid";

/**
 * The solid part a process shapes, and its smallest sizes. A gas or liquid phase is never shaped:
 * where the family's fabricated phase is one (air rods are holes in the host, air spheres are voids),
 * the process shapes the other phase around it, so the roles of feature (smallest solid part) and gap
 * (smallest opening) swap. Null when both phases are fluid: there is nothing to shape.
 * Example: rods of air (diameter 0.3 mm, walls 0.1 mm) in resin → resin, feature 0.1 mm, gap 0.3 mm.
 */
export function shapedPart(which: FabricatedPhase, hostClass: string, inclusionClass: string, feature: SmallestFeature): { classes: string[]; feature: SmallestFeature } | null {
  const named = which === "both" ? [inclusionClass, hostClass] : which === "host" ? [hostClass] : [inclusionClass];
  const solid = named.filter((c) => !isFluid(c));
  if (solid.length) return { classes: [...new Set(solid)], feature };
  const other = which === "host" ? inclusionClass : which === "inclusion" ? hostClass : null;
  if (other === null || isFluid(other)) return null;
  return { classes: [other], feature: { featureM: feature.gapM, gapM: feature.featureM } };
}

/**
 * Process check of the part the process shapes (`shapedPart`): the size reasons once, each material
 * class the process does not take once. Null without a process.
 */
export function processCheckFor(process: Process | undefined, which: FabricatedPhase, hostClass: string, inclusionClass: string, feature: SmallestFeature & { heightM?: number }): ProcessCheck | null {
  if (!process) return null;
  const part = shapedPart(which, hostClass, inclusionClass, feature);
  if (part === null) return { ok: false, reasons: [`nothing for ${process.name} to shape: both phases are gas or liquid`] };
  const reasons = new Set<string>();
  const sizes = { ...part.feature, ...(feature.heightM !== undefined ? { heightM: feature.heightM } : {}) };
  for (const c of part.classes) for (const r of checkProcess(process, sizes, c).reasons) reasons.add(r);
  return { ok: reasons.size === 0, reasons: [...reasons] };
}

/** Index of a phase for the homogenization check: |Re sqrt(ε)|; metals are skipped (fields do not enter them). */
export function phaseIndex(p: CellPhase): number {
  return p.class === "metal" ? 0 : Math.abs(cSqrt(p.eps).re);
}

/**
 * Homogenization check with n_max over the given phases and effective values (ε·μ). An effective
 * value counts by its propagating index Re √(εμ): a wire medium below its plasma frequency (ε < 0,
 * μ = 1) carries no wave along the check's direction — it is evanescent, not short-wavelength — so
 * its |ε| sets no wavelength, and the size criterion is the pitch against the wavelength in the
 * propagating phases (the host; for wire media the local model needs a ≪ λ there: Belov et al.,
 * "Strong spatial dispersion in wire media in the very large wavelength limit", Phys. Rev. B 67,
 * 113103 (2003)). This is the planner's rule too (refractiveIndex(ε).re, plan/match).
 */
export function homogenizationFor(pitchM: number, frequencyHz: number, phases: CellPhase[], effective: Complex[]): HomogenizationCheck & { nMax: number } {
  let nMax = 1;
  for (const p of phases) nMax = Math.max(nMax, phaseIndex(p));
  for (const e of effective) if (Number.isFinite(cAbs(e))) nMax = Math.max(nMax, cSqrt(e).re);
  return { ...homogenizationCheck(pitchM, frequencyHz, nMax), nMax };
}

/** The human line for a homogenization result that is not ok. */
export function homogenizationNote(h: HomogenizationCheck): string {
  const frac = `pitch is ${h.ratio.toPrecision(3)} of the wavelength in the densest material`;
  return h.status === "refuse" ? `${frac}: too coarse to homogenize (needs ≤ 0.25, ideally ≤ 0.1)` : `${frac}: above the λ/10 guideline, effective-medium values are approximate`;
}
