/**
 * The frequencies of a sweep: `count` equally spaced values from startHz to stopHz, both included
 * (one frequency when count is 1, then start and stop are equal). Pure; the shell parses the text.
 */

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
