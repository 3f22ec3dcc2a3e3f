/**
 * The `realized-geometry` case on its own ladder (drawnLadder.ts) beside the homogenized `realized`
 * map, and the plan's homogenization error read from the two (runCheck.ts calls it).
 *
 * Per rung k both are solved on the same grid. The headline figure is the difference of the two
 * widths over a width that does not vanish with them:
 *   Δ_k = (σ_geometry,k − σ_realized,k) / S,
 * S = σ_bare (the hidden object's or the bump's width, extrapolated on the main ladder) where there
 * is one — then Δ is the change of σ/σ_bare the drawing makes — else the larger of the two widths
 * (extrapolated). Δ is extrapolated over the rungs (richardson.ts) with its uncertainty; it is
 * `converged` when that uncertainty is at most the check's accuracy (and, for beams, the delivered
 * share's difference too). The ratio ρ = σ_geometry/σ_realized is kept (`relative` = ρ − 1, `ratios`),
 * but it says little when the homogenized device is nearly invisible: the microwave carpet's
 * realized σ is 9 % of the bump's and its drawn σ 27 % — "+200 %" for a change of 0.18 σ_bare.
 *
 * The drawn case's own figures are read like every grid case's (widthReading.ts): σ_s extrapolated
 * over its rungs, its uncertainty judged against max(σ_s, σ_bare, device width); for beams the
 * delivered share extrapolated too. Its σ/σ_bare is the realized case's plus Δ (with S = σ_bare).
 * Pure.
 */
import { SPEED_OF_LIGHT_M_PER_S as C0 } from "../core/physicalConstants.js";
import { InputError } from "../core/errors.js";
import type { DrawnLadderPlan, DrawnRung } from "./drawnLadder.js";
import { formatLength } from "./formatQuantity.js";
import { resampleNodes } from "./resampleNodes.js";
import { NOMINAL_ORDER, richardson } from "./richardson.js";
import { DEFAULT_ACCURACY, verifyDevice, type CaseResult, type CaseSpec, type LadderPoint, type VerifyInput, type VerifyResult } from "./verifyDevice.js";
import { clampFigure, widthReading } from "./widthReading.js";

/** Nominal order of a drawn Hz scene's figures: first (see where it is used). */
export const DRAWN_HZ_ORDER = 1;

/** The plan's homogenization error: the drawn structure against its effective-medium map. */
export interface HomogenizationError {
  /** Δ = (σ_geometry − σ_realized)/S, extrapolated to zero step (see file comment) */
  difference: number;
  /** absolute uncertainty of `difference` (null on a single grid) */
  differenceUncertainty: number | null;
  /** what S is: the bare object's width, or the larger of the two widths (no bare object) */
  differenceScale: "bare" | "larger-width";
  /** S, metres */
  differenceScaleM: number;
  /** Δ on each rung (the ladder `difference` is extrapolated from) */
  differences: number[];
  /** `differenceUncertainty` (and, for beams, the delivered share difference's) ≤ accuracy; null on a single grid */
  converged: boolean | null;
  /** σ_geometry/σ_realized − 1, extrapolated to zero step (null when the realized width is 0 on a rung) */
  relative: number | null;
  /** absolute uncertainty of `relative` (null on a single grid or without `relative`) */
  uncertainty: number | null;
  /** σ/σ_bare of the drawn structure minus the realized case's (= difference when S is σ_bare; null without a bare object) */
  vsBareDifference: number | null;
  /** beams: delivered share of the drawn structure minus the homogenized map's, extrapolated over the rungs */
  deliveredPowerDifference: number | null;
  /** absolute uncertainty of deliveredPowerDifference (null without one) */
  deliveredPowerDifferenceUncertainty: number | null;
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
  /** σ_geometry/σ_realized on each rung (empty when the realized width is 0 on a rung) */
  ratios: number[];
  /** not converged and no finer rung added: why (e.g. the --drawn-time that would let the ladder go on); null otherwise */
  addedRungNote: string | null;
}

/** A case the check reports, with the solver that computed it. */
export interface CheckCase extends CaseResult {
  /** the solver that computed this case (null: the case has nothing to solve, `reason` says why) */
  method: "fdfd" | "radial" | null;
  /** why that solver (null with `method`) */
  methodReason: string | null;
}

