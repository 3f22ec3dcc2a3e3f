/**
 * One verify run with the solver chosen per case: `auto` (the default) takes the exact radial
 * solver (radialCases.ts) for every case whose scene is r-only and diagonal in the polar basis —
 * a radial cloak's bare conductor, ideal and reduced shells, a concentrator, a layered realization
 * of them — and the finite-difference grid (verifyDevice.ts) for the rest (the realized map on the
 * design's square cells, rotators, bends, beams, ground planes). `radial` and `fdfd` force one
 * solver. Each case says which solver computed it and why (`method`, `methodReason`); the run's
 * `method` is `radial`, `fdfd` or `radial+fdfd`.
 *
 * In a mixed run a grid case is compared with the bare object solved on the same grid (σ/σ_bare
 * like with like); the bare row itself is the exact radial figure. A grid case's field difference
 * from the ideal device needs the ideal on the grid too, so it is null when the ideal was radial.
 *
 * The `realized-geometry` case (inclusions drawn at their size, geometryScene.ts) needs a grid fine
 * enough to draw them, far finer than the other cases need, so it gets a ladder of its own
 * (drawnLadder.ts: steps from the smallest drawn feature, costed and told before anything is
 * solved) on which the homogenized `realized` map is solved again: per rung the ratio
 * ρ = σ_geometry/σ_realized compares like with like, is extrapolated (Richardson) with its
 * uncertainty, and ρ − 1 is the plan's homogenization error. The geometry case's σ/σ_bare is the
 * realized case's times ρ. A ladder that does not fit is not run: the case says how large its grids
 * would be (nodes, memory, time, the limit) and how much coarser the features would have to be.
 * Pure: no files, no clock.
 */
import { SPEED_OF_LIGHT_M_PER_S as C0 } from "../core/physicalConstants.js";
import { InputError } from "../core/errors.js";
import { formatBytes } from "./assemble.js";
import { formatLength } from "./formatQuantity.js";
import { DRAWN_STEPS, drawnLadderPlan, type DrawnLadderPlan } from "./drawnLadder.js";
import { richardson } from "./richardson.js";
import type { TransformSpec } from "../field/transformSpec.js";
import type { FdfdGrid } from "./fdfdGrid.js";
import type { Illumination } from "./illumination.js";
import { radialCases, radialGeometry, type RadialCaseResult } from "./radialCases.js";
import { resampleNodes } from "./resampleNodes.js";
import { DEFAULT_ACCURACY, verifyDevice, type CaseResult, type CaseSpec, type LadderPoint, type VerifyInput, type VerifyResult } from "./verifyDevice.js";

export type MethodOption = "auto" | "fdfd" | "radial";
export const METHOD_OPTIONS: readonly MethodOption[] = ["auto", "fdfd", "radial"];

export interface CheckCase extends CaseResult {
  /** the solver that computed this case (null: the case has nothing to solve, `reason` says why) */
  method: "fdfd" | "radial" | null;
  /** why that solver (null with `method`) */
  methodReason: string | null;
}

export interface CheckResult extends Omit<VerifyResult, "method" | "grid" | "cases"> {
  method: "fdfd" | "radial" | "radial+fdfd";
  /** why this solver (or split) was used */
  methodReason: string;
  /** finest grid, null when no case needed it */
  grid: FdfdGrid | null;
  cases: CheckCase[];
  /** realized-geometry against realized (homogenized) on the same fine ladder; null when either is not computed */
  homogenizationError: HomogenizationError | null;
}

/** The plan's homogenization error: the drawn structure against its effective-medium map. */
export interface HomogenizationError {
  /** σ_geometry/σ_realized − 1, extrapolated to zero step */
  relative: number;
  /** absolute uncertainty of `relative` (null on a single grid) */
  uncertainty: number | null;
  /** σ/σ_bare of the drawn structure minus the realized case's (null without a bare object) */
  vsBareDifference: number | null;
  /** beams: delivered power of the drawn structure minus the homogenized map's, finest grid */
  deliveredPowerDifference: number | null;
  /** the grid step of the coarsest rung, metres */
  stepM: number;
  /** points per wavelength in the densest material on each rung */
  resolutions: number[];
  /** grid step of each rung (coarsest first), metres */
  stepsM: number[];
  /** grid steps across the smallest drawn feature on each rung */
  stepsAcrossFeature: number[];
  /** the smallest drawn feature, metres */
  featureM: number;
  /** σ_geometry/σ_realized on each rung (the ladder the error is extrapolated from) */
  ratios: number[];
}

