/**
 * The frequencies of a sweep: `count` equally spaced values from startHz to stopHz, both included
 * (one frequency when count is 1, then start and stop are equal), and the text that tells them
 * apart. Pure; the shell parses the text.
 */
import { formatFrequency, formatFrequencyPrecise, significant } from "../../core/formatQuantity.js";

/** Largest number of frequencies one sweep solves (each is a full check on its own ladder). */
export const MAX_SWEEP_POINTS = 401;

/** Equally spaced frequencies; throws RangeError for a bad range or count (the shell validates first). */
export function sweepFrequencies(startHz: number, stopHz: number, count: number): number[] {
  if (!Number.isInteger(count) || count < 1 || count > MAX_SWEEP_POINTS) throw new RangeError(`sweepFrequencies: expected 1 to ${MAX_SWEEP_POINTS} points, got ${count}`);
  if (!(startHz > 0) || !Number.isFinite(stopHz) || (count === 1 ? stopHz !== startHz : !(stopHz > startHz))) throw new RangeError("sweepFrequencies: expected 0 < start < stop (start = stop for one point)");
  if (count === 1) return [startHz];
  const out = new Array<number>(count);
  for (let k = 0; k < count; k++) out[k] = k === count - 1 ? stopHz : startHz + ((stopHz - startHz) * k) / (count - 1);
  return out;
}

/**
 * A frequency formatter for a sweep's texts: the fewest significant digits, from 3 to 12, with
 * which every frequency of the sweep reads within a twentieth of the smallest spacing of its
 * true value (3 digits print 193.5 and 193.75 THz as "194 THz"; 4 print 193.25 as "193.3");
 * 6 digits for a lone frequency.
 */
export function sweepFrequencyFormat(frequenciesHz: readonly number[]): (hz: number) => string {
  const fs = [...new Set(frequenciesHz.filter((f) => Number.isFinite(f) && f > 0))].sort((a, b) => a - b);
  const withDigits = (digits: number) => (hz: number): string => formatFrequency(hz, (v) => significant(v, digits));
  if (fs.length < 2) return formatFrequencyPrecise;
  let spacing = Infinity;
  for (let k = 1; k < fs.length; k++) spacing = Math.min(spacing, fs[k] - fs[k - 1]);
  for (let digits = 3; digits < 12; digits++) {
    // significant digits do not depend on the unit the text is scaled to
    const ok = fs.every((f) => {
      const shown = Number(f.toPrecision(digits));
      return Math.abs(shown - f) <= spacing / 20;
    });
    if (ok) return withDigits(digits);
  }
  return withDigits(12);
}
