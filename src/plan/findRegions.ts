/**
 * Regions: connected groups of device cells that share a level, so the shop sees contiguous zones.
 * Connectivity is by shared faces on the lattice (4 neighbours in 2D, 6 in 3D). Regions are
 * numbered in the order of their levels (cells without a level last), and within a level in the
 * order of their first cell in the grid's row-major listing.
 */
import type { DeviceGrid } from "../field/deviceGrid.js";
import type { PlanRegion } from "./planTypes.js";

export interface RegionResult {
  /** 0-based region of each cell */
  region: Int32Array;
  regions: PlanRegion[];
}

/**
 * Label the connected components of equal `level` over the grid's cells. Cells listed in
 * row-major order (k, then j, then i, as buildDeviceGrid makes them) are joined as runs: a run is
 * a stretch of one row with consecutive i and one level; runs of neighbouring rows (and layers)
 * that overlap in i and share the level are united (union–find over runs, O(cells + runs)), so no
 * lattice-sized lookup is touched. Other listings fall back to a breadth-first search.
 */
export function findRegions(grid: DeviceGrid, level: Int32Array): RegionResult {
  const n = grid.count;
  const gi = grid.i, gj = grid.j, gk = grid.k;
  for (let c = 1; c < n; c++) {
    const dk = gk[c] - gk[c - 1], dj = gj[c] - gj[c - 1];
    if (dk < 0 || (dk === 0 && (dj < 0 || (dj === 0 && gi[c] <= gi[c - 1])))) return findRegionsByLattice(grid, level);
  }
  // runs: [runStart[r], runStart[r + 1]) cells; rows: [rowRun[w], rowRun[w + 1]) runs
  let runs = 0, rows = 0;
  for (let c = 0; c < n; c++) {
    const newRow = c === 0 || gj[c] !== gj[c - 1] || gk[c] !== gk[c - 1];
    if (newRow) rows++;
    if (newRow || gi[c] !== gi[c - 1] + 1 || level[c] !== level[c - 1]) runs++;
  }
  const runStart = new Int32Array(runs + 1), rowRun = new Int32Array(rows + 1);
  for (let c = 0, r = 0, w = 0; c < n; c++) {
    const newRow = c === 0 || gj[c] !== gj[c - 1] || gk[c] !== gk[c - 1];
    if (newRow) rowRun[w++] = r;
    if (newRow || gi[c] !== gi[c - 1] + 1 || level[c] !== level[c - 1]) runStart[r++] = c;
  }
  runStart[runs] = n;
  rowRun[rows] = runs;
  const parent = new Int32Array(runs);
  for (let r = 0; r < runs; r++) parent[r] = r;
  const root = (r: number): number => {
    while (parent[r] !== r) { parent[r] = parent[parent[r]]; r = parent[r]; }
    return r;
  };
  /** Unite the overlapping, equal-level runs of rows a and b (both sorted by i). */
  const joinRows = (a: number, b: number): void => {
    let p = rowRun[a], q = rowRun[b];
    const pEnd = rowRun[a + 1], qEnd = rowRun[b + 1];
    while (p < pEnd && q < qEnd) {
      const p0 = gi[runStart[p]], p1 = gi[runStart[p + 1] - 1];
      const q0 = gi[runStart[q]], q1 = gi[runStart[q + 1] - 1];
      if (p0 <= q1 && q0 <= p1 && level[runStart[p]] === level[runStart[q]]) {
        const x = root(p), y = root(q);
        // the smaller run index stays the root: a component's root is its first run
        if (x < y) parent[y] = x; else if (y < x) parent[x] = y;
      }
      if (p1 < q1) p++; else q++;
    }
  };
  // rows of the layer below, by j, for 3D grids (rows of one layer are sorted by j)
  const three = grid.nz > 1;
  const rowBelow = three ? new Int32Array(grid.ny).fill(-1) : null;
  for (let w = 0, layerStart = 0; w < rows; w++) {
    const c = runStart[rowRun[w]];
    if (three && (w === 0 || gk[c] !== gk[runStart[rowRun[w - 1]]])) {
      // a new layer: the finished one becomes "below" when it is the layer just under this one
      const adjacent = w > 0 && gk[c] === gk[runStart[rowRun[w - 1]]] + 1;
      rowBelow!.fill(-1);
      if (adjacent) for (let v = layerStart; v < w; v++) rowBelow![gj[runStart[rowRun[v]]]] = v;
      layerStart = w;
    }
    if (w > 0) {
      const prev = runStart[rowRun[w - 1]];
      if (gk[prev] === gk[c] && gj[prev] === gj[c] - 1) joinRows(w - 1, w);
    }
    if (three) {
      const below = rowBelow![gj[c]];
      if (below >= 0) joinRows(below, w);
    }
  }
  // components in the order of their first cell (= their root run), then renumbered by level
  const compOf = new Int32Array(runs);
  const regions: PlanRegion[] = [];
  for (let r = 0; r < runs; r++) {
    const x = root(r);
    let id: number;
    if (x === r) {
      id = regions.length;
      const c = runStart[r];
      regions.push({ index: id + 1, level: level[c] + 1, cellCount: 0, iMin: gi[c], iMax: gi[c], jMin: gj[c], jMax: gj[c] });
    } else {
      id = compOf[x];
    }
    compOf[r] = id;
    const reg = regions[id];
    const c0 = runStart[r], c1 = runStart[r + 1] - 1;
    reg.cellCount += c1 - c0 + 1;
    if (gi[c0] < reg.iMin) reg.iMin = gi[c0];
    if (gi[c1] > reg.iMax) reg.iMax = gi[c1];
    if (gj[c0] < reg.jMin) reg.jMin = gj[c0];
    if (gj[c0] > reg.jMax) reg.jMax = gj[c0];
  }
  const { newId, sorted } = levelOrder(regions);
  const region = new Int32Array(n);
  for (let r = 0; r < runs; r++) {
    const id = newId[compOf[r]];
    for (let c = runStart[r], end = runStart[r + 1]; c < end; c++) region[c] = id;
  }
  return { region, regions: sorted };
}

