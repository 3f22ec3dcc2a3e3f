import fc from "fast-check";
import { describe, expect, it } from "vitest";
import type { Complex } from "../../../src/core/complex.js";
import { wienerBounds, hashinShtrikmanBounds } from "../../../src/media/bounds.js";
import { bruggemanForward } from "../../../src/media/mixing/bruggeman.js";
import { bruggeman2d } from "../../../src/media/mixing/bruggeman2d.js";
import { bruggeman3d } from "../../../src/media/mixing/bruggeman3d.js";
import { expectClose } from "../../helpers/close.js";

const c = (re: number, im = 0): Complex => ({ re, im });

/** Residual of the Bruggeman equation f(ε_i − ε)/(ε_i + (d−1)ε) + (1 − f)(ε_h − ε)/(ε_h + (d−1)ε). */
function residual(h: Complex, i: Complex, f: number, e: Complex, d: number): number {
  const term = (p: Complex, w: number) => {
    const num = { re: p.re - e.re, im: p.im - e.im };
    const den = { re: p.re + (d - 1) * e.re, im: p.im + (d - 1) * e.im };
    const m = den.re * den.re + den.im * den.im;
    return { re: (w * (num.re * den.re + num.im * den.im)) / m, im: (w * (num.im * den.re - num.re * den.im)) / m };
  };
  const a = term(i, f);
  const b = term(h, 1 - f);
  return Math.hypot(a.re + b.re, a.im + b.im);
}

describe("Bruggeman (symmetric)", () => {
  it("solves its defining equation (Bruggeman, Ann. Phys. 416, 636 (1935)) for passive complex phases", () => {
    const phase = fc.record({ re: fc.double({ min: -30, max: 60, noNaN: true }), im: fc.double({ min: 0.01, max: 10, noNaN: true }) });
    fc.assert(
      fc.property(phase, phase, fc.double({ min: 0.01, max: 0.99, noNaN: true }), fc.constantFrom(2 as const, 3 as const), (h, i, f, d) => {
        const e = bruggemanForward(h, i, f, d);
        expect(residual(h, i, f, e, d)).toBeLessThan(1e-9);
        expect(e.im).toBeGreaterThanOrEqual(-1e-12 * Math.hypot(e.re, e.im)); // physical root: Im ε ≥ 0
      }),
      { seed: 42, numRuns: 200 },
    );
  });

  it("lies inside the Wiener bounds (and the Hashin–Shtrikman bounds) for real positive phases", () => {
    fc.assert(
      fc.property(fc.double({ min: 1, max: 100, noNaN: true }), fc.double({ min: 1, max: 100, noNaN: true }), fc.double({ min: 0, max: 1, noNaN: true }), fc.constantFrom(2 as const, 3 as const), (h, i, f, d) => {
        const e = bruggemanForward(c(h), c(i), f, d).re;
        const [wl, wu] = wienerBounds(h, i, f);
        const [hl, hu] = hashinShtrikmanBounds(h, i, f, d);
        const tol = 1e-12 * Math.max(h, i);
        expect(e).toBeGreaterThanOrEqual(wl - tol);
        expect(e).toBeLessThanOrEqual(wu + tol);
        expect(e).toBeGreaterThanOrEqual(hl - tol);
        expect(e).toBeLessThanOrEqual(hu + tol);
      }),
      { seed: 42, numRuns: 200 },
    );
  });

  it("2D at f = 1/2 gives sqrt(ε1 ε2) (Keller–Dykhne), also for complex phases", () => {
    fc.assert(
      fc.property(fc.double({ min: 0.5, max: 100, noNaN: true }), fc.double({ min: 0.5, max: 100, noNaN: true }), (a, b) => {
        expectClose(bruggeman2d.forward(c(a), c(b), 0.5).re, Math.sqrt(a * b), { rel: 1e-12 });
      }),
      { seed: 42, numRuns: 200 },
    );
    // complex: sqrt((2+i)(10+3i)) = sqrt(17+16i) on the Im ≥ 0 branch
    const e = bruggeman2d.forward(c(2, 1), c(10, 3), 0.5);
    const m = Math.hypot(17, 16);
    expectClose([e.re, e.im], [Math.sqrt((m + 17) / 2), Math.sqrt((m - 17) / 2)], { rel: 1e-12, label: "sqrt(17+16i)" });
  });

  // Percolation: with an insulating host (ε_h → 0) the Bruggeman equation gives
  // ε = ε_i (d f − 1)/(d − 1) above f = 1/d and 0 below (solved from the quadratic with ε_h = 0;
  // thresholds 1/3 in 3D and 1/2 in 2D as in references.md, Bruggeman 1935).
  it("a conducting phase percolates at f = 1/3 (3D) and f = 1/2 (2D)", () => {
    const host = c(1e-9);
    const metal = c(1, 1e6); // a good conductor: ε'' huge
    for (const [rule, d] of [[bruggeman3d, 3], [bruggeman2d, 2]] as const) {
      const threshold = 1 / d;
      const below = rule.forward(host, metal, threshold - 0.05);
      const above = rule.forward(host, metal, threshold + 0.05);
      expect(Math.hypot(below.re, below.im), `${rule.id} below`).toBeLessThan(1e-3);
      const expected = (1e6 * (d * (threshold + 0.05) - 1)) / (d - 1);
      expectClose(above.im, expected, { rel: 1e-6, label: `${rule.id} above` });
    }
  });

  it("lossless metal in a dielectric: the root has Im ε ≥ 0 (Bruggeman predicts absorption)", () => {
    const e = bruggeman3d.forward(c(2), c(-10), 0.3);
    expect(e.im).toBeGreaterThan(0);
    expect(residual(c(2), c(-10), 0.3, e, 3)).toBeLessThan(1e-12);
  });
});
