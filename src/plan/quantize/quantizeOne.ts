/**
 * Quantization of ONE target component into levels with optimal 1D k-means (ckmeansLadder.ts: the
 * partitions of simple-statistics' ckmeans, one dynamic programme for every k asked; Wang & Song,
 * "Ckmeans.1d.dp: optimal k-means clustering in one dimension by dynamic programming", R Journal
 * 3(2), 2011): the optimal 1D partition into k contiguous groups.
 *
 * - Values are clustered in log scale when all are positive (so equal steps mean equal relative
 *   error), linearly otherwise.
 * - Each distinct value counts once, and at most SAMPLE_LIMIT evenly spaced order statistics of the
 *   distinct values are clustered: the tolerance is about the largest error of any cell, not the
 *   average over cells, so a value shared by many cells needs no extra weight; the cap keeps the
 *   dynamic programme (k × n memory) small for 10⁶-cell devices.
 * - Every cell is then assigned to its group by the boundaries between groups, and each group's
 *   level value is the minimax centre of its actual range (minimaxCentre).
 */
import { ckmeansLadder, type CkmeansLadder } from "./ckmeansLadder.js";
import { minimaxCentre, relErr } from "./relativeError.js";

export const SAMPLE_LIMIT = 4000;

export interface Quantized {
  /** group of each cell, 0-based, groups ordered by increasing value of the first component */
  level: Int32Array;
  /** centre of each group, per component: centres[g][c] */
  centres: number[][];
  /** relative quantization error of each cell (largest over components) */
  error: Float64Array;
  maxError: number;
}

/** Sorted distinct values, thinned to at most `limit` evenly spaced order statistics. */
export function distinctSample(values: Float64Array, limit: number): Float64Array {
  const sorted = values.slice().sort();
  let n = 0;
  for (let k = 0; k < sorted.length; k++) {
    if (k === 0 || sorted[k] !== sorted[n - 1]) sorted[n++] = sorted[k];
  }
  if (n <= limit) return sorted.slice(0, n);
  const out = new Float64Array(limit);
  for (let k = 0; k < limit; k++) out[k] = sorted[Math.round((k * (n - 1)) / (limit - 1))];
  return out;
}

/** The clustering sample of one component: thinned distinct values, log-scaled when all positive. */
export interface OneSample {
  positive: boolean;
  /** sorted, scaled sample */
  scaled: number[];
  /** the k-means ladder over `scaled`, made on first use and shared by every k asked */
  ladder?: CkmeansLadder;
}

export function oneSample(values: Float64Array): OneSample {
  const sample = distinctSample(values, SAMPLE_LIMIT);
  let positive = true;
  for (let s = 0; s < sample.length; s++) if (!(sample[s] > 0)) { positive = false; break; }
  return { positive, scaled: Array.from(sample, (v) => (positive ? Math.log(v) : v)) };
}

/** ckmeans groups of the sample, as boundaries between consecutive groups (scaled space). */
export function sampleBounds(sample: OneSample, k: number): number[] {
  sample.ladder ??= ckmeansLadder(sample.scaled);
  const groups = sample.ladder.groups(Math.max(1, Math.min(k, sample.scaled.length)));
  const bounds: number[] = [];
  for (let g = 0; g + 1 < groups.length; g++) bounds.push(0.5 * (groups[g][groups[g].length - 1] + groups[g + 1][0]));
  return bounds;
}

/**
 * Largest relative error of the sample's own points against minimax centres of `bounds`' groups:
 * a cheap estimate used to choose k (the exact per-cell error comes from `assignOne`).
 */
export function sampleError(sample: OneSample, bounds: number[]): number {
  let worst = 0, start = 0;
  const xs = sample.scaled;
  const value = (x: number): number => (sample.positive ? Math.exp(x) : x);
  for (let g = 0; g <= bounds.length; g++) {
    let end = start;
    while (end < xs.length && (g === bounds.length || xs[end] < bounds[g])) end++;
    if (end > start) {
      const lo = value(xs[start]), hi = value(xs[end - 1]);
      const c = minimaxCentre(lo, hi);
      worst = Math.max(worst, relErr(c, lo), relErr(c, hi));
    }
    start = end;
  }
  return worst;
}

/** Assign every cell to its group by the boundaries, then centre each group on its actual range. */
export function assignOne(values: Float64Array, sample: OneSample, bounds: number[]): Quantized {
  const n = values.length;
  const groups = bounds.length + 1;
  const level = new Int32Array(n);
  const lo = new Float64Array(groups).fill(Infinity);
  const hi = new Float64Array(groups).fill(-Infinity);
  const positive = sample.positive;
  for (let c = 0; c < n; c++) {
    const v = values[c];
    const x = positive ? Math.log(v) : v;
    let a = 0, b = bounds.length; // first boundary above x
    while (a < b) {
      const m = (a + b) >> 1;
      if (bounds[m] < x) a = m + 1;
      else b = m;
    }
    level[c] = a;
    if (v < lo[a]) lo[a] = v;
    if (v > hi[a]) hi[a] = v;
  }
  return finish(values, level, lo, hi);
}

/** Cluster one component into exactly min(k, distinct values) groups. */
export function quantizeOneWithK(values: Float64Array, k: number): Quantized {
  const sample = oneSample(values);
  return assignOne(values, sample, sampleBounds(sample, k));
}

function finish(values: Float64Array, level: Int32Array, lo: Float64Array, hi: Float64Array): Quantized {
  // drop empty groups (possible when the sample thinned a group away) and renumber
  const map = new Int32Array(lo.length).fill(-1);
  const centres: number[][] = [];
  for (let g = 0; g < lo.length; g++) {
    if (lo[g] <= hi[g]) { map[g] = centres.length; centres.push([minimaxCentre(lo[g], hi[g])]); }
  }
  const error = new Float64Array(values.length);
  let maxError = 0;
  for (let c = 0; c < values.length; c++) {
    const g = map[level[c]];
    level[c] = g;
    const e = relErr(centres[g][0], values[c]);
    error[c] = e;
    if (e > maxError) maxError = e;
  }
  return { level, centres, error, maxError };
}
