/**
 * What lights the scene: a plane wave at any angle, or a Gaussian beam; optionally reflected by a
 * perfectly conducting ground plane (the half-space y < y_g).
 *
 * Every incident field is built from plane waves that solve the background's discrete equations
 * exactly: on the five-point stencil a wave exp(i(k_x x + k_y y)) travelling along (cos φ, sin φ)
 * must satisfy (4/h²)[sin²(k_x h/2) + sin²(k_y h/2)] = k² (k = k0 n_b), so its grid wavenumber K(φ)
 * is found by bisection. Then L_b u_inc = 0 holds to rounding at every node, a homogeneous window
 * scatters nothing at any angle, and the PML only ever meets the scattered field.
 *
 * Beam: the angular spectrum of a 2D Gaussian beam of waist w0 focused at r0 (Goodman, "Introduction
 * to Fourier Optics", 3rd ed., 2005, §3.10; Siegman, "Lasers", 1986, §16.1):
 * u(x′, y′) = ∫ exp(−κ² w0²/4) exp(i(κ y′ + sqrt(k² − κ²) x′)) dκ in the beam's own frame; with
 * κ = k sin(φ − φ0) this is a sum over propagation angles φ of grid-exact plane waves of weight
 * a(φ) = exp(−(k w0 sin(φ − φ0))²/4) k cos(φ − φ0) Δφ, |φ − φ0| < π/2 (evanescent parts dropped:
 * below exp(−(k w0)²/4), negligible for w0 ≥ λ). Its amplitude at the focus is about
 * √π·2/w0 × …; the beam is normalized to unit amplitude at the focus.
 *
 * Ground plane: an image wave (reflection y → 2y_g − y of the direction) with sign −1 for Ez
 * (E_z = 0 on the plane) and +1 for Hz (∂H_z/∂y = 0); with the plane on a row of nodes (Ez) or a
 * row of faces (Hz) the discrete reflection is exact too.
 */
import { InputError } from "../core/errors.js";
import type { FdfdGrid } from "./fdfdGrid.js";

export type Illumination =
  | { kind: "plane"; angleRad: number }
  | { kind: "beam"; angleRad: number; waistM: number; focusM: [number, number] };

export const PLANE_ALONG_X: Illumination = { kind: "plane", angleRad: 0 };

/** Grid wavenumber K of a background plane wave along angle φ: (4/h²)[sin²(K cos φ h/2) + sin²(K sin φ h/2)] = k². */
export function gridWavenumberAt(k: number, h: number, angleRad: number): number {
  const c = Math.abs(Math.cos(angleRad)), s = Math.abs(Math.sin(angleRad));
  const target = (k * h / 2) ** 2;
  const f = (K: number): number => Math.sin(K * c * h / 2) ** 2 + Math.sin(K * s * h / 2) ** 2 - target;
  // f rises from −target at K = 0 to its first maximum at K·max(c, s)·h = π
  const hi = Math.PI / (Math.max(c, s) * h);
  if (!(f(hi) >= 0)) throw new InputError({ where: "verify grid", message: `grid step ${h.toPrecision(3)} m is too coarse for the wavelength (fewer than 2 points per wavelength)` });
  let lo = 0, up = hi;
  for (let it = 0; it < 60; it++) { const m = 0.5 * (lo + up); if (f(m) < 0) lo = m; else up = m; }
  return 0.5 * (lo + up);
}

export interface IncidentField {
  re: Float64Array;
  im: Float64Array;
  /**
   * Discrete power per unit length carried by a unit plane wave (plane illumination): the flux of
   * metrics.ts crossing one face, divided by h — |(sin(K_x h), sin(K_y h))| / h.
   */
  intensityPerM: number;
  /** beams: the plane-wave components (angle, complex weight), for the far-field pattern */
  components: { angleRad: Float64Array; re: Float64Array; im: Float64Array } | null;
}

