/**
 * radialFromScene.ts: the exact radial solver fed by the same continuous scenes the FDFD check
 * samples (design → transform → material → reduction), against the closed-form cloak shells.
 */
import { describe, expect, it } from "vitest";
import { computeTensorField } from "../../src/field/computeTensorField.js";
import type { FieldDesign } from "../../src/field/transformSpec.js";
import { reduceField } from "../../src/reduce/reduceField.js";
import { deviceCases } from "../../src/verify/deviceCases.js";
import { linearCloakShell } from "../../src/verify/radialCloakShell.js";
import { radialProblemFromScene } from "../../src/verify/radialFromScene.js";
import { radialScattering } from "../../src/verify/radialSolver.js";
import { SAMPLE_MEDIUM, S_B, S_TXX, S_TXY, S_TYY, type Scene } from "../../src/verify/scene.js";
import { expectClose } from "../helpers/close.js";

const C0 = 299_792_458;
const f = 10e9, lambda = C0 / f, k0 = (2 * Math.PI) / lambda;
const a = lambda / 2, b = lambda;

function cloakScenes(innerOffsetM: number): { ideal: Scene; reduced: Scene } {
  const design: FieldDesign = {
    name: "test cloak", sourcePath: "test.json", background: { eps: 1, mu: 1 },
    transform: { kind: "radial-cloak", innerRadiusM: a, outerRadiusM: b, profile: "linear", innerOffsetM },
    grid: { pitchM: lambda / 20 },
  };
  const field = computeTensorField(design);
  const ideal = reduceField(field, { polarization: "Ez", scheme: "full" });
  const reduced = reduceField(field, { polarization: "Ez", scheme: "unit-mu", unitAxis: "larger" });
  const dc = deviceCases({ transform: design.transform, fieldBackground: design.background, background: { eps: 1, mu: 1 }, polarization: "Ez", grid: field.grid, ideal, reduced, plan: null });
  const scene = (name: string): Scene => dc.cases.find((c) => c.name === name)!.scene!;
  return { ideal: scene("ideal"), reduced: scene("reduced") };
}

describe("radial problem from a scene", () => {
  it("the design's ideal and reduced linear cloak (a = λ/2, b = λ, offset 1e-3 a), through transform and reduction, scatter as the closed-form shells (Ruan et al. 2007; Yan, Ruan & Qiu 2007)", () => {
    const delta = 1e-3 * a;
    const scenes = cloakScenes(delta);
    const bare = radialScattering({ polarization: "Ez", k0, background: { eps: 1, mu: 1 }, coreRadiusM: a, core: { kind: "pec" }, shells: [] }).scatteringWidthM;
    for (const [name, set] of [["ideal", "ideal"], ["reduced", "reduced-ez"]] as const) {
      const p = radialProblemFromScene({ scene: scenes[name], centreM: [0, 0], coreRadiusM: a, core: { kind: "pec" }, outerRadiusM: b, k0 });
      expect(p.applies, name).toBe(true);
      if (!p.applies) continue;
      const fromScene = radialScattering(p.problem).scatteringWidthM / bare;
      const direct = radialScattering({ polarization: "Ez", k0, background: { eps: 1, mu: 1 }, coreRadiusM: a, core: { kind: "pec" }, shells: [linearCloakShell(set, a, b, delta)] }).scatteringWidthM / bare;
      expectClose(fromScene, direct, { rel: 1e-3, label: name });
    }
  });

  it("refuses a tensor that is not diagonal in the polar basis (a rotator-like shell) and one that depends on the angle", () => {
    const base = (polarOffDiagonal: number, angular: number): Scene => ({
      polarization: "Ez", background: { eps: 1, mu: 1 }, bounds: { minX: -1, maxX: 1, minY: -1, maxY: 1 },
      sample(x, y, out) {
        const r = Math.hypot(x, y);
        if (r > 0.8 || r < 0.3) return 0;
        const c = x / r, s = y / r, tr = 2 + angular * x, tt = 0.5, trt = polarOffDiagonal;
        out[S_B] = 1.5; out[S_B + 1] = 0;
        out[S_TXX] = tr * c * c + tt * s * s - 2 * trt * c * s; out[S_TXX + 1] = 0;
        out[S_TYY] = tr * s * s + tt * c * c + 2 * trt * c * s; out[S_TYY + 1] = 0;
        out[S_TXY] = (tr - tt) * c * s + trt * (c * c - s * s); out[S_TXY + 1] = 0;
        return SAMPLE_MEDIUM;
      },
    });
    const input = { centreM: [0, 0] as [number, number], coreRadiusM: 0.3, core: { kind: "medium" as const, eps: 1, mu: 1 }, outerRadiusM: 0.8, k0: 2 * Math.PI };
    expect(radialProblemFromScene({ ...input, scene: base(0, 0) }).applies).toBe(true);
    const rot = radialProblemFromScene({ ...input, scene: base(0.3, 0) });
    expect(rot.applies).toBe(false);
    if (!rot.applies) expect(rot.reason).toMatch(/not diagonal in the polar basis/);
    const ang = radialProblemFromScene({ ...input, scene: base(0, 0.5) });
    expect(ang.applies).toBe(false);
    if (!ang.applies) expect(ang.reason).toMatch(/depends on the angle/);
  });
});
