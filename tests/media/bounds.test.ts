import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { boundsCheck, hashinShtrikmanBounds, realBoundsApply, wienerBounds } from "../../src/media/bounds.js";
import { expectClose } from "../helpers/close.js";

describe("Wiener and Hashin–Shtrikman bounds", () => {
  it("Wiener: [series, parallel] (Wiener 1912); 1 and 4 at f = 1/2 → [1.6, 2.5] by hand", () => {
    expectClose(wienerBounds(1, 4, 0.5), [1.6, 2.5], { rel: 1e-15 });
    expectClose(wienerBounds(4, 1, 0.5), [1.6, 2.5], { rel: 1e-15 });
  });

  it("Hashin–Shtrikman for 1 and 4 at f = 1/2: 3D [2, 16/7], 2D [13/7, 28/13] (Hashin, Shtrikman 1962, evaluated by hand)", () => {
    // HS form ε1 + f2/(1/(ε2−ε1) + f1/(d ε1)), lower (d = 3): 1 + 0.5/(1/3 + 0.5/3) = 1 + 0.5/0.5 = 2
    // upper: 4 + 0.5/(1/(1−4) + 0.5/12) = 4 + 0.5/(−1/3 + 1/24) = 4 − 0.5·24/7 = 16/7 ≈ 2.2857
    expectClose(hashinShtrikmanBounds(1, 4, 0.5, 3), [2, 16 / 7], { rel: 1e-14 });
    // 2D: lower 1 + 0.5/(1/3 + 0.5/2) = 1 + 0.5/(7/12) = 13/7; upper 4 + 0.5/(−1/3 + 0.5/8) = 4 − 0.5·48/13 = 28/13
    expectClose(hashinShtrikmanBounds(1, 4, 0.5, 2), [13 / 7, 28 / 13], { rel: 1e-14 });
  });

  it("HS bounds lie inside the Wiener bounds, the 3D pair shifted toward the parallel mean, and close at f = 0, 1", () => {
    fc.assert(
      fc.property(fc.double({ min: 1, max: 100, noNaN: true }), fc.double({ min: 1, max: 100, noNaN: true }), fc.double({ min: 0, max: 1, noNaN: true }), (a, b, f) => {
        const [wl, wu] = wienerBounds(a, b, f);
        const [l2, u2] = hashinShtrikmanBounds(a, b, f, 2);
        const [l3, u3] = hashinShtrikmanBounds(a, b, f, 3);
        const tol = 1e-12 * Math.max(a, b);
        // HS(d) is MG with N = 1/d: a smaller N moves both bounds toward the parallel mean, so
        // wl ≤ l2 ≤ l3 and u2 ≤ u3 ≤ wu, with l_d ≤ u_d
        expect(wl).toBeLessThanOrEqual(l2 + tol);
        expect(l2).toBeLessThanOrEqual(l3 + tol);
        expect(l2).toBeLessThanOrEqual(u2 + tol);
        expect(l3).toBeLessThanOrEqual(u3 + tol);
        expect(u2).toBeLessThanOrEqual(u3 + tol);
        expect(u3).toBeLessThanOrEqual(wu + tol);
      }),
      { seed: 42, numRuns: 200 },
    );
    expectClose(hashinShtrikmanBounds(2, 7, 0, 3), [2, 2], { rel: 1e-15 });
    expectClose(hashinShtrikmanBounds(2, 7, 1, 3), [7, 7], { rel: 1e-15 });
  });

  it("boundsCheck without a fill: reachable exactly between the phase values, names the violated side", () => {
    expect(boundsCheck(2, 10, 5, 3).reachable).toBe(true);
    const above = boundsCheck(2, 10, 12, 3);
    expect(above.reachable).toBe(false);
    expect(above.violated).toEqual({ bound: "phase", side: "upper", value: 10 });
    expect(above.message).toMatch(/above the larger phase value 10/);
    const below = boundsCheck(2, 10, 1.5, 3);
    expect(below.violated).toEqual({ bound: "phase", side: "lower", value: 2 });
  });

  it("boundsCheck at a fill: Wiener for any geometry, Hashin–Shtrikman for isotropic mixtures", () => {
    // 1 and 4 at f = 1/2: Wiener [1.6, 2.5], HS 3D [2, 16/7] (above)
    const anis = boundsCheck(1, 4, 2.4, 3, 0.5, false);
    expect(anis.reachable).toBe(true);
    const iso = boundsCheck(1, 4, 2.4, 3, 0.5);
    expect(iso.reachable).toBe(false);
    expect(iso.violated?.bound).toBe("hashin-shtrikman");
    expect(iso.violated?.side).toBe("upper");
    expectClose(iso.violated?.value ?? NaN, 16 / 7, { rel: 1e-14 });
    const wiener = boundsCheck(1, 4, 1.5, 3, 0.5);
    expect(wiener.violated?.bound).toBe("wiener");
    expect(wiener.violated?.side).toBe("lower");
    expect(wiener.message).toMatch(/below the lower Wiener bound at fill 0.5 1.6/);
  });

  it("boundsCheck does not apply to lossy or negative phases", () => {
    expect(realBoundsApply({ re: 2, im: 0.0001 }, 9)).toBe(true);
    expect(realBoundsApply({ re: -10, im: 1 }, 2)).toBe(false);
    expect(realBoundsApply({ re: 10, im: 5 }, 2)).toBe(false);
    const r = boundsCheck({ re: -10, im: 1 }, 2, 50, 3);
    expect(r.applies).toBe(false);
    expect(r.reachable).toBe(true);
  });
});
