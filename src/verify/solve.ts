/**
 * Solve a 2D scene in the scattered-field formulation: u = u_inc + u_s with u_inc a grid-exact
 * solution of the background (illumination.ts), so the right-hand side vanishes outside the
 * scatterer and the PML only ever sees outgoing waves. Nodes inside a perfect conductor are held at
 * zero total field (u_s = −u_inc); how the conductor's surface enters is in gridCoefficients.ts.
 */
import { InputError } from "../core/errors.js";
import { gridOrdering } from "../numerics/gridNestedDissection.js";
import { NumericalFailure } from "../numerics/numericalFailure.js";
import { factorGridMatrix, solveWithFactor } from "../numerics/sparseLdltSolve.js";
import { assembleSparseOperator, checkGridSize } from "./assemble.js";
import type { FdfdGrid } from "./fdfdGrid.js";
import { backgroundGridCoefficients, gridCoefficients, type GridCoefficients } from "./gridCoefficients.js";
import { gridWavenumberAt, incidentField, PLANE_ALONG_X, type IncidentField, type Illumination } from "./illumination.js";
import { pmlStretch, type PmlStretch } from "./pml.js";
import { groundConductor } from "./conductor.js";
import { backgroundCoefficients, emptyScene, SAMPLE_PEC, type Scene } from "./scene.js";
import { applyOperator } from "./stencil.js";

export interface LinearSolution {
  re: Float64Array;
  im: Float64Array;
  /** smallest |pivot| / largest |diagonal| of the factorization */
  pivotRatio: number;
  /** ‖f − L u‖ / ‖f‖ of the returned solution (after iterative refinement, if any was needed) */
  residual: number;
}

/**
 * Solve L_pml u = f on grid g (f indexed by node id) with the nested-dissection direct solver
 * (src/numerics). Nodes flagged in holdZero take u = f there.
 * Throws InputError when the grid exceeds the solver's memory (checkGridSize, `limitBytes`), and
 * NumericalFailure when the factorization meets a zero pivot (the message names the node).
 */
export function solveLinear(g: FdfdGrid, c: GridCoefficients, stretch: PmlStretch | null, k0: number, fRe: Float64Array, fIm: Float64Array, holdZero: Uint8Array | null, onProgress?: (fraction: number) => void, limitBytes?: number): LinearSolution {
  checkGridSize(g, "verify grid", limitBytes);
  const f2Re = fRe.slice(), f2Im = fIm.slice();
  const m = assembleSparseOperator(g, c, stretch, k0, holdZero, f2Re, f2Im);
  const ord = gridOrdering(g.nx, g.ny);
  const fac = factorGridMatrix(m, ord, onProgress);
  const fail = (reason: string, id: number): NumericalFailure => {
    const where = id >= 0 ? ` (node ${id % g.nx}, ${Math.floor(id / g.nx)})` : "";
    return new NumericalFailure("verify solver", `${reason}${where}; the field equations have no reliable solution on this grid — try another resolution or margin`, id);
  };
  if (!fac.ok) throw fail(fac.reason, fac.badUnknown);
  const sol = solveWithFactor(m, fac.factor, fac.pivotRatio, f2Re, f2Im);
  if (!sol.ok) throw fail(sol.reason, sol.badUnknown);
  return { re: sol.re, im: sol.im, pivotRatio: sol.pivotRatio, residual: sol.residual };
}

export interface SceneSolution {
  grid: FdfdGrid;
  scene: Scene;
  k0: number;
  /** grid wavenumber of the incident wave's main direction in the background */
  kGrid: number;
  /** background wavenumber k0·n_b */
  kBackground: number;
  illumination: Illumination;
  /** power per unit length of a unit plane wave on this grid (see illumination.ts) */
  incidentIntensityPerM: number;
  /** beam components, for the far-field pattern (null for plane waves) */
  incidentComponents: IncidentField["components"];
  coefficients: GridCoefficients;
  incidentRe: Float64Array; incidentIm: Float64Array;
  scatteredRe: Float64Array; scatteredIm: Float64Array;
  totalRe: Float64Array; totalIm: Float64Array;
  pivotRatio: number;
  /** relative residual ‖f − L u‖ / ‖f‖ of the linear solve */
  residual: number;
}

export interface SolveOptions {
  /** points per grid cell side for material averaging (default 4) */
  subsamples?: number;
  /** PML strength factor (1 = design value; tests use 0 to switch it off) */
  pmlStrength?: number;
  /** default: plane wave along +x */
  illumination?: Illumination;
  /** a conducting ground plane y < yM that is part of the background (its reflection is in u_inc) */
  groundYM?: number;
  onProgress?: (fraction: number) => void;
}

