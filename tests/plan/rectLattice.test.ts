/**
 * Rect lattices in plans (realization.lattice "rect"): the recipe search, the recipe's values
 * against the family's solved values, and the drawing (m × n holes per cell, read back from the
 * DXF with dxf-parser, an independent npm reader).
 */
import { beforeAll, describe, expect, it } from "vitest";
import { readFile } from "node:fs/promises";
import { join } from "node:path";
import { parse } from "csv-parse/sync";
import * as dxfParserModule from "dxf-parser";
import { runCli } from "../../src/cli/run.js";
import { bufferIo } from "../../src/cli/cliIo.js";
import { complex } from "../../src/core/complex.js";
import { holesInSlab } from "../../src/cells/families/holesInSlab.js";
import { rectTiling } from "../../src/cells/lattice.js";
import { rectTableReady } from "../../src/cells/homogenize/rectCircleTable.js";
import { loadMaterialCatalog } from "../../src/io/materialCatalog.js";
import { parseDesign } from "../../src/io/design/loadDesign.js";
import { CELL_FAMILIES } from "../../src/cells/registry.js";
import { evaluateMaterials } from "../../src/plan/runPlan.js";
import { levelCandidates } from "../../src/plan/match/levelCandidates.js";
import type { MatchContext } from "../../src/plan/match/matchContext.js";
import type { TargetComponent } from "../../src/plan/planTypes.js";
import type { Material } from "../../src/media/material.js";
import { expectClose } from "../helpers/close.js";
import { tempDir } from "../helpers/tempDir.js";

const DxfParser = ((dxfParserModule as unknown as { DxfParser?: unknown }).DxfParser ?? (dxfParserModule as unknown as { default: unknown }).default) as typeof dxfParserModule.DxfParser;

const HZ: TargetComponent[] = [
  { name: "mu_z", kind: "mu", axis: "z", constant: true },
  { name: "eps_1", kind: "eps", axis: "1", constant: false },
  { name: "eps_2", kind: "eps", axis: "2", constant: false },
];

let materials: Material[];
beforeAll(async () => { materials = await loadMaterialCatalog(); });

function ctx(ids: string[], over: Partial<MatchContext> = {}): MatchContext {
  return {
    polarization: "Hz", components: HZ, pitchM: 0.8e-3, frequencyHz: 10e9, tolerance: 0.1,
    materials: evaluateMaterials(materials, ids, 10e9), materialsChosen: true,
    families: CELL_FAMILIES.filter((f) => f.id === "holes-in-slab"), lattice: "rect",
    aspects: [1, 1 / 2, 2, 2 / 3, 3 / 2], rectTables: { left: 6 }, process: null, bandwidth: null, ...over,
  };
}

describe("rect lattices in the recipe search", () => {
  it("tilings: b/a = m/n with m, n ≤ 4 in lowest terms; others refused", () => {
    expect(rectTiling(2 / 3)).toEqual({ m: 2, n: 3 });
    expect(rectTiling(0.5)).toEqual({ m: 1, n: 2 });
    expect(rectTiling(1)).toEqual({ m: 1, n: 1 });
    expect(rectTiling(2.5)).toBeNull();
  });

  it("an isotropic target meets the square lattice (aspect 1) and solves no other table", () => {
    const c = ctx(["alumina-995", "air"]);
    const s = levelCandidates([1, 4.5, 4.5], c);
    const rect = s.candidates.filter((x) => x.family === "holes-in-slab");
    expect(rect.length).toBeGreaterThan(0);
    for (const r of rect) expect(r.aspect).toBe(1);
    expect(c.rectTables!.left).toBe(6);
    expect(rectTableReady(1.00054 / 9.8, 2)).toBe(false);
  });

  it("an anisotropic target gets aspects ≠ 1 whose values are the family's solved values at p/m", () => {
    const c = ctx(["alumina-96", "air"]);
    const s = levelCandidates([1, 4, 4.9], c);
    const rect = s.candidates.filter((x) => x.family === "holes-in-slab" && x.aspect !== 1);
    expect(rect.length).toBeGreaterThan(0);
    const sq = s.candidates.find((x) => x.family === "holes-in-slab" && x.aspect === 1)!;
    const best = rect.reduce((a, b) => (a.relError < b.relError ? a : b));
    expect(best.relError).toBeLessThan(sq.relError);
    const t = rectTiling(best.aspect!)!;
    expectClose(best.dimensions.spacing1_m, 0.8e-3 / t.m, { rel: 1e-12, label: "spacing along axis 1" });
    expectClose(best.dimensions.spacing2_m, 0.8e-3 / t.n, { rel: 1e-12, label: "spacing along axis 2" });
    const [host, air] = evaluateMaterials(materials, ["alumina-96", "air"], 10e9).map((m) => m.eps);
    const e = holesInSlab.effectivePermittivity(host, air, best.fillFraction, "rect", { aspect: best.aspect });
    expectClose(best.achieved[1], e.perpendicular.re, { rel: 1e-12, label: "eps_1 = along the lattice's x" });
    expectClose(best.achieved[2], e.perpendicularY!.re, { rel: 1e-12, label: "eps_2 = along the lattice's y" });
    // aspects R and 1/R share one table: at most three new tables for five aspects
    expect(c.rectTables!.left).toBeGreaterThanOrEqual(6 - 2);
  });

  it("a spent table budget is a counted refusal, not a silent skip", () => {
    const c = ctx(["alumina-995", "air"], { rectTables: { left: 0 }, aspects: [1, 3, 1 / 3] });
    const s = levelCandidates([1, 4, 5.5], c);
    expect([...s.refusals.keys()].some((k) => k.includes("fill tables are spent"))).toBe(true);
    expect(s.candidates.every((x) => x.aspect === undefined || x.aspect === 1)).toBe(true);
  });

  it("the design file: aspect must tile the cell and needs lattice rect", async () => {
    const base = { name: "t", frequency: "10 GHz", transform: { kind: "beam-shifter", length: "5 mm", height: "5 mm", shift: "1 mm" }, grid: { pitch: "1 mm" } };
    const ok = await parseDesign({ ...base, realization: { lattice: "rect", aspect: 1.5 } }, "d.json");
    expect(ok.realization?.aspect).toBe(1.5);
    await expect(parseDesign({ ...base, realization: { lattice: "rect", aspect: 2.5 } }, "d.json")).rejects.toThrow(/realization\.aspect.*m\/n/s);
    await expect(parseDesign({ ...base, realization: { lattice: "square", aspect: 2 } }, "d.json")).rejects.toThrow(/realization\.aspect.*rect/s);
  });
});