export interface CheckInput extends VerifyInput {
  method: MethodOption;
  transform: TransformSpec;
  /** the option that asks for the grid (--resolution, --margin, --out), if any: auto then takes the grid */
  gridOption?: string | null;
  /** estimated seconds the drawn case may take (default MAX_DRAWN_SECONDS; 0: not run) */
  drawnSeconds?: number;
}

/** Why the radial solver cannot take this run as a whole (null when it can). */
export function radialRunReason(input: Pick<CheckInput, "transform" | "illumination" | "groundYM">): string | null {
  const geo = radialGeometry(input.transform);
  if ("reason" in geo) return geo.reason;
  if (input.illumination?.kind === "beam") return "a beam is not a plane wave: the radial solver takes plane waves only";
  if (input.groundYM !== undefined) return "a ground plane breaks the rotational symmetry the radial solver needs";
  return null;
}

const RADIAL_WHY = "exact radial solver: the tensors depend on r only and are diagonal in the polar basis";

/** Run the check (see file comment). Throws InputError when `radial` is forced where it does not apply. */
export function runCheck(input: CheckInput): CheckResult {
  const drawn = input.cases.find((c) => c.scene !== null && c.maxStepM !== undefined);
  if (!drawn) return { ...runMain(input), homogenizationError: null };
  // the drawn ladder is chosen and costed before anything is solved, and its estimate told first
  const realizedSpec = input.cases.find((c) => c.name === "realized" && c.scene !== null);
  const plan = input.drawnSeconds === 0 ? { rungs: [], seconds: 0, marginM: 0, reason: "not run (--drawn-time 0)" }
    : realizedSpec && input.method !== "radial" ? drawnLadderPlan(input, realizedSpec, drawn, drawn.featureM ?? drawn.maxStepM! * DRAWN_STEPS[0], { seconds: input.drawnSeconds }) : null;
  if (plan && plan.reason === null && input.onEstimate) {
    const last = plan.rungs[plan.rungs.length - 1].grid;
    input.onEstimate(plan.seconds, `realized-geometry: ${2 * plan.rungs.length} solves (the drawn structure and the homogenized map on ${plan.rungs.length} grids, the finest ${last.nx} × ${last.ny} nodes, about ${formatBytes(Math.max(...plan.rungs.map((r) => r.bytes)))} for the solver)`);
  }
  const main = runMain({ ...input, cases: input.cases.map((c) => (c === drawn ? { name: c.name, scene: null, reason: "solved on its own grid", indexHint: 0 } : c)) });
  const at = main.cases.findIndex((c) => c.name === drawn.name);
  const { result, error } = geometryRun(input, { ...drawn, featureM: drawn.featureM ?? drawn.maxStepM! * DRAWN_STEPS[0] }, main, plan);
  main.cases[at] = result;
  if (result.available && error) main.notes.push(`realized-geometry: drawn on grids of its own (${error.stepsAcrossFeature.join(", ")} steps across the smallest feature, ${formatLength(error.featureM)}; steps ${error.stepsM.map((h) => formatLength(h)).join(", ")}), with the realized map solved again on each for the homogenization error; σ ratio per grid ${error.ratios.map((r) => r.toFixed(4)).join(", ")}`);
  return { ...main, homogenizationError: error };
}

const unavailableCase = (name: CaseSpec["name"], reason: string): CheckCase => ({
  name, method: null, methodReason: null, available: false, reason, scatteringWidthM: null, scatteringWidthUncertaintyM: null, scatteringWidthBelowM: null, uncertainty: null, converged: null, vsBare: null, vsBareUncertainty: null,
  absorptionWidthM: null, powerBalance: null, fieldErrorVsIdeal: null, deliveredPower: null, deliveredPowerUncertainty: null, lobes: null, deviationDeg: null, bistaticM: null, ladder: [], magnitude: null,
});

