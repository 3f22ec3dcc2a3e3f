/**
 * The cases of a verify run (deviceCases.ts) solved with the exact radial solver instead of the
 * finite-difference grid, for the transforms whose tensors are r-only and diagonal in the polar
 * basis: a radial cloak (perfect-conductor core of the inner radius, shell to the outer radius)
 * and a concentrator (homogeneous core r < R1 sampled from the case's own scene, shell R1 … R3).
 * Each case's scene is checked first (radialFromScene.ts); one that is not radial (a rotator, a map
 * sampled on the design's square cells) comes back unavailable with the reason — never silently
 * replaced. `uncertainty` is the solver's own convergence figure (tolerance ladder, order tail).
 * The devices are rotationally symmetric, so a plane wave from any angle α scatters the same total
 * and the bistatic pattern turns with it.
 */
import type { TransformSpec } from "../field/transformSpec.js";
import { radialProblemFromScene } from "./radialFromScene.js";
import { radialScattering, type RadialCore, type RadialProblem } from "./radialSolver.js";
import { SAMPLE_MEDIUM, S_B, S_TXX, S_TXY, S_TYY, SAMPLE_LENGTH, type Scene } from "./scene.js";
import type { CaseSpec } from "./verifyDevice.js";
import { widthReading } from "./widthReading.js";

export interface RadialCaseResult {
  name: CaseSpec["name"];
  available: boolean;
  reason: string | null;
  scatteringWidthM: number | null;
  /** σ_s / σ_s(bare) when a bare case was computed */
  vsBare: number | null;
  /** its absolute uncertainty (σ_s's over σ_bare) */
  vsBareUncertainty: number | null;
  absorptionWidthM: number | null;
  /** max(tolerance-ladder change, order tail) × σ_s, relative to max(σ_s, σ_bare, 2R) (widthReading.ts, the grid's rule) */
  uncertainty: number | null;
  /** absolute uncertainty of σ_s, metres */
  scatteringWidthUncertaintyM: number | null;
  /** σ_s cannot be told from zero: below this width, metres (widths below 1e-6 of 2R read as zero), else null */
  scatteringWidthBelowM: number | null;
  /** bistatic width σ(φ), φ = 0 … 359° from +x, for incidence at `incidenceRad` from +x */
  bistaticM: Float64Array | null;
}

/** σ(φ) = (4/k)|a_0 + 2 Σ a_m cos m(φ − α)|² at φ = 0 … 359° (rotational symmetry: incidence at α). */
function patternAt(aRe: Float64Array, aIm: Float64Array, k: number, incidenceRad: number): Float64Array {
  const out = new Float64Array(360);
  for (let q = 0; q < 360; q++) {
    const phi = (q * Math.PI) / 180 - incidenceRad;
    let sRe = aRe[0], sIm = aIm[0];
    for (let m = 1; m < aRe.length; m++) { const c = 2 * Math.cos(m * phi); sRe += c * aRe[m]; sIm += c * aIm[m]; }
    out[q] = (4 / k) * (sRe * sRe + sIm * sIm);
  }
  return out;
}

/** The geometry the radial solver needs for a transform, or why it does not apply. */
export function radialGeometry(spec: TransformSpec): { centreM: [number, number]; coreRadiusM: number; outerRadiusM: number; pecCore: boolean } | { reason: string } {
  if (spec.kind === "radial-cloak") return { centreM: spec.center ?? [0, 0], coreRadiusM: spec.innerRadiusM, outerRadiusM: spec.outerRadiusM, pecCore: true };
  if (spec.kind === "concentrator") return { centreM: spec.center ?? [0, 0], coreRadiusM: spec.innerRadiusM, outerRadiusM: spec.outerRadiusM, pecCore: false };
  if (spec.kind === "rotator") return { reason: "a rotator's tensor is not diagonal in the polar basis (it couples r and θ); use the finite-difference method" };
  return { reason: `the ${spec.kind} transform is not a radial device; use the finite-difference method` };
}

/** The homogeneous core of `scene` at r < coreRadius (sampled at half the radius), or why it is not one. */
function sampledCore(scene: Scene, centre: [number, number], coreRadiusM: number): RadialCore | string {
  const out = new Float64Array(SAMPLE_LENGTH);
  const values: number[][] = [];
  for (const [fx, fy] of [[0.5, 0], [0, 0.3], [-0.2, -0.2]]) {
    const kind = scene.sample(centre[0] + fx * coreRadiusM, centre[1] + fy * coreRadiusM, out);
    values.push(kind === SAMPLE_MEDIUM ? [out[S_B], out[S_B + 1], out[S_TXX], out[S_TXX + 1], out[S_TYY], out[S_TYY + 1], out[S_TXY], out[S_TXY + 1]] : [kind === 0 ? -1 : -2]);
  }
  if (values.some((v) => v.length !== values[0].length || v.some((x, i) => Math.abs(x - values[0][i]) > 1e-9 * Math.max(1, Math.abs(x))))) return "the core is not homogeneous";
  const v = values[0];
  const { eps: eb, mu: mb } = scene.background;
  let b: number, t: number;
  if (v.length === 1) {
    if (v[0] === -2) return { kind: "pec" };
    [b, t] = scene.polarization === "Ez" ? [eb, mb] : [mb, eb];
  } else {
    if (v[1] !== 0 || v[3] !== 0 || v[5] !== 0 || v[6] !== 0 || v[2] !== v[4]) return "the core is lossy or anisotropic (the radial solver's core is an isotropic lossless medium)";
    b = v[0]; t = v[2];
  }
  if (!(b > 0 && t > 0)) return "the core has a non-positive constant";
  return scene.polarization === "Ez" ? { kind: "medium", eps: b, mu: t } : { kind: "medium", eps: t, mu: b };
}

