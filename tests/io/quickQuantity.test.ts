import { describe, it, expect } from "vitest";
import fc from "fast-check";
import { quickQuantity } from "../../src/io/quickQuantity.js";
import { parseQuantity, parseQuantityWith, NeedsMathjs } from "../../src/io/quantity.js";
import { getMath } from "../../src/io/mathjs.js";

const UNITS = {
  length: ["m", "km", "cm", "mm", "um", "nm"],
  frequency: ["Hz", "kHz", "MHz", "GHz", "THz"],
  angle: ["rad", "deg"],
} as const;

describe("quantities without mathjs", () => {
  it("gives the same bits as mathjs for a plain number and a common unit (property)", async () => {
    const math = await getMath();
    const dims = Object.keys(UNITS) as (keyof typeof UNITS)[];
    fc.assert(
      fc.property(
        fc.constantFrom(...dims),
        fc.nat(20),
        fc.double({ min: 1e-12, max: 1e12, noNaN: true }),
        fc.constantFrom("", " ", "  "),
        fc.boolean(),
        (dim, pick, x, gap, exp) => {
          const unit = UNITS[dim][pick % UNITS[dim].length];
          const text = `${exp ? x.toExponential() : String(x)}${gap}${unit}`;
          const quick = quickQuantity(text, dim);
          // identity: mathjs's own reading of the same string, bit for bit
          const slow = math.unit(text).toNumber(dim === "length" ? "m" : dim === "frequency" ? "Hz" : "rad");
          expect(quick, text).toBe(slow);
        },
      ),
      { seed: 1313, numRuns: 2000 },
    );
  });
  it("leaves everything else to mathjs", () => {
    for (const t of ["2 inch", "3 mm + 1 mm", "25 degC", "35 µm", "mm", "1e400 m", "3 GHz"]) expect(quickQuantity(t, "length"), t).toBeUndefined();
    expect(quickQuantity("90 deg", "length")).toBeUndefined();
    expect(quickQuantity("1 m", "dimensionless")).toBeUndefined();
    expect(() => parseQuantityWith(null, "2 inch", "length", "$.x")).toThrow(NeedsMathjs);
  });
  it("keeps mathjs's answers and messages where the fast path does not apply", async () => {
    // 1 inch = 0.0254 m exactly (NIST SP 811, 2008, appendix B.8)
    expect(await parseQuantity("2 inch", "length", "$.x")).toBe(2 * 0.0254);
    await expect(parseQuantity("3 GHz", "length", "$.pitch")).rejects.toThrow(/expected a length/);
    await expect(parseQuantity("1e400 m", "length", "$.pitch")).rejects.toThrow(/finite/);
  });
});
