/**
 * How long a command will take, estimated before the work starts, so a user who asked for a large
 * grid or a fine ladder hears "expect about N s" instead of waiting without a word. Seconds of one
 * core on an idle machine (other work sharing the cores makes it longer); a rough figure, good to
 * a factor of about two, never used to decide anything.
 *
 * The rates come from `npm run bench` (src/bench), measured on the 2-core development machine
 * (Node 20):
 * - plan: the whole plan (field, reduction, levels, matching, all outputs written), CPU time of
 *   the process at 1.05 × 10⁶ cells (bench/plan-bend-1e6.json; the "whole plan" bench), minus the
 *   start-up; the fixed part is start-up, catalogs and matching, which do not grow with the cells.
 *   Refitted in session 6 (the plan had become faster; 3.4 µs overestimated by about 1.5×):
 *   `/usr/bin/time` of three whole processes each, user + system: the bench design 2.98–3.28 s,
 *   demo-designs/plan-printed-bend.json (1537 cells) 0.67–0.73 s, so (3.1 − 0.7) s / 1.05 × 10⁶
 *   ≈ 2.3 µs a cell. An expression transform adds the expression library's load (0.7–2 s).
 * - verify: one solve on an FDFD grid = the sparse factorization (its operation count, `work` of
 *   verify/assemble.ts `solveCost`; 1.8 s per 10⁹, fitted to the CPU seconds of the solver bench
 *   at 400² and 700² nodes: 1.9 s at 0.63 × 10⁹ work, 8.4 s at 3.4 × 10⁹) + a cost per grid node
 *   for everything else one case on one grid does (assembly, sampling the scene from the map, the
 *   solve and its residual, the far field): 13 µs, refitted in session 4 (the code had become
 *   faster: the old 22 µs overestimated by 1.4–1.7×) from `verify --method fdfd --resolution 24`
 *   and `48` of demo-designs/field-radial-cloak.json (3 cases on 209² and 377² nodes: 0.82 s and
 *   2.5 s of CPU per solve, start-up removed: 15 and 11 µs per node besides the factorization) and
 *   `--resolution 33` of plan-microwave-mast-cloak.json (4 cases on 295² nodes: 12 µs).
 * - radial: one case of the exact radial solver (verify/radialSolver.ts) = orders × a cost per order
 *   that grows with the device's electrical size x = k R (more RK4 steps per order to follow the
 *   oscillation): RADIAL_SECONDS_PER_ORDER × orders × (1 + x/20), fitted (session 6) to the CPU
 *   seconds of the ideal and reduced cloak shells of demo-designs/field-radial-cloak.json and
 *   plan-microwave-mast-cloak.json at 0.5, 1, 2 and 4 times their design frequencies (x = 4.9 … 43,
 *   22 … 67 orders: 0.24 … 2.1 s; the model gives 0.25 … 1.8 s). Shells without a singular edge
 *   (a concentrator) cost about a tenth of that, so the figure is an upper bound for them; a
 *   case without shells (the bare conductor: Bessel functions only) costs ~1 ms.
 * Pure.
 */

/** CPU seconds per device cell of a whole `plan`. */
export const PLAN_SECONDS_PER_CELL = 2.3e-6;
/** CPU seconds of a `plan` that do not grow with the cells (start-up, catalogs, matching). */
export const PLAN_SECONDS_FIXED = 0.6;
/** CPU seconds per complex operation of the sparse factorization. */
export const SOLVER_SECONDS_PER_OPERATION = 1.8e-9;
/** CPU seconds per grid node of one verify solve, besides the factorization. */
export const SOLVER_SECONDS_PER_NODE = 1.3e-5;
/** CPU seconds per angular order of one radial case through a cloak's shell (at x ≪ 20; see radialSeconds). */
export const RADIAL_SECONDS_PER_ORDER = 9e-3;
/** Estimates above this many seconds are said to the user. */
export const WARN_ABOVE_SECONDS = 10;

/** Estimated seconds of a whole `plan` of `cells` device cells. */
export function planSeconds(cells: number): number {
  return PLAN_SECONDS_FIXED + cells * PLAN_SECONDS_PER_CELL;
}

/** Estimated seconds of one verify solve on a grid of `unknowns` nodes whose factorization costs `work` complex operations. */
export function solveSeconds(work: number, unknowns: number): number {
  return work * SOLVER_SECONDS_PER_OPERATION + unknowns * SOLVER_SECONDS_PER_NODE;
}

/**
 * Estimated CPU seconds of one radial case: `orders` angular orders for a device of electrical size
 * x = k R, with shells to integrate through or none (a bare conductor: Bessel functions only).
 */
export function radialSeconds(orders: number, x: number, shells: boolean): number {
  return shells ? RADIAL_SECONDS_PER_ORDER * orders * (1 + x / 20) : 1e-3;
}

/** "40 s", "3 min", "1.5 h": rounded to what a person plans around. */
export function formatDuration(seconds: number): string {
  if (seconds < 20) return `${Math.max(1, Math.round(seconds))} s`;
  if (seconds < 90) return `${5 * Math.round(seconds / 5)} s`;
  if (seconds < 5400) return `${Math.round(seconds / 60)} min`;
  return `${Number((seconds / 3600).toPrecision(2))} h`;
}

/**
 * The warning for an estimate, or null when it is at most WARN_ABOVE_SECONDS (or not a finite
 * positive figure): "expect about 40 s for <what> (one core; rates measured by npm run bench)".
 */
export function expectedTimeWarning(seconds: number, what: string): string | null {
  if (!(seconds > WARN_ABOVE_SECONDS) || !Number.isFinite(seconds)) return null;
  return `expect about ${formatDuration(seconds)} for ${what} (estimate for one idle core, from the rates npm run bench measures)`;
}
