import { describe, expect, it } from "vitest";
import { InputError } from "../../src/core/errors.js";
import { findProcess, loadProcessCatalog, parseProcessCatalog } from "../../src/io/processCatalog.js";

describe("process catalog", () => {
  it("every row of the shipped catalog parses, with a source, and the generic processes are there", async () => {
    const catalog = await loadProcessCatalog();
    expect(catalog.length).toBeGreaterThanOrEqual(8);
    for (const id of ["fused-filament", "stereolithography", "pcb-etching", "cnc-milling", "laser-cutting", "deep-uv-lithography", "electron-beam-lithography", "two-photon-lithography"]) {
      expect(catalog.map((p) => p.id)).toContain(id);
    }
    for (const p of catalog) {
      expect(p.minFeatureM, p.id).toBeGreaterThan(0);
      expect(p.minGapM, p.id).toBeGreaterThan(0);
      expect(p.maxAspectRatio, p.id).toBeGreaterThan(0);
      expect(p.materialClasses.length, p.id).toBeGreaterThan(0);
      expect(p.source, p.id).toMatch(/common practice|\(\d{4}\)/);
    }
  });

  it("reports every bad cell with its line and column", () => {
    const text = [
      "id,name,min_feature_m,min_gap_m,max_aspect_ratio,material_classes,source",
      "good,good process,1e-3,1e-3,5,polymer,common practice",
      "Bad Id,x,-1,abc,5,plastic,",
      "good,dup,1e-3,1e-3,5,polymer,common practice",
    ].join("\n");
    try {
      parseProcessCatalog(text, "p.csv");
      expect.unreachable();
    } catch (err) {
      expect(err).toBeInstanceOf(InputError);
      const issues = (err as InputError).issues.map((i) => `${i.where} ${i.message}`);
      expect(issues).toContain("p.csv:3:1 id: expected lower-case letters, digits and '-', got 'Bad Id'");
      expect(issues.some((i) => i.startsWith("p.csv:3:3 min_feature_m"))).toBe(true);
      expect(issues.some((i) => i.startsWith("p.csv:3:4 min_gap_m"))).toBe(true);
      expect(issues.some((i) => /p\.csv:3:6 .*unknown material class 'plastic'/.test(i))).toBe(true);
      expect(issues.some((i) => i.startsWith("p.csv:3:7 source"))).toBe(true);
      expect(issues).toContain("p.csv:4:1 id: duplicate 'good'");
    }
  });

  it("a missing column is named", () => {
    expect(() => parseProcessCatalog("id,name\nx,y\n", "p.csv")).toThrow(/missing column 'min_feature_m'/);
  });

  it("unknown process ids suggest the closest", async () => {
    const catalog = await loadProcessCatalog();
    expect(() => findProcess(catalog, "stereolitography")).toThrow(/unknown process 'stereolitography'; did you mean stereolithography/);
  });
});
