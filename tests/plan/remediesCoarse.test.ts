/**
 * Remedies for coarse cells (`homogenization`) and model uncertainty (plan/remedies.ts): they are
 * candidates, ranked, and — like every remedy — tried by re-planning before they are printed. The
 * expected figures come from re-planning here (an identity of our own definition), not from a
 * published source; λ/10 is common practice (cells/homogenization.ts).
 */
import { beforeAll, describe, expect, it } from "vitest";
import { betterThan, candidateChanges, findRemedies, PRIORITY } from "../../src/plan/remedies.js";
import { searchRemedies } from "../../src/io/planRemedies.js";
import { loadDesign } from "../../src/io/design/loadDesign.js";
import { loadFieldForDesign } from "../../src/io/fieldCsv.js";
import { loadMaterialCatalog } from "../../src/io/materialCatalog.js";
import { loadProcessCatalog } from "../../src/io/processCatalog.js";
import { computeTensorField } from "../../src/field/computeTensorField.js";
import { planFromField, type PlanCatalogs } from "../../src/plan/runPlan.js";
import type { DeviceFigures, MissedRequirement, PlanLevel, Recipe } from "../../src/plan/planTypes.js";
import { planVerdict } from "../../src/plan/verdict.js";
import { resolveSettings } from "../../src/plan/resolveSettings.js";
import { F_COARSE, F_NORECIPE } from "../../src/plan/flags.js";

let catalogs: PlanCatalogs;
beforeAll(async () => {
  catalogs = { materials: await loadMaterialCatalog(), processes: await loadProcessCatalog() };
});

describe("homogenization in the ranking", () => {
  it("ranks after the process and before the loss; fewer coarse cells is better, all else equal", () => {
    expect(PRIORITY.indexOf("homogenization")).toBe(PRIORITY.indexOf("process") + 1);
    expect(PRIORITY.indexOf("homogenization")).toBeLessThan(PRIORITY.indexOf("loss"));
    const coarse = (v: number): MissedRequirement => ({ what: "homogenization", value: v, limit: 0, text: "" });
    expect(betterThan([coarse(0.05)], [coarse(0.15)])).toBe(true);
    expect(betterThan([], [coarse(0.15)])).toBe(true);
    // a change that clears the coarse cells but breaks the process is not better
    expect(betterThan([{ what: "process", value: 2, limit: 0, text: "" }], [coarse(0.15)])).toBe(false);
  });
});

describe("homogenization counts the coarse cells that have a recipe", () => {
  it("a level refused for coarseness counts under recipes only (no '→ met' for plans that still build nothing)", () => {
    const figures = { flagCounts: { coarse: 7, norecipe: 4 }, maxRelError: 0.01, lossBudgetDb: null, lossDb: 0, bandwidthRequired: null, minBandwidth: null, largestAnisotropy: 1, processMinFeatureM: null, smallestFeatureM: null } as unknown as DeviceFigures;
    const lv = (index: number, cellCount: number, recipe: boolean, flags: number): PlanLevel => ({
      index, target: [1], cellCount, maxQuantizationError: 0, unresolvable: false, runnersUp: [], reasons: [], flags,
      recipe: recipe ? ({ family: "rods-in-host", spread: 0, notes: [], pitchRatio: 0.15 } as unknown as Recipe) : null,
    });
    const settings = resolveSettings({ realization: { tolerance: 0.05 } });
    const v = planVerdict({ cells: 10, figures, settings, levels: [lv(1, 3, true, F_COARSE), lv(2, 4, false, F_COARSE | F_NORECIPE), lv(3, 3, true, 0)], maxZeroTargetAbsError: NaN });
    const m = v.missed.find((x) => x.what === "homogenization")!;
    expect(m.value).toBe(0.3);
    expect(m.levels).toEqual([1]);
    expect(v.missed.find((x) => x.what === "recipes")!.value).toBe(4);
    const none = planVerdict({ cells: 10, figures, settings, levels: [lv(2, 4, false, F_COARSE | F_NORECIPE), lv(3, 6, true, 0)], maxZeroTargetAbsError: NaN });
    expect(none.missed.map((x) => x.what)).toEqual(["recipes"]);
  });
});

