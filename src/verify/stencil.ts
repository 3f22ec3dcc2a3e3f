/**
 * The nine-point stencil of ∇·(A ∇u) + k0² b u at one node, with stretched-coordinate PML folded
 * into the coefficients (uniaxial form: A_xx → (s_y/s_x) A_xx, A_yy → (s_x/s_y) A_yy,
 * b → s_x s_y b, A_xy unchanged; Sacks et al., IEEE Trans. Antennas Propag. 43, 1460 (1995);
 * Chew & Weedon 1994).
 *
 * Discretization (node spacing h):
 *   diagonal part  [a⁺ₓ(u_{i+1,j} − u_{ij}) − a⁻ₓ(u_{ij} − u_{i−1,j}) + same along y] / h²,
 *   cross part     from the form Σ_cells A_xy,c (ḡx_c(u) ḡy_c(v) + ḡy_c(u) ḡx_c(v)) where ḡ are
 *                  the gradients averaged over the cell's four corners;
 * or, where the coefficients carry A_xy on the faces (drawn scenes, gridCoefficients.ts), half of
 *                  2 A_xy u_x u_y on the x-faces (g_x of the face times ḡ_y, the mean of the four
 *                  y-differences around it) and half on the y-faces likewise (faceCrossTerms);
 * both come from one symmetric bilinear form, so the matrix is complex symmetric. With the cross
 * term at the centres it is positive semi-definite in the diagonal-plus-cross part whenever A is
 * (each cell's energy bounds Axx ḡx² + 2Axy ḡx ḡy + Ayy ḡy² from above); on the faces that bound is
 * not proven (the drawn scenes' Kottke tensors are isotropic but near interfaces, |A_xy| ≤ the
 * spread of A there). For constant A_xy the cross part is the usual
 * 2A_xy (u_{i+1,j+1} − u_{i+1,j−1} − u_{i−1,j+1} + u_{i−1,j−1}) / (4h²).
 */
import type { FdfdGrid } from "./fdfdGrid.js";
import type { GridCoefficients } from "./gridCoefficients.js";
import type { PmlStretch } from "./pml.js";

/** Weights w[(di+1) + 3(dj+1)] of neighbour (i+di, j+dj), complex as (re, im) pairs: length 18. */
export type StencilWeights = Float64Array;

/**
 * Write the stencil of node (i, j) into w (length 18) and return it. Neighbours outside the grid
 * get weight zero (the wall). `stretch` null means no PML (plain coefficients).
 */
