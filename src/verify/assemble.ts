/**
 * Assemble the FDFD operator of a gridded scene as a sparse complex symmetric matrix (both
 * triangles, compressed columns) for the nested-dissection solver (src/numerics), plus the sizes
 * of that solve for refusing a grid before anything is allocated. Nodes whose value is prescribed
 * (Ez nodes inside a perfect conductor) are eliminated symmetrically: their row and column become
 * the identity and their column is moved to the right-hand side, so the matrix stays symmetric.
 * The tests check the assembled solve against the matrix-free operator (`applyOperator`,
 * stencil.ts) and the sparse solver against a banded and a dense reference (tests/helpers).
 */
import { InputError } from "../core/errors.js";
import { gridFactorCost, type SymbolicCost } from "../numerics/gridNestedDissection.js";
import type { SparseSymmetricMatrix } from "../numerics/sparseSymmetricMatrix.js";
import type { FdfdGrid } from "./fdfdGrid.js";
import type { GridCoefficients } from "./gridCoefficients.js";
import type { PmlStretch } from "./pml.js";
import { nodeStencil } from "./stencil.js";

/**
 * Memory the solver may use unless the caller says otherwise: 8 GB (a third of this 24 GB
 * machine, our choice, leaving room for the other runs and processes). The shell may pass the
 * machine's own figure (checkGridSize's `limitBytes`).
 */
export const DEFAULT_SOLVER_BYTES = 8e9;
/** Bytes per unknown besides the factor: the matrix (9 entries × 20 B), ordering, solution, residual and right-hand-side vectors. */
const BYTES_PER_UNKNOWN = 9 * 20 + 4 * 4 + 12 * 16;

export interface SolveCost {
  /** peak memory of one solve (factor + workspace + matrix and vectors), MB */
  megabytes: number;
  /** complex multiply-adds of the factorization */
  work: number;
  unknowns: number;
  /** entries of the factor */
  factorEntries: number;
  symbolic: SymbolicCost;
}

/**
 * Grids of more nodes are not costed front by front: the unknowns' own arrays alone would take
 * above 100 GB, and the symbolic walk (and the ordering's 2³¹ limit) would cost time for nothing.
 */
const COSTED_NODES = 2 ** 28;

/**
 * Memory and work of solving on grid g with the nested-dissection solver (symbolic phase only).
 * Above COSTED_NODES a lower bound (the unknowns' arrays and one factor entry per unknown), which
 * is enough to refuse the grid with a finite figure.
 */
export function solveCost(g: FdfdGrid): SolveCost {
  const nodes = g.nx * g.ny;
  if (!(nodes <= COSTED_NODES)) {
    const n = Math.min(nodes, Number.MAX_SAFE_INTEGER);
    const symbolic: SymbolicCost = { unknowns: n, fronts: 1, factorEntries: n, work: n, largestFront: 1, peakStackEntries: 0, factorBytes: 16 * n, workspaceBytes: 0 };
    return { megabytes: ((16 + BYTES_PER_UNKNOWN) * n) / 1e6, work: n, unknowns: n, factorEntries: n, symbolic };
  }
  const s = gridFactorCost(g.nx, g.ny);
  const bytes = s.factorBytes + s.workspaceBytes + BYTES_PER_UNKNOWN * s.unknowns;
  return { megabytes: bytes / 1e6, work: s.work, unknowns: s.unknowns, factorEntries: s.factorEntries, symbolic: s };
}

/** True when grid g fits in `limitBytes`. */
export function gridFits(g: FdfdGrid, limitBytes = DEFAULT_SOLVER_BYTES): boolean {
  return solveCost(g).megabytes * 1e6 <= limitBytes;
}

/** "1.2 GB" / "850 MB" / "3.2e+6 GB" (beyond 10⁵ GB: two significant digits) */
export function formatBytes(bytes: number): string {
  if (bytes >= 1e14) return `${(bytes / 1e9).toPrecision(2)} GB`;
  return bytes >= 1e9 ? `${(bytes / 1e9).toFixed(1)} GB` : `${Math.max(1, Math.round(bytes / 1e6))} MB`;
}

/**
 * Throw InputError at `where` when solving on grid g would need more than `limitBytes`. The
 * message gives the grid, the estimate and the limit; `hint` (e.g. the largest resolution that
 * fits) is appended.
 */
export function checkGridSize(g: FdfdGrid, where = "verify grid", limitBytes = DEFAULT_SOLVER_BYTES, hint = "lower the resolution or the margin"): void {
  const c = solveCost(g);
  if (c.megabytes * 1e6 > limitBytes) {
    throw new InputError({
      where,
      message: `a grid of ${g.nx} × ${g.ny} nodes needs about ${formatBytes(c.megabytes * 1e6)} for the direct solver (${(c.work / 1e9).toFixed(1)}e9 complex operations), more than the ${formatBytes(limitBytes)} allowed; ${hint}`,
    });
  }
}

/**
 * The operator matrix (with PML) of coefficients c at free-space wavenumber k0 as a sparse
 * symmetric matrix indexed by node id (v = i + nx·j). Nodes flagged in `held` keep the value
 * f[id]; the right-hand side f is updated in place for their symmetric elimination.
 */
export function assembleSparseOperator(g: FdfdGrid, c: GridCoefficients, stretch: PmlStretch | null, k0: number, held: Uint8Array | null, fRe: Float64Array, fIm: Float64Array): SparseSymmetricMatrix {
  const n = g.nx * g.ny;
  const colPtr = new Int32Array(n + 1);
  const cap = 9 * n;
  let rowIdx = new Int32Array(cap), re = new Float64Array(cap), im = new Float64Array(cap);
  const w = new Float64Array(18);
  const heldScale = 1 / (g.h * g.h);
  let e = 0;
  for (let j = 0; j < g.ny; j++) {
    for (let i = 0; i < g.nx; i++) {
      const id = i + g.nx * j;
      colPtr[id] = e;
      if (held && held[id]) { rowIdx[e] = id; re[e] = heldScale; im[e] = 0; e++; continue; }
      nodeStencil(g, c, stretch, k0, i, j, w);
      for (let dj = -1; dj <= 1; dj++) {
        const nj = j + dj;
        if (nj < 0 || nj >= g.ny) continue;
        for (let di = -1; di <= 1; di++) {
          const ni = i + di;
          if (ni < 0 || ni >= g.nx) continue;
          const s = 2 * ((di + 1) + 3 * (dj + 1));
          const wr = w[s], wi = w[s + 1];
          const nid = ni + g.nx * nj;
          if (nid !== id && wr === 0 && wi === 0) continue;
          if (held && held[nid]) {
            // known value: move to the right-hand side
            fRe[id] -= wr * fRe[nid] - wi * fIm[nid];
            fIm[id] -= wr * fIm[nid] + wi * fRe[nid];
            continue;
          }
          // row id of the symmetric matrix = column id
          rowIdx[e] = nid; re[e] = wr; im[e] = wi; e++;
        }
      }
    }
  }
  // a held row reads heldScale·u = heldScale·f: the same size as the stencil's rows (1/h²), so the
  // solver's relative pivot test does not mistake it for a zero pivot on fine (optical) grids
  if (held) for (let id = 0; id < n; id++) if (held[id]) { fRe[id] *= heldScale; fIm[id] *= heldScale; }
  colPtr[n] = e;
  if (e < cap) { rowIdx = rowIdx.slice(0, e); re = re.slice(0, e); im = im.slice(0, e); }
  return { n, colPtr, rowIdx, re, im };
}
