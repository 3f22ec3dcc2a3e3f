/**
 * Richardson extrapolation and its uncertainty (src/verify/richardson.ts): the grid convergence
 * index with Fs = 1.25 only where the observed order confirms the scheme's (Roache, J. Fluids
 * Eng. 116, 405 (1994)), Fs = 3 and the order capped at the nominal elsewhere (Roache, J. Fluids
 * Eng. 133, 115501 (2011); Oberkampf & Roy 2010, ch. 8). Manufactured ladders Q(h) = Q∞ + error
 * terms, where Q∞ is known by construction.
 */
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { NOMINAL_ORDER, richardson } from "../../src/verify/richardson.js";

const ladder = (h: number[], f: (h: number) => number): number[] => h.map(f);
const H = [0.1, 0.1 / 1.4375, 0.1 / 1.4375 ** 2];

describe("Richardson extrapolation with the grid convergence index", () => {
  it("a pure second-order ladder: exact limit, order 2, Fs = 1.25", () => {
    const q = ladder(H, (h) => 3 + 7 * h * h);
    const x = richardson(H, q);
    expect(x.how).toBe("three-grid");
    expect(x.order!).toBeCloseTo(2, 6);
    expect(x.value).toBeCloseTo(3, 10);
    // Fs·|Q∞ − Q3| with Fs = 1.25
    expect(x.uncertainty!).toBeCloseTo(1.25 * 7 * H[2] * H[2], 10);
  });

  it("a first-order ladder is not in the second-order scheme's asymptotic range: order 1 kept, Fs = 3", () => {
    const q = ladder(H, (h) => 1 + 0.5 * h);
    const x = richardson(H, q);
    expect(x.order!).toBeCloseTo(1, 6);
    expect(x.value).toBeCloseTo(1, 10);
    expect(x.uncertainty!).toBeCloseTo(3 * 0.5 * H[2], 10);
  });

  it("an observed order above the nominal is not believed: extrapolated with the nominal, Fs = 3", () => {
    const q = ladder(H, (h) => 2 + 40 * h ** 3);
    const x = richardson(H, q);
    expect(x.order).toBe(NOMINAL_ORDER);
    const d = (q[2] - q[1]) / (1.4375 ** 2 - 1);
    expect(x.value).toBeCloseTo(q[2] + d, 12);
    expect(x.uncertainty!).toBeCloseTo(3 * Math.abs(d), 12);
    expect(Math.abs(x.value - 2)).toBeLessThan(x.uncertainty!);
  });

  it("a coarse ladder with an apparent order far above the nominal is not trusted (the reduced Ez cloak at 9.8 GHz)", () => {
    // Ladder of this project's grid solver, demo-designs/field-radial-cloak.json at 9.8 GHz,
    // `--scheme unit-mu --accuracy 10% --method fdfd` (8, 11, 16 points per wavelength): σ/σ_bare
    // of the reduced cloak. The exact radial solver (src/verify/radialSolver.ts, itself checked
    // against the series in tests/verify/radialSolver.test.ts) gives 0.2655.
    const hs = [2.2943e-3, 1.6686e-3, 1.1472e-3];
    const qs = [0.55351, 0.39985, 0.36278];
    const exact = 0.2655;
    const x = richardson(hs, qs);
    expect(x.order).toBe(NOMINAL_ORDER); // the observed order is about 3.9
    expect(Math.abs(x.value - exact)).toBeLessThan(x.uncertainty!);
    expect(x.uncertainty! / x.value).toBeGreaterThan(0.1); // so it is not called converged at 10 %
    // the former rule (Fs = 1.25 at the observed order) read about 0.351 ± 0.015: "converged", six widths off
    const pObs = Math.log((qs[0] - qs[1]) / (qs[1] - qs[2])) / Math.log(hs[0] / hs[1]);
    const dOld = (qs[2] - qs[1]) / ((hs[1] / hs[2]) ** pObs - 1);
    expect(Math.abs(qs[2] + dOld - exact)).toBeGreaterThan(5 * 1.25 * Math.abs(dOld));
  });

  it("a pre-asymptotic ladder whose order falls (0.8 underneath a second-order term) is covered", () => {
    // The reduced Ez cloak at its design frequency, 9.4 GHz, finest three rungs of 8…33 points per
    // wavelength: 0.3667, 0.3319, 0.3121 against 0.2562 by the radial solver (observed order 1.55).
    const x = richardson([1.196e-3, 8.32e-4, 5.799e-4], [0.3667, 0.3319, 0.3121]);
    expect(x.order!).toBeGreaterThan(1.4);
    expect(x.order!).toBeLessThan(1.7);
    expect(Math.abs(x.value - 0.2562)).toBeLessThan(x.uncertainty!);
    // and manufactured ladders of the same kind: Q∞ + a h^0.8 (h in units of the coarsest) + b h²
    fc.assert(fc.property(fc.double({ min: 0.2, max: 1.2, noNaN: true }), fc.double({ min: 1, max: 4, noNaN: true }), (a, b) => {
      const u = [1, 1 / 1.4375, 1 / 1.4375 ** 2];
      const y = ladder(u, (h) => 5 + a * h ** 0.8 + b * h * h);
      const r = richardson(u, y);
      if (r.how !== "three-grid") return; // an unresolvable order falls back to the nominal-order rule (tested below)
      expect(Math.abs(r.value - 5)).toBeLessThanOrEqual(r.uncertainty!);
    }), { seed: 7, numRuns: 200 });
  });

  it("oscillating values: no extrapolation, the spread is the uncertainty", () => {
    const x = richardson(H, [1.0, 1.2, 1.1]);
    expect(x.how).toBe("oscillating");
    expect(x.value).toBe(1.1);
    expect(x.uncertainty!).toBeCloseTo(0.2, 12);
  });

  it("two grids: the nominal order and Fs = 3; one grid: no estimate", () => {
    const q = ladder(H.slice(0, 2), (h) => 3 + 7 * h * h);
    const x = richardson(H.slice(0, 2), q);
    expect(x.how).toBe("nominal-order");
    expect(x.value).toBeCloseTo(3, 10);
    expect(x.uncertainty!).toBeCloseTo(3 * 7 * H[1] * H[1], 10);
    expect(richardson([0.1], [4]).uncertainty).toBeNull();
  });
});
