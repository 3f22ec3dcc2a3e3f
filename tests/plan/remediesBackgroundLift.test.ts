/**
 * When the remedy search tries a background that lifts every ε (plan/remedies.ts): one rule decides
 * both whether the background changes are tried and whether the "no catalog material" note is
 * written, and the rule does not compare the needed index with `settings.backgroundIndex` (1 when
 * no index is given, whatever the design's own background). The rules are our own (remedies.ts);
 * the physics the real-plan cases rest on is named beside them.
 */
import { beforeAll, describe, expect, it } from "vitest";
import { candidateChanges, findRemedies, type RemedyContext } from "../../src/plan/remedies.js";
import { parseDesign } from "../../src/io/design/loadDesign.js";
import { computeTensorField } from "../../src/field/computeTensorField.js";
import { loadMaterialCatalog } from "../../src/io/materialCatalog.js";
import { loadProcessCatalog } from "../../src/io/processCatalog.js";
import { planFromField, type PlanCatalogs } from "../../src/plan/runPlan.js";
import type { Plan } from "../../src/plan/planTypes.js";
import { backgroundMaterialChoices } from "../../src/verify/sweep/backgroundAtFrequency.js";
import { syntheticPlan } from "../tui/helpers/syntheticPlan.js";
import { beamBendDesign } from "../helpers/beamBendDesign.js";

let catalogs: PlanCatalogs;
beforeAll(async () => {
  catalogs = { materials: await loadMaterialCatalog(), processes: await loadProcessCatalog() };
});

const isBackground = (c: { overrides: { backgroundIndex?: number } }): boolean => c.overrides.backgroundIndex !== undefined;

describe("one rule for trying a background lift and for noting that none can be tried", () => {
  /** The synthetic plan (8 cells subunity and without recipe) needing index `min`, then edited. */
  function variant(min: number | null, edit: (p: Plan) => void = () => {}): Plan {
    const p = syntheticPlan();
    p.minBackgroundIndex = min;
    edit(p);
    return p;
  }
  const VARIANTS: { name: string; edit: (p: Plan) => void; min?: number | null; lift: boolean }[] = [
    { name: "cells below every material (subunity), recipes missed", edit: () => {}, lift: true },
    { name: "only unreachable cells", edit: (p) => { p.figures.flagCounts = { unreachable: 8, norecipe: 8 }; }, lift: true },
    { name: "only the tolerance missed", edit: (p) => { p.verdict.missed = [{ what: "tolerance", value: 0.2, limit: 0.05, text: "20 %" }]; }, lift: true },
    { name: "no subunity or unreachable cell", edit: (p) => { p.figures.flagCounts = { magnetic: 8, norecipe: 8 }; }, lift: false },
    { name: "neither recipes nor tolerance missed", edit: (p) => { p.verdict.missed = [{ what: "loss", value: 6, limit: 3, text: "6 dB" }]; }, lift: false },
    { name: "no index computed", edit: () => {}, min: null, lift: false },
    { name: "some cell needs ε ≤ 0 (no index lifts it)", edit: () => {}, min: Infinity, lift: false },
  ];

  it.each(VARIANTS)("$name: background changes tried = $lift, and the note only when tried and no material fits", ({ edit, min, lift }) => {
    // an index a catalog background reaches (polypropylene √2.27 ≈ 1.507, Riddle et al. 2003) and one none does
    const reachable = variant(min === undefined ? 1.5 : min, edit);
    const unreachable = variant(min === undefined ? 40 : min, edit);
    const context: RemedyContext = { background: { materialId: "air", choices: backgroundMaterialChoices(catalogs.materials, 5.8e9) } };
    expect(candidateChanges(reachable).some(isBackground)).toBe(lift);
    expect(candidateChanges(reachable, context).some(isBackground)).toBe(lift);
    expect(candidateChanges(unreachable, context).some(isBackground)).toBe(false);
    expect(findRemedies(reachable, () => null, () => false, context).notes).toBeUndefined();
    expect(findRemedies(unreachable, () => null, () => false, context).notes?.length ?? 0).toBe(lift ? 1 : 0);
    // without a named background material nothing is ever noted
    expect(findRemedies(unreachable, () => null).notes).toBeUndefined();
  });
});

