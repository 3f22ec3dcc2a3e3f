/**
 * The realized map as built (materialMap.ts mapFromPlan): recipes the shop stands on the grid (rect
 * lattices, laminates with their layer normal in the plane) take the snapped axes the layouts and
 * the drawn case use (layoutShapes.ts, rectSites.ts, geometryScene.ts); isotropic-in-plane recipes
 * keep the target's. Expected values: the rotation T = λ1 I + (λ2 − λ1) e eᵀ, e = (cos θ, sin θ)
 * (an identity), at θ = 0 or π/2 for the snapped recipes.
 */
import { describe, expect, it } from "vitest";
import { expectClose } from "../helpers/close.js";
import type { Plan, Recipe } from "../../src/plan/planTypes.js";
import { builtAxisAngleRad, mapFromPlan } from "../../src/verify/materialMap.js";
import { rectCellCounts } from "../../src/plan/layout/rectSites.js";
import { squareDeviceGrid } from "../helpers/squareDeviceGrid.js";

const deg = (d: number): number => (d * Math.PI) / 180;

describe("builtAxisAngleRad and mapFromPlan: the realized map stands on the axes the recipe is built on", () => {
  it("snaps rect lattices and in-plane laminates to the grid axis their layout uses, and leaves others alone", () => {
    const rect = { family: "holes-in-slab", lattice: "rect", orientation: "z" } as const;
    // axis 2 at 20°: axis 1 at 110°, nearer y → the lattice's x axis along y, axis 2 along x
    expect(builtAxisAngleRad(rect, deg(20))).toBe(0);
    // axis 2 at 70°: axis 1 at 160°, nearer x → axis 2 along y
    expect(builtAxisAngleRad(rect, deg(70))).toBe(Math.PI / 2);
    // the same rule as the drawn case's columns: m along x exactly when axis 2 is snapped to y
    for (const d of [-80, -44, 0, 20, 46, 70, 135, 170]) {
      const counts = rectCellCounts({ m: 2, n: 1 }, deg(d), new Int32Array(2));
      expect(counts[0] === 2, `${d}°`).toBe(builtAxisAngleRad(rect, deg(d)) === Math.PI / 2);
    }
    // laminates: the layer normal on the grid axis nearer the principal axis it stands for
    expect(builtAxisAngleRad({ family: "laminate", lattice: "square", orientation: "2" }, deg(20))).toBe(0); // normal = axis 2 at 20° → along x
    expect(builtAxisAngleRad({ family: "laminate", lattice: "square", orientation: "1" }, deg(20))).toBe(0); // normal = axis 1 at 110° → along y, so axis 2 along x
    expect(builtAxisAngleRad({ family: "laminate", lattice: "square", orientation: "2" }, deg(60))).toBe(Math.PI / 2);
    // isotropic in the plane, or stacked along z: the target's angle
    expect(builtAxisAngleRad({ family: "rods-in-host", lattice: "square", orientation: "z" }, 0.3)).toBe(0.3);
    expect(builtAxisAngleRad({ family: "laminate", lattice: "square", orientation: "z" }, 0.3)).toBe(0.3);
  });

  it("gives a rect cell turned 20° its values along the grid and a square cell its values rotated by the target's angle", () => {
    const grid = squareDeviceGrid(2, 1e-3);
    const recipe = (lattice: string): Recipe => ({ family: "holes-in-slab", host: "h", inclusion: "air", lattice, orientation: "z", fillFraction: 0.3, dimensions: {}, achieved: [1, 3, 5], achievedIm: [0, 0.01, 0.02] } as unknown as Recipe);
    const plan = {
      grid, level: Int32Array.from([0, 1, 0, 1]), axisAngleRad: Float64Array.from([deg(20), deg(20), deg(70), deg(70)]),
      levels: [{ index: 1, recipe: recipe("rect") }, { index: 2, recipe: recipe("square") }],
    } as unknown as Plan;
    const m = mapFromPlan(plan, { b: 1, t: 1 });
    // rect at 20°: axis 2 snapped to x → T = diag(5, 3); at 70°: to y → diag(3, 5); no cross term
    expect([m.txx[0], m.tyy[0], m.txy[0], m.txxIm![0], m.tyyIm![0]]).toEqual([5, 3, 0, 0.02, 0.01]);
    expect([m.txx[2], m.tyy[2], m.txy[2]]).toEqual([3, 5, 0]);
    // the "square" recipe (here anisotropic on purpose) keeps the rotation by the target's angle
    const c = Math.cos(deg(20)), s = Math.sin(deg(20));
    expectClose([m.txx[1], m.tyy[1], m.txy[1]], [3 + 2 * c * c, 3 + 2 * s * s, 2 * c * s], { rel: 1e-14, label: "rotated tensor" });
  });
});
