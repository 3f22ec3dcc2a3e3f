/**
 * Cubes of side s in a host on a simple cubic lattice of pitch a, faces aligned (3D, isotropic by
 * cubic symmetry). f = (s/a)³, up to a solid cell at s = a. Mixed with Maxwell Garnett for spheres:
 * a cube's mean depolarization factor is 1/3 by symmetry, the usual approximation (common practice;
 * corners raise the true response somewhat at high contrast — the MG/Bruggeman spread shows it).
 */
import { mixingFamily, type MixingFamilySpec } from "./mixingFamily.js";

const spec: MixingFamilySpec = {
  id: "cubes-in-host",
  description: "cubes in a host on a simple cubic lattice (3D, isotropic)",
  lattices: ["cubic"],
  dimension: 3,
  isotropic: true,
  defaultAxis: "perpendicular",
  fabricatedPhase: "inclusion",
  fillRange: () => [0, 1],
  dimensionsFromFill: (fill, pitchM) => ({ sideM: pitchM * Math.cbrt(fill) }),
  fillFromDimensions: (dims, pitchM) => (dims.sideM / pitchM) ** 3,
  smallestFeatureM(fill, pitchM) {
    const s = pitchM * Math.cbrt(fill);
    return { featureM: s, gapM: Math.max(0, pitchM - s) };
  },
  rules: { parallel: "mg-sphere", perpendicular: "mg-sphere" },
  limitNote: () => "solid cell",
};

export const cubesInHost = mixingFamily(spec);
