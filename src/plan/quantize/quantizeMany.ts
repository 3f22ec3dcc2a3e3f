/**
 * Quantization of TWO OR THREE target components together, by greedy tolerance-driven splitting
 * (a divisive, k-d-tree-like method): start with every cell in one group; repeatedly take the group
 * with the largest relative error, and cut it in two across the component whose relative spread is
 * widest, at that component's minimax centre; stop at the level limit or when every group meets
 * the error goal. Each group's level value is the minimax centre of its range on each component.
 *
 * Why this and not k-means: the planner's contract is the LARGEST relative error of any cell (the
 * tolerance), while k-means minimises the mean squared error and can leave a few outlying cells far
 * from every centre; k-means also depends on its seeding. Splitting is deterministic, its error
 * never increases with one more level, each split roughly halves the widest relative range (so the
 * error falls geometrically), and it costs O(cells × components) per split with no per-cell
 * allocation (groups are contiguous ranges of one permutation array, partitioned in place).
 * It is not guaranteed to use the fewest levels for a tolerance (that problem is NP-hard in 2D+).
 */
import { minimaxCentre, relErr, REL_FLOOR } from "./relativeError.js";
import type { Quantized } from "./quantizeOne.js";

interface Group {
  start: number;
  end: number;
  lo: Float64Array;
  hi: Float64Array;
  centre: Float64Array;
  error: number;
}

function measure(values: Float64Array[], perm: Int32Array, start: number, end: number): Group {
  const m = values.length;
  const lo = new Float64Array(m).fill(Infinity);
  const hi = new Float64Array(m).fill(-Infinity);
  for (let c = 0; c < m; c++) {
    const v = values[c];
    let a = Infinity, b = -Infinity;
    for (let p = start; p < end; p++) {
      const x = v[perm[p]];
      if (x < a) a = x;
      if (x > b) b = x;
    }
    lo[c] = a;
    hi[c] = b;
  }
  const centre = new Float64Array(m);
  for (let c = 0; c < m; c++) centre[c] = minimaxCentre(lo[c], hi[c]);
  let error = 0;
  for (let p = start; p < end; p++) {
    const cell = perm[p];
    for (let c = 0; c < m; c++) {
      const e = relErr(centre[c], values[c][cell]);
      if (e > error) error = e;
    }
  }
  return { start, end, lo, hi, centre, error };
}

/**
 * Quantize `values` (one Float64Array per component, equal lengths) into at most `maxLevels`
 * groups, stopping early once every cell is within `goal` relative error.
 */
export function quantizeMany(values: Float64Array[], maxLevels: number, goal: number): Quantized {
  const n = values[0].length;
  const m = values.length;
  const perm = new Int32Array(n);
  for (let p = 0; p < n; p++) perm[p] = p;
  const groups: Group[] = [measure(values, perm, 0, n)];
  while (groups.length < maxLevels) {
    let worst = -1;
    for (let g = 0; g < groups.length; g++) {
      if (groups[g].end - groups[g].start > 1 && (worst < 0 || groups[g].error > groups[worst].error)) worst = g;
    }
    if (worst < 0 || groups[worst].error <= goal) break;
    const G = groups[worst];
    // widest component by the end-point relative error of its range
    let axis = -1, spread = 0;
    for (let c = 0; c < m; c++) {
      const s = (G.hi[c] - G.lo[c]) / (Math.max(Math.abs(G.lo[c]), REL_FLOOR) + Math.max(Math.abs(G.hi[c]), REL_FLOOR));
      if (s > spread) { spread = s; axis = c; }
    }
    if (axis < 0) break; // every component constant: identical targets, cannot split
    const v = values[axis];
    const cut = G.centre[axis];
    let a = G.start, b = G.end - 1;
    while (a <= b) {
      if (v[perm[a]] <= cut) a++;
      else { const t = perm[a]; perm[a] = perm[b]; perm[b] = t; b--; }
    }
    if (a === G.start || a === G.end) break; // cannot happen when hi > lo; guard anyway
    groups.splice(worst, 1, measure(values, perm, G.start, a), measure(values, perm, a, G.end));
  }
  // order groups by their centre on the first component, then the others, for stable numbering
  const order = groups.map((_, g) => g).sort((x, y) => {
    for (let c = 0; c < m; c++) {
      const d = groups[x].centre[c] - groups[y].centre[c];
      if (d !== 0) return d;
    }
    return 0;
  });
  const level = new Int32Array(n);
  const error = new Float64Array(n);
  const centres: number[][] = [];
  let maxError = 0;
  order.forEach((g, rank) => {
    const G = groups[g];
    centres.push(Array.from(G.centre));
    for (let p = G.start; p < G.end; p++) {
      const cell = perm[p];
      level[cell] = rank;
      let e = 0;
      for (let c = 0; c < m; c++) {
        const x = relErr(G.centre[c], values[c][cell]);
        if (x > e) e = x;
      }
      error[cell] = e;
      if (e > maxError) maxError = e;
    }
  });
  return { level, centres, error, maxError };
}
