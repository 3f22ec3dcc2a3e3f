/**
 * The ladder of the drawn realized case (`realized-geometry`, geometryScene.ts): grids fine enough
 * to draw the inclusions, chosen from the smallest drawn feature, costed before anything is solved,
 * and solved together with the homogenized `realized` map so that per rung the ratio
 * ρ = σ_geometry/σ_realized compares like with like; ρ is extrapolated (richardson.ts) and ρ − 1 is
 * the plan's homogenization error.
 *
 * Steps: rung k has DRAWN_STEPS[k] grid steps (2, 3, 4.5) across the smallest drawn feature or a
 * quarter of the pitch, whichever is smaller (drawnStepFeature: 8, 12, 18 steps per pitch at least). With
 * the sub-pixel averaging of gridCoefficients.ts, a uniform block of rods (fill 0.5–0.6, ε 9.6 in
 * air, a = λ0/32) drawn with 2 steps across its narrowest wall scatters within 2.7 % of its
 * effective medium (Perrins et al. 1979 for the square array, the solved table for the hexagonal),
 * with 3 steps within 1.3 %, and the second-order extrapolation of the two within 0.6 %
 * (tests/verify/drawnLattices.test.ts): so two rungs already give the error to about a per cent,
 * and the third gives the observed order. The window is the device box with a margin of a quarter
 * background wavelength (the drawn lattice's near field decays within a pitch; the flux contour and
 * the far field need no more room), unless --margin says otherwise.
 *
 * Cost: each rung's grid is costed with the nested-dissection solver's own estimate (solveCost:
 * memory and factor operations) and the time rates of core/timeEstimate.ts. Rungs are taken in
 * order while they fit the solver's memory, MAX_DRAWN_UNKNOWNS and, together, MAX_DRAWN_SECONDS of
 * estimated time; fewer than two rungs and the case is not run, with one line that names the
 * grid, its memory and time estimates and the limits. A fourth rung is costed too, for a figure the
 * three leave unconverged (DRAWN_ADDED_STEPS). Pure.
 */
import { SPEED_OF_LIGHT_M_PER_S as C0 } from "../core/physicalConstants.js";
import { formatDuration, solveSeconds } from "../core/timeEstimate.js";
import { DEFAULT_SOLVER_BYTES, formatBytes, solveCost } from "./assemble.js";
import type { FdfdGrid } from "./fdfdGrid.js";
import { formatLength } from "./formatQuantity.js";
import { DEFAULT_ACCURACY, ladderGrids, ladderStart } from "./ladderGrids.js";
import type { CaseSpec, VerifyInput } from "./verifyDevice.js";

/** Grid steps across the smallest drawn feature on each rung (coarsest first). */
export const DRAWN_STEPS: readonly number[] = [2, 3, 4.5];
/** The length the drawn steps are counted across: the smallest drawn feature, at most a quarter of the pitch (a disc's outline wants about 8 steps per pitch on the coarsest grid). */
export function drawnStepFeature(smallestFeatureM: number, pitchM: number): number {
  return Math.min(smallestFeatureM, pitchM / 4);
}

/** Rungs the drawn case needs at least (two give an extrapolation at the nominal order). */
export const DRAWN_MIN_RUNGS = 2;
/** Estimated seconds (one idle core) the check spends on the drawn case. */
export const MAX_DRAWN_SECONDS = 300;
/**
 * Largest drawn grid the check solves on its own: 2 × 10⁶ nodes (the grid ladder's own cap is
 * 1.2 × 10⁶). The drawn case has only three rungs and needs the third for an observed order; at
 * 1.2 × 10⁶ the silicon bend's third rung (1203 × 1203 = 1.45 × 10⁶ nodes) was refused and its
 * figure stayed "not converged" (+0.107 ± 0.034); with it, +0.106 ± 0.013 in 2 min 24 s and
 * 2.4 GB peak (measured in session 6). Time stays bounded by MAX_DRAWN_SECONDS, memory by the
 * solver's limit.
 */
export const MAX_DRAWN_UNKNOWNS = 2e6;
/**
 * A ladder whose figure is not converged on its three rungs goes on to one more, 1.5 times finer
 * (6.75 steps across the feature), when that rung fits the solver's memory, MAX_DRAWN_ADDED_UNKNOWNS
 * and, with the rungs before it, the drawn case's time (--drawn-time). Then the last three rungs are
 * extrapolated. Why: the first-order Hz drawing (DRAWN_HZ_ORDER) leaves the silicon bend's
 * difference at ± 0.03 on 2, 3, 4.5 steps; its estimate on 3, 4.5, 6.75 is about ± 0.014
 * (DEVELOPERS.md, "Accuracy of the drawing").
 */
export const DRAWN_ADDED_STEPS = 6.75;
/** Largest added drawn grid: 4 × 10⁶ nodes (about 5–6 GB for the solver; memory is checked too). */
export const MAX_DRAWN_ADDED_UNKNOWNS = 4e6;

export interface DrawnRung {
  /** steps across the smallest feature */
  stepsAcross: number;
  grid: FdfdGrid;
  /** points per wavelength the rung is asked for (the feature decides the step) */
  resolution: number;
  bytes: number;
  /** estimated seconds of the rung's two solves */
  seconds: number;
}

export interface DrawnLadderPlan {
  rungs: DrawnRung[];
  /** estimated seconds of all rungs taken */
  seconds: number;
  marginM: number;
  /** why the case is not run (null when it is) */
  reason: string | null;
  /** the rung added when the planned ones leave the figure unconverged (null: it does not fit; `addedReason` says why) */
  added?: DrawnRung | null;
  /** why no rung can be added (null with `added`), with the --drawn-time that would let it */
  addedReason?: string | null;
}

