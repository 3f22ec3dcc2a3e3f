import { describe, it, expect, beforeAll } from "vitest";
import { parseDesign } from "../../src/io/design/loadDesign.js";
import { computeTensorField } from "../../src/field/computeTensorField.js";
import { loadMaterialCatalog } from "../../src/io/materialCatalog.js";
import { loadProcessCatalog } from "../../src/io/processCatalog.js";
import { planFromField, type PlanCatalogs } from "../../src/plan/runPlan.js";
import { reduceField } from "../../src/reduce/reduceField.js";
import { givenBackgroundIndex } from "../../src/plan/resolveSettings.js";
import { reportMarkdown } from "../../src/plan/outputs/reportMarkdown.js";
import { significantAtLeast } from "../../src/core/formatQuantity.js";
import { readFile } from "node:fs/promises";
import { beamBendDesign } from "../helpers/beamBendDesign.js";
import type { ReducedField } from "../../src/reduce/reducedField.js";
import { createSessionServices } from "../../src/tui/sessionServices.js";
import { compareSchemes } from "../../src/reduce/schemeMetrics.js";
import { schemeTableView } from "../../src/tui/state/schemeTableView.js";
import { schemeTable } from "../../src/reduce/schemeTable.js";
import { tempDir } from "../helpers/tempDir.js";
import { writeFileSync } from "node:fs";
import { join } from "node:path";

/** The reduction's first component (Ez: ε_zz), the plan's first target column. */
const first = (r: ReducedField): Float64Array => r.components[r.componentNames[0]];

/**
 * A background index of 1 that the design or the command line gives is a background of index 1,
 * for `plan` as for `reduce` and `verify` (which reduce with `givenBackgroundIndex` too); only when
 * none is given does the reduction keep the design's own background. Before, `plan` read an index
 * of 1 as "none given", so a design with a glass background ($.background ε 2.25) and
 * `reduction.backgroundIndex: 1` was planned for the glass and verified for index 1.
 */
