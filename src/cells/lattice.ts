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

/**
 * Rect lattices a plan builds on its square device cells of pitch p: b/a = m/n with m, n ≤ 4, so a
 * device cell holds m × n circles (spacing a = p/m along the lattice's x axis, b = p/n along y)
 * and the drawing tiles exactly. The default set the planner tries (aspect 1 is the square lattice).
 */
export const PLAN_RECT_ASPECTS: readonly number[] = [1, 1 / 3, 1 / 2, 2 / 3, 3 / 2, 2, 3];
const MAX_TILE = 4;

/** m, n (≤ 4, lowest terms) with m/n = aspect, or null when no such tiling exists. */
export function rectTiling(aspect: number): { m: number; n: number } | null {
  for (let n = 1; n <= MAX_TILE; n++) {
    for (let m = 1; m <= MAX_TILE; m++) {
      if (Math.abs(m / n - aspect) <= 1e-9 * aspect) {
        let a = m, b = n;
        while (b) [a, b] = [b, a % b];
        return { m: m / a, n: n / a };
      }
    }
  }
  return null;
}

/** Parse a lattice name given by the user; `where` names the flag or JSON path. */
export function parseLattice(value: string, where: string): Lattice {
  if ((LATTICES as readonly string[]).includes(value)) return value as Lattice;
  throw new InputError({ where, message: `expected one of ${LATTICES.join(", ")}, got '${value}'` });
}
