import { expectClose } from "../helpers/close.js";
import { describe, it, expect, beforeAll } from "vitest";
import { loadMaterialCatalog } from "../../src/io/materialCatalog.js";
import { loadProcessCatalog } from "../../src/io/processCatalog.js";
import type { Material } from "../../src/media/material.js";
import type { Process } from "../../src/cells/process.js";
import { CELL_FAMILIES } from "../../src/cells/registry.js";
import { evaluateMaterials } from "../../src/plan/runPlan.js";
import { levelCandidates } from "../../src/plan/match/levelCandidates.js";
import { baseScore, chooseRecipes } from "../../src/plan/match/chooseRecipes.js";
import type { MatchContext } from "../../src/plan/match/matchContext.js";
import type { TargetComponent } from "../../src/plan/planTypes.js";

let materials: Material[];
let processes: Process[];
beforeAll(async () => {
  materials = await loadMaterialCatalog();
  processes = await loadProcessCatalog();
});

const EZ: TargetComponent[] = [
  { name: "eps_z", kind: "eps", axis: "z", constant: false },
  { name: "mu_1", kind: "mu", axis: "1", constant: true },
  { name: "mu_2", kind: "mu", axis: "2", constant: true },
];

function ctx(over: Partial<MatchContext> & { materialIds: string[]; familyIds: string[] }): MatchContext {
  const { materialIds, familyIds, ...rest } = over;
  return {
    polarization: "Ez",
    components: EZ,
    pitchM: 2e-3,
    frequencyHz: 10e9,
    tolerance: 0.05,
    materials: evaluateMaterials(materials, materialIds, 10e9),
    materialsChosen: true,
    families: CELL_FAMILIES.filter((f) => familyIds.includes(f.id)),
    lattice: "square",
    process: null,
    bandwidth: null,
    ...rest,
  };
}

