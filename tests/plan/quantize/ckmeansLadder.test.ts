import { describe, it, expect } from "vitest";
import fc from "fast-check";
import { ckmeans } from "simple-statistics";
import { ckmeansLadder } from "../../../src/plan/quantize/ckmeansLadder.js";

/**
 * The ladder must give the partitions of simple-statistics' ckmeans (Wang & Song's dynamic
 * programme, divide-and-conquer fill of Ckmeans.1d.dp 3.4.6) for every k, to the bit and tie for
 * tie: the library is the oracle, asked one k at a time.
 */
describe("ckmeansLadder", () => {
  it("equals ckmeans(sample, k) for every k, asked in any order (property)", () => {
    fc.assert(
      fc.property(
        fc.array(fc.oneof(fc.double({ min: -5, max: 5, noNaN: true }), fc.integer({ min: -3, max: 3 })), { minLength: 1, maxLength: 70 }),
        fc.array(fc.nat(), { minLength: 1, maxLength: 12 }),
        (xs, picks) => {
          const sorted = [...xs].sort((a, b) => a - b);
          const ladder = ckmeansLadder(sorted);
          // the quantizer's order (large k first, then a binary search) and random orders
          for (const k of [...picks.map((p) => 1 + (p % sorted.length)), sorted.length, 1]) {
            expect(ladder.groups(k), `k = ${k}`).toEqual(ckmeans(sorted, k));
          }
        },
      ),
      { seed: 31, numRuns: 1500 },
    );
  });

  it("equals ckmeans on a quantizer-sized sample of log targets for the search's k (256, 129, 65 … 32)", () => {
    // smooth, skewed values like a bend's log ε_z, with repeated runs
    const sorted = Array.from({ length: 4000 }, (_, q) => Math.log(1.2 + 0.9 * (q / 3999) ** 1.7 + 1e-4 * Math.floor(q / 50))).sort((a, b) => a - b);
    const ladder = ckmeansLadder(sorted);
    for (const k of [1, 256, 129, 65, 33, 17, 25, 29, 31, 32]) expect(ladder.groups(k), `k = ${k}`).toEqual(ckmeans(sorted, k));
  });

  it("keeps one group for identical values and refuses k outside 1 … n", () => {
    expect(ckmeansLadder([2, 2, 2]).groups(3)).toEqual([[2, 2, 2]]);
    expect(() => ckmeansLadder([1, 2]).groups(3)).toThrow(RangeError);
    expect(() => ckmeansLadder([1, 2]).groups(0)).toThrow(RangeError);
  });
});
