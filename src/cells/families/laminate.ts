/**
 * Layered laminate: layers of the inclusion, thickness t, alternating with host layers, period a
 * (uniaxial). f = t/a. Field in the layer planes: Wiener parallel mean; normal to the layers:
 * Wiener series mean — both exact for a fine laminate (Wiener 1912).
 */
import { mixingFamily, type MixingFamilySpec } from "./mixingFamily.js";

const spec: MixingFamilySpec = {
  id: "laminate",
  description: "alternating layers of inclusion and host (uniaxial; exact Wiener means)",
  lattices: ["square", "cubic"],
  dimension: 2,
  isotropic: false,
  defaultAxis: "parallel",
  fabricatedPhase: "both",
  fillRange: () => [0, 1],
  dimensionsFromFill: (fill, pitchM) => ({ thicknessM: fill * pitchM, hostThicknessM: (1 - fill) * pitchM }),
  fillFromDimensions: (dims, pitchM) => dims.thicknessM / pitchM,
  smallestFeatureM(fill, pitchM) {
    return { featureM: fill * pitchM, gapM: (1 - fill) * pitchM };
  },
  rules: { parallel: "parallel", perpendicular: "series" },
  limitNote: () => "solid cell",
};

export const laminate = mixingFamily(spec);
