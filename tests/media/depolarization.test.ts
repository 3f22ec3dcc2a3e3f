import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { ProgrammerError } from "../../src/core/errors.js";
import { ellipsoidDepolarization, spheroidAspectForDepolarization, spheroidDepolarization } from "../../src/media/depolarization.js";
import { expectClose } from "../helpers/close.js";

describe("depolarization factors", () => {
  it("sphere: 1/3 each (Osborn 1945)", () => {
    expectClose(spheroidDepolarization(1).axis, 1 / 3, { rel: 1e-15 });
    expectClose(ellipsoidDepolarization(2, 2, 2), [1 / 3, 1 / 3, 1 / 3], { rel: 1e-12 });
  });

  it("prolate spheroids m = 2, 5, 10: N_axis ≈ 0.1736, 0.0558, 0.0203 (Osborn 1945 / Stoner 1945 — from memory, 4 digits)", () => {
    expectClose(spheroidDepolarization(2).axis, 0.1736, { abs: 6e-5, label: "m=2" });
    expectClose(spheroidDepolarization(5).axis, 0.0558, { abs: 6e-5, label: "m=5" });
    expectClose(spheroidDepolarization(10).axis, 0.0203, { abs: 6e-5, label: "m=10" });
  });

  it("oblate spheroid m = 1/2 (e = sqrt(3)): N_axis = (1 + e²)/e³ (e − arctan e) = (4/3)(1 − π/(3√3)) (Osborn 1945, evaluated by hand)", () => {
    const e = Math.sqrt(3);
    expectClose(spheroidDepolarization(0.5).axis, (4 / 3) * (1 - Math.PI / (3 * e)), { rel: 1e-14 });
  });

  it("limits: needle {0, 1/2}, disk {1, 0}; continuous through m = 1 (series branch)", () => {
    expect(spheroidDepolarization(Infinity)).toEqual({ axis: 0, transverse: 0.5 });
    expect(spheroidDepolarization(0)).toEqual({ axis: 1, transverse: 0 });
    // just either side of the series/closed-form switch the two forms agree
    for (const m of [1 / Math.sqrt(1 - 0.0999 ** 2), 1 / Math.sqrt(1 - 0.1001 ** 2), 1 / Math.sqrt(1 + 0.0999 ** 2), 1 / Math.sqrt(1 + 0.1001 ** 2)]) {
      const [nx] = ellipsoidDepolarization(m, 1, 1);
      expectClose(spheroidDepolarization(m).axis, nx, { rel: 1e-11, label: `m=${m}` });
    }
    expect(() => spheroidDepolarization(-1)).toThrow(ProgrammerError);
    expect(() => spheroidDepolarization(NaN)).toThrow(ProgrammerError);
  });

  it("the numerical ellipsoid integral matches the spheroid closed forms and sums to 1", () => {
    fc.assert(
      fc.property(fc.double({ min: -4, max: 4, noNaN: true }), (logM) => {
        const m = Math.exp(logM);
        const [nx, ny, nz] = ellipsoidDepolarization(m, 1, 1);
        const s = spheroidDepolarization(m);
        expectClose([nx, ny, nz], [s.axis, s.transverse, s.transverse], { rel: 1e-9, abs: 1e-12, label: `m=${m}` });
        expectClose(s.axis + 2 * s.transverse, 1, { abs: 1e-14, label: "spheroid sum" });
      }),
      { seed: 42, numRuns: 100 },
    );
    fc.assert(
      fc.property(fc.double({ min: 0.01, max: 100, noNaN: true }), fc.double({ min: 0.01, max: 100, noNaN: true }), fc.double({ min: 0.01, max: 100, noNaN: true }), (a, b, c) => {
        const n = ellipsoidDepolarization(a, b, c);
        expectClose(n[0] + n[1] + n[2], 1, { abs: 1e-10, label: "sum" });
        // the longest axis has the smallest factor
        const order = [a, b, c].map((x, k) => [x, n[k]]).sort((p, q) => p[0] - q[0]);
        expect(order[0][1]).toBeGreaterThanOrEqual(order[2][1] - 1e-12);
      }),
      { seed: 42, numRuns: 100 },
    );
  });

  it("general ellipsoids match an mpmath quadrature fixture (tests/media/fixtures/ellipsoidDepolarization.gen.py)", () => {
    expectClose(ellipsoidDepolarization(3, 2, 1), [0.15630069882927098, 0.26715404026200452, 0.5765452609087245], { rel: 1e-10 });
    expectClose(ellipsoidDepolarization(10, 1, 0.5), [0.011528250361845718, 0.3279721167936444, 0.66049963284450989], { rel: 1e-10 });
    expectClose(ellipsoidDepolarization(1, 0.3, 0.05), [0.022974915043733521, 0.13377231328397749, 0.84325277167228899], { rel: 1e-10 });
    // scale invariance and permutation
    expectClose(ellipsoidDepolarization(3e-6, 1e-6, 2e-6), [0.15630069882927098, 0.5765452609087245, 0.26715404026200452], { rel: 1e-10 });
    expect(() => ellipsoidDepolarization(1, 0, 1)).toThrow(ProgrammerError);
  });

  it("the aspect ratio for a depolarization factor inverts spheroidDepolarization", () => {
    for (const m of [0.01, 0.3, 1, 2.5, 40]) {
      expectClose(spheroidAspectForDepolarization(spheroidDepolarization(m).axis), m, { rel: 1e-9, label: `m=${m}` });
    }
    expect(spheroidAspectForDepolarization(0)).toBe(Infinity);
    expect(spheroidAspectForDepolarization(1)).toBe(0);
  });
});