/** One case's radial problem, or why the radial solver cannot take it (decided without solving). */
export type RadialCasePlan =
  | { name: CaseSpec["name"]; problem: RadialProblem; reason: null }
  | { name: CaseSpec["name"]; problem: null; reason: string };

/**
 * The radial problem of every case of `cases` (see file comment), without solving: what
 * radialCases solves, and what a cost estimate counts (radialProblemSeconds) before anything runs.
 */
export function radialCasePlans(spec: TransformSpec, cases: readonly CaseSpec[], k0: number, tolerance = 1e-9): RadialCasePlan[] {
  const geo = radialGeometry(spec);
  const no = (name: CaseSpec["name"], reason: string): RadialCasePlan => ({ name, problem: null, reason });
  if ("reason" in geo) return cases.map((c) => no(c.name, geo.reason));
  return cases.map((c) => {
    if (!c.scene) return no(c.name, c.reason ?? "not computed");
    const scene = c.scene;
    let core: RadialCore | string;
    if (c.name === "bare") core = { kind: "pec" };
    else core = geo.pecCore ? { kind: "pec" } : sampledCore(scene, geo.centreM, geo.coreRadiusM);
    if (typeof core === "string") return no(c.name, core);
    if (c.name === "bare") return { name: c.name, problem: { polarization: scene.polarization, k0, background: scene.background, coreRadiusM: geo.coreRadiusM, core, shells: [], tolerance }, reason: null };
    const p = radialProblemFromScene({ scene, centreM: geo.centreM, coreRadiusM: geo.coreRadiusM, core, outerRadiusM: geo.outerRadiusM, k0, tolerance });
    if (!p.applies) return no(c.name, `not radial: ${p.reason}; use the finite-difference method`);
    return { name: c.name, problem: p.problem, reason: null };
  });
}

/** Solve every case of `cases` radially (see file comment); k0 in rad/m. */
export function radialCases(spec: TransformSpec, cases: CaseSpec[], k0: number, tolerance = 1e-9, incidenceRad = 0): RadialCaseResult[] {
  return solveRadialPlans(spec, radialCasePlans(spec, cases, k0, tolerance), incidenceRad);
}

/** Solve the radial plans of radialCasePlans (those with a problem; the others come back unavailable with their reason). */
export function solveRadialPlans(spec: TransformSpec, plans: readonly RadialCasePlan[], incidenceRad = 0): RadialCaseResult[] {
  const geo = radialGeometry(spec);
  const unavailable = (name: CaseSpec["name"], reason: string): RadialCaseResult => ({ name, available: false, reason, scatteringWidthM: null, vsBare: null, vsBareUncertainty: null, absorptionWidthM: null, uncertainty: null, scatteringWidthUncertaintyM: null, scatteringWidthBelowM: null, bistaticM: null });
  if ("reason" in geo) return plans.map((p) => unavailable(p.name, geo.reason));
  const results: RadialCaseResult[] = plans.map((plan) => {
    if (plan.problem === null) return unavailable(plan.name, plan.reason);
    const s = radialScattering(plan.problem);
    return {
      name: plan.name, available: true, reason: null,
      scatteringWidthM: s.scatteringWidthM, vsBare: null, vsBareUncertainty: null, absorptionWidthM: s.absorptionWidthM,
      uncertainty: Math.max(s.convergence.relativeChange, s.convergence.tail),
      scatteringWidthUncertaintyM: null, scatteringWidthBelowM: null,
      bistaticM: patternAt(s.aRe, s.aIm, s.k, incidenceRad),
    };
  });
  const bare = results.find((r) => r.name === "bare" && r.available);
  // an invisible device has σ_s ≈ 0, whose relative change means nothing: the uncertainty is read on
  // the problem's scale, max(σ_s, σ_bare, 2R), and a width below 1e-6 of 2R reads as zero (widthReading.ts)
  for (const r of results) {
    if (!r.available) continue;
    const w = widthReading(r.scatteringWidthM!, r.uncertainty! * r.scatteringWidthM!, { referenceM: bare?.scatteringWidthM ?? null, deviceWidthM: 2 * geo.outerRadiusM });
    r.scatteringWidthM = w.valueM;
    if (bare && bare.scatteringWidthM! > 0) {
      r.vsBare = w.valueM / bare.scatteringWidthM!;
      r.vsBareUncertainty = w.uncertaintyM! / bare.scatteringWidthM!;
    }
    r.uncertainty = w.relative;
    r.scatteringWidthUncertaintyM = w.uncertaintyM;
    r.scatteringWidthBelowM = w.belowM;
  }
  return results;
}
