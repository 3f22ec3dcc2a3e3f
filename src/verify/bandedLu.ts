/**
 * Complex banded matrices and their LU factorization without pivoting, in place.
 *
 * Storage: row-major band, row r holds columns r − w … r + w at offsets 0 … 2w (w = half-bandwidth),
 * real and imaginary parts in separate Float64Arrays. LU without pivoting keeps the band (fill-in
 * stays inside it; Golub & Van Loan, "Matrix Computations", 4th ed., 2013, §4.3, Algorithm 4.3.1),
 * so the cost is about n·w² complex multiply-adds and the memory 16·n·(2w+1) bytes. Without
 * pivoting a zero or tiny pivot is possible for indefinite matrices; the factorization reports it
 * (`ok: false`) instead of dividing by it, and callers check the residual of the solution.
 */

export interface BandMatrix {
  n: number;
  /** half-bandwidth w: entries (r, c) with |r − c| ≤ w are stored */
  w: number;
  re: Float64Array;
  im: Float64Array;
}

/** Bytes needed for an n × n band matrix of half-bandwidth w. */
export const bandBytes = (n: number, w: number): number => 16 * n * (2 * w + 1);

/** A zero band matrix. */
export function newBandMatrix(n: number, w: number): BandMatrix {
  const len = n * (2 * w + 1);
  return { n, w, re: new Float64Array(len), im: new Float64Array(len) };
}

/** Offset of entry (r, c) (caller guarantees |r − c| ≤ w). */
export const bandIndex = (m: BandMatrix, r: number, c: number): number => r * (2 * m.w + 1) + (c - r + m.w);

/** Add (re, im) to entry (r, c). Throws RangeError outside the band. */
export function bandAdd(m: BandMatrix, r: number, c: number, re: number, im: number): void {
  if (Math.abs(r - c) > m.w || r < 0 || c < 0 || r >= m.n || c >= m.n) throw new RangeError(`bandAdd: (${r}, ${c}) outside the band (n ${m.n}, w ${m.w})`);
  const k = bandIndex(m, r, c);
  m.re[k] += re;
  m.im[k] += im;
}

export interface LuResult {
  ok: boolean;
  /** first row whose pivot was tiny (−1 when ok) */
  badRow: number;
  /** smallest |pivot| / largest |diagonal entry| seen */
  pivotRatio: number;
}

/**
 * Factor m = L U in place (L unit lower, stored below the diagonal; U on and above). Stops at the
 * first pivot smaller than 1e-14 × the largest diagonal magnitude. `onProgress(fraction)` is called
 * about a hundred times.
 */
export function factorBanded(m: BandMatrix, onProgress?: (fraction: number) => void): LuResult {
  const { n, w, re, im } = m;
  const stride = 2 * w + 1;
  let dMax = 0;
  for (let r = 0; r < n; r++) dMax = Math.max(dMax, Math.hypot(re[r * stride + w], im[r * stride + w]));
  const tiny = 1e-14 * (dMax || 1);
  let pMin = Infinity;
  const step = Math.max(1, Math.floor(n / 100));
  for (let k = 0; k < n; k++) {
    if (onProgress && k % step === 0) onProgress(k / n);
    const kd = k * stride + w;
    const pr = re[kd], pi = im[kd];
    const pa = Math.hypot(pr, pi);
    if (pa < pMin) pMin = pa;
    if (!(pa > tiny)) return { ok: false, badRow: k, pivotRatio: pa / (dMax || 1) };
    const p2 = pr * pr + pi * pi;
    const ipr = pr / p2, ipi = -pi / p2;
    const last = Math.min(n - 1, k + w);
    const kRow = k * stride - k + w; // + c gives the offset of (k, c)
    for (let r = k + 1; r <= last; r++) {
      const rRow = r * stride - r + w;
      const e = rRow + k;
      const ar = re[e], ai = im[e];
      if (ar === 0 && ai === 0) continue;
      const lr = ar * ipr - ai * ipi, li = ar * ipi + ai * ipr;
      re[e] = lr; im[e] = li;
      // row r −= l · row k over columns k+1 … last (contiguous in both rows)
      const end = kRow + last + 1;
      for (let kk = kRow + k + 1, o = rRow + k + 1; kk < end; kk++, o++) {
        const ur = re[kk], ui = im[kk];
        re[o] -= lr * ur - li * ui;
        im[o] -= lr * ui + li * ur;
      }
    }
  }
  onProgress?.(1);
  return { ok: true, badRow: -1, pivotRatio: pMin / (dMax || 1) };
}

/** Solve (L U) x = b in place (b becomes x) with a matrix factored by factorBanded. */
export function solveFactored(m: BandMatrix, bRe: Float64Array, bIm: Float64Array): void {
  const { n, w, re, im } = m;
  const stride = 2 * w + 1;
  for (let r = 0; r < n; r++) {
    const row = r * stride - r + w;
    let sr = bRe[r], si = bIm[r];
    for (let c = Math.max(0, r - w); c < r; c++) {
      const lr = re[row + c], li = im[row + c];
      sr -= lr * bRe[c] - li * bIm[c];
      si -= lr * bIm[c] + li * bRe[c];
    }
    bRe[r] = sr; bIm[r] = si;
  }
  for (let r = n - 1; r >= 0; r--) {
    const row = r * stride - r + w;
    let sr = bRe[r], si = bIm[r];
    const last = Math.min(n - 1, r + w);
    for (let c = r + 1; c <= last; c++) {
      const ur = re[row + c], ui = im[row + c];
      sr -= ur * bRe[c] - ui * bIm[c];
      si -= ur * bIm[c] + ui * bRe[c];
    }
    const dr = re[row + r], di = im[row + r];
    const d2 = dr * dr + di * di;
    bRe[r] = (sr * dr + si * di) / d2;
    bIm[r] = (si * dr - sr * di) / d2;
  }
}

/** y = m x for an unfactored band matrix (for residuals). */
export function bandMultiply(m: BandMatrix, xRe: Float64Array, xIm: Float64Array, yRe: Float64Array, yIm: Float64Array): void {
  const { n, w, re, im } = m;
  const stride = 2 * w + 1;
  for (let r = 0; r < n; r++) {
    const row = r * stride - r + w;
    let sr = 0, si = 0;
    const last = Math.min(n - 1, r + w);
    for (let c = Math.max(0, r - w); c <= last; c++) {
      const ar = re[row + c], ai = im[row + c];
      sr += ar * xRe[c] - ai * xIm[c];
      si += ar * xIm[c] + ai * xRe[c];
    }
    yRe[r] = sr; yIm[r] = si;
  }
}
