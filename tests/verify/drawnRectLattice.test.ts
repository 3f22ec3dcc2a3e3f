/**
 * Rect-lattice recipes drawn (geometryScene.ts with src/plan/layout/rectSites.ts): m × n discs per
 * device cell, spacing p/m along the lattice's x axis and p/n along y, that axis on the grid axis
 * nearer the cell's principal axis 1 — the sites the layout files draw (layoutShapes.ts).
 * Expected values:
 * - the drawn area fraction: the recipe's fill, f = m·n·πr²/p² = πr²/(a·b) (geometry);
 * - the sites: those of the layout writer (planLayout), the circle polygons' centres;
 * - a uniform block of rods drawn at a cell small against the wavelength (a = λ0/32) scatters as the
 *   same block filled with the rect lattice's solved effective tensor (rectCircleTable.ts: the cell
 *   problem solved per aspect; its aspect-1 values agree with Perrins, McKenzie & McPhedran,
 *   "Transport properties of regular arrays of cylinders", Proc. R. Soc. Lond. A 369, 207 (1979),
 *   to 8e-4, tests/cells/homogenize/rectCircleTable.test.ts) — lit along x (Hz: E along y, it sees
 *   ε_yy) and along y (it sees ε_xx), so a drawing turned the wrong way round would show.
 */
import { describe, expect, it } from "vitest";
import { expectClose } from "../helpers/close.js";
import { rectCircleNode, rectErrorEnvelope } from "../../src/cells/homogenize/rectCircleTable.js";
import { rectTiling } from "../../src/cells/lattice.js";
import type { DeviceGrid } from "../../src/field/deviceGrid.js";
import { planLayout } from "../../src/plan/layout/layoutShapes.js";
import type { Plan, Recipe } from "../../src/plan/planTypes.js";
import { deviceScene } from "../../src/verify/deviceScene.js";
import { geometryScene, type BulkMaterial } from "../../src/verify/geometryScene.js";
import { mapFromPlan } from "../../src/verify/materialMap.js";
import { richardson } from "../../src/verify/richardson.js";
import { BOX_MAX_PARTS, BOX_PART, SAMPLE_MEDIUM, type Scene } from "../../src/verify/scene.js";
import { verifyDevice, type CaseSpec } from "../../src/verify/verifyDevice.js";
import { squareDeviceGrid } from "../helpers/squareDeviceGrid.js";

const C0 = 299_792_458;
const f = 10e9, lambda = C0 / f;
const vacuum = { eps: 1, mu: 1 };
const EPS_ROD = 9.6, N = 8, A = lambda / 32;
const materials = new Map<string, BulkMaterial>([
  ["air", { eps: { re: 1, im: 0 }, mu: { re: 1, im: 0 }, isMetal: false }],
  ["rod", { eps: { re: EPS_ROD, im: 0 }, mu: { re: 1, im: 0 }, isMetal: false }],
]);

type ScenePlan = Pick<Plan, "grid" | "level" | "levels" | "axisAngleRad">;

/** An N × N block of rods on a rect lattice of aspect `aspect`, principal axis 2 at `axisRad` in each cell (a function of the cell). */
function rectBlock(aspect: number, fill: number, axisRad: (c: number) => number, achieved: [number, number] = [1, 1]): ScenePlan {
  const grid = squareDeviceGrid(N, A);
  // m × n circles per cell (aspect m/n), spacing A/m and A/n: r from f = m·n·πr²/A²
  const t = rectTiling(aspect)!;
  const radius = A * Math.sqrt(fill / (t.m * t.n * Math.PI));
  const recipe = { family: "rods-in-host", host: "air", inclusion: "rod", lattice: "rect", aspect, orientation: "z", fillFraction: fill, dimensions: { radius_m: radius }, achieved: [1, ...achieved], achievedIm: [0, 0, 0] } as unknown as Recipe;
  return { grid, level: new Int32Array(grid.count), levels: [{ index: 1, recipe } as Plan["levels"][number]], axisAngleRad: Float64Array.from({ length: grid.count }, (_, c) => axisRad(c)) };
}

