/**
 * One-line and multi-line descriptions of a recipe (family, materials, fill, dimensions) for the
 * Levels screen and the cell record.
 */
import type { Recipe } from "../../plan/planTypes.js";
import { formatLength, formatPercent, formatValue } from "./formatValue.js";
import { orientationPhrase } from "../../plan/outputs/orientationText.js";

/** "radius_m" → "radius". */
export function dimensionName(key: string): string {
  return key.replace(/_m$/, "").replace(/_/g, " ");
}

/** Dimensions as "radius 1.20 mm, wall 0.300 mm" (keys ending in _m are lengths). */
export function dimensionsText(dimensions: Record<string, number>): string {
  return Object.entries(dimensions)
    .map(([k, v]) => `${dimensionName(k)} ${k.endsWith("_m") ? formatLength(v) : formatValue(v)}`)
    .join(", ");
}

/** "rods-in-host: alumina-96 in ptfe, square, fill 32.0 %" */
export function recipeHeadline(r: Recipe): string {
  const materials = r.inclusion ? `${r.inclusion} in ${r.host}` : r.host;
  const lattice = r.lattice === "rect" && r.aspect !== undefined ? `rect ${Number(r.aspect.toPrecision(3))}` : r.lattice;
  return `${r.family}: ${materials}, ${lattice}, fill ${formatPercent(r.fillFraction)}`;
}

/** Several lines describing a recipe fully. */
export function recipeLines(r: Recipe, componentNames: string[]): string[] {
  const lines = [recipeHeadline(r)];
  const along = orientationPhrase(r);
  if (along) lines.push(`orientation: ${along}`);
  const dims = dimensionsText(r.dimensions);
  if (dims) lines.push(`dimensions: ${dims}`);
  lines.push(`achieved: ${componentNames.map((n, k) => `${n} ${formatValue(r.achieved[k])}`).join(", ")}`);
  const extras = [
    `error ${formatPercent(r.relError)}`,
    `tan δ ${formatValue(r.lossTangent)}`,
    `MG–Bruggeman spread ${formatPercent(r.spread)}`,
    `smallest feature ${formatLength(r.featureM)}`,
  ];
  if (r.bandwidth !== null) extras.push(`bandwidth ${formatPercent(r.bandwidth)}`);
  if (r.resonant) extras.push("resonant");
  lines.push(extras.join(", "));
  for (const note of r.notes) lines.push(`note: ${note}`);
  return lines;
}
