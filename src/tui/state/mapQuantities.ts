/**
 * The per-cell quantities the Map screen can show, read from a plan: each target component, the
 * achieved value, the level, the errors and every flag that occurs. Pure selectors, memoised per
 * plan (a plan is never mutated).
 */
import { FLAGS } from "../../plan/flags.js";
import type { Plan } from "../../plan/planTypes.js";
import { formatPercent, formatValue } from "./formatValue.js";
import { CATEGORY_GLYPHS, continuousScaleOf, type BlockSummary, type MapScale } from "./heatMap.js";

export interface MapQuantity {
  id: string;
  label: string;
  /** one value per device cell; NaN = missing */
  values: ArrayLike<number>;
  scale: MapScale;
  summary: BlockSummary;
  missingLabel: string;
  /** how values print in the legend and status line */
  format: (v: number) => string;
}

/** "eps_z" → "ε_z", "mu_1" → "μ_1" for display. */
export function prettyComponent(name: string): string {
  return name.replace(/^eps/, "ε").replace(/^mu/, "μ");
}

const cache = new WeakMap<Plan, MapQuantity[]>();

/** Every quantity the map can show for this plan, in cycling order. */
export function mapQuantities(plan: Plan): MapQuantity[] {
  const hit = cache.get(plan);
  if (hit) return hit;
  const n = plan.grid.count;
  const out: MapQuantity[] = [];
  out.push({
    id: "relError",
    label: "error: built vs cell target",
    values: plan.relError,
    scale: continuousScaleOf(plan.relError),
    summary: "max",
    missingLabel: "no recipe",
    format: formatPercent,
  });
  const levelCount = plan.levels.length;
  out.push({
    id: "level",
    label: "level (recipe number)",
    format: (v) => String(Math.round(v) + 1),
    values: plan.level,
    scale:
      levelCount <= CATEGORY_GLYPHS.length
        ? { kind: "categorical", labels: plan.levels.map((l) => `level ${l.index}`) }
        : continuousScaleOf(plan.level),
    summary: levelCount <= CATEGORY_GLYPHS.length ? "mode" : "mean",
    missingLabel: "no level",
  });
  plan.components.forEach((comp, k) => {
    const pretty = prettyComponent(comp.name);
    out.push({
      id: `target:${comp.name}`,
      label: `target ${pretty}`,
      values: plan.targets[k],
      scale: continuousScaleOf(plan.targets[k]),
      summary: "mean",
      missingLabel: "no value",
      format: (v) => formatValue(v),
    });
    const achieved = new Float64Array(n);
    for (let c = 0; c < n; c++) {
      const recipe = plan.levels[plan.level[c]]?.recipe;
      achieved[c] = recipe ? recipe.achieved[k] : NaN;
    }
    out.push({
      id: `achieved:${comp.name}`,
      label: `built ${pretty} (recipe of the cell's level)`,
      values: achieved,
      scale: continuousScaleOf(achieved),
      summary: "mean",
      missingLabel: "no recipe",
      format: (v) => formatValue(v),
    });
  });
  out.push({
    id: "quantizationError",
    label: "error: level vs cell target",
    values: plan.quantizationError,
    scale: continuousScaleOf(plan.quantizationError),
    summary: "max",
    missingLabel: "no value",
    format: formatPercent,
  });
  FLAGS.forEach((flag, k) => {
    const bit = 1 << k;
    const values = new Float64Array(n);
    let any = false;
    for (let c = 0; c < n; c++) {
      if (plan.flags[c] & bit) {
        values[c] = 1;
        any = true;
      }
    }
    if (!any) return;
    out.push({
      id: `flag:${flag.name}`,
      label: `flag ${flag.name}: ${flag.meaning}`,
      values,
      scale: { kind: "categorical", labels: ["not flagged", flag.name], glyphs: ["·", "!"], colours: ["#6c7280", "#ff5f5f"] },
      summary: "max",
      missingLabel: "no value",
      format: (v) => (v > 0 ? "flagged" : "not flagged"),
    });
  });
  cache.set(plan, out);
  return out;
}

/** The quantity with this id, or the first one (the error map) when it does not exist in this plan. */
export function findQuantity(plan: Plan, id: string): MapQuantity {
  const all = mapQuantities(plan);
  return all.find((q) => q.id === id) ?? all[0];
}

/** Device cell with the largest value of a quantity (−1 when every value is missing). */
export function largestValueCell(values: ArrayLike<number>): number {
  let best = -1;
  let bestV = -Infinity;
  for (let c = 0; c < values.length; c++) {
    const v = values[c];
    if (Number.isFinite(v) && v > bestV) {
      bestV = v;
      best = c;
    }
  }
  return best;
}
