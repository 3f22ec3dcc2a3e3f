/**
 * Single-pole Debye relaxation: ε = ε∞ + (ε_s − ε∞)/(1 − iωτ) (exp(−iωt), so Im ε ≥ 0 when
 * ε_s ≥ ε∞). Source: Debye, "Polar Molecules" (1929); Böttcher & Bordewijk, "Theory of Electric
 * Polarization", vol. II (1978).
 */
import { cDiv, type Complex } from "../../core/complex.js";
import { angular, type DispersionModel, type DispersionParams } from "./dispersionModel.js";

/** ε∞ + (ε_s − ε∞)/(1 − iωτ); τ in seconds, frequency in Hz. */
export function debyePermittivity(epsStatic: number, epsInf: number, tauS: number, frequencyHz: number): Complex {
  const d = cDiv({ re: epsStatic - epsInf, im: 0 }, { re: 1, im: -angular(frequencyHz) * tauS });
  return { re: epsInf + d.re, im: d.im };
}

export const debye: DispersionModel = {
  id: "debye",
  description: "Debye relaxation ε∞ + (ε_s − ε∞)/(1 − iωτ)",
  params: [
    { key: "eps_s", required: true, description: "static permittivity ε_s" },
    { key: "eps_inf", required: true, description: "high-frequency permittivity ε∞" },
    { key: "tau_s", required: true, description: "relaxation time τ in s", sign: "positive" },
  ],
  check: (p) => (p.eps_s < p.eps_inf ? ["eps_s must be ≥ eps_inf (a passive relaxation)"] : []),
  evaluate: (p: DispersionParams, f: number) => debyePermittivity(p.eps_s, p.eps_inf, p.tau_s, f),
};
