/**
 * A device's material as the FDFD check sees it: per device cell, the out-of-plane constant b and
 * the in-plane tensor T (Ez: ε_zz and μ_xx, μ_yy, μ_xy; Hz: μ_zz and ε_xx, ε_yy, ε_xy), real parts,
 * plus which cells had no value (those are filled with the background and counted).
 * Built from a reduced field (ideal = scheme `full`, reduced = the chosen scheme) or from a plan's
 * achieved per-cell values (realized).
 */
import type { Plan, Recipe } from "../plan/planTypes.js";
import { standsOnGrid } from "../plan/latticeMisalignment.js";
import { axis1AlongX } from "../plan/layout/rectSites.js";
import type { ReducedField } from "../reduce/reducedField.js";

export interface MaterialMap {
  b: Float64Array;
  txx: Float64Array;
  tyy: Float64Array;
  txy: Float64Array;
  /** imaginary parts (loss, exp(−iωt): Im ≥ 0 when passive); absent for lossless maps */
  bIm?: Float64Array;
  txxIm?: Float64Array;
  tyyIm?: Float64Array;
  txyIm?: Float64Array;
  /** cells that carry no value and were set to the background */
  missing: number;
}

/** The map of a reduced field (Ez or Hz). Undefined cells (NaN components) become background (b_bg, t_bg). */
export function mapFromReduced(reduced: ReducedField, background: { b: number; t: number }): MaterialMap {
  const ez = reduced.polarization === "Ez";
  const comp = reduced.components;
  const src = ez ? [comp.eps_zz, comp.mu_xx, comp.mu_yy, comp.mu_xy] : [comp.mu_zz, comp.eps_xx, comp.eps_yy, comp.eps_xy];
  if (src.some((a) => a === undefined)) throw new RangeError(`mapFromReduced: expected a ${reduced.polarization} reduction`);
  const n = reduced.count;
  const m: MaterialMap = { b: new Float64Array(n), txx: new Float64Array(n), tyy: new Float64Array(n), txy: new Float64Array(n), missing: 0 };
  for (let c = 0; c < n; c++) {
    const ok = Number.isFinite(src[0][c]) && Number.isFinite(src[1][c]) && Number.isFinite(src[2][c]) && Number.isFinite(src[3][c]);
    if (!ok) { m.b[c] = background.b; m.txx[c] = background.t; m.tyy[c] = background.t; m.txy[c] = 0; m.missing++; continue; }
    m.b[c] = src[0][c]; m.txx[c] = src[1][c]; m.tyy[c] = src[2][c]; m.txy[c] = src[3][c];
  }
  return m;
}

/**
 * The realized map of a plan: each cell takes its level's recipe's achieved values — out-of-plane
 * value, smaller and larger in-plane principal values — with the larger one along the cell's
 * principal axis (angle θ from x): T = λ1 I + (λ2 − λ1) e eᵀ, e = (cos θ, sin θ). Cells whose level
 * has no recipe are set to the background (nothing can be built there) and counted.
 * Loss: the recipe's achieved imaginary parts at the design frequency (the same principal-frame
 * rotation applies to them).
 * Recipes the shop stands on the grid (plan/latticeMisalignment.ts `standsOnGrid`: rect lattices,
 * laminates with their layer normal in the plane) are built with their axes along the grid axes
 * nearer the cell's principal axes (layout/rectSites.ts, layoutShapes.ts), so their tensor takes
 * that snapped angle (builtAxisAngleRad), not the target's: the map is the device as built, whose
 * turn from the target the plan counts in rel_error.
 */
export function mapFromPlan(plan: Plan, background: { b: number; t: number }): MaterialMap {
  const n = plan.grid.count;
  const m: MaterialMap = {
    b: new Float64Array(n), txx: new Float64Array(n), tyy: new Float64Array(n), txy: new Float64Array(n), missing: 0,
    bIm: new Float64Array(n), txxIm: new Float64Array(n), tyyIm: new Float64Array(n), txyIm: new Float64Array(n),
  };
  for (let c = 0; c < n; c++) {
    const l = plan.level[c];
    const recipe = l >= 0 ? plan.levels[l]?.recipe ?? null : null;
    if (!recipe) { m.b[c] = background.b; m.txx[c] = background.t; m.tyy[c] = background.t; m.txy[c] = 0; m.missing++; continue; }
    const [z, l1, l2] = recipe.achieved;
    const th = builtAxisAngleRad(recipe, plan.axisAngleRad[c]);
    // a snapped angle exactly (cos π/2 is not 0 in floating point)
    const co = th === Math.PI / 2 && th !== plan.axisAngleRad[c] ? 0 : Math.cos(th), si = Math.sin(th), d = l2 - l1;
    m.b[c] = z;
    m.txx[c] = l1 + d * co * co;
    m.tyy[c] = l1 + d * si * si;
    m.txy[c] = d * co * si;
    const [zi, l1i, l2i] = recipe.achievedIm ?? [0, 0, 0];
    const di = (l2i ?? 0) - (l1i ?? 0);
    m.bIm![c] = zi ?? 0; m.txxIm![c] = (l1i ?? 0) + di * co * co; m.tyyIm![c] = (l1i ?? 0) + di * si * si; m.txyIm![c] = di * co * si;
  }
  return m;
}

/**
 * Angle (rad) of principal axis 2 as the recipe is built in a cell whose target's axis 2 stands at
 * `axisRad`: for recipes standing on the grid, 0 or π/2 as the layouts and the drawn case place
 * them (a rect lattice's x axis, along axis 1, on the grid axis nearer axis 1; a laminate's layer
 * normal on the grid axis nearer the principal axis it stands for, geometryScene.ts); otherwise
 * `axisRad` itself. Example: a rect recipe at axisRad = 1.2 (axis 1 at 159°, nearer x) → π/2.
 */
export function builtAxisAngleRad(recipe: Pick<Recipe, "family" | "lattice" | "orientation">, axisRad: number): number {
  if (!standsOnGrid(recipe)) return axisRad;
  if (recipe.family === "laminate") {
    const normal = recipe.orientation === "2" ? axisRad : axisRad + Math.PI / 2;
    const normalX = Math.abs(Math.cos(normal)) >= Math.abs(Math.sin(normal));
    // the normal is axis 2 (orientation "2") or axis 1: axis 2 along x exactly when the normal along x is axis 2's
    return (recipe.orientation === "2") === normalX ? 0 : Math.PI / 2;
  }
  return axis1AlongX(axisRad) ? Math.PI / 2 : 0;
}

/** Largest local index over the map: max over cells of sqrt(|b| · largest |principal value of T|). */
export function largestIndex(m: MaterialMap): number {
  let best = 0;
  for (let c = 0; c < m.b.length; c++) {
    const a = m.txx[c], d = m.tyy[c], x = m.txy[c];
    const lam = Math.abs((a + d) / 2) + Math.sqrt(((a - d) / 2) ** 2 + x * x);
    const n = Math.sqrt(Math.abs(m.b[c]) * lam);
    if (n > best) best = n;
  }
  return best;
}
