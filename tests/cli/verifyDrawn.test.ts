/**
 * `cellwright verify` on the rod lens demo, whose rods can all be drawn: the realized-geometry case
 * runs on its own grids and the homogenization error comes with its ladder in JSON, or the table
 * says in one line why it did not run; `--drawn-time` bounds it (here to two grids, to keep the test short) and refuses bad text.
 * The figures are checked for consistency (the extrapolated error against its own ladder), not
 * against a published value: the physics of the drawing is tested in tests/verify/drawnLattices.test.ts.
 */
import { describe, expect, it } from "vitest";
import { join } from "node:path";
import { DEMO_DIR, cliInTempDir } from "../helpers/cliInTempDir.js";

const LENS = join(DEMO_DIR, "plan-microwave-rod-lens.json"); // 253 cells of hexagonal alumina rods in air, Hz, 10 GHz
const cli = cliInTempDir("verify", "cw-verify-drawn-");

describe("verify: the drawn realized case on the rod lens demo", () => {
  it("two drawn grids within --drawn-time 12 (the main cases on one grid, --resolution 8): the error, its uncertainty and its ladder in JSON and in the table", async () => {
    const r = await cli.run([LENS, "--drawn-time", "12", "--resolution", "8", "--json"]);
    expect([0, 2], r.err).toContain(r.code);
    const s = JSON.parse(r.out);
    const geo = s.cases.find((c: { name: string }) => c.name === "realized-geometry");
    expect(geo.available, geo.reason).toBe(true);
    expect(geo.method).toBe("fdfd");
    const e = s.homogenizationError;
    expect(e.stepsAcrossFeature).toEqual([2, 3]);
    expect(e.featureM).toBeCloseTo(0.5e-3, 12); // a quarter of the 2 mm pitch (the walls are wider)
    expect(e.ratios).toHaveLength(2);
    // two grids: extrapolation at the nominal order (richardson.ts), uncertainty 3× the correction
    // (Roache 1998); the lens is an Hz scene, whose drawn order is first (drawnRun.ts DRAWN_HZ_ORDER)
    const d = (e.ratios[1] - e.ratios[0]) / ((e.stepsM[0] / e.stepsM[1]) ** 1 - 1);
    expect(Math.abs(e.relative - (e.ratios[1] + d - 1))).toBeLessThan(1e-12);
    expect(Math.abs(e.uncertainty - 3 * Math.abs(d))).toBeLessThan(1e-12);
    // the headline figure: no bare object here, so Δ = (σ_geometry − σ_realized)/S with S the larger
    // width, extrapolated the same way from its own ladder; converged when its uncertainty is within
    // --accuracy (default 2 %), and the exit code follows every figure's state
    expect(e.differenceScale).toBe("larger-width");
    expect(e.differenceScaleM).toBeGreaterThan(0);
    expect(e.differences).toHaveLength(2);
    const dd = (e.differences[1] - e.differences[0]) / ((e.stepsM[0] / e.stepsM[1]) ** 1 - 1);
    expect(Math.abs(e.difference - (e.differences[1] + dd))).toBeLessThan(1e-12);
    expect(Math.abs(e.differenceUncertainty - 3 * Math.abs(dd))).toBeLessThan(1e-12);
    expect(e.converged).toBe(e.differenceUncertainty <= 0.02);
    expect(s.converged).toBe(s.cases.every((c: { available: boolean; converged: boolean | null }) => !c.available || c.converged !== false) && e.converged !== false);
    expect(r.code).toBe(s.converged ? 0 : 2);
    expect(r.err).toMatch(/warning: expect about .* for realized-geometry|note: realized-geometry: drawn on grids of its own/);
    // the human table with too little time for two grids: the case's one-line reason
    const h = await cli.run([LENS, "--drawn-time", "3", "--resolution", "8"]);
    expect(h.out).toMatch(/^  realized-geometry .*not computed: drawing the inclusions \(smallest feature 500 µm\) needs a ladder of at least 2 grids .* over the time \(about .* in all, the check spends at most 3 s on the drawn case; --drawn-time sets it\)/m);
    expect(h.out).not.toMatch(/homogenization error of the plan/);
  }, 120_000);

  it("refuses a --drawn-time that is not a time", async () => {
    const r = await cli.run([LENS, "--drawn-time", "soon"]);
    expect(r.code).toBe(1);
    expect(r.err).toMatch(/--drawn-time.*expected a time such as '10 min', '90 s' or 0, got 'soon'/);
  });
});
