/**
 * How many frequencies of a sweep may be solved at once without running out of memory. Each worker
 * holds one check at a time; its peak is the largest solve of its ladder (ladderGrids.ts: the
 * factor, workspace and vectors of the nested-dissection solver, assemble.ts solveCost) plus the
 * worker's own baseline (the design, plan and scenes cloned into it, the runtime; this thread holds
 * one more copy while workers run). The pool takes
 * as many workers as the cores and the frequencies allow, lowered until every worker's worst
 * frequency fits the memory budget together; each worker's solves are then held to its share, so
 * a ladder that would add rungs beyond it stops instead (verifyDevice's solverBytes). A single
 * frequency whose first rungs do not fit even alone is refused with the figures. Pure.
 */
import { SPEED_OF_LIGHT_M_PER_S as C0 } from "../../core/physicalConstants.js";
import { BYTES_PER_CELL } from "../../core/memoryBudget.js";
import { DEFAULT_SOLVER_BYTES, formatBytes } from "../assemble.js";
import { formatFrequency } from "../formatQuantity.js";
import { DRAWN_STEPS, drawnLadderPlan } from "../drawnLadder.js";
import { DEFAULT_ACCURACY, ladderGrids, ladderPeakBytes, ladderSeconds } from "../ladderGrids.js";
import { radialProblemSeconds } from "../radialSolver.js";
import { solverSplit } from "../runCheck.js";
import { sweepBackground, sweepCases, type SweepContext } from "./sweepPoint.js";

/**
 * A worker's baseline besides its solves, bytes: the runtime and modules (WORKER_RUNTIME_BYTES)
 * plus the design's cells, reductions and plan cloned into it, counted with the verify figure of
 * core/memoryBudget.ts (600 bytes per device cell). Measured on the mast-cloak demo (1476 cells,
 * --resolution 6, 6 MB solves): a second worker raised the peak resident size from 125 MB to
 * 165 MB, so the runtime share is about 40 MB; we take 60 MB.
 */
export const WORKER_RUNTIME_BYTES = 60e6;

/** The baseline of one worker for a design of `cells` device cells, bytes. */
export function workerBaselineBytes(cells: number): number {
  return WORKER_RUNTIME_BYTES + BYTES_PER_CELL.verify * cells;
}

/** What one frequency's check costs, estimated before anything is solved (see sweepPeakBytes). */
export interface SweepPointCost {
  /** peak memory of the wanted grid rungs (and of the drawn case's), bytes */
  wantedBytes: number;
  /** the same with the rungs the main ladder may add */
  withAddedBytes: number;
  /** the finest wanted main grid's nodes (0: no grid case) */
  nodes: number;
  /** estimated CPU seconds: the grid cases' wanted rungs, the radial cases and the drawn ladder */
  seconds: number;
  /** the same with every rung the main ladder may add */
  secondsAtMost: number;
  /** the radial cases' share of `seconds` */
  radialSeconds: number;
  /** the drawn case's share of `seconds` (0: not swept) */
  drawnSeconds: number;
  /** the solvers this frequency will use */
  method: "fdfd" | "radial" | "radial+fdfd";
}

/**
 * What one frequency's check costs, before anything is solved, split between the solvers as the
 * check will split it (runCheck.ts solverSplit: `--method`, and for auto the radial solver for every
 * case whose tensors depend on r only): the grid cases' ladder (ladderSeconds, ladderPeakBytes at
 * the rates of core/timeEstimate.ts), the radial cases (radialProblemSeconds), and the drawn case's
 * own ladder when the sweep draws it (ctx.drawn; drawnLadder.ts, its rungs' memory counted in the
 * peak). Throws InputError where the check would (`--method radial` where it does not apply).
 */