/** The drawn case on its own ladder (drawnLadder.ts), beside the homogenized realized map (see file comment). */
function geometryRun(input: CheckInput, drawn: CaseSpec, main: Omit<CheckResult, "homogenizationError">, plan: DrawnLadderPlan | null): { result: CheckCase; error: HomogenizationError | null } {
  if (input.method === "radial") return { result: unavailableCase(drawn.name, "--method radial: drawn inclusions are not an r-only map; use --method auto or fdfd"), error: null };
  const realizedSpec = input.cases.find((c) => c.name === "realized" && c.scene !== null);
  const realizedMain = main.cases.find((c) => c.name === "realized" && c.available);
  if (!realizedSpec || !realizedMain || !plan) return { result: unavailableCase(drawn.name, "the realized (homogenized) case was not computed, so there is nothing to compare the drawn structure with"), error: null };
  if (plan.reason !== null) return { result: unavailableCase(drawn.name, plan.reason), error: null };
  const hom: LadderPoint[] = [], geo: LadderPoint[] = [];
  let last: VerifyResult | null = null;
  for (const [k, rung] of plan.rungs.entries()) {
    let run: VerifyResult;
    try {
      run = verifyDevice({
        ...input, cases: [realizedSpec, drawn], resolution: rung.resolution, maxStepM: drawn.featureM! / rung.stepsAcross, marginM: plan.marginM, onEstimate: undefined,
        onProgress: input.onProgress && ((step, f) => input.onProgress!(`realized-geometry grid ${k + 1} of ${plan.rungs.length}: ${step}`, (k + f) / plan.rungs.length)),
      });
    } catch (e) {
      if (e instanceof InputError) return { result: unavailableCase(drawn.name, `the drawn structure's grid was refused: ${e.issues.map((i) => i.message).join("; ")}`), error: null };
      throw e;
    }
    hom.push(run.cases[0].ladder[0]); geo.push(run.cases[1].ladder[0]);
    last = run;
  }
  const hs = geo.map((p) => p.stepM);
  const g = last!.cases[1];
  const why = `finite differences on grids that draw every inclusion (${plan.rungs.map((r) => r.stepsAcross).join(", ")} steps across the smallest feature, ${formatLength(drawn.featureM!)})`;
  const ladder = geo.map((p) => ({ ...p, vsBare: null }));
  const magnitude = main.grid && g.magnitude ? resampleNodes(last!.grid, g.magnitude, main.grid) : null;
  const sx = richardson(hs, geo.map((p) => p.scatteringWidthM));
  const uncertainty = sx.uncertainty === null ? null : Math.abs(sx.value) > 0 ? sx.uncertainty / Math.abs(sx.value) : 0;
  const base: CheckCase = {
    ...g, method: "fdfd", methodReason: why, scatteringWidthM: sx.value, uncertainty, converged: uncertainty === null ? null : uncertainty <= (input.accuracy ?? DEFAULT_ACCURACY),
    vsBare: null, fieldErrorVsIdeal: null, ladder, magnitude,
  };
  if (hom.some((p) => !(p.scatteringWidthM > 0))) return { result: base, error: null };
  const ratio = richardson(hs, geo.map((p, k) => p.scatteringWidthM / hom[k].scatteringWidthM));
  const vsBare = realizedMain.vsBare === null ? null : realizedMain.vsBare * ratio.value;
  const lastHom = last!.cases[0];
  const delivered = g.deliveredPower !== null && lastHom.deliveredPower !== null ? g.deliveredPower - lastHom.deliveredPower : null;
  return {
    result: { ...base, vsBare },
    error: {
      relative: ratio.value - 1, uncertainty: ratio.uncertainty,
      vsBareDifference: vsBare === null ? null : vsBare - realizedMain.vsBare!,
      deliveredPowerDifference: delivered,
      stepM: hs[0], resolutions: hs.map((h) => Math.round(C0 / (input.frequencyHz * last!.densestIndex * h))),
      stepsM: hs, stepsAcrossFeature: plan.rungs.map((r) => r.stepsAcross), featureM: drawn.featureM!,
      ratios: geo.map((p, k) => p.scatteringWidthM / hom[k].scatteringWidthM),
    },
  };
}