describe("the background lift is judged by the ε the reduction gave, not by settings.backgroundIndex", () => {
  /** The quarter-turn bend (beamBendDesign) referenced to `ref`, in the design's own background, no index given. */
  async function bendPlan(background: { eps: number; mu: number }, scheme: string, ref: string, materials: string[]) {
    const d = beamBendDesign({ name: "bend in its own background", frequency: "10 GHz", pitch: "2 mm", materials }) as { transform: Record<string, unknown> } & Record<string, unknown>;
    const design = await parseDesign({ ...d, transform: { ...d.transform, referenceRadius: ref }, background, reduction: { scheme } }, "bend.json");
    const field = computeTensorField(design);
    return { design, field, plan: planFromField(design, field, catalogs) };
  }

  it("a design background of ε 0.64 (index 0.8): the lift to index 1 is tried, and it gives recipes", async () => {
    // beam bend: ε_z = μ_z = R0/r' (Rahm et al., Opt. Express 16, 11555 (2008), beamBend.ts), so the
    // isotropic Ez index at unit background is R0/r' ≥ 90/80 and every ε is above air's 1 there: index 1
    // lifts them (schemeMetrics' minBackgroundIndex returns its floor of 1), while the design's own
    // ε_b = 0.64 puts the outer cells below 1 (ε′ linear in ε_b: Ward & Pendry, J. Mod. Opt. 43, 773 (1996))
    const { design, field, plan } = await bendPlan({ eps: 0.64, mu: 1 }, "isotropic", "90 mm", ["alumina-96", "air"]);
    expect(plan.reductionBackground).toEqual({ index: 0.8, given: false });
    expect(plan.settings.backgroundIndex).toBe(1);
    expect(plan.minBackgroundIndex).toBe(1);
    const missedBefore = plan.verdict.missed.find((m) => m.what === "recipes")!.value;
    expect(missedBefore).toBeGreaterThan(0);
    // before: "1 > settings.backgroundIndex (1)" failed, and no background was tried
    const lift = candidateChanges(plan).filter(isBackground);
    expect(lift.map((c) => c.label)).toEqual([
      "embed the device in a background of index 1.02",
      "embed the device in a background of index 1.02 and allow every material and family",
      "embed the device in a background of index 1.33 and allow every material and family",
    ]);
    const after = planFromField(design, field, catalogs, lift[0].overrides);
    expect(after.verdict.missed.find((m) => m.what === "recipes")?.value ?? 0).toBeLessThan(missedBefore);
  });

  it("a magnetic design background (ε 1, μ 2.25: index 1.5) under the full scheme: an index below 1.5 still lifts ε and is tried", async () => {
    // full scheme: ε′ = J ε_b Jᵀ/det J depends on ε_b alone (Ward & Pendry 1996), so the ε here are
    // those of a unit background, below PTFE's 2.1 (catalog) in every cell; the index that lifts them
    // lies below √(ε_b μ_b) = 1.5, the index the reduction used. Comparing with that index instead
    // would drop a change that helps.
    const { design, field, plan } = await bendPlan({ eps: 1, mu: 2.25 }, "full", "80 mm", ["alumina-96", "ptfe"]);
    expect(plan.reductionBackground).toEqual({ index: 1.5, given: false });
    expect(plan.minBackgroundIndex).toBeGreaterThan(1);
    expect(plan.minBackgroundIndex).toBeLessThan(1.5);
    const lift = candidateChanges(plan).filter(isBackground);
    expect(lift.length).toBeGreaterThan(0);
    const missedBefore = plan.verdict.missed.find((m) => m.what === "recipes")!.value;
    const after = planFromField(design, field, catalogs, lift[0].overrides);
    expect(after.verdict.missed.find((m) => m.what === "recipes")?.value ?? 0).toBeLessThan(missedBefore);
  });
});
