import type { ReductionScheme } from "./reductionScheme.js";

/**
 * `full`: the polarization's components as the transform gives them (α = 1); generally magnetic
 * and anisotropic. Reflectionless when the map is the identity on the outer boundary.
 */
export const fullScheme: ReductionScheme = {
  name: "full",
  summary: "components as the transform gives them: magnetic, anisotropic",
  polarizations: ["Ez", "Hz", "3D"],
  cellScale: () => 1,
  isotropize: false,
  matchBoundary: false,
};
