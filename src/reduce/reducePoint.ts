/**
 * The reduced components at one point of the device: exact (from the field's point evaluator) when
 * the field has one, otherwise the values of the cell whose centre is nearest (within one pitch).
 */
import { InputError } from "../core/errors.js";
import { readSym } from "../core/symTensor.js";
import type { TensorField } from "../field/tensorField.js";
import { componentNames, type Polarization } from "./polarization.js";
import { newCellReduction, reductionKernel } from "./reduceCell.js";
import { flagList, type ReductionSettings } from "./reducedField.js";
import type { ReductionSchemeName } from "./schemes/schemeNames.js";

export interface PointReduction {
  scheme: ReductionSchemeName;
  polarization: Polarization;
  xM: number;
  yM: number;
  zM: number;
  /** "exact" from the transform, or "cell" (nearest cell's values, e.g. imported fields) */
  source: "exact" | "cell";
  /** the nearest cell, when source is "cell" */
  cell: number | null;
  components: Record<string, number>;
  /** principal values of the kept in-plane tensor, ascending (3D: smallest and largest of ε) */
  principal: [number, number];
  anisotropy: number;
  droppedAnisotropy: number;
  /** in-plane scale α */
  scale: number;
  flags: string[];
}

/**
 * Reduce at (xM, yM, zM) with settings from `reductionSettings`. Throws InputError at `where`
 * when the point lies outside the device (or, for fields without a point evaluator, farther than
 * one pitch from every cell centre).
 */
export function reducePoint(field: TensorField, settings: ReductionSettings, xM: number, yM: number, zM: number, where = "--at"): PointReduction {
  const eps = new Float64Array(6), mu = new Float64Array(6);
  let source: PointReduction["source"] = "exact";
  let cell: number | null = null;
  let capped = false;
  const g = field.grid;
  const z = g.dimension === 2 ? g.originZM : zM;
  if (field.evaluateAt) {
    const detJ = field.evaluateAt(xM, yM, z, eps, mu);
    if (Number.isNaN(detJ)) throw new InputError({ where, message: `point (${xM}, ${yM}${g.dimension === 3 ? `, ${zM}` : ""}) m is outside the device` });
  } else {
    let best = -1, bestD = Infinity;
    for (let c = 0; c < g.count; c++) {
      const d = (g.xM[c] - xM) ** 2 + (g.yM[c] - yM) ** 2 + (g.dimension === 3 ? (g.zM[c] - zM) ** 2 : 0);
      if (d < bestD) { bestD = d; best = c; }
    }
    if (best < 0 || Math.sqrt(bestD) > g.pitchM) {
      throw new InputError({ where, message: `point (${xM}, ${yM}) m is not within one pitch of any device cell` });
    }
    readSym(eps, field.eps, best);
    readSym(mu, field.mu, best);
    capped = field.capped[best] === 1;
    source = "cell";
    cell = best;
  }
  const r = reductionKernel(settings).apply(eps, mu, capped, newCellReduction());
  const components: Record<string, number> = {};
  componentNames(settings.polarization).forEach((name, k) => { components[name] = r.components[k]; });
  return {
    scheme: settings.scheme,
    polarization: settings.polarization,
    xM, yM, zM: z,
    source,
    cell,
    components,
    principal: [r.principalMin, r.principalMax],
    anisotropy: r.anisotropy,
    droppedAnisotropy: r.droppedAnisotropy,
    scale: r.scale,
    flags: flagList(r.flags).split(";").filter(Boolean),
  };
}
