/**
 * Lowest photonic band of a 2D lattice of circles (rods or holes) by plane-wave expansion (Ho,
 * Chan, Soukoulis, PRL 65, 3152 (1990)), and the effective index it implies at a given frequency.
 *
 * Field along the circles' axis (E_z, "parallel"): |k + G|² e_G = k₀² Σ_G' ε(G − G') e_G'.
 * Field across them (H_z, "perpendicular"): Σ_G' η(G − G')(k + G)·(k + G') h_G' = k₀² h_G with η the
 * Fourier coefficients of 1/ε (the "inverse rule", which converges best for this polarization).
 * Circle of radius r in a cell of area A: c(G) = c_h δ_G0 + (c_i − c_h)·f·2J₁(Gr)/(Gr).
 *
 * Square, hexagonal and rectangular lattices (bandLattice.ts: the directions and plane waves of
 * each). For a Bloch wavevector k along a principal direction the smallest eigenvalue k₀²(k) is
 * found by inverse iteration (complex Cholesky of the Hermitian matrix); the band index at the
 * design frequency is k/k₀ where k₀²(k) meets the design k₀² (regula falsi in k: the lowest band rises
 * monotonically from Γ). The deviation from the long-wavelength limit of the same expansion, taken
 * along the same direction (a rect lattice is anisotropic already in that limit), measures spatial
 * dispersion; both use the same truncation, so its error largely cancels (tests: M = 4 against
 * M = 6). Real ε only (losses do not move the band at first order in this use). Cost: one complex
 * Cholesky (perpendicular) or one inverse iteration (parallel) per step of the root search, about
 * ten per direction: 20–80 ms for square and hex (49 and 61 plane waves), 0.1–0.6 s for rect at R = 3
 * (151 waves, three directions).
 */
import { ProgrammerError } from "../../core/errors.js";
import { NumericalFailure } from "../../numerics/numericalFailure.js";
import { maxCircleFill } from "../homogenize/cellShape.js";
import { bandDirections, bandLatticeGeometry, planeWaveCutoff, type BandLattice } from "./bandLattice.js";

/** J₁(x): Abramowitz & Stegun 9.4.4 (|x| ≤ 3) and 9.4.6 (x ≥ 3). */
export function besselJ1(x: number): number {
  const ax = Math.abs(x);
  let v: number;
  if (ax <= 3) {
    const y = (ax / 3) ** 2;
    v = ax * (0.5 + y * (-0.56249985 + y * (0.21093573 + y * (-0.03954289 + y * (0.00443319 + y * (-0.00031761 + y * 0.00001109))))));
  } else {
    const y = 3 / ax;
    const f1 = 0.79788456 + y * (0.00000156 + y * (0.01659667 + y * (0.00017105 + y * (-0.00249511 + y * (0.00113653 - y * 0.00020033)))));
    const t1 = ax - 2.35619449 + y * (0.12499612 + y * (0.0000565 + y * (-0.00637879 + y * (0.00074348 + y * (0.00079824 - y * 0.00029166)))));
    v = (f1 * Math.cos(t1)) / Math.sqrt(ax);
  }
  return x < 0 ? -v : v;
}

export type BandPolarization = "parallel" | "perpendicular";

export interface BandCell {
  lattice: BandLattice;
  /** rect only: b/a (spacing along y over spacing along x), BAND_ASPECT_RANGE; default 1 */
  aspect?: number;
  /** relative permittivities (real) of the host and the circles */
  epsHost: number;
  epsCircle: number;
  fill: number;
}

interface Basis {
  gx: Float64Array;
  gy: Float64Array;
  /** Fourier coefficient of ε (parallel) or 1/ε (perpendicular) for each pair, row-major n × n */
  coef: Float64Array;
  n: number;
}

