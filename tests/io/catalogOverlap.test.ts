import { describe, expect, it } from "vitest";
import { loadMaterialCatalog } from "../../src/io/materialCatalog.js";
import { evaluateMaterial } from "../../src/media/material.js";

/**
 * Rows describing the same material with different fits must not contradict each other inside
 * their declared ranges: where two ranges overlap, Re ε agrees within 10 % and the loss within a
 * factor 1.5 (our tolerance for "the same material"); otherwise the ranges must not overlap.
 */
const SAME_MATERIAL: [string, string][] = [["gold", "gold-optical"], ["silicon-hr", "silicon-nir"], ["fused-silica", "fused-silica-optical"]];

describe("catalog rows of one material agree where their ranges overlap", () => {
  for (const [a, b] of SAME_MATERIAL) {
    it(`${a} / ${b}`, async () => {
      const cat = await loadMaterialCatalog();
      const ma = cat.find((m) => m.id === a)!, mb = cat.find((m) => m.id === b)!;
      const lo = Math.max(ma.validMinHz, mb.validMinHz), hi = Math.min(ma.validMaxHz, mb.validMaxHz);
      if (!(lo <= hi)) return expect(lo).toBeGreaterThan(hi);
      for (let k = 0; k <= 8; k++) {
        const f = lo * (hi / lo) ** (k / 8);
        const ea = evaluateMaterial(ma, f).eps, eb = evaluateMaterial(mb, f).eps;
        expect(Math.abs(ea.re / eb.re - 1), `${a} vs ${b} at ${f} Hz`).toBeLessThan(0.1);
        if (eb.im > 0 && ea.im > 0) expect(Math.max(ea.im / eb.im, eb.im / ea.im), `${a} vs ${b} loss at ${f} Hz`).toBeLessThan(1.5);
      }
    });
  }
});
