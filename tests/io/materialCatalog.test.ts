import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { InputError } from "../../src/core/errors.js";
import { findMaterial, loadMaterialCatalog, parseMaterialCsv, parseMaterialRows, parseParamsCell } from "../../src/io/materialCatalog.js";
import { SPEED_OF_LIGHT } from "../../src/media/dispersion/dispersionModel.js";
import { DISPERSION_MODELS } from "../../src/media/dispersion/registry.js";
import { evaluateMaterial, MATERIAL_CLASSES } from "../../src/media/material.js";
import { expectClose } from "../helpers/close.js";

const HEADER = "id,name,class,model,params,valid_min_hz,valid_max_hz,mu_r,conductivity_s_per_m,source";

function issuesOf(fn: () => unknown): { where: string; message: string }[] {
  try {
    fn();
  } catch (err) {
    if (err instanceof InputError) return err.issues;
    throw err;
  }
  throw new Error("expected an InputError");
}

describe("material catalog (catalogs/materials.csv)", () => {
  it("every row parses, has a source, a known class and at least 25 rows cover the requested materials", async () => {
    const catalog = await loadMaterialCatalog();
    expect(catalog.length).toBeGreaterThanOrEqual(25);
    const ids = catalog.map((m) => m.id);
    for (const id of ["ptfe", "hdpe", "polypropylene", "polystyrene", "pmma", "abs", "pla", "polyamide", "photopolymer-resin", "fr4", "ptfe-glass", "fused-silica", "alumina-96", "alumina-995", "sapphire-o", "titania", "barium-titanate", "silicon-hr", "germanium", "fused-silica-optical", "silicon-nir", "silicon-nitride-optical", "gold", "silver", "copper", "aluminium", "water", "air"]) {
      expect(ids, id).toContain(id);
    }
    for (const m of catalog) {
      expect(MATERIAL_CLASSES as readonly string[]).toContain(m.class);
      expect(m.source.length, m.id).toBeGreaterThan(10);
      if (m.class === "metal") expect(m.conductivitySPerM, `${m.id} DC conductivity`).toBeGreaterThan(1e7);
    }
    // all dispersion models are used by some row
    for (const model of Object.keys(DISPERSION_MODELS)) expect(catalog.some((m) => m.model === model), model).toBe(true);
  });

  it("every model evaluates finite and passive across each row's valid range (fast-check over frequencies)", async () => {
    const catalog = await loadMaterialCatalog();
    for (const m of catalog) {
      const logLo = Math.log10(m.validMinHz);
      const logHi = Math.log10(m.validMaxHz);
      fc.assert(
        fc.property(fc.double({ min: 0, max: 1, noNaN: true }), (u) => {
          const f = 10 ** (logLo + u * (logHi - logLo));
          const v = evaluateMaterial(m, Math.min(m.validMaxHz, Math.max(m.validMinHz, f)));
          expect(Number.isFinite(v.eps.re) && Number.isFinite(v.eps.im), `${m.id} finite at ${f}`).toBe(true);
          expect(v.inRange).toBe(true);
          expect(v.warning).toBeUndefined();
          // Passivity (Landau & Lifshitz, Electrodynamics of Continuous Media, §84 — from memory):
          // Im ε ≥ 0 everywhere; where the loss is negligible also d(ωε')/dω ≥ 1.
          expect(v.eps.im, `${m.id} Im ε at ${f}`).toBeGreaterThanOrEqual(0);
          if (v.eps.im <= 1e-9 * Math.abs(v.eps.re)) {
            const h = 1e-4;
            const fa = f * (1 - h);
            const fb = f * (1 + h);
            const slope = (fb * evaluateMaterial(m, fb).eps.re - fa * evaluateMaterial(m, fa).eps.re) / (fb - fa);
            expect(slope, `${m.id} d(ωε)/dω at ${f}`).toBeGreaterThanOrEqual(1 - 1e-6);
          }
        }),
        { seed: 42, numRuns: 50 },
      );
    }
  });

  it("plastics at 10 GHz match Riddle, Baker-Jarvis, Krupka, IEEE Trans. MTT 51(3), 727 (2003), table", async () => {
    const catalog = await loadMaterialCatalog();
    const table: [string, number, number][] = [
      ["ptfe", 2.05, 0.0002],
      ["hdpe", 2.37, 0.0002],
      ["polypropylene", 2.27, 0.0001],
      ["polystyrene", 2.54, 0.0005],
      ["pmma", 2.61, 0.01],
      ["abs", 2.7, 0.008],
      ["pvc", 2.71, 0.006],
      ["polyamide", 3.01, 0.02],
    ];
    for (const [id, eps, tan] of table) {
      const v = evaluateMaterial(findMaterial(catalog, id), 10e9);
      expectClose(v.eps.re, eps, { rel: 1e-12, label: `${id} ε'` });
      expectClose(v.lossTangent, tan, { rel: 1e-9, label: `${id} tan δ` });
    }
  });

  it("optical rows: fused silica n(0.5876 µm) = 1.45846 (Malitson 1965); silicon n(1.31 µm) = 3.5005 (Edwards 1980, seen) and n(1.55 µm) ≈ 3.476 (Li 1980, from memory)", async () => {
    const catalog = await loadMaterialCatalog();
    const n = (id: string, um: number) => evaluateMaterial(findMaterial(catalog, id), SPEED_OF_LIGHT / (um * 1e-6)).n.re;
    expectClose(n("fused-silica-optical", 0.5876), 1.45846, { abs: 5e-6, label: "fused silica" });
    expectClose(n("silicon-nir", 1.31), 3.5005, { abs: 5e-5, label: "Si 1.31" });
    expectClose(n("silicon-nir", 1.55), 3.476, { abs: 1e-3, label: "Si 1.55" });
    // silicon nitride near 1.55 µm ≈ 1.996 (Luke et al., Opt. Lett. 40, 4823 (2015) — from memory)
    expectClose(n("silicon-nitride-optical", 1.55), 1.996, { abs: 2e-3, label: "Si3N4 1.55" });
  });

  it("metal rows carry Ordal's Drude parameters converted from cm⁻¹ (Ordal et al., Appl. Opt. 22, 1099 (1983); 24, 4493 (1985))", async () => {
    const catalog = await loadMaterialCatalog();
    const cm1 = (x: number) => x * 100 * SPEED_OF_LIGHT;
    const ordal: [string, number, number][] = [["gold", 72800, 215], ["silver", 72700, 145], ["copper", 59600, 73.2], ["aluminium", 119000, 660]];
    for (const [id, wp, wt] of ordal) {
      const m = findMaterial(catalog, id);
      expectClose(m.params.plasma_hz, cm1(wp), { rel: 1e-12, label: `${id} ω_p` });
      expectClose(m.params.gamma_hz, cm1(wt), { rel: 1e-12, label: `${id} ω_τ` });
    }
  });

  it("water row at 25 °C: static permittivity ≈ 78.4 at 1 MHz (Kaatze 1989)", async () => {
    const catalog = await loadMaterialCatalog();
    expectClose(evaluateMaterial(findMaterial(catalog, "water"), 1e6).eps.re, 78.4, { abs: 0.05 });
  });

  it("findMaterial suggests the closest ids for an unknown one", async () => {
    const catalog = await loadMaterialCatalog();
    const issues = issuesOf(() => findMaterial(catalog, "ptf"));
    expect(issues[0].message).toMatch(/unknown material 'ptf'; did you mean ptfe/);
    expect(issues[0].where).toBe("material");
    expect(findMaterial(catalog, "gold").class).toBe("metal");
  });

  it("loadMaterialCatalog is cached", async () => {
    expect(await loadMaterialCatalog()).toBe(await loadMaterialCatalog());
  });
});

