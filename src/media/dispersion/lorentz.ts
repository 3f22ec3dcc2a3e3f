/**
 * Sum of Lorentz poles: ε = ε∞ + Σ_k Δε_k f0_k² / (f0_k² − f² − i γ_k f), frequencies in Hz
 * (ordinary, not angular: the ratio is the same). Im ε ≥ 0 for Δε_k ≥ 0, γ_k ≥ 0.
 * Source: Lorentz, "The Theory of Electrons" (1909); Bohren & Huffman, "Absorption and Scattering
 * of Light by Small Particles" (1983), §9.1.
 */
import { cAdd, cDiv, type Complex } from "../../core/complex.js";
import { checkPoles, poleNumbers, type DispersionModel, type DispersionParams } from "./dispersionModel.js";

export interface LorentzPole {
  deltaEps: number;
  f0Hz: number;
  gammaHz: number;
}

/** Σ Δε f0²/(f0² − f² − iγf) (without ε∞). */
export function lorentzSum(poles: readonly LorentzPole[], frequencyHz: number): Complex {
  let sum: Complex = { re: 0, im: 0 };
  for (const p of poles) {
    const num = { re: p.deltaEps * p.f0Hz * p.f0Hz, im: 0 };
    const den = { re: p.f0Hz * p.f0Hz - frequencyHz * frequencyHz, im: -p.gammaHz * frequencyHz };
    sum = cAdd(sum, cDiv(num, den));
  }
  return sum;
}

/** The poles of a parameter record (pole1_delta_eps, pole1_f0_hz, pole1_gamma_hz, pole2_…). */
export function polesOf(params: DispersionParams): LorentzPole[] {
  return poleNumbers(params, "f0_hz").map((n) => ({
    deltaEps: params[`pole${n}_delta_eps`],
    f0Hz: params[`pole${n}_f0_hz`],
    gammaHz: params[`pole${n}_gamma_hz`],
  }));
}

export const POLE_PARAMS = [
  { key: "poleN_delta_eps", required: false, description: "oscillator strength Δε of pole N", sign: "nonnegative" },
  { key: "poleN_f0_hz", required: false, description: "resonance frequency of pole N in Hz", sign: "positive" },
  { key: "poleN_gamma_hz", required: false, description: "damping of pole N in Hz", sign: "nonnegative" },
] as const;

export const lorentz: DispersionModel = {
  id: "lorentz",
  description: "sum of Lorentz poles ε∞ + Σ Δε f0²/(f0² − f² − iγf)",
  params: [{ key: "eps_inf", required: true, description: "high-frequency permittivity ε∞" }, ...POLE_PARAMS],
  check: (p) => checkPoles(p, true),
  evaluate(p: DispersionParams, f: number) {
    const s = lorentzSum(polesOf(p), f);
    return { re: p.eps_inf + s.re, im: s.im };
  },
};
