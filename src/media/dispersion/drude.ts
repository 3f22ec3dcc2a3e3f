/**
 * Drude free-electron model: ε = ε∞ − f_p² / (f² + i γ f), with plasma frequency f_p and
 * collision rate γ as ordinary frequencies in Hz (ω_p/2π, Γ/2π). DC conductivity follows as
 * σ = ε₀ (2π f_p)² / (2π γ). Source: Ordal et al., Appl. Opt. 22, 1099 (1983) and 24, 4493 (1985)
 * (their ω_p, ω_τ in cm⁻¹ convert to Hz by f = c·ν̃).
 */
import type { Complex } from "../../core/complex.js";
import { cDiv } from "../../core/complex.js";
import { VACUUM_PERMITTIVITY, type DispersionModel, type DispersionParams } from "./dispersionModel.js";

/** −f_p²/(f² + iγf) (without ε∞). */
export function drudeTerm(plasmaHz: number, gammaHz: number, frequencyHz: number): Complex {
  return cDiv({ re: -plasmaHz * plasmaHz, im: 0 }, { re: frequencyHz * frequencyHz, im: gammaHz * frequencyHz });
}

/** DC conductivity σ = ε₀ ω_p²/Γ (S/m) of a Drude term with f_p, γ in Hz. */
export function drudeDcConductivity(plasmaHz: number, gammaHz: number): number {
  return (VACUUM_PERMITTIVITY * (2 * Math.PI * plasmaHz) ** 2) / (2 * Math.PI * gammaHz);
}

export const DRUDE_PARAMS = [
  { key: "eps_inf", required: true, description: "high-frequency permittivity ε∞" },
  { key: "plasma_hz", required: true, description: "plasma frequency f_p = ω_p/2π in Hz", sign: "positive" },
  { key: "gamma_hz", required: true, description: "collision rate γ = Γ/2π in Hz", sign: "nonnegative" },
] as const;

export const drude: DispersionModel = {
  id: "drude",
  description: "Drude metal ε∞ − f_p²/(f² + iγf)",
  params: DRUDE_PARAMS,
  evaluate(p: DispersionParams, f: number) {
    const d = drudeTerm(p.plasma_hz, p.gamma_hz, f);
    return { re: p.eps_inf + d.re, im: d.im };
  },
};
