import { describe, it, expect } from "vitest";
import { readFile } from "node:fs/promises";
import { join } from "node:path";
import { parseDesign } from "../../src/io/design/loadDesign.js";
import { computeTensorField } from "../../src/field/computeTensorField.js";
import { loadMaterialCatalog } from "../../src/io/materialCatalog.js";
import { loadProcessCatalog } from "../../src/io/processCatalog.js";
import { planFromField } from "../../src/plan/runPlan.js";
import { writePlanOutputs } from "../../src/io/planOutputs.js";
import { BUILD_LIST_CHUNK_BYTES, emitBuildList } from "../../src/plan/outputs/buildListRows.js";
import { beamBendDesign } from "../helpers/beamBendDesign.js";
import { tempDir } from "../helpers/tempDir.js";

describe("build list on disk", () => {
  it("holds exactly the bytes the rows were made of, over many reused chunk buffers", async () => {
    // the printed bend demo at a 0.25 mm pitch: about 3.5 × 10⁴ cells, several 1 MB chunks
    const design = await parseDesign(beamBendDesign({ name: "chunked bend", frequency: "28 GHz", pitch: "0.25 mm", materials: ["photopolymer-resin", "air"] }), "chunked.json");
    const plan = planFromField(design, computeTensorField(design), { materials: await loadMaterialCatalog(), processes: await loadProcessCatalog() });
    // the rows as made, each chunk copied at once (the emitter reuses its buffers)
    const parts: Buffer[] = [];
    await emitBuildList(plan, (chunk) => {
      parts.push(Buffer.from(chunk));
    });
    const made = Buffer.concat(parts);
    expect(parts.length).toBeGreaterThan(3);
    expect(made.length).toBeGreaterThan(3 * BUILD_LIST_CHUNK_BYTES);
    expect(made.toString("utf8").split("\n").length).toBe(plan.grid.count + 2); // header, rows, final newline
    // the writer must be done with a chunk's bytes before its promise settles: a writer that lets
    // the emitter reuse a buffer still queued in the stream writes later rows over earlier ones
    const dir = tempDir("cw-chunks-");
    await writePlanOutputs(plan, dir);
    const onDisk = await readFile(join(dir, "build-list.csv"));
    expect(onDisk.equals(made)).toBe(true);
  }, 60_000);
});
