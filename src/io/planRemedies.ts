/**
 * The remedy search of a plan (plan/remedies.ts) wired to the world: re-plans the same design with
 * each candidate change (a new pitch recomputes the field, except for an imported field), under a
 * wall-clock budget. Shared by `cellwright plan` and the interactive session so both print the
 * same remedies. Each re-plan costs one plan of the design (0.1–2 s for the demos).
 */
import { computeTensorField } from "../field/computeTensorField.js";
import type { TensorField } from "../field/tensorField.js";
import { findRemedies, type RemedyResult } from "../plan/remedies.js";
import { evaluateMaterials, planFromField, type PlanCatalogs, type PlanDesign } from "../plan/runPlan.js";
import { refractiveIndex } from "../core/complex.js";
import type { Plan, PlanOverrides } from "../plan/planTypes.js";
import type { FieldDesign } from "../field/transformSpec.js";

/** Wall-clock budget of one remedy search, ms. */
export const REMEDY_BUDGET_MS = 20_000;

export function searchRemedies(
  plan: Plan, design: PlanDesign & FieldDesign, field: TensorField, catalogs: PlanCatalogs, overrides: PlanOverrides, budgetMs = REMEDY_BUDGET_MS,
): RemedyResult {
  const start = Date.now();
  // the catalog's materials at the design frequency, for "do without the densest material" (metals have no index here)
  const materials = evaluateMaterials(catalogs.materials, null, plan.design.frequencyHz)
    .filter((m) => !m.isMetal)
    .map((m) => ({ id: m.material.id, index: refractiveIndex(m.eps).re }))
    .filter((m) => Number.isFinite(m.index));
  return findRemedies(plan, (change) => {
    let f = field;
    if (change.pitchM !== null) {
      if (design.transform.kind === "imported") return null; // an imported field keeps its own grid
      f = computeTensorField({ ...design, grid: { ...design.grid, pitchM: change.pitchM } }, undefined, undefined, { derived: "lazy" });
    }
    return planFromField(design, f, catalogs, { ...overrides, ...change.overrides });
  }, () => Date.now() - start > budgetMs, { materials });
}
