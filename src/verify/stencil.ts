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
 * both come from one symmetric bilinear form, so the matrix is complex symmetric, and it is
 * positive semi-definite in the diagonal-plus-cross part whenever A is (each cell's energy bounds
 * Axx ḡx² + 2Axy ḡx ḡy + Ayy ḡy² from above). For constant A_xy the cross part is the usual
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
