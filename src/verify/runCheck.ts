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
 * enough to draw them (`maxStepM`), far finer than the other cases need, so it gets a ladder of its
 * own on which the homogenized `realized` map is solved again: per rung the ratio
 * ρ = σ_geometry/σ_realized compares like with like, is extrapolated (Richardson) with its
 * uncertainty, and ρ − 1 is the plan's homogenization error. The geometry case's σ/σ_bare is the
 * realized case's times ρ. A grid that does not fit is not run: the case says how large it would be
 * and how much coarser the features would have to be.
 * Pure: no files, no clock.
 */
import { SPEED_OF_LIGHT_M_PER_S as C0 } from "../core/physicalConstants.js";
import { InputError } from "../core/errors.js";
import { formatBytes, solveCost } from "./assemble.js";
import { formatLength } from "./formatQuantity.js";
import { FEATURE_STEPS } from "./geometryScene.js";
import { richardson } from "./richardson.js";
import type { TransformSpec } from "../field/transformSpec.js";
import type { FdfdGrid } from "./fdfdGrid.js";
import type { Illumination } from "./illumination.js";
import { radialCases, radialGeometry, type RadialCaseResult } from "./radialCases.js";
import { ladderGrids } from "./ladderGrids.js";
import { resampleNodes } from "./resampleNodes.js";
import { DEFAULT_ACCURACY, gridFits, MAX_AUTO_UNKNOWNS, verifyDevice, type CaseResult, type CaseSpec, type VerifyInput, type VerifyResult } from "./verifyDevice.js";

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
  /** the grid step of the coarsest rung and the smallest drawn feature, metres */
  stepM: number;
  resolutions: number[];
}

export interface CheckInput extends VerifyInput {
  method: MethodOption;
  transform: TransformSpec;
  /** the option that asks for the grid (--resolution, --margin, --out), if any: auto then takes the grid */
  gridOption?: string | null;
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
  const main = runMain({ ...input, cases: input.cases.map((c) => (c === drawn ? { name: c.name, scene: null, reason: "solved on its own grid", indexHint: 0 } : c)) });
  const at = main.cases.findIndex((c) => c.name === drawn.name);
  const { result, error } = geometryRun(input, drawn, main);
  main.cases[at] = result;
  if (result.available && error) main.notes.push(`realized-geometry: drawn on its own ladder (${error!.resolutions.join(", ")} points per wavelength, step ${formatLength(error!.stepM)} on the coarsest, at least ${FEATURE_STEPS} steps across the smallest feature), with the realized map solved again on it for the homogenization error`);
  return { ...main, homogenizationError: error };
}

const unavailableCase = (name: CaseSpec["name"], reason: string): CheckCase => ({
  name, method: null, methodReason: null, available: false, reason, scatteringWidthM: null, scatteringWidthUncertaintyM: null, scatteringWidthBelowM: null, uncertainty: null, converged: null, vsBare: null, vsBareUncertainty: null,
  absorptionWidthM: null, powerBalance: null, fieldErrorVsIdeal: null, deliveredPower: null, deliveredPowerUncertainty: null, deviationDeg: null, bistaticM: null, ladder: [], magnitude: null,
});

