/**
 * Assemble the FDFD operator of a gridded scene into a complex symmetric band matrix (lower band).
 * Unknowns are numbered along the shorter side of the grid first, so the half-bandwidth is
 * min(nx, ny) + 1 (the nine-point stencil reaches the diagonal neighbours). Nodes whose value is
 * prescribed (Ez nodes inside a perfect conductor) are eliminated symmetrically: their row becomes
 * the identity and their column is moved to the right-hand side, so the matrix stays symmetric.
 */
import { InputError } from "../core/errors.js";
import { newSymBandMatrix, symBandBytes, type SymBandMatrix } from "./bandedLdlt.js";
import type { FdfdGrid } from "./fdfdGrid.js";
import type { GridCoefficients } from "./gridCoefficients.js";
import type { PmlStretch } from "./pml.js";
import { nodeStencil } from "./stencil.js";

/**
 * Size limits of the direct solver (our choice, for a 2-core machine: the LDLᵀ factorization costs
 * about n·w²/2 complex multiply-adds at roughly 3 ns each in V8, so the work limit is about 3 s per
 * solve; the band takes 16·n·(w+1) bytes). A square grid of about 200 × 200 nodes fits.
 */
export const MAX_BAND_MEGABYTES = 200;
export const MAX_FACTOR_WORK = 1e9;

/** Node numbering: row of node id = i + nx·j, and back. */
export interface NodeOrder {
  /** matrix row of each node id */
  row: Int32Array;
  halfBandwidth: number;
}

/** Numbering along the shorter side first. */
export function nodeOrder(g: FdfdGrid): NodeOrder {
  const row = new Int32Array(g.nx * g.ny);
  const alongX = g.nx <= g.ny;
  for (let j = 0; j < g.ny; j++) for (let i = 0; i < g.nx; i++) row[i + g.nx * j] = alongX ? i + g.nx * j : j + g.ny * i;
  return { row, halfBandwidth: Math.min(g.nx, g.ny) + 1 };
}

/** Memory (MB) and work (complex multiply-adds) of solving on grid g. */
export function solveCost(g: FdfdGrid): { megabytes: number; work: number; unknowns: number; halfBandwidth: number } {
  const n = g.nx * g.ny, w = Math.min(g.nx, g.ny) + 1;
  return { megabytes: symBandBytes(n, w) / 1e6, work: (n * w * w) / 2, unknowns: n, halfBandwidth: w };
}

/** Throw InputError at `where` when the grid exceeds MAX_BAND_MEGABYTES or MAX_FACTOR_WORK. */
export function checkGridSize(g: FdfdGrid, where = "verify grid"): void {
  const c = solveCost(g);
  if (c.megabytes > MAX_BAND_MEGABYTES || c.work > MAX_FACTOR_WORK) {
    throw new InputError({
      where,
      message: `grid of ${g.nx} × ${g.ny} nodes is too large for the direct solver (${Math.round(c.megabytes)} MB, ${(c.work / 1e9).toFixed(1)}e9 operations; limits ${MAX_BAND_MEGABYTES} MB and ${MAX_FACTOR_WORK / 1e9}e9); lower the resolution or the margin`,
    });
  }
}

/**
 * The operator matrix (with PML) of coefficients c at free-space wavenumber k0, lower band only.
 * Nodes flagged in `held` keep the value f[id] (f indexed by node id); the right-hand side f is
 * updated in place for the symmetric elimination of those nodes.
 */
export function assembleOperator(g: FdfdGrid, c: GridCoefficients, stretch: PmlStretch | null, k0: number, order: NodeOrder, held: Uint8Array | null, fRe: Float64Array, fIm: Float64Array): SymBandMatrix {
  checkGridSize(g);
  const m = newSymBandMatrix(g.nx * g.ny, order.halfBandwidth);
  const w = new Float64Array(18);
  const stride = m.w + 1;
  for (let j = 0; j < g.ny; j++) {
    for (let i = 0; i < g.nx; i++) {
      const id = i + g.nx * j;
      const r = order.row[id];
      const base = r * stride - r + m.w;
      if (held && held[id]) { m.re[base + r] = 1; continue; }
      nodeStencil(g, c, stretch, k0, i, j, w);
      for (let dj = -1; dj <= 1; dj++) {
        const nj = j + dj;
        if (nj < 0 || nj >= g.ny) continue;
        for (let di = -1; di <= 1; di++) {
          const ni = i + di;
          if (ni < 0 || ni >= g.nx) continue;
          const s = 2 * ((di + 1) + 3 * (dj + 1));
          const wr = w[s], wi = w[s + 1];
          if (wr === 0 && wi === 0) continue;
          const nid = ni + g.nx * nj;
          if (held && held[nid]) {
            // known value: move to the right-hand side
            fRe[id] -= wr * fRe[nid] - wi * fIm[nid];
            fIm[id] -= wr * fIm[nid] + wi * fRe[nid];
            continue;
          }
          const col = order.row[nid];
          if (col > r) continue; // upper triangle: the same value is stored from the other row
          m.re[base + col] += wr;
          m.im[base + col] += wi;
        }
      }
    }
  }
  return m;
}
