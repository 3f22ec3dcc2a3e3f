/**
 * A sparse complex symmetric matrix (A = Aᵀ, not Hermitian) in compressed-column form holding
 * both triangles: column v lists the rows u with A[u][v] ≠ 0 (structurally), values as separate
 * re and im arrays. With both triangles stored, column v is also row v, so the product A·x and the
 * residual run over columns without a transpose. Memory: 4·(n+1) + 20·nnz bytes.
 */
import { ProgrammerError } from "../core/errors.js";

export interface SparseSymmetricMatrix {
  n: number;
  /** column v's entries are at colPtr[v] … colPtr[v+1]−1 */
  colPtr: Int32Array;
  rowIdx: Int32Array;
  re: Float64Array;
  im: Float64Array;
}

/** out = A·x (complex). Kernel: no checks; out must not alias x. Returns out. */
export function multiplySymmetric(a: SparseSymmetricMatrix, xRe: Float64Array, xIm: Float64Array, outRe: Float64Array, outIm: Float64Array): Float64Array[] {
  const { n, colPtr, rowIdx, re, im } = a;
  for (let v = 0; v < n; v++) {
    let sr = 0, si = 0;
    for (let e = colPtr[v]; e < colPtr[v + 1]; e++) {
      const u = rowIdx[e], ar = re[e], ai = im[e], xr = xRe[u], xi = xIm[u];
      sr += ar * xr - ai * xi;
      si += ar * xi + ai * xr;
    }
    outRe[v] = sr; outIm[v] = si; // row v of A = column v (symmetric)
  }
  return [outRe, outIm];
}

/** Largest |A[v][v]| (0 for a matrix without diagonal entries). */
export function largestDiagonal(a: SparseSymmetricMatrix): number {
  let m = 0;
  for (let v = 0; v < a.n; v++) {
    for (let e = a.colPtr[v]; e < a.colPtr[v + 1]; e++) if (a.rowIdx[e] === v) m = Math.max(m, Math.hypot(a.re[e], a.im[e]));
  }
  return m;
}

/**
 * Throw ProgrammerError unless `a` is a well-formed n × n matrix: pointer and index ranges,
 * finite values, and A[u][v] = A[v][u] exactly (looked up by a scan of the partner column).
 */
export function checkSymmetricMatrix(a: SparseSymmetricMatrix, where = "sparse matrix"): void {
  const { n, colPtr, rowIdx, re, im } = a;
  if (!(Number.isInteger(n) && n >= 0) || colPtr.length !== n + 1 || colPtr[0] !== 0) throw new ProgrammerError(`${where}: expected colPtr of length n + 1 = ${n + 1} starting at 0`);
  const nnz = colPtr[n];
  if (rowIdx.length < nnz || re.length < nnz || im.length < nnz) throw new ProgrammerError(`${where}: expected ${nnz} entries in rowIdx, re and im`);
  for (let v = 0; v < n; v++) {
    if (colPtr[v + 1] < colPtr[v]) throw new ProgrammerError(`${where}: colPtr decreases at column ${v}`);
    for (let e = colPtr[v]; e < colPtr[v + 1]; e++) {
      const u = rowIdx[e];
      if (!(u >= 0 && u < n)) throw new ProgrammerError(`${where}: row index ${u} out of range in column ${v}`);
      if (!Number.isFinite(re[e]) || !Number.isFinite(im[e])) throw new ProgrammerError(`${where}: entry (${u}, ${v}) is not finite`);
      if (u === v) continue;
      let found = false;
      for (let q = colPtr[u]; q < colPtr[u + 1]; q++) {
        if (rowIdx[q] === v) { found = re[q] === re[e] && im[q] === im[e]; break; }
      }
      if (!found) throw new ProgrammerError(`${where}: entry (${u}, ${v}) differs from (${v}, ${u}) or has no partner (the matrix must be symmetric)`);
    }
  }
}