/** Renumber regions in level order (stable: ties keep the order of their first cell). */
function levelOrder(regions: PlanRegion[]): { newId: Int32Array; sorted: PlanRegion[] } {
  const order = regions.map((_, k) => k).sort((a, b) => {
    const la = regions[a].level <= 0 ? Infinity : regions[a].level, lb = regions[b].level <= 0 ? Infinity : regions[b].level;
    return la - lb || a - b;
  });
  const newId = new Int32Array(regions.length);
  order.forEach((old, k) => { newId[old] = k; });
  return { newId, sorted: order.map((old, k) => ({ ...regions[old], index: k + 1 })) };
}

/**
 * The same labels by breadth-first search over a lattice lookup (O(cells + bounding box)), for
 * grids whose cells are not listed in row-major order (imported fields); exported for the test
 * that checks both give the same labels.
 */
export function findRegionsByLattice(grid: DeviceGrid, level: Int32Array): RegionResult {
  const n = grid.count;
  const { nx, ny, nz } = grid;
  const slab = nx * ny;
  const lookup = new Int32Array(slab * nz).fill(-1);
  for (let c = 0; c < n; c++) lookup[grid.k[c] * slab + grid.j[c] * nx + grid.i[c]] = c;
  const region = new Int32Array(n).fill(-1);
  const queue = new Int32Array(n);
  const regions: PlanRegion[] = [];
  for (let seed = 0; seed < n; seed++) {
    if (region[seed] >= 0) continue;
    const id = regions.length;
    const lv = level[seed];
    let head = 0, tail = 0;
    queue[tail++] = seed;
    region[seed] = id;
    let iMin = grid.i[seed], iMax = iMin, jMin = grid.j[seed], jMax = jMin;
    while (head < tail) {
      const c = queue[head++];
      const i = grid.i[c], j = grid.j[c], k = grid.k[c];
      if (i < iMin) iMin = i;
      if (i > iMax) iMax = i;
      if (j < jMin) jMin = j;
      if (j > jMax) jMax = j;
      for (let d = 0; d < 6; d++) {
        let ii = i, jj = j, kk = k;
        if (d === 0) ii--; else if (d === 1) ii++; else if (d === 2) jj--; else if (d === 3) jj++; else if (d === 4) kk--; else kk++;
        if (ii < 0 || jj < 0 || kk < 0 || ii >= nx || jj >= ny || kk >= nz) continue;
        const o = lookup[kk * slab + jj * nx + ii];
        if (o < 0 || region[o] >= 0 || level[o] !== lv) continue;
        region[o] = id;
        queue[tail++] = o;
      }
    }
    regions.push({ index: id + 1, level: lv + 1, cellCount: tail, iMin, iMax, jMin, jMax });
  }
  const { newId, sorted } = levelOrder(regions);
  for (let c = 0; c < n; c++) if (region[c] >= 0) region[c] = newId[region[c]];
  return { region, regions: sorted };
}
