/** The full record of one device cell, as the Map screen shows it beside the cursor. */
import { orientationPhrase } from "../../plan/outputs/orientationText.js";
import { flagNames, FLAGS } from "../../plan/flags.js";
import type { Plan } from "../../plan/planTypes.js";
import { formatLength, formatPercent, formatValue } from "./formatValue.js";
import { prettyComponent } from "./mapQuantities.js";
import { dimensionsText, recipeHeadline } from "./recipeText.js";

export interface CellRecordLine {
  label: string;
  value: string;
  /** drawn as a warning (flags, missing recipe) */
  warn?: boolean;
}

/** Every field of the cell's record: position, targets, level and recipe, errors, flags. */
export function cellRecord(plan: Plan, c: number): CellRecordLine[] {
  if (c < 0 || c >= plan.grid.count) return [{ label: "cell", value: "outside the device" }];
  const g = plan.grid;
  const lvl = plan.levels[plan.level[c]];
  const lines: CellRecordLine[] = [
    { label: "cell", value: `#${c + 1}, lattice (${g.i[c]}, ${g.j[c]})` },
    { label: "position", value: `x ${formatLength(g.xM[c])}, y ${formatLength(g.yM[c])}` },
  ];
  lines.push({ label: "", value: lvl?.recipe ? "target → built" : "target" });
  plan.components.forEach((comp, k) => {
    const built = lvl?.recipe ? ` → ${formatValue(lvl.recipe.achieved[k])}` : "";
    lines.push({ label: prettyComponent(comp.name), value: `${formatValue(plan.targets[k][c])}${built}` });
  });
  lines.push({ label: "axis", value: `${formatValue((plan.axisAngleRad[c] * 180) / Math.PI)}° from x` });
  if (lvl) {
    lines.push({ label: "level", value: `${lvl.index} of ${plan.levels.length}, region ${plan.regions[plan.region[c]]?.index ?? "—"}` });
    if (lvl.recipe) {
      lines.push({ label: "recipe", value: recipeHeadline(lvl.recipe) });
      const o = lvl.recipe.orientation;
      if (o !== null) {
        // the recipe's own axis for this cell: z, or an in-plane angle from +x
        const deg = (plan.axisAngleRad[c] * 180) / Math.PI + (o === "1" ? 90 : 0);
        const where = o === "z" ? "z" : `${formatValue(((deg + 90) % 180 + 180) % 180 - 90)}° from x`;
        lines.push({ label: "points", value: `${orientationPhrase(lvl.recipe).replace(/ along .*$/, "")} along ${where}` });
      }
      const dims = dimensionsText(lvl.recipe.dimensions);
      if (dims) lines.push({ label: "dimensions", value: dims });
    } else {
      lines.push({ label: "recipe", value: `none: ${lvl.reasons[0] ?? "nothing reaches the target"}`, warn: true });
    }
  }
  lines.push({ label: "built err", value: `${formatPercent(plan.relError[c])} vs target`, warn: !Number.isFinite(plan.relError[c]) });
  lines.push({ label: "level err", value: `${formatPercent(plan.quantizationError[c])} vs target` });
  const names = flagNames(plan.flags[c]);
  lines.push({ label: "flags", value: names.length ? names.join(", ") : "none", warn: names.length > 0 });
  return lines;
}

/** Meaning of a flag by name (for the legend line of a flag map). */
export function flagMeaning(name: string): string {
  return FLAGS.find((f) => f.name === name)?.meaning ?? "";
}
