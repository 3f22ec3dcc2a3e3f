/**
 * A lattice row of a point test by runs: the same answers as calling the test at every lattice
 * point x_i = x0 + i·pitch, with the test called only near the region's boundary and once per run
 * of points between.
 *
 * A transform with a closed-form boundary (circles about a centre, straight edges through it)
 * lists, for the row's y, the x-intervals ("zones") in which its point test may change its
 * answer: every place where a boundary crosses the row, widened far beyond rounding (a relative
 * 1e-9 of the region's size, ≫ the 1e-16 error of the test's own arithmetic) and by one lattice
 * point each side. Outside the zones the answer cannot change from one lattice point to the next,
 * so each run between two zones takes the test's answer at its first point; inside a zone every
 * point is tested. The zones need not be tight, only complete: an extra zone costs a few tests,
 * a missing one would be a wrong answer, so anything doubtful (a row along a straight edge, a
 * non-finite bound) makes the whole row a zone.
 *
 * Why: `buildDeviceGrid` scans the device's bounding box, and for a quarter ring the box holds
 * three lattice points per device cell, each paying a square root and an arctangent.
 * Allocation-free per row (scratch made once per transform).
 */

/** Relative half-width of a zone about a boundary (the test's rounding is ~1e-16 of the size). */
export const ZONE_REL = 1e-9;

export interface RowRuns {
  /** Start a row: no zones. */
  reset(): void;
  /** The test may change its answer for x in [loM, hiM]. */
  zone(loM: number, hiM: number): void;
  /** The test may change its answer anywhere on this row. */
  whole(): void;
  /**
   * Zones where the row (at dyM from the centre's y) crosses the circle of radius `radiusM`
   * about the centre's x `cxM`, with a half-width of `halfM` in radius.
   */
  ring(cxM: number, dyM: number, radiusM: number, halfM: number): void;
  /**
   * Zones where the row crosses the straight line through the centre (cxM, dyM = 0) at angle
   * `angleRad`, within `halfM` of it; a row along the line (within `halfM`) is a zone whole.
   */
  line(cxM: number, dyM: number, angleRad: number, halfM: number): void;
  /** out[i] = test(x0M + i·pitchM, yM, zM) ? 1 : 0 for every i < out.length, by runs. */
  fill(out: Uint8Array, x0M: number, pitchM: number, yM: number, zM: number, test: (x: number, y: number, z: number) => boolean): void;
}

/** A run filler for at most `maxZones` zones per row (more make the row a zone whole). */
export function rowRuns(maxZones: number): RowRuns {
  const lo = new Float64Array(maxZones), hi = new Float64Array(maxZones);
  const start = new Int32Array(maxZones), end = new Int32Array(maxZones);
  let zones = 0, all = false;
  const runs: RowRuns = {
    reset() { zones = 0; all = false; },
    zone(a, b) {
      if (!(a <= b)) { if (!(a > b)) all = true; return; } // NaN bounds: doubtful, test everything
      if (zones === maxZones) { all = true; return; }
      lo[zones] = a; hi[zones] = b; zones++;
    },
    whole() { all = true; },
    ring(cx, dy, radius, half) {
      const outer = radius + half, inner = radius - half, dy2 = dy * dy;
      if (dy2 > outer * outer) return;
      const xOut = Math.sqrt(outer * outer - dy2);
      const xIn = inner > 0 && dy2 < inner * inner ? Math.sqrt(inner * inner - dy2) : 0;
      runs.zone(cx - xOut, cx - xIn);
      runs.zone(cx + xIn, cx + xOut);
    },
    line(cx, dy, angle, half) {
      // distance of (dx, dy) from the line: |dx·sin − dy·cos|
      const s = Math.sin(angle), c = Math.cos(angle);
      if (s === 0) { if (Math.abs(dy * c) <= half) all = true; return; } // along the row
      const a = cx + (dy * c - half) / s, b = cx + (dy * c + half) / s;
      runs.zone(Math.min(a, b), Math.max(a, b));
    },
    fill(out, x0, pitch, y, z, test) {
      const n = out.length;
      if (all || !(pitch > 0)) {
        for (let i = 0; i < n; i++) out[i] = test(x0 + i * pitch, y, z) ? 1 : 0;
        return;
      }
      // zones as lattice index ranges, one point wider each side than rounding could matter
      let m = 0;
      for (let q = 0; q < zones; q++) {
        const s = Math.floor((lo[q] - x0) / pitch) - 1, e = Math.ceil((hi[q] - x0) / pitch) + 1;
        if (!(s === s && e === e)) { for (let i = 0; i < n; i++) out[i] = test(x0 + i * pitch, y, z) ? 1 : 0; return; }
        if (e < 0 || s > n - 1) continue;
        // insertion by start
        let k = m++;
        const s0 = Math.max(0, s), e0 = Math.min(n - 1, e);
        while (k > 0 && start[k - 1] > s0) { start[k] = start[k - 1]; end[k] = end[k - 1]; k--; }
        start[k] = s0; end[k] = e0;
      }
      let i = 0;
      for (let k = 0; k <= m; k++) {
        const stop = k < m ? start[k] : n;
        if (stop > i) {
          // a run between zones: one answer for all of it
          out.fill(test(x0 + i * pitch, y, z) ? 1 : 0, i, stop);
          i = stop;
        }
        if (k < m) for (; i <= end[k]; i++) out[i] = test(x0 + i * pitch, y, z) ? 1 : 0;
      }
    },
  };
  return runs;
}
