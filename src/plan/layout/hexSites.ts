/**
 * Where the inclusions of a hexagonal-lattice recipe stand in the device — one set of sites shared
 * by the layout files (layoutShapes.ts, printedPart.ts) and the drawn full-wave case
 * (src/verify/geometryScene.ts), so the shop and the check build the same rods and holes. Pure.
 *
 * The lattice: one hexagonal (triangular) lattice of nearest-neighbour distance a (the recipe's
 * pitch, the device's cell pitch), rows along x, ANCHORED ON THE CENTRE OF THE DEVICE GRID (the
 * middle of its bounding lattice of cells, a cell centre or a cell edge):
 *   site (n, m) at x = x_c + (n + (m mod 2)/2)·a,  y = y_c + m·(√3/2)·a.
 * A hexagonal lattice is mirror-symmetric about the vertical line through any site and the row
 * through any site, so a device symmetric about the grid's centre lines gets a symmetric pattern.
 * It has one site per (√3/2)·a² of area: the recipe's fill f = πr²/((√3/2)·a²) is the area fraction
 * built (2/√3 ≈ 1.155 sites per square cell on average, some cells one, some two).
 *
 * Level of a site: the recipe of the device cell that contains its centre. Every other row of sites
 * lies on vertical cell edges (that is what the symmetric anchor costs): a site on an edge belongs
 * to the cell on the anchor's side (nearer the grid's centre line), one on the centre line itself to
 * the lower cell — so mirror-image sites take mirror-image cells. Computed from the integers (n, m),
 * not from rounded coordinates.
 *
 * Which sites are built (the edge rule): a site is built when its SHARE — the disc of radius a/2
 * around it, where touching inclusions would meet — reaches no device cell whose recipe is another
 * kind (kinds: same family, host and inclusion material on the hexagonal lattice; radii may differ;
 * a cell without a recipe is another kind) and stays inside the device outline. Toward the outline
 * only, an inclusion standing free in a gas host (rods in air: nothing solid lies between it and the
 * outline) needs only itself, the disc of its radius r, inside. So no built inclusion crosses the
 * device outline or reaches into a cell built another way (a solid cell, a square-lattice cell,
 * rods next to holes), and none overlaps another: between two built sites the wall is
 * a − r₁ − r₂ ≥ the smaller of their recipes' walls; to a cell of another kind, or to the outline
 * of a slab, a built inclusion keeps at least half its recipe's wall, (a − 2r)/2, as a
 * square-lattice inclusion does to its own cell's edge. The sites left out are counted per level.
 * Along the edge of a region this leaves out a band about a/2 wide (r wide for free rods at the
 * outline): a region of area A and perimeter P holds about (A − P·a/2)·2/(√3 a²) built sites.
 */

/** Row spacing of the hexagonal lattice over its nearest-neighbour distance, √3/2. */
export const HEX_ROW = Math.sqrt(3) / 2;

/** The lattice fields of a device grid the sites need (cell (i, j) is centred at origin + (i, j)·pitch). */
export interface SiteGrid {
  pitchM: number;
  nx: number;
  ny: number;
  originXM: number;
  originYM: number;
}

/**
 * Site (n, m) in the grid's units: `x2` = its x in half-pitches from cell column 0's centre (an
 * integer), `y` = its y in pitches from cell row 0's centre.
 */
const siteX2 = (g: SiteGrid, n: number, m: number): number => g.nx - 1 + 2 * n + (m & 1); // (m & 1) is right for negative m (two's complement)
const siteYp = (g: SiteGrid, m: number): number => (g.ny - 1) / 2 + m * HEX_ROW;

/** Centre of site (n, m), metres, into out[0], out[1]. */
export function hexSitePosition(g: SiteGrid, n: number, m: number, out: Float64Array): Float64Array {
  out[0] = g.originXM + siteX2(g, n, m) * (g.pitchM / 2);
  out[1] = g.originYM + siteYp(g, m) * g.pitchM;
  return out;
}

/**
 * Lattice cell (i, j) of the device grid containing site (n, m) (the tie rule of the file comment),
 * into out[0], out[1]; may lie outside 0…nx−1, 0…ny−1.
 */
export function hexSiteCell(g: SiteGrid, n: number, m: number, out: Int32Array): Int32Array {
  const x2 = siteX2(g, n, m);
  let i: number;
  if ((x2 & 1) === 0) i = x2 / 2;
  else {
    // on the edge between cells (x2 − 1)/2 and (x2 + 1)/2: the one nearer the centre line (2i = nx − 1)
    const lo = (x2 - 1) / 2, hi = lo + 1, c2 = g.nx - 1;
    i = Math.abs(2 * hi - c2) < Math.abs(2 * lo - c2) ? hi : lo;
  }
  const y = siteYp(g, m);
  // y is a half-integer only for m = 0 with ny even (√3 is irrational): the centre line, lower cell
  const j = m === 0 && (g.ny & 1) === 0 ? g.ny / 2 - 1 : Math.round(y);
  out[0] = i; out[1] = j;
  return out;
}

/**
 * The site (n, m) nearest to (x, y), into out[0], out[1]. The nearest site lies in one of the two
 * rows around y (a point is within a/√3 of some site, the rows are √3/2·a apart), so two candidates
 * suffice. Nothing allocated.
 */
