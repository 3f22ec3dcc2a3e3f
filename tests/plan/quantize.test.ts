import { describe, it, expect } from "vitest";
import fc from "fast-check";
import { expectClose } from "../helpers/close.js";
import { quantizeTargets, isConstant } from "../../src/plan/quantize/quantizeTargets.js";
import { quantizeMany } from "../../src/plan/quantize/quantizeMany.js";
import { minimaxCentre, relErr } from "../../src/plan/quantize/relativeError.js";

describe("minimaxCentre", () => {
  it("is the harmonic mean of the ends for positive ranges, equalizing the end errors", () => {
    // derivation: (c − lo)/lo = (hi − c)/hi ⇒ c = 2·lo·hi/(lo + hi); error (hi − lo)/(hi + lo)
    expectClose(minimaxCentre(1, 3), 1.5, { rel: 1e-12 });
    expectClose(relErr(1.5, 1), 0.5, { rel: 1e-12 });
    expectClose(relErr(1.5, 3), 0.5, { rel: 1e-12 });
  });
  it("returns the value itself for a one-point range", () => {
    expect(minimaxCentre(2.5, 2.5)).toBe(2.5);
  });
});

describe("quantizeTargets, one varying component (ckmeans)", () => {
  const values = Float64Array.from({ length: 400 }, (_, k) => 1 + (9 * k) / 399); // 1 … 10
  const ones = new Float64Array(400).fill(1);

  it("numbers levels in increasing order of the target and meets the goal with few levels", () => {
    const q = quantizeTargets([values, ones, ones], { maxLevels: null, goal: 0.05, cap: 64 });
    expect(q.dimensions).toBe(1);
    expect(q.maxError).toBeLessThanOrEqual(0.05);
    for (let l = 1; l < q.centres.length; l++) expect(q.centres[l][0]).toBeGreaterThan(q.centres[l - 1][0]);
    // a geometric covering of [1, 10] with relative half-width e needs ln(10)/ln((1+e)/(1−e)) ≈ 57.6
    // intervals at e = 0.02; at e = 0.05, ln(10)/ln(1.05/0.95) = 23.0 (derived from the minimax
    // error (hi − lo)/(hi + lo)); ckmeans is not minimax-optimal, so it may use more, up to the cap
    expect(q.centres.length).toBeGreaterThanOrEqual(23);
    expect(q.centres.length).toBeLessThanOrEqual(64);
  });

  it("respects the level limit and reports each cell's error against its level", () => {
    const q = quantizeTargets([values, ones, ones], { maxLevels: 5, goal: 0.001, cap: 64 });
    expect(q.centres.length).toBe(5);
    for (let c = 0; c < values.length; c += 37) {
      expectClose(q.error[c], relErr(q.centres[q.level[c]][0], values[c]), { rel: 1e-12, abs: 1e-15 });
    }
  });

  it("treats rounding noise as a constant component", () => {
    const noisy = Float64Array.from({ length: 10 }, (_, k) => 2.9387755102040813 + (k % 2) * 4e-16);
    expect(isConstant(noisy)).toBe(true);
    expect(isConstant(Float64Array.from([1, 1.001]))).toBe(false);
  });

  it("gives one level when every cell has the same target", () => {
    const q = quantizeTargets([ones, ones, ones], { maxLevels: 8, goal: 0.01, cap: 64 });
    expect(q.centres.length).toBe(1);
    expect(q.maxError).toBe(0);
  });
});

describe("quantizeMany (greedy splitting, 2–3 components)", () => {
  it("never exceeds the level limit, and its error never grows with more levels", () => {
    fc.assert(
      fc.property(
        fc.array(fc.tuple(fc.double({ min: 1, max: 20, noNaN: true }), fc.double({ min: 0.05, max: 5, noNaN: true })), { minLength: 2, maxLength: 300 }),
        fc.integer({ min: 1, max: 12 }),
        (pts, k) => {
          const a = Float64Array.from(pts.map((p) => p[0]));
          const b = Float64Array.from(pts.map((p) => p[1]));
          const q1 = quantizeMany([a, b], k, 0);
          const q2 = quantizeMany([a, b], k + 1, 0);
          expect(q1.centres.length).toBeLessThanOrEqual(k);
          expect(q2.maxError).toBeLessThanOrEqual(q1.maxError + 1e-12);
          for (let c = 0; c < a.length; c++) {
            const lv = q1.centres[q1.level[c]];
            const e = Math.max(relErr(lv[0], a[c]), relErr(lv[1], b[c]));
            expect(Math.abs(e - q1.error[c])).toBeLessThanOrEqual(1e-12);
          }
        },
      ),
      { seed: 42, numRuns: 200 },
    );
  });

  it("stops as soon as every cell is within the goal", () => {
    const a = Float64Array.from({ length: 200 }, (_, k) => 1 + k / 50);
    const b = Float64Array.from({ length: 200 }, (_, k) => 3 - k / 150);
    const q = quantizeMany([a, b], 64, 0.05);
    expect(q.maxError).toBeLessThanOrEqual(0.05);
    expect(q.centres.length).toBeLessThan(64);
  });
});
