/**
 * What the FDFD solver simulates: a 2D scene of one polarization — a uniform background and, inside
 * a bounding box, a medium given point by point (possibly with perfectly conducting parts).
 *
 * For polarization Ez the unknown u = E_z and the medium acts through b = ε_zz (out of plane) and
 * the in-plane tensor T = μ_t; for Hz, u = H_z, b = μ_zz and T = ε_t. Both obey
 * ∇·(A ∇u) + k0² b u = 0 with A = T / det T (design brief §2; for diagonal T, A = diag(1/T_yy, 1/T_xx)).
 */
import type { Conductor } from "./conductor.js";

export type ScenePolarization = "Ez" | "Hz";

/** sample() result: the point is background, a medium, or a perfect electric conductor. */
export const SAMPLE_BACKGROUND = 0;
export const SAMPLE_MEDIUM = 1;
export const SAMPLE_PEC = 2;

/** Offsets into the sample buffer (length SAMPLE_LENGTH): complex b, T_xx, T_yy, T_xy as re, im pairs. */
export const S_B = 0, S_TXX = 2, S_TYY = 4, S_TXY = 6, SAMPLE_LENGTH = 8;

/** Floats per part written by Scene.boxParts: area fraction, kind (SAMPLE_BACKGROUND or SAMPLE_MEDIUM), then the SAMPLE_LENGTH values. */
export const BOX_PART = 2 + SAMPLE_LENGTH;
/** Most parts Scene.boxParts writes (more distinct materials in one box: it returns 0). */
export const BOX_MAX_PARTS = 8;

export interface Scene {
  polarization: ScenePolarization;
  /** relative permittivity and permeability of the (lossless, isotropic) background */
  background: { eps: number; mu: number };
  /** box outside which everything is background, metres */
  bounds: { minX: number; maxX: number; minY: number; maxY: number };
  /**
   * Material at a point: writes b, T_xx, T_yy, T_xy (re, im pairs) into out for SAMPLE_MEDIUM and
   * returns the kind; for SAMPLE_BACKGROUND and SAMPLE_PEC out is left alone.
   */
  sample(xM: number, yM: number, out: Float64Array): number;
  /**
   * Optional: the exact make-up of the axis-aligned h × h box centred at (x, y), as sample() would
   * classify its points — one part per distinct material, BOX_PART floats each (area fraction,
   * kind, values as sample() writes them) in out (length ≥ BOX_MAX_PARTS · BOX_PART). Returns the
   * number of parts (fractions sum to 1), or 0 when it cannot say exactly (a conductor within
   * reach, more than BOX_MAX_PARTS materials): the grid then samples the box point by point.
   * Drawn structures offer it (geometryScene.ts), so their sub-pixel averages carry no sampling error.
   * When `normal` (length ≥ 2) is given and the box holds exactly one interface, of a shape the
   * scene knows (a single disc's boundary), its unit normal there is written into it (the
   * direction of ∫_box ∇χ dA, χ the indicator of one side; see geometryScene.ts); otherwise (0, 0):
   * several interfaces, none, or one the scene cannot place exactly.
   */
  boxParts?(xM: number, yM: number, hM: number, out: Float64Array, normal?: Float64Array): number;
  /**
   * The perfect conductors of the scene as shapes (sample() also reports SAMPLE_PEC inside them):
   * the solver uses them to place the conductor's surface between grid nodes. Points sample()
   * calls PEC outside every listed shape are treated as whole cells (a staircase).
   */
  conductors?: readonly Conductor[];
  /**
   * true when the medium varies continuously wherever sample() returns SAMPLE_MEDIUM (a graded map):
   * only changes of kind (medium, background, conductor) are interfaces that need fine sampling.
   */
  smoothMedium?: boolean;
}

/** b and the in-plane tensor of the background as the polarization sees it: Ez (ε, μ), Hz (μ, ε). */
export function backgroundCoefficients(scene: Pick<Scene, "polarization" | "background">): { b: number; t: number } {
  const { eps, mu } = scene.background;
  return scene.polarization === "Ez" ? { b: eps, t: mu } : { b: mu, t: eps };
}

/** A scene with no scatterer at all. */
export function emptyScene(polarization: ScenePolarization, background: { eps: number; mu: number }): Scene {
  return { polarization, background, bounds: { minX: 0, maxX: 0, minY: 0, maxY: 0 }, sample: () => SAMPLE_BACKGROUND };
}