/** Area of the rod material in the whole block from the scene's exact boxes (discRectArea.ts), boxes of A/8 tiling the block and a margin. */
function drawnRodArea(scene: Scene): number {
  const h = A / 8, out = new Float64Array(BOX_MAX_PARTS * BOX_PART);
  const half = (N / 2 + 0.5) * A;
  let area = 0;
  for (let y = -half + h / 2; y < half; y += h) {
    for (let x = -half + h / 2; x < half; x += h) {
      const np = scene.boxParts!(x, y, h, out);
      expect(np, `box at (${x}, ${y})`).toBeGreaterThan(0);
      for (let k = 0; k < np; k++) if (out[BOX_PART * k + 1] === SAMPLE_MEDIUM && out[BOX_PART * k + 2 + 2] === EPS_ROD) area += out[BOX_PART * k] * h * h;
    }
  }
  return area;
}

/** σ of the drawn block and of each homogenized scene, Hz, lit at angleRad, on one grid of step = smallest feature / steps. */
function widths(plan: ScenePlan, homogenized: Scene[], steps: number, angleRad: number): { drawn: number; homogenized: number[]; stepsPerPitch: number } {
  const d = geometryScene({ plan, materials, polarization: "Hz", background: vacuum, hidden: null });
  if (!d.ok) throw new Error(d.reason);
  const names = ["realized", "ideal", "reduced", "bare"] as const;
  const cases: CaseSpec[] = [
    { name: "realized-geometry", scene: d.scene, indexHint: d.indexHint },
    ...homogenized.map((scene, k): CaseSpec => ({ name: names[k], scene, indexHint: Math.sqrt(EPS_ROD) })),
  ];
  const h = (N / 2 + 0.5) * A;
  const r = verifyDevice({ polarization: "Hz", background: vacuum, frequencyHz: f, deviceBox: { minX: -h, maxX: h, minY: -h, maxY: h }, cases, illumination: { kind: "plane", angleRad }, marginM: 0.08 * lambda, resolution: 12, maxStepM: d.smallestFeatureM / steps });
  const [geo, ...hom] = r.cases.map((c) => c.scatteringWidthM!);
  return { drawn: geo, homogenized: hom, stepsPerPitch: A / r.grid.h };
}

