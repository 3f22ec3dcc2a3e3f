/**
 * The build list: one CSV row per device cell. This file makes the text in chunks (pure); the
 * writer in io/buildListCsv.ts streams the chunks to disk, so a 10⁶-cell plan never holds the
 * whole text in memory.
 *
 * Columns: cell, i, j, [k,] x_<u>, y_<u>, [z_<u>,] axis_deg, region, level, target_<c>…,
 * achieved_<c>…, rel_error, quantization_error, zero_target_abs_error, family, host, inclusion,
 * lattice, orientation, fill_fraction, <dimension>_<u>…, loss_tangent, flags — <u> the design's
 * length unit (designUnit.ts: um for optical work, mm otherwise), numbers to 6 significant digits.
 * Per-level columns (recipe, achieved values) are formatted once per level.
 */
import { designUnit, unitColumn } from "./designUnit.js";
import { orientationCode } from "./orientationText.js";
import type { Plan } from "../planTypes.js";
import { flagList } from "../flags.js";
import { csvField, fmt } from "./csvText.js";

/** Dimension keys (metres, "radius_m") used by any level's recipe, sorted by name. */
export function dimensionColumns(plan: Plan): string[] {
  const set = new Set<string>();
  for (const lv of plan.levels) if (lv.recipe) for (const k of Object.keys(lv.recipe.dimensions)) set.add(k);
  return [...set].sort();
}

/** The header row (without the line break). */
export function buildListHeader(plan: Plan): string {
  const three = plan.grid.dimension === 3;
  const u = designUnit(plan.design.wavelengthM).suffix;
  const cols = ["cell", "i", "j", ...(three ? ["k"] : []), `x_${u}`, `y_${u}`, ...(three ? [`z_${u}`] : []), "axis_deg", "region", "level"];
  for (const c of plan.components) cols.push(`target_${c.name}`);
  for (const c of plan.components) cols.push(`achieved_${c.name}`);
  cols.push("rel_error", "quantization_error", "zero_target_abs_error", "family", "host", "inclusion", "lattice", "orientation", "fill_fraction");
  cols.push(...dimensionColumns(plan).map((d) => unitColumn(d, designUnit(plan.design.wavelengthM))));
  cols.push("loss_tangent", "flags");
  return cols.join(",");
}

/** Per-level text: the achieved values (",a,b,c") and the recipe columns after the errors. */
function levelTexts(plan: Plan): { achieved: string[]; recipe: string[] } {
  const dims = dimensionColumns(plan);
  const perM = designUnit(plan.design.wavelengthM).perM;
  const achieved: string[] = [];
  const recipe: string[] = [];
  for (const lv of plan.levels) {
    const r = lv.recipe;
    achieved.push(plan.components.map((_, c) => `,${r ? fmt(r.achieved[c]) : ""}`).join(""));
    if (r) {
      const parts = [r.family, r.host, r.inclusion, r.lattice, orientationCode(r)].map(csvField);
      parts.push(fmt(r.fillFraction));
      for (const d of dims) parts.push(d in r.dimensions ? fmt(r.dimensions[d] * perM) : "");
      parts.push(fmt(r.lossTangent, 4));
      recipe.push(`,${parts.join(",")}`);
    } else {
      recipe.push(",".repeat(6 + dims.length + 1));
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
  chunkRows = 2048,
): Promise<void> {
  const g = plan.grid;
  const three = g.dimension === 3;
  await emit(`${buildListHeader(plan)}\n`);
  // positions depend on one lattice index each: format them once per index
  const perM = designUnit(plan.design.wavelengthM).perM;
  const xs = Array.from({ length: g.nx }, (_, i) => fmt((g.originXM + i * g.pitchM) * perM));
  const ys = Array.from({ length: g.ny }, (_, j) => fmt((g.originYM + j * g.pitchM) * perM));
  const zs = three ? Array.from({ length: g.nz }, (_, k) => fmt((g.originZM + k * g.pitchM) * perM)) : [];
  const { achieved, recipe } = levelTexts(plan);
  const m = plan.components.length;
  const noAchieved = ",".repeat(m);
  const noRecipe = ",".repeat(6 + dimensionColumns(plan).length + 1);
  // repeated values (constant components, isotropic axes, neighbouring cells) reuse their text
  const lastV = new Float64Array(m + 3).fill(NaN);
  const lastS: string[] = new Array(m + 3).fill("");
  const num = (col: number, v: number, digits: number): string => {
    if (v === lastV[col]) return lastS[col];
    const t = fmt(v, digits);
    lastV[col] = v;
    lastS[col] = t;
    return t;
  };
  const is = Array.from({ length: g.nx }, (_, i) => String(i));
  const js = Array.from({ length: g.ny }, (_, j) => String(j));
  const ks = Array.from({ length: g.nz }, (_, k) => String(k));
  const degPerRad = 180 / Math.PI;
  let chunk = "";
  let rows = 0;
  for (let c = 0; c < g.count; c++) {
    const lv = plan.level[c];
    const gi = g.i[c], gj = g.j[c];
    let row = `${c + 1},${is[gi]},${js[gj]},`;
    if (three) row += `${ks[g.k[c]]},`;
    row += `${xs[gi]},${ys[gj]},`;
    if (three) row += `${zs[g.k[c]]},`;
    row += `${num(0, plan.axisAngleRad[c] * degPerRad, 4)},${plan.region[c] + 1},${lv >= 0 ? lv + 1 : ""}`;
    for (let k = 0; k < m; k++) row += `,${num(3 + k, plan.targets[k][c], 6)}`;
    row += lv >= 0 ? achieved[lv] : noAchieved;
    row += `,${num(1, plan.relError[c], 4)},${num(2, plan.quantizationError[c], 4)},${fmt(plan.zeroTargetAbsError[c], 4)}`;
    row += lv >= 0 ? recipe[lv] : noRecipe;
    row += `,${flagList(plan.flags[c])}\n`;
    chunk += row;
    if (++rows === chunkRows) {
      await emit(chunk);
      chunk = "";
      rows = 0;
    }
  }
  if (chunk) await emit(chunk);
}
