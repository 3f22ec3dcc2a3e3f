/**
 * The realized-geometry case (geometryScene.ts, runCheck.ts): each cell's inclusion drawn at its
 * size, solved on a grid that resolves it, against the homogenized realized map. Expected values:
 * - rods along z, field along them (Ez): the arithmetic (Wiener parallel) mean f·ε_i + (1 − f)·ε_h
 *   is exact in the quasi-static limit; field across them (Hz): Maxwell Garnett for cylinders,
 *   ε_h[(ε_i + ε_h) + f(ε_i − ε_h)]/[(ε_i + ε_h) − f(ε_i − ε_h)] (Sihvola, "Electromagnetic Mixing
 *   Formulas and Applications", IEE 1999, ch. 3 and 5); for a square array Rayleigh's correction is
 *   of order f⁴ (Perrins, McKenzie & McPhedran, Proc. R. Soc. Lond. A 369, 207 (1979)), about 2e-4
 *   here (from memory), far below the tolerances below.
 * - the homogenization limit: as the cell shrinks against the wavelength the drawn structure's
 *   scattering tends to the effective medium's (Sihvola 1999, ch. 1: mixing rules hold for
 *   inclusions small against the wavelength); the difference is expected to fall like (k·a)²
 *   (common practice for periodic media; measured here, each extrapolated from the drawn ladder of
 *   drawnLadder.ts, session 5 with exact box fractions: Ez 5.8 %, 1.4 %, 0.35 % at a = λ_eff/4.2,
 *   /8.4, /17 — a factor 4 per halving, (k·a)²; Hz 2.6 %, 0.83 %, 0.41 %, where the last is at the Hz
 *   drawing's own accuracy, about 0.5 %: tests/verify/drawnLattices.test.ts).
 */
import { describe, expect, it } from "vitest";
import type { Plan, Recipe } from "../../src/plan/planTypes.js";
import { deviceScene } from "../../src/verify/deviceScene.js";
import { DRAWN_STEPS, drawnStepFeature } from "../../src/verify/drawnLadder.js";
import { geometryScene, type BulkMaterial } from "../../src/verify/geometryScene.js";
import { mapFromPlan } from "../../src/verify/materialMap.js";
import { runCheck } from "../../src/verify/runCheck.js";
import type { CaseSpec } from "../../src/verify/verifyDevice.js";
import { expectClose } from "../helpers/close.js";
import { squareDeviceGrid } from "../helpers/squareDeviceGrid.js";

const C0 = 299_792_458;
const f = 10e9, lambda = C0 / f;
const vacuum = { eps: 1, mu: 1 };
const EPS_HOST = 2.1, EPS_ROD = 9.6;
const materials = new Map<string, BulkMaterial>([
  ["host", { eps: { re: EPS_HOST, im: 0 }, mu: { re: 1, im: 0 }, isMetal: false }],
  ["rod", { eps: { re: EPS_ROD, im: 0 }, mu: { re: 1, im: 0 }, isMetal: false }],
]);

/** Maxwell Garnett for cylinders, field across the axis. */
const mg2d = (eh: number, ei: number, fill: number): number => eh * ((ei + eh) + fill * (ei - eh)) / ((ei + eh) - fill * (ei - eh));

function uniformRodPlan(pol: "Ez" | "Hz", n: number, sideM: number, fill: number): Pick<Plan, "grid" | "level" | "levels" | "axisAngleRad"> {
  const a = sideM / n;
  const grid = squareDeviceGrid(n, a);
  const along = fill * EPS_ROD + (1 - fill) * EPS_HOST, across = mg2d(EPS_HOST, EPS_ROD, fill);
  const achieved = pol === "Ez" ? [along, 1, 1] : [1, across, across];
  const recipe = { family: "rods-in-host", host: "host", inclusion: "rod", lattice: "square", orientation: "z", fillFraction: fill, dimensions: { radius_m: a * Math.sqrt(fill / Math.PI) }, achieved, achievedIm: [0, 0, 0] } as unknown as Recipe;
  return { grid, level: new Int32Array(grid.count), levels: [{ index: 1, recipe } as Plan["levels"][number]], axisAngleRad: new Float64Array(grid.count) };
}

