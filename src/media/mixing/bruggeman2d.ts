/**
 * Symmetric Bruggeman, 2D (parallel cylinders, field across the axis):
 * f(ε_i − ε)/(ε_i + ε) + (1 − f)(ε_h − ε)/(ε_h + ε) = 0. At f = 1/2, ε = sqrt(ε_1 ε_2)
 * (Keller–Dykhne); a conducting phase percolates at f = 1/2. Source: Bruggeman, Ann. Phys. 416,
 * 636 (1935).
 */
import { bruggemanForward, bruggemanInverse } from "./bruggeman.js";
import type { MixingRule } from "./mixingRule.js";

export const bruggeman2d: MixingRule = {
  id: "bruggeman-2d",
  description: "Bruggeman, symmetric, 2D (cylinders across the axis; percolates at 1/2)",
  forward: (host, inclusion, fill) => bruggemanForward(host, inclusion, fill, 2),
  inverse: (host, inclusion, targetRe) => bruggemanInverse(host, inclusion, targetRe, 2),
};
