/**
 * Figures from a solved field: power flux through a closed contour of grid faces, the scattering,
 * absorption and extinction widths that follow from it, and relative field differences on an
 * observation region.
 *
 * Flux. For ∇·(A∇u) + k0² b u = 0 with real A, b in a region, the discrete Green identity of the
 * five-point stencil gives Im Σ_region ū (L u) = Σ_boundary faces A Im(ū_in u_out) / h², so
 * F = Σ_faces Im(ū_in u_out) (A = background constant, dropped) is the discrete counterpart of the
 * outgoing time-averaged power ∮ Im(ū ∂u/∂n) dl ∝ ∮ S·n dl (S_x = Im(E_z* ∂_x E_z)/(2ωμ0μ_b) for Ez;
 * duals for Hz). It is conserved exactly by the discrete equations in source-free lossless regions.
 * A unit plane wave exp(i k̃ x) carries sin(k̃h) per face, so a width in metres is F·h / sin(k̃h).
 * σ_s uses u_s (outgoing scattered power), σ_abs = −F(u_total) (power absorbed inside the contour),
 * σ_ext = σ_s + σ_abs (Bohren & Huffman 1983, §3.4, in 2D). The contour must lie in the background,
 * outside every scatterer and inside the PML's inner edge.
 */
import { inPml, type FdfdGrid } from "./fdfdGrid.js";
import type { SceneSolution } from "./solve.js";

/** A rectangle of nodes [i0, i1] × [j0, j1] (inclusive); the contour runs along its outer faces. */
export interface NodeBox { i0: number; i1: number; j0: number; j1: number }

/** Outward flux F = Σ Im(ū_in u_out) over the faces leaving the box. */
export function boxFlux(g: FdfdGrid, box: NodeBox, re: Float64Array, im: Float64Array): number {
  return fluxSums(g, box, re, im, false);
}

/** Σ |Im(ū_in u_out)| over the same faces: the scale the flux's rounding is relative to. */
export function boxFluxMagnitude(g: FdfdGrid, box: NodeBox, re: Float64Array, im: Float64Array): number {
  return fluxSums(g, box, re, im, true);
}

function fluxSums(g: FdfdGrid, box: NodeBox, re: Float64Array, im: Float64Array, magnitude: boolean): number {
  const { i0, i1, j0, j1 } = box;
  if (i0 < 1 || j0 < 1 || i1 > g.nx - 2 || j1 > g.ny - 2 || i0 > i1 || j0 > j1) throw new RangeError("boxFlux: box must lie strictly inside the grid");
  const term = (p: number, q: number): number => {
    const t = re[p] * im[q] - im[p] * re[q]; // Im(conj(u_p) u_q)
    return magnitude ? Math.abs(t) : t;
  };
  let f = 0;
  for (let j = j0; j <= j1; j++) {
    f += term(i0 + g.nx * j, i0 - 1 + g.nx * j);
    f += term(i1 + g.nx * j, i1 + 1 + g.nx * j);
  }
  for (let i = i0; i <= i1; i++) {
    f += term(i + g.nx * j0, i + g.nx * (j0 - 1));
    f += term(i + g.nx * j1, i + g.nx * (j1 + 1));
  }
  return f;
}

/**
 * Relative size, against Σ|terms| of the total field's flux, below which a net flux is rounding and
 * the direct solver's residual (both ~1e-13 here) rather than absorption: reported as 0.
 */
export const ABSORPTION_RESOLUTION = 1e-9;

export interface CrossSections {
  /** scattering width, metres */
  scatteringM: number;
  /** absorption width, metres (negative means net gain inside the contour; 0 within ABSORPTION_RESOLUTION of the flux's scale) */
  absorptionM: number;
  extinctionM: number;
  /** incident flux per face, for reference: sin(k̃h) along x */
  incidentPerFace: number;
}

/** Scattering, absorption and extinction widths from the flux through `box` (see file comment). */
export function crossSections(sol: SceneSolution, box: NodeBox): CrossSections {
  const g = sol.grid;
  const perFace = sol.incidentIntensityPerM * g.h;
  const toM = g.h / perFace;
  const scat = boxFlux(g, box, sol.scatteredRe, sol.scatteredIm) * toM;
  const net = -boxFlux(g, box, sol.totalRe, sol.totalIm);
  // a lossless scene's net flux is zero but for rounding (±1e-21 m in a CSV says nothing)
  const abs = Math.abs(net) <= ABSORPTION_RESOLUTION * boxFluxMagnitude(g, box, sol.totalRe, sol.totalIm) ? 0 : net * toM;
  return { scatteringM: scat, absorptionM: abs, extinctionM: scat + abs, incidentPerFace: perFace };
}

/**
 * The largest box around the scatterer that stays `gap` nodes inside the PML's inner edge; null when
 * it would touch a scatterer node (`deviceNode`).
 */