function run(pol: "Ez" | "Hz", n: number, opts: { resolution?: number; accuracy?: number } = {}) {
  const side = 0.25 * lambda;
  const plan = uniformRodPlan(pol, n, side, 0.2);
  const bg = pol === "Ez" ? { b: 1, t: 1 } : { b: 1, t: 1 };
  const hom = mapFromPlan(plan as Plan, bg);
  const d = geometryScene({ plan, materials, polarization: pol, background: vacuum, hidden: null });
  if (!d.ok) throw new Error(d.reason);
  const cases: CaseSpec[] = [
    { name: "realized", scene: deviceScene(plan.grid, pol, vacuum, hom, null), indexHint: Math.sqrt(EPS_ROD) },
    { name: "realized-geometry", scene: d.scene, indexHint: d.indexHint, maxStepM: drawnStepFeature(d.smallestFeatureM, side / n) / DRAWN_STEPS[0], featureM: drawnStepFeature(d.smallestFeatureM, side / n) },
  ];
  const h = side / 2;
  return runCheck({ method: "fdfd", transform: { kind: "rotator" } as never, polarization: pol, background: vacuum, frequencyHz: f, deviceBox: { minX: -h, maxX: h, minY: -h, maxY: h }, cases, marginM: 0.1 * lambda, ...opts });
}

