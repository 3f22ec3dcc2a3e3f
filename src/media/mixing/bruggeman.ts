/**
 * Symmetric Bruggeman effective medium in d dimensions (d = 2 or 3), two phases:
 *   f (ε_i − ε)/(ε_i + (d−1)ε) + (1 − f)(ε_h − ε)/(ε_h + (d−1)ε) = 0.
 * Cleared of denominators this is the quadratic (d−1)ε² − bε − ε_i ε_h = 0 with
 * b = f((d−1)ε_i − ε_h) + (1 − f)((d−1)ε_h − ε_i). Both phases are treated alike (no host), which
 * suits aggregates and high fill; a conducting phase percolates at f = 1/d.
 * Source: Bruggeman, Ann. Phys. 416, 636 (1935); Sihvola, "Electromagnetic Mixing Formulas and
 * Applications", IEE (1999), ch. 5.
 */
import { cAdd, cMul, cScale, cSqrt, cSub, type Complex } from "../../core/complex.js";
import { acceptClosedForm, realPhases, solveFillByBracketing } from "./fillSolver.js";
import type { InverseResult } from "./mixingRule.js";

/**
 * ε_eff of the symmetric Bruggeman rule (complex). Of the two roots of the quadratic, the
 * physical one has Im ε ≥ 0 (exp(−iωt), passive phases); when both qualify (lossless phases) the
 * one nearer the parallel mean f ε_i + (1 − f) ε_h is taken, which for positive phases is the root
 * inside the Wiener bounds and at f = 0 / f = 1 is exactly the host / the inclusion.
 * Example: bruggemanForward({re:1,im:0},{re:4,im:0},0.5,2) → {re: 2, im: 0} (= sqrt(1·4)).
 */
export function bruggemanForward(host: Complex, inclusion: Complex, fill: number, dimension: 2 | 3): Complex {
  return bruggemanAligned(host, inclusion, fill, 1 / dimension);
}

/**
 * Bruggeman for aligned ellipsoidal grains of both phases with depolarization factor N along the
 * field (Polder, van Santen, Physica 12, 257 (1946); Sihvola 1999, ch. 9):
 * f(ε_i − ε)/(ε + N(ε_i − ε)) + (1 − f)(ε_h − ε)/(ε + N(ε_h − ε)) = 0, which is the d-dimensional
 * rule with d − 1 replaced by k = (1 − N)/N (N = 1/3: spheres, 1/2: cylinders across the field).
 * The limits N → 0 and N → 1 are the parallel and series means (laminates, exact).
 */
export function bruggemanAligned(host: Complex, inclusion: Complex, fill: number, depolarization: number): Complex {
  if (fill === 0) return { re: host.re, im: host.im };
  if (fill === 1) return { re: inclusion.re, im: inclusion.im };
  const N = depolarization;
  if (N <= 1e-12) return cAdd(cScale(inclusion, fill), cScale(host, 1 - fill));
  if (N >= 1 - 1e-12) {
    // series: 1/ε = f/ε_i + (1 − f)/ε_h
    const inv = cAdd(cScale(cDivOne(inclusion), fill), cScale(cDivOne(host), 1 - fill));
    return cDivOne(inv);
  }
  const k = (1 - N) / N;
  const b = cAdd(
    cScale(cSub(cScale(inclusion, k), host), fill),
    cScale(cSub(cScale(host, k), inclusion), 1 - fill),
  );
  const disc = cSqrt(cAdd(cMul(b, b), cScale(cMul(inclusion, host), 4 * k)));
  const r1 = cScale(cAdd(b, disc), 1 / (2 * k));
  const r2 = cScale(cSub(b, disc), 1 / (2 * k));
  const scale = Math.max(Math.hypot(r1.re, r1.im), Math.hypot(r2.re, r2.im), 1e-300);
  const tol = 1e-12 * scale;
  const ok1 = r1.im >= -tol;
  const ok2 = r2.im >= -tol;
  if (ok1 && !ok2) return r1;
  if (ok2 && !ok1) return r2;
  if (!ok1 && !ok2) return r1.im >= r2.im ? r1 : r2;
  const mean = cAdd(cScale(inclusion, fill), cScale(host, 1 - fill));
  const d1 = Math.hypot(r1.re - mean.re, r1.im - mean.im);
  const d2 = Math.hypot(r2.re - mean.re, r2.im - mean.im);
  return d1 <= d2 ? r1 : r2;
}

function cDivOne(z: Complex): Complex {
  const d = z.re * z.re + z.im * z.im;
  return { re: z.re / d, im: -z.im / d };
}

/**
 * Closed-form fill fraction for real phases: the Bruggeman equation is linear in f, so with
 * A = (ε_h − t)/(ε_h + (d−1)t) and B = (ε_i − t)/(ε_i + (d−1)t), f = A/(A − B).
 */
export function bruggemanFillReal(host: number, inclusion: number, targetRe: number, dimension: 2 | 3): number {
  const k = dimension - 1;
  const a = (host - targetRe) / (host + k * targetRe);
  const b = (inclusion - targetRe) / (inclusion + k * targetRe);
  return a / (a - b);
}

/** Inverse of the symmetric Bruggeman rule (closed form for real phases, bracketing otherwise). */
export function bruggemanInverse(host: Complex, inclusion: Complex, targetRe: number, dimension: 2 | 3): InverseResult {
  const id = dimension === 3 ? "bruggeman-3d" : "bruggeman-2d";
  const forward = (f: number) => bruggemanForward(host, inclusion, f, dimension);
  if (realPhases(host, inclusion)) {
    if (host.re === inclusion.re) {
      return targetRe === host.re
        ? { fill: 0, achieved: host, converged: true, iterations: 0 }
        : { fill: NaN, achieved: { re: NaN, im: NaN }, converged: false, iterations: 0, reason: "host and inclusion are the same permittivity; no fill fraction changes it" };
    }
    if (targetRe === host.re) return { fill: 0, achieved: forward(0), converged: true, iterations: 0 };
    if (targetRe === inclusion.re) return { fill: 1, achieved: forward(1), converged: true, iterations: 0 };
    return acceptClosedForm(bruggemanFillReal(host.re, inclusion.re, targetRe, dimension), forward, targetRe, id);
  }
  return solveFillByBracketing(forward, targetRe, id);
}
