/**
 * Maxwell Garnett for spheres (3D): (ε − ε_h)/(ε + 2ε_h) = f (ε_i − ε_h)/(ε_i + 2ε_h), i.e. the
 * ellipsoid rule with N = 1/3. Suits isolated inclusions at low fill. Source: Maxwell Garnett,
 * Phil. Trans. R. Soc. A 203, 385 (1904); Sihvola, "Electromagnetic Mixing Formulas and
 * Applications", IEE (1999), eq. (3.27).
 */
import { maxwellGarnettAxis, maxwellGarnettAxisInverse } from "./mgEllipsoid.js";
import type { MixingRule } from "./mixingRule.js";

export const mgSphere: MixingRule = {
  id: "mg-sphere",
  description: "Maxwell Garnett, spheres in a host (3D, isolated inclusions)",
  forward: (host, inclusion, fill) => maxwellGarnettAxis(host, inclusion, fill, 1 / 3),
  inverse: (host, inclusion, targetRe) => maxwellGarnettAxisInverse(host, inclusion, targetRe, 1 / 3, "mg-sphere"),
};
