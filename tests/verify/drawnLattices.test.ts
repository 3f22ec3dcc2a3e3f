/**
 * Drawn lattices (geometryScene.ts with src/plan/layout/hexSites.ts): a uniform block of rods drawn
 * at their size against the same block as an effective medium, at a cell small against the
 * wavelength (a = λ0/32), so that what is left is the drawing, not the homogenization.
 * Expected values:
 * - square array of circular rods, field across them (Hz): the closed form of Perrins, McKenzie &
 *   McPhedran, "Transport properties of regular arrays of cylinders", Proc. R. Soc. Lond. A 369,
 *   207 (1979), eq. (4.4) in the form with Keller's symmetry (references.md):
 *   ε/ε_h = 1 − 2f/(T + f − 0.305827 f⁴T/(T² − 1.402958 f⁸) − 0.013362 f⁸/T),
 *   T = (1 + ε_c/ε_h)/(1 − ε_c/ε_h);
 * - hexagonal array, field across (Hz): the project's solved cell table (hexCircleTable.ts,
 *   homogenizationTable.ts), itself checked against Perrins et al. 1979 and the Hashin–Shtrikman
 *   bounds in tests/cells; Maxwell Garnett for cylinders (Sihvola, "Electromagnetic Mixing Formulas
 *   and Applications", 1999, ch. 3) within 1 % of it at this fill, as a second source.
 * A hexagonal lattice does not tile a square block: its effective body is the union of its built
 * sites' Wigner–Seitz cells (hexagons of (√3/2)·a² each: the points whose nearest lattice site is
 * built) — the homogenized body the drawn rods are compared with.
 */
import { describe, expect, it } from "vitest";
import { expectClose } from "../helpers/close.js";
import { solvedInPlane } from "../../src/cells/homogenize/homogenizationTable.js";
import type { DeviceGrid } from "../../src/field/deviceGrid.js";
import { HEX_ROW, builtSiteAt, hexSiteCell, hexSitePosition, hexSites, nearestHexSite } from "../../src/plan/layout/hexSites.js";
import { planHexSites } from "../../src/plan/layout/planHexSites.js";
import type { Plan, Recipe } from "../../src/plan/planTypes.js";
import { deviceScene, latticeLookup } from "../../src/verify/deviceScene.js";
import { geometryScene, type BulkMaterial } from "../../src/verify/geometryScene.js";
import { mapFromPlan } from "../../src/verify/materialMap.js";
import { richardson } from "../../src/verify/richardson.js";
import type { Scene } from "../../src/verify/scene.js";
import { verifyDevice, type CaseSpec } from "../../src/verify/verifyDevice.js";
import { squareDeviceGrid } from "../helpers/squareDeviceGrid.js";

const C0 = 299_792_458;
const f = 10e9, lambda = C0 / f;
const vacuum = { eps: 1, mu: 1 };
const EPS_ROD = 9.6, FILL = 0.6, N = 8, A = lambda / 32;
const materials = new Map<string, BulkMaterial>([
  ["air", { eps: { re: 1, im: 0 }, mu: { re: 1, im: 0 }, isMetal: false }],
  ["rod", { eps: { re: EPS_ROD, im: 0 }, mu: { re: 1, im: 0 }, isMetal: false }],
]);

/** Perrins, McKenzie & McPhedran 1979, square array, field across the rods (see file comment). */
function perrinsSquare(eh: number, ec: number, fill: number): number {
  const T = (1 + ec / eh) / (1 - ec / eh);
  return eh * (1 - (2 * fill) / (T + fill - (0.305827 * fill ** 4 * T) / (T * T - 1.402958 * fill ** 8) - (0.013362 * fill ** 8) / T));
}

function blockPlan(lattice: "square" | "hex", radiusM: number, epsAcross: number, fill = FILL): Pick<Plan, "grid" | "level" | "levels" | "axisAngleRad"> {
  const grid = squareDeviceGrid(N, A);
  const recipe = { family: "rods-in-host", host: "air", inclusion: "rod", lattice, orientation: "z", fillFraction: fill, dimensions: { radius_m: radiusM }, achieved: [1, epsAcross, epsAcross], achievedIm: [0, 0, 0] } as unknown as Recipe;
  return { grid, level: new Int32Array(grid.count), levels: [{ index: 1, recipe } as Plan["levels"][number]], axisAngleRad: new Float64Array(grid.count) };
}

