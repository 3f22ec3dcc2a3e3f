/**
 * Real symmetric positive-definite banded systems: Cholesky factorization A = L Lᵀ in band
 * storage, forward/back substitution, and the residual ‖A x − b‖ / ‖b‖ that every direct solve
 * reports as its evidence.
 *
 * Storage: the lower band of A row by row, `band[i*(w+1) + (j − i + w)]` = A[i][j] for
 * i − w ≤ j ≤ i (entries left of column 0 are unused and stay 0). The factor overwrites a copy.
 * Cost: n·w²/2 multiply-adds to factor, 2·n·w per solve; memory n·(w+1) doubles. A structured
 * 200 × 100 Laplace grid numbered along the short side (w ≈ 101) factors in about 10⁸ operations.
 *
 * Method: the column-oriented banded Cholesky of Golub & Van Loan, "Matrix Computations", 4th ed.
 * (2013), §4.3.5 (Algorithm 4.3.5, band Cholesky). Written here because no maintained npm package
 * offers a typed-array band Cholesky; the complex-symmetric LDLᵀ in src/verify serves another kind
 * of matrix.
 */

/** Result of a factorization: ok, or the first row whose pivot was not positive. */
export interface BandFactor {
  ok: boolean;
  /** why the factorization stopped (empty when ok) */
  reason: string;
  n: number;
  halfBandwidth: number;
  /** L in the same band storage as the input */
  factor: Float64Array;
}

/** Allocate an empty lower band for n unknowns with half-bandwidth w. */
export function allocBand(n: number, w: number): Float64Array {
  return new Float64Array(n * (w + 1));
}

/** Add `value` to A[i][j] (and so A[j][i]); requires |i − j| ≤ w. */
export function addToBand(band: Float64Array, w: number, i: number, j: number, value: number): void {
  if (j > i) { const t = i; i = j; j = t; }
  band[i * (w + 1) + (j - i + w)] += value;
}

/**
 * Factor the SPD band matrix (not modified). A non-positive or non-finite pivot is a non-answer:
 * `ok` is false and `reason` names the row.
 * Example: bandCholesky(2, 1, [0, 4, 2, 5]) → factor [0, 2, 1, 2] (A = [[4, 2], [2, 5]]).
 */
export function bandCholesky(n: number, w: number, band: ArrayLike<number>): BandFactor {
  const stride = w + 1;
  const L = new Float64Array(n * stride);
  for (let q = 0; q < L.length; q++) L[q] = band[q];
  for (let i = 0; i < n; i++) {
    const rowI = i * stride;
    const j0 = Math.max(0, i - w);
    for (let j = j0; j <= i; j++) {
      const rowJ = j * stride;
      const k0 = Math.max(j0, j - w);
      let s = L[rowI + (j - i + w)];
      // L[i][k] at rowI + k − i + w, L[j][k] at rowJ + k − j + w
      const oi = rowI - i + w, oj = rowJ - j + w;
      // four independent partial sums: the dot product is latency-bound otherwise
      let s1 = 0, s2 = 0, s3 = 0, k = k0;
      for (; k + 3 < j; k += 4) {
        s -= L[oi + k] * L[oj + k];
        s1 += L[oi + k + 1] * L[oj + k + 1];
        s2 += L[oi + k + 2] * L[oj + k + 2];
        s3 += L[oi + k + 3] * L[oj + k + 3];
      }
      for (; k < j; k++) s -= L[oi + k] * L[oj + k];
      s -= s1 + s2 + s3;
      if (j < i) {
        L[rowI + (j - i + w)] = s / L[rowJ + w];
      } else {
        if (!(s > 0) || !Number.isFinite(s)) {
          return { ok: false, reason: `pivot ${s} at row ${i}: matrix not positive definite`, n, halfBandwidth: w, factor: L };
        }
        L[rowI + w] = Math.sqrt(s);
      }
    }
  }
  return { ok: true, reason: "", n, halfBandwidth: w, factor: L };
}

/** Solve L Lᵀ x = b into `out` (may alias b). */
export function bandCholeskySolve(f: BandFactor, b: ArrayLike<number>, out: Float64Array): Float64Array {
  const { n, halfBandwidth: w, factor: L } = f;
  const stride = w + 1;
  for (let i = 0; i < n; i++) out[i] = b[i];
  for (let i = 0; i < n; i++) {
    const o = i * stride - i + w;
    let s = out[i];
    for (let k = Math.max(0, i - w); k < i; k++) s -= L[o + k] * out[k];
    out[i] = s / L[i * stride + w];
  }
  for (let i = n - 1; i >= 0; i--) {
    out[i] /= L[i * stride + w];
    const xi = out[i], o = i * stride - i + w;
    for (let k = Math.max(0, i - w); k < i; k++) out[k] -= L[o + k] * xi;
  }
  return out;
}

/** y = A x for the symmetric band matrix (lower band given). */
export function bandMultiply(n: number, w: number, band: ArrayLike<number>, x: ArrayLike<number>, y: Float64Array): Float64Array {
  const stride = w + 1;
  y.fill(0, 0, n);
  for (let i = 0; i < n; i++) {
    const o = i * stride - i + w;
    let s = band[i * stride + w] * x[i];
    const xi = x[i];
    for (let j = Math.max(0, i - w); j < i; j++) {
      const a = band[o + j];
      s += a * x[j];
      y[j] += a * xi;
    }
    y[i] += s;
  }
  return y;
}

/** Relative residual ‖A x − b‖₂ / ‖b‖₂ (absolute when b = 0). */
export function bandResidual(n: number, w: number, band: ArrayLike<number>, x: ArrayLike<number>, b: ArrayLike<number>): number {
  const y = bandMultiply(n, w, band, x, new Float64Array(n));
  let r = 0, nb = 0;
  for (let i = 0; i < n; i++) { r += (y[i] - b[i]) ** 2; nb += b[i] * b[i]; }
  return nb > 0 ? Math.sqrt(r / nb) : Math.sqrt(r);
}
