import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { mgBruggemanSpread } from "../../src/media/uncertainty.js";
import { bruggemanAligned, bruggemanForward } from "../../src/media/mixing/bruggeman.js";
import { expectClose } from "../helpers/close.js";

describe("Maxwell Garnett – Bruggeman spread", () => {
  it("1 and 4 at f = 1/2 (3D): MG 2 (host 1) or 16/7 (host 4) against Bruggeman's root of its quadratic", () => {
    // Bruggeman 3D, 1 and 4 at 1/2: 2ε² − bε − 4 = 0 with b = 0.5(8 − 1) + 0.5(2 − 4) = 2.5 →
    // ε = (2.5 + sqrt(6.25 + 32))/4 = 2.171..., computed here from the quadratic (Bruggeman 1935)
    const br = (2.5 + Math.sqrt(6.25 + 32)) / 4;
    expectClose(mgBruggemanSpread(1, 4, 0.5, 3), Math.abs(2 - br) / br, { rel: 1e-12 });
    expectClose(mgBruggemanSpread(4, 1, 0.5, 3), Math.abs(16 / 7 - br) / br, { rel: 1e-12 });
  });

  it("vanishes at f = 0, f = 1 and for equal phases; grows with contrast at mid fill", () => {
    fc.assert(
      fc.property(fc.double({ min: 1, max: 50, noNaN: true }), fc.double({ min: 1, max: 50, noNaN: true }), fc.constantFrom(2 as const, 3 as const), (h, i, d) => {
        expectClose(mgBruggemanSpread(h, i, 0, d), 0, { abs: 1e-14 });
        expectClose(mgBruggemanSpread(h, i, 1, d), 0, { abs: 1e-14 });
        expectClose(mgBruggemanSpread(h, h, 0.4, d), 0, { abs: 1e-14 });
      }),
      { seed: 42, numRuns: 200 },
    );
    expect(mgBruggemanSpread(1, 10, 0.4, 3)).toBeGreaterThan(mgBruggemanSpread(1, 3, 0.4, 3));
  });
});

describe("aligned-ellipsoid Bruggeman (Polder–van Santen) and its spread", () => {
  it("reduces to the 3D and 2D rules at N = 1/3 and 1/2, and to the laminates at N → 0 and N → 1 (identities)", () => {
    const h = { re: 1, im: 0 }, i = { re: 6, im: 0.3 };
    for (const f of [0.1, 0.4, 0.8]) {
      const a3 = bruggemanAligned(h, i, f, 1 / 3), b3 = bruggemanForward(h, i, f, 3);
      expect(Math.hypot(a3.re - b3.re, a3.im - b3.im)).toBeLessThan(1e-12);
      const a2 = bruggemanAligned(h, i, f, 1 / 2), b2 = bruggemanForward(h, i, f, 2);
      expect(Math.hypot(a2.re - b2.re, a2.im - b2.im)).toBeLessThan(1e-12);
      // N → 0: parallel mean; N → 1: series mean (Wiener 1912); both limits continuous
      const par = bruggemanAligned(h, i, f, 1e-7), ser = bruggemanAligned(h, i, f, 1 - 1e-7);
      expect(Math.abs(par.re - (f * 6 + (1 - f)))).toBeLessThan(1e-4);
      // complex series mean 1/(f/ε_i + (1 − f)/ε_h) with ε_i = 6 + 0.3i
      const invI = { re: 6 / (36 + 0.09), im: -0.3 / (36 + 0.09) };
      const sRe = f * invI.re + (1 - f), sIm = f * invI.im, d = sRe * sRe + sIm * sIm;
      expect(Math.hypot(ser.re - sRe / d, ser.im + sIm / d)).toBeLessThan(1e-4);
    }
  });
  it("mg-ellipsoid's spread uses its own depolarization factor: a needle along the field has none", () => {
    // N → 0: Maxwell Garnett and Bruggeman both give the parallel mean, so the spread vanishes
    expect(mgBruggemanSpread(1, 4, 0.3, 3, 1e-9)).toBeLessThan(1e-6);
    expectClose(mgBruggemanSpread(1, 4, 0.3, 3, 1 / 3), mgBruggemanSpread(1, 4, 0.3, 3), { rel: 1e-12, label: "N = 1/3 is the sphere case" });
  });
});
