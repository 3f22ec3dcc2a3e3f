import { describe, it, expect } from "vitest";
import { readdir, writeFile, readFile } from "node:fs/promises";
import { join } from "node:path";
import { runCli, EXIT_INPUT, EXIT_NOT_BUILDABLE } from "../../src/cli/run.js";
import { bufferIo } from "../../src/cli/cliIo.js";
import { loadDesign } from "../../src/io/design/loadDesign.js";
import { loadFieldForDesign } from "../../src/io/fieldCsv.js";
import { loadMaterialCatalog } from "../../src/io/materialCatalog.js";
import { loadProcessCatalog } from "../../src/io/processCatalog.js";
import { planFromField } from "../../src/plan/runPlan.js";
import { writePlanOutputs } from "../../src/io/planOutputs.js";
import { tempDir } from "../helpers/tempDir.js";
import { beamBendDesign } from "../helpers/beamBendDesign.js";

async function designFile(dir: string, body: object): Promise<string> {
  const p = join(dir, "design.json");
  await writeFile(p, JSON.stringify(body));
  return p;
}

const bend = beamBendDesign({ name: "bad-input check", frequency: "2.5 GHz", pitch: "6 mm" });

describe("plan with bad or impossible input", () => {
  it("refuses a 3D device, even its z = 0 slice (not invariant along z), and writes nothing", async () => {
    const dir = tempDir("cw-bad-");
    const out = join(dir, "out");
    for (const grid of [{ pitch: "5 mm" }, { pitch: "2.5 mm", slice: true }]) {
      const p = await designFile(dir, { name: "sphere", frequency: "8 GHz", transform: { kind: "spherical-cloak", innerRadius: "15 mm", outerRadius: "35 mm" }, grid });
      const io = bufferIo();
      expect(await runCli(["plan", p, "--out", out], io)).toBe(EXIT_INPUT);
      expect(io.err()).toContain("2D devices");
      await expect(readdir(out)).rejects.toThrow();
    }
  });

  it("still writes a complete report when no recipe is feasible anywhere (exit 2)", async () => {
    const dir = tempDir("cw-bad-");
    // PTFE (ε' 2.05) with air cannot reach ε ≥ 2.05·1.05 … the targets here are 1.49–1.88, so
    // ask for a pair that brackets none of them: alumina (9.4) and titania (100)
    const p = await designFile(dir, { ...bend, realization: { materials: ["alumina-96", "titania"], families: ["rods-in-host"] } });
    const out = join(dir, "out");
    const io = bufferIo();
    expect(await runCli(["plan", p, "--out", out], io)).toBe(EXIT_NOT_BUILDABLE);
    expect((await readdir(out)).sort()).toEqual(["build-list.csv", "levels.csv", "manifest.json", "maps.svg", "report.md", "summary.json"]);
    const report = await readFile(join(out, "report.md"), "utf8");
    expect(report).toContain("Not buildable as asked");
    expect(report).toContain("| norecipe |");
    const summary = JSON.parse(await readFile(join(out, "summary.json"), "utf8"));
    expect(summary.flags.norecipe).toBe(summary.cells);
    expect(summary.buildable).toBe(false);
  }, 30_000);

  it("refuses an empty device region (exit 1, nothing written)", async () => {
    const dir = tempDir("cw-bad-");
    // a 0.2 mm thin shell sampled every 10 mm: no cell centre falls inside it
    const p = await designFile(dir, { ...bend, transform: { kind: "radial-cloak", innerRadius: "20.05 mm", outerRadius: "20.25 mm", profile: "linear" }, grid: { pitch: "10 mm" } });
    const out = join(dir, "out");
    const io = bufferIo();
    expect(await runCli(["plan", p, "--out", out], io)).toBe(EXIT_INPUT);
    expect(io.err()).toMatch(/cell/);
    await expect(readdir(out)).rejects.toThrow();
  }, 30_000);

  it("leaves no partial output when interrupted", async () => {
    const dir = tempDir("cw-bad-");
    const p = await designFile(dir, { ...bend, realization: { materials: ["photopolymer-resin", "air"], families: ["strut-lattice"] } });
    const design = await loadDesign(p);
    const plan = planFromField(design, await loadFieldForDesign(design), { materials: await loadMaterialCatalog(), processes: await loadProcessCatalog() });
    const out = join(dir, "out");
    const controller = new AbortController();
    const pending = writePlanOutputs(plan, out, { signal: controller.signal });
    controller.abort();
    await expect(pending).rejects.toThrow(/interrupted/);
    expect(await readdir(out)).toEqual([]);
    // and a plan whose data break half-way through the build list
    const broken = { ...plan, flags: new Proxy(plan.flags, { get: (t, k) => (k === "40" ? (() => { throw new Error("disk gone"); })() : Reflect.get(t, k)) }) };
    await expect(writePlanOutputs(broken as typeof plan, out)).rejects.toThrow();
    expect(await readdir(out)).toEqual([]);
  }, 30_000);

  it("rejects unknown realization keys with a suggestion", async () => {
    const dir = tempDir("cw-bad-");
    const p = await designFile(dir, { ...bend, realization: { levles: 4 } });
    const io = bufferIo();
    expect(await runCli(["plan", p, "--out", join(dir, "out")], io)).toBe(EXIT_INPUT);
    expect(io.err()).toContain("did you mean levels");
  });

  it("rejects unknown material ids with a suggestion", async () => {
    const dir = tempDir("cw-bad-");
    const p = await designFile(dir, { ...bend, realization: { materials: ["ptfee"] } });
    const io = bufferIo();
    expect(await runCli(["plan", p, "--out", join(dir, "out")], io)).toBe(EXIT_INPUT);
    expect(io.err()).toMatch(/unknown material 'ptfee'; did you mean .*ptfe/);
  });
});
