/**
 * A number's compact decimal text (`fmt` in csvText.ts: `toPrecision(digits)` with trailing zeros
 * and the exponent's "+" dropped) written straight into a byte buffer, for the build list's
 * per-cell columns. `toPrecision` makes a string per call and `fmt` trims it into another; at
 * 3 × 10⁶ numbers a build list spent a quarter of the plan there.
 *
 * Method: with e = ⌊log10 |x|⌋ (corrected by one when the logarithm rounds across a power of
 * ten), s = |x|·10^(digits−1−e) is one correctly rounded product or quotient by an exact power of
 * ten (|exponent| ≤ 22), so s is within half an ulp (< 1.2e-10 for digits ≤ 6) of the exact
 * scaled value; rounding s to the nearest integer then gives toPrecision's digits unless s lies
 * within 1e-9 of a half-integer, where the exact value could round the other way. Those (and
 * values outside 1e-15 … 1e20, digits > 6) return -1 and the caller falls back to `fmt`, so
 * the bytes are always toPrecision's. `writeFmt` is the whole column formatter: zero,
 * non-finite values and the fallback included. The tests sweep random and edge values against
 * `fmt`.
 */
import { fmt } from "./csvText.js";

/** Exact powers of ten 10⁰ … 10²². */
const POW10 = new Float64Array(23);
for (let k = 0, v = 1; k < 23; k++, v *= 10) POW10[k] = v;

/** Half-integer guard on the scaled value: ≫ its rounding error (≤ 1.2e-10 for s < 2²⁰). */
const HALF_GUARD = 1e-9;

const ZERO = 48, DOT = 46, MINUS = 45, LOWER_E = 101;

/**
 * Write `fmt(x, digits)` for a finite, non-zero `x` into `buf` at `at` (room for 24 bytes needed);
 * returns the position after it, or -1 (nothing written) when the fast path cannot promise
 * toPrecision's digits and the caller must format with `fmt`.
 */
export function writeDecimal(buf: Uint8Array, at: number, x: number, digits: number): number {
  if (digits > 6 || digits < 1) return -1;
  const neg = x < 0;
  const a = neg ? -x : x;
  if (!(a >= 1e-15 && a < 1e20)) return -1;
  // decimal exponent by comparison with exact powers (cheaper than a logarithm at these sizes)
  let e = 0;
  if (a >= 1) { while (a >= POW10[e + 1]) e++; }
  else { e = -1; while (a * POW10[-e] < 1) e--; }
  let k = digits - 1 - e;
  let s = k >= 0 ? a * POW10[k] : a / POW10[-k];
  if (s < POW10[digits - 1]) {
    e--; k++;
    s = k >= 0 ? a * POW10[k] : a / POW10[-k];
  } else if (s >= POW10[digits]) {
    e++; k--;
    s = k >= 0 ? a * POW10[k] : a / POW10[-k];
  }
  const whole = Math.floor(s);
  const frac = s - whole;
  if (Math.abs(frac - 0.5) < HALF_GUARD) return -1;
  // below 10⁶ + 1: small integers from here on (integer division and remainder, no fmod)
  let n = whole | 0;
  if (frac > 0.5) n++;
  if (n >= POW10[digits]) { n = POW10[digits - 1] | 0; e++; }
  // mantissa digits without trailing zeros; digit d (most significant first) lands at pos(d)
  let nd = digits;
  while (nd > 1 && n % 10 === 0) { n = (n / 10) | 0; nd--; }
  if (neg) buf[at++] = MINUS;
  if (e < -6 || e >= digits) {
    // exponential, as toPrecision: d[.ddd]e±x (fmt drops the "+")
    for (let d = nd - 1; d >= 0; d--) {
      const q = (n / 10) | 0;
      buf[d === 0 ? at : at + 1 + d] = ZERO + (n - q * 10);
      n = q;
    }
    if (nd > 1) buf[at + 1] = DOT;
    at += nd > 1 ? nd + 1 : 1;
    buf[at++] = LOWER_E;
    let ex = e;
    if (ex < 0) { buf[at++] = MINUS; ex = -ex; }
    if (ex >= 10) { const t = (ex / 10) | 0; buf[at++] = ZERO + t; ex -= 10 * t; }
    buf[at++] = ZERO + ex;
    return at;
  }
  if (e >= 0) {
    // integer part (zeros where trailing zeros were dropped), then the fraction if any
    for (let d = nd - 1; d >= 0; d--) {
      const q = (n / 10) | 0;
      buf[d <= e ? at + d : at + d + 1] = ZERO + (n - q * 10);
      n = q;
    }
    for (let d = nd; d <= e; d++) buf[at + d] = ZERO;
    if (nd > e + 1) {
      buf[at + e + 1] = DOT;
      return at + nd + 1;
    }
    return at + e + 1;
  }
  // 0.000ddd
  buf[at++] = ZERO;
  buf[at++] = DOT;
  for (let z = -1; z > e; z--) buf[at++] = ZERO;
  for (let d = nd - 1; d >= 0; d--) {
    const q = (n / 10) | 0;
    buf[at + d] = ZERO + (n - q * 10);
    n = q;
  }
  return at + nd;
}

/**
 * Write exactly `fmt(x, digits)` (csvText.ts) into `buf` at `at` (room for 24 bytes needed) and
 * return the position after it: "0" for ±0, nothing for NaN and ±Infinity (an empty CSV cell),
 * `writeDecimal` where it can promise the bytes, `fmt`'s own text otherwise.
 */
export function writeFmt(buf: Uint8Array, at: number, x: number, digits: number): number {
  if (x === 0) { buf[at] = ZERO; return at + 1; }
  if (!Number.isFinite(x)) return at;
  const end = writeDecimal(buf, at, x, digits);
  if (end >= 0) return end;
  const t = fmt(x, digits);
  for (let k = 0; k < t.length; k++) buf[at++] = t.charCodeAt(k);
  return at;
}

/**
 * Values that take every branch of `writeFmt` (zero, non-finite, exponential both ways, integer
 * with dropped zeros, fraction, 0.000ddd, negative, rounding up to the next power of ten, the
 * half-way and out-of-range fallbacks), at 4 and 6 digits.
 */
export const EVERY_BRANCH: readonly number[] = [0, NaN, 1.5e-12, -1.5e-7, 1234567, 1200, 12.5, 0.00123, -2.5, 9.9999999, 1.0000005, 1e25];

/**
 * Format `EVERY_BRANCH` into `scratch` (room for 24 bytes needed). Called before a long run of
 * `writeFmt` calls so that every branch has run before the optimizing compiler compiles it: a
 * branch first taken afterwards throws the compiled code away (a rare exponent in the middle of
 * a build list cost a recompilation and interpreted calls meanwhile). About 0.2 ms. Returns a
 * position written.
 */
export function runEveryBranch(scratch: Uint8Array): number {
  let at = 0;
  // several rounds: a function records type feedback only after its first few calls
  for (let round = 0; round < ROUNDS; round++) {
    for (const digits of [4, 6]) for (const x of EVERY_BRANCH) at = writeFmt(scratch, 0, x, digits);
  }
  return at;
}

const ROUNDS = 8;
