/**
 * Spheres of radius r in a host on a simple cubic lattice of pitch a (3D, isotropic by cubic
 * symmetry). f = (4/3)πr³/a³; spheres touch at r = a/2: f_max = π/6. Maxwell Garnett for spheres.
 */
import { mixingFamily, type MixingFamilySpec } from "./mixingFamily.js";

const spec: MixingFamilySpec = {
  id: "spheres-in-host",
  description: "spheres in a host on a simple cubic lattice (3D, isotropic)",
  lattices: ["cubic"],
  dimension: 3,
  isotropic: true,
  defaultAxis: "perpendicular",
  fabricatedPhase: "inclusion",
  fillRange: () => [0, Math.PI / 6],
  dimensionsFromFill: (fill, pitchM) => ({ radiusM: pitchM * Math.cbrt((3 * fill) / (4 * Math.PI)) }),
  fillFromDimensions: (dims, pitchM) => ((4 / 3) * Math.PI * dims.radiusM ** 3) / pitchM ** 3,
  smallestFeatureM(fill, pitchM) {
    const d = 2 * pitchM * Math.cbrt((3 * fill) / (4 * Math.PI));
    return { featureM: d, gapM: Math.max(0, pitchM - d) };
  },
  rules: { parallel: "mg-sphere", perpendicular: "mg-sphere" },
  limitNote: () => "touching spheres, cubic lattice",
};

export const spheresInHost = mixingFamily(spec);
