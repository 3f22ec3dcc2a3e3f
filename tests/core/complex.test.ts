/** Complex helpers: identities and the edge cases of the principal square root. */
import { describe, it, expect } from "vitest";
import fc from "fast-check";
import { cSqrt, cMul, cDiv, refractiveIndex, complex } from "../../src/core/complex.js";
import { expectClose } from "../helpers/close.js";

describe("cSqrt", () => {
  it("squares back to its argument (identity), fast-check", () => {
    fc.assert(
      fc.property(fc.double({ min: -1e6, max: 1e6, noNaN: true }), fc.double({ min: -1e6, max: 1e6, noNaN: true }), (re, im) => {
        const r = cSqrt({ re, im });
        const back = cMul(r, r);
        const scale = Math.hypot(re, im) || 1;
        const tol = 1e-12 * scale + 1e-300; // absolute floor: subnormal inputs have no relative precision
        return Math.abs(back.re - re) <= tol && Math.abs(back.im - im) <= tol && r.re >= 0;
      }),
      { seed: 42, numRuns: 500 },
    );
  });
  it("keeps the small imaginary part of a nearly real argument (sqrt(1+iδ) ≈ 1 + iδ/2, Taylor series)", () => {
    const r = cSqrt({ re: 2.05, im: 2.05 * 1e-7 });
    expectClose(r.im, (2.05 * 1e-7) / (2 * Math.sqrt(2.05)), { rel: 1e-12, label: "Im sqrt" });
  });
  it("gives +i·sqrt for a negative real argument and 0 for 0", () => {
    expect(cSqrt(complex(-4))).toEqual({ re: 0, im: 2 });
    expect(cSqrt(complex(0))).toEqual({ re: 0, im: 0 });
  });
});

describe("cDiv and refractiveIndex", () => {
  it("divides back (identity) and picks the passive branch of n (Im n ≥ 0 for exp(-iωt))", () => {
    const a = { re: 3, im: -2 }, b = { re: -1e-300, im: 5 };
    const q = cDiv(cMul(a, b), b);
    expectClose([q.re, q.im], [3, -2], { rel: 1e-14, label: "a·b/b" });
    const n = refractiveIndex({ re: -10, im: 1 });
    expect(n.im).toBeGreaterThan(0);
    expectClose(refractiveIndex(complex(4)).re, 2, { rel: 1e-15 });
  });
});
