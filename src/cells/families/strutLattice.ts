/**
 * Printed cubic strut lattice: struts of square cross-section w along the twelve edges of a cube of
 * pitch a (each cell owns three struts). Solid fraction f = 3(w/a)² − 2(w/a)³ (three orthogonal
 * square bars minus the twice-counted node cube; inclusion–exclusion). Isotropic by cubic symmetry.
 * Both phases are connected, so the symmetric Bruggeman rule (3D) is used rather than Maxwell
 * Garnett, which treats the printed phase as isolated inclusions (Bruggeman 1935; common practice
 * for interpenetrating networks). The MG/Bruggeman spread is reported by designCell.
 */
import { mixingFamily, type MixingFamilySpec } from "./mixingFamily.js";

/** f(x) = 3x² − 2x³ for x = w/a in [0, 1]. */
export const strutFill = (x: number): number => 3 * x * x - 2 * x * x * x;

/** Inverse of strutFill on [0, 1]: x = 1/2 − sin(asin(1 − 2f)/3) (trigonometric root of the cubic). */
export const strutWidthRatio = (fill: number): number => 0.5 - Math.sin(Math.asin(Math.min(1, Math.max(-1, 1 - 2 * fill))) / 3);

const spec: MixingFamilySpec = {
  id: "strut-lattice",
  description: "printed cubic lattice of square struts (3D, isotropic)",
  lattices: ["cubic"],
  dimension: 3,
  isotropic: true,
  defaultAxis: "perpendicular",
  fabricatedPhase: "inclusion",
  fillRange: () => [0, 1],
  dimensionsFromFill: (fill, pitchM) => ({ widthM: strutWidthRatio(fill) * pitchM }),
  fillFromDimensions: (dims, pitchM) => strutFill(dims.widthM / pitchM),
  smallestFeatureM(fill, pitchM) {
    const w = strutWidthRatio(fill) * pitchM;
    return { featureM: w, gapM: Math.max(0, pitchM - w) };
  },
  rules: { parallel: "bruggeman-3d", perpendicular: "bruggeman-3d" },
  limitNote: () => "solid cell",
};

export const strutLattice = mixingFamily(spec);
