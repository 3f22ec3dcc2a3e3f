/**
 * How many frequencies of a sweep may be solved at once without running out of memory. Each worker
 * holds one check at a time; its peak is the largest solve of its ladder (ladderGrids.ts: the
 * factor, workspace and vectors of the nested-dissection solver, assemble.ts solveCost) plus the
 * worker's own baseline (the design, plan and scenes cloned into it, the runtime). The pool takes
 * as many workers as the cores and the frequencies allow, lowered until every worker's worst
 * frequency fits the memory budget together; each worker's solves are then held to its share, so
 * a ladder that would add rungs beyond it stops instead (verifyDevice's solverBytes). A single
 * frequency whose first rungs do not fit even alone is refused with the figures. Pure.
 */
import { SPEED_OF_LIGHT_M_PER_S as C0 } from "../../core/physicalConstants.js";
import { DEFAULT_SOLVER_BYTES, formatBytes } from "../assemble.js";
import { formatFrequency } from "../formatQuantity.js";
import { deviceCases } from "../deviceCases.js";
import { DEFAULT_ACCURACY, ladderGrids, ladderPeakBytes } from "../ladderGrids.js";
import { planAtFrequency } from "./recipeAtFrequency.js";
import { SWEEP_CASES, type SweepContext } from "./sweepPoint.js";

/**
 * A worker's baseline besides its solves, bytes: the runtime, the modules and the design, field
 * and plan cloned into it. Measured on the mast-cloak demo (1476 cells): a worker holding its
 * context and idle between tasks takes about 90 MB resident; doubled for larger designs (ours).
 */
export const WORKER_BASELINE_BYTES = 180e6;

/** Peak memory of one frequency's check: its wanted rungs, and with the rungs the ladder may add. */
export function sweepPeakBytes(ctx: SweepContext, frequencyHz: number): { wantedBytes: number; withAddedBytes: number; nodes: number } {
  const plan = ctx.plan ? planAtFrequency(ctx.plan, ctx.catalog, frequencyHz) : null;
  const built = deviceCases({ transform: ctx.transform, fieldBackground: ctx.fieldBackground, background: ctx.background, polarization: ctx.polarization, grid: ctx.grid, ideal: ctx.ideal, reduced: ctx.reduced, plan });
  const cases = built.cases.filter((c) => SWEEP_CASES.includes(c.name) && c.scene);
  const nb = Math.sqrt(ctx.background.eps * ctx.background.mu);
  const lambdaB = C0 / frequencyHz / nb;
  const l = ladderGrids({
    polarization: ctx.polarization, background: ctx.background, frequencyHz, deviceBox: built.deviceBox, caseIndexHints: cases.map((c) => c.indexHint),
    resolution: ctx.resolution, accuracy: ctx.accuracy ?? DEFAULT_ACCURACY, marginM: ctx.marginM ?? lambdaB / 2,
  });
  const finest = l.makeGrid(l.wanted[l.wanted.length - 1]);
  return { wantedBytes: ladderPeakBytes(l, false), withAddedBytes: ladderPeakBytes(l, true), nodes: finest.nx * finest.ny };
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
export function planSweepPool(peaks: readonly { frequencyHz: number; wantedBytes: number; withAddedBytes: number }[], cores: number, budgetBytes: number, budgetSource: string): PoolPlan | { refusal: string } {
  const worstWanted = peaks.reduce((a, p) => (p.wantedBytes > a.wantedBytes ? p : a), peaks[0]);
  const worstAdded = Math.max(...peaks.map((p) => p.withAddedBytes));
  const alone = Math.min(budgetBytes, DEFAULT_SOLVER_BYTES + WORKER_BASELINE_BYTES);
  if (worstWanted.wantedBytes + WORKER_BASELINE_BYTES > alone) {
    return { refusal: `at ${formatFrequency(worstWanted.frequencyHz)} one solve of the check needs about ${formatBytes(worstWanted.wantedBytes)}, more than the ${formatBytes(alone - WORKER_BASELINE_BYTES)} it may use (${budgetSource}); sweep a lower band, or give a coarser --resolution or --accuracy, or a smaller --margin` };
  }
  const most = Math.max(1, Math.min(cores, peaks.length));
  let workers = most;
  // fit every worker's wanted rungs; prefer also fitting the rungs the ladder may add
  const fits = (w: number, bytes: number): boolean => w * (bytes + WORKER_BASELINE_BYTES) <= budgetBytes;
  while (workers > 1 && !fits(workers, worstWanted.wantedBytes)) workers--;
  while (workers > 1 && !fits(workers, worstAdded) && fits(workers - 1, worstAdded)) workers--;
  const solverBytes = Math.min(DEFAULT_SOLVER_BYTES, budgetBytes / workers - WORKER_BASELINE_BYTES);
  const note = workers < most
    ? `memory: ${workers} worker${workers > 1 ? "s" : ""} instead of ${most}: one frequency's check needs up to ${formatBytes(Math.max(worstWanted.wantedBytes, Math.min(worstAdded, solverBytes)))} (with a baseline of ${formatBytes(WORKER_BASELINE_BYTES)} per worker), the budget is ${formatBytes(budgetBytes)} (${budgetSource})`
    : null;
  return { workers, solverBytes, note };
}