export function fluxBox(sol: SceneSolution, gap = 2): NodeBox | null {
  const g = sol.grid;
  const box = { i0: g.pml + gap, i1: g.nx - 1 - g.pml - gap, j0: g.pml + gap, j1: g.ny - 1 - g.pml - gap };
  if (box.i0 > box.i1 || box.j0 > box.j1) return null;
  const dev = sol.coefficients.deviceNode;
  for (let j = box.j0 - 1; j <= box.j1 + 1; j++) {
    for (let i = box.i0 - 1; i <= box.i1 + 1; i++) {
      const edge = i <= box.i0 || i >= box.i1 || j <= box.j0 || j >= box.j1;
      if (edge && dev[i + g.nx * j]) return null;
    }
  }
  return box;
}

/**
 * Observation mask: nodes outside the PML that are more than `gap` nodes (Chebyshev distance) from
 * every node in `exclude` (the union of the device masks of the compared cases).
 */
export function observationMask(g: FdfdGrid, exclude: Uint8Array, gap = 1): Uint8Array {
  const mask = new Uint8Array(g.nx * g.ny);
  for (let j = 0; j < g.ny; j++) for (let i = 0; i < g.nx; i++) if (!inPml(g, i, j)) mask[i + g.nx * j] = 1;
  for (let j = 0; j < g.ny; j++) {
    for (let i = 0; i < g.nx; i++) {
      if (!exclude[i + g.nx * j]) continue;
      for (let q = Math.max(0, j - gap); q <= Math.min(g.ny - 1, j + gap); q++) {
        for (let p = Math.max(0, i - gap); p <= Math.min(g.nx - 1, i + gap); p++) mask[p + g.nx * q] = 0;
      }
    }
  }
  return mask;
}

/** ‖a − b‖₂ / ‖b‖₂ over the mask (NaN when the mask is empty or b vanishes on it). */
export function relativeDifference(aRe: Float64Array, aIm: Float64Array, bRe: Float64Array, bIm: Float64Array, mask: Uint8Array): number {
  let num = 0, den = 0;
  for (let k = 0; k < mask.length; k++) {
    if (!mask[k]) continue;
    const dr = aRe[k] - bRe[k], di = aIm[k] - bIm[k];
    num += dr * dr + di * di;
    den += bRe[k] * bRe[k] + bIm[k] * bIm[k];
  }
  return den > 0 ? Math.sqrt(num / den) : NaN;
}

/**
 * Far-field amplitude of the scattered field, T(φ) with u_s ≈ sqrt(2/(π k r)) e^{i(kr − π/4)} T(φ)
 * as r → ∞ (for a cylinder T(φ) = Σ a_n e^{inφ}, cylinderSeries.ts), from the field on the faces
 * of `box` by the 2D near-to-far transformation (Green's theorem with the large-argument Hankel
 * function; Taflove & Hagness, "Computational Electrodynamics", 3rd ed., 2005, §8.5, in 2D):
 *   T(φ) = (i/4) ∮ [−i k (r̂·n′) u_s − ∂u_s/∂n′] e^{−i k r̂·r′} dl′,
 * with u_s and ∂u_s/∂n′ taken at face midpoints (mean and difference of the two nodes), and the
 * grid's own wavenumber K(φ) for k in the phase. Bistatic scattering width σ(φ) = (4/k)|T(φ)|²;
 * (1/2π)∫σ dφ is the scattering width, and σ_ext = −(4/k) Re T(φ_inc) (optical theorem).
 */
