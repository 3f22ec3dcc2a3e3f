/**
 * A catalog material: a dispersion model with its parameters, the band where the model holds,
 * and where the numbers come from. Evaluation is pure.
 */
import { cAbs, type Complex, ONE, refractiveIndex } from "../core/complex.js";
import { ProgrammerError } from "../core/errors.js";
import type { DispersionModelId, DispersionParams } from "./dispersion/dispersionModel.js";
import { DISPERSION_MODELS } from "./dispersion/registry.js";

/** Material classes, as in the catalog's `class` column (cells and processes match on these words). */
export const MATERIAL_CLASSES = ["polymer", "resin", "laminate", "glass", "ceramic", "semiconductor", "metal", "liquid", "gas"] as const;
export type MaterialClass = (typeof MATERIAL_CLASSES)[number];

export interface Material {
  /** short lower-case id: "ptfe", "alumina-96" */
  id: string;
  /** generic name: "PTFE", "alumina 96 %" */
  name: string;
  class: MaterialClass;
  model: DispersionModelId;
  /** model parameters with SI names (see src/media/dispersion/) */
  params: DispersionParams;
  /** band where the model and its numbers hold, Hz */
  validMinHz: number;
  validMaxHz: number;
  /** publication, handbook, "common practice" or "from memory" */
  source: string;
  /** relative permeability (1 when absent) */
  mu?: Complex;
  /** DC conductivity in S/m (metals; for wire and ring losses), when known */
  conductivitySPerM?: number;
}

export interface MaterialValue {
  eps: Complex;
  mu: Complex;
  /** ε''/|ε'| (= ε''/ε' for ε' > 0; kept non-negative for metals, where ε' < 0) */
  lossTangent: number;
  /** n = sqrt(εμ), Im n ≥ 0 */
  n: Complex;
  /** frequency inside [validMinHz, validMaxHz] */
  inRange: boolean;
  /** why the value should not be trusted (outside the valid range, not finite) */
  warning?: string;
}

function formatHz(hz: number): string {
  const units: [number, string][] = [[1e15, "PHz"], [1e12, "THz"], [1e9, "GHz"], [1e6, "MHz"], [1e3, "kHz"]];
  for (const [s, u] of units) if (Math.abs(hz) >= s) return `${Number((hz / s).toPrecision(4))} ${u}`;
  return `${Number(hz.toPrecision(4))} Hz`;
}

/**
 * ε, μ, tan δ and n of a material at frequencyHz (> 0, finite). Outside the model's valid range
 * the value is still computed but `inRange` is false and `warning` says so; a non-finite model
 * value (at a Sellmeier pole, say) also comes with a warning.
 * Throws ProgrammerError for a non-positive or non-finite frequency (validate at the edge).
 */
export function evaluateMaterial(m: Material, frequencyHz: number): MaterialValue {
  if (!(frequencyHz > 0) || !Number.isFinite(frequencyHz)) {
    throw new ProgrammerError("evaluateMaterial needs a finite frequency > 0", { frequencyHz });
  }
  const eps = DISPERSION_MODELS[m.model].evaluate(m.params, frequencyHz);
  const mu = m.mu ?? ONE;
  const n = refractiveIndex(eps, mu);
  const lossTangent = eps.re === 0 ? Infinity : eps.im / Math.abs(eps.re);
  const inRange = frequencyHz >= m.validMinHz && frequencyHz <= m.validMaxHz;
  const warnings: string[] = [];
  if (!inRange) {
    warnings.push(`${m.id}: ${formatHz(frequencyHz)} is outside the valid range ${formatHz(m.validMinHz)} – ${formatHz(m.validMaxHz)} of its ${m.model} model`);
  }
  if (!Number.isFinite(cAbs(eps))) warnings.push(`${m.id}: the ${m.model} model is not finite at ${formatHz(frequencyHz)}`);
  return { eps, mu, lossTangent, n, inRange, ...(warnings.length ? { warning: warnings.join("; ") } : {}) };
}
