/**
 * A dispersive background in the sweep (backgroundAtFrequency.ts, sweepPoint.ts): the design names
 * the catalog material its device is embedded in (fixture tests/verify/fixtures/silica-graded-block.json:
 * fused silica at 193.5 THz), and at each sweep frequency every case stands in that material's ε(f),
 * the ideal and reduced maps scaled with it, the realized and drawn recipes in their own materials at f.
 *
 * Expected values: fused silica's index from Malitson's Sellmeier formula, I. H. Malitson,
 * "Interspecimen comparison of the refractive index of fused silica", J. Opt. Soc. Am. 55, 1205
 * (1965): n² − 1 = Σ B_k λ² / (λ² − C_k²), B = 0.6961663, 0.4079426, 0.8974794,
 * C = 0.0684043, 0.1162414, 9.896161 µm (λ in µm), computed here independently of the catalog.
 * The scaling of the ideal map: ε′ = J ε_b Jᵀ / det J is linear in ε_b (design brief §2), an identity.
 */
import { describe, expect, it } from "vitest";
import { join } from "node:path";
import { expectClose } from "../../helpers/close.js";
import { loadDesign } from "../../../src/io/design/loadDesign.js";
import { loadFieldForDesign } from "../../../src/io/fieldCsv.js";
import { loadMaterialCatalog } from "../../../src/io/materialCatalog.js";
import { loadProcessCatalog } from "../../../src/io/processCatalog.js";
import { planFromField } from "../../../src/plan/runPlan.js";
import { resolveSettings } from "../../../src/plan/resolveSettings.js";
import { reduceField } from "../../../src/reduce/reduceField.js";
import { InputError } from "../../../src/core/errors.js";
import { backgroundAt, checkBackgroundMaterial, scaleReducedEps } from "../../../src/verify/sweep/backgroundAtFrequency.js";
import { sweepBackground, sweepCases, type SweepContext } from "../../../src/verify/sweep/sweepPoint.js";
import { SAMPLE_BACKGROUND, SAMPLE_MEDIUM } from "../../../src/verify/scene.js";
import { SPEED_OF_LIGHT_M_PER_S as C0 } from "../../../src/core/physicalConstants.js";

const FIXTURE = join(import.meta.dirname, "..", "fixtures", "silica-graded-block.json");
const F0 = 193.5e12, F1 = 185e12, F2 = 200e12;

/** Malitson 1965 (file comment): ε = n² of fused silica at frequency f. */
function malitsonEps(frequencyHz: number): number {
  const l2 = (C0 / frequencyHz * 1e6) ** 2;
  const B = [0.6961663, 0.4079426, 0.8974794], C = [0.0684043, 0.1162414, 9.896161];
  return 1 + B.reduce((a, b, k) => a + (b * l2) / (l2 - C[k] ** 2), 0);
}

async function fixtureContext(): Promise<SweepContext> {
  const design = await loadDesign(FIXTURE, process.cwd());
  const field = await loadFieldForDesign(design);
  const catalog = await loadMaterialCatalog();
  const plan = planFromField(design, field, { materials: catalog, processes: await loadProcessCatalog() });
  const s = resolveSettings(design, {});
  const ideal = reduceField(field, { polarization: s.polarization, scheme: "full", backgroundIndex: s.backgroundIndex });
  const reduced = reduceField(field, { polarization: s.polarization, scheme: s.scheme, unitAxis: s.unitAxis, backgroundIndex: s.backgroundIndex });
  const n = reduced.settings.backgroundIndex, z = reduced.settings.backgroundImpedance;
  return {
    transform: design.transform, fieldBackground: design.background, background: { eps: n / z, mu: n * z }, polarization: s.polarization, grid: field.grid,
    ideal, reduced, plan, catalog, illumination: { kind: "plane", angleRad: 0 }, drawn: { seconds: 60 },
    backgroundDispersion: { materialId: "fused-silica-optical", designFrequencyHz: design.frequencyHz },
  };
}

