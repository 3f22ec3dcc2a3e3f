import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { ProgrammerError } from "../../src/core/errors.js";
import { gridOrdering } from "../../src/numerics/gridNestedDissection.js";
import { partialLdlt } from "../../src/numerics/multifrontalLdlt.js";
import { solveGridSystem } from "../../src/numerics/sparseLdltSolve.js";
import { checkSymmetricMatrix, multiplySymmetric, type SparseSymmetricMatrix } from "../../src/numerics/sparseSymmetricMatrix.js";
import { factorSymBanded, newSymBandMatrix, solveSymFactored, symIndex } from "../helpers/bandedLdlt.js";
import { expectClose } from "../helpers/close.js";
import { denseSolve } from "../helpers/denseComplexSolve.js";


/** A random complex symmetric nine-point matrix on an nx × ny grid (values from `next`), diagonal shifted by `shift`. */
function gridMatrix(nx: number, ny: number, next: () => number, shift: number): { a: SparseSymmetricMatrix; re: number[][]; im: number[][] } {
  const n = nx * ny;
  const re = Array.from({ length: n }, () => new Array<number>(n).fill(0)), im = Array.from({ length: n }, () => new Array<number>(n).fill(0));
  for (let v = 0; v < n; v++) {
    const i = v % nx, j = (v - i) / nx;
    for (let dj = -1; dj <= 1; dj++) for (let di = -1; di <= 1; di++) {
      const a = i + di, b = j + dj;
      if (a < 0 || b < 0 || a >= nx || b >= ny) continue;
      const u = a + nx * b;
      if (u > v) continue;
      const x = next(), y = next();
      re[v][u] = re[u][v] = x + (u === v ? shift : 0);
      im[v][u] = im[u][v] = y;
    }
  }
  const colPtr = new Int32Array(n + 1), rows: number[] = [], vr: number[] = [], vi: number[] = [];
  for (let v = 0; v < n; v++) {
    colPtr[v] = rows.length;
    for (let u = 0; u < n; u++) if (re[u][v] !== 0 || im[u][v] !== 0 || u === v) { rows.push(u); vr.push(re[u][v]); vi.push(im[u][v]); }
  }
  colPtr[n] = rows.length;
  return { a: { n, colPtr, rowIdx: Int32Array.from(rows), re: Float64Array.from(vr), im: Float64Array.from(vi) }, re, im };
}

const SEED = { seed: 20261202, numRuns: 40 };
const sizes = fc.record({ nx: fc.integer({ min: 1, max: 13 }), ny: fc.integer({ min: 1, max: 13 }), vals: fc.array(fc.double({ min: -1, max: 1, noNaN: true }), { minLength: 64, maxLength: 64 }) });
/** deterministic value stream cycling through the drawn values with a twist, so large grids get many distinct values */
const stream = (vals: number[]): (() => number) => { let k = 0; return () => { const v = vals[k % vals.length] * Math.cos(1 + k * 0.37); k++; return v; }; };

