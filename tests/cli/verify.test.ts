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
  it("--json on the radial cloak: one object; bare, ideal, reduced, realized; the ideal cloak scatters less than the bare mast", async () => {
    const r = await run([CLOAK, "--json", "--resolution", "10", "--margin", "8 mm", "--out", "figs"]);
    expect(r.code, r.err).toBe(0);
    const lines = r.out.trim().split("\n");
    expect(lines).toHaveLength(1);
    const s = JSON.parse(lines[0]);
    expect(s.polarization).toBe("Ez");
    expect(s.cases.map((c: { name: string }) => c.name)).toEqual(["bare", "ideal", "reduced", "realized"]);
    const [bare, ideal, reduced] = s.cases;
    expect(bare.vsBare).toBe(1);
    expect(ideal.vsBare).toBeLessThan(0.8);
    // the design's scheme is full (default), so reduced = ideal exactly
    expect(reduced.fieldErrorVsIdeal).toBe(0);
    expectClose(reduced.scatteringWidthM, ideal.scatteringWidthM, { rel: 1e-12, label: "reduced = ideal" });
    for (const c of s.cases) expect(Math.abs(c.absorptionWidthM) / c.scatteringWidthM, c.name).toBeLessThan(1e-8);
    expect(s.resolution).toBe(10);
    expect(s.outputs).toHaveLength(1);
    const svg = readFileSync(s.outputs[0], "utf8");
    expect(svg.startsWith("<svg")).toBe(true);
    expect(svg).toContain(">realized<");
    expect(r.err).toContain("… solve");
  });

  it("the human table for a Hz design lists the three cases", async () => {
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
    expect(b.code).toBe(1);
    expect(b.err).toMatch(/--resolution: expected points per wavelength from 10/);
    expect(existsSync(join(dir, "nores"))).toBe(false);
    const c = await run([CLOAK, "--margin", "lots"]);
    expect(c.code).toBe(1);
    expect(c.err).toMatch(/--margin/);
  });
});
