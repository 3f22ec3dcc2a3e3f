/**
 * Band Cholesky against identities: L Lᵀ reproduces A, the solve's residual is at rounding level,
 * a dense-equivalent small case matches the hand factorization, and an indefinite matrix is a
 * non-answer naming its row (Golub & Van Loan, "Matrix Computations", 4th ed. (2013), §4.3.5).
 */
import { describe, it, expect } from "vitest";
import fc from "fast-check";
import { expectClose } from "../helpers/close.js";
import { allocBand, addToBand, bandCholesky, bandCholeskySolve, bandResidual, bandMultiply } from "../../src/numerics/bandedCholesky.js";

describe("band Cholesky", () => {
  it("factors [[4, 2], [2, 5]] into [[2, 0], [1, 2]] (hand computation)", () => {
    const f = bandCholesky(2, 1, [0, 4, 2, 5]);
    expect(f.ok).toBe(true);
    expectClose(Array.from(f.factor), [0, 2, 1, 2], { abs: 1e-15 });
  });

  it("solves the 1D Laplacian (tridiagonal 2, −1) exactly: x_i = i(n+1−i)/2 for b = 1", () => {
    // closed form of the discrete Poisson problem −x_{i−1} + 2x_i − x_{i+1} = 1, x_0 = x_{n+1} = 0
    const n = 50, w = 1, band = allocBand(n, w);
    for (let i = 0; i < n; i++) { addToBand(band, w, i, i, 2); if (i > 0) addToBand(band, w, i, i - 1, -1); }
    const b = new Float64Array(n).fill(1);
    const f = bandCholesky(n, w, band);
    const x = bandCholeskySolve(f, b, new Float64Array(n));
    expectClose(Array.from(x), Array.from({ length: n }, (_, i) => ((i + 1) * (n - i)) / 2), { rel: 1e-12, label: "x" });
    // backward stable: residual ≲ n·u·‖A‖‖x‖/‖b‖ ≈ 50 · 1.1e-16 · 4 · 10 (Golub & Van Loan §4.2.6)
    expect(bandResidual(n, w, band, x, b)).toBeLessThan(3e-13);
  });

  it("random SPD band matrices: solve residual ≤ 1e-12, input unchanged, out may alias b", () => {
    fc.assert(fc.property(fc.integer({ min: 1, max: 40 }), fc.integer({ min: 0, max: 6 }), fc.integer({ min: 1, max: 1e6 }), (n, w, seed) => {
      let s = seed;
      const rnd = (): number => { s = (s * 16807) % 2147483647; return s / 2147483647 - 0.5; };
      const band = allocBand(n, w);
      for (let i = 0; i < n; i++) for (let j = Math.max(0, i - w); j < i; j++) addToBand(band, w, i, j, rnd());
      // diagonal dominance makes it SPD
      for (let i = 0; i < n; i++) addToBand(band, w, i, i, 2 * w + 1);
      const copy = Float64Array.from(band);
      const b = Float64Array.from({ length: n }, rnd);
      const f = bandCholesky(n, w, band);
      expect(f.ok).toBe(true);
      const x = bandCholeskySolve(f, b, Float64Array.from(b));
      expect(Array.from(band)).toEqual(Array.from(copy));
      expect(bandResidual(n, w, band, x, b)).toBeLessThan(1e-12);
      const aliased = Float64Array.from(b);
      bandCholeskySolve(f, aliased, aliased);
      expectClose(Array.from(aliased), Array.from(x), { abs: 1e-14 });
      const y = bandMultiply(n, w, band, x, new Float64Array(n));
      expectClose(Array.from(y), Array.from(b), { abs: 1e-12 });
    }), { seed: 11, numRuns: 60 });
  });

  it("an indefinite matrix is a non-answer naming the row", () => {
    const f = bandCholesky(2, 1, [0, 1, 2, 1]); // [[1, 2], [2, 1]] has eigenvalues 3 and −1
    expect(f.ok).toBe(false);
    expect(f.reason).toMatch(/row 1/);
  });
});
