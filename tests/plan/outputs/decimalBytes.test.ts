import { describe, it, expect } from "vitest";
import fc from "fast-check";
import { EVERY_BRANCH, LOG10_2_Q12, NUMBER_ROOM, runEveryBranch, writeDecimal, writeFmt } from "../../../src/plan/outputs/decimalBytes.js";
import { fmt } from "../../../src/plan/outputs/csvText.js";
import { precisionReference } from "../../helpers/precisionReference.js";

const reference = precisionReference;

const buf = new Uint8Array(64);
const view = new DataView(buf.buffer);
const decoder = new TextDecoder();
/** writeDecimal's text at an offset, or null when it declines. */
function written(x: number, digits: number): string | null {
  buf.fill(0x7e);
  const end = writeDecimal(buf, view, 3, x, digits);
  if (end < 0) {
    expect(buf.every((b) => b === 0x7e), `${x} @ ${digits}: declined but wrote`).toBe(true);
    return null;
  }
  expect(buf[2], "nothing written before the offset").toBe(0x7e);
  expect(end - 3, "the text within its room").toBeLessThanOrEqual(NUMBER_ROOM);
  expect(buf.subarray(3 + NUMBER_ROOM).every((b) => b === 0x7e), "nothing written past the room").toBe(true);
  return decoder.decode(buf.subarray(3, end));
}

describe("writeDecimal", () => {
  it("gives toPrecision's trimmed text for any finite non-zero double, or declines (property)", () => {
    let declined = 0, runs = 0;
    fc.assert(
      fc.property(fc.double({ noNaN: true, noDefaultInfinity: true }).filter((x) => x !== 0), fc.integer({ min: 1, max: 8 }), (x, d) => {
        runs++;
        const t = written(x, d);
        if (t === null) { declined++; return; }
        expect(t, `${x} @ ${d}`).toBe(reference(x, d));
      }),
      { seed: 13, numRuns: 30000 },
    );
    expect(declined).toBeLessThan(runs);
  });

  it("takes the fast path for build-list values and matches toPrecision there (property)", () => {
    let declined = 0;
    fc.assert(
      fc.property(fc.double({ min: 1e-9, max: 1e9, noNaN: true }).filter((x) => x !== 0), fc.constantFrom(4, 6), fc.boolean(), (x, d, neg) => {
        const v = neg ? -x : x;
        const t = written(v, d);
        if (t === null) { declined++; return; }
        expect(t, `${v} @ ${d}`).toBe(reference(v, d));
      }),
      { seed: 17, numRuns: 50000 },
    );
    expect(declined).toBeLessThan(50); // only values within 1e-9 of a decimal half-way point
  });

  it("rounds at decimal half-way points, powers of ten and notation switches as toPrecision does", () => {
    const cases: number[] = [1, -1, 10, 100, 1e5, 1e6, 999999.5, 9999995, 0.5, 1.5e-7, 1e-6, 1e-7, 1.23456789e-7,
      123456.5, 1234565, 0.0001234565, 1e19, 9.99999e19, 9.999995e19, 1e-15, 1.0000005, 0.00012345, 999.95, 0.99995,
      2.5, 0.125, 1.0000000000000002, 0.9999999999999999, 99999.95, 9.9999995, 123456, 120000, 1e20 - 1e5, 4.35e-7];
    for (let e = -15; e <= 19; e++) {
      for (const m of [1, 1.5, 1.23456, 9.999995, 9.9999949, 5.5555555, 7.0000005]) {
        cases.push(m * 10 ** e, m / 10 ** -e);
        cases.push(10 ** e * (1 - 2 ** -52), 10 ** e * (1 + 2 ** -52));
      }
    }
    let checked = 0;
    for (const x of cases) {
      for (let d = 1; d <= 6; d++) {
        for (const v of [x, -x]) {
          const t = written(v, d);
          if (t === null) continue;
          checked++;
          expect(t, `${v} @ ${d}`).toBe(reference(v, d));
        }
      }
    }
    expect(checked).toBeGreaterThan(2000);
  });

  it("estimates the decimal exponent from the binary one: (b·1233) >> 12 = ⌊b·log10 2⌋ over 1e-15 … 1e20", () => {
    // binary exponents of 1e-15 (2^-50 …) up to 1e20 (… 2^66); log10 2 from its definition
    for (let b = Math.floor(Math.log2(1e-15)); b <= Math.ceil(Math.log2(1e20)); b++) {
      expect((b * LOG10_2_Q12) >> 12, `b = ${b}`).toBe(Math.floor(b * Math.log10(2)));
    }
  });

  it("declines what it cannot promise: more than 6 digits, tiny and huge magnitudes", () => {
    expect(written(1.5, 7)).toBeNull();
    expect(written(1e-300, 6)).toBeNull();
    expect(written(1e300, 6)).toBeNull();
    expect(written(5e-324, 4)).toBeNull();
  });
});

