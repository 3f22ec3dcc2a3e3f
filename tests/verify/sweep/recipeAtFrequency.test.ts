/**
 * Recipes re-evaluated at another frequency (src/verify/sweep/recipeAtFrequency.ts).
 * - Identity: at the design frequency every recipe of every planner demo (chosen ones and runners-up)
 *   gives back the plan's own achieved values — the sweep's centre is the plan.
 * - Dispersion: a wire-medium recipe follows the Drude form with the lattice plasma frequency of its
 *   built radius (Pendry, Holden, Robbins, Stewart, J. Phys.: Condens. Matter 10, 4785 (1998);
 *   Belov, Tretyakov, Viitanen, J. Electromagn. Waves Appl. 16, 1153 (2002)): compared with the cell
 *   model called directly at each frequency, Re ε rising with f and crossing zero near f_p/√ε_h.
 * - A split-ring recipe follows its Lorentz μ(f) (Pendry et al., IEEE Trans. MTT 47, 2075 (1999)):
 *   compared with splitRingResponse called directly, and Re μ returns toward 1 far below resonance.
 */
import { describe, expect, it } from "vitest";
import { loadDesign } from "../../../src/io/design/loadDesign.js";
import { loadFieldForDesign } from "../../../src/io/fieldCsv.js";
import { loadMaterialCatalog } from "../../../src/io/materialCatalog.js";
import { loadProcessCatalog } from "../../../src/io/processCatalog.js";
import { layerFor, planFromField } from "../../../src/plan/runPlan.js";
import type { Plan, Recipe } from "../../../src/plan/planTypes.js";
import { planAtFrequency, recipeAtFrequency, recipeContext } from "../../../src/verify/sweep/recipeAtFrequency.js";
import { wireMediumResponse } from "../../../src/cells/wireMedium.js";
import { evaluateMaterial } from "../../../src/media/material.js";
import { getCellFamily } from "../../../src/cells/registry.js";
import { expectClose } from "../../helpers/close.js";

const DEMOS = ["plan-microwave-mast-cloak", "plan-printed-bend", "plan-silicon-chip-bend", "plan-concentrator-subunity", "plan-microwave-carpet"];

async function planOf(name: string): Promise<{ plan: Plan; catalog: Awaited<ReturnType<typeof loadMaterialCatalog>> }> {
  const design = await loadDesign(`demo-designs/${name}.json`);
  const field = await loadFieldForDesign(design);
  const [materials, processes] = await Promise.all([loadMaterialCatalog(), loadProcessCatalog()]);
  return { plan: planFromField(design, field, { materials, processes }, {}), catalog: materials };
}

describe("recipes at the design frequency give back the plan", () => {
  it.each(DEMOS)("%s: every chosen recipe and runner-up", async (name) => {
    const { plan, catalog } = await planOf(name);
    const ctx = recipeContext(plan, catalog);
    let count = 0;
    const families = new Set<string>();
    for (const l of plan.levels) {
      for (const r of [l.recipe, ...l.runnersUp].filter((x): x is Recipe => x !== null)) {
        const v = recipeAtFrequency(r, ctx, plan.design.frequencyHz);
        expectClose(v.re, r.achieved, { rel: 1e-9, abs: 1e-12, label: `${name} level ${l.index} ${r.family} re` });
        expectClose(v.im, r.achievedIm, { rel: 1e-9, abs: 1e-12, label: `${name} level ${l.index} ${r.family} im` });
        count++;
        families.add(r.family);
      }
    }
    expect(count).toBeGreaterThan(0);
    // the plan seen at its own frequency keeps every level's values
    const same = planAtFrequency(plan, catalog, plan.design.frequencyHz);
    same.levels.forEach((l, k) => { if (l.recipe) expectClose(l.recipe.achieved, plan.levels[k].recipe!.achieved, { rel: 1e-9, abs: 1e-12 }); });
  }, 60_000);
});

