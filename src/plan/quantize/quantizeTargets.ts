/**
 * Quantization of the per-cell targets into levels: ckmeans for one varying component
 * (quantizeOne.ts), greedy tolerance-driven splitting for two or three (quantizeMany.ts).
 * Components that are the same in every cell are not clustered; they keep their one value.
 */
import { assignOne, oneSample, sampleBounds, sampleError, type Quantized } from "./quantizeOne.js";
import { quantizeMany } from "./quantizeMany.js";
import { relErr, REL_FLOOR } from "./relativeError.js";

export interface QuantizeOptions {
  /** largest number of levels (null: up to `cap`) */
  maxLevels: number | null;
  /** relative error every cell should meet, when reachable within the level limit */
  goal: number;
  /** level limit when maxLevels is null */
  cap: number;
}

export interface QuantizedTargets extends Quantized {
  /** centres over ALL components (constant ones included): centres[level][component] */
  centres: number[][];
  method: string;
  /** number of components clustered */
  dimensions: number;
}

/** Relative spread below which a component counts as the same in every cell (rounding noise). */
export const CONSTANT_SPREAD = 1e-9;

/** True when every entry equals the first to within CONSTANT_SPREAD (relative, floor REL_FLOOR). */
export function isConstant(v: Float64Array): boolean {
  let lo = v[0], hi = v[0];
  for (let k = 1; k < v.length; k++) {
    if (v[k] < lo) lo = v[k];
    if (v[k] > hi) hi = v[k];
  }
  return hi - lo <= CONSTANT_SPREAD * Math.max(Math.abs(lo), Math.abs(hi), REL_FLOOR);
}

/**
 * Quantize the targets (one Float64Array per component). With one varying component the number of
 * levels is the smallest k ≤ limit whose ckmeans partition of the sample meets `goal`, found by
 * binary search on k (the largest error of the optimal 1D partition falls as k grows, up to ties);
 * the error then reported is exact, per cell (with a thinned sample it may exceed the goal
 * slightly). With two or three
 * the splitting stops at the goal by itself.
 */
export function quantizeTargets(targets: Float64Array[], opts: QuantizeOptions): QuantizedTargets {
  const n = targets[0]?.length ?? 0;
  if (n === 0) throw new Error("quantizeTargets: no cells");
  const limit = Math.max(1, opts.maxLevels ?? opts.cap);
  const varying: number[] = [];
  targets.forEach((t, c) => { if (!isConstant(t)) varying.push(c); });
  let q: Quantized;
  let method: string;
  if (varying.length === 0) {
    q = { level: new Int32Array(n), centres: [[]], error: new Float64Array(n), maxError: 0 };
    method = "none (every cell has the same target)";
  } else if (varying.length === 1) {
    const v = targets[varying[0]];
    // choose k on the sample (cheap), then assign every cell once
    const sample = oneSample(v);
    let bounds = sampleBounds(sample, 1);
    if (sampleError(sample, bounds) > opts.goal && limit > 1) {
      // smallest k in [2, limit] that meets the goal; the limit itself when none does
      bounds = sampleBounds(sample, limit);
      if (sampleError(sample, bounds) <= opts.goal) {
        let lo = 2, hi = limit;
        while (lo < hi) {
          const mid = (lo + hi) >> 1;
          const b = sampleBounds(sample, mid);
          if (sampleError(sample, b) <= opts.goal) { bounds = b; hi = mid; }
          else lo = mid + 1;
        }
      }
    }
    const best = assignOne(v, sample, bounds);
    q = best;
    method = "ckmeans (optimal 1D k-means, log scale for positive targets)";
  } else {
    q = quantizeMany(varying.map((c) => targets[c]), limit, opts.goal);
    method = `greedy relative-error splitting over ${varying.length} components`;
  }
  // expand centres to every component
  const centres = q.centres.map((row) => {
    const full = targets.map((t) => t[0]);
    varying.forEach((c, k) => { full[c] = row[k]; });
    return full;
  });
  // constant components are exact, so the error is that of the varying ones
  return { ...q, centres, method, dimensions: varying.length };
}

/** Largest relative error of `centre` against the cell's targets (all components). */
export function cellError(targets: Float64Array[], cell: number, centre: number[]): number {
  let e = 0;
  for (let c = 0; c < targets.length; c++) {
    const x = relErr(centre[c], targets[c][cell]);
    if (x > e) e = x;
  }
  return e;
}
