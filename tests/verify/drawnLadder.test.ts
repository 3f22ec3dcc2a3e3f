/**
 * The drawn case's ladder (drawnLadder.ts) on the demo designs, costed without solving: the rod
 * lens demo draws on three grids within the time the check spends on it unasked; every other demo
 * with a realization says in one line why its drawn case is not run — the families it cannot draw,
 * or the grid with its nodes, memory and time estimates and the limit. The figures are the
 * solver's own cost model (assemble.ts solveCost, core/timeEstimate.ts), not physics: the expected
 * values here are the limits themselves.
 */
import { describe, expect, it } from "vitest";
import { loadDesign } from "../../src/io/design/loadDesign.js";
import { loadFieldForDesign } from "../../src/io/fieldCsv.js";
import { loadMaterialCatalog } from "../../src/io/materialCatalog.js";
import { loadProcessCatalog } from "../../src/io/processCatalog.js";
import { planFromField } from "../../src/plan/runPlan.js";
import { resolveSettings } from "../../src/plan/resolveSettings.js";
import { reduceField } from "../../src/reduce/reduceField.js";
import { bulkMaterials } from "../../src/verify/bulkMaterials.js";
import { deviceCases } from "../../src/verify/deviceCases.js";
import { DRAWN_ADDED_STEPS, DRAWN_STEPS, drawnLadderPlan, MAX_DRAWN_ADDED_UNKNOWNS, MAX_DRAWN_SECONDS } from "../../src/verify/drawnLadder.js";
import { expectClose } from "../helpers/close.js";

async function drawnCase(path: string) {
  const design = await loadDesign(path, process.cwd());
  const field = await loadFieldForDesign(design);
  const s = resolveSettings(design, {});
  const [materials, processes] = await Promise.all([loadMaterialCatalog(), loadProcessCatalog()]);
  const plan = planFromField(design, field, { materials, processes }, {});
  const ideal = reduceField(field, { polarization: s.polarization, scheme: "full" });
  const reduced = reduceField(field, { polarization: s.polarization, scheme: s.scheme, unitAxis: s.unitAxis });
  const background = { eps: 1, mu: 1 };
  const built = deviceCases({ transform: design.transform, fieldBackground: design.background, background, polarization: s.polarization, grid: field.grid, ideal, reduced, plan, materials: bulkMaterials(materials, design.frequencyHz, plan) });
  const drawn = built.cases.find((c) => c.name === "realized-geometry")!;
  const realized = built.cases.find((c) => c.name === "realized")!;
  const input = { polarization: s.polarization, background, frequencyHz: design.frequencyHz, deviceBox: built.deviceBox, cases: built.cases, groundYM: built.ground?.groundYM };
  return { drawn, realized, input, pitchM: field.grid.pitchM };
}

