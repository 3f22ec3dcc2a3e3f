/**
 * How long a frequency sweep will take, and on how many threads to run it, decided before anything
 * is solved from each frequency's estimated cost (sweepConcurrency.ts sweepPeakBytes: the ladder's
 * solves at the rates of core/timeEstimate.ts).
 *
 * - One thread: Σ t_f.
 * - W worker threads: each pays WORKER_START_SECONDS first (loading the modules and warming the hot
 *   loops in a fresh isolate: measured ≈ 1.2 s of CPU per worker on the mast-cloak sweep), then the
 *   frequencies are dealt longest first to the least-loaded worker (Graham's LPT rule, "Bounds on
 *   multiprocessing timing anomalies", SIAM J. Appl. Math. 17, 416 (1969): makespan within
 *   4/3 − 1/(3W) of the best); the wall time is the start plus that makespan.
 * - Workers are used only when the sweep is long enough for them to pay: the one-thread estimate
 *   at least POOL_MIN_SECONDS (ten worker start-ups, so the extra start-up CPU of two workers is
 *   at most a fifth of the work: on a machine whose cores are busy with other work, parallel
 *   threads gain nothing and the start-up is pure loss), and the pool's estimate at least
 *   a quarter shorter than one thread's. Measured (DEVELOPERS.md): a short sweep on two workers was
 *   1.33× slower than one thread.
 * Pure.
 */

/** CPU seconds a worker thread spends before its first frequency (module load, warm-up). */
export const WORKER_START_SECONDS = 1.2;
/** One-thread estimate below which a sweep runs in the command's own thread. */
export const POOL_MIN_SECONDS = 10 * WORKER_START_SECONDS;
/** The pool must be estimated at least this much shorter than one thread (as a fraction). */
export const POOL_MIN_GAIN = 0.25;

/** Estimated wall seconds of the sweep on `workers` threads (1: the command's own thread, no start-up). */
export function sweepWallSeconds(perFrequencySeconds: readonly number[], workers: number): number {
  const total = perFrequencySeconds.reduce((a, t) => a + t, 0);
  if (workers <= 1 || perFrequencySeconds.length <= 1) return total;
  const load = new Float64Array(Math.min(workers, perFrequencySeconds.length));
  for (const t of [...perFrequencySeconds].sort((a, b) => b - a)) {
    let k = 0;
    for (let j = 1; j < load.length; j++) if (load[j] < load[k]) k = j;
    load[k] += t;
  }
  return WORKER_START_SECONDS + Math.max(...load);
}

export interface SweepThreads {
  /** threads to solve on (1: the command's own thread) */
  workers: number;
  /** estimated wall seconds on them (one idle core per thread) */
  seconds: number;
  /** why one thread although more were allowed (null otherwise) */
  note: string | null;
}

/**
 * The threads for a sweep (see file comment): at most `cap` (cores, frequencies and memory allow
 * that many), fewer when the estimate says workers would not pay.
 */
export function chooseSweepThreads(perFrequencySeconds: readonly number[], cap: number): SweepThreads {
  const one = sweepWallSeconds(perFrequencySeconds, 1);
  if (cap <= 1) return { workers: 1, seconds: one, note: null };
  const pooled = sweepWallSeconds(perFrequencySeconds, cap);
  if (one < POOL_MIN_SECONDS || pooled > (1 - POOL_MIN_GAIN) * one) {
    return {
      workers: 1, seconds: one,
      note: `one thread: the sweep is short (about ${Math.max(1, Math.round(one))} s of solving; ${cap} worker threads would each spend about ${WORKER_START_SECONDS} s starting, for an estimated ${Math.max(1, Math.round(pooled))} s)`,
    };
  }
  return { workers: cap, seconds: pooled, note: null };
}
