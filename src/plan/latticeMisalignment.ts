/**
 * Error of a rect-lattice cell whose lattice axes are not along its target's principal axes.
 *
 * A rect recipe tiles the square device cell with m × n circles, so its lattice axes stand along the
 * grid's x and y: the layout (plan/layout/layoutShapes.ts) puts the lattice's x axis on the grid
 * axis nearer the cell's principal axis 1. Where the target's principal axes are turned by δ from
 * the grid (δ ≤ 45°), the built in-plane tensor is diag(e₁, e₂) turned by δ in the target's frame:
 *
 *   A₁₁ = e₁cos²δ + e₂sin²δ,  A₂₂ = e₁sin²δ + e₂cos²δ,  A₁₂ = (e₂ − e₁) sinδ cosδ,
 *
 * against the target diag(t₁, t₂). Its error is the largest of |A₁₁ − t₁|/|t₁|, |A₂₂ − t₂|/|t₂| and
 * |A₁₂|/√|t₁t₂| — the largest entry of T^{-1/2}(A − T)T^{-1/2}, which is the plain per-component
 * relative error when δ = 0 (complex e, real t). Measured on the anisotropic strip turned from the
 * grid (tests/plan/latticeMisalignment.test.ts): by 20° the turn adds up to 4.65 % to a cell's error
 * (to 10.3 %, tolerance 12 %); by 30°, with recipes chosen as if aligned, up to 8.9 % (to 13.9 %, the
 * plan then misses its tolerance), mostly through A₁₂ — too large to leave to a note, so it is part of
 * rel_error, and the level search (levelCandidates.ts, MatchContext.turnRad) judges rect recipes by
 * the same figure at the level's largest angle: at 30° it then keeps square tilings (cells over the
 * tolerance 8 → 2, mean error 5.2 → 4.9 %, largest 14.2 → 14.9 %: quantization against an isotropic
 * recipe). Square and hex recipes are isotropic in the plane at long wavelengths (e₁ = e₂), so
 * turning them changes nothing.
 *
 * Laminates whose layer normal lies in the plane (orientation "1" or "2") are snapped the same
 * way: the layout (layoutShapes.ts) draws the layers with their normal along the grid axis nearer
 * the principal axis it stands for, which is turned from it by the same δ (the two principal axes
 * are perpendicular, and so are the grid's). Their tensor diag(e₁, e₂) is as anisotropic as a
 * laminate gets (Wiener's bounds), so a turn costs them more than a rect tiling; counted the same
 * way since session 6.
 */

/** True for a recipe the layout stands on the grid axes: a rect lattice, or a laminate with its layer normal in the plane. */
export function standsOnGrid(r: { family: string; lattice?: string | null; orientation?: string | null }): boolean {
  return r.lattice === "rect" || (r.family === "laminate" && (r.orientation === "1" || r.orientation === "2"));
}

/** Angle (rad, 0…π/4) between principal axis 1 (at axisRad + π/2; axisRad is axis 2's angle) and the grid axis nearer it. */
export function gridMisalignmentRad(axisRad: number): number {
  const t = axisRad + Math.PI / 2;
  return Math.acos(Math.min(1, Math.max(Math.abs(Math.cos(t)), Math.abs(Math.sin(t)))));
}

/**
 * Largest relative error of the in-plane tensor diag(e₁, e₂) (complex: re, im) turned by δ against
 * the target diag(t₁, t₂) (module comment). Both targets must be non-zero.
 * Example: e = (2, 3), t = (2, 3), δ = 30° → |A₁₂|/√6 = 0.433/2.449 = 0.177.
 */
export function misalignedRelError(e1re: number, e1im: number, e2re: number, e2im: number, t1: number, t2: number, deltaRad: number): number {
  const c2 = Math.cos(deltaRad) ** 2, s2 = 1 - c2, sc = Math.sin(deltaRad) * Math.cos(deltaRad);
  const a11re = e1re * c2 + e2re * s2 - t1, a11im = e1im * c2 + e2im * s2;
  const a22re = e1re * s2 + e2re * c2 - t2, a22im = e1im * s2 + e2im * c2;
  const a12re = (e2re - e1re) * sc, a12im = (e2im - e1im) * sc;
  const x11 = Math.sqrt(a11re * a11re + a11im * a11im) / Math.abs(t1);
  const x22 = Math.sqrt(a22re * a22re + a22im * a22im) / Math.abs(t2);
  const x12 = Math.sqrt(a12re * a12re + a12im * a12im) / Math.sqrt(Math.abs(t1 * t2));
  return Math.max(x11, x22, x12);
}