describe("dispersive recipes change with frequency", () => {
  it("a wire medium follows the Drude form of its built wires (cell model called directly)", async () => {
    const { plan, catalog } = await planOf("plan-concentrator-subunity");
    const ctx = recipeContext(plan, catalog);
    // a wire medium along z (Hz: eps_1, eps_2 in the plane; wires along axis 1 give eps_1 the Drude value)
    const pitchM = plan.grid.pitchM;
    const radiusM = 0.01 * pitchM;
    const lattice = "square" as const;
    const fill = (Math.PI * radiusM ** 2) / pitchM ** 2;
    const recipe: Recipe = {
      family: "wire-medium", host: "ptfe", inclusion: "copper", lattice, orientation: "1", fillFraction: fill,
      dimensions: { radius_m: radiusM }, achieved: [], achievedIm: [], relError: 0, lossTangent: 0, indexIm: 0, spread: 0,
      bandwidth: null, featureM: 2 * radiusM, resonant: true, score: 0, notes: [],
    };
    const ptfe = catalog.find((m) => m.id === "ptfe")!;
    const copper = catalog.find((m) => m.id === "copper")!;
    const eps1 = plan.components.findIndex((c) => c.kind === "eps" && c.axis === "1");
    expect(eps1).toBeGreaterThanOrEqual(0);
    let prev = -Infinity;
    let fZero = NaN;
    const fs = [2e9, 4e9, 5.8e9, 8e9, 12e9, 20e9];
    for (const f of fs) {
      const v = recipeAtFrequency(recipe, ctx, f);
      const direct = wireMediumResponse({ pitchM, radiusM, frequencyHz: f, hostEps: evaluateMaterial(ptfe, f).eps, conductivitySPerM: copper.conductivitySPerM!, lattice });
      expectClose(v.re[eps1], direct.eps.re, { rel: 1e-12, abs: 1e-12, label: `Re ε at ${f} Hz` });
      expectClose(v.im[eps1], direct.eps.im, { rel: 1e-12, abs: 1e-12, label: `Im ε at ${f} Hz` });
      // Drude: Re ε rises with frequency (d(ωε)/dω ≥ 1 for a passive lossless medium)
      expect(v.re[eps1]).toBeGreaterThan(prev);
      prev = v.re[eps1];
      fZero = direct.effectivePlasmaHz;
    }
    // the zero of Re ε lies at f_p/√ε_h (lossless Drude); the values at 2 GHz and 20 GHz straddle it
    const lo = recipeAtFrequency(recipe, ctx, 0.8 * fZero).re[eps1], hi = recipeAtFrequency(recipe, ctx, 1.25 * fZero).re[eps1];
    expect(lo).toBeLessThan(0);
    expect(hi).toBeGreaterThan(0);
    // and the component across the wires is the Maxwell Garnett value, nearly flat in frequency
    const other = plan.components.findIndex((c) => c.kind === "eps" && c.axis === "2");
    const a = recipeAtFrequency(recipe, ctx, 4e9).re[other], b = recipeAtFrequency(recipe, ctx, 8e9).re[other];
    expectClose(a, b, { rel: 1e-3, label: "ε across thin wires" });
  });

  it("dispersive materials: a Sellmeier slab's holes and a Lorentz solid follow their catalog models at f", async () => {
    const { plan, catalog } = await planOf("plan-silicon-chip-bend");
    const ctx = recipeContext(plan, catalog);
    const holes = plan.levels.map((l) => l.recipe).find((r): r is Recipe => r?.family === "holes-in-slab")!;
    expect(holes.host).toBe("silicon-nir");
    const family = getCellFamily("holes-in-slab");
    const air = catalog.find((m) => m.id === holes.inclusion)!;
    const eps1 = plan.components.findIndex((c) => c.kind === "eps" && c.axis === "1");
    const values = [170e12, 193.4e12, 230e12].map((f) => {
      const v = recipeAtFrequency(holes, ctx, f);
      // the design declares a silicon layer: its core enters as the slab mode's ε at f (as the planner does)
      const layer = plan.settings.layer!;
      expect(layer.coreId).toBe("silicon-nir");
      const direct = family.effectivePermittivity(layerFor(layer, plan.settings.polarization, catalog, f).coreEps, evaluateMaterial(air, f).eps, holes.fillFraction, holes.lattice, { pitchM: plan.grid.pitchM, frequencyHz: f });
      expectClose(v.re[eps1], direct.perpendicular.re, { rel: 1e-12, label: `holes across, ${f} Hz` });
      return v.re[eps1];
    });
    // silicon's normal dispersion (Sellmeier: n rises with frequency below the band gap) and the slab
    // mode's growing confinement both raise the cell's ε with frequency
    expect(values[0]).toBeLessThan(values[1]);
    expect(values[1]).toBeLessThan(values[2]);
    // a solid cell of a Lorentz material (silicon carbide) is that material at f
    const sic = catalog.find((m) => m.id === "silicon-carbide")!;
    const solid: Recipe = { ...holes, family: "solid", host: "silicon-carbide", inclusion: "", fillFraction: 0, dimensions: {}, orientation: null };
    for (const f of [sic.validMinHz, Math.sqrt(sic.validMinHz * sic.validMaxHz), sic.validMaxHz]) {
      const v = recipeAtFrequency(solid, ctx, f);
      const e = evaluateMaterial(sic, f).eps;
      expectClose([v.re[eps1], v.im[eps1]], [e.re, e.im], { rel: 1e-12, abs: 1e-15, label: `SiC at ${f} Hz` });
    }
  });

  it("the mast cloak's split rings follow their Lorentz μ(f): strongly dispersive near the design frequency", async () => {
    const { plan, catalog } = await planOf("plan-microwave-mast-cloak");
    const ctx = recipeContext(plan, catalog);
    const rings = plan.levels.map((l) => l.recipe).filter((r): r is Recipe => r?.family === "split-ring");
    expect(rings.length).toBeGreaterThan(0);
    const f0 = plan.design.frequencyHz;
    const mu1 = plan.components.findIndex((c) => c.kind === "mu" && c.axis === "1");
    for (const r of rings) {
      const at = (f: number) => recipeAtFrequency(r, ctx, f).re[mu1];
      const design = at(f0);
      // 1 % off the design frequency moves μ' of a ring built for μ' ≈ 0.15–0.3 by far more than 1 %
      expect(Math.abs(at(1.01 * f0) - design)).toBeGreaterThan(0.05 * Math.abs(design));
      // far below resonance the rings barely respond: μ' → 1 (Lorentz form, ω ≪ ω0)
      expect(Math.abs(at(0.2 * f0) - 1)).toBeLessThan(0.1);
      // passive at every frequency: Im μ ≥ 0 (exp(−iωt))
      for (const f of [0.5 * f0, 0.9 * f0, f0, 1.1 * f0, 2 * f0]) expect(recipeAtFrequency(r, ctx, f).im[mu1]).toBeGreaterThanOrEqual(0);
    }
  }, 60_000);
});
