/**
 * How far Maxwell Garnett and Bruggeman disagree for one axis of a family at a fill fraction: the
 * family's own rule against its counterpart (MG cylinder ↔ Bruggeman 2D, MG sphere ↔ Bruggeman 3D).
 * Rules exact for their geometry (Wiener parallel and series means) have no spread. Maxwell Garnett
 * suits isolated inclusions at low fill, Bruggeman aggregates at high fill; where they disagree by
 * more than the design tolerance the cell should be verified with a full-wave unit-cell simulation.
 */
import type { Complex } from "../core/complex.js";
import type { MixingRuleId } from "../media/mixing/mixingRule.js";
import { getMixingRule } from "../media/mixing/registry.js";
import type { AxisPermittivity } from "./cellFamily.js";

const COUNTERPART: Partial<Record<string, MixingRuleId>> = {
  "mg-cylinder": "bruggeman-2d",
  "bruggeman-2d": "mg-cylinder",
  "mg-sphere": "bruggeman-3d",
  "bruggeman-3d": "mg-sphere",
};

/** The rule an axis rule is compared with, or undefined when the axis rule is exact. */
export const spreadCounterpart = (rule: string): MixingRuleId | undefined => COUNTERPART[rule];

/**
 * |Re ε_rule − Re ε_counterpart| / max(|Re ε_rule|, 1) along one axis; 0 when the rule is exact.
 */
export function axisSpread(rule: string, host: Complex, inclusion: Complex, fill: number, value: Complex): number {
  const other = spreadCounterpart(rule);
  if (!other || !(fill > 0)) return 0;
  const alt = getMixingRule(other).forward(host, inclusion, fill);
  return Math.abs(value.re - alt.re) / Math.max(Math.abs(value.re), 1);
}

export interface CellSpread {
  parallel: number;
  perpendicular: number;
  max: number;
}

/** Spread on both axes of a family's effective permittivity. */
export function cellSpread(eff: AxisPermittivity, host: Complex, inclusion: Complex, fill: number): CellSpread {
  const parallel = axisSpread(eff.rules.parallel, host, inclusion, fill, eff.parallel);
  const perpendicular = axisSpread(eff.rules.perpendicular, host, inclusion, fill, eff.perpendicular);
  return { parallel, perpendicular, max: Math.max(parallel, perpendicular) };
}
