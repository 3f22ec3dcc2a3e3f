/**
 * The shape shared by every reduction scheme. A 2D scheme is a per-cell scale α applied to the
 * polarization's components — in-plane tensor × α, out-of-plane scalar × 1/α — which keeps the
 * local dispersion relation (ray paths) and changes only the impedance (design brief §2;
 * Schurig et al., Science 314, 977 (2006)); optionally followed by replacing the in-plane tensor
 * by its isotropic part (geometric mean of its principal values).
 */
import type { Polarization, PlanarPolarization } from "../polarization.js";
import type { ReductionSchemeName } from "./schemeNames.js";

export interface ReductionScheme {
  name: ReductionSchemeName;
  /** one line for the UI and --help */
  summary: string;
  /** polarizations the scheme applies to */
  polarizations: readonly Polarization[];
  /**
   * In-plane scale α for one cell, from the principal values λmin ≤ λmax (> 0) of the in-plane
   * tensor (Ez: μ_t, Hz: ε_t) and the out-of-plane scalar s (> 0; Ez: ε_zz, Hz: μ_zz).
   */
  cellScale(polarization: PlanarPolarization, lambdaMin: number, lambdaMax: number, s: number, unitLarger: boolean): number;
  /** after scaling, replace the in-plane tensor by sqrt(det)·I */
  isotropize: boolean;
  /** after scaling, multiply α by one constant chosen so the outer boundary is impedance-matched */
  matchBoundary: boolean;
}
