/**
 * The quasi-conformal map of a quadrilateral (Li & Pendry, "Hiding under the carpet: a new
 * strategy for cloaking", Phys. Rev. Lett. 101, 203901 (2008); sliding boundaries as in Chang,
 * Zhou, Hu & Hu, Opt. Express 18, 6089 (2010)): over the physical domain, solve Laplace's equation
 * twice on one boundary-fitted mesh —
 *   û = 0 on the left side, 1 on the right, zero normal derivative (sliding) on bottom and top;
 *   v̂ = 0 on the bottom side, 1 on the top, sliding on left and right.
 * If the quadrilateral is conformally equivalent to the rectangle [0, 1] × [0, M] (bottom and top
 * corresponding), û + iM v̂ is that conformal map, so (û, v̂) is conformal up to the constant
 * scaling M, and its energies give the conformal module M two-sidedly:
 *   E(v̂) = 1/M and E(û) = M; a conforming discretization over-estimates both energies,
 *   so 1/E_h(v̂) ≤ M ≤ E_h(û) (Dirichlet's principle; Ahlfors, "Conformal Invariants", 1973, ch. 4
 * on extremal length; Papamichael & Stylianopoulos, "Numerical Conformal Mapping", 2010, §2.4).
 * Cost: two band Cholesky factorizations of nu·nv unknowns with half-bandwidth min(nu, nv) + 1.
 */
import { InputError } from "../../core/errors.js";
import type { QuasiConformalSpec } from "../transformSpec.js";
import { coonsMesh, firstFoldedQuad, winslowSmooth, type StructuredMesh } from "./structuredMesh.js";
import { assembleLaplace, solveLaplace } from "./meshLaplace.js";
import { hermiteField, makeLocator, type HermiteField, type Locator } from "./hermitePatch.js";
import { quadSideIssues, rectOf, sideNodes } from "./quadSides.js";

export interface SolvedQuadMap {
  mesh: StructuredMesh;
  gx: HermiteField;
  gy: HermiteField;
  u: HermiteField;
  v: HermiteField;
  locator: Locator;
  moduleLower: number;
  moduleUpper: number;
  residual: number;
}

/** Winslow sweeps tried when the interpolated mesh folds. */
export const SMOOTHING_SWEEPS = 400;

const fmt = (v: number): string => String(Number(v.toPrecision(5)));

/**
 * Solve the map of a quasi-conformal spec. Throws InputError (where = "$.transform…", the caller
 * adds the file) when the sides are not a quadrilateral or the domain cannot be gridded.
 */
export function solveQuadMap(spec: QuasiConformalSpec): SolvedQuadMap {
  const issues = quadSideIssues(spec);
  if (issues.length) throw new InputError(issues.map((i) => ({ where: `$.transform.${i.path}`, message: i.message })));
  const r = rectOf(spec);
  const [nu, nv] = spec.nodes;
  const bottom = sideNodes(spec.sides.bottom, "bottom", r, nu);
  const top = sideNodes(spec.sides.top, "top", r, nu);
  const left = sideNodes(spec.sides.left, "left", r, nv);
  const right = sideNodes(spec.sides.right, "right", r, nv);
  const mesh = coonsMesh(bottom, right, top, left);
  if (firstFoldedQuad(mesh) >= 0) winslowSmooth(mesh, SMOOTHING_SWEEPS);
  const bad = firstFoldedQuad(mesh);
  let assembled = bad < 0 ? assembleLaplace(mesh) : null;
  if (bad >= 0 || !assembled || assembled.assembly === null) {
    const q = bad >= 0 ? bad : (assembled as { badQuad: number }).badQuad;
    const i = q % (nu - 1), j = Math.floor(q / (nu - 1)), p = j * nu + i;
    throw new InputError({
      where: "$.transform.sides",
      message: `cannot grid the domain between these sides: solver cell (${i}, ${j}) near (${fmt(mesh.x[p])} m, ${fmt(mesh.y[p])} m) folds even after smoothing; expected gentler sides or more nodes`,
    });
  }
  const assembly = assembled.assembly;
  const n = nu * nv;
  const fixed = new Uint8Array(n), value = new Float64Array(n);
  for (let j = 0; j < nv; j++) { fixed[j * nu] = 1; fixed[j * nu + nu - 1] = 1; value[j * nu + nu - 1] = 1; }
  const su = solveLaplace(assembly, fixed, value);
  fixed.fill(0); value.fill(0);
  for (let i = 0; i < nu; i++) { fixed[i] = 1; fixed[(nv - 1) * nu + i] = 1; value[(nv - 1) * nu + i] = 1; }
  const sv = solveLaplace(assembly, fixed, value);
  if (!su.ok || !sv.ok) throw new Error(`quasi-conformal solve failed: ${su.reason || sv.reason}`);
  assembled = null;
  const gx = hermiteField(mesh.x, nu, nv), gy = hermiteField(mesh.y, nu, nv);
  return {
    mesh, gx, gy,
    u: hermiteField(su.values, nu, nv),
    v: hermiteField(sv.values, nu, nv),
    locator: makeLocator(gx, gy),
    moduleLower: 1 / sv.energy,
    moduleUpper: su.energy,
    residual: Math.max(su.residual, sv.residual),
  };
}
