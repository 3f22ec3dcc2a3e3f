/**
 * Even–odd point-in-polygon for polygons of any size, simple or self-intersecting.
 *
 * The rule (unchanged from the per-point ray cast it replaces): a point (x, y) is inside when an
 * odd number of edges cross the ray from it towards +x. An edge from (xₖ, yₖ) to (xₘ, yₘ) crosses
 * the row at height y when y lies in its half-open y-range [min(yₖ, yₘ), max(yₖ, yₘ)) — horizontal
 * edges never cross — at x꜀ = xₖ + (y − yₖ)(xₘ − xₖ)/(yₘ − yₖ), and it counts when x < x꜀. So a point
 * on a left or bottom edge is inside and one on a right or top edge outside (for a simple polygon);
 * a self-intersecting polygon's doubly covered parts are outside. Every crossing is computed with
 * exactly that expression, so the index answers bit for bit like the plain ray cast.
 *
 * Cost, for N edges and k of them crossing the queried row:
 * - build: O(N log N) — a centred interval tree over the edges' y-ranges (Edelsbrunner 1980; see
 *   de Berg et al., Computational Geometry, 3rd ed., 2008, §10.1), stored in flat typed arrays;
 * - `contains(x, y)`: O(log N + k); a second query on the same row sorts that row's crossings once
 *   and then answers in O(log k) (rows of a grid or a solver's samples come in runs of equal y);
 * - `containsRow(out, y, x0, pitch)`: the whole row of cells xᵢ = x0 + i·pitch in
 *   O(log N + k + cells) — each crossing toggles the parity of a prefix of the row (no sort).
 * A grid of R rows therefore costs O(N log N + R log N + K + cells), K the crossings of all rows.
 * K is about 2R for a simple polygon; a polygon whose edges cross each other everywhere can have K
 * up to R·N, which no scan avoids (the answer depends on every crossing).
 *
 * Written here: no npm library gives an even–odd test with this exact half-open rule and a row
 * fill; the per-row cache is local to one index (no shared state), so the module stays pure.
 */

/** The point test and the row fill of one polygon. */
export interface PolygonIndex {
  /** even–odd: true when (xM, yM) is inside */
  contains(xM: number, yM: number): boolean;
  /** out[i] = contains(x0M + i·pitchM, yM) ? 1 : 0 for i < out.length (x computed exactly so) */
  containsRow(out: Uint8Array, yM: number, x0M: number, pitchM: number): void;
}

/** Build the index of the closed polygon with vertices (xs[k], ys[k]); xs and ys are not kept. */
export function polygonIndex(xs: Float64Array, ys: Float64Array): PolygonIndex {
  const n = xs.length;
  // Edges as the ray cast walks them: edge e runs from vertex k = e to vertex m = e − 1 (m = n − 1
  // for e = 0); (ax, ay) is vertex k, the base point of the crossing formula.
  let edges = 0;
  for (let k = 0, m = n - 1; k < n; m = k++) if (ys[k] !== ys[m]) edges++;
  const ax = new Float64Array(edges), ay = new Float64Array(edges), dx = new Float64Array(edges), dy = new Float64Array(edges);
  const lo = new Float64Array(edges), hi = new Float64Array(edges);
  for (let k = 0, m = n - 1, e = 0; k < n; m = k++) {
    if (ys[k] === ys[m]) continue;
    ax[e] = xs[k]; ay[e] = ys[k]; dx[e] = xs[m] - xs[k]; dy[e] = ys[m] - ys[k];
    lo[e] = Math.min(ys[k], ys[m]); hi[e] = Math.max(ys[k], ys[m]);
    e++;
  }
  const tree = intervalTree(lo, hi);

  /** x of edge e's crossing with row y (the ray cast's own expression) */
  const crossing = (e: number, y: number): number => ax[e] + ((y - ay[e]) * dx[e]) / dy[e];

  // cache of one row: its crossings sorted ascending (NaN crossings dropped: they never count)
  let rowY = NaN, rowSorted = false, rowCount = 0;
  let row = new Float64Array(16);

  const collectRow = (y: number): void => {
    rowCount = 0;
    tree.stab(y, (e) => {
      const xc = crossing(e, y);
      if (xc !== xc) return;
      if (rowCount === row.length) { const grown = new Float64Array(2 * row.length); grown.set(row); row = grown; }
      row[rowCount++] = xc;
    });
    row.subarray(0, rowCount).sort();
  };

  return {
    contains(x, y) {
      if (y === rowY && !rowSorted) { collectRow(y); rowSorted = true; }
      if (y === rowY) {
        // crossings right of x: those after the last one ≤ x (NaN x: none are > NaN… and none ≤)
        if (x !== x) return false;
        let a = 0, b = rowCount;
        while (a < b) { const mid = (a + b) >>> 1; if (row[mid] <= x) a = mid + 1; else b = mid; }
        return ((rowCount - a) & 1) === 1;
      }
      rowY = y; rowSorted = false;
      let inside = false;
      tree.stab(y, (e) => { if (x < crossing(e, y)) inside = !inside; });
      return inside;
    },
    containsRow(out, y, x0, pitch) {
      const cells = out.length;
      out.fill(0);
      // a crossing with t cells left of it toggles cells 0 … t−1: it marks position t, and cell i's
      // parity is the XOR of the marks at positions above i, accumulated from the right below
      const marks = out;
      let tail = 0; // mark at t = cells (toggles every cell), kept outside the array
      tree.stab(y, (e) => {
        const xc = crossing(e, y);
        if (!(x0 < xc)) return; // no cell lies left of this crossing (or it is NaN)
        // t = number of cells with x0 + i·pitch < xc (a prefix: the xᵢ never decrease)
        let t = Math.ceil((xc - x0) / pitch);
        if (!(t >= 0)) t = 0;
        if (t > cells) t = cells;
        if (t > 0 && !(x0 + (t - 1) * pitch < xc)) t = lowerCount(x0, pitch, xc, 0, t);
        else if (t < cells && x0 + t * pitch < xc) t = lowerCount(x0, pitch, xc, t, cells);
        if (t === cells) tail ^= 1;
        else marks[t] ^= 1;
      });
      let parity = tail;
      for (let i = cells - 1; i >= 0; i--) {
        const m = marks[i];
        marks[i] = parity;
        parity ^= m;
      }
    },
  };
}

