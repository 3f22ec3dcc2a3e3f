/**
 * Holes (usually air) through a dielectric slab: rods of the inclusion phase in the slab as host,
 * square, hexagonal or rectangular lattice. Same geometry as rods-in-host (f = πr²/A, f_max = π/4 or π/(2√3));
 * for the process the wall between holes is the solid feature and the hole is the opening.
 * Maxwell Garnett for cylinders with the slab as host: for a hole phase of lower ε this is the
 * upper Hashin–Shtrikman bound (Milton 2002), suited to isolated holes.
 */
import type { MixingFamilySpec } from "./mixingFamily.js";
import { solvedCircleFamily } from "./solvedCircleFamily.js";
import { circleLattice } from "./rodsInHost.js";

const spec: MixingFamilySpec = {
  id: "holes-in-slab",
  description: "holes (e.g. air) through a dielectric slab, square, hexagonal or rectangular lattice (2D; rect: in-plane anisotropic)",
  lattices: circleLattice.lattices,
  dimension: 2,
  isotropic: false,
  defaultAxis: "perpendicular",
  fabricatedPhase: "host",
  fillRange: circleLattice.fillRange,
  dimensionsFromFill: circleLattice.dimensionsFromFill,
  fillFromDimensions: circleLattice.fillFromDimensions,
  smallestFeatureM(fill, pitchM, lattice, aspect) {
    const { diameterM, wallM } = circleLattice.diameterAndWall(fill, pitchM, lattice, aspect);
    return { featureM: wallM, gapM: diameterM };
  },
  rules: { parallel: "parallel", perpendicular: "mg-cylinder" },
  limitNote: (lattice) => `touching holes, ${lattice} lattice`,
};

export const holesInSlab = solvedCircleFamily(spec);
