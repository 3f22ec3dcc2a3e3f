import type { ReductionScheme } from "./reductionScheme.js";
import { nonMagneticScheme } from "./nonMagnetic.js";
import { unitMuScheme } from "./unitMu.js";

/**
 * `matched`: the reduced set (Ez: unit-mu, Hz: non-magnetic) times one constant c chosen so the
 * wave impedance at the outer boundary equals the background's (geometric mean over the boundary).
 * A constant scale leaves the 2D wave equation exactly unchanged inside; it brings back a uniform
 * magnetic factor c (Ez: μ_t × c) or 1/c (Hz: μ_zz). Linear cylindrical cloak, Ez:
 * ε_z = μ_θ = b/(b−a), μ_r = (b/(b−a))((r−a)/r)², which removes the boundary mismatch
 * Z = 1 − a/b of the unit-mu set (Yan, Ruan, Qiu, Opt. Express 15, 17772 (2007)).
 */
export const matchedScheme: ReductionScheme = {
  name: "matched",
  summary: "reduced set times one constant that matches the outer edge",
  polarizations: ["Ez", "Hz"],
  cellScale: (pol, lambdaMin, lambdaMax, s, unitLarger) =>
    pol === "Ez"
      ? unitMuScheme.cellScale(pol, lambdaMin, lambdaMax, s, unitLarger)
      : nonMagneticScheme.cellScale(pol, lambdaMin, lambdaMax, s, unitLarger),
  isotropize: false,
  matchBoundary: true,
};