export function nodeStencil(g: FdfdGrid, c: GridCoefficients, stretch: PmlStretch | null, k0: number, i: number, j: number, w: StencilWeights): StencilWeights {
  w.fill(0);
  const nx = g.nx, ny = g.ny, ih2 = 1 / (g.h * g.h);
  const id = i + nx * j;
  // x-faces i±½ (coefficient index of the face to the right of node i−1 and i)
  for (let side = 0; side < 2; side++) {
    // face i+½ is stored at node i; the wall face left of node 0 reuses face 0's values
    const fi = Math.max(0, side === 0 ? i - 1 : i);
    const f = fi + nx * j;
    let aRe = c.axxRe[f], aIm = c.axxIm[f];
    if (stretch) {
      // × s_y(node j) / s_x(face fi)
      const syRe = stretch.y.nodeRe[j], syIm = stretch.y.nodeIm[j];
      const sxRe = stretch.x.faceRe[fi], sxIm = stretch.x.faceIm[fi];
      const d = sxRe * sxRe + sxIm * sxIm;
      const qRe = (syRe * sxRe + syIm * sxIm) / d, qIm = (syIm * sxRe - syRe * sxIm) / d;
      const t = aRe * qRe - aIm * qIm; aIm = aRe * qIm + aIm * qRe; aRe = t;
    }
    aRe *= ih2; aIm *= ih2;
    const nb = side === 0 ? 3 : 5; // (di = −1 or +1, dj = 0)
    w[8] -= aRe; w[9] -= aIm;
    if (!(side === 0 ? i === 0 : i === nx - 1)) { w[2 * nb] += aRe; w[2 * nb + 1] += aIm; }
  }
  for (let side = 0; side < 2; side++) {
    const fj = Math.max(0, side === 0 ? j - 1 : j);
    const f = i + nx * fj;
    let aRe = c.ayyRe[f], aIm = c.ayyIm[f];
    if (stretch) {
      const sxRe = stretch.x.nodeRe[i], sxIm = stretch.x.nodeIm[i];
      const syRe = stretch.y.faceRe[fj], syIm = stretch.y.faceIm[fj];
      const d = syRe * syRe + syIm * syIm;
      const qRe = (sxRe * syRe + sxIm * syIm) / d, qIm = (sxIm * syRe - sxRe * syIm) / d;
      const t = aRe * qRe - aIm * qIm; aIm = aRe * qIm + aIm * qRe; aRe = t;
    }
    aRe *= ih2; aIm *= ih2;
    const nb = side === 0 ? 1 : 7; // (0, −1) or (0, +1)
    w[8] -= aRe; w[9] -= aIm;
    if (!(side === 0 ? j === 0 : j === ny - 1)) { w[2 * nb] += aRe; w[2 * nb + 1] += aIm; }
  }
  // cross terms from the four cells around the node; cell (ci+½, cj+½) stored at node (ci, cj)
  for (let cq = 0; cq < 2; cq++) {
    for (let cp = 0; cp < 2; cp++) {
      const ci = i - 1 + cp, cj = j - 1 + cq;
      if (ci < 0 || cj < 0 || ci >= nx || cj >= ny) continue;
      const cell = ci + nx * cj;
      const xyRe = c.axyRe[cell], xyIm = c.axyIm[cell];
      if (xyRe === 0 && xyIm === 0) continue;
      // position of node (i, j) in the cell: p = 1 − cp, q = 1 − cq; signs σ = 2p − 1
      const sx = 1 - 2 * cp, sy = 1 - 2 * cq;
      for (let qq = 0; qq < 2; qq++) {
        for (let pp = 0; pp < 2; pp++) {
          const ni = ci + pp, nj = cj + qq;
          if (ni < 0 || nj < 0 || ni >= nx || nj >= ny) continue;
          const f = -(sy * (2 * pp - 1) + sx * (2 * qq - 1)) * 0.25 * ih2;
          if (f === 0) continue;
          const slot = 2 * ((ni - i + 1) + 3 * (nj - j + 1));
          w[slot] += f * xyRe; w[slot + 1] += f * xyIm;
        }
      }
    }
  }
  if (c.axyXRe && c.axyXIm && c.axyYRe && c.axyYIm) faceCrossTerms(c.axyXRe, c.axyXIm, c.axyYRe, c.axyYIm, nx, ny, ih2, i, j, w);
  // k0² b (× s_x s_y)
  let bRe = c.bRe[id], bIm = c.bIm[id];
  if (stretch) {
    const sxRe = stretch.x.nodeRe[i], sxIm = stretch.x.nodeIm[i], syRe = stretch.y.nodeRe[j], syIm = stretch.y.nodeIm[j];
    const pRe = sxRe * syRe - sxIm * syIm, pIm = sxRe * syIm + sxIm * syRe;
    const t = bRe * pRe - bIm * pIm; bIm = bRe * pIm + bIm * pRe; bRe = t;
  }
  w[8] += k0 * k0 * bRe; w[9] += k0 * k0 * bIm;
  return w;
}

/** w[slot of node (ni, nj)] += f·(re, im) when the node is on the grid (else: the Dirichlet wall). */
function addWeight(w: StencilWeights, i: number, j: number, nx: number, ny: number, ni: number, nj: number, f: number, re: number, im: number): void {
  if (ni < 0 || nj < 0 || ni >= nx || nj >= ny) return;
  const slot = 2 * ((ni - i + 1) + 3 * (nj - j + 1));
  w[slot] += f * re; w[slot + 1] += f * im;
}

/**
 * The cross term 2 A_xy u_x u_y carried by the faces (GridCoefficients.axyX*, axyY*): half of it on
 * the x-faces, with g_x the face's difference and ḡ_y the mean of the four y-differences around it,
 * half on the y-faces likewise — the bilinear form Σ_f (A_xy,f / 2)(g_x(u) ḡ_y(v) + ḡ_y(u) g_x(v)) h²,
 * so the matrix stays symmetric and nine-point. Node (i, j)'s row: w_m −= (A_xy,f / 2)(g_m e_n + ḡ_m d_n)
 * over the faces whose differences hold the node (d_n, e_n: the node's weights in g and ḡ).
 */
