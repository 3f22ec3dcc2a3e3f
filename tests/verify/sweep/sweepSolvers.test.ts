/**
 * The sweep's per-frequency plan before anything is solved: which solver each case gets (the split
 * of runCheck.ts, so the estimate costs what the check will run), the radial solver's share of the
 * estimate, the drawn case's budget (sweepDrawn.ts) and the drawn materials at another frequency
 * (bulkMaterialsAt). Costs are the project's own models (core/timeEstimate.ts), so the expected
 * values are identities: the estimate adds up the same per-case figures the solvers would be
 * costed with; no timing is asserted. The materials at f are checked against the catalog's
 * dispersion models evaluated at f (media/material.ts, whose models carry their published sources).
 */
import { describe, expect, it } from "vitest";
import { loadDesign } from "../../../src/io/design/loadDesign.js";
import { loadFieldForDesign } from "../../../src/io/fieldCsv.js";
import { loadMaterialCatalog } from "../../../src/io/materialCatalog.js";
import { loadProcessCatalog } from "../../../src/io/processCatalog.js";
import { evaluateMaterial } from "../../../src/media/material.js";
import { planFromField } from "../../../src/plan/runPlan.js";
import { resolveSettings } from "../../../src/plan/resolveSettings.js";
import { reduceField } from "../../../src/reduce/reduceField.js";
import { bulkMaterials, bulkMaterialsAt } from "../../../src/verify/bulkMaterials.js";
import { radialProblemSeconds } from "../../../src/verify/radialSolver.js";
import { solverSplit } from "../../../src/verify/runCheck.js";
import { sweepPeakBytes } from "../../../src/verify/sweep/sweepConcurrency.js";
import { sweepDrawnPlan } from "../../../src/verify/sweep/sweepDrawn.js";
import { sweepCases, type SweepContext } from "../../../src/verify/sweep/sweepPoint.js";
import { InputError } from "../../../src/core/errors.js";
import { expectClose } from "../../helpers/close.js";

async function contextOf(path: string, overrides: Partial<SweepContext> = {}): Promise<{ ctx: SweepContext; frequencyHz: number }> {
  const design = await loadDesign(path, process.cwd());
  const field = await loadFieldForDesign(design);
  const s = resolveSettings(design, {});
  const [materials, processes] = await Promise.all([loadMaterialCatalog(), loadProcessCatalog()]);
  const plan = design.realization !== undefined ? planFromField(design, field, { materials, processes }, {}) : null;
  const ideal = reduceField(field, { polarization: s.polarization, scheme: "full" });
  const reduced = reduceField(field, { polarization: s.polarization, scheme: s.scheme, unitAxis: s.unitAxis });
  const ctx: SweepContext = {
    transform: design.transform, fieldBackground: design.background, background: { eps: 1, mu: 1 }, polarization: s.polarization, grid: field.grid,
    ideal, reduced, plan, catalog: plan ? materials : [], illumination: { kind: "plane", angleRad: 0 }, ...overrides,
  };
  return { ctx, frequencyHz: design.frequencyHz };
}

describe("the sweep's solver split and its cost", () => {
  it("a radial cloak: auto costs every case on the radial solver (no grid), fdfd and --resolution put them on the grid", async () => {
    const { ctx, frequencyHz } = await contextOf("demo-designs/field-radial-cloak.json", { method: "auto" });
    const f = 1.1 * frequencyHz;
    const auto = sweepPeakBytes(ctx, f);
    expect(auto.method).toBe("radial");
    expect([auto.nodes, auto.wantedBytes, auto.drawnSeconds]).toEqual([0, 0, 0]);
    // the estimate is the radial problems' own costs, the same problems the check will solve
    const split = solverSplit({ method: "auto", transform: ctx.transform, illumination: ctx.illumination, frequencyHz: f, cases: sweepCases(ctx, f).cases });
    expect(split.gridCases).toEqual([]);
    expect(split.radial.map((p) => p.name)).toEqual(["bare", "ideal", "reduced", "realized"]);
    expectClose(auto.radialSeconds, split.radial.reduce((a, p) => a + (p.problem ? radialProblemSeconds(p.problem) : 0), 0), { rel: 1e-12 });
    expect(auto.seconds).toBe(auto.radialSeconds);
    // a larger device electrically costs more orders
    expect(sweepPeakBytes(ctx, 2 * f).radialSeconds).toBeGreaterThan(auto.radialSeconds);
    for (const grid of [sweepPeakBytes({ ...ctx, method: "fdfd" }, f), sweepPeakBytes({ ...ctx, gridOption: "--resolution" , resolution: 10 }, f)]) {
      expect(grid.method).toBe("fdfd");
      expect(grid.radialSeconds).toBe(0);
      expect(grid.nodes).toBeGreaterThan(0);
      expect(grid.wantedBytes).toBeGreaterThan(0);
    }
  });

  it("a split-ring cloak: auto puts the realized map (square cells) on the grid beside the bare object, the rest radial", async () => {
    const { ctx, frequencyHz } = await contextOf("demo-designs/plan-microwave-mast-cloak.json", { method: "auto", drawn: { seconds: 300 } });
    const c = sweepPeakBytes(ctx, frequencyHz);
    expect(c.method).toBe("radial+fdfd");
    expect(c.radialSeconds).toBeGreaterThan(0);
    expect(c.nodes).toBeGreaterThan(0);
    expect(c.drawnSeconds).toBe(0); // split rings cannot be drawn
    const split = solverSplit({ method: "auto", transform: ctx.transform, illumination: ctx.illumination, frequencyHz, cases: sweepCases(ctx, frequencyHz).cases });
    expect(split.gridCases.map((x) => x.name)).toEqual(["bare", "realized"]);
  });

  it("--method radial where it does not apply is an input error before anything is solved", async () => {
    const { ctx, frequencyHz } = await contextOf("demo-designs/plan-microwave-rod-lens.json", { method: "radial" });
    expect(() => sweepPeakBytes(ctx, frequencyHz)).toThrow(InputError);
  });
});

