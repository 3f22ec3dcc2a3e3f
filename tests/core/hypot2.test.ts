import { describe, it, expect } from "vitest";
import fc from "fast-check";
import { hypot2 } from "../../src/core/hypot2.js";

describe("hypot2", () => {
  it("equals Math.hypot to the bit (identity; property over all doubles)", () => {
    fc.assert(
      fc.property(fc.double(), fc.double(), (x, y) => {
        expect(Object.is(hypot2(x, y), Math.hypot(x, y)), `${x}, ${y}`).toBe(true);
      }),
      { seed: 2024, numRuns: 20000 },
    );
    fc.assert(
      fc.property(fc.double({ min: -1e3, max: 1e3, noNaN: true }), fc.double({ min: -1e3, max: 1e3, noNaN: true }), (x, y) => {
        expect(Object.is(hypot2(x, y), Math.hypot(x, y)), `${x}, ${y}`).toBe(true);
      }),
      { seed: 7, numRuns: 20000 },
    );
  });
  it("handles the edges as Math.hypot does", () => {
    for (const [x, y] of [[0, 0], [-0, 0], [Infinity, NaN], [NaN, -Infinity], [NaN, 1], [1e308, 1e308], [5e-324, 5e-324], [3, 4]]) {
      expect(Object.is(hypot2(x, y), Math.hypot(x, y)), `${x}, ${y}`).toBe(true);
    }
    expect(hypot2(3, 4)).toBe(5); // 3-4-5 triangle
  });
});