describe("a dispersive background followed across the sweep (fused silica, Malitson 1965)", () => {
  it("takes the catalog's fused silica at each frequency: Malitson's ε(f) scaled to the design's index at f₀", async () => {
    const catalog = await loadMaterialCatalog();
    const d = { materialId: "fused-silica-optical", designFrequencyHz: F0 };
    for (const f of [F1, F2]) {
      const b = backgroundAt(d, catalog, f);
      // the catalog's Sellmeier row is Malitson's (C_k squared to 14 digits)
      expectClose(b.epsRe, malitsonEps(f), { rel: 1e-12, label: `Re ε at ${f / 1e12} THz` });
      expectClose(b.scale, malitsonEps(f) / malitsonEps(F0), { rel: 1e-12, label: `scale at ${f / 1e12} THz` });
      expect(b.lossTangent).toBe(0);
      expect(b.inRange).toBe(true);
    }
    // Malitson's index, 1.4440 near 1549 nm, falls with wavelength: ε higher at 200 THz than at 185 THz (normal dispersion)
    expect(backgroundAt(d, catalog, F2).scale).toBeGreaterThan(1);
    expect(backgroundAt(d, catalog, F1).scale).toBeLessThan(1);
    expect(backgroundAt(d, catalog, F0).scale).toBe(1);
  });

  it("checks the material against the design: known, a dielectric, non-magnetic, its index the background index within 1 %", async () => {
    const catalog = await loadMaterialCatalog();
    const n0 = Math.sqrt(malitsonEps(F0));
    expect(checkBackgroundMaterial("fused-silica-optical", catalog, F0, n0, "$.x", "$.y").index).toBeCloseTo(n0, 12);
    const err = (fn: () => unknown): string => { try { fn(); return ""; } catch (e) { expect(e).toBeInstanceOf(InputError); return (e as Error).message; } };
    expect(err(() => checkBackgroundMaterial("fused-silica-optcal", catalog, F0, n0, "$.x", "$.y"))).toMatch(/\$\.x: unknown material 'fused-silica-optcal'; did you mean fused-silica-optical/);
    expect(err(() => checkBackgroundMaterial("gold-optical", catalog, F0, n0, "$.x", "$.y"))).toMatch(/is a metal/);
    expect(err(() => checkBackgroundMaterial("fused-silica-optical", catalog, F0, 1.5, "$.x", "$.y"))).toMatch(/'fused-silica-optical' has index 1\.4440 at the design frequency .* the device's background index is 1\.5000 \(\$\.y\): expected them equal within 1 %/);
    // PTFE's constant model holds to 100 GHz: not at an optical frequency
    expect(err(() => checkBackgroundMaterial("ptfe", catalog, F0, 1.43, "$.x", "$.y"))).toMatch(/outside the valid range/);
  });

  it("puts every case of a sweep point in the background at f, scales the ideal and reduced maps with it, and keeps the drawn hosts in their own material at f", async () => {
    const ctx = await fixtureContext();
    const sample = new Float64Array(8);
    for (const f of [F1, F2]) {
      const s = malitsonEps(f) / malitsonEps(F0);
      const bg = sweepBackground(ctx, f);
      expectClose(bg.eps, ctx.background.eps * s, { rel: 1e-12, label: "background ε" });
      // the design's index is Malitson's at f₀ to 7 digits, so the background is Malitson's ε(f) to about 1e-7
      expectClose(bg.eps, malitsonEps(f), { rel: 2e-7, label: "background ε against Malitson" });
      expect(bg.mu).toBe(ctx.background.mu);
      const built = sweepCases(ctx, f);
      const names = built.cases.map((c) => c.name);
      expect(names).toEqual(expect.arrayContaining(["ideal", "reduced", "realized", "realized-geometry"]));
      for (const c of built.cases) if (c.scene) expect(c.scene.background, c.name).toEqual(bg);
      // the ideal map at a point inside the device: ε (Hz: the in-plane T) scaled by s, μ_zz (b) not
      const at0 = sweepCases({ ...ctx, backgroundDispersion: undefined }, f);
      const ideal = built.cases.find((c) => c.name === "ideal")!.scene!, ideal0 = at0.cases.find((c) => c.name === "ideal")!.scene!;
      const ref = new Float64Array(8);
      for (const [x, y] of [[0, 0], [0.1e-6, -0.05e-6], [0.3e-6, 0.2e-6]]) {
        expect(ideal.sample(x, y, sample)).toBe(SAMPLE_MEDIUM);
        ideal0.sample(x, y, ref);
        expectClose([sample[0], sample[2], sample[4], sample[6]], [ref[0], ref[2] * s, ref[4] * s, ref[6] * s], { rel: 1e-12, abs: 1e-15, label: `ideal at (${x}, ${y})` });
      }
      // outside the device every scene is the background
      expect(ideal.sample(2e-6, 0, sample)).toBe(SAMPLE_BACKGROUND);
      // the drawn case: a solid fused-silica cell and a silicon nitride rod's silica host are Malitson's ε(f)
      const drawn = built.cases.find((c) => c.name === "realized-geometry")!;
      expect(drawn.scene, drawn.reason ?? "").not.toBeNull();
      const plan = ctx.plan!;
      const solidCell = [...plan.level].findIndex((l) => plan.levels[l]?.recipe?.family === "solid" && plan.levels[l].recipe!.host === "fused-silica-optical");
      expect(solidCell).toBeGreaterThanOrEqual(0);
      expect(drawn.scene!.sample(plan.grid.xM[solidCell], plan.grid.yM[solidCell], sample)).toBe(SAMPLE_MEDIUM);
      expectClose(sample[2], malitsonEps(f), { rel: 1e-12, label: "drawn silica cell, ε" });
      const rodLevel = plan.levels.findIndex((l) => l.recipe?.family === "rods-in-host" && l.recipe.host === "fused-silica-optical");
      const rodCell = [...plan.level].indexOf(rodLevel);
      const a = plan.grid.pitchM;
      // a cell corner lies outside its rod (radius below a/2): the host
      drawn.scene!.sample(plan.grid.xM[rodCell] + 0.49 * a, plan.grid.yM[rodCell] + 0.49 * a, sample);
      expectClose(sample[2], malitsonEps(f), { rel: 1e-12, label: "drawn rod host, ε" });
    }
  }, 120_000);

  it("scales a reduced field's ε and its background, and leaves μ alone", async () => {
    const ctx = await fixtureContext();
    const r = scaleReducedEps(ctx.reduced, 1.02);
    expect(scaleReducedEps(ctx.reduced, 1)).toBe(ctx.reduced);
    for (const k of ctx.reduced.componentNames) {
      const want = k.startsWith("eps") ? 1.02 : 1;
      for (let c = 0; c < ctx.reduced.count; c += 7) {
        const v = ctx.reduced.components[k][c];
        if (Number.isFinite(v)) expect(r.components[k][c]).toBe(v * want);
      }
    }
    expectClose(r.settings.backgroundIndex, ctx.reduced.settings.backgroundIndex * Math.sqrt(1.02), { rel: 1e-15 });
    expectClose(r.settings.epsScale, ctx.reduced.settings.epsScale * 1.02, { rel: 1e-15 });
    expect(r.settings.muScale).toBe(ctx.reduced.settings.muScale);
  }, 60_000);
});
