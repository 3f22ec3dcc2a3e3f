/**
 * A number's compact decimal text (`fmt` in csvText.ts: `toPrecision(digits)` with trailing zeros
 * and the exponent's "+" dropped) written straight into a byte buffer, for the build list's
 * per-cell columns. `toPrecision` makes a string per call and `fmt` trims it into another; at
 * 3 × 10⁶ numbers a build list spent a quarter of the plan there.
 *
 * Method: with e = ⌊log10 |x|⌋ (from the binary exponent and one comparison with the double
 * nearest 10^(e+1), then corrected by one if that double lay on the wrong side of the power of
 * ten), s = |x|·10^(digits−1−e) is one correctly rounded product or quotient by an exact power of
 * ten (|exponent| ≤ 22), so s is within half an ulp (< 1.2e-10 for digits ≤ 6) of the exact
 * scaled value; rounding s to the nearest integer then gives toPrecision's digits unless s lies
 * within 1e-9 of a half-integer, where the exact value could round the other way. Those (and
 * values outside 1e-15 … 1e20, digits > 6) return -1 and the caller falls back to `fmt`, so
 * the bytes are always toPrecision's. `writeFmt` is the whole column formatter: zero,
 * non-finite values and the fallback included. The steps whose outcome varies from number to
 * number (the exponent's last step, rounding up or down) are arithmetic, not branches that the
 * processor guesses wrong about every other number (measured alone: about 10 ns a number less,
 * against 25–30 ns in all). The tests sweep random and edge values against
 * `fmt`.
 */
import { fmt } from "./csvText.js";

/**
 * Bytes a number's text may take and its writing may touch from where it starts: the longest text
 * ("-1.23457e-100", 13) and the words written past it (a number of 0.000ddd form writes up to 16).
 */
export const NUMBER_ROOM = 24;

/** Exact powers of ten 10⁰ … 10²². */
const POW10 = new Float64Array(23);
for (let k = 0, v = 1; k < 23; k++, v *= 10) POW10[k] = v;

/** Half-integer guard on the scaled value: ≫ its rounding error (≤ 1.2e-10 for s < 2²⁰). */
const HALF_GUARD = 1e-9;

/** The double nearest 10^k at NEAR_POW10[k + NEAR_OFFSET], k = −17 … 21. */
const NEAR_OFFSET = 17;
const NEAR_POW10 = new Float64Array(39);
for (let k = -NEAR_OFFSET; k <= 21; k++) NEAR_POW10[k + NEAR_OFFSET] = Number(`1e${k}`);

/** log10 2 × 2¹²: (b·1233) >> 12 is ⌊b·log10 2⌋ for every binary exponent b of 1e-15 … 1e20 (tested). */
export const LOG10_2_Q12 = 1233;

/** A double's bits: its high 32-bit word holds the sign, the biased exponent and 20 mantissa bits. */
const BITS_F64 = new Float64Array(1);
const BITS_U32 = new Uint32Array(BITS_F64.buffer);
const HIGH_WORD = new Uint8Array(new Uint16Array([1]).buffer)[0] === 1 ? 1 : 0;

const ZERO = 48, DOT = 46, MINUS = 45, LOWER_E = 101;

/** 0 … 999 as three ASCII digits (leading zeros included) in a little-endian word's low bytes. */
const DIGITS3 = new Int32Array(1000);
/** Trailing zeros of 0 … 999 written with three digits (3 for 0). */
const TRAILING_ZEROS = new Uint8Array(1000);
for (let v = 0; v < 1000; v++) {
  const h = (v / 100) | 0, t = ((v / 10) | 0) % 10, u = v % 10;
  DIGITS3[v] = (ZERO + h) | ((ZERO + t) << 8) | ((ZERO + u) << 16);
  TRAILING_ZEROS[v] = v === 0 ? 3 : v % 100 === 0 ? 2 : v % 10 === 0 ? 1 : 0;
}

