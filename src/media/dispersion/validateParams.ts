/**
 * Check a parameter record against a dispersion model's specs: known keys only (with a
 * suggestion for a misspelt one), required keys present, signs respected, the model's own checks,
 * and finite, passive values (Im ε ≥ 0) at a few frequencies across the valid range.
 */
import { closest } from "../../core/errors.js";
import type { DispersionModel, DispersionParams, ParamSpec } from "./dispersionModel.js";

function specPattern(spec: ParamSpec): RegExp {
  const escaped = spec.key.replace(/[.*+?^${}()|[\]\\]/g, "\\$&").replace("N", "\\d+");
  return new RegExp(`^${escaped}$`);
}

/** The spec a key belongs to, or undefined. */
export function specFor(model: DispersionModel, key: string): ParamSpec | undefined {
  return model.params.find((s) => specPattern(s).test(key));
}

/** Problems with a parameter record, as short messages keyed by parameter name ("" = whole row). */
export function validateDispersionParams(model: DispersionModel, params: DispersionParams): { key: string; message: string }[] {
  const issues: { key: string; message: string }[] = [];
  for (const [key, value] of Object.entries(params)) {
    const spec = specFor(model, key);
    if (!spec) {
      const near = closest(key, model.params.map((s) => s.key), 2);
      issues.push({ key, message: `unknown parameter '${key}' for model ${model.id}${near.length ? `; did you mean ${near.join(", ")}?` : ""}` });
      continue;
    }
    if (!Number.isFinite(value)) issues.push({ key, message: `${key} must be a finite number` });
    else if (spec.sign === "positive" && !(value > 0)) issues.push({ key, message: `${key} must be > 0, got ${value}` });
    else if (spec.sign === "nonnegative" && !(value >= 0)) issues.push({ key, message: `${key} must be ≥ 0, got ${value}` });
  }
  for (const spec of model.params) {
    if (spec.required && params[spec.key] === undefined) issues.push({ key: spec.key, message: `model ${model.id} needs ${spec.key} (${spec.description})` });
  }
  if (issues.length === 0 && model.check) for (const m of model.check(params)) issues.push({ key: "", message: m });
  return issues;
}

/**
 * Frequencies spread log-uniformly over [minHz, maxHz] (both ends included), for spot checks.
 * `count` ≥ 2.
 */
export function logSpacedFrequencies(minHz: number, maxHz: number, count: number): number[] {
  const a = Math.log(minHz);
  const b = Math.log(maxHz);
  return Array.from({ length: count }, (_, k) => Math.exp(a + ((b - a) * k) / (count - 1)));
}

/** Messages when the model is not finite or not passive (Im ε < 0) somewhere in the range. */
export function checkModelInRange(model: DispersionModel, params: DispersionParams, minHz: number, maxHz: number): string[] {
  for (const f of logSpacedFrequencies(minHz, maxHz, 25)) {
    const eps = model.evaluate(params, f);
    if (!Number.isFinite(eps.re) || !Number.isFinite(eps.im)) return [`model ${model.id} is not finite at ${f.toPrecision(4)} Hz inside the valid range`];
    if (eps.im < -1e-12 * Math.max(1, Math.abs(eps.re))) return [`model ${model.id} is active (Im ε < 0) at ${f.toPrecision(4)} Hz`];
  }
  return [];
}
