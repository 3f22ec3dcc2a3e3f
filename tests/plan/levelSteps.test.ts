/**
 * Level steps finer than the process: printed split rings whose radii differ by 1–2.5 µm under
 * 100 µm printed-circuit rules (resolution a quarter of the smallest feature, 25 µm: our choice,
 * levelSteps.ts) come out of the shop as one ring. They are merged when every cell stays within the
 * tolerance, and stay separate (flagged `unresolvable`) when merging would push a cell over it.
 */
import { describe, it, expect } from "vitest";
import { markUnresolvable, mergeUnresolvable } from "../../src/plan/levelSteps.js";
import type { PlanLevel, Recipe } from "../../src/plan/planTypes.js";

const RADII_UM = [1010.3, 1011.3, 1012.8];
const MU = [0.5, 0.505, 0.512]; // each level's achieved μ_1 and its cells' target (invented: a demo of the rule)

function setup(): { levels: PlanLevel[]; level: Int32Array; targets: Float64Array[] } {
  const levels: PlanLevel[] = RADII_UM.map((r, l) => ({
    index: l + 1,
    target: [2.4, MU[l], 1],
    cellCount: 4,
    maxQuantizationError: 0,
    unresolvable: false,
    recipe: {
      family: "split-ring", host: "ptfe-ceramic-10", inclusion: "copper", lattice: "cubic", orientation: "1", fillFraction: 0.1,
      dimensions: { ring_radius_m: r * 1e-6, ring_width_m: 200e-6, ring_gap_m: 200e-6 },
      achieved: [2.4, MU[l], 1], achievedIm: [0, 0, 0], relError: 0, lossTangent: 0, indexIm: 0, spread: 0, bandwidth: null, featureM: 200e-6, resonant: true, score: 0, notes: [],
    } as Recipe,
    runnersUp: [], reasons: [], flags: 0,
  }));
  // four cells per level, each at its level's target
  const level = Int32Array.from([0, 0, 0, 0, 1, 1, 1, 1, 2, 2, 2, 2]);
  const targets = [new Float64Array(12).fill(2.4), Float64Array.from(level, (l) => MU[l]), new Float64Array(12).fill(1)];
  return { levels, level, targets };
}

describe("level steps finer than the process", () => {
  it("ring radii 1010.3 / 1011.3 / 1012.8 µm under 100 µm rules: all three unresolvable", () => {
    const { levels } = setup();
    markUnresolvable(levels, 100e-6);
    expect(levels.map((l) => l.unresolvable)).toEqual([true, true, true]);
  });

  it("are merged into one level when every cell stays within a 5 % tolerance", () => {
    const { levels, level, targets } = setup();
    const m = mergeUnresolvable(levels, level, targets, 0.05, 100e-6);
    expect(m.removed.length).toBe(2);
    expect(new Set(level).size).toBe(1);
    const kept = level[0];
    expect(m.removed).not.toContain(kept);
    // the kept recipe's μ against every cell's own target: at most |0.512 − 0.5| / 0.5 = 2.4 %
    const mu = levels[kept].recipe!.achieved[1];
    for (let c = 0; c < 12; c++) expect(Math.abs(mu - targets[1][c]) / targets[1][c]).toBeLessThanOrEqual(0.05);
    expect(m.notes.length).toBe(2);
    expect(m.notes[0]).toMatch(/differ by less than the process can make/);
  });

  it("stay separate when a merge would push a cell over a 0.5 % tolerance", () => {
    const { levels, level, targets } = setup();
    const before = Int32Array.from(level);
    const m = mergeUnresolvable(levels, level, targets, 0.005, 100e-6);
    expect(m.removed).toEqual([]);
    expect(level).toEqual(before);
  });

  it("are left alone under finer rules (20 nm electron-beam lithography: resolution 5 nm)", () => {
    const { levels, level, targets } = setup();
    markUnresolvable(levels, 20e-9);
    expect(levels.some((l) => l.unresolvable)).toBe(false);
    expect(mergeUnresolvable(levels, level, targets, 0.05, 20e-9).removed).toEqual([]);
  });

  it("merge only the pair that fits: 1 and 2 (1 %) under a 1.2 % tolerance, not 3", () => {
    const { levels, level, targets } = setup();
    const m = mergeUnresolvable(levels, level, targets, 0.012, 100e-6);
    expect(m.removed.length).toBe(1);
    expect(level[8]).toBe(2);
    expect(level[0]).toBe(level[4]);
  });
});
