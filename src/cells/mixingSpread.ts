/**
 * How far Maxwell Garnett and Bruggeman disagree along each axis of a family at a fill fraction,
 * with the media module's measure (mgBruggemanSpread: |ε_MG − ε_Br| / |ε_Br|, same dimension).
 * Axes mixed by MG cylinders or 2D Bruggeman use the 2D pair, MG spheres or 3D Bruggeman the 3D
 * pair; rules exact for their geometry (Wiener parallel and series means) and the resonant models
 * have no spread. Where the spread exceeds the design tolerance the cell should be verified with a
 * full-wave unit-cell simulation (common practice).
 */
import type { Complex } from "../core/complex.js";
import { mgBruggemanSpread } from "../media/uncertainty.js";
import { axisRule, axisSolvedError, type Axis, type AxisPermittivity } from "./cellFamily.js";

const DIMENSION: Partial<Record<string, 2 | 3>> = {
  "mg-cylinder": 2,
  "bruggeman-2d": 2,
  "mg-sphere": 3,
  "bruggeman-3d": 3,
};

/** Dimension of the MG/Bruggeman pair an axis rule is compared within, or undefined when exact. */
export const spreadDimension = (rule: string): 2 | 3 | undefined => DIMENSION[rule];

/** Spread along one axis; 0 when the rule is exact for its geometry. */
export function axisSpread(rule: string, host: Complex, inclusion: Complex, fill: number): number {
  const d = spreadDimension(rule);
  return d === undefined ? 0 : mgBruggemanSpread(host, inclusion, fill, d);
}

export interface CellSpread {
  parallel: number;
  perpendicular: number;
  /** rect lattices only */
  perpendicularY?: number;
  max: number;
}

/**
 * Model uncertainty on both axes of a family's effective permittivity: the solver's error estimate
 * on a solved axis, the MG/Bruggeman spread on a closed-form axis.
 */
export function cellSpread(eff: AxisPermittivity, host: Complex, inclusion: Complex, fill: number): CellSpread {
  const one = (axis: Axis) => (axisRule(eff, axis) === "solved-cell" ? axisSolvedError(eff, axis) ?? 0 : axisSpread(axisRule(eff, axis), host, inclusion, fill));
  const parallel = one("parallel");
  const perpendicular = one("perpendicular");
  if (eff.perpendicularY === undefined) return { parallel, perpendicular, max: Math.max(parallel, perpendicular) };
  const perpendicularY = one("perpendicularY");
  return { parallel, perpendicular, perpendicularY, max: Math.max(parallel, perpendicular, perpendicularY) };
}