/** The bytes "0.000000" as one 8-byte word read little-endian (a double whose bits they are; not a NaN), written back the same way. */
const ZERO_POINT_ZEROS = new DataView(new Uint8Array([ZERO, DOT, ZERO, ZERO, ZERO, ZERO, ZERO, ZERO]).buffer).getFloat64(0, true);

/**
 * Write `fmt(x, digits)` for a finite, non-zero `x` into `buf` at `at` (`view` over the same bytes;
 * room for `NUMBER_ROOM` bytes needed: bytes past the text, up to that room, may be written too);
 * returns the position after it, or -1 (nothing written) when the fast path cannot promise
 * toPrecision's digits and the caller must format with `fmt`.
 */
export function writeDecimal(buf: Uint8Array, view: DataView, at: number, x: number, digits: number): number {
  return formatNumber(buf, view, at, x, digits, true);
}

/**
 * Write exactly `fmt(x, digits)` (csvText.ts) into `buf` at `at` (`view` over the same bytes; room
 * for `NUMBER_ROOM` bytes needed, which the writing may use past the text) and return the position
 * after it: "0" for ±0, nothing for NaN and ±Infinity (an empty CSV cell),
 * the fast path where it can promise the bytes, `fmt`'s own text otherwise.
 */
export function writeFmt(buf: Uint8Array, view: DataView, at: number, x: number, digits: number): number {
  return formatNumber(buf, view, at, x, digits, false);
}

/** `fmt`'s text at `at`; returns the position after it. */
function writeFallback(buf: Uint8Array, at: number, x: number, digits: number): number {
  const t = fmt(x, digits);
  for (let k = 0; k < t.length; k++) buf[at++] = t.charCodeAt(k);
  return at;
}

/**
 * `writeFmt`, or with `decline` `writeDecimal`: one function holding the fast path, zero, non-finite
 * values and the fallback, large enough that the optimizing compiler calls it rather than copying
 * it into each caller — the build list's row loop has five number columns, and five inlined copies
 * (with `fmt`'s string code for the fallback) made it slow to compile and slower to run.
 */