function basis(cell: BandCell, pol: BandPolarization, m: number): Basis {
  const aspect = cell.aspect ?? 1;
  const v = bandLatticeGeometry(cell.lattice, aspect);
  // reciprocal vectors inside a disc (keeps the lattice's symmetry, unlike an index square);
  // |i| ≤ |G|·|a1|/2π and |j| ≤ |G|·|a2|/2π bound the indices of every G in it
  const gx: number[] = [], gy: number[] = [];
  const gMax = planeWaveCutoff(cell.lattice, m, aspect) * (1 + 1e-9);
  const iMax = Math.ceil((gMax * Math.hypot(v.a1[0], v.a1[1])) / (2 * Math.PI));
  const jMax = Math.ceil((gMax * Math.hypot(v.a2[0], v.a2[1])) / (2 * Math.PI));
  for (let i = -iMax; i <= iMax; i++) for (let j = -jMax; j <= jMax; j++) {
    const x = i * v.b1[0] + j * v.b2[0], y = i * v.b1[1] + j * v.b2[1];
    if (Math.hypot(x, y) <= gMax) { gx.push(x); gy.push(y); }
  }
  const n = gx.length;
  const r = Math.sqrt((cell.fill * v.area) / Math.PI);
  const [ch, ci] = pol === "parallel" ? [cell.epsHost, cell.epsCircle] : [1 / cell.epsHost, 1 / cell.epsCircle];
  const coef = new Float64Array(n * n);
  for (let a = 0; a < n; a++) for (let b = 0; b < n; b++) {
    const dx = gx[a] - gx[b], dy = gy[a] - gy[b];
    const g = Math.hypot(dx, dy);
    coef[a * n + b] = g === 0 ? ch + (ci - ch) * cell.fill : (ci - ch) * cell.fill * ((2 * besselJ1(g * r)) / (g * r));
  }
  return { gx: Float64Array.from(gx), gy: Float64Array.from(gy), coef, n };
}

/** In-place Cholesky of a Hermitian PD matrix (re, im row-major n × n, lower triangle used). False if not PD. */
function cholesky(re: Float64Array, im: Float64Array, n: number): boolean {
  for (let j = 0; j < n; j++) {
    let d = re[j * n + j];
    for (let k = 0; k < j; k++) d -= re[j * n + k] ** 2 + im[j * n + k] ** 2;
    if (!(d > 0)) return false;
    const ljj = Math.sqrt(d);
    re[j * n + j] = ljj; im[j * n + j] = 0;
    for (let i = j + 1; i < n; i++) {
      let sr = re[i * n + j], si = im[i * n + j];
      for (let k = 0; k < j; k++) {
        // L_ik · conj(L_jk)
        const ar = re[i * n + k], ai = im[i * n + k], br = re[j * n + k], bi = -im[j * n + k];
        sr -= ar * br - ai * bi;
        si -= ar * bi + ai * br;
      }
      re[i * n + j] = sr / ljj; im[i * n + j] = si / ljj;
    }
  }
  return true;
}

/** Solve L Lᴴ x = b in place (xr, xi). */
function cholSolve(re: Float64Array, im: Float64Array, n: number, xr: Float64Array, xi: Float64Array): void {
  for (let i = 0; i < n; i++) {
    let sr = xr[i], si = xi[i];
    for (let k = 0; k < i; k++) {
      const ar = re[i * n + k], ai = im[i * n + k];
      sr -= ar * xr[k] - ai * xi[k];
      si -= ar * xi[k] + ai * xr[k];
    }
    xr[i] = sr / re[i * n + i]; xi[i] = si / re[i * n + i];
  }
  for (let i = n - 1; i >= 0; i--) {
    let sr = xr[i], si = xi[i];
    for (let k = i + 1; k < n; k++) {
      // conj(L_ki)
      const ar = re[k * n + i], ai = -im[k * n + i];
      sr -= ar * xr[k] - ai * xi[k];
      si -= ar * xi[k] + ai * xr[k];
    }
    xr[i] = sr / re[i * n + i]; xi[i] = si / re[i * n + i];
  }
}

/**
 * Smallest eigenvalue k₀²a² at Bloch wavevector (kx, ky)·(1/a) for the cell (a = 1). Inverse
 * iteration from the uniform vector; 60 iterations at most (the gap to the next band is large
 * near Γ, so a few suffice).
 */