describe("the drawn ladder on the demos (costed, not solved)", () => {
  it("the rod lens demo draws every rod on three grids, 2, 3 and 4.5 steps across its smallest feature, within the time limit", async () => {
    const { drawn, realized, input, pitchM } = await drawnCase("demo-designs/plan-microwave-rod-lens.json");
    expect(drawn.scene, drawn.reason).not.toBeNull();
    const plan = drawnLadderPlan(input, realized, drawn, drawn.featureM!);
    expect(plan.reason).toBeNull();
    expect(plan.rungs.map((r) => r.stepsAcross)).toEqual([...DRAWN_STEPS]);
    expect(plan.seconds).toBeLessThan(MAX_DRAWN_SECONDS);
    // the step counts across the feature, which is at most a quarter pitch: ≥ 8 steps per pitch on the coarsest grid
    expect(pitchM / plan.rungs[0].grid.h).toBeGreaterThanOrEqual(8 - 1e-9);
    // a tighter time limit keeps the two coarsest grids; tighter still, the case says why in one line
    const two = drawnLadderPlan(input, realized, drawn, drawn.featureM!, { seconds: plan.rungs[0].seconds + plan.rungs[1].seconds + 1e-9 });
    expect(two.rungs.length).toBe(2);
    expect(two.reason).toBeNull();
    const none = drawnLadderPlan(input, realized, drawn, drawn.featureM!, { seconds: plan.rungs[0].seconds });
    expect(none.reason).toMatch(/^drawing the inclusions \(smallest feature 500 µm\) needs a ladder of at least 2 grids from 2 steps across the smallest feature; at 3 steps across it: \d+ × \d+ nodes, over the time \(about .* in all, the check spends at most .* on the drawn case; --drawn-time sets it\); it would fit with every feature about [\d.]+ times larger/);
    expect(none.reason).not.toMatch(/\n/);
  }, 60_000);

  it("a fourth, finer rung (6.75 steps) is costed for an unconverged figure: taken when it fits the time and size limits, else one line gives the --drawn-time that would let it", async () => {
    const { drawn, realized, input } = await drawnCase("demo-designs/plan-microwave-rod-lens.json");
    const plan = drawnLadderPlan(input, realized, drawn, drawn.featureM!);
    expect(plan.added, plan.addedReason ?? "").not.toBeNull();
    expect(plan.added!.stepsAcross).toBe(DRAWN_ADDED_STEPS);
    expect(plan.added!.grid.h).toBeLessThan(plan.rungs[2].grid.h);
    expectClose(plan.rungs[2].grid.h / plan.added!.grid.h, DRAWN_ADDED_STEPS / DRAWN_STEPS[2], { rel: 0.02, label: "the added rung is 1.5 times finer" });
    expect(plan.seconds + plan.added!.seconds).toBeLessThanOrEqual(MAX_DRAWN_SECONDS);
    // a time limit that holds the three planned rungs but not the fourth: no fourth, and the --drawn-time that would do
    const tight = drawnLadderPlan(input, realized, drawn, drawn.featureM!, { seconds: plan.seconds + 0.5 * plan.added!.seconds });
    expect(tight.rungs.length).toBe(3);
    expect(tight.added).toBeNull();
    const minutes = Math.ceil((plan.seconds + plan.added!.seconds) / 60);
    expect(tight.addedReason).toContain(`give --drawn-time '${minutes} min' to let the ladder go on`);
    // the fourth stays within the size limit the check adds on its own
    const fourth = plan.added!.grid.nx * plan.added!.grid.ny;
    expect(fourth).toBeLessThanOrEqual(MAX_DRAWN_ADDED_UNKNOWNS);
  }, 60_000);

  it.each([
    ["demo-designs/plan-microwave-mast-cloak.json", /^not every cell can be drawn in 2D — levels [\d, ]+: split-ring cells are resonant metal structures/],
    ["demo-designs/plan-printed-bend.json", /strut-lattice cells are 3D printed lattices/],
    ["demo-designs/plan-microwave-carpet.json", null],
    ["demo-designs/plan-silicon-chip-bend.json", null],
    ["demo-designs/plan-silicon-chip-carpet.json", null],
    ["demo-designs/plan-concentrator-subunity.json", null],
  ])("%s: either its drawn ladder fits (two grids at least, within the limits) or one line says why not", async (path, why) => {
    const { drawn, realized, input } = await drawnCase(path);
    const p = drawn.scene === null ? null : drawnLadderPlan(input, realized, drawn, drawn.featureM!);
    const reason = p ? p.reason : drawn.reason!;
    if (why) expect(reason, path).toMatch(why);
    if (reason !== null) {
      expect(reason).not.toMatch(/\n/);
      // a grid that does not fit names its nodes and the limit it is over
      if (p) expect(reason).toMatch(/\d+ × \d+ nodes, over the (memory|size|time) \(/);
    } else {
      expect(p!.rungs.length).toBeGreaterThanOrEqual(2);
      expect(p!.seconds).toBeLessThanOrEqual(MAX_DRAWN_SECONDS);
    }
  }, 60_000);
});
