/**
 * A scattering width as the check reports it: physical (σ_s ≥ 0), with an uncertainty that stays
 * honest near zero, judged on the scale of the problem. Both solvers read their widths through this
 * one rule (verifyDevice.ts for the grid ladder, radialCases.ts for the exact radial solver).
 *
 * - Value: an extrapolated width (Richardson, richardson.ts) can overshoot below zero when the
 *   ladder converges towards an invisible device; the width is clamped to v = max(0, σ∞), and the
 *   absolute uncertainty becomes U' = max(U, v − σ∞), so the interval v ± U' still holds the
 *   extrapolated value (clamping never makes the figure look surer than the ladder said).
 * - Scale: a relative uncertainty of a width near zero means nothing (−17.7 nm ± 870 %). The
 *   uncertainty is taken relative to S = max(v, σ_bare, D): the width itself, the bare object's
 *   width (the denominator of σ/σ_bare) and the device's width across D (the order of the width of an
 *   opaque object of the device's size). A figure is converged when U'/S ≤ the requested accuracy.
 * - Resolution: a width the check cannot tell from zero (v − U' ≤ 0, or v below the solver's floor
 *   F·D) reads "≈ 0, below X" with X = max(v + U', F·D), the largest width the evidence allows.
 *   F = ZERO_WIDTH_FRACTION = 1e-6 for both solvers: the radial series sums to a tolerance of 1e-9
 *   (σ to about 1e-7 relative), and the grid's spurious width without a scatterer is zero to
 *   rounding (scattered-field formulation: no source outside the scatterer; measured on a vacuum
 *   scene and on an identity-map device over a ladder, tests/verify/widthReading.test.ts),
 *   so below 1e-6 of the device's width neither solver claims a non-zero width.
 * Pure.
 */

/** Below this fraction of the device's width D a width reads as zero, for every solver (see file comment). */
export const ZERO_WIDTH_FRACTION = 1e-6;

export interface WidthReading {
  /** σ_s ≥ 0, metres */
  valueM: number;
  /** absolute uncertainty, metres (null: a single grid, no evidence) */
  uncertaintyM: number | null;
  /** uncertaintyM / max(valueM, referenceM, deviceWidthM) (null with uncertaintyM) */
  relative: number | null;
  /** the width cannot be told from zero: it is below this bound, metres (null when it can) */
  belowM: number | null;
}

export interface WidthScale {
  /** the bare object's width (null: no bare object) */
  referenceM: number | null;
  /** the device's width across, metres */
  deviceWidthM: number;
}

/**
 * Read an extrapolated width `valueM` ± `uncertaintyM` (absolute; null for one grid) on `scale`.
 * Example: widthReading(-17.7e-9, 154e-9, { referenceM: null, deviceWidthM: 0.1 }) →
 * { valueM: 0, uncertaintyM: 1.54e-7, relative: 1.54e-6, belowM: 1.54e-7 }.
 */
export function widthReading(valueM: number, uncertaintyM: number | null, scale: WidthScale): WidthReading {
  const v = Math.max(0, valueM);
  const u = uncertaintyM === null ? null : Math.max(Math.abs(uncertaintyM), v - valueM);
  const s = Math.max(v, Math.abs(scale.referenceM ?? 0), scale.deviceWidthM);
  const floorM = ZERO_WIDTH_FRACTION * scale.deviceWidthM;
  const top = Math.max(v + (u ?? 0), floorM);
  const zero = v <= floorM || (u !== null && v - u <= 0);
  return { valueM: v, uncertaintyM: u, relative: u === null ? null : s > 0 ? u / s : 0, belowM: zero ? top : null };
}

/**
 * A figure that cannot leave [lo, hi] (σ/σ_bare ≥ 0, a delivered share in [0, 1]) extrapolated on its
 * own: clamped into the range, its absolute uncertainty widened to reach the extrapolated value
 * (as for widths). Example: clampFigure(-0.01, 0.004, 0) → { value: 0, uncertainty: 0.01 }.
 */
export function clampFigure(value: number, uncertainty: number | null, lo: number, hi = Infinity): { value: number; uncertainty: number | null } {
  const v = Math.min(hi, Math.max(lo, value));
  return { value: v, uncertainty: uncertainty === null ? null : Math.max(Math.abs(uncertainty), Math.abs(v - value)) };
}
