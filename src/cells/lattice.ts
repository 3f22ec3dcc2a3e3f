/**
 * Lattices of unit cells. Square and hexagonal lattices tile the plane (2D families, invariant along
 * the axis z); the cubic lattice tiles space (3D families).
 */
import { InputError } from "../core/errors.js";

export type Lattice = "square" | "hex" | "cubic";

export const LATTICES: readonly Lattice[] = ["square", "hex", "cubic"];

/**
 * Area of one 2D cell of nearest-neighbour spacing `pitchM` (m²): a² (square), (√3/2)·a² (hex,
 * rhombic primitive cell of one site). Geometry, any text on lattices.
 */
export function cellAreaM2(pitchM: number, lattice: Lattice): number {
  return lattice === "hex" ? (Math.sqrt(3) / 2) * pitchM * pitchM : pitchM * pitchM;
}

/** Parse a lattice name given by the user; `where` names the flag or JSON path. */
export function parseLattice(value: string, where: string): Lattice {
  if ((LATTICES as readonly string[]).includes(value)) return value as Lattice;
  throw new InputError({ where, message: `expected one of ${LATTICES.join(", ")}, got '${value}'` });
}
