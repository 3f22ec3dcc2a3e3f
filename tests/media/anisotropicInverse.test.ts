import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { anisotropicInverse, laminateMaxAnisotropy } from "../../src/media/anisotropicInverse.js";
import { spheroidDepolarization } from "../../src/media/depolarization.js";
import { maxwellGarnettAxis } from "../../src/media/mixing/mgEllipsoid.js";
import { expectClose } from "../helpers/close.js";

const c = (re: number) => ({ re, im: 0 });

describe("anisotropic inverse: fill fraction and shape together", () => {
  it("finds the laminate: 1 and 4 at f = 1/2 give [2.5, 1.6] (Wiener 1912, by hand)", () => {
    const r2 = anisotropicInverse(1, 4, [2.5, 1.6], 2);
    expect(r2.feasible).toBe(true);
    expect(r2.shape).toBe("laminate");
    expectClose(r2.fill, 0.5, { abs: 1e-9 });
    expect(r2.depolarization).toEqual([0, 1]);
    const r3 = anisotropicInverse(1, 4, [1.6, 2.5], 3);
    expect(r3.shape).toBe("laminate");
    expect(r3.depolarization).toEqual([1, 0]);
  });

  it("recovers the fill and aspect of aligned spheroids (3D) it was given", () => {
    fc.assert(
      fc.property(fc.double({ min: 0.05, max: 0.6, noNaN: true }), fc.double({ min: -2, max: 2, noNaN: true }), fc.double({ min: 2, max: 20, noNaN: true }), (f, logM, i) => {
        const m = Math.exp(logM);
        fc.pre(Math.abs(logM) > 0.05); // a sphere's two values coincide
        const n = spheroidDepolarization(m);
        const t: [number, number] = [maxwellGarnettAxis(c(1), c(i), f, n.axis).re, maxwellGarnettAxis(c(1), c(i), f, n.transverse).re];
        const r = anisotropicInverse(1, i, t, 3);
        expect(r.feasible).toBe(true);
        expect(r.hostSwapped).toBe(false);
        expectClose(r.fill, f, { rel: 1e-6, label: "fill" });
        expectClose(r.aspect, m, { rel: 1e-5, label: "aspect" });
        expectClose([r.achieved[0].re, r.achieved[1].re], t, { rel: 1e-9, label: "achieved" });
      }),
      { seed: 42, numRuns: 60 },
    );
  });

  it("recovers elliptic cylinders in 2D (N1 + N2 = 1)", () => {
    const f = 0.35;
    const n1 = 0.3; // semi-axis ratio a1/a2 = N2/N1 = 7/3
    const t: [number, number] = [maxwellGarnettAxis(c(2), c(9), f, n1).re, maxwellGarnettAxis(c(2), c(9), f, 1 - n1).re];
    const r = anisotropicInverse(2, 9, t, 2);
    expect(r.shape).toBe("elliptic-cylinder");
    expectClose(r.fill, f, { rel: 1e-8 });
    expectClose(r.depolarization, [n1, 1 - n1], { rel: 1e-7 });
    expectClose(r.aspect, 7 / 3, { rel: 1e-7 });
  });

  it("says when no shape reaches both values", () => {
    // ratio 3.5 is beyond the laminate of 1 and 4 (largest par/ser = 1.5625 at f = 1/2: 2.5/1.6)
    expectClose(laminateMaxAnisotropy(1, 4), 2.5 / 1.6, { rel: 1e-12 });
    const r = anisotropicInverse(1, 4, [3.9, 1.1], 2);
    expect(r.feasible).toBe(false);
    expect(r.fill).toBeNaN();
    expect(r.reason).toMatch(/exceeds the largest anisotropy 1.5625 a laminate of this pair gives/);
    const out = anisotropicInverse(1, 4, [5, 2], 3);
    expect(out.feasible).toBe(false);
    expect(out.reason).toMatch(/outside the range 1–4/);
  });
});
