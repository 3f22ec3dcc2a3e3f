/**
 * The periodic cell problem of 2D quasi-static homogenization, solved numerically:
 *
 *   ∇·ε(x)(E₀ + ∇ψ) = 0 in the cell, ψ periodic;   ε_eff·E₀ = ⟨ε(E₀ + ∇ψ)⟩
 *
 * (Bensoussan, Lions, Papanicolaou, "Asymptotic Analysis for Periodic Structures", 1978, ch. 1;
 * Milton, "The Theory of Composites", 2002, ch. 1). Two solves (E₀ = x̂, ŷ) give the full in-plane
 * tensor; the out-of-plane component is the area average, exactly.
 *
 * Discretization: ψ at the centres of an nx × ny periodic grid, fluxes on the faces (the standard
 * five-point finite-volume scheme). Each face carries the ε of its dual cell smoothed across the
 * interface as Kottke, Farjadpour & Johnson, PRE 77, 036611 (2008): ε_face = n²·⟨ε⁻¹⟩⁻¹ +
 * (1 − n²)·⟨ε⟩ with ⟨·⟩ the area mean over the dual cell and n the interface normal's component
 * along the face's flux (the off-diagonal coupling of their tensor is dropped; the grid ladder in
 * homogenizeCell.ts measures what that costs).
 *
 * Solver: conjugate gradients preconditioned by the constant-coefficient periodic Laplacian,
 * inverted exactly with FFTs (the operator and its preconditioner are spectrally equivalent with
 * condition number ≤ max ε / min ε, so the count of iterations grows as the square root of the
 * contrast). Cost per iteration: two 2D FFTs, O(N log N); memory: ten arrays of N = nx·ny doubles.
 * Real permittivities only (tables are built on real contrasts; losses enter to first order, see
 * homogenizationTable.ts).
 */
import { ProgrammerError } from "../../core/errors.js";
import { fft2d, fft2dPlan, type Fft2dPlan } from "../../numerics/periodicFft2d.js";
import type { CellShape } from "./cellShape.js";

/** Face geometry of a shape on a grid: inclusion fraction and normal² per face, for any contrast. */
export interface CellFaces {
  nx: number;
  ny: number;
  hx: number;
  hy: number;
  /** inclusion area fraction of the dual cell of the x-face to the right of cell (i, j) */
  thetaX: Float64Array;
  /** n_x² there */
  normalX2: Float64Array;
  thetaY: Float64Array;
  normalY2: Float64Array;
  shape: CellShape;
}

const SUB = 8;

/**
 * Inclusion fraction of a rectangle (centre cx, cy; sides hx, hy): exact where the shape knows it,
 * otherwise by SUB × SUB sub-sampling (the shipped circle tables were built with SUB = 8).
 */
function fraction(shape: CellShape, cx: number, cy: number, hx: number, hy: number): number {
  if (shape.exactFraction) return shape.exactFraction(cx, cy, hx, hy);
  let n = 0;
  for (let a = 0; a < SUB; a++) {
    const x = wrap(cx + ((a + 0.5) / SUB - 0.5) * hx, shape.lx);
    for (let b = 0; b < SUB; b++) {
      const y = wrap(cy + ((b + 0.5) / SUB - 0.5) * hy, shape.ly);
      if (shape.inside(x, y)) n++;
    }
  }
  return n / (SUB * SUB);
}

const wrap = (v: number, l: number): number => (v < 0 ? v + l : v >= l ? v - l : v);

/** Face fractions and normals of `shape` on an nx × ny grid. */
export function cellFaces(shape: CellShape, nx: number, ny: number): CellFaces {
  const hx = shape.lx / nx, hy = shape.ly / ny;
  const n = nx * ny;
  const thetaX = new Float64Array(n), normalX2 = new Float64Array(n);
  const thetaY = new Float64Array(n), normalY2 = new Float64Array(n);
  const nrm = new Float64Array(2);
  const reach = Math.hypot(hx, hy);
  for (let j = 0; j < ny; j++) {
    for (let i = 0; i < nx; i++) {
      const k = i + nx * j;
      // x-face: at ((i+1)hx, (j+½)hy); y-face: at ((i+½)hx, (j+1)hy)
      const xfX = wrap((i + 1) * hx, shape.lx), xfY = (j + 0.5) * hy;
      if (shape.distance(xfX, xfY) > reach) thetaX[k] = shape.inside(xfX, xfY) ? 1 : 0;
      else {
        thetaX[k] = fraction(shape, xfX, xfY, hx, hy);
        shape.normal(xfX, xfY, nrm);
        normalX2[k] = nrm[0] * nrm[0];
      }
      const yfX = (i + 0.5) * hx, yfY = wrap((j + 1) * hy, shape.ly);
      if (shape.distance(yfX, yfY) > reach) thetaY[k] = shape.inside(yfX, yfY) ? 1 : 0;
      else {
        thetaY[k] = fraction(shape, yfX, yfY, hx, hy);
        shape.normal(yfX, yfY, nrm);
        normalY2[k] = nrm[1] * nrm[1];
      }
    }
  }
  return { nx, ny, hx, hy, thetaX, normalX2, thetaY, normalY2, shape };
}

