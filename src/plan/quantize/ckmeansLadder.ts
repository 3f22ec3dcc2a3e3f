/**
 * Optimal 1D k-means for a LADDER of k on one sorted sample: the dynamic programme of Wang & Song
 * ("Ckmeans.1d.dp: optimal k-means clustering in one dimension by dynamic programming", R Journal
 * 3(2), 2011) with the divide-and-conquer row fill of Ckmeans.1d.dp 3.4.6, as simple-statistics'
 * `ckmeans` runs it. Row r of the cost matrix (the best cost of r + 1 groups over every prefix)
 * does not depend on k for r < k − 1, and the last row is needed at the last column only; so the
 * rows are filled once, up to the largest k asked, and each k adds one entry. The quantizer's
 * search for the number of levels asks for up to nine k on the same sample (256, 129, 65 …): one
 * fill instead of nine, typed rows instead of arrays of arrays.
 *
 * The partitions are those of simple-statistics' `ckmeans(sample, k)` to the bit, ties included
 * (same arithmetic in the same order, same pruning bounds): tests/plan/quantize/ckmeansLadder
 * compares them over random samples and every k. Memory: (largest k − 1) rows of n doubles and n
 * 32-bit indices (256 levels × 4000 samples: 12 MB).
 */

export interface CkmeansLadder {
  /** The groups of an optimal partition into `k` groups (1 ≤ k ≤ sample length), as `ckmeans` returns them. */
  groups(k: number): number[][];
}

/** `sorted`: ascending, finite. */
export function ckmeansLadder(sorted: readonly number[]): CkmeansLadder {
  const n = sorted.length;
  let unique = n > 0 ? 1 : 0;
  for (let i = 1; i < n; i++) if (sorted[i] !== sorted[i - 1]) unique++;
  // cumulative sums of the values shifted by the median (numerical stability), and of their squares
  const shift = sorted[Math.floor(n / 2)];
  const sums = new Float64Array(n), squares = new Float64Array(n);
  /** Within-group sum of squared deviations of sorted[j..i]. */
  const ssq = (j: number, i: number): number => {
    let s: number;
    if (j > 0) {
      const mean = (sums[i] - sums[j - 1]) / (i - j + 1);
      s = squares[i] - squares[j - 1] - (i - j + 1) * mean * mean;
    } else {
      s = squares[i] - (sums[i] * sums[i]) / (i + 1);
    }
    return s < 0 ? 0 : s;
  };
  const cost: Float64Array[] = [new Float64Array(n)];
  const start: Int32Array[] = [new Int32Array(n)];
  for (let i = 0; i < n; i++) {
    const v = sorted[i] - shift;
    sums[i] = i === 0 ? v : sums[i - 1] + v;
    squares[i] = i === 0 ? v * v : squares[i - 1] + v * v;
    cost[0][i] = ssq(0, i);
  }

  /**
   * Entries iMin..iMax of row `r` (cur, curStart) from row r − 1 (prev, prevStart): the middle
   * entry by a search bounded by its neighbours' optimal starts, then both halves.
   */
  const fill = (iMin: number, iMax: number, r: number, cur: Float64Array, curStart: Int32Array, prev: Float64Array, prevStart: Int32Array): void => {
    if (iMin > iMax) return;
    const i = Math.floor((iMin + iMax) / 2);
    cur[i] = prev[i - 1];
    curStart[i] = i;
    let jlow = r;
    if (iMin > r) jlow = Math.max(jlow, curStart[iMin - 1]);
    jlow = Math.max(jlow, prevStart[i]);
    let jhigh = i - 1;
    if (iMax < n - 1) jhigh = Math.min(jhigh, curStart[iMax + 1]);
    for (let j = jhigh; j >= jlow; --j) {
      const sji = ssq(j, i);
      if (sji + prev[jlow - 1] >= cur[i]) break;
      // the lower end of the range, then the upper
      const low = ssq(jlow, i) + prev[jlow - 1];
      if (low < cur[i]) { cur[i] = low; curStart[i] = jlow; }
      jlow++;
      const high = sji + prev[j - 1];
      if (high < cur[i]) { cur[i] = high; curStart[i] = j; }
    }
    fill(iMin, i - 1, r, cur, curStart, prev, prevStart);
    fill(i + 1, iMax, r, cur, curStart, prev, prevStart);
  };

  /** Full rows 0 … last (each over columns r … n − 1). */
  const rowsThrough = (last: number): void => {
    for (let r = cost.length; r <= last; r++) {
      const cur = new Float64Array(n), curStart = new Int32Array(n);
      fill(r, n - 1, r, cur, curStart, cost[r - 1], start[r - 1]);
      cost.push(cur);
      start.push(curStart);
    }
  };

  // the last row of one k: its last column only, from a row of zeros (as a fresh k-row matrix has)
  const lastCost = new Float64Array(n), lastStart = new Int32Array(n);

  return {
    groups(k: number): number[][] {
      if (!(k >= 1 && k <= n)) throw new RangeError(`ckmeansLadder: expected 1 ≤ k ≤ ${n}, got ${k}`);
      if (unique === 1) return [sorted.slice()];
      const last = k - 1;
      let lastRowStart: Int32Array = start[0];
      if (last > 0) {
        rowsThrough(last - 1);
        lastCost.fill(0);
        lastStart.fill(0);
        fill(n - 1, n - 1, last, lastCost, lastStart, cost[last - 1], start[last - 1]);
        lastRowStart = lastStart;
      }
      const out: number[][] = [];
      let right = n - 1;
      for (let r = last; r >= 0; r--) {
        const left = r === last ? lastRowStart[right] : start[r][right];
        out[r] = sorted.slice(left, right + 1);
        if (r > 0) right = left - 1;
      }
      return out;
    },
  };
}