describe("the background index a plan reduces with", () => {
  let catalogs: PlanCatalogs;
  beforeAll(async () => {
    catalogs = { materials: await loadMaterialCatalog(), processes: await loadProcessCatalog() };
  });

  const design = async (backgroundIndex?: number) => {
    const d = beamBendDesign({ name: "glass-background bend", frequency: "10 GHz", pitch: "2 mm", materials: ["alumina-96", "air"] });
    return parseDesign({ ...d, background: { eps: 2.25, mu: 1 }, reduction: { scheme: "isotropic", ...(backgroundIndex !== undefined ? { backgroundIndex } : {}) } }, "glass.json");
  };

  it("is 1 when the design gives 1, as reduce and verify take it; the design's own background when none is given", async () => {
    const given = await design(1);
    const none = await design();
    expect(givenBackgroundIndex(given)).toBe(1);
    expect(givenBackgroundIndex(none)).toBeUndefined();
    const field = computeTensorField(given);
    const atOne = reduceField(field, { polarization: "Ez", scheme: "isotropic", backgroundIndex: 1 });
    const own = reduceField(field, { polarization: "Ez", scheme: "isotropic" });
    const planGiven = planFromField(given, field, catalogs);
    const planNone = planFromField(none, computeTensorField(none), catalogs);
    expect(planGiven.targets[0]).toEqual(first(atOne));
    expect(planNone.targets[0]).toEqual(first(own));
    // ε′ = J ε_b Jᵀ / det J is linear in the background's ε (form invariance; Ward & Pendry, J. Mod.
    // Opt. 43, 773 (1996)): the glass background's targets are 2.25 times those of index 1
    for (let c = 0; c < field.grid.count; c += 37) expect(planNone.targets[0][c] / planGiven.targets[0][c]).toBeCloseTo(2.25, 9);
  });

  it("is the command line's or session's index when one overrides the design, 1 included", async () => {
    const none = await design();
    expect(givenBackgroundIndex(none, { backgroundIndex: 1 })).toBe(1);
    const field = computeTensorField(none);
    const plan = planFromField(none, field, catalogs, { backgroundIndex: 1 });
    expect(plan.targets[0]).toEqual(first(reduceField(field, { polarization: "Ez", scheme: "isotropic", backgroundIndex: 1 })));
  });

  it("is the index the report names: the glass's 1.5 when none is given, 1 when 1 is given", async () => {
    const none = await design();
    const given = await design(1);
    const planNone = planFromField(none, computeTensorField(none), catalogs);
    const planGiven = planFromField(given, computeTensorField(given), catalogs);
    // index of the background ε 2.25, μ 1: √2.25 = 1.5
    expect(planNone.reductionBackground).toEqual({ index: 1.5, given: false });
    expect(planGiven.reductionBackground).toEqual({ index: 1, given: true });
    expect(reportMarkdown(planNone)).toContain("background index 1.5 (the design's own background; no background index given).");
    expect(reportMarkdown(planGiven)).toContain("background index 1.\n");
  });

  it("prints the smallest index that lifts every ε as a value that still does when given back as printed", async () => {
    // the sub-unity concentrator demo in the glass background: its threshold lies a hair above 1.5
    const demo = JSON.parse(await readFile("demo-designs/plan-concentrator-subunity.json", "utf8"));
    const glass = await parseDesign({ ...demo, background: { eps: 2.25, mu: 1 }, reduction: { scheme: "non-magnetic" } }, "glass-concentrator.json");
    const field = computeTensorField(glass);
    const plan = planFromField(glass, field, catalogs);
    expect(plan.minBackgroundIndex).not.toBeNull();
    const printed = Number(/a background of index ([0-9.]+) or more lifts every ε above it/.exec(reportMarkdown(plan))?.[1]);
    expect(printed).toBeGreaterThanOrEqual(plan.minBackgroundIndex!);
    expect(significantAtLeast(plan.minBackgroundIndex!, 4)).toBe(printed);
    const lifted = planFromField(glass, field, catalogs, { backgroundIndex: printed });
    expect(lifted.minBackgroundIndex).toBeNull(); // no cell left below the lowest material
    // reduce's table and the session's print the n_b min column rounded up alike (3 digits)
    const summaries = compareSchemes(field, "Hz", { backgroundIndex: 1.5 });
    const exact = summaries.find((x) => x.scheme === "non-magnetic")!.minBackgroundIndex;
    expect(exact).toBeGreaterThan(1.5); // a hair above: nearest rounding would print 1.5
    const inReduce = Number(schemeTable(summaries, { polarization: "Hz" }).rows.find((r) => r.scheme === "non-magnetic")!.cells.minIndex);
    const inSession = Number(schemeTableView("Hz", summaries).rows.find((r) => r.scheme === "non-magnetic")!.cells.at(-1));
    expect(inReduce).toBe(significantAtLeast(exact, 3));
    expect(inSession).toBe(inReduce);
    expect(inReduce).toBeGreaterThanOrEqual(exact);
  });

  it("is the index the session's scheme table reduces with, an index of 1 from the session included", async () => {
    // a magnetic background (ε 1, μ 2.25: index 1.5, impedance 1.5): the table's μ ≠ 1 cells and edge
    // reflection are not invariant under a change of it, as they are under a scaled isotropic one
    const dir = tempDir("cw-bg-schemes-");
    const path = join(dir, "magnetic.json");
    const magnetic = { ...beamBendDesign({ name: "magnetic-background bend", frequency: "10 GHz", pitch: "2 mm", materials: ["alumina-96", "air"] }), background: { eps: 1, mu: 2.25 }, reduction: { scheme: "isotropic" } };
    writeFileSync(path, JSON.stringify(magnetic));
    const services = createSessionServices({ designPath: path, cwd: dir, outDir: join(dir, "out"), sessionPath: join(dir, "out", "session.json"), useWorker: false });
    try {
      const { base } = await services.open();
      const field = computeTensorField(await parseDesign(magnetic, path));
      // the full scheme's row: cells needing ε < 1, μ ≠ 1, anisotropy, edge reflection, n_b min
      const row = (table: Awaited<ReturnType<typeof services.schemes>>) => table.rows.find((r) => r.scheme === "full")!.cells;
      const expected = (backgroundIndex?: number) => {
        const s = compareSchemes(field, "Ez", backgroundIndex === undefined ? {} : { backgroundIndex }).find((x) => x.scheme === "full")!;
        return schemeTableView("Ez", [s]).rows[0].cells;
      };
      // the session sets index 1: a background of index 1, as its plans reduce with; none: the design's
      const atOne = await services.schemes({ ...base, backgroundIndex: 1 }, { backgroundIndex: 1 });
      const own = await services.schemes(base, {});
      expect(row(atOne)).toEqual(expected(1));
      expect(row(own)).toEqual(expected(undefined));
      expect(expected(1)).not.toEqual(expected(undefined));
    } finally {
      await services.close();
    }
  });
});

describe("significantAtLeast (a threshold printed to be given back)", () => {
  it("rounds up to the digits asked, and leaves a value already at them as it is", () => {
    expect(significantAtLeast(1.50037, 4)).toBe(1.501);
    expect(significantAtLeast(1.5, 4)).toBe(1.5);
    expect(significantAtLeast(1.4996, 4)).toBe(1.5);
    expect(significantAtLeast(9.9991, 4)).toBe(10);
    expect(significantAtLeast(0.0123401, 3)).toBe(0.0124);
    expect(significantAtLeast(Infinity, 3)).toBe(Infinity);
  });
});
