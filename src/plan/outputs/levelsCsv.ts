/**
 * levels.csv: one row per level with its target, its recipe and up to three runners-up.
 * Columns: level, cells, regions, target_<c>…, max_quantization_error, family, host, inclusion,
 * lattice, orientation, fill_fraction, achieved_<c>…, rel_error, <dimension>_m…, loss_tangent, model_uncertainty,
 * bandwidth, smallest_feature_m, flags, reasons, runner_up_1, runner_up_2, runner_up_3, recipe_notes
 * (the chosen recipe's notes, e.g. where the solved cell replaced a closed form, joined by "; ").
 */
import { orientationCode } from "./orientationText.js";
import type { Plan, Recipe } from "../planTypes.js";
import { flagList } from "../flags.js";
import { csvField, fmt } from "./csvText.js";
import { dimensionColumns } from "./buildListRows.js";
import { designUnit, unitColumn } from "./designUnit.js";

export const RUNNERS_UP_SHOWN = 3;

/** "laminate PTFE/alumina-96 square f=0.312 err=0.4%" — one runner-up in one cell. */
export function recipeLabel(r: Recipe): string {
  const mats = r.inclusion ? `${r.host}/${r.inclusion}` : r.host;
  const along = r.orientation === null ? "" : ` along ${r.orientation}`;
  return `${r.family} ${mats} ${r.lattice}${r.aspect !== undefined ? ` ${Number(r.aspect.toPrecision(4))}` : ""}${along} f=${fmt(r.fillFraction, 3)} err=${r.relError < 1e-8 ? 0 : fmt(r.relError * 100, 2)}%`;
}

/** The whole levels.csv text (small: one row per level). */
export function levelsCsvText(plan: Plan): string {
  const dims = dimensionColumns(plan);
  const unit = designUnit(plan.design.wavelengthM);
  const comps = plan.components.map((c) => c.name);
  const header = [
    "level", "cells", "regions",
    ...comps.map((c) => `target_${c}`),
    "max_quantization_error", "family", "host", "inclusion", "lattice", "orientation", "fill_fraction",
    ...comps.map((c) => `achieved_${c}`),
    "rel_error", ...dims.map((d) => unitColumn(d, unit)), "loss_tangent", "model_uncertainty", "bandwidth", `smallest_feature_${unit.suffix}`,
    "flags", "reasons",
    ...Array.from({ length: RUNNERS_UP_SHOWN }, (_, k) => `runner_up_${k + 1}`),
    "recipe_notes",
  ];
  const regionsPerLevel = new Int32Array(plan.levels.length);
  for (const r of plan.regions) regionsPerLevel[r.level - 1]++;
  const lines = [header.join(",")];
  for (const lv of plan.levels) {
    const r = lv.recipe;
    const row: string[] = [String(lv.index), String(lv.cellCount), String(regionsPerLevel[lv.index - 1])];
    row.push(...lv.target.map((t) => fmt(t)));
    row.push(fmt(lv.maxQuantizationError, 4));
    if (r) {
      row.push(csvField(r.family), csvField(r.host), csvField(r.inclusion), r.lattice, orientationCode(r), fmt(r.fillFraction));
      row.push(...r.achieved.map((a) => fmt(a)));
      row.push(fmt(r.relError, 4));
      for (const d of dims) row.push(d in r.dimensions ? fmt(r.dimensions[d] * unit.perM) : "");
      row.push(fmt(r.lossTangent, 4), fmt(r.spread, 4), r.bandwidth === null ? "" : fmt(r.bandwidth, 4), fmt(r.featureM * unit.perM, 4));
    } else {
      row.push("", "", "", "", "", "", ...comps.map(() => ""), "", ...dims.map(() => ""), "", "", "", "");
    }
    row.push([flagList(lv.flags), ...(lv.unresolvable ? ["unresolvable"] : [])].filter(Boolean).join(";"), csvField(lv.reasons.join("; ")));
    for (let k = 0; k < RUNNERS_UP_SHOWN; k++) row.push(lv.runnersUp[k] ? csvField(recipeLabel(lv.runnersUp[k])) : "");
    row.push(r ? csvField(r.notes.join("; ")) : "");
    lines.push(row.join(","));
  }
  return lines.join("\n") + "\n";
}
