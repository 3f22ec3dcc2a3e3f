/**
 * writeNumber (plan/outputs/numberBytes.ts) writes exactly the bytes of fmt (csvText.ts, built
 * on toPrecision) — an identity, checked on random doubles across magnitudes, rounding ties and
 * the edges of fixed and exponential notation.
 */
import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { fmt } from "../../../src/plan/outputs/csvText.js";
import { writeNumber } from "../../../src/plan/outputs/numberBytes.js";

const buf = new Uint8Array(64);
const written = (x: number, digits: number): string => {
  const end = writeNumber(buf, 0, x, digits);
  return String.fromCharCode(...buf.subarray(0, end));
};

describe("writeNumber gives fmt's bytes", () => {
  it("edge cases: zero, non-finite, ties, powers of ten, notation boundaries, tiny and huge", () => {
    const cases = [
      0, -0, NaN, Infinity, -Infinity, 1, -1, 0.5, 2.5, 1.25, 0.125, 999999.5, 9999995, 99999.95, 0.1, 0.2, 0.3,
      1e-6, 9.999995e-7, 1e-7, 1.5e-7, 123456, 1234567, 999999, 1e6, 1e21, 1e22, 1e23, 1e-22, 1e-23, 1e-300, 5e-324, 1.7976931348623157e308,
      0.000123456789, 12.3456789, 3.14159265358979, 100, 1000.5, 45, 0.0458, 2.8, 1e-5 * 3,
    ];
    for (const digits of [1, 2, 3, 4, 6, 8]) {
      for (const x of cases) for (const v of [x, -x]) expect(written(v, digits), `${v} at ${digits}`).toBe(fmt(v, digits));
    }
  });

  it("random doubles of every magnitude (4 and 6 digits)", () => {
    fc.assert(
      fc.property(fc.double({ noNaN: true }), fc.constantFrom(4, 6), (x, digits) => written(x, digits) === fmt(x, digits)),
      { seed: 42, numRuns: 20000 },
    );
  });

  it("values near ties and digit boundaries (short decimals and their neighbours)", () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 99999999 }), fc.integer({ min: -12, max: 8 }), fc.integer({ min: -2, max: 2 }), fc.constantFrom(4, 6), (m, ex, ulps, digits) => {
        let x = m * 10 ** ex;
        for (let u = 0; u < Math.abs(ulps); u++) x = ulps > 0 ? nextUp(x) : nextDown(x);
        return written(x, digits) === fmt(x, digits);
      }),
      { seed: 42, numRuns: 20000 },
    );
  });
});

function nextUp(x: number): number {
  const f = new Float64Array([x]), b = new BigInt64Array(f.buffer);
  b[0] += 1n;
  return f[0];
}
function nextDown(x: number): number {
  const f = new Float64Array([x]), b = new BigInt64Array(f.buffer);
  b[0] -= 1n;
  return f[0];
}