describe("realized-geometry: inclusions drawn at their size", () => {
  it("draws a rod along z as a disc of the recipe's radius (area fraction = fill) and gives each polarization its constants: Ez b = ε, Hz T = ε", () => {
    for (const pol of ["Ez", "Hz"] as const) {
      const plan = uniformRodPlan(pol, 1, 0.01, 0.2);
      const d = geometryScene({ plan, materials, polarization: pol, background: vacuum, hidden: null });
      if (!d.ok) throw new Error(d.reason);
      const out = new Float64Array(8);
      let inside = 0;
      const m = 400;
      for (let p = 0; p < m; p++) for (let q = 0; q < m; q++) {
        d.scene.sample(-0.005 + ((p + 0.5) / m) * 0.01, -0.005 + ((q + 0.5) / m) * 0.01, out);
        if ((pol === "Ez" ? out[0] : out[2]) === EPS_ROD) inside++;
      }
      expect(Math.abs(inside / (m * m) - 0.2), "drawn area fraction").toBeLessThan(2e-3);
      d.scene.sample(0, 0, out);
      expect(pol === "Ez" ? [out[0], out[2], out[4]] : [out[0], out[2], out[4]]).toEqual(pol === "Ez" ? [EPS_ROD, 1, 1] : [1, EPS_ROD, EPS_ROD]);
      // smallest feature: the wall a − 2r = 0.495 a beside the rod's diameter 0.505 a
      expect(d.smallestFeatureM).toBeCloseTo(0.01 * (1 - 2 * Math.sqrt(0.2 / Math.PI)), 12);
    }
  });

  it("a uniform block of rods approaches its homogenized map as the cell shrinks (homogenization limit), within 1 % at a = λ_eff/17", () => {
    for (const pol of ["Ez", "Hz"] as const) {
      const errs = [2, 4, 8].map((n) => Math.abs(run(pol, n, { resolution: 12 }).homogenizationError!.relative!));
      expect(errs[1], `${pol}: ${errs}`).toBeLessThan(errs[0] / 3);
      expect(errs[2], `${pol}: ${errs}`).toBeLessThan(errs[1]);
      expect(errs[2], `${pol}: ${errs}`).toBeLessThan(0.01);
    }
  }, 120_000);

  it("on its own ladder the drawn case converges, and the homogenization error of coarse cells (a = λ_eff/4) stands out of its uncertainty", () => {
    const r = run("Ez", 2, { accuracy: 0.02 });
    const geo = r.cases.find((c) => c.name === "realized-geometry")!;
    expect(geo.available).toBe(true);
    expect(geo.ladder.length).toBeGreaterThanOrEqual(3);
    expect(geo.converged).toBe(true);
    expect(geo.method).toBe("fdfd");
    const e = r.homogenizationError!;
    expect(e.resolutions.length).toBeGreaterThanOrEqual(3);
    expect(e.uncertainty).not.toBeNull();
    expect(Math.abs(e.relative!)).toBeGreaterThan(3 * e.uncertainty!);
    // the headline figure: no bare object, so the difference of the widths over the larger one;
    // per rung Δ·S = σ_geometry − σ_realized = σ_geometry (1 − 1/ρ) (an identity between the outputs)
    expect(e.differenceScale).toBe("larger-width");
    expect(e.differenceScaleM).toBeGreaterThanOrEqual(geo.scatteringWidthM!);
    expect(Math.abs(e.difference)).toBeGreaterThan(3 * e.differenceUncertainty!);
    expect(e.converged).toBe(true);
    e.differences.forEach((d, k) => expectClose(d * e.differenceScaleM, geo.ladder[k].scatteringWidthM * (1 - 1 / e.ratios[k]), { rel: 1e-9, label: `Δ·S on rung ${k}` }));
    // the steps of the drawn ladder: DRAWN_STEPS across the wall, coarsest first
    const wall = Math.min((0.25 * lambda / 2) * (1 - 2 * Math.sqrt(0.2 / Math.PI)), 0.25 * lambda / 2 / 4); // the wall, at most a quarter pitch
    expect(e.stepsAcrossFeature).toEqual([...DRAWN_STEPS]);
    e.stepsM.forEach((h, k) => expect(h).toBeLessThanOrEqual((wall / DRAWN_STEPS[k]) * (1 + 1e-12)));
    expect(e.ratios.length).toBe(3);
  }, 120_000);

  it("with a hidden object the homogenization error is the change of σ/σ_bare: Δ over the bare width, the drawn σ/σ_bare the realized one plus Δ", () => {
    const side = 0.25 * lambda, n = 2;
    const plan = uniformRodPlan("Ez", n, side, 0.2);
    const hidden = { centerM: [0, 0] as [number, number], radiusM: 0.1 * side };
    const d = geometryScene({ plan, materials, polarization: "Ez", background: vacuum, hidden });
    if (!d.ok) throw new Error(d.reason);
    const feature = drawnStepFeature(d.smallestFeatureM, side / n);
    const cases: CaseSpec[] = [
      { name: "bare", scene: deviceScene(plan.grid, "Ez", vacuum, null, hidden), indexHint: 0 },
      { name: "realized", scene: deviceScene(plan.grid, "Ez", vacuum, mapFromPlan(plan as Plan, { b: 1, t: 1 }), hidden), indexHint: Math.sqrt(EPS_ROD) },
      { name: "realized-geometry", scene: d.scene, indexHint: d.indexHint, maxStepM: feature / DRAWN_STEPS[0], featureM: feature },
    ];
    const h = side / 2;
    const r = runCheck({ method: "fdfd", transform: { kind: "rotator" } as never, polarization: "Ez", background: vacuum, frequencyHz: f, deviceBox: { minX: -h, maxX: h, minY: -h, maxY: h }, cases, marginM: 0.1 * lambda, resolution: 12 });
    const e = r.homogenizationError!;
    const bare = r.cases.find((c) => c.name === "bare")!, realized = r.cases.find((c) => c.name === "realized")!, geo = r.cases.find((c) => c.name === "realized-geometry")!;
    expect(e.differenceScale).toBe("bare");
    expect(e.differenceScaleM).toBe(bare.scatteringWidthM);
    expect(e.vsBareDifference).toBe(e.difference);
    expectClose(geo.vsBare!, realized.vsBare! + e.difference, { rel: 1e-12, label: "drawn σ/σ_bare" });
    // per rung: Δ·σ_bare = σ_geometry − σ_realized = σ_geometry (1 − 1/ρ)
    e.differences.forEach((v, k) => expectClose(v * e.differenceScaleM, geo.ladder[k].scatteringWidthM * (1 - 1 / e.ratios[k]), { rel: 1e-9, label: `rung ${k}` }));
    expect(e.differenceUncertainty).not.toBeNull();
    expect(e.converged).toBe(e.differenceUncertainty! <= 0.02);
  }, 120_000);

  it("says why a cell cannot be drawn: spheres (3D), rods lying in the plane, split rings, metal inclusions", () => {
    const base = uniformRodPlan("Ez", 2, 0.01, 0.2);
    const withRecipe = (patch: Partial<Recipe>) => ({ ...base, levels: [{ ...base.levels[0], recipe: { ...base.levels[0].recipe!, ...patch } }] });
    const reason = (patch: Partial<Recipe>, mats = materials): string => {
      const d = geometryScene({ plan: withRecipe(patch), materials: mats, polarization: "Ez", background: vacuum, hidden: null });
      expect(d.ok).toBe(false);
      return d.ok ? "" : d.reason;
    };
    expect(reason({ family: "spheres-in-host" })).toMatch(/level 1: spheres-in-host are 3D inclusions.*2D, not the 3D, effective medium/);
    expect(reason({ orientation: "1" })).toMatch(/lying in the plane.*varies along z/);
    expect(reason({ family: "split-ring" })).toMatch(/resonant metal/);
    const metal = new Map(materials);
    metal.set("rod", { ...materials.get("rod")!, isMetal: true });
    expect(reason({}, metal)).toMatch(/metal 'rod'/);
  });

  it("a grid too large to draw the inclusions is not run: the case names the grid, its memory and how much coarser the features must be", () => {
    const r = run("Ez", 120);
    const geo = r.cases.find((c) => c.name === "realized-geometry")!;
    expect(geo.available).toBe(false);
    expect(geo.reason).toMatch(/drawing the inclusions \(smallest feature [\d.]+ [mµ]m\) needs a ladder of at least 2 grids from 2 steps across the smallest feature; at [\d.]+ steps across it: \d+ × \d+ nodes, over the (memory|size|time) \(.*\); it would fit with every feature about [\d.]+ times larger/);
    expect(r.homogenizationError).toBeNull();
    expect(r.cases.find((c) => c.name === "realized")!.available).toBe(true);
  }, 60_000);
});