function runMain(input: CheckInput): Omit<CheckResult, "homogenizationError"> {
  const accuracy = input.accuracy ?? DEFAULT_ACCURACY;
  const whole = radialRunReason(input);
  if (input.method === "radial" && whole !== null) throw new InputError({ where: "--method", message: `radial does not apply: ${whole}; use --method fdfd` });
  const gridOnly = input.method === "fdfd" ? "--method fdfd" : whole !== null ? whole : input.gridOption ? `${input.gridOption} asks for the grid` : null;
  if (gridOnly !== null) {
    const r = verifyDevice(input);
    const why = input.method === "fdfd" ? "finite differences on a grid (--method fdfd)" : `finite differences on a grid (auto: ${gridOnly})`;
    return { ...r, method: "fdfd", methodReason: why, cases: r.cases.map((c) => (c.available ? { ...c, method: "fdfd", methodReason: why } : { ...c, method: null, methodReason: null })) };
  }
  const k0 = (2 * Math.PI * input.frequencyHz) / C0;
  const angle = input.illumination?.kind === "plane" ? input.illumination.angleRad : 0;
  const radial = radialCases(input.transform, input.cases, k0, 1e-9, angle);
  const onGrid = input.method === "auto"
    ? input.cases.filter((c) => c.scene !== null && !radial.find((r) => r.name === c.name)!.available)
    : [];
  const needGrid = onGrid.some((c) => c.name !== "bare");
  const gridRun = needGrid
    ? verifyDevice({ ...input, cases: input.cases.filter((c) => c.name === "bare" || onGrid.includes(c)) })
    : null;
  return mergeRuns(input, radial, gridRun, accuracy);
}

function mergeRuns(input: CheckInput, radial: RadialCaseResult[], grid: VerifyResult | null, accuracy: number): Omit<CheckResult, "homogenizationError"> {
  const cases: CheckCase[] = input.cases.map((spec) => {
    const r = radial.find((c) => c.name === spec.name)!;
    const g = grid?.cases.find((c) => c.name === spec.name && c.available);
    if (g && !r.available) return { ...g, method: "fdfd", methodReason: `finite differences on a grid (auto: ${r.reason})` };
    const none = spec.scene === null;
    return {
      name: spec.name, method: none ? null : "radial", methodReason: none ? null : r.available ? RADIAL_WHY : "--method radial",
      available: r.available, reason: r.reason,
      scatteringWidthM: r.scatteringWidthM, scatteringWidthUncertaintyM: r.scatteringWidthUncertaintyM, scatteringWidthBelowM: r.scatteringWidthBelowM, uncertainty: r.uncertainty, converged: r.uncertainty === null ? null : r.uncertainty <= accuracy,
      vsBare: r.vsBare, vsBareUncertainty: r.vsBareUncertainty,
      absorptionWidthM: r.absorptionWidthM, powerBalance: null, fieldErrorVsIdeal: null,
      deliveredPower: null, deliveredPowerUncertainty: null, lobes: null, deviationDeg: null, bistaticM: r.bistaticM, ladder: [], magnitude: null,
    };
  });
  const usedGrid = cases.some((c) => c.method === "fdfd");
  const nb = Math.sqrt(input.background.eps * input.background.mu);
  const notes = [...(grid?.notes ?? [])];
  if (usedGrid) notes.push("radial cases are exact for their continuous map; grid cases are compared with the bare object solved on the same grid and have no field difference from the (radial) ideal");
  const gridNames = cases.filter((c) => c.method === "fdfd").map((c) => c.name).join(", ");
  return {
    method: usedGrid ? "radial+fdfd" : "radial",
    methodReason: usedGrid
      ? `auto: exact radial solver where the tensors depend on r only; finite differences for ${gridNames} (not radial)`
      : input.method === "radial" ? `${RADIAL_WHY} (--method radial)` : `${RADIAL_WHY} (auto)`,
    polarization: input.polarization, frequencyHz: input.frequencyHz,
    grid: grid?.grid ?? null, resolutions: grid?.resolutions ?? [], accuracy,
    densestIndex: grid?.densestIndex ?? nb, backgroundIndex: nb, marginM: grid?.marginM ?? 0,
    illumination: input.illumination ?? { kind: "plane", angleRad: 0 },
    cases, deviceMask: grid?.deviceMask ?? new Uint8Array(0), groundYM: null, notes,
  };
}
