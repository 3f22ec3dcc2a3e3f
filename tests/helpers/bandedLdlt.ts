/**
 * Test reference (the solver the sparse nested-dissection solve replaced; src/ no longer uses it):
 * complex symmetric banded matrices (A = Aᵀ, not Hermitian) and their factorization A = L D Lᵀ
 * without pivoting, in place: about n·w²/2 complex multiply-adds and 16·n·(w+1) bytes. (Golub & Van Loan, "Matrix Computations", 4th ed., 2013, §4.1.2 and §4.3.6:
 * LDLᵀ is Gaussian elimination that uses the symmetry; for complex symmetric matrices it applies
 * with the plain transpose.) A zero or tiny pivot is reported (`ok: false`), never divided by.
 *
 * Storage: lower band, row r holds columns r − w … r at offsets 0 … w, separate re and im arrays.
 * After factoring, offsets 0 … w−1 hold L (unit diagonal implied) and offset w holds D.
 */
export interface LuResult {
  ok: boolean;
  /** first row whose pivot was tiny (−1 when ok) */
  badRow: number;
  /** smallest |pivot| / largest |diagonal entry| seen */
  pivotRatio: number;
}

export interface SymBandMatrix {
  n: number;
  w: number;
  re: Float64Array;
  im: Float64Array;
}

/** Bytes needed for the lower band of an n × n matrix of half-bandwidth w. */
export const symBandBytes = (n: number, w: number): number => 16 * n * (w + 1);

export function newSymBandMatrix(n: number, w: number): SymBandMatrix {
  const len = n * (w + 1);
  return { n, w, re: new Float64Array(len), im: new Float64Array(len) };
}

/** Offset of entry (r, c), c ≤ r, r − c ≤ w. */
export const symIndex = (m: SymBandMatrix, r: number, c: number): number => r * (m.w + 1) + (c - r + m.w);

/** Factor in place (see file comment). `onProgress(fraction)` is called about a hundred times. */
export function factorSymBanded(m: SymBandMatrix, onProgress?: (fraction: number) => void): LuResult {
  const { n, w, re, im } = m;
  const stride = w + 1;
  let dMax = 0;
  for (let r = 0; r < n; r++) dMax = Math.max(dMax, Math.hypot(re[r * stride + w], im[r * stride + w]));
  const tiny = 1e-14 * (dMax || 1);
  let pMin = Infinity;
  const tRe = new Float64Array(w + 1), tIm = new Float64Array(w + 1); // column k below the diagonal
  const step = Math.max(1, Math.floor(n / 100));
  for (let k = 0; k < n; k++) {
    if (onProgress && k % step === 0) onProgress(k / n);
    const kd = k * stride + w;
    const dr = re[kd], di = im[kd];
    const da = Math.hypot(dr, di);
    if (da < pMin) pMin = da;
    if (!(da > tiny)) return { ok: false, badRow: k, pivotRatio: da / (dMax || 1) };
    const d2 = dr * dr + di * di;
    const idr = dr / d2, idi = -di / d2;
    const last = Math.min(n - 1, k + w);
    const cnt = last - k;
    let any = false;
    for (let q = 1; q <= cnt; q++) {
      const e = (k + q) * stride + (k - (k + q) + w);
      tRe[q] = re[e]; tIm[q] = im[e];
      if (tRe[q] !== 0 || tIm[q] !== 0) any = true;
    }
    if (!any) continue;
    for (let q = 1; q <= cnt; q++) {
      const ar = tRe[q], ai = tIm[q];
      if (ar === 0 && ai === 0) continue;
      const r = k + q;
      // l = a_rk / d; row r −= l · (column k entries a_ck) for c = k+1 … r
      const lr = ar * idr - ai * idi, li = ar * idi + ai * idr;
      const rowBase = r * stride - r + w; // + c
      let o = rowBase + k + 1;
      for (let p = 1; p <= q; p++, o++) {
        const ur = tRe[p], ui = tIm[p];
        re[o] -= lr * ur - li * ui;
        im[o] -= lr * ui + li * ur;
      }
      re[rowBase + k] = lr; im[rowBase + k] = li;
    }
  }
  onProgress?.(1);
  return { ok: true, badRow: -1, pivotRatio: pMin / (dMax || 1) };
}

/** Solve L D Lᵀ x = b in place (b becomes x). */
export function solveSymFactored(m: SymBandMatrix, bRe: Float64Array, bIm: Float64Array): void {
  const { n, w, re, im } = m;
  const stride = w + 1;
  // L y = b
  for (let r = 0; r < n; r++) {
    const base = r * stride - r + w;
    let sr = bRe[r], si = bIm[r];
    for (let c = Math.max(0, r - w); c < r; c++) {
      const lr = re[base + c], li = im[base + c];
      sr -= lr * bRe[c] - li * bIm[c];
      si -= lr * bIm[c] + li * bRe[c];
    }
    bRe[r] = sr; bIm[r] = si;
  }
  // D z = y
  for (let r = 0; r < n; r++) {
    const o = r * stride + w;
    const dr = re[o], di = im[o], d2 = dr * dr + di * di;
    const sr = bRe[r], si = bIm[r];
    bRe[r] = (sr * dr + si * di) / d2;
    bIm[r] = (si * dr - sr * di) / d2;
  }
  // Lᵀ x = z: x_c −= L_rc x_r for r > c, done column-wise from the bottom
  for (let r = n - 1; r >= 0; r--) {
    const base = r * stride - r + w;
    const xr = bRe[r], xi = bIm[r];
    for (let c = Math.max(0, r - w); c < r; c++) {
      const lr = re[base + c], li = im[base + c];
      bRe[c] -= lr * xr - li * xi;
      bIm[c] -= lr * xi + li * xr;
    }
  }
}
