/**
 * The shared shape of every mixing rule (one file per rule in this folder, listed in registry.ts).
 * A rule maps a fill fraction of an inclusion phase in a host phase to an effective permittivity
 * (forward), and a target back to the fill fraction (inverse). Complex-valued, exp(-iωt).
 */
import type { Complex } from "../../core/complex.js";

export type MixingRuleId =
  | "mg-sphere"
  | "mg-cylinder"
  | "mg-ellipsoid"
  | "parallel"
  | "series"
  | "bruggeman-3d"
  | "bruggeman-2d";

export interface MixingParams {
  /** depolarization factor along the field, for mg-ellipsoid (0 ≤ N ≤ 1) */
  depolarization?: number;
}

export interface InverseResult {
  /** fill fraction of the inclusion phase; NaN when no fill fraction in [0, 1] reaches the target */
  fill: number;
  /** value the rule gives at `fill` */
  achieved: Complex;
  converged: boolean;
  iterations: number;
  /** why there is no answer, when fill is NaN ("target above the upper bound 7.3 of this pair") */
  reason?: string;
}

export interface MixingRule {
  id: MixingRuleId;
  /** one line for help texts */
  description: string;
  /** ε_eff of `fill` (0..1) of `inclusion` in `host` */
  forward(host: Complex, inclusion: Complex, fill: number, params?: MixingParams): Complex;
  /**
   * Fill fraction whose ε_eff has the target's real part (closed form where one exists, bounded
   * iteration otherwise). Only the real part of the target is matched; the loss follows.
   */
  inverse(host: Complex, inclusion: Complex, targetRe: number, params?: MixingParams): InverseResult;
}