function formatNumber(buf: Uint8Array, view: DataView, at: number, x: number, digits: number, decline: boolean): number {
  if (x === 0) { buf[at] = ZERO; return at + 1; }
  if (!Number.isFinite(x)) return decline ? -1 : at;
  if (digits > 6 || digits < 1) return decline ? -1 : writeFallback(buf, at, x, digits);
  const neg = x < 0;
  const a = neg ? -x : x;
  if (!(a >= 1e-15 && a < 1e20)) return decline ? -1 : writeFallback(buf, at, x, digits);
  // decimal exponent from the binary one: a ∈ [2^b, 2^(b+1)) puts ⌊log10 a⌋ at ⌊b·log10 2⌋ or one
  // above, told by one comparison with the double nearest that power of ten (no loop, no branch)
  BITS_F64[0] = a;
  const b = (BITS_U32[HIGH_WORD] >>> 20) - 1023;
  let e = (b * LOG10_2_Q12) >> 12;
  e += +(a >= NEAR_POW10[e + 1 + NEAR_OFFSET]);
  let k = digits - 1 - e;
  let s = k >= 0 ? a * POW10[k] : a / POW10[-k];
  // the double nearest 10^e may lie on either side of it: one correction either way
  if (s < POW10[digits - 1]) {
    e--; k++;
    s = k >= 0 ? a * POW10[k] : a / POW10[-k];
  } else if (s >= POW10[digits]) {
    e++; k--;
    s = k >= 0 ? a * POW10[k] : a / POW10[-k];
  }
  // round half up by flooring s + 1/2 (exact: s < 2²⁰); a fraction of s within the guard of 1/2
  // leaves t within the guard of an integer, where the exact value could round the other way
  const shifted = s + 0.5;
  const rounded = Math.floor(shifted);
  const above = shifted - rounded;
  if (above < HALF_GUARD || above > 1 - HALF_GUARD) return decline ? -1 : writeFallback(buf, at, x, digits);
  // below 10⁶ + 1: small integers from here on (integer division and remainder, no fmod)
  let n = rounded | 0;
  if (n >= POW10[digits]) { n = POW10[digits - 1] | 0; e++; }
  // n's digits (`digits` wide, leading zeros included) in two groups, the last three and the rest,
  // each written as one 4-byte word from a table; nd: the digits left once trailing zeros are dropped
  const high = digits > 3 ? (n / 1000) | 0 : 0;
  const low = n - high * 1000;
  const nd = digits - (low === 0 ? 3 + TRAILING_ZEROS[high] : TRAILING_ZEROS[low]);
  if (neg) buf[at++] = MINUS;
  if (e < -6 || e >= digits) {
    // exponential, as toPrecision: d[.ddd]e±x (fmt drops the "+"): the digits one place on, the
    // first moved back before the point
    putDigits(view, at + 1, high, low, digits);
    buf[at] = buf[at + 1];
    if (nd > 1) { buf[at + 1] = DOT; at += nd + 1; } else at += 1;
    buf[at++] = LOWER_E;
    let ex = e;
    if (ex < 0) { buf[at++] = MINUS; ex = -ex; }
    if (ex >= 10) { const t = (ex / 10) | 0; buf[at++] = ZERO + t; ex -= 10 * t; }
    buf[at++] = ZERO + ex;
    return at;
  }
  if (e >= 0) {
    // the integer part is the first e + 1 digits (zeros included); a fraction, if any, after a point:
    // the digits one place on, the integer part moved back before the point
    if (nd <= e + 1) {
      putDigits(view, at, high, low, digits);
      return at + e + 1;
    }
    putDigits(view, at + 1, high, low, digits);
    for (let d = 0; d <= e; d++) buf[at + d] = buf[at + d + 1];
    buf[at + e + 1] = DOT;
    return at + nd + 1;
  }
  // 0.000ddd: "0.000000" as one word, the digits over its zeros from the place −e − 1 zeros on
  view.setFloat64(at, ZERO_POINT_ZEROS, true);
  at += 1 - e;
  putDigits(view, at, high, low, digits);
  return at + nd;
}

/** `digits` digits (1 … 6), the last three `low`, the rest `high`, at `at` (up to 4 bytes more written past them). */
function putDigits(view: DataView, at: number, high: number, low: number, digits: number): void {
  if (digits > 3) {
    view.setInt32(at, DIGITS3[high] >>> (8 * (6 - digits)), true);
    view.setInt32(at + digits - 3, DIGITS3[low], true);
  } else {
    view.setInt32(at, DIGITS3[low] >>> (8 * (3 - digits)), true);
  }
}

/**
 * Values that take every branch of `writeFmt` (zero, non-finite, exponential both ways, integer
 * with dropped zeros, fraction, 0.000ddd, negative, rounding up to the next power of ten, the
 * half-way and out-of-range fallbacks), at 4 and 6 digits.
 */
export const EVERY_BRANCH: readonly number[] = [0, NaN, 1.5e-12, -1.5e-7, 1234567, 1200, 12.5, 0.00123, -2.5, 9.9999999, 1.0000005, 1e25];

/**
 * Format `EVERY_BRANCH` into `scratch` (room for `NUMBER_ROOM` bytes needed). Called before a long run of
 * `writeFmt` calls so that every branch has run before the optimizing compiler compiles it: a
 * branch first taken afterwards throws the compiled code away (a rare exponent in the middle of
 * a build list cost a recompilation and interpreted calls meanwhile). About 0.2 ms. Returns a
 * position written.
 */
export function runEveryBranch(scratch: Uint8Array): number {
  const view = new DataView(scratch.buffer, scratch.byteOffset, scratch.byteLength);
  let at = 0;
  // several rounds: a function records type feedback only after its first few calls
  for (let round = 0; round < ROUNDS; round++) {
    for (const digits of [4, 6]) for (const x of EVERY_BRANCH) at = writeFmt(scratch, view, 0, x, digits);
  }
  return at;
}

const ROUNDS = 8;
