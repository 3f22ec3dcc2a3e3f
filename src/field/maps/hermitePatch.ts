/**
 * Smooth interpolation of nodal fields on a structured mesh, and the point locator.
 *
 * Every field f (the physical positions x′, y′ and the solved virtual coordinates) is carried at
 * the nodes with its index-space derivatives f_s, f_t, f_st from second-order finite differences
 * (central inside, one-sided three-point at the ends), and interpolated cell by cell with bicubic
 * Hermite polynomials (de Boor, "A Practical Guide to Splines", 2001, ch. IV; Fritsch & Carlson,
 * SIAM J. Numer. Anal. 17, 238 (1980) for the cubic Hermite basis). The interpolant is C¹ across
 * cells, so the Jacobian of the composite map (virtual as a function of physical) is continuous and
 * is exactly the derivative of the interpolated map — `inverse` and `jacobianK` agree to rounding.
 * With O(h²) nodal values and derivatives, positions are O(h²) and the Jacobian O(h²) accurate.
 * Pure; evaluation allocates nothing.
 */

export interface HermiteField {
  nu: number;
  nv: number;
  /** per node j·nu + i: value, ∂/∂i, ∂/∂j, ∂²/∂i∂j (index units) */
  f: Float64Array;
  fs: Float64Array;
  ft: Float64Array;
  fst: Float64Array;
}

/** Derivative along one index direction (stride 1 with count nu, or stride nu with count nv). */
function diff(src: Float64Array, out: Float64Array, nu: number, nv: number, alongI: boolean): void {
  const count = alongI ? nu : nv, lines = alongI ? nv : nu;
  const stride = alongI ? 1 : nu, lineStride = alongI ? nu : 1;
  for (let l = 0; l < lines; l++) {
    const o = l * lineStride;
    if (count === 2) {
      const d = src[o + stride] - src[o];
      out[o] = d; out[o + stride] = d;
      continue;
    }
    for (let k = 1; k + 1 < count; k++) out[o + k * stride] = 0.5 * (src[o + (k + 1) * stride] - src[o + (k - 1) * stride]);
    out[o] = 0.5 * (-3 * src[o] + 4 * src[o + stride] - src[o + 2 * stride]);
    const e = o + (count - 1) * stride;
    out[e] = 0.5 * (3 * src[e] - 4 * src[e - stride] + src[e - 2 * stride]);
  }
}

/** Nodal values → Hermite data with finite-difference derivatives (the values array is kept). */
export function hermiteField(values: Float64Array, nu: number, nv: number): HermiteField {
  const n = nu * nv;
  const fs = new Float64Array(n), ft = new Float64Array(n), fst = new Float64Array(n);
  diff(values, fs, nu, nv, true);
  diff(values, ft, nu, nv, false);
  diff(ft, fst, nu, nv, true);
  return { nu, nv, f: values, fs, ft, fst };
}

/**
 * f, ∂f/∂s, ∂f/∂t at local (s, t) ∈ [0, 1]² of cell (i, j) into out[o], out[o+1], out[o+2].
 */
export function evalHermite(h: HermiteField, i: number, j: number, s: number, t: number, out: Float64Array, o: number): void {
  const nu = h.nu;
  const s2 = s * s, s3 = s2 * s, t2 = t * t, t3 = t2 * t;
  // basis in s: value-at-0, slope-at-0, value-at-1, slope-at-1, and their derivatives
  const a0 = 2 * s3 - 3 * s2 + 1, a1 = s3 - 2 * s2 + s, a2 = -2 * s3 + 3 * s2, a3 = s3 - s2;
  const da0 = 6 * s2 - 6 * s, da1 = 3 * s2 - 4 * s + 1, da2 = -6 * s2 + 6 * s, da3 = 3 * s2 - 2 * s;
  const b0 = 2 * t3 - 3 * t2 + 1, b1 = t3 - 2 * t2 + t, b2 = -2 * t3 + 3 * t2, b3 = t3 - t2;
  const db0 = 6 * t2 - 6 * t, db1 = 3 * t2 - 4 * t + 1, db2 = -6 * t2 + 6 * t, db3 = 3 * t2 - 2 * t;
  const p00 = j * nu + i, p10 = p00 + 1, p01 = p00 + nu, p11 = p01 + 1;
  const { f, fs, ft, fst } = h;
  // coefficients of the tensor basis: c[sIndex][tIndex]
  const c00 = f[p00], c20 = f[p10], c02 = f[p01], c22 = f[p11];
  const c10 = fs[p00], c30 = fs[p10], c12 = fs[p01], c32 = fs[p11];
  const c01 = ft[p00], c21 = ft[p10], c03 = ft[p01], c23 = ft[p11];
  const c11 = fst[p00], c31 = fst[p10], c13 = fst[p01], c33 = fst[p11];
  // contract over t first (value basis and its derivative), then over s
  const r0 = c00 * b0 + c01 * b1 + c02 * b2 + c03 * b3, r1 = c10 * b0 + c11 * b1 + c12 * b2 + c13 * b3;
  const r2 = c20 * b0 + c21 * b1 + c22 * b2 + c23 * b3, r3 = c30 * b0 + c31 * b1 + c32 * b2 + c33 * b3;
  const q0 = c00 * db0 + c01 * db1 + c02 * db2 + c03 * db3, q1 = c10 * db0 + c11 * db1 + c12 * db2 + c13 * db3;
  const q2 = c20 * db0 + c21 * db1 + c22 * db2 + c23 * db3, q3 = c30 * db0 + c31 * db1 + c32 * db2 + c33 * db3;
  out[o] = a0 * r0 + a1 * r1 + a2 * r2 + a3 * r3;
  out[o + 1] = da0 * r0 + da1 * r1 + da2 * r2 + da3 * r3;
  out[o + 2] = a0 * q0 + a1 * q1 + a2 * q2 + a3 * q3;
}

