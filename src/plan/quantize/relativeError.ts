/**
 * Relative error used everywhere in the planner: |a − t| / max(|t|, REL_FLOOR).
 *
 * The floor keeps targets that pass through zero (the reduced μ_r of a cloak at its inner radius,
 * a wire medium's ε near its plasma frequency) from demanding infinite precision: a value of
 * magnitude below 0.01 is judged against 0.01, i.e. to an absolute 1e-4 per percent of tolerance.
 * The floor is our choice (common practice is to judge small values absolutely).
 */
export const REL_FLOOR = 0.01;

/** Relative error of `achieved` against `target` with the REL_FLOOR floor. */
export function relErr(achieved: number, target: number): number {
  const w = Math.abs(target);
  return Math.abs(achieved - target) / (w > REL_FLOOR ? w : REL_FLOOR);
}

/**
 * The value c that minimises the largest relative error over the interval [lo, hi]: it equalises
 * the errors at both ends, c = (lo·w(hi) + hi·w(lo)) / (w(lo) + w(hi)) with w(v) = max(|v|, floor).
 * For 0 < floor ≤ lo ≤ hi this is the harmonic mean of the ends, 2·lo·hi/(lo + hi), and the error
 * at either end is (hi − lo)/(hi + lo).
 */
export function minimaxCentre(lo: number, hi: number): number {
  const wl = Math.max(Math.abs(lo), REL_FLOOR);
  const wh = Math.max(Math.abs(hi), REL_FLOOR);
  return (lo * wh + hi * wl) / (wl + wh);
}

/**
 * The error figure of the build list and the verdict (`rel_error`): |a − t| / |t| with the achieved
 * value complex (a = aRe + i·aIm, so its loss counts) and the target real, with NO floor. A target
 * of exactly zero has no relative error: the function returns NaN and the caller reports the
 * absolute error |a| in its own column (`zero_target_abs_error`).
 *
 * Example: complexRelError(1.02, 0.03, 1) → √(0.02² + 0.03²) = 0.0360555.
 */
export function complexRelError(aRe: number, aIm: number, target: number): number {
  if (target === 0) return NaN;
  return Math.hypot(aRe - target, aIm) / Math.abs(target);
}

/**
 * Largest complex relative error over components (zero targets skipped) and the largest absolute
 * error over the components whose target is exactly zero (NaN when there is none).
 */
export function largestErrors(aRe: ArrayLike<number>, aIm: ArrayLike<number>, target: ArrayLike<number>): { rel: number; zeroAbs: number } {
  let rel = 0, zeroAbs = NaN;
  for (let k = 0; k < target.length; k++) {
    const t = target[k];
    if (t === 0) {
      const a = Math.hypot(aRe[k], aIm[k]);
      if (!(a <= zeroAbs)) zeroAbs = a;
      continue;
    }
    const e = Math.hypot(aRe[k] - t, aIm[k]) / Math.abs(t);
    if (e > rel) rel = e;
  }
  return { rel, zeroAbs };
}