describe("plan with realization.lattice rect (tests/io/layout-fixtures/rect-holes.json)", () => {
  it("exit 0; a rect level of m × n holes per cell in the DXF, drawn fraction = fill", async () => {
    const out = tempDir("cw-rect-");
    const io = bufferIo();
    const code = await runCli(["plan", "tests/io/layout-fixtures/rect-holes.json", "--out", out, "--layout", "--json"], io);
    expect(code).toBe(0);
    expect(io.err()).toContain("largest misalignment 0°");
    const levels: Record<string, string>[] = parse(await readFile(join(out, "levels.csv"), "utf8"), { columns: true });
    const rows: Record<string, string>[] = parse(await readFile(join(out, "build-list.csv"), "utf8"), { columns: true });
    const aniso = levels.find((l) => Number(l.spacing1_mm) !== Number(l.spacing2_mm));
    expect(aniso, "a level with a rect lattice of aspect ≠ 1").toBeDefined();
    expect(aniso!.lattice).toBe("rect");
    const m = Math.round(0.8 / Number(aniso!.spacing1_mm)), n = Math.round(0.8 / Number(aniso!.spacing2_mm));
    const dxf = new DxfParser().parseSync(await readFile(join(out, "layout.dxf"), "utf8"))!;
    const polys = (dxf.entities as unknown as { type: string; layer: string; vertices: { x: number; y: number }[] }[]).filter((e) => e.type === "LWPOLYLINE" && e.layer === `LEVEL_${aniso!.level}`);
    const cells = rows.filter((r) => r.level === aniso!.level);
    expect(polys.length).toBe(m * n * cells.length);
    let area = 0;
    for (const p of polys) {
      let s = 0;
      const v = p.vertices;
      for (let k = 0; k < v.length; k++) { const j = (k + 1) % v.length; s += v[k].x * v[j].y - v[j].x * v[k].y; }
      area += Math.abs(s) / 2;
    }
    // m·n circles of πr² in a p² cell: m·n·πr²/p² = πr²/(ab) = the fill (a = p/m, b = p/n)
    expectClose(area / (cells.length * 0.8 * 0.8), Number(aniso!.fill_fraction), { rel: 1e-6, label: "drawn area fraction" });
    // the rows of holes run along the denser spacing: along y here (eps_2 > eps_1 lies along y)
    const xs = new Set(polys.map((p) => p.vertices.reduce((s, q) => s + q.x, 0) / p.vertices.length).map((x) => x.toFixed(4)));
    const ys = new Set(polys.map((p) => p.vertices.reduce((s, q) => s + q.y, 0) / p.vertices.length).map((y) => y.toFixed(4)));
    expect(xs.size * ys.size).toBeGreaterThanOrEqual(polys.length);
  }, 180_000);
});