describe("parseMaterialRows / parseMaterialCsv", () => {
  const good = "ptfe,PTFE,polymer,constant,eps_r=2.05; tan_delta=0.0002,1e8,1e11,,,common practice";

  it("parses a good row with unit-converted parameters", () => {
    const [m] = parseMaterialCsv(`${HEADER}\n${good}\n`, "materials.csv");
    expect(m).toMatchObject({ id: "ptfe", class: "polymer", model: "constant", validMinHz: 1e8, validMaxHz: 1e11 });
    expect(m.conductivitySPerM).toBeUndefined();
    const p = parseParamsCell("eps_inf=1; plasma_cm1=1; gamma_thz=2");
    expect(p.problems).toEqual([]);
    expectClose(p.params.plasma_hz, SPEED_OF_LIGHT * 100, { rel: 1e-15 });
    expectClose(p.params.gamma_hz, 2e12, { rel: 1e-15 });
  });

  it("names file:line:column for every bad cell, all at once", () => {
    const text = [
      HEADER,
      good,
      "bad id,PTFE,plastic,constant,eps_r=2.05; tan_delta=0.0002,1e8,1e11,,,x",
      "ptfe,PTFE,polymer,constant,eps_r=2.05; tan_delt=0.0002,1e8,1e11,,,x",
      "w,water,liquid,debye,eps_s=2; eps_inf=5; tau_s=1e-11,1e6,1e9,,,x",
      "q,quartz,glass,constnt,eps_r=3,1e6,1e9,,,x",
      "r,r,glass,constant,eps_r=3; tan_delta=0,1e9,1e6,,,",
      "s,s,glass,constant,eps_r=abc; tan_delta=0,0,1e6,-1,-2,x",
    ].join("\n");
    const issues = issuesOf(() => parseMaterialCsv(text, "materials.csv"));
    const where = issues.map((i) => `${i.where} ${i.message}`);
    expect(where).toContainEqual(expect.stringMatching(/^materials\.csv:3:1 expected a lower-case id/));
    // no class is a near spelling of 'plastic' (core/didYouMean.ts): the short list is given whole, nothing unrelated is suggested
    expect(where).toContainEqual("materials.csv:3:3 unknown class 'plastic'; expected one of polymer, resin, laminate, glass, ceramic, semiconductor, metal, liquid, gas");
    expect(where).toContainEqual(expect.stringMatching(/^materials\.csv:4:1 duplicate id 'ptfe' \(first on line 2\)/));
    expect(where).toContainEqual(expect.stringMatching(/^materials\.csv:4:5 unknown parameter 'tan_delt'.*did you mean tan_delta/));
    expect(where).toContainEqual(expect.stringMatching(/^materials\.csv:5:5 eps_s must be ≥ eps_inf/));
    expect(where).toContainEqual(expect.stringMatching(/^materials\.csv:6:4 unknown dispersion model 'constnt'; did you mean constant/));
    expect(where).toContainEqual(expect.stringMatching(/^materials\.csv:7:7 expected more than valid_min_hz/));
    expect(where).toContainEqual(expect.stringMatching(/^materials\.csv:7:10 expected a source/));
    expect(where).toContainEqual(expect.stringMatching(/^materials\.csv:8:5 eps_r: expected a finite number, got 'abc'/));
    expect(where).toContainEqual(expect.stringMatching(/^materials\.csv:8:6 expected a frequency > 0 Hz/));
    expect(where).toContainEqual(expect.stringMatching(/^materials\.csv:8:8 expected a relative permeability > 0/));
    expect(where).toContainEqual(expect.stringMatching(/^materials\.csv:8:9 expected a conductivity ≥ 0/));
  });

  it("rejects an active model found by evaluation inside the range", () => {
    // a Lorentz pole with negative damping is caught by the sign rule; an active Drude needs γ < 0
    const issues = issuesOf(() => parseMaterialRows([HEADER.split(","), ["m", "m", "metal", "drude", "eps_inf=1; plasma_hz=1e15; gamma_hz=-1e12", "1e6", "1e14", "", "", "x"]], "t.csv"));
    expect(issues[0].where).toBe("t.csv:2:5");
    expect(issues[0].message).toMatch(/gamma_hz must be ≥ 0/);
  });

  it("header problems: unknown and missing columns", () => {
    const issues = issuesOf(() => parseMaterialRows([["id", "name", "klass"]], "t.csv"));
    expect(issues.map((i) => i.message).join("\n")).toMatch(/unknown column 'klass'; did you mean class/);
    expect(issues.map((i) => i.message).join("\n")).toMatch(/missing column 'source'/);
    expect(issuesOf(() => parseMaterialRows([], "t.csv"))[0].message).toMatch(/header/);
  });

  it("a row with the wrong number of cells names its line", () => {
    const issues = issuesOf(() => parseMaterialCsv(`${HEADER}\nptfe,PTFE,polymer\n`, "materials.csv"));
    expect(issues[0]).toEqual({ where: "materials.csv:2:1", message: "expected 10 columns, got 3" });
  });
});
