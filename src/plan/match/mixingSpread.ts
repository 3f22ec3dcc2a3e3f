/**
 * Maxwell Garnett – Bruggeman spread: where a family uses Maxwell Garnett along an axis, the
 * relative difference from symmetric Bruggeman at the same fill (and the other way round). The two
 * rules bracket the plausible answer for random or dense inclusions (Sihvola, "Electromagnetic
 * Mixing Formulas and Applications", IEE 1999, ch. 9); laminate (Wiener) values are exact and
 * carry no spread.
 */
import { cAbs, cSub, type Complex } from "../../core/complex.js";
import { getMixingRule } from "../../media/mixing/registry.js";

/** |ε_MG − ε_Br| / |ε_Br| for `rule` at `fill`; 0 for rules with no counterpart. */
export function mixingSpread(rule: string, dimension: 2 | 3, host: Complex, inclusion: Complex, fill: number): number {
  let other: string | null = null;
  if (rule.startsWith("mg-")) other = dimension === 2 ? "bruggeman-2d" : "bruggeman-3d";
  else if (rule.startsWith("bruggeman-")) other = rule === "bruggeman-2d" ? "mg-cylinder" : "mg-sphere";
  if (other === null) return 0;
  const a = getMixingRule(rule).forward(host, inclusion, fill);
  const b = getMixingRule(other).forward(host, inclusion, fill);
  // relative to the Bruggeman value, the same measure as media/uncertainty.ts (mix, cell)
  const br = rule.startsWith("bruggeman-") ? a : b;
  const s = cAbs(cSub(a, b)) / Math.max(cAbs(br), 1e-12);
  return Number.isFinite(s) ? s : 0;
}
