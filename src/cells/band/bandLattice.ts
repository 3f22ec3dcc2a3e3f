/**
 * Lattices for the lowest-band solver (lowestBand.ts), spacing a = 1 along x:
 *
 * - square: a1 = (1, 0), a2 = (0, 1); directions Γ–X (along x, zone edge π) and Γ–M (diagonal, π√2);
 * - hex: a1 = (1, 0), a2 = (1/2, √3/2); directions Γ–M (along b1, |b1|/2 = 2π/√3) and Γ–K (along x,
 *   4π/3);
 * - rect (aspect R = b/a): a1 = (1, 0), a2 = (0, R); directions Γ–X (along x, π), Γ–Y (along y,
 *   π/R) and Γ–S (towards the zone corner (π, π/R), edge √(π² + (π/R)²)). X and Y are the principal
 *   axes of its quasi-static tensor; S is where the band departs most from an ellipse, as Γ–M does
 *   for the square lattice. At R = 1 the rect lattice IS the square lattice (same plane waves;
 *   Γ–X = Γ–X, Γ–Y = Γ–X by symmetry, Γ–S = Γ–M), which the tests hold as an identity.
 *
 * Plane waves: the reciprocal vectors G inside a disc |G| ≤ M·2π/s, s the shorter spacing
 * (square: 2π·M = M·|b1|; rect: 2π·M/min(1, R), the same resolution in real space across the
 * shorter spacing, so about πM²·R/min(1, R)² waves: 49 at R = 1, 151 at R = 3 or 1/3 for M = 4);
 * hex keeps M·|b1| (61 waves). A disc keeps the lattice's symmetry, unlike an index square.
 */
import { ProgrammerError } from "../../core/errors.js";

export type BandLattice = "square" | "hex" | "rect";

/** Aspects (b/a) the band solver takes (the same range as the solved rect cells). */
export const BAND_ASPECT_RANGE: readonly [number, number] = [0.25, 4];

export interface BandLatticeGeometry {
  a1: [number, number];
  a2: [number, number];
  b1: [number, number];
  b2: [number, number];
  /** area of the primitive cell (a = 1) */
  area: number;
}

/** Primitive and reciprocal vectors (a = 1; rect: b = aspect). */
export function bandLatticeGeometry(lattice: BandLattice, aspect = 1): BandLatticeGeometry {
  if (lattice === "rect" && !(aspect >= BAND_ASPECT_RANGE[0] && aspect <= BAND_ASPECT_RANGE[1])) {
    throw new ProgrammerError(`bandLatticeGeometry: aspect ${aspect} outside ${BAND_ASPECT_RANGE.join("…")}`);
  }
  const a1: [number, number] = [1, 0];
  const a2: [number, number] = lattice === "square" ? [0, 1] : lattice === "hex" ? [0.5, Math.sqrt(3) / 2] : [0, aspect];
  const area = a1[0] * a2[1] - a1[1] * a2[0];
  const s = (2 * Math.PI) / area;
  return { a1, a2, b1: [a2[1] * s, -a2[0] * s], b2: [-a1[1] * s, a1[0] * s], area };
}

export interface BandDirection {
  /** "Γ–X", "Γ–M", … */
  name: string;
  /** unit vector */
  dir: [number, number];
  /** |k| at the Brillouin-zone edge along dir (a = 1) */
  edge: number;
}

/** The principal directions the band is solved along (module comment). */
export function bandDirections(lattice: BandLattice, aspect = 1): BandDirection[] {
  if (lattice === "square") {
    return [{ name: "Γ–X", dir: [1, 0], edge: Math.PI }, { name: "Γ–M", dir: [Math.SQRT1_2, Math.SQRT1_2], edge: Math.PI * Math.SQRT2 }];
  }
  if (lattice === "hex") {
    const v = bandLatticeGeometry("hex");
    const b = Math.hypot(v.b1[0], v.b1[1]);
    return [{ name: "Γ–M", dir: [v.b1[0] / b, v.b1[1] / b], edge: b / 2 }, { name: "Γ–K", dir: [1, 0], edge: (4 * Math.PI) / 3 }];
  }
  const ky = Math.PI / aspect;
  const s = Math.hypot(Math.PI, ky);
  return [
    { name: "Γ–X", dir: [1, 0], edge: Math.PI },
    { name: "Γ–Y", dir: [0, 1], edge: ky },
    { name: "Γ–S", dir: [Math.PI / s, ky / s], edge: s },
  ];
}

/** Radius of the disc of plane waves kept (module comment), for M = `m`. */
export function planeWaveCutoff(lattice: BandLattice, m: number, aspect = 1): number {
  if (lattice === "hex") {
    const v = bandLatticeGeometry("hex");
    return m * Math.hypot(v.b1[0], v.b1[1]);
  }
  return (m * 2 * Math.PI) / (lattice === "rect" ? Math.min(1, aspect) : 1);
}
