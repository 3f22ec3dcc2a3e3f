/**
 * Background remedies for a design that names the material its device sits in
 * (`reduction.backgroundMaterial`): `plan` refuses a background index more than 1 % from that
 * material's, so "embed the device in a background of index N" cannot be followed there. The
 * search then names a catalog material and the two design keys to set, or says that none fits.
 * The indices are the catalog's rows at 5.8 GHz (catalogs/materials.csv, constant models):
 * polypropylene ε 2.27 and fused silica (microwave) ε 3.8 — polypropylene from Riddle, Baker-Jarvis,
 * Krupka, IEEE Trans. Microw. Theory Tech. 51(3), 727 (2003), table; fused silica 3.8 a handbook
 * value (the catalog's source column). The selection rules are our own (plan/remedies.ts).
 */
import { beforeAll, describe, expect, it } from "vitest";
import { candidateChanges, findRemedies, type RemedyContext } from "../../src/plan/remedies.js";
import { loadMaterialCatalog } from "../../src/io/materialCatalog.js";
import type { Material } from "../../src/media/material.js";
import { backgroundMaterialChoices, checkBackgroundMaterial } from "../../src/verify/sweep/backgroundAtFrequency.js";
import { syntheticPlan } from "../tui/helpers/syntheticPlan.js";
import { expectClose } from "../helpers/close.js";

const F_HZ = 5.8e9;
let catalog: Material[];
beforeAll(async () => {
  catalog = await loadMaterialCatalog();
});

/** The synthetic plan (8 cells subunity without recipe) needing a background index of 1.5 or more. */
function planNeeding(minIndex: number) {
  const plan = syntheticPlan();
  plan.minBackgroundIndex = minIndex;
  return plan;
}

describe("backgroundMaterialChoices", () => {
  it("lists the materials that can surround a device, lowest index first, each accepted by the background check at its own index", () => {
    const choices = backgroundMaterialChoices(catalog, F_HZ);
    expect(choices.length).toBeGreaterThan(5);
    const ids = choices.map((c) => c.id);
    for (const metal of ["gold", "silver", "copper", "aluminium"]) expect(ids).not.toContain(metal);
    for (let k = 1; k < choices.length; k++) expect(choices[k].index).toBeGreaterThanOrEqual(choices[k - 1].index);
    for (const c of choices) expect(checkBackgroundMaterial(c.id, catalog, F_HZ, c.index, "w", "i").index).toBe(c.index);
    // polypropylene: n = √2.27 (Riddle, Baker-Jarvis, Krupka 2003, table)
    expectClose(choices.find((c) => c.id === "polypropylene")!.index, Math.sqrt(2.27), { rel: 1e-12 });
  });
});

describe("background remedies when the design names its background material", () => {
  it("without a background material: the index remedies as before", () => {
    const labels = candidateChanges(planNeeding(1.5)).map((c) => c.label);
    expect(labels).toContain("embed the device in a background of index 1.53");
    expect(labels).toContain("embed the device in a background of index 2 and allow every material and family");
  });

  it("with one: no bare index; the lowest-index material from 1.5 up and the one nearest a third above, with the keys to set", () => {
    const context: RemedyContext = { background: { materialId: "air", choices: backgroundMaterialChoices(catalog, F_HZ) } };
    const changes = candidateChanges(planNeeding(1.5), context);
    expect(changes.filter((c) => /background of index/.test(c.label))).toEqual([]);
    const bg = changes.filter((c) => c.overrides.backgroundIndex !== undefined);
    // polypropylene √2.27 = 1.5067 is the lowest index ≥ 1.5; fused silica √3.8 = 1.9494 the nearest to 1.33 × 1.5 = 1.995
    expect(bg.map((c) => c.design)).toEqual([
      { backgroundMaterial: "polypropylene", backgroundIndex: 1.5067 },
      { backgroundMaterial: "fused-silica", backgroundIndex: 1.9494 },
    ]);
    for (const c of bg) {
      // the index re-planned is the one printed, and the design key says the same
      expect(c.overrides.backgroundIndex).toBe(c.design!.backgroundIndex);
      expect(c.label).toContain(`set reduction.backgroundMaterial to "${c.design!.backgroundMaterial}", reduction.backgroundIndex to ${c.design!.backgroundIndex}`);
      // the printed index passes the check `plan` makes
      expect(() => checkBackgroundMaterial(c.design!.backgroundMaterial, catalog, F_HZ, c.design!.backgroundIndex, "w", "i")).not.toThrow();
    }
    expect(bg[0].label).toBe('embed the device in polypropylene, index 1.5067 at the design frequency (set reduction.backgroundMaterial to "polypropylene", reduction.backgroundIndex to 1.5067)');
    expect(bg[1].overrides).toEqual({ backgroundIndex: 1.9494, materials: null, families: null });
    expect(findRemedies(planNeeding(1.5), () => null, () => false, context).notes).toBeUndefined();
  });

  it("when no catalog material reaches the index: no background change, and a note says why", () => {
    const context: RemedyContext = { background: { materialId: "air", choices: backgroundMaterialChoices(catalog, F_HZ) } };
    const plan = planNeeding(40);
    expect(candidateChanges(plan, context).filter((c) => c.overrides.backgroundIndex !== undefined)).toEqual([]);
    const r = findRemedies(plan, () => null, () => false, context);
    expect(r.notes).toEqual([
      "no other background tried: the design names its background material ('air'), and no catalog material that can surround the device has index 40 or more at the design frequency (the index that lifts every ε above the lowest allowed material)",
    ]);
    // without a background material there is nothing to note
    expect(findRemedies(plan, () => null).notes).toBeUndefined();
  });
});
