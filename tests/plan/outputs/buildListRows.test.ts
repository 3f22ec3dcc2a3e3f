import { describe, it, expect, beforeAll } from "vitest";
import { parseDesign } from "../../../src/io/design/loadDesign.js";
import { computeTensorField } from "../../../src/field/computeTensorField.js";
import { loadMaterialCatalog } from "../../../src/io/materialCatalog.js";
import { loadProcessCatalog } from "../../../src/io/processCatalog.js";
import { planFromField } from "../../../src/plan/runPlan.js";
import { emitBuildList, type BuildListTextLimits } from "../../../src/plan/outputs/buildListRows.js";
import { makeTextPool, poolText } from "../../../src/plan/outputs/textPool.js";
import { flagList } from "../../../src/plan/flags.js";
import type { Plan } from "../../../src/plan/planTypes.js";
import { beamBendDesign } from "../../helpers/beamBendDesign.js";

/** The build list as one string. */
async function buildList(plan: Plan, limits?: BuildListTextLimits): Promise<string> {
  const parts: Buffer[] = [];
  await emitBuildList(plan, (chunk) => { parts.push(Buffer.from(chunk)); }, limits);
  return Buffer.concat(parts).toString("utf8");
}

/** Every text written in parts: no region text, no row end made once. */
const IN_PARTS: BuildListTextLimits = { regions: 0, tails: 0 };

describe("build list rows: texts made once and the same bytes written in parts", () => {
  let plan: Plan;
  beforeAll(async () => {
    const design = await parseDesign(beamBendDesign({ name: "rows bend", frequency: "28 GHz", pitch: "0.8 mm", materials: ["photopolymer-resin", "air"] }), "rows.json");
    plan = planFromField(design, computeTensorField(design), { materials: await loadMaterialCatalog(), processes: await loadProcessCatalog() });
  });

  it("writes the region with its level, and the recipe with the flags, as the columns written one by one", async () => {
    expect(plan.grid.count).toBeGreaterThan(1000);
    expect(plan.regions.length).toBeGreaterThan(1);
    const whole = await buildList(plan);
    expect(await buildList(plan, IN_PARTS)).toBe(whole);
    // and the columns say what the plan holds, cell by cell
    const lines = whole.trimEnd().split("\n");
    const head = lines[0].split(",");
    const col = (name: string) => head.indexOf(name);
    expect(lines.length).toBe(plan.grid.count + 1);
    for (let c = 0; c < plan.grid.count; c += 97) {
      const row = lines[c + 1].split(",");
      expect(row.length).toBe(head.length);
      expect(row[col("region")]).toBe(String(plan.region[c] + 1));
      expect(row[col("level")]).toBe(plan.level[c] >= 0 ? String(plan.level[c] + 1) : "");
      expect(row[col("flags")]).toBe(flagList(plan.flags[c]));
    }
  });

  it("still writes each cell's own level when a cell's level is not its region's", async () => {
    const level = plan.level.slice();
    const c = plan.level.findIndex((l) => l >= 1);
    level[c] = level[c] - 1;
    const edited = { ...plan, level };
    const text = await buildList(edited);
    expect(await buildList(edited, IN_PARTS)).toBe(text);
    const lines = text.split("\n");
    const head = lines[0].split(",");
    expect(lines[c + 1].split(",")[head.indexOf("level")]).toBe(String(level[c] + 1));
    expect(lines[c + 1].split(",")[head.indexOf("region")]).toBe(String(plan.region[c] + 1));
  });

  it("writes many flag masks with the same bytes, whether the row ends are made once or in parts", async () => {
    // cells with up to 4096 masks of the low flag bits: (levels + 1) × masks passes the default limit
    const flags = new Uint16Array(plan.flags.length);
    for (let c = 0; c < flags.length; c++) flags[c] = (c * 2654435761) % 4096;
    const edited = { ...plan, flags };
    const text = await buildList(edited);
    expect(await buildList(edited, { regions: 1 << 16, tails: 1 << 30 })).toBe(text);
    expect(await buildList(edited, IN_PARTS)).toBe(text);
    const lines = text.split("\n");
    const head = lines[0].split(",");
    for (let c = 0; c < flags.length; c += 211) expect(lines[c + 1].split(",").slice(head.length - 1).join(",")).toBe(flagList(flags[c]));
  });
});

describe("text pool", () => {
  it("gives back every text's bytes, each starting on an 8-byte word", () => {
    const enc = new TextEncoder();
    const texts = ["", "a", "12345678", "123456789", "laminate,hdpe,air,cubic,along_z,0.175708,\n"].map((t) => enc.encode(t));
    const pool = makeTextPool(texts);
    texts.forEach((t, id) => {
      expect(Buffer.from(poolText(pool, id)).equals(Buffer.from(t))).toBe(true);
      expect(pool.start[id]).toBeGreaterThanOrEqual(id === 0 ? 0 : pool.start[id - 1] + Math.ceil(texts[id - 1].length / 8));
    });
  });

  it("refuses bytes that could make a word a NaN pattern (DEL, non-ASCII)", () => {
    expect(() => makeTextPool([new Uint8Array([0x61, 0x7f])])).toThrow(/byte 127/);
    expect(() => makeTextPool([new TextEncoder().encode("µm")])).toThrow(/outside printable ASCII/);
  });
});