/** Choose the drawn case's rungs (see file comment). `featureM`: the smallest drawn feature. */
export function drawnLadderPlan(input: VerifyInput, realized: CaseSpec, drawn: CaseSpec, featureM: number, limits: { bytes?: number; seconds?: number; unknowns?: number } = {}): DrawnLadderPlan {
  const nb = Math.sqrt(input.background.eps * input.background.mu);
  const lambdaB = C0 / (input.frequencyHz * nb);
  const marginM = input.marginM ?? lambdaB / 4;
  const resolution = input.resolution ?? ladderStart(input.accuracy ?? DEFAULT_ACCURACY);
  const bytesLimit = limits.bytes ?? input.solverBytes ?? DEFAULT_SOLVER_BYTES;
  const secondsLimit = limits.seconds ?? MAX_DRAWN_SECONDS;
  const unknownsLimit = limits.unknowns ?? MAX_DRAWN_UNKNOWNS;
  const gridAt = (stepsAcross: number, scale = 1): FdfdGrid => ladderGrids({
    polarization: input.polarization, background: input.background, frequencyHz: input.frequencyHz, deviceBox: input.deviceBox, groundYM: input.groundYM,
    resolution, accuracy: input.accuracy ?? DEFAULT_ACCURACY, marginM, maxStepM: (featureM * scale) / stepsAcross, caseIndexHints: [realized.indexHint, drawn.indexHint],
  }).makeGrid(resolution);
  const cost = (g: FdfdGrid): { bytes: number; seconds: number } => {
    const c = solveCost(g);
    return { bytes: c.megabytes * 1e6, seconds: 2 * solveSeconds(c.work, c.unknowns) };
  };
  const rungs: DrawnRung[] = [];
  let seconds = 0;
  let stop = "";
  for (const stepsAcross of DRAWN_STEPS) {
    const grid = gridAt(stepsAcross);
    const c = cost(grid);
    const over = c.bytes > bytesLimit ? `memory (about ${formatBytes(c.bytes)}, limit ${formatBytes(bytesLimit)})`
      : grid.nx * grid.ny > unknownsLimit ? `size (${(grid.nx * grid.ny / 1e6).toPrecision(2)} million nodes, the check solves at most ${(unknownsLimit / 1e6).toPrecision(2)} million on its own)`
      : seconds + c.seconds > secondsLimit ? `time (about ${formatDuration(seconds + c.seconds)} in all, the check spends at most ${formatDuration(secondsLimit)} on the drawn case; --drawn-time sets it)`
      : null;
    if (over !== null) { stop = `${stepsAcross} steps across it: ${grid.nx} × ${grid.ny} nodes, over the ${over}`; break; }
    rungs.push({ stepsAcross, grid, resolution, bytes: c.bytes, seconds: c.seconds });
    seconds += c.seconds;
  }
  if (rungs.length >= DRAWN_MIN_RUNGS) {
    if (rungs.length < DRAWN_STEPS.length) return { rungs, seconds, marginM, reason: null, added: null, addedReason: null };
    // the rung added should the figure not converge on these (see DRAWN_ADDED_STEPS)
    const grid = gridAt(DRAWN_ADDED_STEPS);
    const c = cost(grid);
    const nodes = grid.nx * grid.ny;
    const what = `a fourth drawn grid (${DRAWN_ADDED_STEPS} steps across the smallest feature, ${grid.nx} × ${grid.ny} nodes, about ${formatBytes(c.bytes)} and ${formatDuration(c.seconds)})`;
    const addedReason = c.bytes > bytesLimit ? `${what} is over the solver's memory (limit ${formatBytes(bytesLimit)})`
      : nodes > MAX_DRAWN_ADDED_UNKNOWNS ? `${what} is over the ${(MAX_DRAWN_ADDED_UNKNOWNS / 1e6).toPrecision(2)} million nodes the check adds on its own`
      : seconds + c.seconds > secondsLimit ? `${what} would take the drawn case to about ${formatDuration(seconds + c.seconds)}, over its ${formatDuration(secondsLimit)}: give --drawn-time '${Math.ceil((seconds + c.seconds) / 60)} min' to let the ladder go on`
      : null;
    return { rungs, seconds, marginM, reason: null, added: addedReason === null ? { stepsAcross: DRAWN_ADDED_STEPS, grid, resolution, bytes: c.bytes, seconds: c.seconds } : null, addedReason };
  }
  // how much larger the features would have to be for the two coarsest rungs to fit
  const fits = (scale: number): boolean => {
    let s = 0;
    for (const k of DRAWN_STEPS.slice(0, DRAWN_MIN_RUNGS)) {
      const g = gridAt(k, scale), c = cost(g);
      s += c.seconds;
      if (c.bytes > bytesLimit || g.nx * g.ny > unknownsLimit || s > secondsLimit) return false;
    }
    return true;
  };
  let scale = 1;
  for (let k = 0; k < 80 && !fits(scale); k++) scale *= 1.1;
  const hint = fits(scale) ? `it would fit with every feature about ${scale.toPrecision(2)} times larger (a pitch ${scale.toPrecision(2)} times coarser), a smaller device or a smaller --margin` : "no feature size makes it fit";
  return {
    rungs, seconds, marginM,
    reason: `drawing the inclusions (smallest feature ${formatLength(featureM)}) needs a ladder of at least ${DRAWN_MIN_RUNGS} grids from ${DRAWN_STEPS[0]} steps across the smallest feature; at ${stop}; ${hint}`,
  };
}
