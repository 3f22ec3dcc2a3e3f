import fc from "fast-check";
import { describe, expect, it } from "vitest";
import type { Complex } from "../../../src/core/complex.js";
import { ProgrammerError } from "../../../src/core/errors.js";
import { hashinShtrikmanBounds } from "../../../src/media/bounds.js";
import { mgCylinder } from "../../../src/media/mixing/mgCylinder.js";
import { maxwellGarnettAxis, mgEllipsoid } from "../../../src/media/mixing/mgEllipsoid.js";
import { mgSphere } from "../../../src/media/mixing/mgSphere.js";
import { parallel } from "../../../src/media/mixing/parallel.js";
import { series } from "../../../src/media/mixing/series.js";
import { expectClose } from "../../helpers/close.js";

const c = (re: number, im = 0): Complex => ({ re, im });

describe("Maxwell Garnett", () => {
  it("spheres satisfy (ε − ε_h)/(ε + 2ε_h) = f(ε_i − ε_h)/(ε_i + 2ε_h) (Sihvola 1999, eq. 3.27)", () => {
    // 1 and 4 at f = 1/2: (ε−1)/(ε+2) = 0.5·3/6 = 1/4 → ε = 2 (solved by hand from the formula)
    expectClose(mgSphere.forward(c(1), c(4), 0.5).re, 2, { rel: 1e-14 });
    // complex phases: compare the defining ratio
    const h = c(2, 0.1);
    const i = c(-10, 2);
    const e = mgSphere.forward(h, i, 0.15);
    const lhs = div(sub(e, h), add(e, scale(h, 2)));
    const rhs = scale(div(sub(i, h), add(i, scale(h, 2))), 0.15);
    expectClose([lhs.re, lhs.im], [rhs.re, rhs.im], { abs: 1e-14, label: "MG sphere ratio" });
  });

  it("cylinders across the axis satisfy (ε − ε_h)/(ε + ε_h) = f(ε_i − ε_h)/(ε_i + ε_h) (Sihvola 1999, ch. 4)", () => {
    // 1 and 4 at f = 1/2: (ε−1)/(ε+1) = 0.5·3/5 = 0.3 → ε = 1.3/0.7
    expectClose(mgCylinder.forward(c(1), c(4), 0.5).re, 1.3 / 0.7, { rel: 1e-14 });
  });

  // Milton, "The Theory of Composites" (2002), §23: MG with the lower phase as host is the lower
  // Hashin–Shtrikman bound, with the higher phase as host the upper one.
  it("equals the Hashin–Shtrikman bound of the matching dimension", () => {
    const phase = fc.double({ min: 1, max: 100, noNaN: true });
    fc.assert(
      fc.property(phase, phase, fc.double({ min: 0, max: 1, noNaN: true }), (a, b, f) => {
        const lo = Math.min(a, b);
        const hi = Math.max(a, b);
        const fHi = a <= b ? f : 1 - f; // fraction of the higher phase
        const [l3, u3] = hashinShtrikmanBounds(lo, hi, fHi, 3);
        expectClose(mgSphere.forward(c(lo), c(hi), fHi).re, l3, { rel: 1e-12, label: "3D lower" });
        expectClose(mgSphere.forward(c(hi), c(lo), 1 - fHi).re, u3, { rel: 1e-12, label: "3D upper" });
        const [l2, u2] = hashinShtrikmanBounds(lo, hi, fHi, 2);
        expectClose(mgCylinder.forward(c(lo), c(hi), fHi).re, l2, { rel: 1e-12, label: "2D lower" });
        expectClose(mgCylinder.forward(c(hi), c(lo), 1 - fHi).re, u2, { rel: 1e-12, label: "2D upper" });
      }),
      { seed: 42, numRuns: 200 },
    );
  });

  it("the ellipsoid rule spans the Wiener means: N = 0 is parallel, N = 1 series, N = 1/3 the sphere", () => {
    fc.assert(
      fc.property(fc.double({ min: 1, max: 50, noNaN: true }), fc.double({ min: 1, max: 50, noNaN: true }), fc.double({ min: 0, max: 1, noNaN: true }), (h, i, f) => {
        const tol = { rel: 1e-12, abs: 1e-12 };
        expectClose(maxwellGarnettAxis(c(h), c(i), f, 0).re, parallel.forward(c(h), c(i), f).re, { ...tol, label: "N=0" });
        expectClose(maxwellGarnettAxis(c(h), c(i), f, 1).re, series.forward(c(h), c(i), f).re, { ...tol, label: "N=1" });
        expectClose(mgEllipsoid.forward(c(h), c(i), f, { depolarization: 1 / 3 }).re, mgSphere.forward(c(h), c(i), f).re, { ...tol, label: "N=1/3" });
      }),
      { seed: 42, numRuns: 200 },
    );
  });

  it("mg-ellipsoid without a depolarization factor is a programmer error", () => {
    expect(() => mgEllipsoid.forward(c(1), c(2), 0.1)).toThrow(ProgrammerError);
    expect(() => mgEllipsoid.inverse(c(1), c(2), 1.5, { depolarization: 1.5 })).toThrow(ProgrammerError);
  });

  it("metal inclusions: the closed-form inverse finds the fill on either side of the resonance", () => {
    // lossless Drude-like inclusion ε_i = −10 in ε_h = 2: MG sphere has a pole at
    // ε_h + (1−f)(ε_i − ε_h)/3 = 0 → f = 0.5; the real part is one-to-one in f (a Möbius map)
    const h = c(2);
    const i = c(-10);
    for (const f of [0.1, 0.3, 0.7, 0.9]) {
      const e = mgSphere.forward(h, i, f);
      const inv = mgSphere.inverse(h, i, e.re);
      expect(inv.converged).toBe(true);
      expectClose(inv.fill, f, { abs: 1e-12, label: `fill ${f}` });
    }
  });
});

function add(a: Complex, b: Complex): Complex { return { re: a.re + b.re, im: a.im + b.im }; }
function sub(a: Complex, b: Complex): Complex { return { re: a.re - b.re, im: a.im - b.im }; }
function scale(a: Complex, s: number): Complex { return { re: a.re * s, im: a.im * s }; }
function div(a: Complex, b: Complex): Complex {
  const d = b.re * b.re + b.im * b.im;
  return { re: (a.re * b.re + a.im * b.im) / d, im: (a.im * b.re - a.re * b.im) / d };
}
