/**
 * Stretched-coordinate perfectly matched layer (Bérenger, J. Comput. Phys. 114, 185 (1994); Chew &
 * Weedon, Microw. Opt. Technol. Lett. 7, 599 (1994)). Inside the layer ∂/∂x → (1/s_x) ∂/∂x with
 * s_x = 1 + i σ_max (d/L)^m, d the depth into the layer and L its thickness: an outgoing wave
 * exp(i k x) (exp(−iωt) convention) picks up exp(−k ∫σ dx) and decays. σ_max is set from the
 * target normal-incidence reflection R of the layer backed by a wall:
 * R = exp(−2 k σ_max L/(m+1)) ⇒ σ_max = −(m+1) ln R/(2 k L). Polynomial grading m = 3 and
 * R = 1e-8 are common practice (Taflove & Hagness, "Computational Electrodynamics", 3rd ed.,
 * 2005, §7.6).
 */
import type { FdfdGrid } from "./fdfdGrid.js";

export const PML_GRADING_ORDER = 3;
export const PML_TARGET_REFLECTION = 1e-8;

/** Complex stretch factors along one axis: at nodes (index i) and at faces (i + ½). */
export interface AxisStretch {
  nodeRe: Float64Array;
  nodeIm: Float64Array;
  faceRe: Float64Array;
  faceIm: Float64Array;
}

export interface PmlStretch {
  x: AxisStretch;
  y: AxisStretch;
}

function axis(n: number, pml: number, h: number, k: number, strength: number): AxisStretch {
  const out: AxisStretch = { nodeRe: new Float64Array(n).fill(1), nodeIm: new Float64Array(n), faceRe: new Float64Array(n).fill(1), faceIm: new Float64Array(n) };
  if (pml <= 0) return out;
  const L = pml * h;
  const sigmaMax = (strength * (-(PML_GRADING_ORDER + 1) * Math.log(PML_TARGET_REFLECTION))) / (2 * k * L);
  // the absorbing layer starts at node pml (left) and node n−1−pml (right); depth measured from there
  const lo = pml, hi = n - 1 - pml;
  const depth = (p: number): number => (p < lo ? (lo - p) * h : p > hi ? (p - hi) * h : 0);
  for (let i = 0; i < n; i++) {
    out.nodeIm[i] = sigmaMax * (depth(i) / L) ** PML_GRADING_ORDER;
    out.faceIm[i] = sigmaMax * (depth(i + 0.5) / L) ** PML_GRADING_ORDER;
  }
  return out;
}

/**
 * Stretch factors for a grid and background wavenumber k (rad/m). `strength` scales σ_max
 * (1 = the design value; 0 switches the layer off, leaving bare walls — used by the tests).
 */
export function pmlStretch(g: FdfdGrid, k: number, strength = 1): PmlStretch {
  return { x: axis(g.nx, g.pml, g.h, k, strength), y: axis(g.ny, g.pml, g.h, k, strength) };
}
