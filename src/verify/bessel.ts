/**
 * Bessel functions of the first and second kind, integer order, real positive argument, for the
 * cylinder scattering series. Pure; no dependency.
 *
 * - J_n: Miller's backward recurrence J_{n-1} = (2n/x) J_n − J_{n+1}, started well above the
 *   largest order needed and normalized with J_0 + 2 Σ_k J_{2k} = 1 (Abramowitz & Stegun,
 *   "Handbook of Mathematical Functions", 1964, §9.12 example 1 and eq. 9.1.46).
 * - Y_0 and Y_1 from the Neumann series over the J_n just computed:
 *   Y_0 = (2/π)(ln(x/2) + γ) J_0 − (4/π) Σ_{k≥1} (−1)^k J_{2k}/k   (A&S 9.1.88),
 *   Y_1 = −Y_0' = (2/π)((ln(x/2) + γ) J_1 − J_0/x) + (2/π) Σ_{k≥1} (−1)^k (J_{2k−1} − J_{2k+1})/k
 *   (the derivative of 9.1.88 with J_n' = (J_{n−1} − J_{n+1})/2, A&S 9.1.27; J_0' = −J_1).
 * - Y_n for n ≥ 2 by forward recurrence Y_{n+1} = (2n/x) Y_n − Y_{n−1} (stable for Y; A&S 9.1.27).
 * Accurate to about 1e-12 relative for 0 < x ≤ 200 and orders up to a few hundred (checked against
 * A&S Table 9.1 in the tests). Throws RangeError for x ≤ 0 or non-finite x (the series needs x > 0).
 */

const EULER_GAMMA = 0.57721566490153286061;

/** Starting order of the backward recurrence for orders 0..nMax at argument x. */
function millerStart(nMax: number, x: number): number {
  const m = Math.max(nMax, Math.ceil(x)) + 30 + Math.ceil(Math.sqrt(40 * Math.max(nMax, x)));
  return m % 2 === 0 ? m : m + 1;
}

/**
 * J_0(x) … J_nMax(x) into `out` (length ≥ nMax + 1, allocated when omitted); returns `out`.
 * Example: besselJArray(1, 1) → [0.7651976866, 0.4400505857] (A&S Table 9.1).
 */
export function besselJArray(nMax: number, x: number, out?: Float64Array): Float64Array {
  if (!(x > 0) || !Number.isFinite(x)) throw new RangeError(`besselJArray: expected a finite x > 0, got ${x}`);
  const res = out ?? new Float64Array(nMax + 1);
  const m = millerStart(nMax + 2, x);
  let jp1 = 0; // J_{k+1}
  let jk = 1e-300; // J_k, arbitrary small seed
  let norm = 0;
  for (let k = m; k >= 1; k--) {
    const jm1 = ((2 * k) / x) * jk - jp1;
    jp1 = jk;
    jk = jm1;
    // rescale to avoid overflow
    if (Math.abs(jk) > 1e250) {
      jk *= 1e-250; jp1 *= 1e-250; norm *= 1e-250;
      for (let q = k - 1; q <= nMax && q >= 0; q++) res[q] *= 1e-250;
    }
    if (k - 1 <= nMax) res[k - 1] = jk;
    if ((k - 1) % 2 === 0 && k - 1 > 0) norm += 2 * jk;
  }
  norm += jk; // J_0 term
  for (let q = 0; q <= nMax; q++) res[q] /= norm;
  return res;
}

/**
 * J_0 … J_nMax and Y_0 … Y_nMax at x > 0, written into `j` and `y` (length ≥ nMax + 1).
 * Example: besselJY(1, 1, j, y) gives y = [0.0882569642, −0.7812128213] (A&S Table 9.1).
 */
export function besselJY(nMax: number, x: number, j: Float64Array, y: Float64Array): void {
  if (!(x > 0) || !Number.isFinite(x)) throw new RangeError(`besselJY: expected a finite x > 0, got ${x}`);
  // J up to the order the Neumann series needs (terms vanish once 2k ≫ x)
  const kMax = Math.ceil(x / 2) + 30 + Math.ceil(Math.sqrt(20 * x));
  const need = Math.max(nMax, 2 * kMax + 1);
  const jAll = besselJArray(need, x);
  for (let q = 0; q <= nMax; q++) j[q] = jAll[q];
  const lg = Math.log(x / 2) + EULER_GAMMA;
  let s0 = 0, s1 = 0;
  for (let k = 1; k <= kMax; k++) {
    const sign = k % 2 === 0 ? 1 : -1;
    s0 += (sign * jAll[2 * k]) / k;
    s1 += (sign * (jAll[2 * k - 1] - jAll[2 * k + 1])) / k;
  }
  const y0 = (2 / Math.PI) * lg * jAll[0] - (4 / Math.PI) * s0;
  y[0] = y0;
  if (nMax === 0) return;
  const y1 = (2 / Math.PI) * (lg * jAll[1] - jAll[0] / x) + (2 / Math.PI) * s1;
  y[1] = y1;
  for (let n = 1; n < nMax; n++) y[n + 1] = ((2 * n) / x) * y[n] - y[n - 1];
}

/** J_n(x) for one order (x > 0). */
export function besselJ(n: number, x: number): number {
  return besselJArray(n, x)[n];
}

/** Y_n(x) for one order (x > 0). */
export function besselY(n: number, x: number): number {
  const j = new Float64Array(n + 1), y = new Float64Array(n + 1);
  besselJY(n, x, j, y);
  return y[n];
}
