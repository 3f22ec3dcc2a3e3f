/**
 * Whether a frequency sweep draws the realized device (`realized-geometry`) at every frequency, and
 * on what time budget, decided before anything is solved. The drawn case keeps its single-frequency
 * rules (drawnLadder.ts): rungs of 2, 3 and 4.5 grid steps across the smallest feature, taken while
 * they fit the solver's memory, the grid-size limit and the time budget, at least two or the case
 * is not run. In a sweep the time budget (--drawn-time, default MAX_DRAWN_SECONDS, the same option
 * and default as the single-frequency check) is for the whole sweep, shared equally by its
 * frequencies: each frequency's ladder is planned against its share. When at any frequency the
 * ladder does not fit (memory or grid size there, or two rungs over the share), the drawn case is
 * swept nowhere and says why with the figures: the estimate of two rungs at every frequency (the
 * --drawn-time that would run it) and what else to change. Never partly swept on a whim: the
 * frequencies where it runs are all of them, so its band and the homogenization error per
 * frequency compare like with like.
 *
 * Cost: one drawnLadderPlan per frequency (grids and their cost estimates; nothing solved) plus the
 * drawn scene built at each frequency (geometryScene.ts). Pure.
 */
import { formatDuration } from "../../core/timeEstimate.js";
import { formatFrequencyPrecise } from "../../core/formatQuantity.js";
import { DRAWN_MIN_RUNGS, DRAWN_STEPS, drawnLadderPlan, MAX_DRAWN_SECONDS } from "../drawnLadder.js";
import type { VerifyInput } from "../verifyDevice.js";
import { sweepBackground, sweepCases, type SweepContext, type SweepDrawn } from "./sweepPoint.js";

export interface SweepDrawnPlan {
  /** the budget every frequency gets, or why the drawn case is not swept */
  drawn: SweepDrawn;
  /** estimated seconds of the drawn case over the whole sweep (0 when not swept) */
  seconds: number;
  /** the largest drawn solve, bytes (0 when not swept) */
  bytes: number;
}

/**
 * Plan the drawn case of a sweep (see file comment). `budgetSeconds`: --drawn-time for the whole
 * sweep (0: not run); `bytesLimit`: the memory one solve may use when alone.
 */
export function sweepDrawnPlan(ctx: SweepContext, frequenciesHz: readonly number[], budgetSeconds = MAX_DRAWN_SECONDS, bytesLimit?: number): SweepDrawnPlan {
  const none = (reason: string): SweepDrawnPlan => ({ drawn: { reason }, seconds: 0, bytes: 0 });
  if (!ctx.plan) return none("the design has no realization");
  if (budgetSeconds <= 0) return none("not run (--drawn-time 0)");
  if (ctx.method === "radial") return none("--method radial: drawn inclusions are not an r-only map; use --method auto or fdfd");
  const share = budgetSeconds / frequenciesHz.length;
  const probe: SweepContext = { ...ctx, drawn: { seconds: share } };
  let needed = 0, seconds = 0, bytes = 0;
  let short: { frequencyHz: number; seconds: number } | null = null;
  for (const f of frequenciesHz) {
    const built = sweepCases(probe, f);
    const drawn = built.cases.find((c) => c.name === "realized-geometry");
    const realized = built.cases.find((c) => c.name === "realized" && c.scene !== null);
    // not drawable (split rings, spheres …): the same reason at every frequency, the geometry does not change
    if (!drawn || drawn.scene === null || !realized) return none(drawn?.reason ?? "the realized (homogenized) case is not computed");
    const input: VerifyInput = {
      polarization: ctx.polarization, background: sweepBackground(ctx, f), frequencyHz: f, deviceBox: built.deviceBox, cases: built.cases,
      illumination: ctx.illumination, resolution: ctx.resolution, accuracy: ctx.accuracy, marginM: ctx.marginM, solverBytes: bytesLimit, groundYM: built.ground?.groundYM,
    };
    const featureM = drawn.featureM ?? drawn.maxStepM! * DRAWN_STEPS[0];
    // without a time limit: memory and grid size alone, and the cost of the two rungs it needs at least
    const open = drawnLadderPlan(input, realized, drawn, featureM, { seconds: Number.MAX_VALUE, bytes: bytesLimit });
    if (open.reason !== null) return none(`not swept: at ${formatFrequencyPrecise(f)}, ${open.reason}`);
    const least = open.rungs.slice(0, DRAWN_MIN_RUNGS).reduce((a, r) => a + r.seconds, 0);
    needed += least;
    const planned = drawnLadderPlan(input, realized, drawn, featureM, { seconds: share, bytes: bytesLimit });
    if (planned.reason !== null) {
      if (!short || least > short.seconds) short = { frequencyHz: f, seconds: least };
      continue;
    }
    seconds += planned.seconds;
    bytes = Math.max(bytes, ...planned.rungs.map((r) => r.bytes));
  }
  if (short) {
    const n = frequenciesHz.length;
    return none(`not swept: its ladder of ${DRAWN_MIN_RUNGS} drawn grids (the drawn structure and the homogenized map on each) needs about ${formatDuration(short.seconds)} at ${formatFrequencyPrecise(short.frequencyHz)} and about ${formatDuration(needed)} over the ${n} frequencies, more than --drawn-time (${formatDuration(budgetSeconds)} for the whole sweep, ${formatDuration(share)} per frequency); give --drawn-time '${needed < 90 ? `${Math.ceil(needed)} s` : `${Math.ceil(needed / 60)} min`}' or more, or fewer frequencies`);
  }
  return { drawn: { seconds: share }, seconds, bytes };
}
