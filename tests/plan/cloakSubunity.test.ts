import { describe, it, expect, beforeAll } from "vitest";
import { parseDesign } from "../../src/io/design/loadDesign.js";
import { computeTensorField } from "../../src/field/computeTensorField.js";
import { loadMaterialCatalog } from "../../src/io/materialCatalog.js";
import { loadProcessCatalog } from "../../src/io/processCatalog.js";
import { planFromField, type PlanCatalogs } from "../../src/plan/runPlan.js";
import { FLAG_BIT } from "../../src/plan/flags.js";

let catalogs: PlanCatalogs;
beforeAll(async () => {
  catalogs = { materials: await loadMaterialCatalog(), processes: await loadProcessCatalog() };
});

describe("linear cylindrical cloak, full set for E along z", () => {
  it("flags subunity exactly where ε_z < 1, i.e. r < a/(1 − ((b−a)/b)²)", async () => {
    // ε_z = (b/(b−a))²·(r−a)/r (Pendry, Schurig, Smith, Science 312, 1780 (2006); Schurig et al.,
    // Science 314, 977 (2006)); ε_z < 1 ⇔ (r−a)/r < ((b−a)/b)² ⇔ r < a/(1 − ((b−a)/b)²).
    const a = 0.02, b = 0.05;
    const design = await parseDesign(
      {
        name: "cloak check",
        frequency: "3 GHz",
        transform: { kind: "radial-cloak", innerRadius: a, outerRadius: b, profile: "linear", innerOffset: "0.1 mm", cap: 1000 },
        grid: { pitch: "1 mm" },
        polarization: "Ez",
        reduction: { scheme: "full" },
        realization: { materials: ["ptfe", "alumina-96"], levels: 16 },
      },
      "cloak-check.json",
    );
    const field = computeTensorField(design);
    const plan = planFromField(design, field, catalogs);
    const q = (b - a) / b;
    const rStar = a / (1 - q * q);
    let flagged = 0, checked = 0;
    for (let c = 0; c < plan.grid.count; c++) {
      const r = Math.hypot(plan.grid.xM[c], plan.grid.yM[c]);
      if (plan.flags[c] & FLAG_BIT.capped) continue; // capped cells carry the cap, not the formula
      if (Math.abs(r - rStar) < 1e-9) continue;
      checked++;
      const sub = (plan.flags[c] & FLAG_BIT.subunity) !== 0;
      expect(sub, `cell ${c} at r = ${r}`).toBe(r < rStar);
      if (sub) flagged++;
    }
    expect(checked).toBeGreaterThan(1000);
    expect(flagged).toBeGreaterThan(50);
  });
});
