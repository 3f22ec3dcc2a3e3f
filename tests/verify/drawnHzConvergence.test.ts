/**
 * Drawn structures in Hz (H along z, E in the plane, across the rods' surfaces): the permittivity
 * enters the in-plane tensor, and the sub-pixel rule is the Kottke average — harmonic across the
 * interface normal, arithmetic along it (Kottke, Farjadpour & Johnson, Phys. Rev. E 77, 036611
 * (2008); Farjadpour et al., Opt. Lett. 31, 2972 (2006)) — taken with the exact area fractions and
 * the exact normal of a disc in each box (geometryScene.ts `boxParts`, discRectArea.ts,
 * discBoxNormal.ts), and the cross term A_xy carried by each face with its own box
 * (gridCoefficients.ts, stencil.ts).
 * Reference: a single circular cylinder, the exact Bessel–Hankel series (Bohren & Huffman,
 * "Absorption and Scattering of Light by Small Particles", 1983, §8.4; Balanis, "Advanced
 * Engineering Electromagnetics", 2nd ed., 2012, §11.5), cylinderSeries.ts, itself checked in
 * tests/verify/cylinderSeries.test.ts.
 * Order: the scheme is second order in smooth media; Kottke et al. report second order with their
 * average on grids where every field component has its own place. Here, at a curved interface, the
 * measured error is first order with a small constant (about 1.5 %/N at N steps across the radius
 * of an ε 9.6 rod). Why (measured in session 7, DEVELOPERS.md "Accuracy of the drawing"): the
 * scheme is exact for a planar interface along a grid axis but not for an oblique one — its residual
 * on the exact piecewise-linear field carries a mean dipole layer (about 0.016 h·sin²2θ for ε 9.6),
 * which acts as an interface shifted by a fixed share of h: a first-order error of one sign.
 * Measured before this rule (sampled fractions and normal, A_xy at the cell centres only), placement
 * (0.3, 0.1): the rod 9.1e-3, 3.5e-3, 4.4e-3, 3.7e-3, 3.4e-3 at 4, 6, 8, 12, 16 steps, the hole
 * 2.6e-3, −5.5e-3, −2.7e-3, −9.5e-4, −2.4e-3 (and −7.8e-3 at 12 steps with the disc centred on a
 * node) — irregular, up to about 1 %; the first two tests below fail with it.
 */
import { describe, expect, it } from "vitest";
import type { Plan, Recipe } from "../../src/plan/planTypes.js";
import { cylinderSeries, seriesScatteringWidth } from "../../src/verify/cylinderSeries.js";
import { gridForWindow } from "../../src/verify/fdfdGrid.js";
import { geometryScene, type BulkMaterial } from "../../src/verify/geometryScene.js";
import { crossSections, fluxBox } from "../../src/verify/metrics.js";
import type { Scene } from "../../src/verify/scene.js";
import { solveScene } from "../../src/verify/solve.js";
import { verifyDevice } from "../../src/verify/verifyDevice.js";
import { squareDeviceGrid } from "../helpers/squareDeviceGrid.js";

const material = (eps: number): BulkMaterial => ({ eps: { re: eps, im: 0 }, mu: { re: 1, im: 0 }, isMetal: false });

/** One cell of pitch 4R holding a rod (or hole) of radius R, drawn in Hz. */
function drawnOne(family: "rods-in-host" | "holes-in-slab", radiusM: number, host: number, inclusion: number, background: number): { scene: Scene; indexHint: number } {
  const grid = squareDeviceGrid(1, 4 * radiusM);
  const recipe = { family, host: "host", inclusion: "inc", lattice: "square", orientation: "z", fillFraction: 0, dimensions: { radius_m: radiusM }, achieved: [1, 1, 1], achievedIm: [0, 0, 0] } as unknown as Recipe;
  const plan = { grid, level: new Int32Array(1), levels: [{ index: 1, recipe } as Plan["levels"][number]], axisAngleRad: new Float64Array(1) };
  const d = geometryScene({ plan, materials: new Map([["host", material(host)], ["inc", material(inclusion)]]), polarization: "Hz", background: { eps: background, mu: 1 }, hidden: null });
  if (!d.ok) throw new Error(d.reason);
  return { scene: d.scene, indexHint: d.indexHint };
}

const k0 = 2 * Math.PI; // λ0 = 1 m
const R = 0.03;

/** σ_s / series − 1 on a grid of step R/steps whose window is shifted by (sx, sy)·h (a generic placement of the disc against the nodes). */
function relativeError(scene: Scene, series: number, steps: number, sx: number, sy: number): number {
  const h = R / steps, w = 0.22; // the cell (±0.1) and 0.12 of free space
  const sol = solveScene(scene, gridForWindow({ minX: -w + sx * h, maxX: w + sx * h, minY: -w + sy * h, maxY: w + sy * h }, h, 12), k0);
  return crossSections(sol, fluxBox(sol)!).scatteringM / series - 1;
}

/** Least-squares slope of log|e| against log N (the observed order). */
function observedOrder(steps: readonly number[], err: readonly number[]): number {
  const x = steps.map(Math.log), y = err.map((e) => Math.log(Math.abs(e)));
  const mx = x.reduce((s, v) => s + v, 0) / x.length, my = y.reduce((s, v) => s + v, 0) / y.length;
  let num = 0, den = 0;
  for (let k = 0; k < x.length; k++) { num += (x[k] - mx) * (y[k] - my); den += (x[k] - mx) ** 2; }
  return -num / den;
}

