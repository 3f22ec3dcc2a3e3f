/** Small symmetric eigen solvers: closed form (block-diagonal branch) and cyclic Jacobi (full branch). */
import { describe, it, expect } from "vitest";
import fc from "fast-check";
import { expectClose } from "../helpers/close.js";
import { sym2Eigenvalues, sym2MajorAngle, sym3Eigen } from "../../src/core/eigen.js";

/** A v for packed symmetric A */
function apply(t: number[], v: number[]): number[] {
  const [xx, yy, zz, xy, xz, yz] = t;
  return [xx * v[0] + xy * v[1] + xz * v[2], xy * v[0] + yy * v[1] + yz * v[2], xz * v[0] + yz * v[1] + zz * v[2]];
}

function checkPairs(t: number[], vals: Float64Array, vecs: Float64Array, tol: number): void {
  for (let k = 0; k < 3; k++) {
    const v = [vecs[k], vecs[3 + k], vecs[6 + k]];
    expectClose(Math.hypot(...v), 1, { rel: 1e-12, label: `|v${k}|` });
    expectClose(apply(t, v), v.map((x) => vals[k] * x), { abs: tol, label: `A v${k} = λ v${k}` });
  }
}

describe("sym2Eigenvalues / sym2MajorAngle", () => {
  it("diag(2, 1) → [1, 2] (identity: eigenvalues of a diagonal matrix)", () => {
    expect(Array.from(sym2Eigenvalues(new Float64Array(2), 2, 0, 1))).toEqual([1, 2]);
  });
  it("[[2, 1], [1, 2]] → [1, 3], major axis at 45° (closed form of a 2×2 symmetric matrix)", () => {
    expectClose(Array.from(sym2Eigenvalues(new Float64Array(2), 2, 1, 2)), [1, 3], { rel: 1e-15, label: "values" });
    expectClose(sym2MajorAngle(2, 1, 2), Math.PI / 4, { rel: 1e-15, label: "angle" });
  });
});

describe("sym3Eigen, block-diagonal branch (xz = yz = 0)", () => {
  it("rotated in-plane pair plus zz: values and vectors", () => {
    // R diag(1, 4) Rᵀ with R a rotation by 30°, zz = 2.5 (identity: a similarity keeps eigenvalues)
    const c = Math.cos(Math.PI / 6), s = Math.sin(Math.PI / 6);
    const t = [1 * c * c + 4 * s * s, 1 * s * s + 4 * c * c, 2.5, (1 - 4) * c * s, 0, 0];
    const vals = new Float64Array(3), vecs = new Float64Array(9);
    sym3Eigen(vals, t, vecs);
    expectClose(Array.from(vals), [1, 2.5, 4], { rel: 1e-14, label: "values" });
    checkPairs(t, vals, vecs, 1e-14);
    // the axis of value 1 is the rotated x axis (c, s, 0) up to sign
    expectClose(Math.abs(vecs[0] * c + vecs[3] * s), 1, { rel: 1e-14, label: "axis" });
  });
  it("zz smallest and largest orderings", () => {
    const v = new Float64Array(3);
    expect(Array.from(sym3Eigen(v, [3, 5, 1, 0, 0, 0]))).toEqual([1, 3, 5]);
    expect(Array.from(sym3Eigen(v, [3, 5, 9, 0, 0, 0]))).toEqual([3, 5, 9]);
  });
});

describe("sym3Eigen, Jacobi branch", () => {
  it("tridiagonal [[2,1,0],[1,2,1],[0,1,2]] → 2 − √2, 2, 2 + √2", () => {
    // eigenvalues of the tridiagonal Toeplitz matrix tridiag(b, a, b): a + 2b cos(kπ/(n+1)), k = 1..n
    // (standard closed form, e.g. G. D. Smith, "Numerical Solution of Partial Differential
    // Equations", Oxford 1985)
    const t = [2, 2, 2, 1, 0, 1];
    const vals = new Float64Array(3), vecs = new Float64Array(9);
    sym3Eigen(vals, t, vecs);
    expectClose(Array.from(vals), [2 - Math.SQRT2, 2, 2 + Math.SQRT2], { rel: 1e-13, label: "values" });
    checkPairs(t, vals, vecs, 1e-13);
  });
  it("all-ones matrix → 0, 0, 3 (rank one: u uᵀ with |u|² = 3)", () => {
    const vals = sym3Eigen(new Float64Array(3), [1, 1, 1, 1, 1, 1]);
    expectClose(Array.from(vals), [0, 0, 3], { abs: 1e-14, label: "values" });
  });
  it("random symmetric matrices: A v = λ v, orthonormal vectors, trace and determinant kept", () => {
    fc.assert(
      fc.property(fc.array(fc.double({ min: -10, max: 10, noNaN: true }), { minLength: 6, maxLength: 6 }), (t) => {
        fc.pre(t[4] !== 0 || t[5] !== 0);
        const vals = new Float64Array(3), vecs = new Float64Array(9);
        sym3Eigen(vals, t, vecs);
        expect(vals[0]).toBeLessThanOrEqual(vals[1]);
        expect(vals[1]).toBeLessThanOrEqual(vals[2]);
        const scale = Math.max(1, ...t.map(Math.abs));
        checkPairs(t, vals, vecs, 1e-12 * scale);
        expectClose(vals[0] + vals[1] + vals[2], t[0] + t[1] + t[2], { abs: 1e-12 * scale, label: "trace" });
        for (let p = 0; p < 3; p++) for (let q = p + 1; q < 3; q++) {
          const dot = vecs[p] * vecs[q] + vecs[3 + p] * vecs[3 + q] + vecs[6 + p] * vecs[6 + q];
          expectClose(dot, 0, { abs: 1e-12, label: `v${p}·v${q}` });
        }
      }),
      { seed: 42, numRuns: 200 },
    );
  });
  it("non-finite input gives NaN, not a silent number", () => {
    const vals = sym3Eigen(new Float64Array(3), [NaN, 1, 1, 0.5, 0.1, 0]);
    expect(Array.from(vals).some(Number.isNaN)).toBe(true);
  });
  it("leaves its input unchanged", () => {
    const t = Float64Array.from([2, 2, 2, 1, 0, 1]);
    sym3Eigen(new Float64Array(3), t);
    expect(Array.from(t)).toEqual([2, 2, 2, 1, 0, 1]);
  });
});
