/**
 * Guided modes of a three-layer dielectric slab (core n₁ of thickness d between a substrate n_s
 * below and a cover n_c above), exact: the transcendental dispersion relation in the form of
 * Kogelnik & Ramaswamy, "Scaling rules for thin-film optical waveguides", Appl. Opt. 13, 1857
 * (1974), and Kogelnik, "Theory of dielectric waveguides", in Integrated Optics (Tamir, ed., 1975):
 *
 *   κd = mπ + atan(ρ_s·γ_s/κ) + atan(ρ_c·γ_c/κ),   κ = k₀√(n₁² − N²), γ_{s,c} = k₀√(N² − n_{s,c}²)
 *
 * with ρ = 1 for TE modes (electric field in the slab plane) and ρ = n₁²/n_{s,c}² for TM modes
 * (magnetic field in the slab plane). Normalized: V = k₀d√(n₁² − n_s²), b = (N² − n_s²)/(n₁² − n_s²),
 * asymmetry a = (n_s² − n_c²)/(n₁² − n_s²) (TE); the TE relation reads
 *   V√(1 − b) = mπ + atan√(b/(1 − b)) + atan√((b + a)/(1 − b)),
 * and mode m is guided for V > V_m = mπ + atan√a (symmetric slab: V_m = mπ, i.e. mπ/2 in terms of
 * the half thickness). Each mode index is found by bisection on N ∈ (max(n_s, n_c), n₁), where the
 * left side minus the right side decreases monotonically. Lossless (real) indices.
 *
 * "TE-like"/"TM-like" in a patterned slab: a device whose in-plane field is E (the Hz polarization
 * of this tool) runs on the slab's TE modes; one whose field is E_z (normal to the slab) on its TM
 * modes.
 */
import { ProgrammerError } from "../../core/errors.js";

export type SlabPolarization = "TE" | "TM";

export interface SlabInput {
  coreIndex: number;
  substrateIndex: number;
  coverIndex: number;
  thicknessM: number;
  wavelengthM: number;
  polarization: SlabPolarization;
}

export interface SlabModes {
  /** effective indices of the guided modes, fundamental first */
  indices: number[];
  /** V = k₀d√(n₁² − n_s²) (n_s: the larger of the two claddings) */
  v: number;
  /** cut-off V of the next mode (m = number of guided modes) */
  nextCutoffV: number;
  /** cut-off V of the fundamental mode (0 for a symmetric slab) */
  fundamentalCutoffV: number;
  /** b of the fundamental mode (NaN when none is guided) */
  b: number;
}

const TWO_PI = 2 * Math.PI;

/** Cut-off V of mode m: κd at N = n_s (γ_s = 0): mπ + atan(ρ_c·√(n_s² − n_c²)/√(n₁² − n_s²)). */
export function cutoffV(input: SlabInput, m: number): number {
  const { n1, ns, nc } = ordered(input);
  const rhoC = input.polarization === "TE" ? 1 : (n1 * n1) / (nc * nc);
  return m * Math.PI + Math.atan((rhoC * Math.sqrt(ns * ns - nc * nc)) / Math.sqrt(n1 * n1 - ns * ns));
}

function ordered(input: SlabInput): { n1: number; ns: number; nc: number } {
  const n1 = input.coreIndex;
  const ns = Math.max(input.substrateIndex, input.coverIndex);
  const nc = Math.min(input.substrateIndex, input.coverIndex);
  return { n1, ns, nc };
}

/** κd − mπ − atan(ρ_sγ_s/κ) − atan(ρ_cγ_c/κ) at index N (decreasing in N). */
function mismatch(input: SlabInput, N: number, m: number): number {
  const { n1, ns, nc } = ordered(input);
  const k0 = TWO_PI / input.wavelengthM;
  const kappa = k0 * Math.sqrt(Math.max(0, n1 * n1 - N * N));
  const gs = k0 * Math.sqrt(Math.max(0, N * N - ns * ns));
  const gc = k0 * Math.sqrt(Math.max(0, N * N - nc * nc));
  const rs = input.polarization === "TE" ? 1 : (n1 * n1) / (ns * ns);
  const rc = input.polarization === "TE" ? 1 : (n1 * n1) / (nc * nc);
  return kappa * input.thicknessM - m * Math.PI - Math.atan2(rs * gs, kappa) - Math.atan2(rc * gc, kappa);
}

/** All guided modes (see the module comment). Throws ProgrammerError for a non-guiding core. */
export function slabModes(input: SlabInput): SlabModes {
  const { n1, ns } = ordered(input);
  if (!(input.thicknessM > 0) || !(input.wavelengthM > 0)) throw new ProgrammerError("slabModes: thickness and wavelength must be > 0", input);
  if (!(n1 > ns)) throw new ProgrammerError(`slabModes: the core index ${n1} must exceed the claddings' ${ns}`, input);
  const k0 = TWO_PI / input.wavelengthM;
  const v = k0 * input.thicknessM * Math.sqrt(n1 * n1 - ns * ns);
  const indices: number[] = [];
  for (let m = 0; m < 10000; m++) {
    if (!(v > cutoffV(input, m))) break;
    let lo = ns, hi = n1;
    for (let it = 0; it < 200 && hi - lo > 1e-15 * n1; it++) {
      const mid = 0.5 * (lo + hi);
      if (mismatch(input, mid, m) > 0) lo = mid;
      else hi = mid;
    }
    indices.push(0.5 * (lo + hi));
  }
  const N0 = indices[0];
  return {
    indices,
    v,
    nextCutoffV: cutoffV(input, indices.length),
    fundamentalCutoffV: cutoffV(input, 0),
    b: N0 === undefined ? NaN : (N0 * N0 - ns * ns) / (n1 * n1 - ns * ns),
  };
}

/** Largest thickness (m) for single-mode operation: V below the cut-off of mode 1. */
export function singleModeThicknessM(input: Omit<SlabInput, "thicknessM">): number {
  const { n1, ns } = ordered({ ...input, thicknessM: 1 });
  const k0 = TWO_PI / input.wavelengthM;
  return cutoffV({ ...input, thicknessM: 1 }, 1) / (k0 * Math.sqrt(n1 * n1 - ns * ns));
}