const PLACEMENTS = [[0.3, 0.1], [0.25, 0.7]] as const;

describe("drawn structures in Hz against the exact series (Kottke average with exact fractions and normals)", () => {
  it("an ε 9.6 rod in air (k0 R = 0.19): the error falls at every rung from 4 to 16 steps across the radius, at first order, below 0.3 % from 8 steps", () => {
    const rod = drawnOne("rods-in-host", R, 1, 9.6, 1).scene;
    const series = seriesScatteringWidth(cylinderSeries({ polarization: "Hz", radiusM: R, k0, background: { eps: 1, mu: 1 }, interior: { kind: "dielectric", eps: 9.6, mu: 1 } }));
    const steps = [4, 6, 8, 12, 16];
    for (const [sx, sy] of PLACEMENTS) {
      const err = steps.map((s) => relativeError(rod, series, s, sx, sy));
      // measured (session 6): (0.3, 0.1) 9.26e-3, 2.52e-3, 2.11e-3, 1.42e-3, 1.11e-3 (order 0.84 over
      // 6–16; 6.8e-4 at 24, 4.9e-4 at 32, 3.2e-4 at 48 steps: order 1.0–1.1);
      // (0.25, 0.7) 5.92e-3, 3.94e-3, 2.41e-3, 1.41e-3, 1.00e-3 (order 1.40)
      for (let k = 1; k < err.length; k++) expect(Math.abs(err[k]), `placement (${sx}, ${sy}): errors ${err}`).toBeLessThan(Math.abs(err[k - 1]));
      const p = observedOrder(steps.slice(1), err.slice(1));
      expect(p, `placement (${sx}, ${sy}): errors ${err}`).toBeGreaterThan(0.6);
      expect(p, `placement (${sx}, ${sy}): errors ${err}`).toBeLessThan(1.8);
      for (let k = 2; k < err.length; k++) expect(Math.abs(err[k]), `placement (${sx}, ${sy}): errors ${err}`).toBeLessThan(3e-3);
    }
  }, 60_000);

  it("an air hole in ε 10.2 (the host = the background): within 0.2 % of the series from 6 to 16 steps across the radius, within 1 % from 4", () => {
    const hole = drawnOne("holes-in-slab", R, 10.2, 1, 10.2).scene;
    const series = seriesScatteringWidth(cylinderSeries({ polarization: "Hz", radiusM: R, k0, background: { eps: 10.2, mu: 1 }, interior: { kind: "dielectric", eps: 1, mu: 1 } }));
    for (const [sx, sy] of PLACEMENTS) {
      const err = [4, 6, 8, 12, 16].map((s) => relativeError(hole, series, s, sx, sy));
      // measured (session 6): (0.3, 0.1) 4.8e-4, −3.1e-4, −1.17e-3, −1.02e-3, −1.22e-3 (−8.5e-4 at 24,
      // −8.0e-4 at 32, −4.9e-4 at 48 steps: first order from about 16 steps);
      // (0.25, 0.7) 5.50e-3, −5.2e-4, −1.44e-3, −1.42e-3, −1.19e-3
      expect(Math.abs(err[0]), `placement (${sx}, ${sy}): errors ${err}`).toBeLessThan(0.01);
      for (let k = 1; k < err.length; k++) expect(Math.abs(err[k]), `placement (${sx}, ${sy}): errors ${err}`).toBeLessThan(2e-3);
    }
  }, 60_000);

  it.each([
    ["an ε 9.6 rod in air", "rods-in-host", 1, 9.6, 1],
    ["an air hole in ε 10.2", "holes-in-slab", 10.2, 1, 10.2],
  ] as const)("%s at k R = 1 through verify's ladder at the default accuracy (2 %): within 1 % of the series, converged, the uncertainty covering the error", (_label, family, host, inclusion, bg) => {
    const C0 = 299_792_458, f = 10e9, lambda = C0 / f, k = (2 * Math.PI) / lambda;
    const r = 1 / (k * Math.sqrt(bg));
    const d = drawnOne(family, r, host, inclusion, bg);
    const out = verifyDevice({ polarization: "Hz", background: { eps: bg, mu: 1 }, frequencyHz: f, deviceBox: { minX: -r, maxX: r, minY: -r, maxY: r }, cases: [{ name: "ideal", ...d }], marginM: (0.3 * lambda) / Math.sqrt(bg), maxStepM: r / 2 });
    const series = seriesScatteringWidth(cylinderSeries({ polarization: "Hz", radiusM: r, k0: k, background: { eps: bg, mu: 1 }, interior: { kind: "dielectric", eps: family === "rods-in-host" ? inclusion : 1, mu: 1 } }));
    const c = out.cases[0];
    const err = c.scatteringWidthM! / series - 1;
    // measured (session 6; ladder 8, 11.3, 16 steps across the radius): the rod +1.5e-3 ± 5.6e-3, the
    // hole −1.6e-3 ± 1.7e-3 (before: +3.4e-3 ± 1.6e-2 and −2.3e-3 ± 4.4e-3)
    expect(Math.abs(err), `σ ${c.scatteringWidthM} vs ${series}`).toBeLessThan(0.01);
    expect(c.converged).toBe(true);
    expect(c.uncertainty! * c.scatteringWidthM!, `error ${err}, uncertainty ${c.uncertainty}`).toBeGreaterThanOrEqual(Math.abs(c.scatteringWidthM! - series));
  }, 60_000);
});
