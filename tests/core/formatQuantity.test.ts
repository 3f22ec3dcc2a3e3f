/** One formatter for lengths and frequencies: unit choice, digits, and no NaN/Infinity (identities, SI prefixes). */
import { describe, it, expect } from "vitest";
import { formatFrequency, formatFrequencyPrecise, formatLength, formatPoint, significant } from "../../src/core/formatQuantity.js";

describe("formatQuantity", () => {
  it("picks the readable SI unit", () => {
    expect(formatLength(0.0012)).toBe("1.2 mm");
    expect(formatLength(3.9e-8)).toBe("39 nm");
    expect(formatLength(2.5)).toBe("2.5 m");
    expect(formatLength(-1.5e-6)).toBe("-1.5 µm");
    expect(formatLength(2e-13)).toBe("0.2 pm");
    expect(formatFrequency(1.05e10)).toBe("10.5 GHz");
    expect(formatFrequency(1.934e14)).toBe("193 THz");
    expect(formatFrequency(50)).toBe("50 Hz");
    // a frequency as given keeps six digits: 193.5 THz (1549.3 nm) is not 194 THz
    expect(formatFrequencyPrecise(1.935e14)).toBe("193.5 THz");
    expect(formatFrequencyPrecise(9.4e9)).toBe("9.4 GHz");
    expect(formatFrequencyPrecise(Number.NaN)).toBe("—");
  });
  it("takes the caller's number style and never prints NaN or Infinity", () => {
    expect(formatLength(0.0012, (v) => v.toPrecision(3))).toBe("1.20 mm");
    expect(significant(0.012345, 3)).toBe("0.0123");
    for (const bad of [NaN, Infinity, -Infinity]) {
      expect(formatLength(bad)).toBe("—");
      expect(formatFrequency(bad)).toBe("—");
      expect(significant(bad)).toBe("—");
    }
    expect(formatLength(0)).toBe("0 m");
    expect(formatLength(-0)).toBe("0 m");
  });
  it("writes a point in the unit of its larger coordinate", () => {
    expect(formatPoint([0.04, 1e-18])).toBe("(40 mm, 0 mm)");
    expect(formatPoint([-2.5e-6, 0.0004])).toBe("(-2.5 µm, 400 µm)");
    expect(formatPoint([0, 0])).toBe("(0 m, 0 m)");
    expect(formatPoint([NaN, 1])).toBe("(—, —)");
  });
});