describe("demo-designs/field-quasi-conformal.json (its only miss: coarse cells)", () => {
  it("offers a finer pitch sized from the worst figure and a plan without the densest coarse material; the printed ones re-plan to what they claim", async () => {
    const design = await loadDesign("demo-designs/field-quasi-conformal.json");
    const field = await loadFieldForDesign(design);
    const plan = planFromField(design, field, catalogs, {});
    expect(plan.verdict.missed.map((m) => m.what)).toEqual(["homogenization"]);
    const worst = plan.verdict.missed[0].worst!;
    const ids = catalogs.materials.map((m) => m.id);
    const changes = candidateChanges(plan, { materials: ids.map((id) => ({ id, index: id === "sapphire-o" ? 3.1 : 1.5 })) });
    const finer = changes.find((c) => c.pitchM !== null && c.pitchM < plan.grid.pitchM);
    expect(finer, changes.map((c) => c.label).join("; ")).toBeDefined();
    // the pitch ratio scales with the pitch: 0.97 × (λ/10 over the worst ratio), within [1/4, 1/1.2]
    if (worst.figure === "pitch-ratio") {
      expect(finer!.pitchM! / plan.grid.pitchM).toBeCloseTo(Math.min(1 / 1.2, Math.max(0.25, (0.97 * worst.limit) / worst.value)), 12);
    }
    const result = searchRemedies(plan, design, field, catalogs, {}, 120_000);
    expect(result.remedies.length).toBeGreaterThan(0);
    for (const r of result.remedies) {
      // tried before printed: re-planned here independently, the verdict is the one it claims
      const f = r.pitchM === null ? field : computeTensorField({ ...design, grid: { ...design.grid, pitchM: r.pitchM } }, undefined, undefined, { derived: "lazy" });
      const again = planFromField(design, f, catalogs, r.overrides);
      expect(again.verdict.buildable, r.label).toBe(r.buildable);
      expect(again.verdict.missed.map((m) => m.what), r.label).toEqual(r.missedAfter.map((m) => m.what));
      expect(betterThan(again.verdict.missed, plan.verdict.missed), r.label).toBe(true);
    }
    expect(result.remedies[0].label).toMatch(/^finer pitch/);
  }, 180_000);

  it("a remedy the search did not try is never printed: a search stopped before its first try prints nothing", async () => {
    const design = await loadDesign("demo-designs/field-quasi-conformal.json");
    const plan = planFromField(design, await loadFieldForDesign(design), catalogs, {});
    let calls = 0;
    const r = findRemedies(plan, () => { calls++; return null; }, () => true);
    expect(calls).toBe(0);
    expect(r).toEqual({ remedies: [], tried: 0 });
  });
});

describe("demo-designs/plan-microwave-mast-cloak.json (eight misses)", () => {
  it("the coarse and model-uncertainty changes stay among the tried candidates however many others come first", async () => {
    const design = await loadDesign("demo-designs/plan-microwave-mast-cloak.json");
    const plan = planFromField(design, await loadFieldForDesign(design), catalogs, {});
    const missed = plan.verdict.missed.map((m) => m.what);
    expect(missed).toContain("homogenization");
    expect(missed).toContain("model-uncertainty");
    const changes = candidateChanges(plan, { materials: catalogs.materials.map((m) => ({ id: m.id, index: 2 })) });
    expect(changes.length).toBeLessThanOrEqual(10);
    expect(changes.some((c) => c.pitchM !== null && c.pitchM < plan.grid.pitchM)).toBe(true);
    // the design allows split rings only: no other family to fall back on, so no such change
    expect(plan.settings.families).toEqual(["split-ring"]);
    expect(changes.some((c) => /^do without the .* family/.test(c.label))).toBe(false);
    // with every family allowed, the least certain one (the rings) is dropped as a tried change
    const open = planFromField(design, await loadFieldForDesign(design), catalogs, { families: null });
    const drop = candidateChanges(open).find((c) => /^do without the .* family/.test(c.label));
    expect(drop?.label).toBe("do without the split-ring family (the least certain model)");
    expect(drop?.overrides.families).not.toContain("split-ring");
  }, 120_000);
});
