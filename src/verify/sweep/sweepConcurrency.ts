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
import { deviceCases } from "../deviceCases.js";
import { DEFAULT_ACCURACY, ladderGrids, ladderPeakBytes, ladderSeconds } from "../ladderGrids.js";
import { planAtFrequency } from "./recipeAtFrequency.js";
import { SWEEP_CASES, type SweepContext } from "./sweepPoint.js";

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

/**
 * What one frequency's check costs, before anything is solved: peak memory of its wanted rungs and
 * with the rungs the ladder may add, the finest wanted grid's nodes, and the estimated CPU seconds
 * (ladderSeconds: `seconds` for the wanted rungs, `secondsAtMost` with the added ones).
 */
export function sweepPeakBytes(ctx: SweepContext, frequencyHz: number): { wantedBytes: number; withAddedBytes: number; nodes: number; seconds: number; secondsAtMost: number } {
  const plan = ctx.plan ? planAtFrequency(ctx.plan, ctx.catalog, frequencyHz) : null;
  const built = deviceCases({ transform: ctx.transform, fieldBackground: ctx.fieldBackground, background: ctx.background, polarization: ctx.polarization, grid: ctx.grid, ideal: ctx.ideal, reduced: ctx.reduced, plan, freeSpace: ctx.freeSpace });
  const cases = built.cases.filter((c) => SWEEP_CASES.includes(c.name) && c.scene);
  const nb = Math.sqrt(ctx.background.eps * ctx.background.mu);
  const lambdaB = C0 / frequencyHz / nb;
  const l = ladderGrids({
    polarization: ctx.polarization, background: ctx.background, frequencyHz, deviceBox: built.deviceBox, caseIndexHints: cases.map((c) => c.indexHint),
    resolution: ctx.resolution, accuracy: ctx.accuracy ?? DEFAULT_ACCURACY, marginM: ctx.marginM ?? lambdaB / 2, groundYM: built.ground?.groundYM,
  });
  const finest = l.makeGrid(l.wanted[l.wanted.length - 1]);
  const time = ladderSeconds(l, cases.length);
  return { wantedBytes: ladderPeakBytes(l, false), withAddedBytes: ladderPeakBytes(l, true), nodes: finest.nx * finest.ny, seconds: time.planned, secondsAtMost: time.atMost };
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
