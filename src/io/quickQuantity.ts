/**
 * The common quantity strings ("60 mm", "28 GHz", "90 deg", "1550 nm") read without mathjs, whose
 * load costs about 0.7 s of CPU (more on a busy machine) — most of a small plan's run. Only a plain
 * decimal number followed by one unit of a short table is taken; anything else (other units,
 * expressions, temperatures with an offset) returns undefined and goes to mathjs. The SI value is
 * computed as mathjs computes it (number × prefix × unit, where one of the two factors is 1), so
 * both paths give the same bits; a test compares them over many numbers.
 */
import type { Dimension } from "./quantity.js";

/** SI factor of each unit the fast path takes, by dimension. */
const UNITS: Partial<Record<Dimension, Record<string, number>>> = {
  length: { m: 1, km: 1e3, cm: 1e-2, mm: 1e-3, um: 1e-6, nm: 1e-9 },
  frequency: { Hz: 1, kHz: 1e3, MHz: 1e6, GHz: 1e9, THz: 1e12 },
  angle: { rad: 1, deg: Math.PI / 180 },
};

const PATTERN = /^([+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?)\s*([A-Za-z]+)$/;

/**
 * The SI value of `text` as `dimension` when it is a plain number and a unit of the table, else
 * undefined (also for a result that is not finite: mathjs then gives the message).
 * Example: quickQuantity("0.6 mm", "length") → 0.0006; quickQuantity("2 inch", "length") → undefined
 */
export function quickQuantity(text: string, dimension: Dimension): number | undefined {
  const table = UNITS[dimension];
  if (!table) return undefined;
  const m = PATTERN.exec(text);
  if (!m) return undefined;
  const factor = Object.prototype.hasOwnProperty.call(table, m[2]) ? table[m[2]] : undefined;
  if (factor === undefined) return undefined;
  const si = Number(m[1]) * factor;
  return Number.isFinite(si) ? si : undefined;
}
