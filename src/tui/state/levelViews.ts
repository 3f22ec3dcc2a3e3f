/** Rows of the Levels screen and the detail of the selected level. Pure selectors over a plan. */
import { flagNames } from "../../plan/flags.js";
import type { Plan } from "../../plan/planTypes.js";
import { formatPercent, formatValue } from "./formatValue.js";
import { prettyComponent } from "./mapQuantities.js";
import { recipeHeadline, recipeLines } from "./recipeText.js";

export interface LevelRow {
  /** 1-based level number */
  index: number;
  cells: number;
  /** target of each component, formatted */
  target: string;
  recipe: string;
  /** error of the recipe against the level's target (complex: its loss counts) */
  error: string;
  /** largest quantization error of the level's cells (level target against cell target) */
  quantization: string;
  runnersUp: number;
  flags: string;
  buildable: boolean;
}

/** Table columns, with the width each takes (the recipe column takes the rest). */
export const LEVEL_COLUMNS = [
  { title: "lvl", width: 4 },
  { title: "cells", width: 6 },
  { title: "target", width: 18 },
  { title: "error", width: 8 },
  { title: "alt", width: 4 },
  { title: "recipe", width: 0 },
] as const;

export function levelRows(plan: Plan): LevelRow[] {
  return plan.levels.map((l) => ({
    index: l.index,
    cells: l.cellCount,
    target: l.target.map((v) => formatValue(v)).join(" "),
    recipe: l.recipe ? recipeHeadline(l.recipe) : `no recipe: ${l.reasons[0] ?? "nothing reaches the target"}`,
    error: l.recipe ? formatPercent(l.recipe.relError) : "—",
    quantization: formatPercent(l.maxQuantizationError),
    runnersUp: l.runnersUp.length,
    flags: flagNames(l.flags).join(" "),
    buildable: l.recipe !== null,
  }));
}

/** Every line about one level: target, recipe, why it won, the runners-up. */
export function levelDetail(plan: Plan, levelIndex0: number): string[] {
  const l = plan.levels[levelIndex0];
  if (!l) return [];
  const names = plan.components.map((c) => prettyComponent(c.name));
  const lines = [
    `level ${l.index}: ${l.cellCount} cells, target ${names.map((n, k) => `${n} ${formatValue(l.target[k])}`).join(", ")}`,
    `largest quantization error of its cells ${formatPercent(l.maxQuantizationError)}`,
  ];
  if (l.flags) lines.push(`flags: ${flagNames(l.flags).join(", ")}`);
  if (l.recipe) {
    lines.push("recipe:");
    for (const s of recipeLines(l.recipe, names)) lines.push(`  ${s}`);
  } else {
    lines.push("no recipe:");
    for (const r of l.reasons) lines.push(`  ${r}`);
  }
  if (l.runnersUp.length) {
    lines.push(`runners-up (${l.runnersUp.length}):`);
    l.runnersUp.forEach((r, k) => lines.push(`  ${k + 1}. ${recipeHeadline(r)} — error ${formatPercent(r.relError)}, score ${formatValue(r.score)}`));
  } else {
    lines.push("no runners-up");
  }
  return lines;
}

/** The cell of a level nearest the centroid of its cells (where Enter puts the map cursor), −1 if none. */
export function levelCentreCell(plan: Plan, levelIndex0: number): number {
  let si = 0;
  let sj = 0;
  let n = 0;
  const { i, j, count } = plan.grid;
  for (let c = 0; c < count; c++) {
    if (plan.level[c] !== levelIndex0) continue;
    si += i[c];
    sj += j[c];
    n++;
  }
  if (n === 0) return -1;
  const ci = si / n;
  const cj = sj / n;
  let best = -1;
  let bestD = Infinity;
  for (let c = 0; c < count; c++) {
    if (plan.level[c] !== levelIndex0) continue;
    const d = (i[c] - ci) ** 2 + (j[c] - cj) ** 2;
    if (d < bestD) {
      bestD = d;
      best = c;
    }
  }
  return best;
}

/**
 * The verdict's missed requirements and the "what would help" panel (remedies tried by
 * re-planning, best first), as lines for the Levels screen; empty when the plan is buildable.
 */
export function verdictLines(plan: Plan): string[] {
  if (plan.verdict.buildable) return [];
  // the remedies come first: the summary line already names what was missed, and at 24 rows the
  // detail pane is short — what the user can do about it must not fall below the screen
  const out: string[] = [];
  const r = plan.remedies;
  if (r === null) out.push("what would help: not searched yet");
  else if (r.remedies.length === 0) out.push(`what would help: none of ${r.tried} changes tried improves the plan`);
  else {
    out.push(`what would help (tried by re-planning; ${r.tried} tried; key w applies one):`);
    r.remedies.forEach((x, k) => out.push(`  ${k + 1}. ${x.label}${x.buildable ? " (buildable)" : ""}: ${x.changes}`));
  }
  for (const n of r?.notes ?? []) out.push(`  note: ${n}`);
  for (const m of plan.verdict.missed) out.push(`missed ${m.what}: ${m.text}`);
  out.push("");
  return out;
}
