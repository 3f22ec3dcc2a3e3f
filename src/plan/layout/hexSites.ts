/**
 * Where the inclusions of a hexagonal-lattice recipe stand in the device: the sites of one
 * hexagonal (triangular) lattice of nearest-neighbour distance a (the recipe's pitch, the device's
 * cell pitch) anchored on the device's cell (0, 0):
 *   site (n, m) at x = x₀ + (n + (m mod 2)/2)·a,  y = y₀ + m·(√3/2)·a.
 * A site belongs to the square device cell that contains it (rounding to the cell grid), and takes
 * that cell's recipe. The lattice has one site per (√3/2)·a² of area, so a region of such cells
 * holds 2/√3 ≈ 1.155 sites per cell on average (some cells none, some two): that is what makes the
 * recipe's fill fraction f = π r²/((√3/2) a²) the area fraction actually built. Pure.
 */

/** Row spacing of the hexagonal lattice over its nearest-neighbour distance, √3/2. */
export const HEX_ROW = Math.sqrt(3) / 2;

/**
 * The site nearest to (x, y) of the hexagonal lattice of distance a anchored at (x0, y0), written
 * into out[0], out[1] (metres). The nearest site lies in one of the two rows around y (a point is
 * within a/√3 of some site, the rows are √3/2·a apart), so two candidates suffice. Nothing allocated.
 */
export function nearestHexSite(x: number, y: number, x0: number, y0: number, a: number, out: Float64Array): Float64Array {
  const row = a * HEX_ROW;
  const m0 = Math.floor((y - y0) / row);
  let best = Infinity, bx = 0, by = 0;
  for (let m = m0; m <= m0 + 1; m++) {
    const shift = (m & 1) === 0 ? 0 : 0.5; // (m & 1) is right for negative m too (two's complement)
    const n = Math.round((x - x0) / a - shift);
    const sx = x0 + (n + shift) * a, sy = y0 + m * row;
    const d = (x - sx) * (x - sx) + (y - sy) * (y - sy);
    if (d < best) { best = d; bx = sx; by = sy; }
  }
  out[0] = bx; out[1] = by;
  return out;
}

/** The lattice fields of a device grid the sites need. */
export interface SiteGrid {
  pitchM: number;
  nx: number;
  ny: number;
  originXM: number;
  originYM: number;
}

/**
 * Every hexagonal-lattice site whose containing cell `keep`s it: `lut` maps lattice index
 * i + nx·j to the device cell (−1 outside the device); `keep(cell)` says whether that cell's recipe
 * stands on the hexagonal lattice. Returns the sites' centres (metres) and cells, in row order.
 */
export function hexSites(grid: SiteGrid, lut: Int32Array, keep: (cell: number) => boolean): { xM: Float64Array; yM: Float64Array; cell: Int32Array } {
  const a = grid.pitchM, row = a * HEX_ROW;
  const x0 = grid.originXM, y0 = grid.originYM;
  const mLo = Math.floor(-0.5 / HEX_ROW) - 1, mHi = Math.ceil((grid.ny - 0.5) / HEX_ROW) + 1;
  const xs: number[] = [], ys: number[] = [], cs: number[] = [];
  for (let m = mLo; m <= mHi; m++) {
    const sy = y0 + m * row;
    const j = Math.round((sy - y0) / a);
    if (j < 0 || j >= grid.ny) continue;
    const shift = (m & 1) === 0 ? 0 : 0.5;
    for (let n = -1; n <= grid.nx; n++) {
      const sx = x0 + (n + shift) * a;
      const i = Math.round((sx - x0) / a);
      if (i < 0 || i >= grid.nx) continue;
      const c = lut[i + grid.nx * j];
      if (c < 0 || !keep(c)) continue;
      xs.push(sx); ys.push(sy); cs.push(c);
    }
  }
  return { xM: Float64Array.from(xs), yM: Float64Array.from(ys), cell: Int32Array.from(cs) };
}
