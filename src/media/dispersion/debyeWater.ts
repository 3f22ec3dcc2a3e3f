/**
 * Liquid water as a single Debye relaxation whose parameters follow the temperature T (°C):
 *   ε_s = 10^(1.94404 − 1.991·10⁻³ T), ε∞ = 5.77 − 2.74·10⁻² T,
 *   τ = 3.745·10⁻¹⁵ (1 + 7·10⁻⁵ (T − 27.5)²) exp(2295.7/(T + 273.15)) s.
 * At 25 °C: ε_s ≈ 78.4, τ ≈ 8.27 ps. Source: Kaatze, "Complex permittivity of water as a function
 * of frequency and temperature", J. Chem. Eng. Data 34, 371 (1989). Valid about 0–60 °C and up to
 * some tens of GHz (the single Debye term misses the faster relaxations above ~100 GHz).
 */
import { debyePermittivity } from "./debye.js";
import type { DispersionModel, DispersionParams } from "./dispersionModel.js";

export interface DebyeTerms {
  epsStatic: number;
  epsInf: number;
  tauS: number;
}

/** Kaatze (1989) Debye parameters of water at temperatureC (°C). */
export function waterDebyeTerms(temperatureC: number): DebyeTerms {
  return {
    epsStatic: 10 ** (1.94404 - 1.991e-3 * temperatureC),
    epsInf: 5.77 - 2.74e-2 * temperatureC,
    tauS: 3.745e-15 * (1 + 7e-5 * (temperatureC - 27.5) ** 2) * Math.exp(2295.7 / (temperatureC + 273.15)),
  };
}

export const debyeWater: DispersionModel = {
  id: "debye-water",
  description: "water: Debye relaxation with Kaatze's temperature fits (temperature_c)",
  params: [{ key: "temperature_c", required: true, description: "temperature in °C (0–60)" }],
  check: (p) => (p.temperature_c < 0 || p.temperature_c > 60 ? ["temperature_c must be within 0–60 °C (range of the fit)"] : []),
  evaluate(p: DispersionParams, f: number) {
    const t = waterDebyeTerms(p.temperature_c);
    return debyePermittivity(t.epsStatic, t.epsInf, t.tauS, f);
  },
};
