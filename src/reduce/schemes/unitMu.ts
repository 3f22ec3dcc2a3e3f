import type { ReductionScheme } from "./reductionScheme.js";

/**
 * `unit-mu` (Ez only): α = 1/λ, λ the larger (default) or smaller principal value of μ_t, so that
 * principal value becomes 1 and ε_zz takes the inverse scale (ε_zz·λ). For the linear cylindrical
 * cloak with `larger` this gives μ_r = ((r−a)/r)², μ_θ = 1, ε_z = (b/(b−a))² (Schurig et al.,
 * "Metamaterial electromagnetic cloak at microwave frequencies", Science 314, 977 (2006)).
 */
export const unitMuScheme: ReductionScheme = {
  name: "unit-mu",
  summary: "one principal μ set to 1 per cell, ε_zz scaled to match",
  polarizations: ["Ez"],
  cellScale: (_pol, lambdaMin, lambdaMax, _s, unitLarger) => 1 / (unitLarger ? lambdaMax : lambdaMin),
  isotropize: false,
  matchBoundary: false,
};
