/**
 * The `model-uncertainty` requirement (plan/verdict.ts): a used level whose recipe's model
 * uncertainty (Recipe.spread) exceeds the tolerance is a miss, with the worst figure, the limit and
 * the levels; levels without cells or within the tolerance are not. And the `homogenization`
 * miss's worst figure (band deviation, else pitch ratio).
 */
import { describe, expect, it } from "vitest";
import { planVerdict } from "../../src/plan/verdict.js";
import { betterThan } from "../../src/plan/remedies.js";
import { resolveSettings } from "../../src/plan/resolveSettings.js";
import { F_COARSE } from "../../src/plan/flags.js";
import type { DeviceFigures, MissedRequirement, PlanLevel, Recipe } from "../../src/plan/planTypes.js";

const figures = {
  flagCounts: {}, maxRelError: 0.01, lossBudgetDb: null, lossDb: 0, bandwidthRequired: null, minBandwidth: null,
  largestAnisotropy: 1, processMinFeatureM: null, smallestFeatureM: null,
} as unknown as DeviceFigures;

function level(index: number, cellCount: number, spread: number | null, family = "split-ring"): PlanLevel {
  const recipe = spread === null ? null : ({ family, spread, notes: [] } as unknown as Recipe);
  return { index, target: [1], cellCount, maxQuantizationError: 0, unresolvable: false, recipe, runnersUp: [], reasons: [], flags: 0 };
}

describe("verdict: model uncertainty above the tolerance is a missed requirement", () => {
  const settings = resolveSettings({ realization: { tolerance: 0.05 } });

  it("names the worst figure, the tolerance and every level above it (only used levels with a recipe)", () => {
    const levels = [level(1, 10, 0.01), level(2, 5, 0.3), level(3, 4, 0.08, "rods-in-host"), level(4, 0, 0.9), level(5, 3, null)];
    const v = planVerdict({ cells: 22, figures, settings, levels, maxZeroTargetAbsError: NaN });
    expect(v.buildable).toBe(false);
    const m = v.missed.find((x) => x.what === "model-uncertainty")!;
    expect(m.value).toBe(0.3);
    expect(m.limit).toBe(0.05);
    expect(m.levels).toEqual([2, 3]);
    expect(m.text).toContain("levels 2, 3 (9 cells)");
    expect(m.text).toContain("the two standard ring inductances");
  });

  it("at or below the tolerance: no miss, buildable", () => {
    const v = planVerdict({ cells: 10, figures, settings, levels: [level(1, 10, 0.05)], maxZeroTargetAbsError: NaN });
    expect(v.missed).toEqual([]);
    expect(v.buildable).toBe(true);
  });

  it("remedies count it: a plan with less model uncertainty is better, all else equal", () => {
    const a: MissedRequirement[] = [{ what: "model-uncertainty", value: 0.1, limit: 0.05, text: "" }];
    const b: MissedRequirement[] = [{ what: "model-uncertainty", value: 0.3, limit: 0.05, text: "" }];
    expect(betterThan(a, b)).toBe(true);
    expect(betterThan([], a)).toBe(true);
  });
});

describe("verdict: the homogenization miss names its worst figure", () => {
  const settings = resolveSettings({ realization: { tolerance: 0.05 } });
  const coarse = (index: number, cells: number, extra: Partial<Recipe>): PlanLevel => ({ ...level(index, cells, 0.001, "rods-in-host"), recipe: { family: "rods-in-host", spread: 0.001, notes: [], ...extra } as unknown as Recipe, flags: F_COARSE });
  const withCoarse = { ...figures, flagCounts: { coarse: 6 } } as unknown as DeviceFigures;

  it("the band deviation where the band was solved wins over pitch ratios", () => {
    const levels = [coarse(1, 2, { pitchRatio: 0.2 }), coarse(2, 3, { pitchRatio: 0.15, bandDeviation: 0.08 }), coarse(3, 1, { pitchRatio: 0.12, bandDeviation: 0.06 }), level(4, 4, 0.001)];
    const m = planVerdict({ cells: 10, figures: withCoarse, settings, levels, maxZeroTargetAbsError: NaN }).missed.find((x) => x.what === "homogenization")!;
    expect(m.value).toBe(0.6);
    expect(m.levels).toEqual([1, 2, 3]);
    expect(m.worst).toEqual({ figure: "band-deviation", value: 0.08, limit: 0.05, level: 2 });
    expect(m.text).toContain("worst: level 2, its band index 8 % off the long-wavelength value (tolerance 5 %)");
  });

  it("without a solved band: the largest pitch ratio against λ/10 (common practice, cells/homogenization.ts)", () => {
    const levels = [coarse(1, 2, { pitchRatio: 0.2 }), coarse(2, 4, { pitchRatio: 0.13 })];
    const m = planVerdict({ cells: 6, figures: withCoarse, settings, levels, maxZeroTargetAbsError: NaN }).missed.find((x) => x.what === "homogenization")!;
    expect(m.worst).toEqual({ figure: "pitch-ratio", value: 0.2, limit: 0.1, level: 1 });
    expect(m.text).toContain("worst: level 1, pitch 0.2 of the wavelength in its densest material (λ/10 = 0.1)");
  });
});
