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
 * Label the connected components of equal `level` over the grid's cells (breadth-first search
 * with one queue array; O(cells + bounding box)).
 */
export function findRegions(grid: DeviceGrid, level: Int32Array): RegionResult {
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
  // renumber in level order (stable: ties keep the order of their first cell)
  const order = regions.map((_, k) => k).sort((a, b) => {
    const la = regions[a].level <= 0 ? Infinity : regions[a].level, lb = regions[b].level <= 0 ? Infinity : regions[b].level;
    return la - lb || a - b;
  });
  const newId = new Int32Array(regions.length);
  order.forEach((old, k) => { newId[old] = k; });
  for (let c = 0; c < n; c++) if (region[c] >= 0) region[c] = newId[region[c]];
  const sorted = order.map((old, k) => ({ ...regions[old], index: k + 1 }));
  return { region, regions: sorted };
}
