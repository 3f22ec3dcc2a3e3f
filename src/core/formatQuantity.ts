/**
 * Lengths and frequencies for people: the most readable unit (m, mm, µm, nm, pm; Hz … THz) and a
 * short number. One implementation for the whole tool; callers choose how the number is written
 * (significant digits, or the session's aligned style). Non-finite values (no answer) print as "—".
 */

/** `digits` significant digits, trailing zeros dropped. Example: significant(0.012345, 3) → "0.0123" */
export function significant(v: number, digits = 3): string {
  return Number.isFinite(v) ? Number(v.toPrecision(digits)).toString() : "—";
}

/**
 * The smallest number of `digits` significant digits that is ≥ v (v > 0): a threshold printed
 * for a user to give back ("a background of index 1.501 or more") must still meet it when taken
 * as printed, which rounding to nearest does not promise (1.50037 → 1.5). Other values pass as
 * they are. Example: significantAtLeast(1.50037, 4) → 1.501; significantAtLeast(1.5, 4) → 1.5.
 */
export function significantAtLeast(v: number, digits = 3): number {
  if (!(v > 0) || !Number.isFinite(v)) return v;
  const nearest = Number(v.toPrecision(digits));
  if (nearest >= v) return nearest;
  const unit = 10 ** (Math.floor(Math.log10(nearest)) - digits + 1);
  return Number((nearest + unit).toPrecision(digits));
}

const LENGTH_UNITS: [number, string][] = [[1, "m"], [1e-3, "mm"], [1e-6, "µm"], [1e-9, "nm"]];
const FREQUENCY_UNITS: [number, string][] = [[1e12, "THz"], [1e9, "GHz"], [1e6, "MHz"], [1e3, "kHz"]];

/** Example: formatLength(0.0012) → "1.2 mm"; formatLength(3.9e-8) → "39 nm"; formatLength(2e-13) → "0.2 pm" */
export function formatLength(m: number, number: (v: number) => string = (v) => significant(v, 3)): string {
  if (!Number.isFinite(m)) return "—";
  const a = Math.abs(m);
  if (a === 0) return "0 m";
  for (const [scale, unit] of LENGTH_UNITS) if (a >= scale) return `${number(m / scale)} ${unit}`;
  return `${number(m * 1e12)} pm`;
}

/**
 * A point in the unit of its larger coordinate; a coordinate below 1e-9 of the larger one prints
 * as 0. Example: formatPoint([0.04, 1e-18]) → "(40 mm, 0 mm)"; formatPoint([0, 0]) → "(0 m, 0 m)"
 */
export function formatPoint(pointM: readonly number[]): string {
  const big = Math.max(...pointM.map(Math.abs));
  if (!Number.isFinite(big)) return `(${pointM.map(() => "—").join(", ")})`;
  const [scale, unit] = big === 0 ? [1, "m"] : LENGTH_UNITS.find(([sc]) => big >= sc) ?? [1e-12, "pm"];
  return `(${pointM.map((v) => `${significant(Math.abs(v) < 1e-9 * big ? 0 : v / scale, 3)} ${unit}`).join(", ")})`;
}

/** Example: formatFrequency(1.05e10) → "10.5 GHz"; formatFrequency(1.934e14) → "193 THz" */
export function formatFrequency(hz: number, number: (v: number) => string = (v) => significant(v, 3)): string {
  if (!Number.isFinite(hz)) return "—";
  for (const [scale, unit] of FREQUENCY_UNITS) if (Math.abs(hz) >= scale) return `${number(hz / scale)} ${unit}`;
  return `${number(hz)} Hz`;
}

/**
 * A frequency as given or solved at (a design frequency, one sweep point): six significant digits,
 * so 193.5 THz does not read "194 THz" as formatFrequency's three would. Example: 1.935e14 → "193.5 THz"
 */
export function formatFrequencyPrecise(hz: number): string {
  return formatFrequency(hz, (v) => significant(v, 6));
}

/** A count in exponent form; one past the number range reads "more than 1.80e+308". Example: formatCount(1.5e6) → "1.50e+6" */
export function formatCount(n: number): string {
  return Number.isFinite(n) ? n.toExponential(2) : `more than ${Number.MAX_VALUE.toExponential(2)}`;
}
