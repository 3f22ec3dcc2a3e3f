import type { ReductionScheme } from "./reductionScheme.js";

/**
 * `isotropic`: one non-magnetic index per cell, dropping the in-plane anisotropy.
 * The kept index is the geometric mean of the two principal indices:
 *   Ez: n² = ε_zz·sqrt(det μ_t)  (α = 1/sqrt(det μ_t), then μ_t → I)
 *   Hz: n² = μ_zz·sqrt(det ε_t)  (α = μ_zz, then ε_t → sqrt(det)·I, μ_zz = 1)
 * For a 2D map with μ_b = 1 and ε_b = n_b², det μ_t = 1 (Ez) and so n² = n_b²/det J, the
 * quasi-conformal result of Li and Pendry, "Hiding under the carpet: a new strategy for cloaking",
 * PRL 101, 203901 (2008). The dropped factor σ1/σ2 = sqrt(λmax/λmin) is reported per cell.
 */
export const isotropicScheme: ReductionScheme = {
  name: "isotropic",
  summary: "one index per cell (geometric mean), no μ; anisotropy dropped",
  polarizations: ["Ez", "Hz"],
  cellScale: (pol, lambdaMin, lambdaMax, s) => (pol === "Ez" ? 1 / Math.sqrt(lambdaMin * lambdaMax) : s),
  isotropize: true,
  matchBoundary: false,
};
