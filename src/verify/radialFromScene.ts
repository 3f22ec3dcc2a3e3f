/**
 * Turn a Scene (the same sampler the FDFD check uses, e.g. continuousScene.ts for the ideal or
 * reduced map of a design) into a RadialProblem for the exact radial solver, when it applies: the
 * material must depend on r only and be diagonal in the polar basis about `centreM`. Checked on
 * samples at `checkAngles` angles and `checkRadii` radii: the polar components T_rr, T_θθ, b at
 * angle θ must equal those at θ = 0 and T_rθ must vanish (relative 1e-6 of the largest component);
 * otherwise the answer is { applies: false, reason } (a rotator has T_rθ ≠ 0; a bend is not radial).
 * Inside the device the shell samples the scene along the ray θ = 0, where the polar basis is the
 * Cartesian one (T_r = T_xx, T_θ = T_yy); `breakpointsM` (radii where the material jumps, e.g.
 * layer edges) split the shell so the integrator never steps across a jump.
 */
import { SAMPLE_MEDIUM, SAMPLE_PEC, S_B, S_TXX, S_TXY, S_TYY, SAMPLE_LENGTH, backgroundCoefficients, type Scene } from "./scene.js";
import type { RadialCore, RadialProblem, RadialShell } from "./radialSolver.js";

export interface RadialSceneInput {
  scene: Scene;
  centreM: [number, number];
  /** radius of the core (the hidden conductor, or where a homogeneous medium core ends) */
  coreRadiusM: number;
  core: RadialCore;
  /** outer radius of the device (background beyond) */
  outerRadiusM: number;
  k0: number;
  breakpointsM?: number[];
  checkAngles?: number;
  checkRadii?: number;
  tolerance?: number;
}

export type RadialSceneResult = { applies: true; problem: RadialProblem } | { applies: false; reason: string };

/** Polar components at (r, θ): [bRe, bIm, trrRe, trrIm, tθθRe, tθθIm, trθRe, trθIm] and the sample kind. */
function polarSample(scene: Scene, cx: number, cy: number, r: number, th: number, buf: Float64Array, out: Float64Array): number {
  const c = Math.cos(th), s = Math.sin(th);
  const kind = scene.sample(cx + r * c, cy + r * s, buf);
  if (kind !== SAMPLE_MEDIUM) {
    const { b, t } = backgroundCoefficients(scene);
    out.fill(0);
    out[0] = b; out[2] = t; out[4] = t;
    return kind;
  }
  out[0] = buf[S_B]; out[1] = buf[S_B + 1];
  for (let p = 0; p < 2; p++) {
    const xx = buf[S_TXX + p], yy = buf[S_TYY + p], xy = buf[S_TXY + p];
    out[2 + p] = c * c * xx + 2 * c * s * xy + s * s * yy; // T_rr
    out[4 + p] = s * s * xx - 2 * c * s * xy + c * c * yy; // T_θθ
    out[6 + p] = (yy - xx) * c * s + (c * c - s * s) * xy; // T_rθ
  }
  return kind;
}

/** See file comment. */
export function radialProblemFromScene(input: RadialSceneInput): RadialSceneResult {
  const { scene, centreM: [cx, cy], coreRadiusM: a, outerRadiusM: R, k0 } = input;
  if (!(a > 0 && R > a)) return { applies: false, reason: `needs 0 < core radius < outer radius, got ${a} and ${R} m` };
  const buf = new Float64Array(SAMPLE_LENGTH), p0 = new Float64Array(8), p1 = new Float64Array(8);
  const nA = input.checkAngles ?? 16, nR = input.checkRadii ?? 24;
  for (let q = 0; q < nR; q++) {
    const r = a + ((q + 0.5) / nR) * (R - a);
    const k0kind = polarSample(scene, cx, cy, r, 0, buf, p0);
    if (k0kind === SAMPLE_PEC) return { applies: false, reason: `a conductor inside the device at r = ${r.toPrecision(4)} m` };
    const scale = Math.max(...Array.from(p0.subarray(0, 6), Math.abs), 1e-300);
    if (Math.hypot(p0[6], p0[7]) > 1e-6 * scale) return { applies: false, reason: `the tensor is not diagonal in the polar basis (T_rθ ≠ 0 at r = ${r.toPrecision(4)} m)` };
    for (let t = 1; t < nA; t++) {
      const th = (2 * Math.PI * t) / nA + 0.1;
      const kind = polarSample(scene, cx, cy, r, th, buf, p1);
      let diff = kind === k0kind ? 0 : Infinity;
      for (let i = 0; i < 8; i++) diff = Math.max(diff, Math.abs(p1[i] - p0[i]));
      if (diff > 1e-6 * scale) return { applies: false, reason: `the material depends on the angle (r = ${r.toPrecision(4)} m)` };
    }
  }
  const cuts = [a, ...(input.breakpointsM ?? []).filter((r) => r > a && r < R).sort((x, y) => x - y), R];
  const shells: RadialShell[] = [];
  for (let i = 0; i + 1 < cuts.length; i++) {
    const tmp = new Float64Array(8);
    // sample strictly inside the shell: at its edges the scene may answer for the neighbour (a conductor's surface, a layer's jump)
    const lo = cuts[i] + 1e-9 * (cuts[i + 1] - cuts[i]), hi = cuts[i + 1] - 1e-9 * (cuts[i + 1] - cuts[i]);
    shells.push({
      innerRadiusM: cuts[i], outerRadiusM: cuts[i + 1],
      sample(rM, out) { polarSample(scene, cx, cy, Math.min(hi, Math.max(lo, rM)), 0, buf, tmp); out.set(tmp.subarray(0, 6)); },
    });
  }
  return {
    applies: true,
    problem: { polarization: scene.polarization, k0, background: scene.background, coreRadiusM: a, core: input.core, shells, tolerance: input.tolerance },
  };
}
