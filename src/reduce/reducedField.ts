/**
 * The result of reducing a material field for one polarization with one simplification scheme:
 * the components the polarization sees, per cell, with the numbers a designer needs to judge the
 * cost (principal values, anisotropy, scale, flags).
 */
import type { ReductionSchemeName } from "./schemes/schemeNames.js";
import type { Polarization } from "./polarization.js";

/** Cell needs a permittivity below 1 (some kept ε principal value < 1 − 1e-9, ignoring rounding). */
export const FLAG_EPS_BELOW_ONE = 1;
/** Cell needs a magnetic response: some kept μ principal value differs from 1 by more than the tolerance. */
export const FLAG_MAGNETIC = 2;
/** The field's value in this cell was capped (or offset) at a singularity. */
export const FLAG_CAPPED = 4;
/** The reduction is undefined here (non-finite input, not positive definite): components are NaN. */
export const FLAG_UNDEFINED = 8;
/** ε or μ couples the plane to z (xz or yz ≠ 0): the two polarizations do not decouple exactly. */
export const FLAG_OUT_OF_PLANE = 16;

export const FLAG_NAMES: ReadonlyArray<readonly [number, string]> = [
  [FLAG_EPS_BELOW_ONE, "eps_below_1"],
  [FLAG_MAGNETIC, "magnetic"],
  [FLAG_CAPPED, "capped"],
  [FLAG_UNDEFINED, "undefined"],
  [FLAG_OUT_OF_PLANE, "out_of_plane_coupling"],
];

/** `;`-separated names of the set bits, "" when none. */
export function flagList(flags: number): string {
  let out = "";
  for (const [bit, name] of FLAG_NAMES) {
    if (flags & bit) out = out ? `${out};${name}` : name;
  }
  return out;
}

/** What the reduction was computed with (enough to re-evaluate it at any point). */
export interface ReductionSettings {
  polarization: Polarization;
  scheme: ReductionSchemeName;
  /** unit-mu (and matched in Ez): which principal value of μ_t becomes 1 */
  unitAxis: "larger" | "smaller";
  /** |μ − 1| above this counts as magnetic */
  muTolerance: number;
  /** index n of the background the device sits in */
  backgroundIndex: number;
  /** wave impedance of that background relative to vacuum, sqrt(μ_b/ε_b) */
  backgroundImpedance: number;
  /** factors applied to the field's ε and μ before reduction (background replacement) */
  epsScale: number;
  muScale: number;
  /** matched scheme: the constant in-plane scale that matches the outer boundary (1 otherwise) */
  matchScale: number;
  /**
   * k such that k·ε is the permittivity this scheme would need in a non-magnetic dielectric
   * background of index 1 (vacuum); in a background of index n_b it needs n_b²·k·ε. Used for the
   * smallest background index.
   */
  epsAtUnitIndex: number;
}

export interface ReducedField {
  polarization: Polarization;
  scheme: ReductionSchemeName;
  settings: ReductionSettings;
  count: number;
  /** names of `components`, in order: Ez eps_zz, mu_xx, mu_yy, mu_xy; Hz mu_zz, eps_xx, eps_yy, eps_xy; 3D all 12 */
  componentNames: readonly string[];
  components: Record<string, Float64Array>;
  /**
   * Principal values, ascending, of the kept in-plane tensor (Ez: μ_t, Hz: ε_t).
   * 3D: smallest and largest principal value of ε.
   */
  principal: [Float64Array, Float64Array];
  /** largest / smallest principal value of the kept in-plane tensor (3D: the larger of ε's and μ's) */
  anisotropy: Float64Array;
  /**
   * isotropic scheme: the in-plane anisotropy factor that was dropped, σ1/σ2 = sqrt(λ_max/λ_min)
   * (Li, Pendry, PRL 101, 203901 (2008)); 1 for other schemes
   */
  droppedAnisotropy: Float64Array;
  /** the in-plane scale α: in-plane tensor × α, out-of-plane scalar × 1/α (1 for full and 3D) */
  scale: Float64Array;
  /** smallest and largest kept ε and μ principal values per cell */
  epsMin: Float64Array;
  epsMax: Float64Array;
  muMin: Float64Array;
  muMax: Float64Array;
  /** bit mask of FLAG_* per cell */
  flags: Uint8Array;
}
