/**
 * Parallel (arithmetic, Wiener upper) mean: ε = f ε_i + (1 − f) ε_h. Exact for a laminate with the
 * field along the layers and for cylinders with the field along their axis. Source: Wiener,
 * Abh. Math.-Phys. Kl. Sächs. Ges. Wiss. 32, 509 (1912).
 */
import { cAdd, cScale, type Complex } from "../../core/complex.js";
import { acceptClosedForm } from "./fillSolver.js";
import type { MixingRule } from "./mixingRule.js";

/** f ε_i + (1 − f) ε_h (complex). */
export function parallelMean(host: Complex, inclusion: Complex, fill: number): Complex {
  return cAdd(cScale(inclusion, fill), cScale(host, 1 - fill));
}

export const parallel: MixingRule = {
  id: "parallel",
  description: "parallel mean: laminate with the field along the layers, or cylinders with the field along the axis",
  forward: parallelMean,
  inverse(host, inclusion, targetRe) {
    // Re ε is linear in f even for complex phases: f = (t − Re ε_h)/(Re ε_i − Re ε_h).
    const d = inclusion.re - host.re;
    if (d === 0) {
      return targetRe === host.re
        ? { fill: 0, achieved: host, converged: true, iterations: 0 }
        : { fill: NaN, achieved: { re: NaN, im: NaN }, converged: false, iterations: 0, reason: "host and inclusion have the same real part; no fill fraction changes it" };
    }
    return acceptClosedForm((targetRe - host.re) / d, (f) => parallelMean(host, inclusion, f), targetRe, "parallel");
  },
};