export const unavailableCase = (name: CaseSpec["name"], reason: string): CheckCase => ({
  name, method: null, methodReason: null, available: false, reason, scatteringWidthM: null, scatteringWidthUncertaintyM: null, scatteringWidthBelowM: null, uncertainty: null, converged: null, vsBare: null, vsBareUncertainty: null,
  absorptionWidthM: null, powerBalance: null, fieldErrorVsIdeal: null, deliveredPower: null, deliveredPowerUncertainty: null, lobes: null, deviationDeg: null, bistaticM: null, ladder: [], magnitude: null,
});

export interface DrawnRunInput extends VerifyInput {
  method: "auto" | "fdfd" | "radial";
}

/** The main run's figures the drawn case is read against. */
export interface DrawnRunMain {
  cases: CheckCase[];
  grid: VerifyResult["grid"] | null;
}

/** The drawn case on its own ladder, beside the homogenized realized map (see file comment). */
export function drawnRun(input: DrawnRunInput, drawn: CaseSpec, main: DrawnRunMain, plan: DrawnLadderPlan | null): { result: CheckCase; error: HomogenizationError | null } {
  if (input.method === "radial") return { result: unavailableCase(drawn.name, "--method radial: drawn inclusions are not an r-only map; use --method auto or fdfd"), error: null };
  const realizedSpec = input.cases.find((c) => c.name === "realized" && c.scene !== null);
  const realizedMain = main.cases.find((c) => c.name === "realized" && c.available);
  if (!realizedSpec || !realizedMain || !plan) return { result: unavailableCase(drawn.name, "the realized (homogenized) case was not computed, so there is nothing to compare the drawn structure with"), error: null };
  if (plan.reason !== null) return { result: unavailableCase(drawn.name, plan.reason), error: null };
  const accuracy = input.accuracy ?? DEFAULT_ACCURACY;
  const hom: LadderPoint[] = [], geo: LadderPoint[] = [];
  let last: VerifyResult | null = null;
  const rungs = [...plan.rungs];
  /** Solve one rung (the homogenized map and the drawn structure on one grid); an error text when its grid is refused. */
  const solveRung = (rung: DrawnRung, k: number, of: number): string | null => {
    let run: VerifyResult;
    try {
      run = verifyDevice({
        ...input, cases: [realizedSpec, drawn], resolution: rung.resolution, maxStepM: drawn.featureM! / rung.stepsAcross, marginM: plan.marginM, onEstimate: undefined,
        onProgress: input.onProgress && ((step, f) => input.onProgress!(`realized-geometry grid ${k + 1} of ${of}: ${step}`, (k + f) / of)),
      });
    } catch (e) {
      if (e instanceof InputError) return `the drawn structure's grid was refused: ${e.issues.map((i) => i.message).join("; ")}`;
      throw e;
    }
    hom.push(run.cases[0].ladder[0]); geo.push(run.cases[1].ladder[0]);
    last = run;
    return null;
  };
  for (const [k, rung] of rungs.entries()) {
    const refused = solveRung(rung, k, rungs.length);
    if (refused !== null) return { result: unavailableCase(drawn.name, refused), error: null };
  }
  let read = readDrawn(input, drawn, main, realizedMain, rungs, hom, geo, last!, accuracy);
  // not converged on the planned rungs: one finer rung where it fits (drawnLadder.ts DRAWN_ADDED_STEPS)
  const unconverged = (r: typeof read): boolean => r.result.converged === false || r.error?.converged === false;
  if (unconverged(read) && plan.added) {
    const refused = solveRung(plan.added, rungs.length, rungs.length + 1);
    if (refused === null) {
      rungs.push(plan.added);
      read = readDrawn(input, drawn, main, realizedMain, rungs, hom, geo, last!, accuracy);
    }
  }
  if (unconverged(read) && read.error && plan.addedReason) read.error.addedRungNote = plan.addedReason;
  return read;
}

