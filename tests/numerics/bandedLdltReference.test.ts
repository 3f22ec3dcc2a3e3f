import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { factorSymBanded, newSymBandMatrix, solveSymFactored, symIndex } from "../helpers/bandedLdlt.js";
import { expectClose } from "../helpers/close.js";
import { denseSolve } from "../helpers/denseComplexSolve.js";

const N = 14, W = 3;
/** A banded, diagonally weighted complex matrix (so elimination without pivoting is stable), complex symmetric (A = Aᵀ). */
const bandedEntries = fc.array(fc.double({ min: -1, max: 1, noNaN: true }), { minLength: 2 * N * (2 * W + 1) + 2 * N, maxLength: 2 * N * (2 * W + 1) + 2 * N });

function build(vals: number[]): { re: number[][]; im: number[][]; b: [number[], number[]] } {
  const re = Array.from({ length: N }, () => new Array(N).fill(0)), im = Array.from({ length: N }, () => new Array(N).fill(0));
  let q = 0;
  for (let r = 0; r < N; r++) {
    for (let c = Math.max(0, r - W); c <= Math.min(N - 1, r + W); c++) {
      const vr = vals[q++], vi = vals[q++];
      if (c < r) continue;
      re[r][c] = vr; im[r][c] = vi;
      re[c][r] = vr; im[c][r] = vi;
    }
    re[r][r] += 6; // keep it away from singular; the imaginary parts keep it indefinite-complex
  }
  const b: [number[], number[]] = [vals.slice(q, q + N), vals.slice(q + N, q + 2 * N)];
  return { re, im, b };
}

describe("banded LDLᵀ (the test reference for the sparse solver)", () => {
  it("symmetric LDLᵀ matches a dense pivoted solve on complex symmetric matrices", () => {
    fc.assert(fc.property(bandedEntries, (vals) => {
      const { re, im, b } = build(vals);
      const m = newSymBandMatrix(N, W);
      for (let r = 0; r < N; r++) for (let c = Math.max(0, r - W); c <= r; c++) { m.re[symIndex(m, r, c)] = re[r][c]; m.im[symIndex(m, r, c)] = im[r][c]; }
      expect(factorSymBanded(m).ok).toBe(true);
      const xr = Float64Array.from(b[0]), xi = Float64Array.from(b[1]);
      solveSymFactored(m, xr, xi);
      const [er, ei] = denseSolve(re, im, b[0], b[1]);
      expectClose(xr, er, { abs: 1e-11, rel: 1e-10, label: "re" });
      expectClose(xi, ei, { abs: 1e-11, rel: 1e-10, label: "im" });
    }), { seed: 42, numRuns: 200 });
  });

  it("reports a zero pivot instead of dividing by it", () => {
    const m = newSymBandMatrix(3, 1);
    m.re[symIndex(m, 1, 1)] = 1; m.re[symIndex(m, 2, 2)] = 1; // (0,0) = 0
    const r = factorSymBanded(m);
    expect(r.ok).toBe(false);
    expect(r.badRow).toBe(0);
  });

  it("1 × 1 system", () => {
    const m = newSymBandMatrix(1, 0);
    m.re[0] = 0; m.im[0] = 2;
    factorSymBanded(m);
    const xr = Float64Array.of(4), xi = Float64Array.of(0);
    solveSymFactored(m, xr, xi);
    expectClose([xr[0], xi[0]], [0, -2], { abs: 1e-15, label: "4 / 2i" });
  });
});
