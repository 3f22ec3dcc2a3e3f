/**
 * `cellwright verify` on a small rect-lattice design (tests/verify/fixtures/rect-holes-drawn.json, a
 * scenario of our own: 45 cells of air holes in alumina on rect lattices of aspect 1/2, Hz, in a
 * background of index 2.5): the drawn realized case runs (geometryScene.ts draws the holes two per
 * cell, as the layout files do) and agrees with the homogenized realized map within its stated
 * uncertainty plus the difference the homogenized recipes themselves allow.
 *
 * That allowance: each rect recipe's value comes from the solved cell table (rectCircleTable.ts),
 * whose stated error (the recipe's `spread`, model_uncertainty in levels.csv: 3.4e-3 here, the
 * table's envelope at contrast 9.6, itself calibrated on Perrins, McKenzie & McPhedran, Proc. R. Soc.
 * Lond. A 369, 207 (1979)) becomes an error of σ through the device's sensitivity, measured below on
 * the homogenized map: the device (ε 5.8–7.1) stands in a background of ε 6.25, so its scattering
 * comes from a small contrast and 0.34 % of ε moves σ by about 7 %.
 * Measured (session 7, --resolution 8 for the main cases, the drawn ladder 2, 3, 4.5 steps across
 * the 92 µm wall): (σ_geometry − σ_realized)/σ_larger per grid −0.046, −0.030, −0.026, extrapolated
 * at first order −0.017 ± 0.025 (not converged at 2 %: exit 2), σ ratio 0.952, 0.969, 0.974 →
 * −1.7 % ± 2.7 %; the table's allowance ±7 %. So the drawing and the homogenized map agree within
 * the ladder's own uncertainty; the ±7 % is what the recipes' values could explain beyond it.
 */
import { describe, expect, it } from "vitest";
import { join } from "node:path";
import { cliInTempDir } from "../helpers/cliInTempDir.js";
import { loadDesign } from "../../src/io/design/loadDesign.js";
import { loadFieldForDesign } from "../../src/io/fieldCsv.js";
import { loadMaterialCatalog } from "../../src/io/materialCatalog.js";
import { loadProcessCatalog } from "../../src/io/processCatalog.js";
import { planFromField } from "../../src/plan/runPlan.js";
import type { Plan } from "../../src/plan/planTypes.js";
import { deviceScene } from "../../src/verify/deviceScene.js";
import { mapFromPlan } from "../../src/verify/materialMap.js";
import { verifyDevice } from "../../src/verify/verifyDevice.js";

const FIXTURE = join(import.meta.dirname, "..", "verify", "fixtures", "rect-holes-drawn.json");
const cli = cliInTempDir("verify", "cw-verify-drawn-rect-");

/** Relative change of the homogenized map's σ when every recipe's in-plane values move by their stated error (one grid). */
async function tableAllowance(): Promise<{ allowance: number; spread: number }> {
  const design = await loadDesign(FIXTURE, process.cwd());
  const plan = planFromField(design, await loadFieldForDesign(design), { materials: await loadMaterialCatalog(), processes: await loadProcessCatalog() });
  const nb = design.reduction!.backgroundIndex!, bg = { eps: nb * nb, mu: 1 };
  const moved = (k: number): Plan => ({ ...plan, levels: plan.levels.map((l) => (l.recipe ? { ...l, recipe: { ...l.recipe, achieved: l.recipe.achieved.map((v, i) => (i === 0 ? v : v * (1 + k * l.recipe!.spread))) } } : l)) });
  const scene = (p: Plan) => deviceScene(p.grid, "Hz", bg, mapFromPlan(p, { b: 1, t: bg.eps }), null);
  const g = plan.grid, a = g.pitchM;
  const box = { minX: g.originXM - a, maxX: g.originXM + g.nx * a, minY: g.originYM - a, maxY: g.originYM + g.ny * a };
  const r = verifyDevice({
    polarization: "Hz", background: bg, frequencyHz: design.frequencyHz, deviceBox: box, resolution: 12,
    cases: [{ name: "realized", scene: scene(plan), indexHint: 2.7 }, { name: "ideal", scene: scene(moved(1)), indexHint: 2.7 }, { name: "reduced", scene: scene(moved(-1)), indexHint: 2.7 }],
  });
  const [s0, up, down] = r.cases.map((c) => c.scatteringWidthM!);
  return { allowance: Math.max(Math.abs(up / s0 - 1), Math.abs(down / s0 - 1)), spread: Math.max(...plan.levels.map((l) => l.recipe?.spread ?? 0)) };
}

describe("verify: the drawn realized case of a rect-lattice design", () => {
  it("draws the rect holes as the layout files do and agrees with the homogenized map within the stated uncertainty plus the recipes' own error", async () => {
    const r = await cli.run([FIXTURE, "--resolution", "8", "--json"]);
    expect([0, 2], r.err).toContain(r.code);
    const s = JSON.parse(r.out);
    const geo = s.cases.find((c: { name: string }) => c.name === "realized-geometry");
    expect(geo.available, geo.reason).toBe(true);
    expect(r.err).toMatch(/rect-lattice recipes \(levels 1 \(1 × 2\), 2 \(1 × 2\) per cell\) are drawn m × n discs per cell .*: 90 discs in 45 cells; largest turn from the principal axes 0°/);
    const e = s.homogenizationError;
    // not converged on 2, 3, 4.5 steps (−0.017 ± 0.025), so the ladder went on to a fourth grid (drawnLadder.ts DRAWN_ADDED_STEPS)
    expect(e.stepsAcrossFeature).toEqual([2, 3, 4.5, 6.75]);
    expect(r.err).toMatch(/a fourth grid, \d+ × \d+ nodes, about .* more if the three leave the figure unconverged/);
    expect(e.differenceScale).toBe("larger-width");
    // the drawing converges toward the homogenized map: each finer grid's difference smaller
    for (let k = 1; k < e.differences.length; k++) expect(Math.abs(e.differences[k])).toBeLessThan(Math.abs(e.differences[k - 1]));
    const { allowance, spread } = await tableAllowance();
    expect(spread).toBeGreaterThan(1e-3);
    expect(spread).toBeLessThan(1e-2);
    expect(allowance).toBeGreaterThan(0.03); // measured 0.07: a device in a near-equal background is sensitive
    expect(allowance).toBeLessThan(0.12);
    // the contract: the drawn and homogenized widths agree within the stated uncertainty plus the recipes' own error
    expect(Math.abs(e.relative), JSON.stringify(e)).toBeLessThan(e.uncertainty + allowance);
    expect(Math.abs(e.difference), JSON.stringify(e)).toBeLessThan(e.differenceUncertainty + allowance);
    // and here within the uncertainty alone (measured −0.014 ± 0.023 on four grids)
    expect(Math.abs(e.difference), JSON.stringify(e)).toBeLessThan(e.differenceUncertainty);
    expect(r.code).toBe(s.converged ? 0 : 2);
  }, 300_000);
});
