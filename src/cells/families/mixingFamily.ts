/**
 * Builds a non-resonant family from its geometry and the mixing rule it uses along each axis, so
 * that every such family answers the forward and inverse questions the same way.
 */
import type { Complex } from "../../core/complex.js";
import type { MixingParams, MixingRuleId } from "../../media/mixing/mixingRule.js";
import { getMixingRule } from "../../media/mixing/registry.js";
import type { Axis, AxisPermittivity, CellFamily, FillResult } from "../cellFamily.js";
import type { Lattice } from "../lattice.js";

export interface MixingFamilySpec extends Omit<CellFamily, "effectivePermittivity" | "fillForTarget" | "resonant"> {
  rules: { parallel: MixingRuleId; perpendicular: MixingRuleId };
  params?: MixingParams;
  /** words naming the geometric limit, for messages: "touching rods" */
  limitNote(lattice: Lattice): string;
}

/** Inverse of one axis rule, checked against the family's geometric range. */
export function fillWithinRange(
  spec: MixingFamilySpec,
  host: Complex,
  inclusion: Complex,
  targetRe: number,
  axis: Axis,
  lattice: Lattice,
  aspect?: number,
): FillResult {
  const rule = getMixingRule(spec.rules[axis === "perpendicularY" ? "perpendicular" : axis]);
  const inv = rule.inverse(host, inclusion, targetRe, spec.params);
  const [lo, hi] = spec.fillRange(lattice, aspect);
  if (!Number.isFinite(inv.fill)) {
    return { ...inv, fill: NaN, ruleFill: NaN, inRange: false, reason: inv.reason ?? `no fill fraction of this pair reaches ε' = ${targetRe}` };
  }
  if (inv.fill < lo - 1e-12 || inv.fill > hi + 1e-12) {
    const side = inv.fill > hi ? `above the geometric limit ${fmt(hi)} (${spec.limitNote(lattice)})` : `below the smallest fill ${fmt(lo)}`;
    return { ...inv, fill: NaN, ruleFill: inv.fill, inRange: false, reason: `ε' = ${targetRe} needs fill ${fmt(inv.fill)}, ${side}` };
  }
  const fill = Math.min(hi, Math.max(lo, inv.fill));
  return { ...inv, fill, ruleFill: inv.fill, inRange: true };
}

const fmt = (x: number): string => Number(x.toPrecision(4)).toString();

export function mixingFamily(spec: MixingFamilySpec): CellFamily {
  const { rules, params, limitNote: _limitNote, ...rest } = spec;
  return {
    ...rest,
    resonant: false,
    effectivePermittivity(host, inclusion, fill): AxisPermittivity {
      const par = getMixingRule(rules.parallel).forward(host, inclusion, fill, params);
      const perp = rules.perpendicular === rules.parallel ? par : getMixingRule(rules.perpendicular).forward(host, inclusion, fill, params);
      return { parallel: par, perpendicular: perp, rules: { ...rules } };
    },
    fillForTarget(host, inclusion, targetRe, axis, lattice, context) {
      return fillWithinRange(spec, host, inclusion, targetRe, axis, lattice, context?.aspect);
    },
  };
}