describe("recipe choice", () => {
  it("prefers fewer distinct materials at equal error", () => {
    // laminates with the field in the layer planes are exact (Wiener parallel bound, Wiener 1912),
    // so every pair that brackets a target reaches it with zero error: the choice is about materials.
    // Level A (ε = 2.2) is bracketed by PTFE/HDPE (2.05–2.37, Riddle et al. 2003) and PTFE/alumina;
    // level B (ε = 6) only by pairs with alumina (9.4). PTFE/alumina for both uses 2 materials.
    const c = ctx({ materialIds: ["ptfe", "hdpe", "alumina-96"], familyIds: ["laminate"] });
    const a = levelCandidates([2.2, 1, 1], c).candidates;
    const b = levelCandidates([6, 1, 1], c).candidates;
    // the real parts are exact; the error left is the loss (complex error: |Im ε|/ε_target)
    for (const [t, list] of [[2.2, a], [6, b]] as const) {
      for (const x of list) {
        expect(Math.abs(x.achieved[0] - t) / t).toBeLessThan(1e-9);
        expectClose(x.relError, Math.abs(x.achievedIm[0]) / t, { rel: 1e-9, abs: 1e-15, label: `${x.host}/${x.inclusion}` });
      }
    }
    // without the material count, level A would take the lower-loss PTFE/HDPE pair (3 materials)
    const aBest = [...a].sort((x, y) => baseScore(x, 0.05) - baseScore(y, 0.05))[0];
    expect([aBest.host, aBest.inclusion].sort()).toEqual(["hdpe", "ptfe"]);
    const chosen = chooseRecipes([a, b], 0.05);
    const used = new Set([a[chosen[0]], b[chosen[1]]].flatMap((r) => [r.host, r.inclusion]));
    expect([...used].sort()).toEqual(["alumina-96", "ptfe"]);
  });

  it("refuses recipes whose features the process cannot make", () => {
    // alumina rods in PTFE for ε = 3: fill ≈ 0.1 (Maxwell Garnett along the rods is the parallel
    // mean: f = (3 − 2.05)/(9.4 − 2.05) = 0.129), rod diameter 2·sqrt(f/π)·a
    const mill = processes.find((p) => p.id === "cnc-milling")!;
    const fine = ctx({ materialIds: ["ptfe", "alumina-96"], familyIds: ["rods-in-host"], pitchM: 1e-3, process: mill });
    const s = levelCandidates([3, 1, 1], fine);
    expect(s.candidates.length).toBe(0);
    expect([...s.refusals.keys()].some((r) => r.includes("below the process limit"))).toBe(true);
    // the same target in 10 mm cells: rods of about 4 mm, well within milling
    const coarse = ctx({ materialIds: ["ptfe", "alumina-96"], familyIds: ["rods-in-host"], pitchM: 4e-3, frequencyHz: 2e9, process: mill });
    const ok = levelCandidates([3, 1, 1], coarse).candidates;
    expect(ok.length).toBeGreaterThan(0);
    for (const r of ok) expect(r.featureM).toBeGreaterThanOrEqual(Math.min(mill.minFeatureM, mill.minGapM));
  });

  it("prints split rings on boards: with the whole catalog allowed, only laminates host them", () => {
    // μ_r = 0.2 at 8.5 GHz in 2.5 mm cells (a reduced-cloak value, Schurig et al. 2006); ε_z = 2.94
    const base = { familyIds: ["split-ring"], lattice: null, pitchM: 2.5e-3, frequencyHz: 8.5e9 };
    const any = ctx({ ...base, materialIds: ["alumina-96", "ptfe-ceramic-10", "copper", "air"], materialsChosen: false });
    const hosts = new Set(levelCandidates([2.94, 0.2, 1], any).candidates.map((r) => r.host));
    expect([...hosts]).toEqual(["ptfe-ceramic-10"]);
    const noBoard = levelCandidates([2.94, 0.2, 1], ctx({ ...base, materialIds: ["alumina-96", "copper", "air"], materialsChosen: false }));
    expect(noBoard.candidates.length).toBe(0);
    expect([...noBoard.refusals.keys()].some((r) => r.includes("board"))).toBe(true);
    // a design that names a ceramic gets rings printed on it
    const named = ctx({ ...base, materialIds: ["alumina-96", "copper", "air"], materialsChosen: true });
    expect(levelCandidates([2.94, 0.2, 1], named).candidates.map((r) => r.host)).toContain("alumina-96");
  });

  it("refuses a recipe that misses the target by more than 4× the tolerance, saying how close it came", () => {
    // Hz in-plane ε of 1.2 and 8 with alumina (9.4, Riddle-class ceramic row) and air: a laminate
    // gives ε_∥ = fε_a + (1 − f) and ε_⊥ = 1/(f/ε_a + (1 − f)) (Wiener 1912); ε_∥ = 8 needs
    // f = 0.83, and then ε_⊥ ≈ 3.9 — far from 1.2, so nothing reaches this target.
    const HZ: TargetComponent[] = [
      { name: "mu_z", kind: "mu", axis: "z", constant: true },
      { name: "eps_1", kind: "eps", axis: "1", constant: false },
      { name: "eps_2", kind: "eps", axis: "2", constant: false },
    ];
    const c = ctx({ materialIds: ["alumina-96", "air"], familyIds: ["laminate", "rods-in-host", "holes-in-slab"], components: HZ, polarization: "Hz", lattice: null, pitchM: 1e-3 });
    const s = levelCandidates([1, 1.2, 8], c);
    expect(s.candidates.length).toBe(0);
    expect([...s.refusals.keys()].some((r) => r.startsWith("the closest recipe misses the target by"))).toBe(true);
    // a near target (within the tolerance) is still matched
    const near = levelCandidates([1, 1.2, 1.25], c);
    expect(near.candidates.some((r) => r.relError <= 0.05)).toBe(true);
  });

  it("uses resonant families only where needed", () => {
    const c = ctx({ materialIds: ["ptfe", "copper"], familyIds: ["wire-medium", "split-ring"], lattice: null });
    expect(levelCandidates([1.5, 1, 1], c).candidates.length).toBe(0);
  });
});

describe("plain (solid) recipes", () => {
  it("a target equal to an allowed material, or to empty space, is a solid cell of it", () => {
    // PTFE's catalog ε' at 10 GHz (a constant-with-tan δ row) asked for exactly: solid PTFE
    const c = ctx({ materialIds: ["ptfe", "alumina-96"], familyIds: ["rods-in-host"] });
    const ptfe = c.materials.find((m) => m.material.id === "ptfe")!;
    const s = levelCandidates([ptfe.eps.re, 1, 1], c).candidates.filter((r) => r.family === "solid");
    expect(s.map((r) => r.host)).toEqual(["ptfe"]);
    // its error is its loss alone: |ε' + iε'' − ε'|/ε' = tan δ (identity)
    expectClose(s[0].relError, ptfe.eps.im / ptfe.eps.re, { rel: 1e-12, label: "solid PTFE error" });
    // ε = μ = 1: an empty cell, even when air is not among the allowed materials
    const empty = levelCandidates([1, 1, 1], c).candidates.filter((r) => r.family === "solid");
    expect(empty.map((r) => r.host)).toEqual(["vacuum"]);
    expect(empty[0].relError).toBe(0);
    // a target between the two materials is no solid recipe
    expect(levelCandidates([4, 1, 1], c).candidates.some((r) => r.family === "solid")).toBe(false);
  });
});
