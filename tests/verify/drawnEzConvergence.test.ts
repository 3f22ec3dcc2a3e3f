/**
 * Drawn structures in Ez (E along z, parallel to every interface of z-invariant rods and holes): the
 * permittivity enters the mass term, and the sub-pixel rule is the arithmetic area mean of ε over each
 * node's box (Farjadpour et al., Opt. Lett. 31, 2972 (2006); Kottke, Farjadpour & Johnson, Phys. Rev.
 * E 77, 036611 (2008)) — second order. The drawn scene hands the grid the exact area of every disc
 * in every box (geometryScene.ts `boxParts`, discRectArea.ts); these tests hold the order and the
 * smooth convergence that gives.
 * References:
 * - a single circular cylinder: the exact Bessel–Hankel series (Bohren & Huffman, "Absorption and
 *   Scattering of Light by Small Particles", 1983, §8.4; Balanis, "Advanced Engineering
 *   Electromagnetics", 2nd ed., 2012, §11.5), cylinderSeries.ts, itself checked in
 *   tests/verify/cylinderSeries.test.ts;
 * - a block of rods with E along them: its effective permittivity tends to the arithmetic (Wiener
 *   parallel) mean as the cell shrinks against the wavelength (Sihvola, "Electromagnetic Mixing
 *   Formulas and Applications", 1999, ch. 3 and 5); the departure is spatial dispersion, of order
 *   (k a)², so halving the cell divides it by about 4.
 */
import { describe, expect, it } from "vitest";
import type { Plan, Recipe } from "../../src/plan/planTypes.js";
import { cylinderSeries, seriesScatteringWidth } from "../../src/verify/cylinderSeries.js";
import { gridForWindow } from "../../src/verify/fdfdGrid.js";
import { geometryScene, type BulkMaterial } from "../../src/verify/geometryScene.js";
import { crossSections, fluxBox } from "../../src/verify/metrics.js";
import { richardson } from "../../src/verify/richardson.js";
import type { Scene } from "../../src/verify/scene.js";
import { solveScene } from "../../src/verify/solve.js";
import { squareDeviceGrid } from "../helpers/squareDeviceGrid.js";

const k0 = 2 * Math.PI; // λ0 = 1 m

const material = (eps: number): BulkMaterial => ({ eps: { re: eps, im: 0 }, mu: { re: 1, im: 0 }, isMetal: false });

/** A drawn plan: n × n cells of one recipe (rods or holes along z, square lattice). */
function drawn(family: "rods-in-host" | "holes-in-slab", n: number, pitchM: number, radiusM: number, host: number, inclusion: number, background: number): Scene {
  const grid = squareDeviceGrid(n, pitchM);
  const recipe = { family, host: "host", inclusion: "inc", lattice: "square", orientation: "z", fillFraction: 0, dimensions: { radius_m: radiusM }, achieved: [1, 1, 1], achievedIm: [0, 0, 0] } as unknown as Recipe;
  const plan = { grid, level: new Int32Array(grid.count), levels: [{ index: 1, recipe } as Plan["levels"][number]], axisAngleRad: new Float64Array(grid.count) };
  const d = geometryScene({ plan, materials: new Map([["host", material(host)], ["inc", material(inclusion)]]), polarization: "Ez", background: { eps: background, mu: 1 }, hidden: null });
  if (!d.ok) throw new Error(d.reason);
  return d.scene;
}

/** σ_s of a scene on a grid of step h, window = the box ± margin. */
function width(scene: Scene, halfM: number, marginM: number, h: number): number {
  const w = halfM + marginM;
  const sol = solveScene(scene, gridForWindow({ minX: -w, maxX: w, minY: -w, maxY: w }, h, 12), k0);
  return crossSections(sol, fluxBox(sol)!).scatteringM;
}

describe("drawn structures in Ez converge at second order", () => {
  it("an air hole drawn in ε = 10.2 (the cell's host = the background) against the exact series: second order, error falling at every step", () => {
    const R = 0.03, eps = 10.2;
    const scene = drawn("holes-in-slab", 1, 0.1, R, eps, 1, eps);
    const series = seriesScatteringWidth(cylinderSeries({ polarization: "Ez", radiusM: R, k0, background: { eps, mu: 1 }, interior: { kind: "dielectric", eps: 1, mu: 1 } }));
    const steps = [3, 6, 12]; // grid steps across the radius
    const err = steps.map((s) => Math.abs(width(scene, 0.05, 0.12, R / s) / series - 1));
    // measured (session 5): 4.25e-3, 1.07e-3, 2.60e-4 — order 2.0 (point-sampled boxes before:
    // 1.9e-4, 2.0e-4, 1.5e-4 at 3, 6, 12 and 1.5e-3 at 4 and 8: no order at all)
    expect(err[1], `errors ${err}`).toBeLessThan(err[0]);
    expect(err[2], `errors ${err}`).toBeLessThan(err[1]);
    const order = Math.log2(err[1] / err[2]);
    expect(Math.abs(order - 2), `observed order ${order} (errors ${err})`).toBeLessThan(0.3);
    expect(err[2]).toBeLessThan(5e-4);
  }, 60_000);

  it("a block of ε 9.6 rods in air (fill 0.6): σ settles to 1e-4 over the ladder, and tends to the arithmetic-mean block as the cell shrinks", () => {
    const fill = 0.6, eps = 9.6, n = 8;
    const mean = 1 + fill * (eps - 1);
    const ratios: number[] = [];
    for (const pitch of [1 / 32, 1 / 64]) {
      const half = (n / 2) * pitch;
      const rods = drawn("rods-in-host", n, pitch, pitch * Math.sqrt(fill / Math.PI), 1, eps, 1);
      const block: Scene = { polarization: "Ez", background: { eps: 1, mu: 1 }, bounds: { minX: -half, maxX: half, minY: -half, maxY: half },
        sample(x, y, o) { if (Math.abs(x) >= half || Math.abs(y) >= half) return 0; o.fill(0); o[0] = mean; o[2] = 1; o[4] = 1; return 1; } };
      const hs = [pitch / 8, pitch / 12, pitch / 16];
      const sigma = hs.map((h) => width(rods, half, 0.08, h));
      // measured at a = λ0/32: 0.0453711, 0.0453634, 0.0453619 m (point-sampled boxes before:
      // 0.045841, 0.045071, 0.045386 — a spread of 1.7 %)
      const spread = (Math.max(...sigma) - Math.min(...sigma)) / sigma[2];
      expect(spread, `σ ${sigma}`).toBeLessThan(1e-3);
      const x = richardson(hs, sigma);
      ratios.push(x.value / width(block, half, 0.08, hs[2]));
    }
    // measured: 1.0092 at a = λ0/32, 1.0027 at λ0/64 — the (k a)² spatial dispersion, quartered when a halves
    expect(ratios[0] - 1, `ratios ${ratios}`).toBeGreaterThan(0);
    expect(ratios[0] - 1, `ratios ${ratios}`).toBeLessThan(0.015);
    expect(Math.abs(ratios[1] - 1), `ratios ${ratios}`).toBeLessThan((ratios[0] - 1) / 2.5);
  }, 120_000);
});
