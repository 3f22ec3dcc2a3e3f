/**
 * The bulk materials the realized-geometry case draws with, at the design frequency: every catalog
 * material evaluated by its dispersion model (the values the planner matched with), the layer's core
 * replaced by its guided-mode value when the plan declares a layer (realization.layer), and
 * `vacuum` (ε = μ = 1, an empty cell or hole). bulkMaterialsAt gives them at another frequency
 * (the frequency sweep: the geometry stays as planned, the materials and the layer's guided mode
 * are evaluated at f, as recipeAtFrequency.ts does for the homogenized map).
 */
import { evaluateMaterial, type Material } from "../media/material.js";
import type { Plan } from "../plan/planTypes.js";
import { layerFor } from "../plan/runPlan.js";
import type { BulkMaterial } from "./geometryScene.js";

export function bulkMaterials(catalog: readonly Material[], frequencyHz: number, plan: Pick<Plan, "settings" | "layer">): Map<string, BulkMaterial> {
  const out = new Map<string, BulkMaterial>();
  out.set("vacuum", { eps: { re: 1, im: 0 }, mu: { re: 1, im: 0 }, isMetal: false });
  for (const m of catalog) {
    const v = evaluateMaterial(m, frequencyHz);
    if (!Number.isFinite(v.eps.re) || !Number.isFinite(v.eps.im)) continue;
    out.set(m.id, { eps: v.eps, mu: v.mu, isMetal: m.class === "metal" });
  }
  const layer = plan.settings.layer;
  if (layer && plan.layer) {
    const core = out.get(layer.coreId);
    if (core) out.set(layer.coreId, { ...core, eps: plan.layer.coreEps });
  }
  return out;
}

/** The bulk materials at `frequencyHz` for a plan made at another frequency: the layer's mode re-solved at f (runPlan.ts layerFor). */
export function bulkMaterialsAt(catalog: readonly Material[], frequencyHz: number, plan: Pick<Plan, "settings" | "layer">): Map<string, BulkMaterial> {
  const l = plan.settings.layer;
  return bulkMaterials(catalog, frequencyHz, { settings: plan.settings, layer: l && plan.layer ? layerFor(l, plan.settings.polarization, catalog, frequencyHz) : null });
}
