/**
 * The remedy search of a plan (plan/remedies.ts) wired to the world: re-plans the same design with
 * each candidate change (a new pitch recomputes the field, except for an imported field; another
 * background material edits the design's two keys), under a wall-clock budget. Every re-plan first
 * checks the design's background material as `plan` does, so a change `plan` would refuse is never
 * offered. Shared by `cellwright plan` and the interactive session so both print the same remedies.
 * Each re-plan costs one plan of the design (0.1–2 s for the demos).
 */
import { computeTensorField } from "../field/computeTensorField.js";
import type { TensorField } from "../field/tensorField.js";
import { findRemedies, type RemedyContext, type RemedyResult } from "../plan/remedies.js";
import { evaluateMaterials, planFromField, type PlanCatalogs, type PlanDesign } from "../plan/runPlan.js";
import { refractiveIndex } from "../core/complex.js";
import type { Plan, PlanOverrides } from "../plan/planTypes.js";
import type { FieldDesign } from "../field/transformSpec.js";
import type { Design } from "./design/designSchema.js";
import { givenBackgroundIndex } from "../plan/resolveSettings.js";
import { backgroundMaterialChoices, checkBackgroundMaterialBeforeReduction } from "../verify/sweep/backgroundAtFrequency.js";

/** Wall-clock budget of one remedy search, ms. */
export const REMEDY_BUDGET_MS = 20_000;

export function searchRemedies(
  plan: Plan, design: PlanDesign & FieldDesign & Pick<Design, "sourcePath" | "background" | "reduction">, field: TensorField, catalogs: PlanCatalogs, overrides: PlanOverrides, budgetMs = REMEDY_BUDGET_MS,
): RemedyResult {
  const start = Date.now();
  // the catalog's materials at the design frequency, for "do without the densest material" (metals have no index here)
  const materials = evaluateMaterials(catalogs.materials, null, plan.design.frequencyHz)
    .filter((m) => !m.isMetal)
    .map((m) => ({ id: m.material.id, index: refractiveIndex(m.eps).re }))
    .filter((m) => Number.isFinite(m.index));
  const context: RemedyContext = { materials };
  const backgroundId = design.reduction?.backgroundMaterial;
  if (backgroundId !== undefined) context.background = { materialId: backgroundId, choices: backgroundMaterialChoices(catalogs.materials, design.frequencyHz) };
  return findRemedies(plan, (change) => {
    let f = field;
    if (change.pitchM !== null) {
      if (design.transform.kind === "imported") return null; // an imported field keeps its own grid
      f = computeTensorField({ ...design, grid: { ...design.grid, pitchM: change.pitchM } }, undefined, undefined, { derived: "lazy" });
    }
    // (only a design that names its background material gets such a change, so its reduction key exists)
    const d = change.design && design.reduction ? { ...design, reduction: { ...design.reduction, ...change.design } } : design;
    const o = { ...overrides, ...change.overrides };
    // refused as `plan` refuses it (InputError: the change is not offered)
    checkBackgroundMaterialBeforeReduction(d, o.backgroundIndex !== undefined, catalogs.materials, givenBackgroundIndex(d, o));
    return planFromField(d, f, catalogs, o);
  }, () => Date.now() - start > budgetMs, context);
}
