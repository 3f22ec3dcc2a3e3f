/**
 * Sellmeier refractive index of a transparent material, λ in µm:
 *   n² = A + Σ_k B_k λ²/(λ² − C_k) + D/λ²,  ε = n² (real: the model is lossless).
 * A = 1 and D = 0 give the classic form (Malitson 1965 for fused silica); A ≠ 1 and D ≠ 0 cover
 * the form Edwards (1980) used for silicon. Valid only inside the fitted transparent window.
 * Sources: Malitson, JOSA 55, 1205 (1965); Edwards, in Palik, "Handbook of Optical Constants of
 * Solids" (1985), after Salzberg & Villa, JOSA 47, 244 (1957).
 */
import type { Complex } from "../../core/complex.js";
import { SPEED_OF_LIGHT, type DispersionModel, type DispersionParams } from "./dispersionModel.js";

/** Vacuum wavelength in µm of a frequency in Hz. */
export const wavelengthUm = (frequencyHz: number): number => (SPEED_OF_LIGHT / frequencyHz) * 1e6;

/** Terms (B_k, C_k in µm²) of a parameter record (b1, c1_um2, b2, c2_um2, …). */
export function sellmeierTerms(params: DispersionParams): { b: number; cUm2: number }[] {
  const out: { b: number; cUm2: number }[] = [];
  for (let k = 1; params[`b${k}`] !== undefined; k++) out.push({ b: params[`b${k}`], cUm2: params[`c${k}_um2`] });
  return out;
}

/** n² at wavelength λ (µm). */
export function sellmeierIndexSquared(params: DispersionParams, lambdaUm: number): number {
  const l2 = lambdaUm * lambdaUm;
  let n2 = params.a ?? 1;
  for (const t of sellmeierTerms(params)) n2 += (t.b * l2) / (l2 - t.cUm2);
  if (params.d_um2 !== undefined) n2 += params.d_um2 / l2;
  return n2;
}

export const sellmeier: DispersionModel = {
  id: "sellmeier",
  description: "Sellmeier n² = A + Σ B λ²/(λ² − C) + D/λ² (λ in µm, lossless)",
  params: [
    { key: "a", required: false, description: "constant term A (default 1)" },
    { key: "bN", required: false, description: "strength B of term N" },
    { key: "cN_um2", required: false, description: "resonance C of term N in µm² (λ_N²)", sign: "nonnegative" },
    { key: "d_um2", required: false, description: "coefficient D of a λ⁻² term, µm²" },
  ],
  check(p) {
    const issues: string[] = [];
    const numbers = Object.keys(p)
      .map((k) => /^b(\d+)$/.exec(k) ?? /^c(\d+)_um2$/.exec(k))
      .filter((m): m is RegExpExecArray => m !== null)
      .map((m) => Number(m[1]));
    const max = numbers.length ? Math.max(...numbers) : 0;
    if (max === 0) issues.push("expected at least one term (b1, c1_um2)");
    for (let k = 1; k <= max; k++) {
      if (p[`b${k}`] === undefined) issues.push(`term ${k} needs b${k} (terms numbered 1, 2, … without gaps)`);
      if (p[`c${k}_um2`] === undefined) issues.push(`term ${k} needs c${k}_um2 (terms numbered 1, 2, … without gaps)`);
    }
    return issues;
  },
  evaluate: (p: DispersionParams, f: number): Complex => ({ re: sellmeierIndexSquared(p, wavelengthUm(f)), im: 0 }),
};
