/**
 * What a computed map reports about itself (field --json's `map` object): the conformal module
 * of the physical domain with its two-sided bracket, the virtual aspect it is mapped to, the
 * residual anisotropy that the mismatch leaves, the solver grid and the linear-solve residual.
 * Module and aspect are both height/width of the Dirichlet pair of the solve (the sides where the
 * second virtual coordinate is fixed: bottom/top of a quadrilateral; a shell (inner/outer curve)
 * reports no module: null).
 */
export interface ComputedMapInfo {
  /** geometric mean of the bracket: lower bound 1/E(v̂), upper bound E(û) (Dirichlet's principle) */
  conformalModule: number | null;
  conformalModuleBounds: [number, number] | null;
  /** height/width of the virtual domain after any fit (null for shells) */
  virtualAspect: number | null;
  /** largest ratio of principal stretches σ₁/σ₂ of the map over the solver's cells */
  maxAnisotropy: number;
  /** area-weighted mean of σ₁/σ₂ */
  meanAnisotropy: number;
  /** solver grid lines [along the first coordinate, along the second] */
  nodes: [number, number];
  /** largest relative residual of the linear solves */
  residual: number;
  /**
   * Estimated relative error of K = ∂x/∂x′: the largest ‖K_h − K_2h‖/‖K_h‖ over the solver's cell
   * centres, divided by 3 (Richardson: the scheme is second order, so K_h is about three times
   * closer to the limit than the difference).
   */
  jacobianErrorEstimate: number;
  /** the virtual rectangle actually used (metres), for quadrilateral maps */
  virtualRectangle?: { minM: [number, number]; maxM: [number, number] };
}

/**
 * σ₁/σ₂ of a 2 × 2 matrix [[a, b], [c, d]] (≥ 1; Infinity when singular), from the stable
 * split σ₁,₂ = (√((a+d)² + (c−b)²) ± √((a−d)² + (b+c)²))/2 (no cancellation near isotropy).
 */
export function stretchRatio(a: number, b: number, c: number, d: number): number {
  const p = Math.hypot(a + d, c - b), q = Math.hypot(a - d, b + c);
  const small = Math.abs(p - q);
  if (!(small > 0)) return Infinity;
  return (p + q) / small;
}