describe("the drawn case's budget in a sweep", () => {
  it("not swept, with the reason, where it cannot be: no realization, --drawn-time 0, --method radial, split rings", async () => {
    const cloak = await contextOf("demo-designs/field-radial-cloak.json");
    expect(sweepDrawnPlan(cloak.ctx, [9e9]).drawn).toEqual({ reason: "the design has no realization" });
    const lens = await contextOf("demo-designs/plan-microwave-rod-lens.json");
    expect(sweepDrawnPlan(lens.ctx, [10e9], 0).drawn).toEqual({ reason: "not run (--drawn-time 0)" });
    expect(sweepDrawnPlan({ ...lens.ctx, method: "radial" }, [10e9]).drawn).toMatchObject({ reason: expect.stringMatching(/--method radial/) });
    const mast = await contextOf("demo-designs/plan-microwave-mast-cloak.json");
    expect(sweepDrawnPlan(mast.ctx, [8.4e9, 8.6e9]).drawn).toMatchObject({ reason: expect.stringMatching(/split-ring cells are resonant metal structures/) });
  });

  it("the rod lens: --drawn-time is shared equally by the frequencies, and the estimate is the sum of each frequency's ladder on its share", async () => {
    const { ctx } = await contextOf("demo-designs/plan-microwave-rod-lens.json");
    const fs = [9.5e9, 10e9, 10.5e9];
    const p = sweepDrawnPlan(ctx, fs, 1800);
    expect(p.drawn).toEqual({ seconds: 600 });
    const per = fs.map((f) => sweepPeakBytes({ ...ctx, drawn: p.drawn }, f).drawnSeconds);
    for (const s of per) { expect(s).toBeGreaterThan(0); expect(s).toBeLessThanOrEqual(600); }
    expectClose(p.seconds, per.reduce((a, s) => a + s, 0), { rel: 1e-12 });
    // too small a share: not swept anywhere, with the budget that would do
    const short = sweepDrawnPlan(ctx, fs, 3).drawn;
    expect(short).toMatchObject({ reason: expect.stringMatching(/^not swept: .* more than --drawn-time \(3 s for the whole sweep, 1 s per frequency\); give --drawn-time '\d+ (s|min)' or more/) });
  });
});

describe("bulkMaterialsAt: the drawn case's materials at another frequency", () => {
  it("every catalog material through its dispersion model at f; at the design frequency the plan's own values", async () => {
    const { ctx, frequencyHz } = await contextOf("demo-designs/plan-microwave-rod-lens.json");
    const f = 1.3 * frequencyHz;
    const at = bulkMaterialsAt(ctx.catalog, f, ctx.plan!);
    // dispersive rows (Drude metal, Debye water) move with f; each equals its model at f
    for (const id of ["copper", "water", "alumina-96"]) {
      const m = ctx.catalog.find((x) => x.id === id)!;
      const v = evaluateMaterial(m, f);
      expect(at.get(id)!.eps).toEqual(v.eps);
    }
    expect(at.get("water")!.eps.re).not.toBe(bulkMaterials(ctx.catalog, frequencyHz, ctx.plan!).get("water")!.eps.re);
    expect(at.get("vacuum")).toEqual({ eps: { re: 1, im: 0 }, mu: { re: 1, im: 0 }, isMetal: false });
  });

  it("a declared layer: its core takes the layer's guided mode re-solved at f, equal to the plan's at the design frequency", async () => {
    const { ctx, frequencyHz } = await contextOf("demo-designs/plan-silicon-chip-carpet.json");
    const plan = ctx.plan!;
    const core = plan.settings.layer!.coreId;
    const here = bulkMaterialsAt(ctx.catalog, frequencyHz, plan).get(core)!.eps;
    expectClose(here.re, plan.layer!.coreEps.re, { rel: 1e-12, label: "core at the design frequency" });
    // a slab mode's effective index falls towards the cladding as the wavelength grows (Hunsperger, "Integrated Optics", ch. 2 — edition and chapter from memory)
    const lower = bulkMaterialsAt(ctx.catalog, 0.8 * frequencyHz, plan).get(core)!.eps.re;
    const bulk = evaluateMaterial(ctx.catalog.find((x) => x.id === core)!, 0.8 * frequencyHz).eps.re;
    expect(lower).toBeLessThan(here.re);
    expect(lower).toBeLessThan(bulk);
  });
});