describe("sparse complex symmetric LDLᵀ on a grid (nested dissection, multifrontal)", () => {
  it("matches a dense pivoted solve on random complex symmetric nine-point grid systems (fast-check, fixed seed)", () => {
    fc.assert(fc.property(sizes, ({ nx, ny, vals }) => {
      const next = stream(vals);
      const { a, re, im } = gridMatrix(nx, ny, next, 6);
      const n = nx * ny;
      const bRe = Array.from({ length: n }, () => next()), bIm = Array.from({ length: n }, () => next());
      const r = solveGridSystem(a, nx, ny, Float64Array.from(bRe), Float64Array.from(bIm));
      expect(r.ok).toBe(true);
      if (!r.ok) return;
      const [er, ei] = denseSolve(re, im, bRe, bIm);
      expectClose(r.re, er, { rel: 1e-10, abs: 1e-12, label: `re ${nx}×${ny}` });
      expectClose(r.im, ei, { rel: 1e-10, abs: 1e-12, label: `im ${nx}×${ny}` });
      expect(r.residual).toBeLessThan(1e-13);
    }), SEED);
  });

  it("matches the banded LDLᵀ reference on a 30 × 23 grid with an indefinite complex diagonal (as a PML operator has)", () => {
    let s = 12345;
    const next = (): number => { s = (s * 1103515245 + 12345) % 2 ** 31; return s / 2 ** 31 - 0.5; };
    const nx = 30, ny = 23, n = nx * ny;
    const { a } = gridMatrix(nx, ny, next, 0.3); // diagonal barely shifted: far from dominant
    for (let v = 0; v < n; v++) for (let e = a.colPtr[v]; e < a.colPtr[v + 1]; e++) if (a.rowIdx[e] === v) a.im[e] += 0.4;
    const bRe = new Float64Array(n).map(() => next()), bIm = new Float64Array(n).map(() => next());
    const r = solveGridSystem(a, nx, ny, bRe, bIm);
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    // banded reference, unknowns in natural order (half-bandwidth nx + 1)
    const m = newSymBandMatrix(n, nx + 1);
    for (let v = 0; v < n; v++) for (let e = a.colPtr[v]; e < a.colPtr[v + 1]; e++) {
      const u = a.rowIdx[e];
      if (u < v) continue;
      m.re[symIndex(m, u, v)] = a.re[e]; m.im[symIndex(m, u, v)] = a.im[e];
    }
    expect(factorSymBanded(m).ok).toBe(true);
    const xr = bRe.slice(), xi = bIm.slice();
    solveSymFactored(m, xr, xi);
    expectClose(r.re, xr, { rel: 1e-8, abs: 1e-10, label: "re vs banded" });
    expectClose(r.im, xi, { rel: 1e-8, abs: 1e-10, label: "im vs banded" });
    // the residual is computed, not assumed: recompute it here
    const yr = new Float64Array(n), yi = new Float64Array(n);
    multiplySymmetric(a, r.re, r.im, yr, yi);
    let num = 0, den = 0;
    for (let v = 0; v < n; v++) { num += (yr[v] - bRe[v]) ** 2 + (yi[v] - bIm[v]) ** 2; den += bRe[v] ** 2 + bIm[v] ** 2; }
    expectClose(r.residual, Math.sqrt(num / den), { rel: 1e-6, abs: 1e-18, label: "reported residual" });
    expect(r.residual).toBeLessThan(1e-12);
  });

  it("a zero pivot is a numerical non-answer (ok: false, the unknown named), not a throw", () => {
    // the 2 × 2 grid block [[0, 0], [0, 1]] on a 2 × 1 grid: unknown 0 has no diagonal
    const a: SparseSymmetricMatrix = { n: 2, colPtr: Int32Array.from([0, 1, 2]), rowIdx: Int32Array.from([0, 1]), re: Float64Array.from([0, 1]), im: Float64Array.from([0, 0]) };
    const r = solveGridSystem(a, 2, 1, Float64Array.from([1, 1]), Float64Array.from([0, 0]));
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.badUnknown).toBe(0);
    expect(r.reason).toMatch(/zero pivot/);
    // and the dense kernel reports the local index
    expect(partialLdlt(Float64Array.from([1, 1, 0, 1]), new Float64Array(4), 2, 2, 1e-14)).toBe(1);
  });

  it("leaves its inputs unchanged and handles 1 × 1, 1 × n and n × 1 grids", () => {
    for (const [nx, ny] of [[1, 1], [1, 20], [20, 1]]) {
      let k = 0;
      const { a } = gridMatrix(nx, ny, () => Math.sin(++k), 4);
      const bRe = new Float64Array(nx * ny).fill(1), bIm = new Float64Array(nx * ny);
      const copy = a.re.slice();
      const r = solveGridSystem(a, nx, ny, bRe, bIm);
      expect(r.ok && r.residual < 1e-14).toBe(true);
      expect(Array.from(a.re)).toEqual(Array.from(copy));
      expect(Array.from(bRe)).toEqual(new Array(nx * ny).fill(1));
    }
  });

  it("refuses malformed input with a ProgrammerError naming the problem", () => {
    let k = 0;
    const { a } = gridMatrix(3, 3, () => Math.sin(++k), 4);
    const b = new Float64Array(9);
    expect(() => solveGridSystem(a, 3, 3, new Float64Array(8), b)).toThrow(/right-hand side of length/);
    expect(() => solveGridSystem(a, 9, 1, b, b)).toThrow(/nine-point/);
    const nan = { ...a, re: a.re.slice() };
    nan.re[3] = Number.NaN;
    expect(() => solveGridSystem(nan, 3, 3, b, b)).toThrow(ProgrammerError);
    const bad = b.slice(); bad[4] = Infinity;
    expect(() => solveGridSystem(a, 3, 3, bad, b)).toThrow(/not finite at unknown 4/);
    expect(() => solveGridSystem(a, 4, 4, b, b)).toThrow(/grid 4 × 4/);
  });

  it("checkSymmetricMatrix accepts a symmetric grid matrix and names an asymmetric entry", () => {
    let k = 0;
    const { a } = gridMatrix(4, 3, () => Math.sin(++k), 4);
    expect(() => checkSymmetricMatrix(a)).not.toThrow();
    const b = { ...a, im: a.im.slice() };
    b.im[1] += 1e-9; // column 0's second entry (row 1): now A[1][0] ≠ A[0][1]
    expect(() => checkSymmetricMatrix(b)).toThrow(/differs/);
  });

  it("the ordering's symbolic sizes are what the factorization uses (no hidden growth)", () => {
    const o = gridOrdering(57, 31);
    expect(o.factorPtr[o.fronts]).toBe(o.cost.factorEntries);
  });
});
