/**
 * Shared inverse machinery for the mixing rules: a closed-form fill fraction checked against the
 * forward rule, and a bounded bracketing iteration on Re ε_eff(f) = target for the cases without a
 * closed form (complex phases, where only the real part is matched and the loss follows).
 */
import type { Complex } from "../../core/complex.js";
import type { InverseResult } from "./mixingRule.js";

/** Number of sub-intervals of [0, 1] scanned for a sign change before bisection. */
export const FILL_SCAN_STEPS = 256;
/** Iteration cap of the bisection that follows the scan. */
export const FILL_MAX_ITERATIONS = 200;
/** Tolerance on the fill fraction for the bisection. */
export const FILL_TOLERANCE = 1e-13;

/** Relative residual allowed on Re ε_eff before a result counts as converged. */
export function residualOk(achievedRe: number, targetRe: number): boolean {
  return Math.abs(achievedRe - targetRe) <= 1e-9 * Math.max(1, Math.abs(targetRe));
}

function fmt(x: number): string {
  return Number(x.toPrecision(6)).toString();
}

/**
 * "target 12 above the largest value 9.8 this pair reaches for fill 0–1" and the like, from the
 * range of Re ε_eff seen over [0, 1].
 */
export function unreachableReason(targetRe: number, lo: number, hi: number, ruleId: string): string {
  if (targetRe > hi) return `target ${fmt(targetRe)} above the largest value ${fmt(hi)} that ${ruleId} reaches with this pair (fill 0–1)`;
  if (targetRe < lo) return `target ${fmt(targetRe)} below the smallest value ${fmt(lo)} that ${ruleId} reaches with this pair (fill 0–1)`;
  return `no fill fraction in [0, 1] gives ${fmt(targetRe)} with ${ruleId} (the real part jumps over it)`;
}

/**
 * Solve Re forward(f) = targetRe on [0, 1] by scanning FILL_SCAN_STEPS sub-intervals for the first
 * sign change (smallest fill fraction, i.e. the least inclusion material) and bisecting it.
 * Converged when the residual is within residualOk; a bracket across a jump (a pole of the rule)
 * is reported as not converged. Iterations count forward evaluations.
 */
export function solveFillByBracketing(
  forward: (fill: number) => Complex,
  targetRe: number,
  ruleId: string,
): InverseResult {
  let evaluations = 0;
  const g = (f: number): number => {
    evaluations++;
    return forward(f).re - targetRe;
  };
  let lo = Infinity;
  let hi = -Infinity;
  let fPrev = 0;
  let gPrev = g(0);
  let fBest = 0;
  let gBest = Math.abs(gPrev);
  if (gPrev === 0) return { fill: 0, achieved: forward(0), converged: true, iterations: evaluations };
  lo = Math.min(lo, gPrev + targetRe);
  hi = Math.max(hi, gPrev + targetRe);
  for (let k = 1; k <= FILL_SCAN_STEPS; k++) {
    const f = k / FILL_SCAN_STEPS;
    const gk = g(f);
    if (Number.isFinite(gk)) {
      lo = Math.min(lo, gk + targetRe);
      hi = Math.max(hi, gk + targetRe);
      if (Math.abs(gk) < gBest) {
        gBest = Math.abs(gk);
        fBest = f;
      }
    }
    if (gk === 0) return { fill: f, achieved: forward(f), converged: true, iterations: evaluations };
    if (Number.isFinite(gk) && Number.isFinite(gPrev) && Math.sign(gk) !== Math.sign(gPrev)) {
      let a = fPrev;
      let b = f;
      let ga = gPrev;
      let iterations = 0;
      while (b - a > FILL_TOLERANCE && iterations < FILL_MAX_ITERATIONS) {
        const m = 0.5 * (a + b);
        const gm = g(m);
        iterations++;
        if (gm === 0) {
          a = m;
          b = m;
          break;
        }
        if (Math.sign(gm) === Math.sign(ga)) {
          a = m;
          ga = gm;
        } else {
          b = m;
        }
      }
      const fill = 0.5 * (a + b);
      const achieved = forward(fill);
      const converged = residualOk(achieved.re, targetRe);
      return {
        fill,
        achieved,
        converged,
        iterations: evaluations,
        ...(converged ? {} : { reason: `the real part of ${ruleId} jumps across the target near fill ${fmt(fill)} (a resonance of the rule)` }),
      };
    }
    fPrev = f;
    gPrev = gk;
  }
  // no sign change: the target may still be met within rounding at a scan point (an end, say)
  if (gBest <= 1e-9 * Math.max(1, Math.abs(targetRe))) {
    return { fill: fBest, achieved: forward(fBest), converged: true, iterations: evaluations };
  }
  return {
    fill: NaN,
    achieved: { re: NaN, im: NaN },
    converged: false,
    iterations: evaluations,
    reason: unreachableReason(targetRe, lo, hi, ruleId),
  };
}

/**
 * Finish a closed-form inverse: accept `fill` when it lies in [0, 1] (within 1e-12, then clamped)
 * and the forward rule reproduces the target; otherwise fall back to bracketing (which also
 * produces the reason when the target is unreachable).
 */
export function acceptClosedForm(
  fill: number,
  forward: (fill: number) => Complex,
  targetRe: number,
  ruleId: string,
): InverseResult {
  if (Number.isFinite(fill) && fill >= -1e-12 && fill <= 1 + 1e-12) {
    const f = Math.min(1, Math.max(0, fill));
    const achieved = forward(f);
    if (residualOk(achieved.re, targetRe)) return { fill: f, achieved, converged: true, iterations: 0 };
  }
  return solveFillByBracketing(forward, targetRe, ruleId);
}

/** True when both phases are real (lossless), where the closed forms apply. */
export const realPhases = (host: Complex, inclusion: Complex): boolean => host.im === 0 && inclusion.im === 0;