/**
 * Scattered and total field of `scene` on grid g, free-space wavenumber k0 (rad/m). With u = u_inc +
 * u_s and held (conductor) nodes at zero total field, L′(ũ_inc + u_s) = 0 on the open nodes, where
 * ũ_inc is u_inc with the held nodes zeroed and L′ the operator with the scene's coefficients. The
 * system solved is L′ u_s = −(L′ ũ_inc − L_b u_inc): the background term is zero to rounding for
 * grid-exact waves, so the source lives only on and next to the scatterer.
 */
export function solveScene(sceneIn: Scene, g: FdfdGrid, k0: number, options: SolveOptions = {}): SceneSolution {
  const scene = options.groundYM === undefined ? sceneIn : withGround(sceneIn, options.groundYM);
  const { b, t } = backgroundCoefficients(scene);
  const nb = Math.sqrt(b * t);
  const kb = k0 * nb;
  const ill = options.illumination ?? PLANE_ALONG_X;
  const kGrid = gridWavenumberAt(kb, g.h, ill.angleRad);
  const c = gridCoefficients(g, scene, options.subsamples ?? 4);
  const n = g.nx * g.ny;
  const ground = options.groundYM === undefined ? null : { yM: options.groundYM, sign: (scene.polarization === "Ez" ? -1 : 1) as 1 | -1 };
  const inc = incidentField(g, kb, ill, ground);
  const incRe = inc.re, incIm = inc.im;
  const hold = c.pecNode;
  const zRe = incRe.slice(), zIm = incIm.slice();
  for (let id = 0; id < n; id++) if (hold[id]) { zRe[id] = 0; zIm[id] = 0; }
  const fRe = new Float64Array(n), fIm = new Float64Array(n);
  const bRe = new Float64Array(n), bIm = new Float64Array(n);
  applyOperator(g, c, null, k0, zRe, zIm, fRe, fIm);
  if (options.groundYM === undefined) {
    applyOperator(g, backgroundGridCoefficients(g, scene), null, k0, incRe, incIm, bRe, bIm);
  } else {
    // the background is the flat ground: the same treatment of its surface, so the source vanishes along it
    const flat = gridCoefficients(g, withGround(emptyScene(scene.polarization, scene.background), options.groundYM), options.subsamples ?? 4);
    const wRe = incRe.slice(), wIm = incIm.slice();
    for (let id = 0; id < n; id++) if (flat.pecNode[id]) { wRe[id] = 0; wIm[id] = 0; }
    applyOperator(g, flat, null, k0, wRe, wIm, bRe, bIm);
    for (let id = 0; id < n; id++) if (flat.pecNode[id]) { incRe[id] = 0; incIm[id] = 0; } // u_inc is defined above the ground only
  }
  for (let id = 0; id < n; id++) {
    if (hold[id]) { fRe[id] = 0; fIm[id] = 0; } else { fRe[id] = bRe[id] - fRe[id]; fIm[id] = bIm[id] - fIm[id]; }
  }
  const sol = solveLinear(g, c, pmlStretch(g, kb, options.pmlStrength ?? 1), k0, fRe, fIm, hold, options.onProgress);
  const totRe = new Float64Array(n), totIm = new Float64Array(n);
  for (let id = 0; id < n; id++) {
    if (hold[id]) { sol.re[id] = -incRe[id]; sol.im[id] = -incIm[id]; continue; } // zero total field inside conductors
    totRe[id] = incRe[id] + sol.re[id];
    totIm[id] = incIm[id] + sol.im[id];
  }
  return {
    grid: g, scene, k0, kGrid, kBackground: kb, illumination: ill,
    incidentIntensityPerM: inc.intensityPerM, incidentComponents: inc.components,
    coefficients: c,
    incidentRe: incRe, incidentIm: incIm,
    scatteredRe: sol.re, scatteredIm: sol.im,
    totalRe: totRe, totalIm: totIm,
    pivotRatio: sol.pivotRatio,
    residual: sol.residual,
  };
}

/** `scene` standing on a perfectly conducting ground plane y < yM (added to its conductors). */
export function withGround(scene: Scene, yM: number): Scene {
  const ground = groundConductor(yM);
  return {
    ...scene,
    bounds: { minX: -Infinity, maxX: Infinity, minY: -Infinity, maxY: Math.max(scene.bounds.maxY, yM) },
    conductors: [...(scene.conductors ?? []), ground],
    sample: (x, y, out) => (y < yM ? SAMPLE_PEC : scene.sample(x, y, out)),
    // a box that reaches the ground is sampled point by point (the conductor's treatment needs it)
    boxParts: scene.boxParts && ((x, y, h, out, normal) => (y - 0.75 * h < yM ? 0 : scene.boxParts!(x, y, h, out, normal))),
  };
}
