/**
 * Series (harmonic, Wiener lower) mean: 1/ε = f/ε_i + (1 − f)/ε_h. Exact for a laminate with the
 * field across the layers. Source: Wiener, Abh. Math.-Phys. Kl. Sächs. Ges. Wiss. 32, 509 (1912).
 */
import { cAdd, cDiv, cScale, ONE, type Complex } from "../../core/complex.js";
import { acceptClosedForm, realPhases, solveFillByBracketing } from "./fillSolver.js";
import type { MixingRule } from "./mixingRule.js";

/** 1 / (f/ε_i + (1 − f)/ε_h) (complex). A zero phase gives a non-finite value. */
export function seriesMean(host: Complex, inclusion: Complex, fill: number): Complex {
  return cDiv(ONE, cAdd(cScale(cDiv(ONE, inclusion), fill), cScale(cDiv(ONE, host), 1 - fill)));
}

export const series: MixingRule = {
  id: "series",
  description: "series mean: laminate with the field across the layers",
  forward: seriesMean,
  inverse(host, inclusion, targetRe) {
    const forward = (f: number) => seriesMean(host, inclusion, f);
    if (realPhases(host, inclusion)) {
      // f = (1/t − 1/ε_h) / (1/ε_i − 1/ε_h)
      const d = 1 / inclusion.re - 1 / host.re;
      if (d === 0) {
        return targetRe === host.re
          ? { fill: 0, achieved: host, converged: true, iterations: 0 }
          : { fill: NaN, achieved: { re: NaN, im: NaN }, converged: false, iterations: 0, reason: "host and inclusion are the same permittivity; no fill fraction changes it" };
      }
      return acceptClosedForm((1 / targetRe - 1 / host.re) / d, forward, targetRe, "series");
    }
    return solveFillByBracketing(forward, targetRe, "series");
  },
};
