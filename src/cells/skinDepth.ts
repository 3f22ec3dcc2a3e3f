/**
 * Skin depth and the conducting cross-section of a round wire or a flat strip at frequency f.
 * δ = sqrt(2/(ωμ₀σ)) (any electromagnetics text, e.g. Jackson, Classical Electrodynamics, §8.1).
 * A round wire of radius r carries current in an outer shell of depth δ when δ < r (common-practice
 * estimate); a strip of thickness t in two faces of depth δ when 2δ < t.
 */
import { MU0 } from "./physicalConstants.js";

/** Skin depth in m of a conductor of σ (S/m) at f (Hz); Infinity at DC, 0 for a perfect conductor. */
export function skinDepthM(conductivitySPerM: number, frequencyHz: number): number {
  if (!(frequencyHz > 0)) return Infinity;
  return Math.sqrt(2 / (2 * Math.PI * frequencyHz * MU0 * conductivitySPerM));
}

/** Conducting area (m²) of a round wire: πr² when δ ≥ r, else the shell π(r² − (r−δ)²). */
export function wireConductingAreaM2(radiusM: number, skinM: number): number {
  if (skinM >= radiusM) return Math.PI * radiusM * radiusM;
  const inner = radiusM - skinM;
  return Math.PI * (radiusM * radiusM - inner * inner);
}

/** Effective thickness (m) of a strip: its thickness, capped at two skin depths (both faces). */
export function stripEffectiveThicknessM(thicknessM: number | undefined, skinM: number): number {
  const twoSkins = 2 * skinM;
  return thicknessM === undefined ? twoSkins : Math.min(thicknessM, twoSkins);
}
