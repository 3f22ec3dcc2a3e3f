/**
 * `cellwright verify` end to end on small demo runs: one JSON object with --json, the SVG with
 * --out, the human table, and refusals (3D design, bad resolution) with exit 1 and nothing written.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { existsSync, mkdtempSync, readFileSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { bufferIo } from "../../src/cli/cliIo.js";
import { runCli } from "../../src/cli/run.js";
import { expectClose } from "../helpers/close.js";

const DEMO = join(import.meta.dirname, "..", "..", "demo-designs");
const CLOAK = join(DEMO, "field-radial-cloak.json"); // linear cloak a = 20 mm, b = 50 mm, 9.4 GHz, Ez
const CONCENTRATOR = join(DEMO, "plan-concentrator-subunity.json"); // Hz, non-magnetic, 5.8 GHz
const SPHERE = join(DEMO, "field-spherical-cloak.json");
let dir = "";
beforeAll(() => { dir = mkdtempSync(join(tmpdir(), "cw-verify-")); });
afterAll(() => rmSync(dir, { recursive: true, force: true }));

async function run(args: string[]) {
  const io = bufferIo(dir);
  const code = await runCli(["verify", ...args], io);
  return { code, out: io.out(), err: io.err() };
}

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
    const r = await run([CONCENTRATOR, "--resolution", "10", "--margin", "10 mm"]);
    expect(r.code, r.err).toBe(0);
    expect(r.out).toMatch(/Hz, scheme non-magnetic/);
    for (const name of ["ideal", "reduced", "realized"]) expect(r.out).toMatch(new RegExp(`^  ${name} `, "m"));
    expect(r.out).not.toMatch(/bare/);
  });

  it("refuses a 3D design and a bad resolution, writing nothing", async () => {
    const a = await run([SPHERE, "--out", "none3d"]);
    expect(a.code).toBe(1);
    expect(a.err).toMatch(/3D design cannot be verified/);
    expect(existsSync(join(dir, "none3d"))).toBe(false);
    const b = await run([CLOAK, "--resolution", "4", "--out", "nores"]);
    const d = await run([CLOAK, "--resolution", "10", "--accuracy", "2%"]);
    expect(d.code).toBe(1);
    expect(d.err).toMatch(/--accuracy/);
    expect(b.code).toBe(1);
    expect(b.err).toMatch(/--resolution: expected points per wavelength from 6/);
    expect(existsSync(join(dir, "nores"))).toBe(false);
    const c = await run([CLOAK, "--margin", "lots"]);
    expect(c.code).toBe(1);
    expect(c.err).toMatch(/--margin/);
  });
});
