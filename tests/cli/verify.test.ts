/**
 * `cellwright verify` end to end on small demo runs: one JSON object with --json, the SVG with
 * --out, the human table, and refusals (3D design, bad resolution) with exit 1 and nothing written.
 */
import { describe, expect, it } from "vitest";
import { existsSync, readFileSync } from "node:fs";
import { join } from "node:path";
import { DEMO_DIR, cliInTempDir } from "../helpers/cliInTempDir.js";
import { cylinderSeries, seriesScatteringWidth } from "../../src/verify/cylinderSeries.js";
import { expectClose } from "../helpers/close.js";

const DEMO = DEMO_DIR;
const CLOAK = join(DEMO, "field-radial-cloak.json"); // linear cloak a = 20 mm, b = 50 mm, 9.4 GHz, Ez
const CONCENTRATOR = join(DEMO, "plan-concentrator-subunity.json"); // Hz, non-magnetic, 5.8 GHz
const SPHERE = join(DEMO, "field-spherical-cloak.json");
const BEND = join(DEMO, "field-beam-bend.json"); // quarter-turn bend, 10 GHz, Ez
const MAST = join(DEMO, "plan-microwave-mast-cloak.json"); // reduced Ez cloak a = 25 mm, b = 60 mm, split rings, 8.5 GHz
const cli = cliInTempDir("verify", "cw-verify-");
const run = cli.run;

describe("verify command", () => {
  it("--json on the radial cloak: one object; bare, ideal, reduced, and a realized case that says why it is absent", async () => {
    const r = await run([CLOAK, "--json", "--resolution", "10", "--margin", "8 mm", "--out", "figs"]);
    expect(r.code, r.err).toBe(0);
    const lines = r.out.trim().split("\n");
    expect(lines).toHaveLength(1);
    const s = JSON.parse(lines[0]);
    expect(s.polarization).toBe("Ez");
    expect(s.method).toBe("fdfd");
    expect(s.cases.map((c: { name: string }) => c.name)).toEqual(["bare", "ideal", "reduced", "realized"]);
    const [bare, ideal, reduced, realized] = s.cases;
    expect(bare.vsBare).toBe(1);
    expect(ideal.vsBare).toBeLessThan(0.8);
    // the design's scheme is full (default), so reduced = ideal exactly
    expect(reduced.fieldErrorVsIdeal).toBe(0);
    expectClose(reduced.scatteringWidthM, ideal.scatteringWidthM, { rel: 1e-12, label: "reduced = ideal" });
    for (const c of s.cases.slice(0, 3)) expect(Math.abs(c.absorptionWidthM) / c.scatteringWidthM, c.name).toBeLessThan(1e-8);
    // no realization in this design: no realized figures, and the reason
    expect(realized).toMatchObject({ available: false, scatteringWidthM: null, vsBare: null, uncertainty: null });
    expect(realized.reason).toMatch(/no realization/);
    // single grid: no uncertainty; radial device: bistatic pattern per degree
    expect(ideal.uncertainty).toBeNull();
    expect(ideal.converged).toBeNull();
    expect(ideal.bistaticM).toHaveLength(360);
    expect(s.resolutions).toEqual([10]);
    expect(s.outputs).toHaveLength(1);
    const svg = readFileSync(s.outputs[0], "utf8");
    expect(svg.startsWith("<svg")).toBe(true);
    expect(svg).toContain(">reduced<");
    expect(svg).not.toContain(">realized<");
    expect(r.err).toContain("… solve");
  });

  it("the human table for a Hz design with a realization lists the three cases and the realized-geometry case's reason", async () => {
    const r = await run([CONCENTRATOR, "--resolution", "10", "--margin", "10 mm", "--drawn-time", "0"]);
    expect(r.code, r.err).toBe(0);
    expect(r.out).toMatch(/Hz, scheme non-magnetic/);
    expect(r.out).toMatch(/^  realized-geometry .*not computed: not run \(--drawn-time 0\)$/m);
    for (const name of ["ideal", "reduced", "realized"]) expect(r.out).toMatch(new RegExp(`^  ${name} `, "m"));
    expect(r.out).not.toMatch(/bare/);
  });

  it("refuses a 3D design and a bad resolution, writing nothing", async () => {
    const a = await run([SPHERE, "--out", "none3d"]);
    expect(a.code).toBe(1);
    expect(a.err).toMatch(/3D design cannot be verified/);
    expect(existsSync(join(cli.dir, "none3d"))).toBe(false);
    const b = await run([CLOAK, "--resolution", "4", "--out", "nores"]);
    const d = await run([CLOAK, "--resolution", "10", "--accuracy", "2%"]);
    expect(d.code).toBe(1);
    expect(d.err).toMatch(/--accuracy/);
    expect(b.code).toBe(1);
    expect(b.err).toMatch(/--resolution: expected points per wavelength from 6/);
    expect(existsSync(join(cli.dir, "nores"))).toBe(false);
    const c = await run([CLOAK, "--margin", "lots"]);
    expect(c.code).toBe(1);
    expect(c.err).toMatch(/--margin/);
  });
});

