/**
 * Exact scattering of a plane wave by an infinite circular cylinder (dielectric or perfectly
 * conducting), as a Bessel–Hankel series — the reference the FDFD solver is checked against.
 *
 * Convention exp(−iωt); incident u_inc = exp(i k x) = Σ_n i^n J_n(kr) e^{inφ} (Jacobi–Anger);
 * scattered u_s = Σ_n i^n a_n H_n^(1)(kr) e^{inφ}; inside u = Σ_n i^n c_n J_n(k_c r) e^{inφ}.
 * u is E_z for polarization Ez and H_z for Hz. Continuity of u and of (1/μ)∂u/∂r (Ez) or
 * (1/ε)∂u/∂r (Hz) at r = a gives, with x = ka, y = k_c a and q = (k_c/k)·(μ_b/μ_c) (Ez) or
 * (k_c/k)·(ε_b/ε_c) (Hz):
 *   a_n = [q J_n'(y) J_n(x) − J_n'(x) J_n(y)] / [J_n(y) H_n'(x) − q J_n'(y) H_n(x)],
 * and for a perfect conductor a_n = −J_n(x)/H_n(x) (Ez), −J_n'(x)/H_n'(x) (Hz).
 * Scattering width (2D cross-section) σ_s = (4/k) Σ_{n=−∞}^{∞} |a_n|², extinction width
 * σ_ext = −(4/k) Re Σ a_n (optical theorem). (Balanis, "Advanced Engineering Electromagnetics",
 * 2nd ed., 2012, §11.5; Bohren & Huffman, "Absorption and Scattering of Light by Small Particles",
 * 1983, §8.4 — written there with exp(−iωt) too.) a_{−n} = a_n for these cylinders.
 * Real, positive material constants only (a lossy interior would need Bessel functions of a
 * complex argument).
 */
import { besselJY } from "./bessel.js";

export type CylinderInterior = { kind: "dielectric"; eps: number; mu: number } | { kind: "pec" };

export interface CylinderProblem {
  polarization: "Ez" | "Hz";
  radiusM: number;
  /** free-space wavenumber k0 = ω/c, rad/m */
  k0: number;
  background: { eps: number; mu: number };
  interior: CylinderInterior;
}

export interface CylinderSeries {
  problem: CylinderProblem;
  /** background wavenumber k = k0 sqrt(ε_b μ_b) */
  k: number;
  /** highest order kept */
  order: number;
  /** a_n, n = 0 … order */
  aRe: Float64Array;
  aIm: Float64Array;
}

/** Orders kept: ka + 4 (ka)^(1/3) + 10 (Wiscombe's rule for Mie series, Appl. Opt. 19, 1505 (1980), plus margin). */
function ordersFor(x: number): number {
  return Math.ceil(x + 4 * Math.cbrt(x) + 10);
}

/** Derivatives Z_n' = (Z_{n−1} − Z_{n+1})/2 with Z_{−1} = −Z_1 (A&S 9.1.27). */
function derivative(z: Float64Array, n: number): number {
  return n === 0 ? -z[1] : 0.5 * (z[n - 1] - z[n + 1]);
}

