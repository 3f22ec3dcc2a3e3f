/**
 * Richardson extrapolation of a figure computed on a ladder of grids, with an uncertainty from the
 * grid convergence index (Richardson, Phil. Trans. R. Soc. A 210, 307 (1911); Roache, "Perspective:
 * a method for uniform reporting of grid refinement studies", J. Fluids Eng. 116, 405 (1994), and
 * "Verification and Validation in Computational Science and Engineering", 1998, ch. 5).
 *
 * Model Q(h) = Q∞ + C h^p. With three grids h1 > h2 > h3 the observed order p solves
 * (Q1 − Q2)/(Q2 − Q3) = (h1^p − h2^p)/(h2^p − h3^p) (bisection on p ∈ [0.5, 6]); then
 * Q∞ = Q3 + (Q3 − Q2)/((h2/h3)^p − 1) and the uncertainty is the GCI, Fs·|Q∞ − Q3| with the safety
 * factor Fs = 1.25. When the three values oscillate (the ratio is negative) nothing is extrapolated:
 * the finest value is kept and the spread of the three is the uncertainty. When p falls outside the
 * range, or only two grids exist, the nominal order of the scheme is assumed and Fs = 3 (Roache's
 * value for two-grid studies), with the spread of the last three as a floor. One grid gives no
 * estimate.
 */

export interface Extrapolation {
  /** extrapolated value (the finest value when no extrapolation was possible) */
  value: number;
  /** absolute uncertainty, null with a single grid */
  uncertainty: number | null;
  /** observed order, or the nominal order when assumed; null with a single grid */
  order: number | null;
  how: "three-grid" | "nominal-order" | "oscillating" | "single-grid";
}

/** Nominal order of the FDFD scheme with sub-pixel averaging (second order). */
export const NOMINAL_ORDER = 2;

/**
 * Extrapolate values `q` computed with steps `h` (same length, coarsest first). Uses the last three
 * (or two) entries. Throws RangeError for mismatched or empty input.
 */
export function richardson(h: readonly number[], q: readonly number[], nominal = NOMINAL_ORDER): Extrapolation {
  if (h.length !== q.length || h.length === 0) throw new RangeError("richardson: expected equal, non-empty arrays");
  const n = q.length;
  if (n === 1) return { value: q[0], uncertainty: null, order: null, how: "single-grid" };
  const nominalFit = (): Extrapolation => {
    const r = h[n - 2] / h[n - 1];
    const d = (q[n - 1] - q[n - 2]) / (r ** nominal - 1);
    let unc = 3 * Math.abs(d);
    if (n >= 3) unc = Math.max(unc, Math.max(q[n - 1], q[n - 2], q[n - 3]) - Math.min(q[n - 1], q[n - 2], q[n - 3]));
    return { value: q[n - 1] + d, uncertainty: unc, order: nominal, how: "nominal-order" };
  };
  if (n === 2) return nominalFit();
  const [h1, h2, h3] = [h[n - 3], h[n - 2], h[n - 1]];
  const [q1, q2, q3] = [q[n - 3], q[n - 2], q[n - 1]];
  if (q2 === q3 && q1 === q2) return { value: q3, uncertainty: 0, order: null, how: "three-grid" };
  const ratio = (q1 - q2) / (q2 - q3);
  if (!(ratio > 0) || !Number.isFinite(ratio)) {
    // oscillating: no extrapolation; the spread of the last three values is the uncertainty
    return { value: q3, uncertainty: Math.max(q1, q2, q3) - Math.min(q1, q2, q3), order: null, how: "oscillating" };
  }
  const f = (p: number): number => (h1 ** p - h2 ** p) / (h2 ** p - h3 ** p) - ratio;
  let lo = 0.5, hi = 6;
  if (f(lo) * f(hi) > 0) return nominalFit();
  for (let it = 0; it < 80; it++) { const m = 0.5 * (lo + hi); if (f(lo) * f(m) <= 0) hi = m; else lo = m; }
  const p = 0.5 * (lo + hi);
  const d = (q3 - q2) / ((h2 / h3) ** p - 1);
  return { value: q3 + d, uncertainty: 1.25 * Math.abs(d), order: p, how: "three-grid" };
}