/** Smoothed face permittivity (host epsH, inclusion epsI, fraction θ, normal² along the flux). */
export function faceEps(epsH: number, epsI: number, theta: number, n2: number): number {
  if (theta <= 0) return epsH;
  if (theta >= 1) return epsI;
  const mean = (1 - theta) * epsH + theta * epsI;
  const harm = 1 / ((1 - theta) / epsH + theta / epsI);
  return n2 * harm + (1 - n2) * mean;
}

/** ∂faceEps/∂epsI (faceEps above, differentiated). */
export function faceEpsDerivative(epsH: number, epsI: number, theta: number, n2: number): number {
  if (theta <= 0) return 0;
  if (theta >= 1) return 1;
  const harm = 1 / ((1 - theta) / epsH + theta / epsI);
  return n2 * harm * harm * theta / (epsI * epsI) + (1 - n2) * theta;
}

export interface CellSolve {
  /** ⟨ε(E₀ + ∇ψ)⟩: the column of ε_eff for E₀ (x and y components) */
  fluxX: number;
  fluxY: number;
  /** ⟨(E₀ + ∇ψ)·ε(E₀ + ∇ψ)⟩ (equals E₀·ε_eff·E₀ at convergence) */
  energy: number;
  /**
   * d(energy)/d(epsI) of the discrete problem: ⟨(∂ε_face/∂ε_I)·|E₀ + ∇ψ|²⟩ on the faces. The
   * energy is stationary in ψ, so this needs no second solve (envelope theorem; the continuum
   * form is ∂ε_eff/∂ε_I = ⟨|E|²⟩ over the inclusion, Milton 2002, §18.2). For E₀ = x̂ it is
   * ∂ε_xx/∂ε_I, the derivative the first-order loss term of a lossy inclusion needs.
   */
  energyDerivative: number;
  iterations: number;
  /** final ‖r‖/‖b‖ of the preconditioned CG */
  residual: number;
  converged: boolean;
}

/** Work arrays of one grid size, reused across solves (nothing allocated per solve). */
export interface CellWorkspace {
  plan: Fft2dPlan;
  epsX: Float64Array; epsY: Float64Array;
  psi: Float64Array; r: Float64Array; z: Float64Array; p: Float64Array; q: Float64Array;
  fre: Float64Array; fim: Float64Array; lap: Float64Array;
}

export function cellWorkspace(nx: number, ny: number, hx: number, hy: number): CellWorkspace {
  const n = nx * ny;
  const lap = new Float64Array(n);
  for (let j = 0; j < ny; j++) {
    const sy = Math.sin((Math.PI * j) / ny);
    for (let i = 0; i < nx; i++) {
      const sx = Math.sin((Math.PI * i) / nx);
      const l = (4 * sx * sx) / (hx * hx) + (4 * sy * sy) / (hy * hy);
      lap[i + nx * j] = l > 0 ? 1 / l : 0;
    }
  }
  const f = () => new Float64Array(n);
  return { plan: fft2dPlan(nx, ny), epsX: f(), epsY: f(), psi: f(), r: f(), z: f(), p: f(), q: f(), fre: f(), fim: f(), lap };
}

/** out = K v with K = Dxᵀ εx Dx + Dyᵀ εy Dy (periodic). */
function applyK(w: CellWorkspace, nx: number, ny: number, hx: number, hy: number, v: Float64Array, out: Float64Array): void {
  const { epsX, epsY } = w;
  const ix2 = 1 / (hx * hx), iy2 = 1 / (hy * hy);
  for (let j = 0; j < ny; j++) {
    const jn = j === ny - 1 ? 0 : j + 1, jp = j === 0 ? ny - 1 : j - 1;
    for (let i = 0; i < nx; i++) {
      const k = i + nx * j;
      const ie = i === nx - 1 ? k - nx + 1 : k + 1;
      const iw = i === 0 ? k + nx - 1 : k - 1;
      const kn = i + nx * jn, ks = i + nx * jp;
      const vk = v[k];
      out[k] = ix2 * (epsX[k] * (vk - v[ie]) + epsX[iw] * (vk - v[iw])) + iy2 * (epsY[k] * (vk - v[kn]) + epsY[ks] * (vk - v[ks]));
    }
  }
}