export function lowestEigenvalue(b: Basis, pol: BandPolarization, kx: number, ky: number): number {
  const n = b.n;
  const re = new Float64Array(n * n), im = new Float64Array(n * n);
  const xr = new Float64Array(n), xi = new Float64Array(n), yr = new Float64Array(n), yi = new Float64Array(n);
  if (pol === "perpendicular") {
    for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) {
      const dot = (kx + b.gx[i]) * (kx + b.gx[j]) + (ky + b.gy[i]) * (ky + b.gy[j]);
      re[i * n + j] = b.coef[i * n + j] * dot;
    }
    if (!cholesky(re, im, n)) return NaN;
    xr.fill(1 / Math.sqrt(n));
    let lambda = NaN;
    for (let it = 0; it < 60; it++) {
      yr.set(xr); yi.set(xi);
      cholSolve(re, im, n, yr, yi);
      let nrm = 0, dot = 0;
      for (let i = 0; i < n; i++) { nrm += yr[i] ** 2 + yi[i] ** 2; dot += xr[i] * yr[i] + xi[i] * yi[i]; }
      const next = 1 / (dot / 1);
      nrm = Math.sqrt(nrm);
      for (let i = 0; i < n; i++) { xr[i] = yr[i] / nrm; xi[i] = yi[i] / nrm; }
      if (Math.abs(next - lambda) < 1e-13 * Math.abs(next)) { lambda = next; break; }
      lambda = next;
    }
    return lambda;
  }
  // parallel: A e = λ B e with A = diag|k+G|², B = [ε(G−G')] (PD): inverse iteration x ← A⁻¹Bx,
  // λ = xᴴAx / xᴴBx
  const a = new Float64Array(n);
  for (let i = 0; i < n; i++) a[i] = (kx + b.gx[i]) ** 2 + (ky + b.gy[i]) ** 2;
  xr.fill(1 / Math.sqrt(n));
  let lambda = NaN;
  for (let it = 0; it < 200; it++) {
    for (let i = 0; i < n; i++) {
      let s = 0;
      for (let j = 0; j < n; j++) s += b.coef[i * n + j] * xr[j];
      yr[i] = s / a[i];
    }
    let num = 0, den = 0, nrm = 0;
    for (let i = 0; i < n; i++) nrm += yr[i] ** 2;
    nrm = Math.sqrt(nrm);
    for (let i = 0; i < n; i++) yr[i] /= nrm;
    for (let i = 0; i < n; i++) {
      num += a[i] * yr[i] * yr[i];
      let s = 0;
      for (let j = 0; j < n; j++) s += b.coef[i * n + j] * yr[j];
      den += yr[i] * s;
    }
    const next = num / den;
    xr.set(yr);
    if (Math.abs(next - lambda) < 1e-13 * Math.abs(next)) { lambda = next; break; }
    lambda = next;
  }
  return lambda;
}

export interface BandIndex {
  /** the principal directions, by name (square: Γ–X, Γ–M; hex: Γ–M, Γ–K; rect: Γ–X, Γ–Y, Γ–S) */
  directions: string[];
  /** effective index k/k₀ along each direction (NaN where the frequency is above the band's edge) */
  index: number[];
  /** the same expansion's long-wavelength index along each direction */
  quasiStaticIndex: number[];
  /** the long-wavelength index along the first direction */
  quasiStatic: number;
  /** largest |n_band/n_quasiStatic − 1| over the directions, each against its own long-wavelength value */
  deviation: number;
  /** (largest − smallest index) / mean over the directions (a rect lattice's quasi-static anisotropy included) */
  anisotropy: number;
  /**
   * the anisotropy spatial dispersion adds: the same figure for the ratios n_band/n_quasiStatic
   * (equal to `anisotropy` for square and hex, whose long-wavelength index is isotropic)
   */
  excessAnisotropy: number;
  /** false when the design frequency lies above the lowest band's edge along a direction */
  inBand: boolean;
  planeWaves: number;
}

