import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { mgBruggemanSpread } from "../../src/media/uncertainty.js";
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