/** The drawn case's figures and the homogenization error from the rungs solved (see file comment). */
function readDrawn(input: DrawnRunInput, drawn: CaseSpec, main: DrawnRunMain, realizedMain: CheckCase, rungs: readonly DrawnRung[], hom: readonly LadderPoint[], geo: readonly LadderPoint[], last: VerifyResult, accuracy: number): { result: CheckCase; error: HomogenizationError | null } {
  const hs = geo.map((p) => p.stepM);
  // the drawn scene's order: second in Ez (tests/verify/drawnEzConvergence.test.ts), first in Hz,
  // where a curved interface leaves a first-order remainder in the in-plane averaging (a single rod
  // against the series: order 0.84–1.4, about 1.0–1.1 on fine grids, drawnHzConvergence.test.ts);
  // extrapolating an Hz ladder as second order would understate what is left
  const nominal = input.polarization === "Hz" ? DRAWN_HZ_ORDER : NOMINAL_ORDER;
  const g = last.cases[1];
  const why = `finite differences on grids that draw every inclusion (${rungs.map((r) => r.stepsAcross).join(", ")} steps across the smallest feature, ${formatLength(drawn.featureM!)})`;
  const magnitude = main.grid && g.magnitude ? resampleNodes(last.grid, g.magnitude, main.grid) : null;
  // the drawn case's own figures, read as every grid case's
  const bare = main.cases.find((c) => c.name === "bare" && c.available && c.scatteringWidthM !== null && c.scatteringWidthM > 0);
  const box = input.deviceBox;
  const deviceWidthM = Math.max(box.maxX - box.minX, box.maxY - box.minY);
  const sx = richardson(hs, geo.map((p) => p.scatteringWidthM), nominal);
  const width = widthReading(sx.value, sx.uncertainty, { referenceM: bare ? bare.scatteringWidthM : null, deviceWidthM });
  const beam = geo.every((p) => p.deliveredPower !== null) && hom.every((p) => p.deliveredPower !== null);
  const dx = beam ? richardson(hs, geo.map((p) => p.deliveredPower!), nominal) : null;
  const share = dx ? clampFigure(dx.value, dx.uncertainty, 0, 1) : null;
  let unc = width.relative;
  if (unc !== null && share && share.uncertainty !== null) unc = Math.max(unc, share.uncertainty);
  const base: CheckCase = {
    ...g, method: "fdfd", methodReason: why,
    scatteringWidthM: width.valueM, scatteringWidthUncertaintyM: width.uncertaintyM, scatteringWidthBelowM: width.belowM,
    uncertainty: unc, converged: unc === null ? null : unc <= accuracy,
    deliveredPower: share ? share.value : g.deliveredPower, deliveredPowerUncertainty: share ? share.uncertainty : null,
    vsBare: null, vsBareUncertainty: null, fieldErrorVsIdeal: null, ladder: geo.map((p) => ({ ...p, vsBare: null })), magnitude,
  };
  // the homogenization error: the difference over S, and the ratio beside it
  const hx = richardson(hs, hom.map((p) => p.scatteringWidthM)); // the homogenized map is smooth: second order
  const scale: HomogenizationError["differenceScale"] = bare ? "bare" : "larger-width";
  const S = bare ? bare.scatteringWidthM! : Math.max(width.valueM, hx.value, realizedMain.scatteringWidthM ?? 0);
  if (!(S > 0)) return { result: base, error: null };
  const differences = geo.map((p, k) => (p.scatteringWidthM - hom[k].scatteringWidthM) / S);
  const diff = richardson(hs, differences, nominal);
  const ratios = hom.every((p) => p.scatteringWidthM > 0) ? geo.map((p, k) => p.scatteringWidthM / hom[k].scatteringWidthM) : [];
  const ratio = ratios.length ? richardson(hs, ratios, nominal) : null;
  const dd = beam ? richardson(hs, geo.map((p, k) => p.deliveredPower! - hom[k].deliveredPower!), nominal) : null;
  const converged = diff.uncertainty === null ? null : diff.uncertainty <= accuracy && (dd === null || dd.uncertainty === null || dd.uncertainty <= accuracy);
  const vsBareDifference = bare && realizedMain.vsBare !== null ? diff.value : null;
  const result: CheckCase = vsBareDifference === null ? base : {
    ...base,
    vsBare: Math.max(0, realizedMain.vsBare! + vsBareDifference),
    vsBareUncertainty: diff.uncertainty === null ? null : Math.hypot(diff.uncertainty, realizedMain.vsBareUncertainty ?? 0),
  };
  return {
    result,
    error: {
      difference: diff.value, differenceUncertainty: diff.uncertainty, differenceScale: scale, differenceScaleM: S, differences, converged,
      relative: ratio ? ratio.value - 1 : null, uncertainty: ratio ? ratio.uncertainty : null,
      vsBareDifference,
      deliveredPowerDifference: dd ? dd.value : null, deliveredPowerDifferenceUncertainty: dd ? dd.uncertainty : null,
      stepM: hs[0], resolutions: hs.map((h) => Math.round(C0 / (input.frequencyHz * last.densestIndex * h))),
      stepsM: hs, stepsAcrossFeature: rungs.map((r) => r.stepsAcross), featureM: drawn.featureM!,
      ratios, addedRungNote: null,
    },
  };
}