/** The drawn case on its own ladder, beside the homogenized realized map (see file comment). */
function geometryRun(input: CheckInput, drawn: CaseSpec, main: Omit<CheckResult, "homogenizationError">): { result: CheckCase; error: HomogenizationError | null } {
  if (input.method === "radial") return { result: unavailableCase(drawn.name, "--method radial: drawn inclusions are not an r-only map; use --method auto or fdfd"), error: null };
  const realizedSpec = input.cases.find((c) => c.name === "realized" && c.scene !== null);
  const realizedMain = main.cases.find((c) => c.name === "realized" && c.available);
  if (!realizedSpec || !realizedMain) return { result: unavailableCase(drawn.name, "the realized (homogenized) case was not computed, so there is nothing to compare the drawn structure with"), error: null };
  const gridInput: VerifyInput = { ...input, cases: [realizedSpec, drawn], maxStepM: drawn.maxStepM, pattern: input.pattern };
  const tooLarge = (scale: number): string | null => {
    const nb = Math.sqrt(input.background.eps * input.background.mu);
    const lad = ladderGrids({
      polarization: input.polarization, background: input.background, frequencyHz: input.frequencyHz, deviceBox: input.deviceBox, groundYM: input.groundYM,
      resolution: input.resolution, accuracy: input.accuracy ?? DEFAULT_ACCURACY, marginM: input.marginM ?? C0 / (input.frequencyHz * nb) / 2,
      maxStepM: drawn.maxStepM! * scale, caseIndexHints: [realizedSpec.indexHint, drawn.indexHint],
    });
    const g = lad.makeGrid(lad.wanted[0]);
    const fit = gridFits(g);
    if (!fit.ok) return `${g.nx} × ${g.ny} nodes, ${fit.over}`;
    if (g.nx * g.ny > MAX_AUTO_UNKNOWNS) return `${g.nx} × ${g.ny} nodes (about ${formatBytes(solveCost(g).megabytes * 1e6)}), more than the ${(MAX_AUTO_UNKNOWNS / 1e6).toPrecision(2)} million nodes the check solves on its own`;
    return null;
  };
  const over = tooLarge(1);
  if (over !== null) {
    let scale = 1;
    for (let k = 0; k < 80 && tooLarge(scale) !== null; k++) scale *= 1.1;
    const fits = tooLarge(scale) === null ? `it would fit with every feature about ${scale.toPrecision(2)} times larger (a pitch ${scale.toPrecision(2)} times coarser), a smaller device or a smaller --margin` : "no feature size makes it fit on this machine";
    return { result: unavailableCase(drawn.name, `drawing the inclusions with ${FEATURE_STEPS} grid steps across the smallest feature (a step of ${formatLength(drawn.maxStepM!)}) needs ${over}; ${fits}`), error: null };
  }
  let run: VerifyResult;
  try {
    run = verifyDevice(gridInput);
  } catch (e) {
    if (e instanceof InputError) return { result: unavailableCase(drawn.name, `the drawn structure's grid was refused: ${e.issues.map((i) => i.message).join("; ")}`), error: null };
    throw e;
  }
  const hom = run.cases.find((c) => c.name === "realized")!;
  const geo = run.cases.find((c) => c.name === drawn.name)!;
  const hs = hom.ladder.map((p) => p.stepM);
  if (hom.ladder.some((p) => !(p.scatteringWidthM > 0))) {
    return { result: { ...geo, method: "fdfd", methodReason: "finite differences on the drawn structure's grid", vsBare: null, fieldErrorVsIdeal: null, magnitude: main.grid && geo.magnitude ? resampleNodes(run.grid, geo.magnitude, main.grid) : null }, error: null };
  }
  const ratio = richardson(hs, geo.ladder.map((p, k) => p.scatteringWidthM / hom.ladder[k].scatteringWidthM));
  const vsBare = realizedMain.vsBare === null ? null : realizedMain.vsBare * ratio.value;
  const why = `finite differences on a grid fine enough to draw the inclusions (at least ${FEATURE_STEPS} steps across the smallest feature)`;
  const delivered = geo.deliveredPower !== null && hom.deliveredPower !== null ? geo.deliveredPower - hom.deliveredPower : null;
  return {
    // |u| of the drawn case on the main grid, for the field picture (null when the main run had no grid)
    result: { ...geo, method: "fdfd", methodReason: why, vsBare, fieldErrorVsIdeal: null, ladder: geo.ladder.map((p) => ({ ...p, vsBare: null })), magnitude: main.grid && geo.magnitude ? resampleNodes(run.grid, geo.magnitude, main.grid) : null },
    error: {
      relative: ratio.value - 1, uncertainty: ratio.uncertainty,
      vsBareDifference: vsBare === null ? null : vsBare - realizedMain.vsBare!,
      deliveredPowerDifference: delivered,
      stepM: hs[0], resolutions: run.resolutions,
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
      deliveredPower: null, deliveredPowerUncertainty: null, deviationDeg: null, bistaticM: r.bistaticM, ladder: [], magnitude: null,
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
