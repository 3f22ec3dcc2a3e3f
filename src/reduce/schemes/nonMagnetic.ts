import type { ReductionScheme } from "./reductionScheme.js";

/**
 * `non-magnetic` (Hz only): α = μ_zz, so μ_zz = 1 and ε_t ← μ_zz ε_t: all-dielectric, possibly
 * ε < 1. Linear cylindrical cloak: ε_r = (b/(b−a))²((r−a)/r)², ε_θ = (b/(b−a))² (Cai, Chettiar,
 * Kildishev, Shalaev, "Optical cloaking with metamaterials", Nature Photonics 1, 224 (2007)); any
 * monotone r' = g(r): ε_r = (r/r')², ε_θ = 1/g'(r)² (Cai et al., APL 91, 111105 (2007)).
 */
export const nonMagneticScheme: ReductionScheme = {
  name: "non-magnetic",
  summary: "μ_zz = 1, in-plane ε × μ_zz: all-dielectric, may need ε < 1",
  polarizations: ["Hz"],
  cellScale: (_pol, _lambdaMin, _lambdaMax, s) => s,
  isotropize: false,
  matchBoundary: false,
};