export function sweepPeakBytes(ctx: SweepContext, frequencyHz: number): SweepPointCost {
  const built = sweepCases(ctx, frequencyHz);
  const drawnSpec = built.cases.find((c) => c.name === "realized-geometry" && c.scene !== null && c.maxStepM !== undefined);
  const realizedSpec = built.cases.find((c) => c.name === "realized" && c.scene !== null);
  // the check solves the drawn case on its own ladder, apart from the others (runCheck.ts)
  const mainCases = built.cases.map((c) => (c === drawnSpec ? { name: c.name, scene: null, reason: "solved on its own grid", indexHint: 0 } : c));
  const method = ctx.method ?? "auto";
  const split = solverSplit({ method, transform: ctx.transform, illumination: ctx.illumination, groundYM: built.ground?.groundYM, gridOption: ctx.gridOption ?? null, frequencyHz, cases: mainCases });
  const radialSeconds = split.radial.reduce((a, p) => a + (p.problem ? radialProblemSeconds(p.problem) : 0), 0);
  const gridCases = split.gridCases.filter((c) => c.scene !== null);
  const background = sweepBackground(ctx, frequencyHz);
  const nb = Math.sqrt(background.eps * background.mu);
  const lambdaB = C0 / frequencyHz / nb;
  let wantedBytes = 0, withAddedBytes = 0, nodes = 0, planned = 0, atMost = 0;
  if (gridCases.length > 0) {
    const l = ladderGrids({
      polarization: ctx.polarization, background, frequencyHz, deviceBox: built.deviceBox, caseIndexHints: gridCases.map((c) => c.indexHint),
      resolution: ctx.resolution, accuracy: ctx.accuracy ?? DEFAULT_ACCURACY, marginM: ctx.marginM ?? lambdaB / 2, groundYM: built.ground?.groundYM,
    });
    const finest = l.makeGrid(l.wanted[l.wanted.length - 1]);
    const time = ladderSeconds(l, gridCases.length);
    wantedBytes = ladderPeakBytes(l, false); withAddedBytes = ladderPeakBytes(l, true);
    nodes = finest.nx * finest.ny; planned = time.planned; atMost = time.atMost;
  }
  let drawnSeconds = 0;
  const realizedOnMain = gridCases.some((c) => c.name === "realized") || split.radial.some((p) => p.name === "realized" && p.problem !== null);
  if (drawnSpec && realizedSpec && realizedOnMain && method !== "radial" && ctx.drawn && "seconds" in ctx.drawn) {
    const plan = drawnLadderPlan(
      { polarization: ctx.polarization, background, frequencyHz, deviceBox: built.deviceBox, cases: built.cases, illumination: ctx.illumination, resolution: ctx.resolution, accuracy: ctx.accuracy, marginM: ctx.marginM, solverBytes: ctx.solverBytes, groundYM: built.ground?.groundYM },
      realizedSpec, drawnSpec, drawnSpec.featureM ?? drawnSpec.maxStepM! * DRAWN_STEPS[0], { seconds: ctx.drawn.seconds },
    );
    if (plan.reason === null) {
      drawnSeconds = plan.seconds;
      const bytes = Math.max(...plan.rungs.map((r) => r.bytes));
      wantedBytes = Math.max(wantedBytes, bytes); withAddedBytes = Math.max(withAddedBytes, bytes);
    }
  }
  const usesGrid = gridCases.length > 0 || drawnSeconds > 0;
  return {
    wantedBytes, withAddedBytes, nodes,
    seconds: planned + radialSeconds + drawnSeconds, secondsAtMost: atMost + radialSeconds + drawnSeconds, radialSeconds, drawnSeconds,
    method: split.gridOnly !== null ? "fdfd" : usesGrid ? "radial+fdfd" : "radial",
  };
}

export interface PoolPlan {
  workers: number;
  /** memory each solve may use, bytes */
  solverBytes: number;
  /** why fewer workers than cores and frequencies (null when none were dropped) */
  note: string | null;
}

/**
 * The pool for a sweep (see file comment). `peaks` per frequency; `budgetBytes` the machine's
 * budget and `budgetSource` where it comes from (for messages). Returns a refusal message instead
 * when one frequency alone does not fit.
 */
export function planSweepPool(peaks: readonly { frequencyHz: number; wantedBytes: number; withAddedBytes: number }[], cores: number, budgetBytes: number, budgetSource: string, baselineBytes = WORKER_RUNTIME_BYTES): PoolPlan | { refusal: string } {
  const worstWanted = peaks.reduce((a, p) => (p.wantedBytes > a.wantedBytes ? p : a), peaks[0]);
  const worstAdded = Math.max(...peaks.map((p) => p.withAddedBytes));
  const alone = Math.min(budgetBytes, DEFAULT_SOLVER_BYTES + baselineBytes);
  if (worstWanted.wantedBytes + baselineBytes > alone) {
    return { refusal: `at ${formatFrequency(worstWanted.frequencyHz)} one solve of the check needs about ${formatBytes(worstWanted.wantedBytes)} on top of a baseline of ${formatBytes(baselineBytes)}, more than the ${formatBytes(alone)} allowed (${budgetSource}${alone < budgetBytes ? "; the solver's own limit" : ""}); sweep a lower band, or give a coarser --resolution or --accuracy, or a smaller --margin` };
  }
  const most = Math.max(1, Math.min(cores, peaks.length));
  let workers = most;
  // fit every worker's wanted rungs; rungs the ladder would add beyond a worker's share are not solved
  // with workers, this thread holds a copy of the context too
  const own = (w: number): number => (w > 1 ? baselineBytes : 0);
  const fits = (w: number, bytes: number): boolean => w * (bytes + baselineBytes) + own(w) <= budgetBytes;
  while (workers > 1 && !fits(workers, worstWanted.wantedBytes)) workers--;
  const solverBytes = Math.min(DEFAULT_SOLVER_BYTES, (budgetBytes - own(workers)) / workers - baselineBytes);
  const capped = worstAdded > solverBytes ? `; finer rungs the ladder might add (up to ${formatBytes(worstAdded)}) are held to ${formatBytes(solverBytes)} per solve` : "";
  const note = workers < most
    ? `memory: ${workers} worker${workers > 1 ? "s" : ""} instead of ${most}: one frequency's largest solve needs about ${formatBytes(worstWanted.wantedBytes)} plus ${formatBytes(baselineBytes)} per worker, the budget is ${formatBytes(budgetBytes)} (${budgetSource})${capped}`
    : null;
  return { workers, solverBytes, note };
}
