/**
 * Maxwell Garnett for aligned ellipsoids, field along one principal axis with depolarization
 * factor N: ε = ε_h + f ε_h (ε_i − ε_h) / (ε_h + (1 − f) N (ε_i − ε_h)).
 * N = 1/3 is the sphere, N = 1/2 the cylinder across its axis, N = 0 the parallel (Wiener) mean and
 * N = 1 the series mean. Source: Sihvola, "Electromagnetic Mixing Formulas and Applications",
 * IEE (1999), eq. (4.32); Maxwell Garnett, Phil. Trans. R. Soc. A 203, 385 (1904).
 */
import { cAdd, cDiv, cMul, cScale, cSub, type Complex } from "../../core/complex.js";
import { ProgrammerError } from "../../core/errors.js";
import { acceptClosedForm, realPhases, solveFillByBracketing } from "./fillSolver.js";
import type { InverseResult, MixingParams, MixingRule } from "./mixingRule.js";

/**
 * ε_eff along an axis with depolarization factor N (0 ≤ N ≤ 1) for fill fraction f of inclusion
 * in host (both relative permittivities, complex, exp(−iωt)). Formula above.
 * Example: maxwellGarnettAxis({re:1,im:0},{re:4,im:0},0.5,1/3) → {re: 2, im: 0}.
 */
export function maxwellGarnettAxis(host: Complex, inclusion: Complex, fill: number, depolarization: number): Complex {
  const d = cSub(inclusion, host);
  const num = cScale(cMul(host, d), fill);
  const den = cAdd(host, cScale(d, (1 - fill) * depolarization));
  return cAdd(host, cDiv(num, den));
}

/**
 * Closed-form fill fraction for real phases: f = (t − h)(h + N(i − h)) / ((i − h)(h + N(t − h))),
 * obtained by solving the formula above for f (it is a Möbius map of f, so the answer is unique).
 * Returns NaN when host = inclusion.
 */
export function maxwellGarnettAxisFillReal(host: number, inclusion: number, targetRe: number, depolarization: number): number {
  const d = inclusion - host;
  if (d === 0) return NaN;
  return ((targetRe - host) * (host + depolarization * d)) / (d * (host + depolarization * (targetRe - host)));
}

/** Inverse shared by the Maxwell Garnett rules (sphere, cylinder, ellipsoid). */
export function maxwellGarnettAxisInverse(
  host: Complex,
  inclusion: Complex,
  targetRe: number,
  depolarization: number,
  ruleId: string,
): InverseResult {
  const forward = (f: number) => maxwellGarnettAxis(host, inclusion, f, depolarization);
  if (realPhases(host, inclusion)) {
    if (host.re === inclusion.re) {
      return targetRe === host.re
        ? { fill: 0, achieved: host, converged: true, iterations: 0 }
        : { fill: NaN, achieved: { re: NaN, im: NaN }, converged: false, iterations: 0, reason: "host and inclusion are the same permittivity; no fill fraction changes it" };
    }
    return acceptClosedForm(maxwellGarnettAxisFillReal(host.re, inclusion.re, targetRe, depolarization), forward, targetRe, ruleId);
  }
  return solveFillByBracketing(forward, targetRe, ruleId);
}

function depolarizationOf(params: MixingParams | undefined): number {
  const n = params?.depolarization;
  if (n === undefined || !Number.isFinite(n) || n < 0 || n > 1) {
    throw new ProgrammerError("mg-ellipsoid needs params.depolarization in [0, 1]", { depolarization: n });
  }
  return n;
}

export const mgEllipsoid: MixingRule = {
  id: "mg-ellipsoid",
  description: "Maxwell Garnett, aligned ellipsoids, field along an axis with depolarization factor N",
  forward: (host, inclusion, fill, params) => maxwellGarnettAxis(host, inclusion, fill, depolarizationOf(params)),
  inverse: (host, inclusion, targetRe, params) =>
    maxwellGarnettAxisInverse(host, inclusion, targetRe, depolarizationOf(params), "mg-ellipsoid"),
};
