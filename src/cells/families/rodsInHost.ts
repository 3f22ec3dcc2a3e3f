/**
 * Parallel circular rods of radius r in a host, square or hexagonal lattice of pitch a (2D family).
 * Fill f = πr²/A with A = a² (square) or (√3/2)a² (hex); rods touch at r = a/2, so
 * f_max = π/4 (square) and π/(2√3) (hex) — circle packing in the plane.
 * Field across the rods: Maxwell Garnett for cylinders; along them: the Wiener parallel (arithmetic)
 * mean, which is exact for a field along invariant rods (Sihvola 1999).
 */
import { cellAreaM2, type Lattice } from "../lattice.js";
import type { MixingFamilySpec } from "./mixingFamily.js";
import { solvedCircleFamily } from "./solvedCircleFamily.js";

/** Geometry shared by rods and holes: circles of radius r on a 2D lattice. */
export const circleLattice = {
  lattices: ["square", "hex"] as Lattice[],
  fillRange: (lattice: Lattice): [number, number] => [0, lattice === "hex" ? Math.PI / (2 * Math.sqrt(3)) : Math.PI / 4],
  dimensionsFromFill: (fill: number, pitchM: number, lattice: Lattice) => ({ radiusM: Math.sqrt((fill * cellAreaM2(pitchM, lattice)) / Math.PI) }),
  fillFromDimensions: (dims: Record<string, number>, pitchM: number, lattice: Lattice) => (Math.PI * dims.radiusM ** 2) / cellAreaM2(pitchM, lattice),
  /** circle diameter and the wall between nearest neighbours (spacing a in both lattices) */
  diameterAndWall(fill: number, pitchM: number, lattice: Lattice): { diameterM: number; wallM: number } {
    const d = 2 * Math.sqrt((fill * cellAreaM2(pitchM, lattice)) / Math.PI);
    return { diameterM: d, wallM: Math.max(0, pitchM - d) };
  },
};

const spec: MixingFamilySpec = {
  id: "rods-in-host",
  description: "parallel circular rods in a host, square or hexagonal lattice (2D, uniaxial)",
  lattices: circleLattice.lattices,
  dimension: 2,
  isotropic: false,
  defaultAxis: "perpendicular",
  fabricatedPhase: "inclusion",
  fillRange: circleLattice.fillRange,
  dimensionsFromFill: circleLattice.dimensionsFromFill,
  fillFromDimensions: circleLattice.fillFromDimensions,
  smallestFeatureM(fill, pitchM, lattice) {
    const { diameterM, wallM } = circleLattice.diameterAndWall(fill, pitchM, lattice);
    return { featureM: diameterM, gapM: wallM };
  },
  rules: { parallel: "parallel", perpendicular: "mg-cylinder" },
  limitNote: (lattice) => `touching rods, ${lattice} lattice`,
};

export const rodsInHost = solvedCircleFamily(spec);
