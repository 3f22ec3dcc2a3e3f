/**
 * One plan of the interactive session, the same on the worker thread and on the session's own:
 * the design's background material checked as `cellwright plan` checks it (against the background
 * index of these choices, same message), then the plan, then the remedies when it misses a
 * requirement — so what the session shows and exports is what `plan` gives, refusals included.
 */
import type { Design } from "../io/design/designSchema.js";
import { searchRemedies } from "../io/planRemedies.js";
import type { Material } from "../media/material.js";
import type { Plan, PlanOverrides, PlanProgress } from "../plan/planTypes.js";
import { givenBackgroundIndex } from "../plan/resolveSettings.js";
import { planFromField } from "../plan/runPlan.js";
import { checkBackgroundMaterialBeforeReduction } from "../verify/sweep/backgroundAtFrequency.js";
import type { PlanInputs } from "./planInputs.js";

/**
 * `reduction.backgroundMaterial` against the index the plan of `overrides` reduces with; an
 * overriding index comes from the session file (`sessionPath`), and is named there. Throws InputError.
 */
export function checkSessionBackground(design: Design, materials: readonly Material[], overrides: PlanOverrides, sessionPath: string): void {
  const overridden = overrides.backgroundIndex !== undefined && `${sessionPath}: $.overrides.backgroundIndex`;
  checkBackgroundMaterialBeforeReduction(design, overridden, materials, givenBackgroundIndex(design, overrides));
}

/** Check, plan and (when not buildable) try the remedies. Throws InputError as `plan` would. */
export function planSession(inputs: PlanInputs, overrides: PlanOverrides, sessionPath: string, onProgress?: PlanProgress): Plan {
  const { design, field, catalogs } = inputs;
  checkSessionBackground(design, catalogs.materials, overrides, sessionPath);
  const plan = planFromField(design, field, catalogs, overrides, onProgress);
  // remedies are tried here too (off the session's thread in the worker), so export writes what `plan` writes
  if (!plan.verdict.buildable) plan.remedies = searchRemedies(plan, design, field, catalogs, overrides);
  return plan;
}
