/**
 * Symmetric Bruggeman, 3D (spherical grains): f(ε_i − ε)/(ε_i + 2ε) + (1 − f)(ε_h − ε)/(ε_h + 2ε) = 0.
 * A conducting phase percolates at f = 1/3. Source: Bruggeman, Ann. Phys. 416, 636 (1935).
 */
import { bruggemanForward, bruggemanInverse } from "./bruggeman.js";
import type { MixingRule } from "./mixingRule.js";

export const bruggeman3d: MixingRule = {
  id: "bruggeman-3d",
  description: "Bruggeman, symmetric, 3D (aggregates, high fill; percolates at 1/3)",
  forward: (host, inclusion, fill) => bruggemanForward(host, inclusion, fill, 3),
  inverse: (host, inclusion, targetRe) => bruggemanInverse(host, inclusion, targetRe, 3),
};
