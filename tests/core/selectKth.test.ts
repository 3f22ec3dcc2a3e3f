import { describe, it, expect } from "vitest";
import fc from "fast-check";
import { selectKth } from "../../src/core/selectKth.js";
import { finiteMedian } from "../../src/plan/planFigures.js";

describe("selectKth", () => {
  it("gives the k-th entry of the sorted array and partitions around it (property)", () => {
    fc.assert(
      fc.property(fc.array(fc.double({ noNaN: true }), { minLength: 1, maxLength: 300 }), fc.nat(), (xs, pick) => {
        const k = pick % xs.length;
        const a = Float64Array.from(xs);
        const sorted = Float64Array.from(xs).sort();
        expect(Object.is(selectKth(a, k), sorted[k]) || selectKth(a, k) === sorted[k]).toBe(true);
        for (let c = 0; c < k; c++) expect(a[c] <= a[k]).toBe(true);
        for (let c = k + 1; c < a.length; c++) expect(a[c] >= a[k]).toBe(true);
      }),
      { seed: 5, numRuns: 3000 },
    );
  });
  it("handles many equal entries (few distinct values, as quantized errors are)", () => {
    const a = Float64Array.from({ length: 10001 }, (_, c) => c % 3);
    expect(selectKth(a, 5000)).toBe(1);
    expect(selectKth(Float64Array.of(5, 1, 4, 2, 3), 2)).toBe(3);
  });
  it("median of the finite entries equals the sorted definition", () => {
    fc.assert(
      fc.property(fc.array(fc.oneof(fc.double({ min: 0, max: 1, noNaN: true }), fc.constant(NaN)), { maxLength: 200 }), (xs) => {
        const f = xs.filter(Number.isFinite).sort((p, q) => p - q);
        const want = f.length === 0 ? NaN : f.length % 2 ? f[(f.length - 1) >> 1] : 0.5 * (f[f.length / 2 - 1] + f[f.length / 2]);
        expect(Object.is(finiteMedian(Float64Array.from(xs)), want)).toBe(true);
      }),
      { seed: 6, numRuns: 3000 },
    );
  });
});
