/**
 * `fmt(x, digits)` (csvText.ts) written straight into a byte buffer, without making a string:
 * the build list formats millions of numbers, and `toPrecision` plus trimming per value was the
 * writer's largest cost.
 *
 * Same bytes as `fmt`, always: the significant digits are n = round(|x|·10^k) with k = digits − 1
 * − e, computed in one correctly rounded multiplication or division by an exact power of ten
 * (10^0 … 10^22), so y = |x|·10^k carries an absolute error below 10^digits · 2^−53 ≈ 1.1·10^−10
 * (digits ≤ 6). Where that error could change the result — y within 10^−8 of a rounding tie
 * (toPrecision rounds the exact value, ties away from zero) or of the ends of [10^(digits−1),
 * 10^digits) — and for exponents beyond the exact powers, the value goes through `fmt` itself.
 * Layout as `fmt`: fixed notation for 10^−6 ≤ |x| < 10^digits (after rounding), else mantissa "e" exponent (no "+"),
 * trailing zeros dropped; NaN and ±Infinity write nothing (an empty CSV cell); 0 writes "0".
 */
import { fmt } from "./csvText.js";

const POW10: number[] = [];
for (let k = 0, p = 1; k <= 22; k++, p *= 10) POW10.push(p);

/** Margin around ties and range ends within which the fast path defers to `fmt`. */
const MARGIN = 1e-8;

/** Scratch for the significant digits (most significant first). */
const DIGITS = new Uint8Array(24);

/**
 * Write fmt(x, digits) as ASCII into buf at `at` (room for 32 bytes needed); returns the new end.
 * `digits` from 1 to 15 (the fast path serves 1 to 6; more defer to `fmt`).
 */
export function writeNumber(buf: Uint8Array, at: number, x: number, digits: number): number {
  if (!(x - x === 0)) return at; // NaN, ±Infinity: empty
  if (x === 0) { buf[at] = 48; return at + 1; }
  const a = x < 0 ? -x : x;
  let e = Math.floor(Math.log10(a));
  let k = digits - 1 - e;
  if (digits > 6 || k > 22 || k < -22) return writeText(buf, at, fmt(x, digits));
  let y = k >= 0 ? a * POW10[k] : a / POW10[-k];
  const lo = POW10[digits - 1], hi = POW10[digits];
  // log10 may be one off near powers of ten: move e until y is in [10^(d−1), 10^d)
  if (y < lo) { e--; k++; if (k > 22) return writeText(buf, at, fmt(x, digits)); y = k >= 0 ? a * POW10[k] : a / POW10[-k]; }
  else if (y >= hi) { e++; k--; if (k < -22) return writeText(buf, at, fmt(x, digits)); y = k >= 0 ? a * POW10[k] : a / POW10[-k]; }
  if (y < lo + MARGIN || y > hi - MARGIN) return writeText(buf, at, fmt(x, digits));
  let n = Math.floor(y);
  const frac = y - n;
  if (Math.abs(frac - 0.5) < MARGIN) return writeText(buf, at, fmt(x, digits));
  if (frac > 0.5) n++;
  if (n === hi) { n = lo; e++; }
  // the digits of n, most significant first
  for (let d = digits - 1; d >= 0; d--) { const q = Math.floor(n / 10); DIGITS[d] = n - 10 * q; n = q; }
  let last = digits - 1; // last non-zero digit (trailing zeros are dropped)
  while (last > 0 && DIGITS[last] === 0) last--;
  if (x < 0) buf[at++] = 45;
  if (e < -6 || e >= digits) {
    // exponential: d[.ddd]e[-]x
    buf[at++] = 48 + DIGITS[0];
    if (last > 0) { buf[at++] = 46; for (let d = 1; d <= last; d++) buf[at++] = 48 + DIGITS[d]; }
    buf[at++] = 101;
    let ex = e;
    if (ex < 0) { buf[at++] = 45; ex = -ex; }
    if (ex >= 100) { buf[at++] = 48 + Math.floor(ex / 100); ex %= 100; buf[at++] = 48 + Math.floor(ex / 10); buf[at++] = 48 + (ex % 10); }
    else if (ex >= 10) { buf[at++] = 48 + Math.floor(ex / 10); buf[at++] = 48 + (ex % 10); }
    else buf[at++] = 48 + ex;
    return at;
  }
  if (e >= 0) {
    // integer part: the first e + 1 digits; then the rest, trimmed
    for (let d = 0; d <= e; d++) buf[at++] = 48 + DIGITS[d];
    if (last > e) { buf[at++] = 46; for (let d = e + 1; d <= last; d++) buf[at++] = 48 + DIGITS[d]; }
    return at;
  }
  buf[at++] = 48; buf[at++] = 46;
  for (let z = -1; z > e; z--) buf[at++] = 48;
  for (let d = 0; d <= last; d++) buf[at++] = 48 + DIGITS[d];
  return at;
}

function writeText(buf: Uint8Array, at: number, s: string): number {
  for (let k = 0; k < s.length; k++) buf[at++] = s.charCodeAt(k);
  return at;
}
