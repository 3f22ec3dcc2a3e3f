/**
 * How a recipe's orientation is written: the build list and levels.csv carry a short code, the
 * report and the session a phrase. Rods, holes, wires and split rings point their axis that way;
 * a laminate points its layer normal that way. Axis 2 is the larger in-plane target principal
 * direction (axis_deg from +x), axis 1 the smaller (axis_deg + 90°).
 */
import type { Recipe } from "../planTypes.js";

/** "along_z", "along_1", "along_2", or "" for isotropic families. */
export function orientationCode(r: Pick<Recipe, "orientation">): string {
  return r.orientation === null ? "" : `along_${r.orientation}`;
}

/** "rods along z", "layer normal along axis 1 (axis_deg + 90°)", or "" for isotropic families. */
export function orientationPhrase(r: Pick<Recipe, "orientation" | "family">): string {
  if (r.orientation === null) return "";
  const where = r.orientation === "z" ? "z" : r.orientation === "2" ? "axis 2 (axis_deg)" : "axis 1 (axis_deg + 90°)";
  const what = r.family === "laminate" ? "layer normal" : r.family === "split-ring" ? "ring axis" : r.family === "wire-medium" ? "wires" : r.family === "holes-in-slab" ? "holes" : "rods";
  return `${what} along ${where}`;
}
