/**
 * The build list: one CSV row per device cell. This file makes the text in chunks (pure); the
 * writer in io/buildListCsv.ts streams the chunks to disk, so a 10⁶-cell plan never holds the
 * whole text in memory.
 *
 * Columns: cell, i, j, [k,] x_m, y_m, [z_m,] axis_deg, region, level, target_<c>…, achieved_<c>…,
 * rel_error, quantization_error, family, host, inclusion, lattice, fill_fraction, <dimension>_m…,
 * loss_tangent, flags. Per-level columns (recipe, achieved values) are formatted once per level.
 */
import type { Plan } from "../planTypes.js";
import { flagList } from "../flags.js";
import { csvField, fmt } from "./csvText.js";

/** Dimension columns used by any level's recipe, sorted by name. */
export function dimensionColumns(plan: Plan): string[] {
  const set = new Set<string>();
  for (const lv of plan.levels) if (lv.recipe) for (const k of Object.keys(lv.recipe.dimensions)) set.add(k);
  return [...set].sort();
}

/** The header row (without the line break). */
export function buildListHeader(plan: Plan): string {
  const three = plan.grid.dimension === 3;
  const cols = ["cell", "i", "j", ...(three ? ["k"] : []), "x_m", "y_m", ...(three ? ["z_m"] : []), "axis_deg", "region", "level"];
  for (const c of plan.components) cols.push(`target_${c.name}`);
  for (const c of plan.components) cols.push(`achieved_${c.name}`);
  cols.push("rel_error", "quantization_error", "family", "host", "inclusion", "lattice", "fill_fraction");
  cols.push(...dimensionColumns(plan));
  cols.push("loss_tangent", "flags");
  return cols.join(",");
}

/** Per-level text: the achieved values (",a,b,c") and the recipe columns after the errors. */
function levelTexts(plan: Plan): { achieved: string[]; recipe: string[] } {
  const dims = dimensionColumns(plan);
  const achieved: string[] = [];
  const recipe: string[] = [];
  for (const lv of plan.levels) {
    const r = lv.recipe;
    achieved.push(plan.components.map((_, c) => `,${r ? fmt(r.achieved[c]) : ""}`).join(""));
    if (r) {
      const parts = [r.family, r.host, r.inclusion, r.lattice].map(csvField);
      parts.push(fmt(r.fillFraction));
      for (const d of dims) parts.push(d in r.dimensions ? fmt(r.dimensions[d]) : "");
      parts.push(fmt(r.lossTangent, 4));
      recipe.push(`,${parts.join(",")}`);
    } else {
      recipe.push(",".repeat(5 + dims.length + 1));
    }
  }
  return { achieved, recipe };
}

/**
 * Calls `emit` with successive chunks of rows (each ending in a line break), `chunkRows` rows at
 * a time; awaits `emit` so a stream's back-pressure is respected. The header comes first.
 */
export async function emitBuildList(
  plan: Plan,
  emit: (chunk: string) => Promise<void> | void,
  chunkRows = 4096,
): Promise<void> {
  const g = plan.grid;
  const three = g.dimension === 3;
  await emit(`${buildListHeader(plan)}\n`);
  // positions depend on one lattice index each: format them once per index
  const xs = Array.from({ length: g.nx }, (_, i) => fmt(g.originXM + i * g.pitchM, 8));
  const ys = Array.from({ length: g.ny }, (_, j) => fmt(g.originYM + j * g.pitchM, 8));
  const zs = three ? Array.from({ length: g.nz }, (_, k) => fmt(g.originZM + k * g.pitchM, 8)) : [];
  const { achieved, recipe } = levelTexts(plan);
  const m = plan.components.length;
  const noAchieved = ",".repeat(m);
  const noRecipe = ",".repeat(5 + dimensionColumns(plan).length + 1);
  const lines: string[] = [];
  for (let c = 0; c < g.count; c++) {
    const lv = plan.level[c];
    let row = `${c + 1},${g.i[c]},${g.j[c]},`;
    if (three) row += `${g.k[c]},`;
    row += `${xs[g.i[c]]},${ys[g.j[c]]},`;
    if (three) row += `${zs[g.k[c]]},`;
    row += `${fmt((plan.axisAngleRad[c] * 180) / Math.PI, 4)},${plan.region[c] + 1},${lv >= 0 ? lv + 1 : ""}`;
    for (let k = 0; k < m; k++) row += `,${fmt(plan.targets[k][c])}`;
    row += lv >= 0 ? achieved[lv] : noAchieved;
    row += `,${fmt(plan.relError[c], 4)},${fmt(plan.quantizationError[c], 4)}`;
    row += lv >= 0 ? recipe[lv] : noRecipe;
    row += `,${flagList(plan.flags[c])}\n`;
    lines.push(row);
    if (lines.length === chunkRows) {
      await emit(lines.join(""));
      lines.length = 0;
    }
  }
  if (lines.length) await emit(lines.join(""));
}