export function nearestHexSite(g: SiteGrid, x: number, y: number, out: Int32Array): Int32Array {
  const u2 = (x - g.originXM) / (g.pitchM / 2), v = (y - g.originYM) / g.pitchM;
  const m0 = Math.floor((v - (g.ny - 1) / 2) / HEX_ROW);
  let best = Infinity, bn = 0, bm = 0;
  for (let m = m0; m <= m0 + 1; m++) {
    const n = Math.round((u2 - (g.nx - 1) - (m & 1)) / 2);
    const dx = (u2 - siteX2(g, n, m)) / 2, dy = v - siteYp(g, m);
    const d = dx * dx + dy * dy;
    if (d < best) { best = d; bn = n; bm = m; }
  }
  out[0] = bn; out[1] = bm;
  return out;
}

/** The built sites of a device (see the file comment). */
export interface HexSites {
  /** index ranges of the lattice searched: n in nLo…nHi, m in mLo…mHi */
  nLo: number;
  nHi: number;
  mLo: number;
  mHi: number;
  /** built sites' centres (metres) and device cells, in row order (m, then n) */
  xM: Float64Array;
  yM: Float64Array;
  cell: Int32Array;
  /** built-site index of lattice site (n, m) at (n − nLo) + (nHi − nLo + 1)·(m − mLo); −1: none */
  index: Int32Array;
  /** sites whose centre lies in a cell of a hexagonal kind but whose share reaches outside its kind's cells, per device cell */
  droppedInCell: Int32Array;
  dropped: number;
}

/** Built-site index of lattice site (n, m), −1 when none is built there. */
export function builtSiteAt(s: HexSites, n: number, m: number): number {
  if (n < s.nLo || n > s.nHi || m < s.mLo || m > s.mHi) return -1;
  return s.index[n - s.nLo + (s.nHi - s.nLo + 1) * (m - s.mLo)];
}

/** Share test tolerance, in pitches squared: a share tangent to a cell edge does not reach into it. */
const TANGENT = 1e-9;

/**
 * The built sites of a device grid: `lut` maps lattice index i + nx·j to the device cell (−1 outside
 * the device); `kind[cell]` ≥ 0 names the kind of hexagonal inclusion the cell's recipe is (equal
 * numbers: same family, host and inclusion), −1 for cells whose recipe is not one; `outlineReach`
 * (per device cell, in pitches, default 1/2 everywhere) is how far from a site of that cell must
 * stay inside the device outline: its share (1/2), or its radius r/a for an inclusion free in a gas
 * host. O(sites).
 */
export function hexSites(g: SiteGrid, lut: Int32Array, kind: Int32Array, outlineReach?: Float64Array): HexSites {
  const nx = g.nx, ny = g.ny;
  const mLo = Math.floor(-((ny - 1) / 2 + 1) / HEX_ROW) - 1, mHi = -mLo;
  const nLo = -Math.ceil((nx + 2) / 2), nHi = -nLo;
  const w = nHi - nLo + 1;
  const index = new Int32Array(w * (mHi - mLo + 1)).fill(-1);
  const droppedInCell = new Int32Array(kind.length);
  const xs: number[] = [], ys: number[] = [], cs: number[] = [];
  const ij = new Int32Array(2), p = new Float64Array(2);
  const cellAt = (i: number, j: number): number => (i < 0 || j < 0 || i >= nx || j >= ny ? -1 : lut[i + nx * j]);
  let dropped = 0;
  for (let m = mLo; m <= mHi; m++) {
    const sy = siteYp(g, m);
    for (let n = nLo; n <= nHi; n++) {
      hexSiteCell(g, n, m, ij);
      const c = cellAt(ij[0], ij[1]);
      if (c < 0 || kind[c] < 0) continue;
      const sx = siteX2(g, n, m) / 2;
      // the share (radius 1/2, in pitches) may reach the eight neighbouring cells
      const reach = outlineReach ? outlineReach[c] : 0.5;
      let ok = true;
      for (let dj = -1; dj <= 1 && ok; dj++) {
        for (let di = -1; di <= 1; di++) {
          if (di === 0 && dj === 0) continue;
          const i = ij[0] + di, j = ij[1] + dj;
          const ex = Math.max(0, Math.abs(sx - i) - 0.5), ey = Math.max(0, Math.abs(sy - j) - 0.5);
          const d2 = ex * ex + ey * ey;
          if (d2 >= 0.25 - TANGENT) continue; // the share does not reach cell (i, j)
          const o = cellAt(i, j);
          if (o < 0 ? d2 < reach * reach - TANGENT : kind[o] !== kind[c]) { ok = false; break; }
        }
      }
      if (!ok) { droppedInCell[c]++; dropped++; continue; }
      hexSitePosition(g, n, m, p);
      index[n - nLo + w * (m - mLo)] = cs.length;
      xs.push(p[0]); ys.push(p[1]); cs.push(c);
    }
  }
  return { nLo, nHi, mLo, mHi, xM: Float64Array.from(xs), yM: Float64Array.from(ys), cell: Int32Array.from(cs), index, droppedInCell, dropped };
}