export function farField(sol: SceneSolution, box: NodeBox, anglesRad: Float64Array, gridWavenumber: (angleRad: number) => number, withBottom = true): { re: Float64Array; im: Float64Array } {
  const g = sol.grid, h = g.h;
  const u = sol.scatteredRe, v = sol.scatteredIm;
  // faces: midpoint, outward normal, (u, du/dn)
  const fx: number[] = [], fy: number[] = [], nxs: number[] = [], nys: number[] = [], uR: number[] = [], uI: number[] = [], dR: number[] = [], dI: number[] = [];
  const add = (pIn: number, pOut: number, x: number, y: number, nx: number, ny: number): void => {
    fx.push(x); fy.push(y); nxs.push(nx); nys.push(ny);
    uR.push(0.5 * (u[pIn] + u[pOut])); uI.push(0.5 * (v[pIn] + v[pOut]));
    dR.push((u[pOut] - u[pIn]) / h); dI.push((v[pOut] - v[pIn]) / h);
  };
  const { i0, i1, j0, j1 } = box;
  for (let j = j0; j <= j1; j++) {
    const y = g.y0 + j * h;
    add(i0 + g.nx * j, i0 - 1 + g.nx * j, g.x0 + (i0 - 0.5) * h, y, -1, 0);
    add(i1 + g.nx * j, i1 + 1 + g.nx * j, g.x0 + (i1 + 0.5) * h, y, 1, 0);
  }
  for (let i = i0; i <= i1; i++) {
    const x = g.x0 + i * h;
    if (withBottom) add(i + g.nx * j0, i + g.nx * (j0 - 1), x, g.y0 + (j0 - 0.5) * h, 0, -1);
    add(i + g.nx * j1, i + g.nx * (j1 + 1), x, g.y0 + (j1 + 0.5) * h, 0, 1);
  }
  const m = anglesRad.length;
  const re = new Float64Array(m), im = new Float64Array(m);
  for (let a = 0; a < m; a++) {
    const phi = anglesRad[a];
    const K = gridWavenumber(phi);
    const cx = Math.cos(phi), cy = Math.sin(phi);
    let sRe = 0, sIm = 0;
    for (let f = 0; f < fx.length; f++) {
      const rn = cx * nxs[f] + cy * nys[f];
      // q = −i K rn u − du/dn
      const qRe = K * rn * uI[f] - dR[f], qIm = -K * rn * uR[f] - dI[f];
      const ph = -K * (cx * fx[f] + cy * fy[f]);
      const eRe = Math.cos(ph), eIm = Math.sin(ph);
      sRe += qRe * eRe - qIm * eIm; sIm += qRe * eIm + qIm * eRe;
    }
    // T = (i/4) h Σ
    re[a] = -0.25 * h * sIm; im[a] = 0.25 * h * sRe;
  }
  return { re, im };
}

/**
 * Far-field amplitude of the scattered field above a perfectly conducting ground plane y = y_g
 * (the box's bottom row lies on the plane: Ez, the node row on it, where u_s = 0; Hz, the first
 * open row above the plane of faces). Image theory unfolds the field into the lower half-plane as
 * u_s(x, 2y_g − y) = s·u_s(x, y), s = −1 for Ez and +1 for Hz (Balanis, "Advanced Engineering
 * Electromagnetics", 2nd ed., 2012, §7.4); the unfolded contour is the box's left, top and right
 * sides and their mirror images, which join on the plane, so no face on the plane is needed. The
 * mirror half's contribution at φ is s·e^{−2iK sinφ·y_g} times the open contour's at −φ, hence
 *   T(φ) = C(φ) + s·e^{−2iK(φ) sinφ y_g}·C(−φ),
 * C the sum of farField over the three sides. Valid for 0 < φ < π.
 */
export function groundFarField(sol: SceneSolution, box: NodeBox, groundYM: number, sign: 1 | -1, anglesRad: Float64Array, gridWavenumber: (angleRad: number) => number): { re: Float64Array; im: Float64Array } {
  const m = anglesRad.length;
  const mirrored = new Float64Array(m);
  for (let a = 0; a < m; a++) mirrored[a] = -anglesRad[a];
  const up = farField(sol, box, anglesRad, gridWavenumber, false);
  const down = farField(sol, box, mirrored, gridWavenumber, false);
  const re = new Float64Array(m), im = new Float64Array(m);
  for (let a = 0; a < m; a++) {
    const ph = -2 * gridWavenumber(anglesRad[a]) * Math.sin(anglesRad[a]) * groundYM;
    const c = Math.cos(ph), s = Math.sin(ph);
    re[a] = up.re[a] + sign * (down.re[a] * c - down.im[a] * s);
    im[a] = up.im[a] + sign * (down.re[a] * s + down.im[a] * c);
  }
  return { re, im };
}

/**
 * The box for figures above a ground plane: left, right and top as fluxBox (gap nodes inside the
 * PML), the bottom row on the plane (Ez: the first held row; Hz: the first open row). null when a
 * side above the plane touches a scatterer node or the ground is not inside the window.
 */
export function groundFluxBox(sol: SceneSolution, groundYM: number, gap = 2): NodeBox | null {
  const g = sol.grid;
  const ez = sol.scene.polarization === "Ez";
  const jg = ez ? Math.round((groundYM - g.y0) / g.h) : Math.round((groundYM - g.y0) / g.h + 0.5);
  const box = { i0: g.pml + gap, i1: g.nx - 1 - g.pml - gap, j0: jg, j1: g.ny - 1 - g.pml - gap };
  if (box.i0 > box.i1 || box.j0 + 2 > box.j1 || box.j0 < 1) return null;
  const dev = sol.coefficients.deviceNode;
  // above the two rows next to the plane (which its cut cells mark), no side may touch the scene
  for (let j = box.j0 + 2; j <= box.j1 + 1; j++) {
    for (let i = box.i0 - 1; i <= box.i1 + 1; i++) {
      const edge = i <= box.i0 || i >= box.i1 || j >= box.j1;
      if (edge && dev[i + g.nx * j]) return null;
    }
  }
  return box;
}