describe("writeFmt (the build list's number columns)", () => {
  const out = new Uint8Array(64);
  const outView = new DataView(out.buffer);
  const text = (x: number, d: number): string => {
    out.fill(0x7e);
    const end = writeFmt(out, outView, 5, x, d);
    expect(out[4], "nothing written before the offset").toBe(0x7e);
    expect(out.subarray(5 + NUMBER_ROOM).every((b) => b === 0x7e), "nothing written past the room").toBe(true);
    return decoder.decode(out.subarray(5, end));
  };

  it("gives exactly fmt's text for any double, fast path or not (property, every bit pattern class)", () => {
    fc.assert(
      fc.property(fc.oneof(fc.double(), fc.double({ min: -1e7, max: 1e7 }), fc.double({ min: -1, max: 1 })), fc.integer({ min: 1, max: 8 }), (x, d) => {
        expect(text(x, d), `${x} @ ${d}`).toBe(fmt(x, d));
      }),
      { seed: 2026, numRuns: 60000 },
    );
  });

  it("gives fmt's text at the edges: ±0, NaN, ±Infinity, subnormals, 1e-7, 9.9999995, half-way points, huge values", () => {
    const edges = [0, -0, NaN, Infinity, -Infinity, 5e-324, -5e-324, 2.2250738585072014e-308, 1e-7, -1e-7, 1e-6, 9.9999995, 9.99999949,
      0.99999995, 999999.5, 9999995, 1.5e-7, 1e-15, 9.99e-16, 1e20, 9.9999e19, 1e21, 1e300, -1.7976931348623157e308, 123456.5, 0.00012345,
      0.000123456, 1234565, 2.5, 0.125, 1 + 2 ** -52, 1 - 2 ** -53, 100, 1e5, 99999.5, 0.5, 0.05, 0.005, 4.35e-7];
    for (const x of edges) for (let d = 1; d <= 8; d++) for (const v of [x, -x]) expect(text(v, d), `${v} @ ${d}`).toBe(fmt(v, d));
  });

  it("runEveryBranch: its samples reach the exponential, 0.000ddd, rounding-up and fallback paths, each as fmt writes it", () => {
    const scratch = new Uint8Array(NUMBER_ROOM);
    expect(runEveryBranch(scratch)).toBeGreaterThan(0);
    const texts = EVERY_BRANCH.flatMap((x) => [4, 6].map((d) => text(x, d)));
    for (const x of EVERY_BRANCH) for (const d of [4, 6]) expect(text(x, d), `${x} @ ${d}`).toBe(fmt(x, d));
    // the branches it is there to reach (fmt's texts, toPrecision's digits)
    for (const t of ["1.5e-12", "-1.5e-7", "1.235e6", "1200", "12.5", "0.00123", "-2.5", "10", "1e25", "0"]) expect(texts).toContain(t);
    expect(EVERY_BRANCH.some((x) => x !== 0 && Number.isFinite(x) && writeDecimal(new Uint8Array(NUMBER_ROOM), new DataView(new ArrayBuffer(NUMBER_ROOM)), 0, x, 6) < 0), "a half-way fallback").toBe(true);
  });
});