/** The hexagonal sites' Wigner–Seitz body — every point whose nearest site is built — filled with ε across = eps (Hz: T = ε·I, b = 1). */
function wignerSeitzBody(plan: ReturnType<typeof blockPlan>, eps: number): Scene {
  const s = planHexSites(plan)!.sites;
  const nm = new Int32Array(2);
  const half = (N / 2 + 1) * A;
  return {
    polarization: "Hz", background: vacuum, bounds: { minX: -half, maxX: half, minY: -half, maxY: half },
    sample(x, y, o) {
      nearestHexSite(plan.grid, x, y, nm);
      if (builtSiteAt(s, nm[0], nm[1]) >= 0) { o.fill(0); o[0] = 1; o[2] = eps; o[4] = eps; return 1; }
      return 0;
    },
  };
}

/** σ(drawn)/σ(homogenized body) on one grid of step = smallest feature / steps. */
function ratio(reference: Scene, plan: ReturnType<typeof blockPlan>, steps: number): { ratio: number; stepsPerPitch: number } {
  const d = geometryScene({ plan, materials, polarization: "Hz", background: vacuum, hidden: null });
  if (!d.ok) throw new Error(d.reason);
  const cases: CaseSpec[] = [
    { name: "realized", scene: reference, indexHint: Math.sqrt(EPS_ROD) },
    { name: "realized-geometry", scene: d.scene, indexHint: d.indexHint },
  ];
  const h = (N / 2 + 0.5) * A;
  const r = verifyDevice({ polarization: "Hz", background: vacuum, frequencyHz: f, deviceBox: { minX: -h, maxX: h, minY: -h, maxY: h }, cases, marginM: 0.08 * lambda, resolution: 12, maxStepM: d.smallestFeatureM / steps });
  const [hom, geo] = r.cases.map((c) => c.scatteringWidthM!);
  return { ratio: geo / hom, stepsPerPitch: A / r.grid.h };
}