/** Where a physical point lies: cell (i, j) and local (s, t). */
export interface MeshLocation { i: number; j: number; s: number; t: number }

export interface Locator {
  /** true and `loc` filled when (x, y) lies in the interpolated domain */
  locate(xM: number, yM: number, loc: MeshLocation): boolean;
}

/** Newton iterations allowed per candidate cell. */
export const LOCATE_MAX_ITERATIONS = 30;
/** Local-coordinate slack at cell edges (points on the boundary count as inside). */
const EDGE_SLACK = 1e-9;

/**
 * A point locator over the Hermite geometry (gx, gy): a bucket grid of cell bounding boxes
 * (inflated for the cubic edges' bulge), then Newton's method in the candidate cells.
 */
export function makeLocator(gx: HermiteField, gy: HermiteField): Locator {
  const { nu, nv } = gx;
  const cu = nu - 1, cv = nv - 1, cells = cu * cv;
  const bx0 = new Float64Array(cells), bx1 = new Float64Array(cells), by0 = new Float64Array(cells), by1 = new Float64Array(cells);
  let minX = Infinity, maxX = -Infinity, minY = Infinity, maxY = -Infinity, sumSize = 0;
  for (let j = 0; j < cv; j++) for (let i = 0; i < cu; i++) {
    const c = j * cu + i, p = j * nu + i;
    const xs = [gx.f[p], gx.f[p + 1], gx.f[p + nu], gx.f[p + nu + 1]], ys = [gy.f[p], gy.f[p + 1], gy.f[p + nu], gy.f[p + nu + 1]];
    let x0 = Math.min(...xs), x1 = Math.max(...xs), y0 = Math.min(...ys), y1 = Math.max(...ys);
    const pad = 0.3 * Math.max(x1 - x0, y1 - y0);
    x0 -= pad; x1 += pad; y0 -= pad; y1 += pad;
    bx0[c] = x0; bx1[c] = x1; by0[c] = y0; by1[c] = y1;
    minX = Math.min(minX, x0); maxX = Math.max(maxX, x1); minY = Math.min(minY, y0); maxY = Math.max(maxY, y1);
    sumSize += Math.max(x1 - x0, y1 - y0);
  }
  const cellSize = Math.max(sumSize / cells, 1e-300);
  const nbx = Math.max(1, Math.min(1024, Math.ceil((maxX - minX) / cellSize))), nby = Math.max(1, Math.min(1024, Math.ceil((maxY - minY) / cellSize)));
  const hx = (maxX - minX) / nbx || 1, hy = (maxY - minY) / nby || 1;
  const counts = new Int32Array(nbx * nby + 1);
  const range = (c: number, visit: (b: number) => void): void => {
    const i0 = Math.max(0, Math.floor((bx0[c] - minX) / hx)), i1 = Math.min(nbx - 1, Math.floor((bx1[c] - minX) / hx));
    const j0 = Math.max(0, Math.floor((by0[c] - minY) / hy)), j1 = Math.min(nby - 1, Math.floor((by1[c] - minY) / hy));
    for (let bj = j0; bj <= j1; bj++) for (let bi = i0; bi <= i1; bi++) visit(bj * nbx + bi);
  };
  for (let c = 0; c < cells; c++) range(c, (b) => { counts[b + 1]++; });
  for (let b = 0; b < nbx * nby; b++) counts[b + 1] += counts[b];
  const fill = counts.slice(0, nbx * nby);
  const list = new Int32Array(counts[nbx * nby]);
  for (let c = 0; c < cells; c++) range(c, (b) => { list[fill[b]++] = c; });

  const ex = new Float64Array(3), ey = new Float64Array(3);
  let last = 0;
  const tryCell = (c: number, px: number, py: number, loc: MeshLocation): boolean => {
    const j = Math.floor(c / cu), i = c - j * cu;
    let s = 0.5, t = 0.5;
    for (let it = 0; it < LOCATE_MAX_ITERATIONS; it++) {
      evalHermite(gx, i, j, s, t, ex, 0);
      evalHermite(gy, i, j, s, t, ey, 0);
      const rx = ex[0] - px, ry = ey[0] - py;
      const det = ex[1] * ey[2] - ex[2] * ey[1];
      if (!(det > 0)) return false;
      const ds = (ey[2] * rx - ex[2] * ry) / det, dt = (-ey[1] * rx + ex[1] * ry) / det;
      s -= ds; t -= dt;
      if (s < -1 || s > 2 || t < -1 || t > 2) return false;
      if (Math.abs(ds) + Math.abs(dt) < 1e-13) break;
    }
    if (s < -EDGE_SLACK || s > 1 + EDGE_SLACK || t < -EDGE_SLACK || t > 1 + EDGE_SLACK) return false;
    loc.i = i; loc.j = j; loc.s = Math.min(1, Math.max(0, s)); loc.t = Math.min(1, Math.max(0, t));
    return true;
  };
  return {
    locate(px, py, loc) {
      if (!(px >= minX && px <= maxX && py >= minY && py <= maxY)) return false;
      if (tryCell(last, px, py, loc)) return true;
      const bi = Math.min(nbx - 1, Math.floor((px - minX) / hx)), bj = Math.min(nby - 1, Math.floor((py - minY) / hy));
      const b = bj * nbx + bi;
      for (let q = counts[b]; q < counts[b + 1]; q++) {
        const c = list[q];
        if (c === last || px < bx0[c] || px > bx1[c] || py < by0[c] || py > by1[c]) continue;
        if (tryCell(c, px, py, loc)) { last = c; return true; }
      }
      return false;
    },
  };
}