describe("rect-lattice recipes drawn as the layout files draw them", () => {
  it("draws m × n discs per cell at the recipe's fill, turned with the cell's principal axis, on the layout writer's sites", () => {
    // aspect 2 (2 × 1 per cell) and 2/3 (2 × 3), axis 1 along grid x in the left half, along grid y in the right half
    for (const [aspect, fill] of [[2, 0.3], [2 / 3, 0.35]] as const) {
      const plan = rectBlock(aspect, fill, (c) => (c % N < N / 2 ? Math.PI / 2 : 0.2));
      const d = geometryScene({ plan, materials, polarization: "Hz", background: vacuum, hidden: null });
      if (!d.ok) throw new Error(d.reason);
      const tiles = aspect === 2 ? 2 : 6;
      expect(d.notes.join(" ")).toMatch(new RegExp(`rect-lattice recipes \\(levels 1 \\(${aspect === 2 ? "2 × 1" : "2 × 3"}\\) per cell\\) are drawn .*: ${tiles * N * N} discs in ${N * N} cells; largest turn from the principal axes 11.5°`));
      // the exact box areas (discRectArea.ts) add up to the recipe's fill of the block: the fill in every cell
      expectClose(drawnRodArea(d.scene), fill * N * N * A * A, { rel: 1e-9, label: `drawn rod area, aspect ${aspect}` });
      // the layout writer's circles (polygon centres) are the drawn discs: each centre and 0.99 r around it drawn as rod, 1.01 r outside
      const layout = planLayout(plan as Plan);
      const polys = layout.levels[0].polygons;
      expect(polys.length).toBe(tiles * N * N);
      const r = plan.levels[0].recipe!.dimensions.radius_m, o = new Float64Array(8);
      const rodAt = (x: number, y: number): boolean => d.scene.sample(x, y, o) === SAMPLE_MEDIUM && o[2] === EPS_ROD;
      for (const p of polys) {
        let cx = 0, cy = 0;
        const nv = p.xy.length / 2;
        for (let k = 0; k < nv; k++) { cx += p.xy[2 * k] / nv; cy += p.xy[2 * k + 1] / nv; }
        expect(rodAt(cx, cy), `layout circle at (${cx}, ${cy})`).toBe(true);
        for (let k = 0; k < 8; k++) {
          const t = (k * Math.PI) / 4 + 0.1;
          expect(rodAt(cx + 0.99 * r * Math.cos(t), cy + 0.99 * r * Math.sin(t))).toBe(true);
          expect(rodAt(cx + 1.01 * r * Math.cos(t), cy + 1.01 * r * Math.sin(t))).toBe(false);
        }
      }
      // the narrowest feature: the wall along the shorter spacing A/max(m, n), less a diameter (each
      // disc keeps to its own A/mx × A/my share of the cell, so walls across the halves' edge are
      // wider), or the diameter
      const s = A / (aspect === 2 ? 2 : 3);
      expectClose(d.smallestFeatureM, Math.min(2 * r, s - 2 * r), { rel: 1e-9, label: "narrowest feature" });
    }
  });

  it("gives a box cut by one rect disc's edge the normal of that disc (Kottke's averaging), and none where two discs' edges cut it", () => {
    const plan = rectBlock(2 / 3, 0.35, (c) => (c % N < N / 2 ? Math.PI / 2 : 0.2));
    const d = geometryScene({ plan, materials, polarization: "Hz", background: vacuum, hidden: null });
    if (!d.ok) throw new Error(d.reason);
    const r = plan.levels[0].recipe!.dimensions.radius_m, h = r / 20;
    const out = new Float64Array(BOX_MAX_PARTS * BOX_PART), normal = new Float64Array(2);
    const polys = planLayout(plan as Plan).levels[0].polygons;
    let checked = 0;
    for (const [k, p] of polys.entries()) {
      if (k % 5) continue;
      let cx = 0, cy = 0;
      const nv = p.xy.length / 2;
      for (let v = 0; v < nv; v++) { cx += p.xy[2 * v] / nv; cy += p.xy[2 * v + 1] / nv; }
      for (const t of [0.3, 1.9, 3.5, 5.1]) {
        // a small box centred on the circle: its mean normal is the radial direction there to O(h/r)
        const bx = cx + r * Math.cos(t), by = cy + r * Math.sin(t);
        expect(d.scene.boxParts!(bx, by, h, out, normal)).toBe(2);
        expect(normal[0] * Math.cos(t) + normal[1] * Math.sin(t), `disc at (${cx}, ${cy}), angle ${t}`).toBeGreaterThan(0.999);
        checked++;
      }
    }
    expect(checked).toBeGreaterThan(100);
    // a box over the wall between two discs of a cell (2 × 3: rows A/3 apart, wall A/3 − 2r), cut by both edges: no single normal
    const c0 = 0; // a cell of the left half: axis 1 along x, 2 columns, 3 rows
    const x0 = plan.grid.xM[c0] - A / 4, y0 = plan.grid.yM[c0] - A / 3; // disc (column 0, row 0)
    const wall = A / 3 - 2 * r;
    expect(d.scene.boxParts!(x0, y0 + r + wall / 2, wall + r / 4, out, normal)).toBeGreaterThan(1);
    expect([normal[0], normal[1]]).toEqual([0, 0]);
  });

  it("refuses a rect recipe whose discs meet, and one without a tiling", () => {
    // fill 0.4 on 2 × 1: r = √(0.4/2π)·A = 0.2523·A, beyond half the A/2 spacing: the two discs of a cell overlap
    const plan = rectBlock(2, 0.4, (c) => (c % 2 ? Math.PI / 2 : 0));
    const d = geometryScene({ plan, materials, polarization: "Hz", background: vacuum, hidden: null });
    expect(d.ok ? "" : d.reason).toMatch(/discs touch or overlap near .* \(radii .* pitch .*\): the drawn structure would not be the recipes' lattices/);
    const bad = rectBlock(2, 0.3, () => 0);
    bad.levels[0].recipe!.aspect = 0.3;
    const b = geometryScene({ plan: bad, materials, polarization: "Hz", background: vacuum, hidden: null });
    expect(b.ok ? "" : b.reason).toMatch(/level 1: rect-lattice recipe without a tiling aspect \(0.3\)/);
  });

  it("a block of rods on a 2 × 1 rect lattice scatters as its solved anisotropic effective medium, lit along either axis (a = λ0/32, fill 0.2, ε 9.6 rods in air, Hz)", () => {
    const fill = 0.2;
    // the rect cell problem, aspect b/a = 2 (spacing a along the lattice's x, 2a along y): F = ε_eff/ε_host
    const node = rectCircleNode(EPS_ROD, fill, 2);
    expect(node.converged).toBe(true);
    // rods closer along x than along y: the field along x sees more rod (the chains), ε_xx > ε_yy
    expect(node.xx).toBeGreaterThan(node.yy * 1.05);
    // axis 1 (the lattice's x) along grid x: achieved [axis 1, axis 2] = [xx, yy], axis 2 at 90°
    const homogenized = (xx: number, yy: number): Scene => {
      const p = rectBlock(2, fill, () => Math.PI / 2, [xx, yy]);
      return deviceScene(p.grid as DeviceGrid, "Hz", vacuum, mapFromPlan(p as Plan, { b: 1, t: 1 }), null);
    };
    const plan = rectBlock(2, fill, () => Math.PI / 2, [node.xx, node.yy]);
    const hom = homogenized(node.xx, node.yy);
    // the table's stated error (rectErrorEnvelope: 3.4e-3 at contrast 9.6, above the node's own
    // ladder estimate) becomes an error of σ through the block's sensitivity, measured here: σ of
    // the block with both values 1 % higher, at the coarse grid (a small block of ε near 1.4
    // scatters like (ε − 1)², so 1 % of ε moves σ by 5–7 %)
    const relErr = Math.max(rectErrorEnvelope(EPS_ROD), node.ladderError);
    const up = homogenized(node.xx * 1.01, node.yy * 1.01);
    const swapped = homogenized(node.yy, node.xx);
    for (const angle of [0, Math.PI / 2]) {
      // the rungs at 3 and 4.5 steps across the wall: the 2-step rung is not yet in the asymptotic
      // range (lit along y it reads 1.0235 against 1.0018 and 0.9958 on the next two); on the first,
      // beside them, the block with its values 1 % up and the block with the two values swapped (what
      // a drawing turned the wrong way would match)
      const w3 = widths(plan, [hom, up, swapped], 3, angle), w45 = widths(plan, [hom], 4.5, angle);
      const coarse = { ratio: w3.drawn / w3.homogenized[0], stepsPerPitch: w3.stepsPerPitch }, fine = { ratio: w45.drawn / w45.homogenized[0], stepsPerPitch: w45.stepsPerPitch };
      const x = richardson([1 / coarse.stepsPerPitch, 1 / fine.stepsPerPitch], [coarse.ratio, fine.ratio], 1);
      const wrong = { ratio: w3.drawn / w3.homogenized[2] };
      const sensitivity = w3.homogenized[1] / w3.homogenized[0]; // σ(hom, ε + 1 %)/σ(hom)
      const fromTable = Math.abs(sensitivity - 1) * (relErr / 0.01);
      // allowed: the table's error through the sensitivity, plus 1 % for the finite 8 × 8 block and
      // the grid (what the square block keeps against Perrins' infinite array, drawnLattices.test.ts)
      const allowed = fromTable + 0.01;
      // measured (session 7), σ drawn / σ homogenized at 2, 3, 4.5, 6 steps across the 0.143·A wall
      // (14, 21, 31, 42 steps per pitch): lit along x (E along y, ε_yy) 1.0217, 1.0178, 1.0151,
      // 1.0136 (3 and 4.5 extrapolated at first order: 1.0097); along y (ε_xx) 1.0235, 1.0018, 0.9958,
      // 0.9930 (0.9838); 1 % of ε moves σ by 7.4 % and 5.1 % (allowed 3.5 % and 2.7 %); against the
      // swapped values 0.49 along x, 2.08 along y
      const label = `angle ${angle}: σ ratio ${coarse.ratio} → ${fine.ratio} → ${x.value} (allowed ±${allowed}); swapped ${wrong.ratio}`;
      expect(Math.abs(fine.ratio - 1), label).toBeLessThan(allowed);
      expect(Math.abs(x.value - 1), label).toBeLessThan(allowed);
      expect(Math.abs(wrong.ratio - 1), label).toBeGreaterThan(3 * allowed);
    }
  }, 300_000);
});
