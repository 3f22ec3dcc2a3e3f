/**
 * A field's summary for reports and `field --json`: component ranges, largest anisotropy, cells
 * with a principal value below 1 (by more than 1e-12, so rounding of an identity map does not
 * count), capped cells.
 */
import { SYM_COMPONENTS, type SymComponent, type SymTensorField } from "../core/symTensor.js";
import type { TensorField } from "./tensorField.js";

/** Tolerance below 1 before a principal value counts as "below one". */
export const BELOW_ONE_TOLERANCE = 1e-12;

export type ComponentRange = { min: Record<SymComponent, number>; max: Record<SymComponent, number> };

export interface FieldSummary {
  cells: number;
  eps: ComponentRange;
  mu: ComponentRange;
  maxAnisotropy: { eps: number; mu: number };
  cellsWithPrincipalBelowOne: { eps: number; mu: number };
  /** cells whose smallest principal value is ≤ 0 (not a passive transformation medium; imported fields only) */
  cellsNotPositiveDefinite: { eps: number; mu: number };
  capped: number;
  capValue: number | null;
}

function range(field: SymTensorField): ComponentRange {
  const min = {} as Record<SymComponent, number>, max = {} as Record<SymComponent, number>;
  for (const c of SYM_COMPONENTS) {
    const a = field[c];
    let lo = Infinity, hi = -Infinity;
    for (let k = 0; k < a.length; k++) { const v = a[k]; if (v < lo) lo = v; if (v > hi) hi = v; }
    min[c] = lo; max[c] = hi;
  }
  return { min, max };
}

/** Largest anisotropy over the cells whose smallest principal value is positive (elsewhere it is undefined). */
function maxAnisotropyOf(ratio: Float64Array, smallest: Float64Array): number {
  let m = -Infinity;
  for (let k = 0; k < ratio.length; k++) if (smallest[k] > 0 && ratio[k] > m) m = ratio[k];
  return m;
}

function countAtMostZero(a: Float64Array): number {
  let n = 0;
  for (let k = 0; k < a.length; k++) if (!(a[k] > 0)) n++;
  return n;
}

function countBelow(a: Float64Array, limit: number): number {
  let n = 0;
  for (let k = 0; k < a.length; k++) if (a[k] < limit) n++;
  return n;
}

export function summarizeField(field: TensorField): FieldSummary {
  let capped = 0;
  for (let k = 0; k < field.capped.length; k++) capped += field.capped[k];
  return {
    cells: field.grid.count,
    eps: range(field.eps),
    mu: range(field.mu),
    maxAnisotropy: {
      eps: maxAnisotropyOf(field.epsAnisotropy, field.epsPrincipal[0]),
      mu: maxAnisotropyOf(field.muAnisotropy, field.muPrincipal[0]),
    },
    cellsWithPrincipalBelowOne: {
      eps: countBelow(field.epsPrincipal[0], 1 - BELOW_ONE_TOLERANCE),
      mu: countBelow(field.muPrincipal[0], 1 - BELOW_ONE_TOLERANCE),
    },
    cellsNotPositiveDefinite: {
      eps: countAtMostZero(field.epsPrincipal[0]),
      mu: countAtMostZero(field.muPrincipal[0]),
    },
    capped,
    capValue: field.capValue,
  };
}
