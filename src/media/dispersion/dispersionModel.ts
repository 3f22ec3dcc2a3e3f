/**
 * The shared shape of a dispersion model (one file per model in this folder, listed in
 * registry.ts). Parameters are a flat record of numbers with SI names (`plasma_hz`, `tau_s`),
 * exactly as the catalog's `params` column gives them after unit conversion at the edge.
 * Convention exp(−iωt): a lossy passive medium has Im ε ≥ 0.
 */
import type { Complex } from "../../core/complex.js";
import { EPS0_F_PER_M, SPEED_OF_LIGHT_M_PER_S } from "../../core/physicalConstants.js";

export type DispersionModelId = "constant" | "debye" | "debye-water" | "lorentz" | "drude" | "drude-lorentz" | "sellmeier";

export type DispersionParams = Readonly<Record<string, number>>;

export interface ParamSpec {
  /** SI name as used in the catalog: "eps_r", "plasma_hz", "pole1_f0_hz" (use "poleN_" for repeated poles) */
  key: string;
  required: boolean;
  description: string;
  /** the value must be > 0 (true) or ≥ 0 ("nonnegative"); unset: any finite number */
  sign?: "positive" | "nonnegative";
}

export interface DispersionModel {
  id: DispersionModelId;
  /** one line for help texts */
  description: string;
  /** accepted parameters; keys with "N" (pole N) repeat for N = 1, 2, … */
  params: readonly ParamSpec[];
  /** extra consistency checks beyond the specs (e.g. poles numbered without gaps); messages */
  check?(params: DispersionParams): string[];
  /** complex relative permittivity at frequencyHz (> 0) */
  evaluate(params: DispersionParams, frequencyHz: number): Complex;
}

/** Angular frequency ω = 2πf in rad/s. */
export const angular = (frequencyHz: number): number => 2 * Math.PI * frequencyHz;

/** Speed of light in vacuum, m/s (exact, SI 2019): the one definition in core/physicalConstants.ts. */
export const SPEED_OF_LIGHT = SPEED_OF_LIGHT_M_PER_S;

/** Vacuum permittivity ε₀ in F/m (CODATA 2018; defined in core/physicalConstants.ts). */
export const VACUUM_PERMITTIVITY = EPS0_F_PER_M;

/** Pole numbers present in a parameter record for a key pattern like "pole{N}_f0_hz", sorted. */
export function poleNumbers(params: DispersionParams, suffix: string): number[] {
  const re = new RegExp(`^pole(\\d+)_${suffix}$`);
  const out: number[] = [];
  for (const k of Object.keys(params)) {
    const m = re.exec(k);
    if (m) out.push(Number(m[1]));
  }
  return out.sort((a, b) => a - b);
}

/** Messages for poles numbered 1..n without gaps and with all three of delta_eps, f0_hz, gamma_hz. */
export function checkPoles(params: DispersionParams, requireAtLeastOne: boolean): string[] {
  const numbers = new Set<number>();
  for (const s of ["delta_eps", "f0_hz", "gamma_hz"]) for (const n of poleNumbers(params, s)) numbers.add(n);
  const sorted = [...numbers].sort((a, b) => a - b);
  const issues: string[] = [];
  if (requireAtLeastOne && sorted.length === 0) issues.push("expected at least one pole (pole1_delta_eps, pole1_f0_hz, pole1_gamma_hz)");
  sorted.forEach((n, k) => {
    if (n !== k + 1) issues.push(`poles must be numbered 1, 2, … without gaps; found pole${n}`);
    for (const s of ["delta_eps", "f0_hz", "gamma_hz"]) {
      if (params[`pole${n}_${s}`] === undefined) issues.push(`pole${n} needs pole${n}_${s}`);
    }
  });
  return issues;
}
