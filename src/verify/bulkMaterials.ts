/**
 * The bulk materials the realized-geometry case draws with, at the design frequency: every catalog
 * material evaluated by its dispersion model (the values the planner matched with), the layer's core
 * replaced by its guided-mode value when the plan declares a layer (realization.layer), and
 * `vacuum` (ε = μ = 1, an empty cell or hole).
 */
import { evaluateMaterial, type Material } from "../media/material.js";
import type { Plan } from "../plan/planTypes.js";
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
