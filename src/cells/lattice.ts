/**
 * Lattices of unit cells. Square, hexagonal and rectangular lattices tile the plane (2D families,
 * invariant along the axis z); the cubic lattice tiles space (3D families). A rectangular lattice
 * (`rect`) has spacing a (the pitch) along its x axis and b = aspect·a along its y axis; its
 * in-plane response differs along x and y.
 */
import { InputError } from "../core/errors.js";

export type Lattice = "square" | "hex" | "rect" | "cubic";

export const LATTICES: readonly Lattice[] = ["square", "hex", "rect", "cubic"];

/**
 * Area of one 2D cell of nearest-neighbour spacing `pitchM` (m²): a² (square), (√3/2)·a² (hex,
 * rhombic primitive cell of one site), aspect·a² (rect: a × b, b = aspect·a). Geometry, any text on
 * lattices.
 */
export function cellAreaM2(pitchM: number, lattice: Lattice, aspect = 1): number {
  if (lattice === "hex") return (Math.sqrt(3) / 2) * pitchM * pitchM;
  return lattice === "rect" ? aspect * pitchM * pitchM : pitchM * pitchM;
}

/** Parse a lattice name given by the user; `where` names the flag or JSON path. */
export function parseLattice(value: string, where: string): Lattice {
  if ((LATTICES as readonly string[]).includes(value)) return value as Lattice;
  throw new InputError({ where, message: `expected one of ${LATTICES.join(", ")}, got '${value}'` });
}
