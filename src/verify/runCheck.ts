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
 * solved) on which the homogenized `realized` map is solved again (drawnRun.ts): per rung the
 * difference of the two widths over the bare object's (or the larger width) compares like with like
 * and is extrapolated with its uncertainty — the plan's homogenization error. A ladder that does not
 * fit is not run: the case says how large its grids would be (nodes, memory, time, the limit) and
 * how much coarser the features would have to be.
 * Pure: no files, no clock.
 */
import { SPEED_OF_LIGHT_M_PER_S as C0 } from "../core/physicalConstants.js";
import { InputError } from "../core/errors.js";
import { formatBytes } from "./assemble.js";
import { formatDuration } from "../core/timeEstimate.js";
import { formatLength } from "./formatQuantity.js";
import { DRAWN_STEPS, drawnLadderPlan, type DrawnLadderPlan } from "./drawnLadder.js";
import type { TransformSpec } from "../field/transformSpec.js";
import type { FdfdGrid } from "./fdfdGrid.js";
import type { Illumination } from "./illumination.js";
import { radialCasePlans, radialGeometry, solveRadialPlans, type RadialCasePlan, type RadialCaseResult } from "./radialCases.js";
import { drawnRun, type CheckCase, type HomogenizationError } from "./drawnRun.js";
import { DEFAULT_ACCURACY, verifyDevice, type CaseSpec, type VerifyInput, type VerifyResult } from "./verifyDevice.js";

export type { CheckCase, HomogenizationError } from "./drawnRun.js";

export type MethodOption = "auto" | "fdfd" | "radial";
export const METHOD_OPTIONS: readonly MethodOption[] = ["auto", "fdfd", "radial"];

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
    const more = plan.added ? `; a fourth grid, ${plan.added.grid.nx} × ${plan.added.grid.ny} nodes, about ${formatDuration(plan.added.seconds)} and ${formatBytes(plan.added.bytes)} more if the three leave the figure unconverged` : "";
    input.onEstimate(plan.seconds, `realized-geometry: ${2 * plan.rungs.length} solves (the drawn structure and the homogenized map on ${plan.rungs.length} grids, the finest ${last.nx} × ${last.ny} nodes, about ${formatBytes(Math.max(...plan.rungs.map((r) => r.bytes)))} for the solver${more})`);
  }
  const main = runMain({ ...input, cases: input.cases.map((c) => (c === drawn ? { name: c.name, scene: null, reason: "solved on its own grid", indexHint: 0 } : c)) });
  const at = main.cases.findIndex((c) => c.name === drawn.name);
  const { result, error } = drawnRun(input, { ...drawn, featureM: drawn.featureM ?? drawn.maxStepM! * DRAWN_STEPS[0] }, main, plan);
  main.cases[at] = result;
  if (result.available && error) main.notes.push(`realized-geometry: drawn on grids of its own (${error.stepsAcrossFeature.join(", ")} steps across the smallest feature, ${formatLength(error.featureM)}; steps ${error.stepsM.map((h) => formatLength(h)).join(", ")}), with the realized map solved again on each for the homogenization error; (σ_geometry − σ_realized)/${error.differenceScale === "bare" ? "σ_bare" : "the larger width"} per grid ${error.differences.map((r) => r.toFixed(4)).join(", ")}${error.ratios.length ? `, σ ratio per grid ${error.ratios.map((r) => r.toFixed(4)).join(", ")}` : ""}`);
  if (result.available && error?.addedRungNote) main.notes.push(`realized-geometry: not converged; ${error.addedRungNote}`);
  return { ...main, homogenizationError: error };
}

/**
 * How a check's cases are split between the two solvers, decided before anything is solved (runMain
 * solves by it; the sweep's time estimate costs by it). `gridOnly`: every case goes to the grid, and
 * why; else `radial` holds each case's radial problem or why it has none, and `gridCases` the cases
 * the grid solves beside them (the bare object and every case the radial solver cannot take, or none).
 * Throws InputError when `radial` is forced where it does not apply.
 */
export interface SolverSplit {
  gridOnly: string | null;
  radial: RadialCasePlan[];
  gridCases: CaseSpec[];
}

/** Split the cases between the solvers (see SolverSplit). */
export function solverSplit(input: Pick<CheckInput, "method" | "transform" | "illumination" | "groundYM" | "gridOption" | "frequencyHz" | "cases">): SolverSplit {
  const whole = radialRunReason(input);
  if (input.method === "radial" && whole !== null) throw new InputError({ where: "--method", message: `radial does not apply: ${whole}; use --method fdfd` });
  const gridOnly = input.method === "fdfd" ? "--method fdfd" : whole !== null ? whole : input.gridOption ? `${input.gridOption} asks for the grid` : null;
  if (gridOnly !== null) return { gridOnly, radial: [], gridCases: input.cases };
  const k0 = (2 * Math.PI * input.frequencyHz) / C0;
  const radial = radialCasePlans(input.transform, input.cases, k0, 1e-9);
  const onGrid = input.method === "auto"
    ? input.cases.filter((c) => c.scene !== null && radial.find((r) => r.name === c.name)!.problem === null)
    : [];
  const needGrid = onGrid.some((c) => c.name !== "bare");
  return { gridOnly: null, radial, gridCases: needGrid ? input.cases.filter((c) => c.name === "bare" || onGrid.includes(c)) : [] };
}

function runMain(input: CheckInput): Omit<CheckResult, "homogenizationError"> {
  const accuracy = input.accuracy ?? DEFAULT_ACCURACY;
  const split = solverSplit(input);
  if (split.gridOnly !== null) {
    const r = verifyDevice(input);
    const why = input.method === "fdfd" ? "finite differences on a grid (--method fdfd)" : `finite differences on a grid (auto: ${split.gridOnly})`;
    return { ...r, method: "fdfd", methodReason: why, cases: r.cases.map((c) => (c.available ? { ...c, method: "fdfd", methodReason: why } : { ...c, method: null, methodReason: null })) };
  }
  const angle = input.illumination?.kind === "plane" ? input.illumination.angleRad : 0;
  const radial = solveRadialPlans(input.transform, split.radial, angle);
  const gridRun = split.gridCases.length ? verifyDevice({ ...input, cases: split.gridCases }) : null;
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