describe("the drawn scene's exact box make-up (boxParts)", () => {
  it("gives every material's area fraction in a box as point sampling of the same scene does (200 × 200 points), and covers whole discs in its bounds", () => {
    // 6 × 6 cells: rods on a square lattice, holes on the hexagonal lattice, layers, solid cells and cells without a recipe
    const a = 1e-3, n = 6;
    const grid = squareDeviceGrid(n, a);
    const mats = new Map<string, BulkMaterial>([
      ["h1", { eps: { re: 2.1, im: 0 }, mu: { re: 1, im: 0 }, isMetal: false }], ["r1", { eps: { re: 9.6, im: 0.1 }, mu: { re: 1, im: 0 }, isMetal: false }],
      ["h2", { eps: { re: 4, im: 0 }, mu: { re: 1, im: 0 }, isMetal: false }], ["r2", { eps: { re: 1.5, im: 0 }, mu: { re: 1, im: 0 }, isMetal: false }],
      ["h3", { eps: { re: 3, im: 0 }, mu: { re: 1, im: 0 }, isMetal: false }], ["r3", { eps: { re: 6, im: 0 }, mu: { re: 1, im: 0 }, isMetal: false }],
      ["s", { eps: { re: 7, im: 0 }, mu: { re: 1, im: 0 }, isMetal: false }],
    ]);
    const rec = (r: object): Plan["levels"][number] => ({ index: 1, recipe: { achieved: [1, 1, 1], achievedIm: [0, 0, 0], fillFraction: 0.3, ...r } as unknown as Recipe } as Plan["levels"][number]);
    const levels = [
      rec({ family: "rods-in-host", host: "h1", inclusion: "r1", lattice: "square", orientation: "z", dimensions: { radius_m: 0.22 * a } }),
      rec({ family: "holes-in-slab", host: "h2", inclusion: "r2", lattice: "hex", orientation: "z", dimensions: { radius_m: 0.2 * a } }),
      rec({ family: "laminate", host: "h3", inclusion: "r3", lattice: "square", orientation: "1", dimensions: { thickness_m: 0.4 * a } }),
      rec({ family: "solid", host: "s", inclusion: "", lattice: "square", orientation: "z", dimensions: {} }),
    ];
    // left third rods, middle hexagonal holes, right: layers below, solid above; one corner without a recipe
    const level = Int32Array.from({ length: grid.count }, (_, c) => { const i = c % n, j = Math.floor(c / n); return i < 2 ? 0 : i < 4 ? 1 : j < 3 ? 2 : j === 5 && i === 5 ? -1 : 3; });
    const plan = { grid, level, levels, axisAngleRad: new Float64Array(grid.count).fill(0.3) };
    const d = geometryScene({ plan, materials: mats, polarization: "Ez", background: { eps: 1.2, mu: 1 }, hidden: null });
    if (!d.ok) throw new Error(d.reason);
    const scene = d.scene;
    expect(scene.boxParts).toBeDefined();
    const parts = new Float64Array(80), pt = new Float64Array(8);
    let seed = 12345;
    const rnd = (): number => { seed = (seed * 1103515245 + 12345) % 2147483648; return seed / 2147483648; };
    const lo = grid.originXM - a, span = (n + 1) * a;
    let worst = 0, cut = 0;
    for (let t = 0; t < 150; t++) {
      const h = a / (8 + 8 * rnd()), xc = lo + rnd() * span, yc = lo + rnd() * span;
      const k = scene.boxParts!(xc, yc, h, parts);
      expect(k).toBeGreaterThan(0);
      const exact = new Map<number, number>();
      let sum = 0;
      for (let p = 0; p < k; p++) { exact.set(parts[10 * p + 2], (exact.get(parts[10 * p + 2]) ?? 0) + parts[10 * p]); sum += parts[10 * p]; }
      expect(Math.abs(sum - 1)).toBeLessThan(1e-12);
      if (k > 1) cut++;
      const M = 200, counted = new Map<number, number>();
      for (let p = 0; p < M; p++) for (let q = 0; q < M; q++) {
        const kind = scene.sample(xc + ((p + 0.5) / M - 0.5) * h, yc + ((q + 0.5) / M - 0.5) * h, pt);
        const b = kind === 0 ? 1.2 : pt[0];
        counted.set(b, (counted.get(b) ?? 0) + 1 / (M * M));
      }
      for (const b of new Set([...exact.keys(), ...counted.keys()])) worst = Math.max(worst, Math.abs((exact.get(b) ?? 0) - (counted.get(b) ?? 0)));
    }
    // 200 points per side: a straight boundary along a side shifts the counted fraction by up to 1/400,
    // two such (a corner) by 1/200; measured worst 0.0023
    expect(worst).toBeLessThan(0.006);
    expect(cut).toBeGreaterThan(15);
    // every disc inside the bounds: hexagonal sites stand up to half a pitch from their cell's centre
    let outside = 0;
    for (let p = 0; p < 400; p++) for (let q = 0; q < 400; q++) {
      const x = lo - a + (p / 400) * (span + 2 * a), y = lo - a + (q / 400) * (span + 2 * a);
      if (scene.sample(x, y, pt) !== 0 && (x < scene.bounds.minX || x > scene.bounds.maxX || y < scene.bounds.minY || y > scene.bounds.maxY)) outside++;
    }
    expect(outside).toBe(0);
  });
});
