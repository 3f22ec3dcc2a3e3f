/**
 * Constant permittivity with a loss tangent and an optional DC conductivity:
 *   ε = ε_r (1 + i tan δ) + i σ/(ω ε₀).
 * The usual model for low-loss dielectrics over a band where ε' and tan δ hardly change; the
 * conduction term gives the 1/f loss of a resistive semiconductor (tan δ = σ/(ω ε₀ ε_r)).
 * Not causal as a broadband model (Kramers–Kronig): use it only inside the row's valid range.
 * Source: standard dielectric practice, e.g. Pozar, "Microwave Engineering", 4th ed., §1.3.
 */
import type { Complex } from "../../core/complex.js";
import { angular, VACUUM_PERMITTIVITY, type DispersionModel, type DispersionParams } from "./dispersionModel.js";

/** ε_r(1 + i tanδ) + iσ/(ωε₀); eps_r dimensionless, σ in S/m, frequency in Hz (> 0). */
export function constantPermittivity(epsR: number, tanDelta: number, conductivitySPerM: number, frequencyHz: number): Complex {
  return { re: epsR, im: epsR * tanDelta + conductivitySPerM / (angular(frequencyHz) * VACUUM_PERMITTIVITY) };
}

export const constant: DispersionModel = {
  id: "constant",
  description: "constant ε' with loss tangent tan δ (and optional DC conductivity σ)",
  params: [
    { key: "eps_r", required: true, description: "real relative permittivity ε'" },
    { key: "tan_delta", required: true, description: "loss tangent ε''/ε' (dielectric part)", sign: "nonnegative" },
    { key: "sigma_s_per_m", required: false, description: "DC conductivity in S/m, adds σ/(ωε₀) to ε''", sign: "nonnegative" },
  ],
  evaluate: (p: DispersionParams, f: number) => constantPermittivity(p.eps_r, p.tan_delta, p.sigma_s_per_m ?? 0, f),
};