/** z = L⁻¹ r with L the periodic five-point Laplacian (mean-free). */
function precondition(w: CellWorkspace, r: Float64Array, z: Float64Array): void {
  const { fre, fim, lap } = w;
  fre.set(r);
  fim.fill(0);
  fft2d(w.plan, fre, fim, false);
  for (let k = 0; k < fre.length; k++) { fre[k] *= lap[k]; fim[k] *= lap[k]; }
  fft2d(w.plan, fre, fim, true);
  z.set(fre);
}

export interface CellSolveOptions {
  tolerance?: number;
  maxIterations?: number;
}

/**
 * Solve the cell problem for E₀ = (e0x, e0y) with host permittivity epsH and inclusion epsI (both
 * real > 0). Writes the smoothed face ε into the workspace, then runs PCG from ψ = 0.
 */
export function solveCellProblem(faces: CellFaces, w: CellWorkspace, epsH: number, epsI: number, e0x: number, e0y: number, opts: CellSolveOptions = {}): CellSolve {
  if (!(epsH > 0) || !(epsI > 0)) throw new ProgrammerError("solveCellProblem: permittivities must be real and > 0", { epsH, epsI });
  const { nx, ny, hx, hy } = faces;
  const n = nx * ny;
  const tol = opts.tolerance ?? 1e-9;
  const maxIt = opts.maxIterations ?? 4000;
  const { epsX, epsY, psi, r, z, p, q } = w;
  for (let k = 0; k < n; k++) {
    epsX[k] = faceEps(epsH, epsI, faces.thetaX[k], faces.normalX2[k]);
    epsY[k] = faceEps(epsH, epsI, faces.thetaY[k], faces.normalY2[k]);
  }
  // b = −(Dxᵀ εx E0x + Dyᵀ εy E0y); Dxᵀ g at k = (g[k−1] − g[k])/hx
  for (let j = 0; j < ny; j++) {
    const jp = j === 0 ? ny - 1 : j - 1;
    for (let i = 0; i < nx; i++) {
      const k = i + nx * j;
      const iw = i === 0 ? k + nx - 1 : k - 1;
      const ks = i + nx * jp;
      r[k] = -((epsX[iw] - epsX[k]) * e0x / hx + (epsY[ks] - epsY[k]) * e0y / hy);
    }
  }
  psi.fill(0);
  let bNorm = 0;
  for (let k = 0; k < n; k++) bNorm += r[k] * r[k];
  bNorm = Math.sqrt(bNorm);
  let it = 0;
  let rel = 0;
  if (bNorm > 0) {
    precondition(w, r, z);
    p.set(z);
    let rz = 0;
    for (let k = 0; k < n; k++) rz += r[k] * z[k];
    for (it = 1; it <= maxIt; it++) {
      applyK(w, nx, ny, hx, hy, p, q);
      let pq = 0;
      for (let k = 0; k < n; k++) pq += p[k] * q[k];
      const alpha = rz / pq;
      let rr = 0;
      for (let k = 0; k < n; k++) {
        psi[k] += alpha * p[k];
        r[k] -= alpha * q[k];
        rr += r[k] * r[k];
      }
      rel = Math.sqrt(rr) / bNorm;
      if (rel < tol) break;
      precondition(w, r, z);
      let rzNew = 0;
      for (let k = 0; k < n; k++) rzNew += r[k] * z[k];
      const beta = rzNew / rz;
      rz = rzNew;
      for (let k = 0; k < n; k++) p[k] = z[k] + beta * p[k];
    }
    if (it > maxIt) it = maxIt;
  }
  // fluxes and energy
  let fx = 0, fy = 0, en = 0, den = 0;
  const { thetaX, thetaY, normalX2, normalY2 } = faces;
  for (let j = 0; j < ny; j++) {
    const jn = j === ny - 1 ? 0 : j + 1;
    for (let i = 0; i < nx; i++) {
      const k = i + nx * j;
      const ie = i === nx - 1 ? k - nx + 1 : k + 1;
      const gx = e0x + (psi[ie] - psi[k]) / hx;
      const gy = e0y + (psi[i + nx * jn] - psi[k]) / hy;
      fx += epsX[k] * gx;
      fy += epsY[k] * gy;
      en += epsX[k] * gx * gx + epsY[k] * gy * gy;
      den += faceEpsDerivative(epsH, epsI, thetaX[k], normalX2[k]) * gx * gx + faceEpsDerivative(epsH, epsI, thetaY[k], normalY2[k]) * gy * gy;
    }
  }
  return { fluxX: fx / n, fluxY: fy / n, energy: en / n, energyDerivative: den / n, iterations: it, residual: rel, converged: rel < tol || bNorm === 0 };
}
