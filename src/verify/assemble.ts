/**
 * Assemble the FDFD operator of a gridded scene into a complex band matrix. Unknowns are numbered
 * along the shorter side of the grid first, so the half-bandwidth is min(nx, ny) + 1 (the nine-point
 * stencil reaches the diagonal neighbours). Rows of nodes held at zero (Ez nodes inside a perfect
 * conductor) become identity rows.
 */
import { InputError } from "../core/errors.js";
import { bandBytes, newBandMatrix, type BandMatrix } from "./bandedLu.js";
import type { FdfdGrid } from "./fdfdGrid.js";
import type { GridCoefficients } from "./gridCoefficients.js";
import type { PmlStretch } from "./pml.js";
import { nodeStencil } from "./stencil.js";

/**
 * Size limits of the direct solver (our choice for a 2-core machine with a few GB of memory; the
 * factorization costs about n·w² complex multiply-adds — 1e9 take a few seconds in V8).
 */
export const MAX_BAND_MEGABYTES = 400;
export const MAX_FACTOR_WORK = 2e9;

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
  return { megabytes: bandBytes(n, w) / 1e6, work: n * w * w, unknowns: n, halfBandwidth: w };
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

/** The operator matrix (with PML) of coefficients c at free-space wavenumber k0. */
export function assembleOperator(g: FdfdGrid, c: GridCoefficients, stretch: PmlStretch | null, k0: number, order: NodeOrder, holdZero: Uint8Array | null): BandMatrix {
  checkGridSize(g);
  const m = newBandMatrix(g.nx * g.ny, order.halfBandwidth);
  const w = new Float64Array(18);
  const stride = 2 * m.w + 1;
  for (let j = 0; j < g.ny; j++) {
    for (let i = 0; i < g.nx; i++) {
      const id = i + g.nx * j;
      const r = order.row[id];
      const base = r * stride - r + m.w;
      if (holdZero && holdZero[id]) { m.re[base + r] = 1; continue; }
      nodeStencil(g, c, stretch, k0, i, j, w);
      for (let dj = -1; dj <= 1; dj++) {
        const nj = j + dj;
        if (nj < 0 || nj >= g.ny) continue;
        for (let di = -1; di <= 1; di++) {
          const ni = i + di;
          if (ni < 0 || ni >= g.nx) continue;
          const s = 2 * ((di + 1) + 3 * (dj + 1));
          if (w[s] === 0 && w[s + 1] === 0) continue;
          const col = order.row[ni + g.nx * nj];
          m.re[base + col] += w[s];
          m.im[base + col] += w[s + 1];
        }
      }
    }
  }
  return m;
}
