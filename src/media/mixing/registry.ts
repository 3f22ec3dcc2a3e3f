/**
 * Registry of the mixing rules: id → rule (forward and inverse together). Add a rule: write its
 * file in this folder, add its id to MixingRuleId in mixingRule.ts, list it here.
 */
import { unknownWithSuggestion, InputError } from "../../core/errors.js";
import { bruggeman2d } from "./bruggeman2d.js";
import { bruggeman3d } from "./bruggeman3d.js";
import { mgCylinder } from "./mgCylinder.js";
import { mgEllipsoid } from "./mgEllipsoid.js";
import { mgSphere } from "./mgSphere.js";
import type { MixingRule, MixingRuleId } from "./mixingRule.js";
import { parallel } from "./parallel.js";
import { series } from "./series.js";

export const MIXING_RULES: Record<MixingRuleId, MixingRule> = {
  "mg-sphere": mgSphere,
  "mg-cylinder": mgCylinder,
  "mg-ellipsoid": mgEllipsoid,
  parallel,
  series,
  "bruggeman-3d": bruggeman3d,
  "bruggeman-2d": bruggeman2d,
};

export const MIXING_RULE_IDS = Object.keys(MIXING_RULES) as MixingRuleId[];

export function isMixingRuleId(id: string): id is MixingRuleId {
  return Object.prototype.hasOwnProperty.call(MIXING_RULES, id);
}

/**
 * The rule with this id. An unknown id is a user mistake (it comes from a flag or a design file):
 * InputError naming `where` with the closest ids.
 */
export function getMixingRule(id: string, where = "--rule"): MixingRule {
  if (!isMixingRuleId(id)) throw new InputError({ where, message: unknownWithSuggestion("mixing rule", id, MIXING_RULE_IDS) });
  return MIXING_RULES[id];
}