/** Number of i in [0, hiCount) with x0 + i·pitch < xc, knowing it is at least loCount. */
function lowerCount(x0: number, pitch: number, xc: number, loCount: number, hiCount: number): number {
  let a = loCount, b = hiCount;
  while (a < b) {
    const mid = (a + b) >>> 1;
    if (x0 + mid * pitch < xc) a = mid + 1; else b = mid;
  }
  return a;
}

interface IntervalTree {
  /** calls visit(e) for every interval e with lo[e] ≤ y < hi[e], in no particular order */
  stab(y: number, visit: (e: number) => void): void;
}

/**
 * Centred interval tree over half-open intervals [lo, hi) (lo < hi). Each node has a centre c
 * (the median of its intervals' midpoints) and keeps the intervals that contain c twice, sorted
 * by lo ascending and by hi descending; intervals wholly below c (hi ≤ c) go left, wholly above
 * (lo > c) right. Both sides hold at most half the node's intervals, so the depth is at most
 * log₂ N + 1. A stab at y walks one root-to-leaf path: at y < c every node interval with lo ≤ y
 * contains y (a prefix of the lo order), at y ≥ c every one with hi > y (a prefix of the hi order).
 */
function intervalTree(lo: Float64Array, hi: Float64Array): IntervalTree {
  const count = lo.length;
  const centre: number[] = [], left: number[] = [], right: number[] = [], start: number[] = [], size: number[] = [];
  const byLo = new Int32Array(count), byHi = new Int32Array(count);
  let filled = 0;
  const mid = new Float64Array(count);
  for (let e = 0; e < count; e++) mid[e] = 0.5 * lo[e] + 0.5 * hi[e];
  // all intervals in midpoint order once; stable partitions keep every node's range in that order,
  // so a node's median midpoint is the middle of its range (no sort per node)
  const order = new Int32Array(count);
  for (let e = 0; e < count; e++) order[e] = e;
  order.sort((a, b) => mid[a] - mid[b]);
  const temp = new Int32Array(count);
  const newNode = (): number => { centre.push(0); left.push(-1); right.push(-1); start.push(0); size.push(0); return centre.length - 1; };
  const root = count > 0 ? newNode() : -1;
  // explicit stack of (node, first, end) ranges of `order`
  const stack: number[] = root >= 0 ? [root, 0, count] : [];
  while (stack.length > 0) {
    const end = stack.pop()!, first = stack.pop()!, node = stack.pop()!;
    let c = mid[order[(first + end) >>> 1]];
    let nLeft = 0, nHere = 0;
    for (let pass = 0; pass < 2; pass++) {
      nLeft = 0; nHere = 0;
      for (let q = first; q < end; q++) {
        const e = order[q];
        if (hi[e] <= c) nLeft++;
        else if (!(lo[e] > c)) nHere++;
      }
      // a midpoint rounded onto hi can send every interval left (no progress): centre on an
      // interval's own lo instead, which keeps that interval here
      if (nLeft < end - first) break;
      c = lo[order[first]];
    }
    // stable three-way partition: left | here | right
    let a = first, b = first + nLeft, r = first + nLeft + nHere;
    for (let q = first; q < end; q++) {
      const e = order[q];
      if (hi[e] <= c) temp[a++] = e;
      else if (!(lo[e] > c)) temp[b++] = e;
      else temp[r++] = e;
    }
    for (let q = first; q < end; q++) order[q] = temp[q];
    const hereFirst = first + nLeft, hereEnd = hereFirst + nHere;
    centre[node] = c; start[node] = filled; size[node] = nHere;
    for (let q = 0; q < nHere; q++) { byLo[filled + q] = order[hereFirst + q]; byHi[filled + q] = order[hereFirst + q]; }
    if (nHere > 1) {
      byLo.subarray(filled, filled + nHere).sort((p, q) => lo[p] - lo[q]);
      byHi.subarray(filled, filled + nHere).sort((p, q) => hi[q] - hi[p]);
    }
    filled += nHere;
    if (nLeft > 0) { const l = newNode(); left[node] = l; stack.push(l, first, hereFirst); }
    if (hereEnd < end) { const rt = newNode(); right[node] = rt; stack.push(rt, hereEnd, end); }
  }
  const cen = Float64Array.from(centre), lft = Int32Array.from(left), rgt = Int32Array.from(right);
  const st = Int32Array.from(start), sz = Int32Array.from(size);
  return {
    stab(y, visit) {
      let node = root;
      while (node >= 0) {
        const s = st[node], end = s + sz[node];
        if (y < cen[node]) {
          for (let q = s; q < end; q++) { const e = byLo[q]; if (lo[e] <= y) visit(e); else break; }
          node = lft[node];
        } else {
          for (let q = s; q < end; q++) { const e = byHi[q]; if (hi[e] > y) visit(e); else break; }
          node = rgt[node];
        }
      }
    },
  };
}
