/**
 * How a family's two principal axes (cellFamily.ts: `parallel`, `perpendicular`) land on the
 * device's directions z, 1 and 2 (1, 2: the in-plane principal axes of the target, 1 the smaller).
 *
 * - isotropic families: every direction gets the same value;
 * - laminates: `orientation` is the stacking normal — the field along the normal sees the series
 *   (perpendicular) value, the field in the layer planes the parallel one;
 * - rods, holes, wires and rings: `orientation` is their axis — the field along it sees the
 *   parallel value, any field across it the perpendicular one;
 * - rods and holes along z on a rect lattice: the lattice's x axis lies along principal axis 1, so
 *   direction 1 sees `perpendicular` and direction 2 `perpendicularY`.
 */
import type { Axis, CellFamily } from "../../cells/cellFamily.js";
import type { Lattice } from "../../cells/lattice.js";

export type Direction = "z" | "1" | "2";
export const DIRECTIONS: readonly Direction[] = ["z", "1", "2"];

/** Family axis seen by a field along `dir` when the family is oriented along `orientation`. */
export function axisFor(family: CellFamily, orientation: Direction, dir: Direction, lattice?: Lattice): Axis {
  if (family.isotropic) return "parallel";
  if (family.id === "laminate") return dir === orientation ? "perpendicular" : "parallel";
  if (dir === orientation) return "parallel";
  return lattice === "rect" && orientation === "z" && dir === "2" ? "perpendicularY" : "perpendicular";
}


/** Orientations worth trying for a family (one for isotropic families). */
export function orientationsFor(family: CellFamily, inPlaneIsotropic: boolean): Direction[] {
  if (family.isotropic) return ["z"];
  return inPlaneIsotropic ? ["z", "1"] : ["z", "1", "2"];
}
