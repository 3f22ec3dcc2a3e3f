/**
 * The ideal or reduced device as a Scene sampled from the continuous map at any point — not from
 * the design's lattice of cells — so the solver's own grid decides how finely the material is seen.
 * Each sample goes through the same code as the design's cells: the transform's K = ∂G/∂x′
 * (field/transforms), the material kernel ε′ = det K · K⁻¹ ε_b K⁻ᵀ (field/materialFromK.ts), the
 * design's inner offset and principal-value cap (as field/computeTensorField.ts applies them), and
 * the reduction kernel of the chosen scheme (reduce/reduceCell.ts) with the settings the design's
 * reduction was computed with (background replacement, boundary matching).
 */
import type { TransformSpec } from "../field/transformSpec.js";
import { makeTransform } from "../field/transforms/registry.js";
import { materialFromK } from "../field/materialFromK.js";
import { capPrincipal, principal3 } from "../field/principalValues.js";
import { newCellReduction, reductionKernel } from "../reduce/reduceCell.js";
import { FLAG_UNDEFINED, type ReductionSettings } from "../reduce/reducedField.js";
import type { Conductor } from "./conductor.js";
import { SAMPLE_BACKGROUND, SAMPLE_MEDIUM, SAMPLE_PEC, S_B, S_TXX, S_TXY, S_TYY, type Scene } from "./scene.js";

export interface ContinuousSceneInput {
  transform: Exclude<TransformSpec, { kind: "imported" }>;
  /** the field's virtual-space background (design.background) */
  fieldBackground: { eps: number; mu: number };
  /** the medium the device sits in, as the solver sees it */
  background: { eps: number; mu: number };
  settings: ReductionSettings;
  /** conductors of the scene (the hidden object), tested before the material */
  conductors: Conductor[];
}

/** A Scene for the reduced map of `settings` (scheme `full` gives the ideal device). */
export function continuousScene(input: ContinuousSceneInput): Scene & { undefinedSamples: () => number } {
  const { transform: spec, fieldBackground, settings, conductors } = input;
  const tr = makeTransform(spec);
  const epsB = fieldBackground.eps, muB = fieldBackground.mu;
  const offset = "innerOffsetM" in spec && spec.innerOffsetM !== undefined && spec.innerOffsetM > 0 && tr.clampToInnerOffset ? spec.innerOffsetM : 0;
  const cap = spec.cap ?? null;
  const kernel = reductionKernel(settings);
  const red = newCellReduction();
  const k = new Float64Array(9), s = new Float64Array(6), eps = new Float64Array(6), mu = new Float64Array(6);
  const ve = new Float64Array(3), vm = new Float64Array(3), pt = new Float64Array(3);
  let undefinedCount = 0;
  const b = tr.bounds;
  const bounds = { minX: b.minX, maxX: b.maxX, minY: b.minY, maxY: b.maxY };
  const z0 = 0.5 * (b.minZ + b.maxZ);
  return {
    polarization: settings.polarization === "Hz" ? "Hz" : "Ez",
    background: input.background,
    bounds,
    conductors,
    smoothMedium: true,
    undefinedSamples: () => undefinedCount,
    sample(x, y, out) {
      for (const c of conductors) if (c.signedDistanceM(x, y) < 0) return SAMPLE_PEC;
      if (!tr.contains(x, y, z0)) return SAMPLE_BACKGROUND;
      let px = x, py = y, capped = false;
      if (offset > 0) {
        pt[0] = x; pt[1] = y; pt[2] = z0;
        if (tr.clampToInnerOffset!(pt, offset)) { px = pt[0]; py = pt[1]; capped = true; }
      }
      tr.jacobianK(k, px, py, z0);
      const det = materialFromK(s, k);
      if (!(det > 0) || det === Infinity) { undefinedCount++; return SAMPLE_BACKGROUND; }
      for (let q = 0; q < 6; q++) { eps[q] = epsB * s[q]; mu[q] = muB * s[q]; }
      if (cap !== null) {
        principal3(ve, eps); principal3(vm, mu);
        if (capPrincipal(eps, ve, cap)) capped = true;
        if (capPrincipal(mu, vm, cap)) capped = true;
      }
      kernel.apply(eps, mu, capped, red);
      if (red.flags & FLAG_UNDEFINED) { undefinedCount++; return SAMPLE_BACKGROUND; }
      const c = red.components;
      out[S_B] = c[0]; out[S_B + 1] = 0;
      out[S_TXX] = c[1]; out[S_TXX + 1] = 0;
      out[S_TYY] = c[2]; out[S_TYY + 1] = 0;
      out[S_TXY] = c[3]; out[S_TXY + 1] = 0;
      return SAMPLE_MEDIUM;
    },
  };
}
