/**
 * sweepTime.ts: the wall-time estimate of a sweep on one thread and on a pool (longest first to
 * the least-loaded worker; any such list schedule ends by Σ/W + (1 − 1/W)·longest: Graham,
 * "Bounds for certain multiprocessing anomalies", Bell Syst. Tech. J. 45, 1563 (1966)), and the
 * choice of one thread for short sweeps.
 */
import { describe, expect, it } from "vitest";
import { chooseSweepThreads, POOL_MIN_SECONDS, sweepWallSeconds, WORKER_START_SECONDS } from "../../../src/verify/sweep/sweepTime.js";

describe("sweepWallSeconds", () => {
  it("one thread: the sum; a pool: start-up plus the longest-first makespan", () => {
    expect(sweepWallSeconds([3, 2, 2, 1], 1)).toBe(8);
    // longest first on 2: 3 → A, 2 → B, 2 → B (4), 1 → A (4): makespan 4 (the best possible)
    expect(sweepWallSeconds([1, 2, 3, 2], 2)).toBe(WORKER_START_SECONDS + 4);
    // more workers than frequencies: the longest one alone
    expect(sweepWallSeconds([5, 1], 8)).toBe(WORKER_START_SECONDS + 5);
    expect(sweepWallSeconds([7], 4)).toBe(7);
  });

  it("between the lower bound max(Σ/W, longest) and Graham's list-scheduling bound Σ/W + (1 − 1/W)·longest on random sweeps", () => {
    let seed = 7;
    const rand = (): number => { seed = (seed * 16807) % 2147483647; return seed / 2147483647; };
    for (let trial = 0; trial < 200; trial++) {
      const w = 2 + Math.floor(rand() * 3);
      const ts = Array.from({ length: 1 + Math.floor(rand() * 20) }, () => 0.1 + 10 * rand());
      const best = Math.max(ts.reduce((a, t) => a + t, 0) / w, ...ts);
      const span = sweepWallSeconds(ts, w) - (ts.length > 1 ? WORKER_START_SECONDS : 0);
      const sum = ts.reduce((a, t) => a + t, 0);
      expect(span).toBeLessThanOrEqual((sum / w + (1 - 1 / w) * Math.max(...ts)) * (1 + 1e-12)); // Graham, Bell Syst. Tech. J. 45, 1563 (1966)
      expect(span).toBeGreaterThanOrEqual(best * (1 - 1e-12));
    }
  });
});

describe("chooseSweepThreads", () => {
  it("a short sweep runs in one thread and says why; a long one on the pool", () => {
    const short = chooseSweepThreads([0.8, 0.8, 0.8, 0.8, 0.8, 0.8, 0.8, 0.8], 2);
    expect(short.workers).toBe(1);
    expect(short.seconds).toBeCloseTo(6.4, 12);
    expect(short.note).toMatch(/one thread: the sweep is short/);
    const long = chooseSweepThreads(Array(8).fill(5), 2);
    expect(long.workers).toBe(2);
    expect(long.seconds).toBeCloseTo(WORKER_START_SECONDS + 20, 12);
    expect(long.note).toBeNull();
  });

  it("the pool must pay: one long frequency among short ones stays on one thread", () => {
    // 20 s in one frequency: two workers finish no sooner than 20 s + start-up
    const r = chooseSweepThreads([20, 0.5, 0.5], 2);
    expect(r.workers).toBe(1);
    expect(chooseSweepThreads([0.45 * POOL_MIN_SECONDS, 0.45 * POOL_MIN_SECONDS], 2).workers).toBe(1);
    expect(chooseSweepThreads([0.55 * POOL_MIN_SECONDS, 0.55 * POOL_MIN_SECONDS], 2).workers).toBe(2);
  });

  it("one allowed thread is one thread, without a note", () => {
    expect(chooseSweepThreads([100, 100], 1)).toEqual({ workers: 1, seconds: 200, note: null });
  });
});