/**
 * The k in (0, edge] where g(k) = √λ(k) − k₀a crosses zero (g(0) = −k₀a < 0 ≤ g(edge)): regula
 * falsi with the Illinois modification (Dowell & Jarratt, BIT 11, 168 (1971)); √λ is nearly linear
 * in k below the zone edge, so a handful of eigen solves suffice where bisection took 32. Stops when
 * the bracket is below 1e-12 of the edge or g vanishes to 1e-14 of k₀a; 60 steps at most (then the
 * bracket's mid-point).
 */
function crossing(g: (k: number) => number, edge: number, scale: number): number {
  // g(0) = −k₀a exactly: the lowest band starts at zero frequency
  let lo = 0, hi = edge, glo = -scale, ghi = g(edge);
  if (ghi === 0) return hi;
  let side = 0;
  for (let it = 0; it < 60; it++) {
    const k = (lo * ghi - hi * glo) / (ghi - glo);
    const gk = g(k);
    if (Math.abs(gk) <= 1e-14 * scale || hi - lo < 1e-12 * edge) return k;
    if (gk < 0) {
      lo = k; glo = gk;
      if (side === -1) ghi /= 2;
      side = -1;
    } else {
      hi = k; ghi = gk;
      if (side === 1) glo /= 2;
      side = 1;
    }
  }
  return 0.5 * (lo + hi);
}

const spreadOverMean = (x: number[]): number => {
  const v = (Math.max(...x) - Math.min(...x)) / (x.reduce((a, b) => a + b, 0) / x.length);
  return Number.isFinite(v) ? v : Infinity;
};

/**
 * Band index at normalized frequency k₀a (a = the spacing along x: the pitch; rect: the spacing
 * a, with b = aspect·a along y) for the cell and polarization.
 * Throws ProgrammerError for non-positive permittivities, a fill outside [0, 1) or an aspect
 * outside BAND_ASPECT_RANGE.
 * Example: a homogeneous cell (epsHost = epsCircle = 4) gives index [2, 2] at any k₀a below the
 * zone edge (the light line).
 */
export function bandIndex(cell: BandCell, pol: BandPolarization, k0a: number, m = 4): BandIndex {
  if (!(cell.epsHost > 0) || !(cell.epsCircle > 0)) throw new ProgrammerError("bandIndex: permittivities must be real and > 0", cell);
  const fMax = maxCircleFill(cell.lattice, cell.aspect ?? 1);
  if (!(cell.fill >= 0 && cell.fill < fMax)) throw new ProgrammerError(`bandIndex: fill must be in [0, ${fMax}) (touching circles)`, cell);
  if (!(k0a > 0) || !Number.isFinite(k0a)) throw new ProgrammerError(`bandIndex: k0a must be finite and > 0, got ${k0a}`);
  const b = basis(cell, pol, m);
  const target = k0a * k0a;
  const dirs = bandDirections(cell.lattice, cell.aspect ?? 1);
  const index = dirs.map(() => NaN);
  let inBand = true;
  dirs.forEach(({ dir, edge }, d) => {
    const at = (k: number) => lowestEigenvalue(b, pol, k * dir[0], k * dir[1]);
    const atEdge = at(edge);
    if (Number.isNaN(atEdge)) throw new NumericalFailure("lowest band", `the plane-wave matrix is not positive definite (${cell.lattice}, fill ${cell.fill})`);
    if (atEdge < target) { inBand = false; index[d] = NaN; return; }
    index[d] = crossing((k) => Math.sqrt(at(k)) - k0a, edge, k0a) / k0a;
  });
  const kSmall = 1e-3;
  const qs = dirs.map(({ dir }) => kSmall / Math.sqrt(lowestEigenvalue(b, pol, kSmall * dir[0], kSmall * dir[1])));
  const ratio = index.map((x, d) => x / qs[d]);
  const deviation = Math.max(...ratio.map((r) => (Number.isFinite(r) ? Math.abs(r - 1) : Infinity)));
  return {
    directions: dirs.map((x) => x.name),
    index,
    quasiStaticIndex: qs,
    quasiStatic: qs[0],
    deviation,
    anisotropy: spreadOverMean(index),
    excessAnisotropy: spreadOverMean(ratio),
    inBand,
    planeWaves: b.n,
  };
}
