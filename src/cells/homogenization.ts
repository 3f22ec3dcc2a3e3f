/**
 * Is the cell fine enough to be treated as a homogeneous medium? Compare the pitch with the
 * wavelength in the densest material of the cell, λ0/n_max.
 * ok: pitch ≤ λ/10; warn: λ/10 < pitch ≤ λ/4; refuse: coarser (common practice; the λ/10 guidance
 * follows Smith, Pendry, "Homogenization of metamaterials by field averaging", JOSA B 23, 391
 * (2006), and Polo, Mackay, Lakhtakia, "Electromagnetic Surface Waves" (2013), App. E).
 */
import { C0 } from "./physicalConstants.js";

export type HomogenizationStatus = "ok" | "warn" | "refuse";

export const HOMOGENIZATION_OK = 0.1;
export const HOMOGENIZATION_WARN = 0.25;

export interface HomogenizationCheck {
  /** pitch / (λ0/n_max) */
  ratio: number;
  status: HomogenizationStatus;
}

/**
 * ratio = pitchM·nMax·f/c; status by the thresholds above. nMax < 1 is raised to 1 (vacuum).
 * Example: homogenizationCheck(1e-3, 10e9, 3) → { ratio: 0.1000…, status: "ok"/"warn" at the edge }
 */
export function homogenizationCheck(pitchM: number, frequencyHz: number, nMax: number): HomogenizationCheck {
  const ratio = (pitchM * Math.max(1, nMax) * frequencyHz) / C0;
  const status: HomogenizationStatus = ratio <= HOMOGENIZATION_OK ? "ok" : ratio <= HOMOGENIZATION_WARN ? "warn" : "refuse";
  return { ratio, status };
}
