/**
 * Parallel circular rods of radius r in a host, square, hexagonal or rectangular lattice of pitch a
 * (2D family; a rect lattice has spacing b = aspect·a along its y axis).
 * Fill f = πr²/A with A = a² (square) or (√3/2)a² (hex); rods touch at r = a/2, so
 * f_max = π/4 (square) and π/(2√3) (hex) — circle packing in the plane.
 * Field across the rods: Maxwell Garnett for cylinders; along them: the Wiener parallel (arithmetic)
 * mean, which is exact for a field along invariant rods (Sihvola 1999).
 */
import { cellAreaM2, type Lattice } from "../lattice.js";
import type { MixingFamilySpec } from "./mixingFamily.js";
import { solvedCircleFamily } from "./solvedCircleFamily.js";

/**
 * Geometry shared by rods and holes: circles of radius r on a 2D lattice. Rect lattices (spacing a =
 * pitch along x, b = aspect·a along y): f = πr²/(ab), the circles touch at r = min(a, b)/2, and the
 * dimensions add the spacing along y (`spacingYM`).
 */
export const circleLattice = {
  lattices: ["square", "hex", "rect"] as Lattice[],
  fillRange: (lattice: Lattice, aspect = 1): [number, number] =>
    [0, lattice === "hex" ? Math.PI / (2 * Math.sqrt(3)) : lattice === "rect" ? (Math.PI * Math.min(1, aspect) ** 2) / (4 * aspect) : Math.PI / 4],
  dimensionsFromFill: (fill: number, pitchM: number, lattice: Lattice, aspect = 1): Record<string, number> => {
    const radiusM = Math.sqrt((fill * cellAreaM2(pitchM, lattice, aspect)) / Math.PI);
    return lattice === "rect" ? { radiusM, spacingYM: aspect * pitchM } : { radiusM };
  },
  fillFromDimensions: (dims: Record<string, number>, pitchM: number, lattice: Lattice, aspect = 1) => (Math.PI * dims.radiusM ** 2) / cellAreaM2(pitchM, lattice, aspect),
  /** circle diameter and the wall between nearest neighbours (spacing a, or min(a, b) on rect lattices) */
  diameterAndWall(fill: number, pitchM: number, lattice: Lattice, aspect = 1): { diameterM: number; wallM: number } {
    const d = 2 * Math.sqrt((fill * cellAreaM2(pitchM, lattice, aspect)) / Math.PI);
    const spacing = lattice === "rect" ? pitchM * Math.min(1, aspect) : pitchM;
    return { diameterM: d, wallM: Math.max(0, spacing - d) };
  },
};

const spec: MixingFamilySpec = {
  id: "rods-in-host",
  description: "parallel circular rods in a host, square, hexagonal or rectangular lattice (2D; rect: in-plane anisotropic)",
  lattices: circleLattice.lattices,
  dimension: 2,
  isotropic: false,
  defaultAxis: "perpendicular",
  fabricatedPhase: "inclusion",
  fillRange: circleLattice.fillRange,
  dimensionsFromFill: circleLattice.dimensionsFromFill,
  fillFromDimensions: circleLattice.fillFromDimensions,
  smallestFeatureM(fill, pitchM, lattice, aspect) {
    const { diameterM, wallM } = circleLattice.diameterAndWall(fill, pitchM, lattice, aspect);
    return { featureM: diameterM, gapM: wallM };
  },
  rules: { parallel: "parallel", perpendicular: "mg-cylinder" },
  limitNote: (lattice) => `touching rods, ${lattice} lattice`,
};

export const rodsInHost = solvedCircleFamily(spec);
