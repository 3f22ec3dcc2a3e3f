/**
 * A circular cylinder (dielectric or perfectly conducting) as a Scene — the test object whose exact
 * series is in cylinderSeries.ts.
 */
import { diskConductor } from "./conductor.js";
import type { CylinderInterior } from "./cylinderSeries.js";
import { SAMPLE_BACKGROUND, SAMPLE_MEDIUM, SAMPLE_PEC, S_B, S_TXX, S_TXY, S_TYY, type Scene, type ScenePolarization } from "./scene.js";

/**
 * Cylinder of radius `radiusM` centred at (cxM, cyM). Ez: b = ε, T = μ I; Hz: b = μ, T = ε I.
 * `lossTangent` (default 0) adds i·tanδ·ε to the interior permittivity (exp(−iωt): passive ⇒ Im ε ≥ 0).
 */
export function cylinderScene(
  polarization: ScenePolarization, background: { eps: number; mu: number }, radiusM: number,
  interior: CylinderInterior, centre: [number, number] = [0, 0], lossTangent = 0,
): Scene {
  const [cx, cy] = centre;
  const r2 = radiusM * radiusM;
  return {
    polarization,
    background,
    bounds: { minX: cx - radiusM, maxX: cx + radiusM, minY: cy - radiusM, maxY: cy + radiusM },
    conductors: interior.kind === "pec" ? [diskConductor([cx, cy], radiusM)] : [],
    sample(x, y, out) {
      if ((x - cx) ** 2 + (y - cy) ** 2 > r2) return SAMPLE_BACKGROUND;
      if (interior.kind === "pec") return SAMPLE_PEC;
      const epsRe = interior.eps, epsIm = interior.eps * lossTangent;
      const ez = polarization === "Ez";
      out[S_B] = ez ? epsRe : interior.mu; out[S_B + 1] = ez ? epsIm : 0;
      const tRe = ez ? interior.mu : epsRe, tIm = ez ? 0 : epsIm;
      out[S_TXX] = tRe; out[S_TXX + 1] = tIm;
      out[S_TYY] = tRe; out[S_TYY + 1] = tIm;
      out[S_TXY] = 0; out[S_TXY + 1] = 0;
      return SAMPLE_MEDIUM;
    },
  };
}
