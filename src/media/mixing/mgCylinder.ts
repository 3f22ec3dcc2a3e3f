/**
 * Maxwell Garnett for parallel cylinders with the field across the axis (2D):
 * (ε − ε_h)/(ε + ε_h) = f (ε_i − ε_h)/(ε_i + ε_h), i.e. the ellipsoid rule with N = 1/2.
 * (For the field along the cylinders use `parallel`.) Source: Sihvola, "Electromagnetic Mixing
 * Formulas and Applications", IEE (1999), ch. 4.
 */
import { maxwellGarnettAxis, maxwellGarnettAxisInverse } from "./mgEllipsoid.js";
import type { MixingRule } from "./mixingRule.js";

export const mgCylinder: MixingRule = {
  id: "mg-cylinder",
  description: "Maxwell Garnett, parallel cylinders, field across the axis (2D)",
  forward: (host, inclusion, fill) => maxwellGarnettAxis(host, inclusion, fill, 1 / 2),
  inverse: (host, inclusion, targetRe) => maxwellGarnettAxisInverse(host, inclusion, targetRe, 1 / 2, "mg-cylinder"),
};