/** Series coefficients a_n of the scattered field. Throws RangeError for a non-positive radius or wavenumber. */
export function cylinderSeries(problem: CylinderProblem): CylinderSeries {
  const { radiusM, k0, background, interior, polarization } = problem;
  if (!(radiusM > 0 && k0 > 0)) throw new RangeError("cylinderSeries: expected radius > 0 and k0 > 0");
  const k = k0 * Math.sqrt(background.eps * background.mu);
  const x = k * radiusM;
  const inner = interior.kind === "dielectric" ? k0 * Math.sqrt(interior.eps * interior.mu) * radiusM : 0;
  const order = ordersFor(Math.max(x, inner));
  const jx = new Float64Array(order + 2), yx = new Float64Array(order + 2);
  besselJY(order + 1, x, jx, yx);
  const jy = new Float64Array(order + 2), yy = new Float64Array(order + 2);
  if (interior.kind === "dielectric") besselJY(order + 1, inner, jy, yy);
  const aRe = new Float64Array(order + 1), aIm = new Float64Array(order + 1);
  const q = interior.kind === "dielectric"
    ? (inner / x) * (polarization === "Ez" ? background.mu / interior.mu : background.eps / interior.eps)
    : 0;
  for (let n = 0; n <= order; n++) {
    const J = jx[n], Y = yx[n], dJ = derivative(jx, n), dY = derivative(yx, n);
    let numRe: number, denRe: number, denIm: number;
    if (interior.kind === "pec") {
      // a = −Z/(J + iY), Z = J (Ez) or J' (Hz)
      if (polarization === "Ez") { numRe = -J; denRe = J; denIm = Y; } else { numRe = -dJ; denRe = dJ; denIm = dY; }
    } else {
      const Jc = jy[n], dJc = derivative(jy, n);
      numRe = q * dJc * J - dJ * Jc;
      denRe = Jc * dJ - q * dJc * J;
      denIm = Jc * dY - q * dJc * Y;
    }
    const d2 = denRe * denRe + denIm * denIm;
    aRe[n] = (numRe * denRe) / d2;
    aIm[n] = (-numRe * denIm) / d2;
  }
  return { problem, k, order, aRe, aIm };
}

/** σ_s = (4/k) Σ_n |a_n|², metres (per unit length of cylinder, for unit incident amplitude). */
export function seriesScatteringWidth(s: CylinderSeries): number {
  let sum = s.aRe[0] ** 2 + s.aIm[0] ** 2;
  for (let n = 1; n <= s.order; n++) sum += 2 * (s.aRe[n] ** 2 + s.aIm[n] ** 2);
  return (4 / s.k) * sum;
}

/** σ_ext = −(4/k) Re Σ_n a_n, metres (optical theorem). Equals σ_s for a lossless cylinder. */
export function seriesExtinctionWidth(s: CylinderSeries): number {
  let sum = s.aRe[0];
  for (let n = 1; n <= s.order; n++) sum += 2 * s.aRe[n];
  return (-4 / s.k) * sum;
}

/**
 * Scattered field u_s at physical points (cylinder centred at the origin), written into outRe/outIm.
 * Points must lie outside the cylinder (r > a); points inside get NaN.
 */
export function seriesScatteredField(s: CylinderSeries, xM: ArrayLike<number>, yM: ArrayLike<number>, outRe: Float64Array, outIm: Float64Array): void {
  const j = new Float64Array(s.order + 1), y = new Float64Array(s.order + 1);
  for (let p = 0; p < xM.length; p++) {
    const r = Math.hypot(xM[p], yM[p]);
    if (!(r > s.problem.radiusM)) { outRe[p] = NaN; outIm[p] = NaN; continue; }
    const phi = Math.atan2(yM[p], xM[p]);
    besselJY(s.order, s.k * r, j, y);
    let re = 0, im = 0;
    for (let n = 0; n <= s.order; n++) {
      // term i^n a_n H_n (×2 cos nφ for n ≥ 1), H_n = J_n + i Y_n
      const w = n === 0 ? 1 : 2 * Math.cos(n * phi);
      const hRe = j[n], hIm = y[n];
      const tRe = s.aRe[n] * hRe - s.aIm[n] * hIm, tIm = s.aRe[n] * hIm + s.aIm[n] * hRe;
      // multiply by i^n
      let uRe: number, uIm: number;
      switch (n % 4) {
        case 0: uRe = tRe; uIm = tIm; break;
        case 1: uRe = -tIm; uIm = tRe; break;
        case 2: uRe = -tRe; uIm = -tIm; break;
        default: uRe = tIm; uIm = -tRe;
      }
      re += w * uRe;
      im += w * uIm;
    }
    outRe[p] = re;
    outIm[p] = im;
  }
}
