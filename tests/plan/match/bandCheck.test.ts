/**
 * The band check of chosen recipes (plan/match/bandCheck.ts): which recipes it covers, the spacing
 * it solves a rect recipe at (pitch/m), and that `coarse` follows the band's own figures.
 */
import { describe, expect, it } from "vitest";
import { bandVerdict } from "../../../src/plan/match/bandCheck.js";
import { bandIndex } from "../../../src/cells/band/lowestBand.js";
import type { Candidate } from "../../../src/plan/match/levelCandidates.js";
import type { EvaluatedMaterial } from "../../../src/plan/match/matchContext.js";
import { expectClose } from "../../helpers/close.js";

const C0 = 299_792_458;
const phase = (id: string, re: number): EvaluatedMaterial => ({ material: { id } as EvaluatedMaterial["material"], value: {} as EvaluatedMaterial["value"], eps: { re, im: 0 }, isMetal: false, isFluid: false });
const materials = [phase("ceramic", 9.6), phase("air", 1)];

function candidate(over: Partial<Candidate>): Candidate {
  return {
    family: "holes-in-slab", host: "ceramic", inclusion: "air", lattice: "square", fillFraction: 0.3, dimensions: {},
    achieved: [1, 5, 5], achievedIm: [0, 0, 0], relError: 0, lossTangent: 0, indexIm: 0, spread: 0, bandwidth: null, featureM: 1e-4,
    resonant: false, score: 0, notes: [], homogenization: "warn", pitchRatio: 0.15, orientation: "z", ...over,
  } as Candidate;
}

describe("bandVerdict", () => {
  it("a rect recipe of aspect 2/3 (2 × 3 holes per cell) is solved at a = pitch/2 with b = 1.5 a, along Γ–X, Γ–Y, Γ–S", () => {
    const pitchM = 3e-3, f = 12e9;
    const v = bandVerdict(candidate({ lattice: "rect", aspect: 2 / 3, fillFraction: 0.25, achieved: [1, 4.2, 5.6] }), materials, "Hz", pitchM, f, 0.05)!;
    expect(v).not.toBeNull();
    const direct = bandIndex({ lattice: "rect", aspect: 2 / 3, epsHost: 9.6, epsCircle: 1, fill: 0.25 }, "perpendicular", (2 * Math.PI * f * (pitchM / 2)) / C0);
    expect(v.band.directions).toEqual(["Γ–X", "Γ–Y", "Γ–S"]);
    expectClose(v.band.index, direct.index, { rel: 1e-12, label: "band index" });
    expect(v.status).toBe(direct.deviation <= 0.05 && direct.excessAnisotropy <= 0.05 ? "ok" : "warn");
    // anchored on the recipe's solved values: n(Γ–X)² = ε_2 (E along y), n(Γ–Y)² = ε_1
    expectClose(v.anchored.quasiStaticIndex[0] ** 2, 5.6, { rel: 1e-12, label: "Γ–X" });
    expectClose(v.anchored.quasiStaticIndex[1] ** 2, 4.2, { rel: 1e-12, label: "Γ–Y" });
    expectClose(v.anchored.index[0] / v.anchored.quasiStaticIndex[0], direct.index[0] / direct.quasiStaticIndex[0], { rel: 1e-12, label: "ratio kept" });
  });

  it("coarse rests on the band: the same recipe passes at a lower frequency and fails nearer the band edge", () => {
    const c = candidate({ lattice: "rect", aspect: 2, fillFraction: 0.2, achieved: [1, 6.4, 5.2] });
    const low = bandVerdict(c, materials, "Hz", 2e-3, 10e9, 0.02)!;
    const high = bandVerdict(c, materials, "Hz", 2e-3, 22e9, 0.02)!;
    expect(low.status).toBe("ok");
    expect(low.band.deviation).toBeLessThan(0.02);
    expect(high.status).toBe("warn");
    expect(Math.max(high.band.deviation, high.band.excessAnisotropy)).toBeGreaterThan(0.02);
  });

  it("square and hex keep their two directions; in-plane rods, other families and metals are not band-checked", () => {
    expect(bandVerdict(candidate({}), materials, "Hz", 2e-3, 15e9, 0.05)!.band.directions).toEqual(["Γ–X", "Γ–M"]);
    expect(bandVerdict(candidate({ lattice: "hex" }), materials, "Ez", 2e-3, 15e9, 0.05)!.band.directions).toEqual(["Γ–M", "Γ–K"]);
    expect(bandVerdict(candidate({ orientation: "1" }), materials, "Hz", 2e-3, 15e9, 0.05)).toBeNull();
    expect(bandVerdict(candidate({ family: "laminate" }), materials, "Hz", 2e-3, 15e9, 0.05)).toBeNull();
    expect(bandVerdict(candidate({ lattice: "rect", aspect: 2.5 }), materials, "Hz", 2e-3, 15e9, 0.05)).toBeNull();
  });
});