function faceCrossTerms(xRe: Float64Array, xIm: Float64Array, yRe: Float64Array, yIm: Float64Array, nx: number, ny: number, ih2: number, i: number, j: number, w: StencilWeights): void {
  // x-faces (fi + ½, fj), stored at fi + nx·fj: g_x = u(fi+1, fj) − u(fi, fj); ḡ_y = ¼[u(fi, fj+1) + u(fi+1, fj+1) − u(fi, fj−1) − u(fi+1, fj−1)]
  for (let fj = Math.max(0, j - 1); fj <= Math.min(ny - 1, j + 1); fj++) {
    for (let fi = Math.max(0, i - 1); fi <= Math.min(nx - 2, i); fi++) {
      const f = fi + nx * fj;
      const cRe = xRe[f], cIm = xIm[f];
      if (cRe === 0 && cIm === 0) continue;
      const dn = fj === j ? (fi === i ? -1 : 1) : 0;
      const en = fj === j - 1 ? 0.25 : fj === j + 1 ? -0.25 : 0;
      const k = -0.5 * ih2;
      if (en !== 0) { addWeight(w, i, j, nx, ny, fi, fj, -k * en, cRe, cIm); addWeight(w, i, j, nx, ny, fi + 1, fj, k * en, cRe, cIm); }
      if (dn !== 0) {
        const q = 0.25 * k * dn;
        addWeight(w, i, j, nx, ny, fi, fj + 1, q, cRe, cIm); addWeight(w, i, j, nx, ny, fi + 1, fj + 1, q, cRe, cIm);
        addWeight(w, i, j, nx, ny, fi, fj - 1, -q, cRe, cIm); addWeight(w, i, j, nx, ny, fi + 1, fj - 1, -q, cRe, cIm);
      }
    }
  }
  // y-faces (fi, fj + ½), stored at fi + nx·fj: g_y = u(fi, fj+1) − u(fi, fj); ḡ_x = ¼[u(fi+1, fj) + u(fi+1, fj+1) − u(fi−1, fj) − u(fi−1, fj+1)]
  for (let fj = Math.max(0, j - 1); fj <= Math.min(ny - 2, j); fj++) {
    for (let fi = Math.max(0, i - 1); fi <= Math.min(nx - 1, i + 1); fi++) {
      const f = fi + nx * fj;
      const cRe = yRe[f], cIm = yIm[f];
      if (cRe === 0 && cIm === 0) continue;
      const dn = fi === i ? (fj === j ? -1 : 1) : 0;
      const en = fi === i - 1 ? 0.25 : fi === i + 1 ? -0.25 : 0;
      const k = -0.5 * ih2;
      if (en !== 0) { addWeight(w, i, j, nx, ny, fi, fj, -k * en, cRe, cIm); addWeight(w, i, j, nx, ny, fi, fj + 1, k * en, cRe, cIm); }
      if (dn !== 0) {
        const q = 0.25 * k * dn;
        addWeight(w, i, j, nx, ny, fi + 1, fj, q, cRe, cIm); addWeight(w, i, j, nx, ny, fi + 1, fj + 1, q, cRe, cIm);
        addWeight(w, i, j, nx, ny, fi - 1, fj, -q, cRe, cIm); addWeight(w, i, j, nx, ny, fi - 1, fj + 1, -q, cRe, cIm);
      }
    }
  }
}

/**
 * out = L u for the operator of coefficients c (no PML), Dirichlet-zero outside the grid.
 * Used for the scattered-field source −(L − L_background) u_inc and for residual checks.
 */
export function applyOperator(g: FdfdGrid, c: GridCoefficients, stretch: PmlStretch | null, k0: number, uRe: Float64Array, uIm: Float64Array, outRe: Float64Array, outIm: Float64Array, mask?: Uint8Array): void {
  const w = new Float64Array(18);
  for (let j = 0; j < g.ny; j++) {
    for (let i = 0; i < g.nx; i++) {
      const id = i + g.nx * j;
      if (mask && !mask[id]) { outRe[id] = 0; outIm[id] = 0; continue; }
      nodeStencil(g, c, stretch, k0, i, j, w);
      let re = 0, im = 0;
      for (let dj = -1; dj <= 1; dj++) {
        const nj = j + dj;
        if (nj < 0 || nj >= g.ny) continue;
        for (let di = -1; di <= 1; di++) {
          const ni = i + di;
          if (ni < 0 || ni >= g.nx) continue;
          const s = 2 * ((di + 1) + 3 * (dj + 1));
          const wr = w[s], wi = w[s + 1];
          if (wr === 0 && wi === 0) continue;
          const n = ni + g.nx * nj;
          re += wr * uRe[n] - wi * uIm[n];
          im += wr * uIm[n] + wi * uRe[n];
        }
      }
      outRe[id] = re; outIm[id] = im;
    }
  }
}
