import { describe, it, expect } from "vitest";
import fc from "fast-check";
import { fmt } from "../../../src/plan/outputs/csvText.js";
import { precisionReference } from "../../helpers/precisionReference.js";

/** `fmt` leaves non-finite values empty and writes zero as "0"; otherwise the shared definition. */
function reference(x: number, digits: number): string {
  if (!Number.isFinite(x)) return "";
  if (x === 0) return "0";
  return precisionReference(x, digits);
}

describe("fmt", () => {
  it("gives toPrecision's text, trimmed, for any double and 1–10 digits (property)", () => {
    fc.assert(
      fc.property(fc.double(), fc.integer({ min: 1, max: 10 }), (x, d) => {
        expect(fmt(x, d), `${x} @ ${d}`).toBe(reference(x, d));
      }),
      { seed: 11, numRuns: 30000 },
    );
    // the ranges a build list holds, where the fast path runs
    fc.assert(
      fc.property(fc.double({ min: 1e-9, max: 1e9, noNaN: true }), fc.constantFrom(4, 6, 8), fc.boolean(), (x, d, neg) => {
        const v = neg ? -x : x;
        expect(fmt(v, d), `${v} @ ${d}`).toBe(reference(v, d));
      }),
      { seed: 12, numRuns: 100000 },
    );
  });
  it("handles ties, powers of ten and the notation switch as toPrecision does", () => {
    const cases = [0.5, 1.5, 2.5, 0.125, 1.0000005, 9.9999995, 9.999996, 99999.95, 1e-7, 1.5e-7, 1e-6, 123456, 1234567, 1e21, 1e-300, 5e-324, 0.30000000000000004, -2.675, 1 / 3];
    for (const x of cases) for (const d of [1, 3, 4, 6, 8]) expect(fmt(x, d), `${x} @ ${d}`).toBe(reference(x, d));
    expect(fmt(0.123456789)).toBe("0.123457");
    expect(fmt(1.5e-7)).toBe("1.5e-7");
    expect(fmt(NaN)).toBe("");
    expect(fmt(-0)).toBe("0");
  });
});