describe("drawn lattices against their effective medium (a = λ0/32, fill 0.6, ε 9.6 rods in air, Hz)", () => {
  it("hexagonal rods drawn on the hexagonal sites scatter as their solved effective medium, converging as the grid refines; drawn one per square cell they do not", () => {
    const solved = solvedInPlane("hex", { re: 1, im: 0 }, { re: EPS_ROD, im: 0 }, FILL).eps.re;
    // Maxwell Garnett for cylinders (Sihvola 1999, ch. 3), a second source for the hexagonal value
    const mg = (EPS_ROD + 1 + FILL * (EPS_ROD - 1)) / (EPS_ROD + 1 - FILL * (EPS_ROD - 1));
    expect(Math.abs(solved / mg - 1)).toBeLessThan(0.01);
    const rHex = A * Math.sqrt((FILL * HEX_ROW) / Math.PI);
    const hexPlan = blockPlan("hex", rHex, solved);
    const ws = wignerSeitzBody(hexPlan, solved);
    const coarse = ratio(ws, hexPlan, 2), fine = ratio(ws, hexPlan, 3);
    // measured (67 sites built, the block's share rule), at 2, 3, 4.5 and 6 steps across the 0.19·a
    // wall (10.7, 16, 24, 32 steps per pitch): with the exact Kottke boxes and the cross term on the
    // faces (session 6) 1.0096, 1.0026, 1.0019, 1.0020; with sampled Kottke boxes and the cross term
    // at the cell centres (session 5) 1.0127, 1.0104, 1.0032, 1.0032. Both settle at 1.002: the 1.2 %
    // once read at 2–3 steps (and put down to the finite block's edge) was the grid's. (With the
    // hexagons approximated by one strip per row the same drawings read 1.019–1.027, and 0.9997–1.018
    // with other anchors and edge rules: a strip body is not a good enough reference at 1 %.)
    const x = richardson([1 / coarse.stepsPerPitch, 1 / fine.stepsPerPitch], [coarse.ratio, fine.ratio]);
    expect(Math.abs(fine.ratio - 1), `σ ratio ${coarse.ratio} → ${fine.ratio}`).toBeLessThan(Math.abs(coarse.ratio - 1));
    expect(Math.abs(coarse.ratio - 1), `σ ratio ${coarse.ratio} → ${fine.ratio}`).toBeLessThan(0.012);
    expect(Math.abs(fine.ratio - 1), `σ ratio ${coarse.ratio} → ${fine.ratio}`).toBeLessThan(0.005);
    expect(Math.abs(x.value - 1), `σ ratio ${coarse.ratio} → ${fine.ratio} → ${x.value}`).toBeLessThan(0.005);
    // the same radius one per square cell (what the layout files draw): area fraction fill·√3/2,
    // σ about (√3/2)² = 0.75 of the hexagonal body's (measured 0.74)
    const squarePlan = blockPlan("square", rHex, solved);
    const onSquare = ratio(deviceScene(squarePlan.grid as DeviceGrid, "Hz", vacuum, mapFromPlan(squarePlan as Plan, { b: 1, t: 1 }), null), squarePlan, 2);
    expect(onSquare.ratio).toBeLessThan(0.8);
  }, 60_000);

  it("square rods drawn at their cell centres scatter as the Perrins–McKenzie–McPhedran effective medium", () => {
    const fill = 0.5; // wall 0.20·a (at 0.6 it is 0.13·a and the grid twice as costly)
    const perrins = perrinsSquare(1, EPS_ROD, fill);
    const plan = blockPlan("square", A * Math.sqrt(fill / Math.PI), perrins, fill);
    const hom = deviceScene(plan.grid as DeviceGrid, "Hz", vacuum, mapFromPlan(plan as Plan, { b: 1, t: 1 }), null);
    const coarse = ratio(hom, plan, 2), fine = ratio(hom, plan, 3);
    // measured (session 6, exact Kottke boxes, cross term on the faces): 1.0216 at 9.9 steps per
    // pitch (2 across the wall), 1.0101 at 14.8 (3 across), extrapolated at second order 1.0009; on
    // at 4.5 and 6 steps across: 1.0098, 1.0089 (session 5, exact b fractions, sampled Kottke boxes:
    // 1.0317, 1.0140 → 0.9999; 1.0119, 1.0108 at 4.5 and 6 steps) — the finer grids still read
    // about 1.009, so the two-grid extrapolation to 1.00 owes something to the ladder; what is left
    // (under 1 %) is the finite 8 × 8 block against Perrins' infinite array or the grid (not separated here)
    const x = richardson([1 / coarse.stepsPerPitch, 1 / fine.stepsPerPitch], [coarse.ratio, fine.ratio]);
    expect(Math.abs(fine.ratio - 1), `σ ratio ${coarse.ratio} → ${fine.ratio}`).toBeLessThan(Math.abs(coarse.ratio - 1));
    expect(Math.abs(x.value - 1), `σ ratio ${coarse.ratio} → ${fine.ratio} → ${x.value}`).toBeLessThan(0.01);
  }, 60_000);

  it("places hexagonal sites one per (√3/2)·a², anchored on the grid's centre, each in the cell containing it, and finds the nearest site of any point", () => {
    const g = squareDeviceGrid(40, 1);
    const s = hexSites(g, latticeLookup(g), new Int32Array(g.count)); // one kind everywhere
    // the block spans [−20, 20]² (cell centres ±0.5 … ±19.5), anchored at its centre (0, 0), a cell
    // corner. Built: the sites whose share (radius a/2) stays in the block, i.e. centres in
    // [−19.5, 19.5]². Counted by rows (an independent count): rows at y = m·√3/2 with |m| ≤ 22;
    // even rows at x = n (39 sites, −19…19), odd rows at x = n + 1/2 (40 sites, −19.5…19.5):
    // 23·39 + 22·40 = 1777.
    expect(s.cell.length).toBe(1777);
    // density identity 2/(√3 a²): (39 a)² holds 1756.3 sites, the closed square's edges add up to a
    // row and a column
    expect(Math.abs(s.cell.length - (39 * 39) / HEX_ROW)).toBeLessThan(40 + 40 / HEX_ROW);
    // sites left out: those of the block's cells whose share crosses its outline
    expect(s.dropped).toBeGreaterThan(0);
    const key = (x: number, y: number): string => `${x.toFixed(9)},${y.toFixed(9)}`;
    const all = new Set<string>();
    for (let k = 0; k < s.cell.length; k++) all.add(key(s.xM[k], s.yM[k]));
    const out = new Int32Array(2), p = new Float64Array(2), ij = new Int32Array(2);
    for (let k = 0; k < s.cell.length; k++) {
      // mirror-symmetric about the grid's centre lines x = 0, y = 0 (the grid is centred on 0)
      expect(all.has(key(-s.xM[k], s.yM[k])) && all.has(key(s.xM[k], -s.yM[k])), `mirror of site ${k}`).toBe(true);
      // the site's cell contains it (within half a pitch of its centre)
      const c = s.cell[k];
      expect(Math.abs(s.xM[k] - g.xM[c])).toBeLessThanOrEqual(0.5);
      expect(Math.abs(s.yM[k] - g.yM[c])).toBeLessThanOrEqual(0.5);
      if (k % 37) continue;
      // a point a little off a site finds that site
      nearestHexSite(g, s.xM[k] + 0.3, s.yM[k] - 0.2, out);
      hexSitePosition(g, out[0], out[1], p);
      expect([p[0], p[1]]).toEqual([s.xM[k], s.yM[k]]);
      hexSiteCell(g, out[0], out[1], ij);
      expect(g.i[c] === ij[0] && g.j[c] === ij[1]).toBe(true);
    }
    // a site on a cell edge goes to the cell nearer the centre line, one on the centre line to the lower cell
    let onEdges = 0;
    for (let k = 0; k < s.cell.length; k++) {
      const c = s.cell[k];
      if (Math.abs(Math.abs(s.xM[k] - g.xM[c]) - 0.5) > 1e-12) continue;
      onEdges++;
      if (s.xM[k] === 0) expect(g.xM[c]).toBe(-0.5);
      else expect(Math.abs(g.xM[c])).toBeLessThan(Math.abs(s.xM[k]));
    }
    expect(onEdges).toBe(23 * 39); // every even row here
  });

  it("draws a hexagonal recipe at its fill (area fraction inside the block), refuses a 3D lattice by name, and leaves out the hexagonal sites whose share reaches a square-lattice half", () => {
    const rHex = A * Math.sqrt((FILL * HEX_ROW) / Math.PI);
    const plan = blockPlan("hex", rHex, 3);
    const d = geometryScene({ plan, materials, polarization: "Hz", background: vacuum, hidden: null });
    if (!d.ok) throw new Error(d.reason);
    // 8 × 8 cells: sites with centres in [−3.5a, 3.5a]² are built: 9 rows, 5 of 7 and 4 of 8 (the
    // row count of the 40 × 40 test above)
    expect(d.notes.join(" ")).toMatch(/anchored on the grid's centre \(67 sites built where their 64 cells' area holds 73.9\)/);
    const out = new Float64Array(8);
    let inside = 0;
    const m = 300, w = 4 * A; // the central 4 × 4 cells, away from the block's ragged edge
    for (let p = 0; p < m; p++) for (let q = 0; q < m; q++) {
      d.scene.sample(-w / 2 + ((p + 0.5) / m) * w, -w / 2 + ((q + 0.5) / m) * w, out);
      if (out[2] === EPS_ROD) inside++;
    }
    // a 4a × 4a window holds 18.5 Wigner–Seitz cells' worth of sites: fill within a disc or so (1/18)
    expect(Math.abs(inside / (m * m) - FILL)).toBeLessThan(FILL / 18);
    // rect lattices are drawn (drawnRectLattice.test.ts); a 3D lattice under a rod is refused by name
    const cubic = { ...plan, levels: [{ ...plan.levels[0], recipe: { ...plan.levels[0].recipe!, lattice: "cubic" } as unknown as Recipe }] };
    const r = geometryScene({ plan: cubic, materials, polarization: "Hz", background: vacuum, hidden: null });
    expect(r.ok ? "" : r.reason).toMatch(/level 1: a cubic lattice is not drawn \(square, hexagonal and rectangular lattices only\)/);
    // left half square-lattice discs of radius 0.45·a, right half hexagonal ones: the hexagonal sites
    // whose share reaches the square half are left out, so no disc crosses into the other half
    const mixed = { ...plan, level: Int32Array.from({ length: N * N }, (_, c) => (c % N < N / 2 ? 0 : 1)),
      levels: [{ index: 1, recipe: { ...plan.levels[0].recipe!, lattice: "square", dimensions: { radius_m: 0.45 * A } } as unknown as Recipe } as Plan["levels"][number], { ...plan.levels[0], index: 2 }] };
    const x = geometryScene({ plan: mixed, materials, polarization: "Hz", background: vacuum, hidden: null });
    if (!x.ok) throw new Error(x.reason);
    expect(x.notes.join(" ")).toMatch(/sites left out at the edge of their kind's cells .*: level 2: \d+ of \d+/);
    // walls across the halves' edge are at least two half walls, (a/2 − 0.45a) + (a/2 − rHex): the
    // narrowest feature stays the square level's own wall a − 0.9a (the levels' own features)
    expectClose(x.smallestFeatureM, Math.min(0.1 * A, 2 * rHex, A - 2 * rHex), { rel: 1e-9, label: "narrowest feature" });
    // every point of the square half is drawn as the square recipe: no hexagonal disc reaches it
    for (let p = 0; p < 200; p++) for (let q = 0; q < 200; q++) {
      const px = -4 * A + (p + 0.5) * (4 * A / 200), py = -4 * A + (q + 0.5) * (8 * A / 200);
      x.scene.sample(px, py, out);
      const i = Math.round(px / A + 3.5), j = Math.round(py / A + 3.5);
      const lx = px - (i - 3.5) * A, ly = py - (j - 3.5) * A;
      expect(out[2] === EPS_ROD, `(${px}, ${py})`).toBe(lx * lx + ly * ly < (0.45 * A) ** 2);
    }
  });
});