describe("verify notes", () => {
  it("human output prints each note once (in the table, not again on stderr); --json puts them in the JSON and on stderr", async () => {
    const h = await run([CLOAK, "--method", "fdfd", "--resolution", "8"]);
    expect(h.code, h.err).toBe(0);
    expect(h.out).toMatch(/^  note: single grid \(--resolution\): no convergence ladder/m);
    expect(h.err).not.toMatch(/note: single grid/);
    const j = await run([CLOAK, "--method", "fdfd", "--resolution", "8", "--json"]);
    expect(JSON.parse(j.out).notes.join("\n")).toMatch(/single grid \(--resolution\)/);
    expect(j.err).toMatch(/note: single grid/);
  }, 60_000);
});

describe("verify --method auto (the default)", () => {
  it("the cylindrical cloak demo goes to the exact radial solver: no grid, the bare mast equals the PEC series (Balanis, Advanced Engineering Electromagnetics, 2nd ed. 2012, §11.5)", async () => {
    const r = await run([CLOAK, "--json"]);
    expect(r.code, r.err).toBe(0);
    const s = JSON.parse(r.out);
    expect(s.method).toBe("radial");
    expect(s.methodReason).toMatch(/depend on r only.*\(auto\)/);
    expect(s.grid).toBeNull();
    expect(s.resolutions).toEqual([]);
    const [bare, ideal, , realized] = s.cases;
    expect(bare.method).toBe("radial");
    const k0 = (2 * Math.PI * 9.4e9) / 299_792_458;
    expectClose(bare.scatteringWidthM, seriesScatteringWidth(cylinderSeries({ polarization: "Ez", radiusM: 0.02, k0, background: { eps: 1, mu: 1 }, interior: { kind: "pec" } })), { rel: 1e-7, label: "bare mast" });
    expect(ideal.converged).toBe(true);
    expect(ideal.vsBare).toBeLessThan(0.1);
    expect(ideal.bistaticM).toHaveLength(360);
    // a case with nothing to solve names no solver
    expect(realized).toMatchObject({ available: false, method: null, methodReason: null });
    const h = await run([CLOAK]);
    expect(h.out).toMatch(/exact radial solver \(no grid\)/);
    expect(h.out).not.toMatch(/finest grid/);
  });

  it("a bend takes the grid and says why; so does a beam on the cloak", async () => {
    const r = await run([BEND, "--json", "--resolution", "8"]);
    expect(r.code, r.err).toBe(0);
    const s = JSON.parse(r.out);
    expect(s.method).toBe("fdfd");
    expect(s.methodReason).toMatch(/auto: the beam-bend transform is not a radial device/);
    for (const c of s.cases.filter((x: { available: boolean }) => x.available)) expect(c.method).toBe("fdfd");
    const b = await run([CLOAK, "--json", "--resolution", "8", "--beam", "60 mm"]);
    expect(b.code, b.err).toBe(0);
    const sb = JSON.parse(b.out);
    expect(sb.method).toBe("fdfd");
    expect(sb.methodReason).toMatch(/a beam is not a plane wave/);
    // every beam case lists its lobes (directions, shares of the outgoing power); a plane wave none
    for (const c of sb.cases.filter((x: { available: boolean }) => x.available)) {
      expect(c.lobes.length, c.name).toBeGreaterThan(0);
      for (const l of c.lobes) expect(l.share).toBeGreaterThan(0);
      expect(c.lobes.reduce((a: number, l: { share: number }) => a + l.share, 0)).toBeLessThanOrEqual(1 + 1e-9);
    }
    for (const c of s.cases.filter((x: { available: boolean }) => x.available)) expect(c.lobes).toBeNull();
  });

  it("--beam places the focus across the beam by the offset and along it by the shift; malformed lists are refused", async () => {
    const base = await run([BEND, "--json", "--resolution", "6", "--beam", "40 mm"]);
    expect(base.code, base.err).toBe(0);
    const moved = await run([BEND, "--json", "--resolution", "6", "--angle", "30", "--beam", "40 mm, 5 mm, -30 mm"]);
    expect(moved.code, moved.err).toBe(0);
    const [cx, cy] = JSON.parse(base.out).illumination.focusM as number[];
    const ill = JSON.parse(moved.out).illumination;
    expect(ill.waistM).toBe(0.04);
    // identity: focus = centre + D·(−sin φ, cos φ) + S·(cos φ, sin φ), φ = 30°
    const phi = Math.PI / 6;
    expectClose(ill.focusM[0], cx - 0.005 * Math.sin(phi) - 0.03 * Math.cos(phi), { rel: 1e-12, abs: 1e-15, label: "focus x" });
    expectClose(ill.focusM[1], cy + 0.005 * Math.cos(phi) - 0.03 * Math.sin(phi), { rel: 1e-12, abs: 1e-15, label: "focus y" });
    const human = await run([BEND, "--resolution", "6", "--beam", "40 mm, 0 mm, -30 mm"]);
    expect(human.code, human.err).toBe(0);
    expect(human.out).toMatch(/Gaussian beam at 0°, waist 40 mm, focus \(/);
    for (const bad of ["40 mm, , 3 mm", "40 mm, 1 mm, 2 mm, 3 mm", "40 mm,"]) {
      const r = await run([BEND, "--resolution", "6", "--beam", bad]);
      expect(r.code, bad).toBe(1);
      expect(r.err).toMatch(/--beam: expected 'WAIST', 'WAIST, OFFSET' or 'WAIST, OFFSET, SHIFT'/);
    }
  });

  it("a radial cloak with a realization: bare, ideal and reduced exact, the realized map (square cells) on the grid beside a grid bare object", async () => {
    const r = await run([MAST, "--json", "--accuracy", "10%"]);
    expect([0, 2], r.err).toContain(r.code);
    const s = JSON.parse(r.out);
    expect(s.method).toBe("radial+fdfd");
    expect(s.methodReason).toMatch(/finite differences for realized/);
    const by = Object.fromEntries(s.cases.map((c: { name: string }) => [c.name, c]));
    for (const n of ["bare", "ideal", "reduced"]) expect(by[n].method, n).toBe("radial");
    expect(by.realized.method).toBe("fdfd");
    expect(by.realized.methodReason).toMatch(/not radial/);
    expect(by.realized.ladder.length).toBeGreaterThanOrEqual(3);
    // split rings have no drawable z-invariant section: the drawn case says why, and there is no homogenization error
    expect(by["realized-geometry"]).toMatchObject({ available: false, method: null });
    expect(by["realized-geometry"].reason).toMatch(/levels? [\d, ]+: split-ring cells are resonant metal structures/);
    expect(s.homogenizationError).toBeNull();
    // σ/σ_bare of the grid case is taken against the grid's bare object, rung by rung
    for (const p of by.realized.ladder) expectClose(p.vsBare * by.bare.scatteringWidthM, p.scatteringWidthM, { rel: 0.1, label: `rung ${p.resolution}: grid bare within 10 % of the exact one` });
    expect(s.grid).not.toBeNull();
    // the reduced Ez cloak has a finite floor (Yan, Ruan & Qiu, PRL 99, 233901 (2007)): not invisible
    expect(by.reduced.vsBare).toBeGreaterThan(0.1);
  });

  it("--method fdfd forces the grid on a radial cloak; grid options under auto ask for the grid too", async () => {
    const r = await run([CLOAK, "--json", "--method", "fdfd", "--resolution", "8"]);
    expect(JSON.parse(r.out).methodReason).toMatch(/--method fdfd/);
    const a = await run([CLOAK, "--json", "--resolution", "8"]);
    const s = JSON.parse(a.out);
    expect(s.method).toBe("fdfd");
    expect(s.methodReason).toMatch(/--resolution asks for the grid/);
  });
});

