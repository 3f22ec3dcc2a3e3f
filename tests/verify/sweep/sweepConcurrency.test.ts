/**
 * The sweep's pool size against memory (src/verify/sweep/sweepConcurrency.ts): as many workers as
 * cores and frequencies when everything fits, fewer (with a note saying so) when the budget does not
 * hold them all, a refusal when one frequency alone does not fit; and the per-frequency peak from
 * the ladder's own grids grows with frequency (the grid step follows the wavelength).
 */
import { describe, expect, it } from "vitest";
import { planSweepPool, workerBaselineBytes, WORKER_RUNTIME_BYTES } from "../../../src/verify/sweep/sweepConcurrency.js";
import { DEFAULT_SOLVER_BYTES } from "../../../src/verify/assemble.js";
import { expectClose } from "../../helpers/close.js";

const GB = 1e9;
const peaks = (n: number, wanted: number, added = wanted) => Array.from({ length: n }, (_, k) => ({ frequencyHz: 8e9 + k * 1e8, wantedBytes: wanted, withAddedBytes: added }));

describe("planSweepPool", () => {
  it("cores and frequencies decide when memory is plentiful", () => {
    const p = planSweepPool(peaks(21, 0.3 * GB, 0.8 * GB), 2, 18 * GB, "test budget");
    expect(p).toMatchObject({ workers: 2, note: null });
    if ("workers" in p) expect(p.solverBytes).toBe(Math.min(DEFAULT_SOLVER_BYTES, (18 * GB - WORKER_RUNTIME_BYTES) / 2 - WORKER_RUNTIME_BYTES));
    expect(planSweepPool(peaks(3, 0.3 * GB), 16, 18 * GB, "test budget")).toMatchObject({ workers: 3 });
    expect(planSweepPool(peaks(1, 0.3 * GB), 16, 18 * GB, "test budget")).toMatchObject({ workers: 1 });
  });

  it("fewer workers, said so, when their solves do not fit the budget together", () => {
    // 8 workers × (1.5 GB + baseline) > 6 GB; 3 × 1.56 GB + 0.06 GB = 4.74 GB fits, 4 × 1.56 + 0.06 does not
    const p = planSweepPool(peaks(21, 1.5 * GB), 8, 6 * GB, "test budget");
    expect(p).toMatchObject({ workers: 3 });
    if ("workers" in p) {
      expect(p.note).toMatch(/3 workers instead of 8/);
      expect(p.note).toMatch(/test budget/);
      // every worker's solves are held to its share
      // every worker's solves are held to its share (this thread keeps one more baseline)
      expect(3 * (p.solverBytes + WORKER_RUNTIME_BYTES) + WORKER_RUNTIME_BYTES).toBeLessThanOrEqual(6 * GB * (1 + 1e-12));
    }
  });

  it("keeps the workers the wanted rungs allow; rungs the ladder might add are held to each worker's share", () => {
    const p = planSweepPool(peaks(4, 1 * GB, 2.5 * GB), 4, 6 * GB, "test budget");
    // 4 × (1 GB + baseline) + baseline fits; the 2.5 GB rungs would not, so each solve is capped at its share
    expect(p).toMatchObject({ workers: 4, note: null });
    if ("workers" in p) expectClose(p.solverBytes, (6 * GB - WORKER_RUNTIME_BYTES) / 4 - WORKER_RUNTIME_BYTES, { rel: 1e-12 });
  });

  it("a worker's baseline grows with the design's cells (each worker holds its own copy)", () => {
    expect(workerBaselineBytes(1e6)).toBe(WORKER_RUNTIME_BYTES + 600e6);
    // 2 workers × (1 GB + 0.66 GB) + 0.66 GB fits 4 GB; with a 10⁶-cell design's 0.66 GB baseline 3 do not
    expect(planSweepPool(peaks(5, 1 * GB), 3, 4 * GB, "test budget", workerBaselineBytes(1e6))).toMatchObject({ workers: 2 });
    expect(planSweepPool(peaks(5, 1 * GB), 3, 4 * GB, "test budget", workerBaselineBytes(1e3))).toMatchObject({ workers: 3 });
  });

  it("refuses with the figures when one frequency alone does not fit", () => {
    const p = planSweepPool([...peaks(2, 1 * GB), { frequencyHz: 12e9, wantedBytes: 5 * GB, withAddedBytes: 5 * GB }], 2, 4 * GB, "test budget");
    expect("refusal" in p).toBe(true);
    if ("refusal" in p) {
      expect(p.refusal).toMatch(/12 GHz/);
      expect(p.refusal).toMatch(/5\.0 GB/);
      expect(p.refusal).toMatch(/test budget/);
    }
  });
});