/** Add w·exp(i(K_x (x − x_r) + K_y (y − y_r))) to (re, im) over the grid. */
function addWave(g: FdfdGrid, K: number, angle: number, wRe: number, wIm: number, xr: number, yr: number, re: Float64Array, im: Float64Array): void {
  const kx = K * Math.cos(angle), ky = K * Math.sin(angle);
  // separable: exp(i kx x) exp(i ky y)
  const exRe = new Float64Array(g.nx), exIm = new Float64Array(g.nx);
  for (let i = 0; i < g.nx; i++) { const p = kx * (g.x0 + i * g.h - xr); exRe[i] = Math.cos(p); exIm[i] = Math.sin(p); }
  for (let j = 0; j < g.ny; j++) {
    const p = ky * (g.y0 + j * g.h - yr);
    const yRe = Math.cos(p), yIm = Math.sin(p);
    const aRe = wRe * yRe - wIm * yIm, aIm = wRe * yIm + wIm * yRe;
    const o = g.nx * j;
    for (let i = 0; i < g.nx; i++) {
      re[o + i] += aRe * exRe[i] - aIm * exIm[i];
      im[o + i] += aRe * exIm[i] + aIm * exRe[i];
    }
  }
}

/** Number of plane waves in a beam's angular spectrum. */
export const BEAM_COMPONENTS = 121;

/**
 * The incident field on grid g for background wavenumber k (rad/m). `groundYM` adds the image
 * reflected by a conducting ground plane at y = groundYM (sign −1 for Ez, +1 for Hz).
 */
export function incidentField(g: FdfdGrid, k: number, ill: Illumination, ground: { yM: number; sign: 1 | -1 } | null = null): IncidentField {
  const n = g.nx * g.ny;
  const re = new Float64Array(n), im = new Float64Array(n);
  const waves: { angle: number; wRe: number; wIm: number; xr: number; yr: number }[] = [];
  let components: IncidentField["components"] = null;
  if (ill.kind === "plane") {
    waves.push({ angle: ill.angleRad, wRe: 1, wIm: 0, xr: 0, yr: 0 });
  } else {
    if (!(ill.waistM > 0)) throw new InputError({ where: "--beam", message: `expected a positive waist, got ${ill.waistM}` });
    const half = Math.min(Math.PI / 2, 6 / (k * ill.waistM)); // spectrum below exp(−9) beyond
    const m = BEAM_COMPONENTS;
    const d = (2 * half) / (m - 1);
    const ang = new Float64Array(m), wr = new Float64Array(m), wi = new Float64Array(m);
    let sum = 0;
    for (let q = 0; q < m; q++) {
      const dphi = -half + q * d;
      const w = Math.exp(-((k * ill.waistM * Math.sin(dphi)) ** 2) / 4) * k * Math.cos(dphi) * d;
      ang[q] = ill.angleRad + dphi; wr[q] = w; sum += w;
    }
    for (let q = 0; q < m; q++) { wr[q] /= sum; waves.push({ angle: ang[q], wRe: wr[q], wIm: 0, xr: ill.focusM[0], yr: ill.focusM[1] }); }
    components = { angleRad: ang, re: wr, im: wi };
  }
  for (const w of waves) {
    const K = gridWavenumberAt(k, g.h, w.angle);
    addWave(g, K, w.angle, w.wRe, w.wIm, w.xr, w.yr, re, im);
    if (ground) {
      // image: direction (cos, −sin), phase reference mirrored so that the two agree on y = y_g
      addWave(g, K, -w.angle, ground.sign * w.wRe, ground.sign * w.wIm, w.xr, 2 * ground.yM - w.yr, re, im);
    }
  }
  const K0 = gridWavenumberAt(k, g.h, ill.angleRad);
  const intensityPerM = Math.hypot(Math.sin(K0 * Math.cos(ill.angleRad) * g.h), Math.sin(K0 * Math.sin(ill.angleRad) * g.h)) / g.h;
  return { re, im, intensityPerM, components };
}
