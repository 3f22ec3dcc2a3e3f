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
  it("median of large arrays (bucketed, no copy) equals the sorted definition, any sign, ties and gaps (property)", () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 17000, max: 40000 }), fc.integer({ min: 0, max: 2 ** 30 }), fc.constantFrom("spread", "narrow", "ties", "signs"),
        (n, seed, kind) => {
          let s = seed;
          const rnd = (): number => ((s = (s * 1103515245 + 12345) % 2147483648) / 2147483648);
          const xs = new Float64Array(n);
          for (let c = 0; c < n; c++) {
            const u = rnd();
            xs[c] = kind === "spread" ? 10 ** (12 * u - 9)
              : kind === "narrow" ? 0.0042 + 1e-9 * u // one bucket holds them all
              : kind === "ties" ? Math.floor(u * 5) * 0.001
              : (u - 0.5) * 10 ** Math.floor(rnd() * 6 - 3);
            if (rnd() < 0.01) xs[c] = [NaN, Infinity, -Infinity][c % 3];
          }
          const f = Array.from(xs).filter(Number.isFinite).sort((p, q) => p - q);
          const want = f.length % 2 ? f[(f.length - 1) >> 1] : 0.5 * (f[f.length / 2 - 1] + f[f.length / 2]);
          const copy = xs.slice();
          expect(finiteMedian(xs)).toBe(want);
          expect(xs).toEqual(copy); // the input is left as it was
        },
      ),
      { seed: 8, numRuns: 60 },
    );
  });
});
