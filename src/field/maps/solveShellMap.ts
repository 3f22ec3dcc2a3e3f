/**
 * The Laplace-generated shell map (after Hu, Zhou & Hu, "Design method for electromagnetic cloak
 * with arbitrary shapes based on Laplace's equation", Opt. Express 17, 1308 (2009)): between an
 * inner curve r = a(θ) and an outer curve r = b(θ) around a centre, the virtual radius ρ(r, θ) is
 * the solution of Laplace's equation in the shell's polar plane (R̄θ, r), treated as flat
 * (R̄ = the mean of a and b, so the plane is close to isometric with the shell's mid-line):
 *   ∂²ρ/∂r² + R̄⁻² ∂²ρ/∂θ² = 0,  ρ = λ·a(θ) on the inner curve, ρ = b(θ) on the outer,
 * periodic in θ; the direction is kept (θ_virtual = θ). λ = 0 makes a cloak (the inner curve is
 * the image of the centre point), 0 < λ < … with λ·a < b inside a concentrator's core. For two
 * concentric circles ρ is linear in r, which is the linear radial cloak r = b(r′ − a)/(b − a)
 * (Pendry, Schurig, Smith, Science 312, 1780 (2006)) — bilinear elements reproduce it exactly.
 *
 * Discretization: nθ × nr boundary-fitted nodes (r linear between the curves along each ray),
 * bilinear elements, unknowns interleaved around the ring (0, nθ−1, 1, nθ−2, …) so the periodic
 * seam keeps the half-bandwidth at 2·nr + 1; band Cholesky; Hermite interpolation on a padded
 * copy whose last column repeats the first.
 */
import { InputError } from "../../core/errors.js";
import type { LaplaceShellSpec } from "../transformSpec.js";
import { allocBand, addToBand } from "../../numerics/bandedCholesky.js";
import { q1Stiffness, solveLaplace } from "./meshLaplace.js";
import type { HermiteField } from "./hermitePatch.js";
import { radiusFunction, shellCurveIssues } from "./shellCurves.js";

export interface SolvedShellMap {
  nTheta: number;
  nRadial: number;
  /** mean radius R̄ of the polar plane (metres) */
  meanRadiusM: number;
  /** padded Hermite fields over (nTheta + 1) × nRadial: node radius r and virtual radius ρ */
  r: HermiteField;
  rho: HermiteField;
  residual: number;
}

/** Periodic-in-i finite differences, padded with a copy of column 0 at i = n. */
function paddedHermite(values: Float64Array, n: number, m: number): HermiteField {
  const nu = n + 1;
  const f = new Float64Array(nu * m), fs = new Float64Array(nu * m), ft = new Float64Array(nu * m), fst = new Float64Array(nu * m);
  const at = (i: number, j: number): number => values[j * n + (((i % n) + n) % n)];
  const dj = (i: number, j: number): number => (m === 2 ? at(i, 1) - at(i, 0)
    : j === 0 ? 0.5 * (-3 * at(i, 0) + 4 * at(i, 1) - at(i, 2))
      : j === m - 1 ? 0.5 * (3 * at(i, m - 1) - 4 * at(i, m - 2) + at(i, m - 3))
        : 0.5 * (at(i, j + 1) - at(i, j - 1)));
  for (let j = 0; j < m; j++) {
    for (let i = 0; i <= n; i++) {
      const p = j * nu + i;
      f[p] = at(i, j);
      fs[p] = 0.5 * (at(i + 1, j) - at(i - 1, j));
      ft[p] = dj(i, j);
      fst[p] = 0.5 * (dj(i + 1, j) - dj(i - 1, j));
    }
  }
  return { nu, nv: m, f, fs, ft, fst };
}

/** Solve the shell map. Throws InputError (where = "$.transform…") for unusable curves. */
export function solveShellMap(spec: LaplaceShellSpec): SolvedShellMap {
  const issues = shellCurveIssues(spec.inner, spec.outer, spec.center);
  if (issues.length) throw new InputError(issues.map((i) => ({ where: `$.transform.${i.path}`, message: i.message })));
  const [n, m] = spec.nodes;
  const [cx, cy] = spec.center;
  const fa = radiusFunction(spec.inner, cx, cy), fb = radiusFunction(spec.outer, cx, cy);
  const a = new Float64Array(n), b = new Float64Array(n);
  let sum = 0;
  for (let i = 0; i < n; i++) {
    const th = (2 * Math.PI * i) / n;
    a[i] = fa(th); b[i] = fb(th);
    sum += 0.5 * (a[i] + b[i]);
  }
  const meanR = sum / n;
  const dX = (2 * Math.PI * meanR) / n;
  const lambda = spec.innerScale;
  if (lambda > 0) {
    for (let i = 0; i < n; i++) {
      if (!(lambda * a[i] < b[i])) {
        throw new InputError({ where: "$.transform.innerScale", message: `innerScale × inner radius reaches the outer curve at θ = ${Number(((360 * i) / n).toPrecision(5))} deg; expected innerScale < ${Number((b[i] / a[i]).toPrecision(4))}` });
      }
    }
  }
  // node radii and values, index j·n + i
  const total = n * m;
  const r = new Float64Array(total);
  for (let j = 0; j < m; j++) for (let i = 0; i < n; i++) r[j * n + i] = a[i] + ((b[i] - a[i]) * j) / (m - 1);
  const ord = (i: number): number => (i < (n + 1) >> 1 ? 2 * i : 2 * (n - 1 - i) + 1);
  const order = new Int32Array(total);
  for (let j = 0; j < m; j++) for (let i = 0; i < n; i++) order[j * n + i] = ord(i) * m + j;
  const w = 2 * m + 1;
  const band = allocBand(total, w);
  const xs = new Float64Array(4), ys = new Float64Array(4), ke = new Float64Array(16), node = new Int32Array(4);
  for (let j = 0; j + 1 < m; j++) {
    for (let i = 0; i < n; i++) {
      const i1 = (i + 1) % n;
      node[0] = j * n + i; node[1] = j * n + i1; node[2] = (j + 1) * n + i1; node[3] = (j + 1) * n + i;
      xs[0] = 0; xs[1] = dX; xs[2] = dX; xs[3] = 0;
      ys[0] = r[node[0]]; ys[1] = r[node[1]]; ys[2] = r[node[2]]; ys[3] = r[node[3]];
      if (!q1Stiffness(xs, ys, ke)) throw new Error(`shell mesh cell (${i}, ${j}) folds`);
      for (let p = 0; p < 4; p++) for (let q = 0; q <= p; q++) addToBand(band, w, order[node[p]], order[node[q]], ke[4 * p + q]);
    }
  }
  const fixed = new Uint8Array(total), value = new Float64Array(total);
  for (let i = 0; i < n; i++) {
    fixed[i] = 1; value[i] = lambda * a[i];
    fixed[(m - 1) * n + i] = 1; value[(m - 1) * n + i] = b[i];
  }
  const sol = solveLaplace({ n: total, halfBandwidth: w, order, band }, fixed, value);
  if (!sol.ok) throw new Error(`laplace-shell solve failed: ${sol.reason}`);
  return { nTheta: n, nRadial: m, meanRadiusM: meanR, r: paddedHermite(r, n, m), rho: paddedHermite(sol.values, n, m), residual: sol.residual };
}
