/**
 * `cellwright verify --sweep` in-process (the frequencies run one after the other here: the worker
 * file exists only in the compiled tree, tested in tests/e2e/verifySweepBuilt.test.ts): the option
 * parser forward and its refusals, the CSV (columns with units, one row per frequency and case, no
 * NaN/Infinity/short rows), the output set's manifest, the JSON `sweep` object, and the sweep at
 * the design frequency equal to a plain `verify` there (one pipeline, not a second model).
 */
import { describe, expect, it } from "vitest";
import { existsSync, readFileSync, readdirSync } from "node:fs";
import { join } from "node:path";
import { parse } from "csv-parse/sync";
import { DEMO_DIR, cliInTempDir } from "../helpers/cliInTempDir.js";
import { parseSweep, parseThreshold } from "../../src/cli/commands/verifySweep.js";
import { InputError } from "../../src/core/errors.js";
import { checkOutputSet } from "../../src/io/outputSet.js";
import { expectClose } from "../helpers/close.js";

const DEMO = DEMO_DIR;
const CLOAK = join(DEMO, "field-radial-cloak.json"); // no realization, 9.4 GHz, Ez
const MAST = join(DEMO, "plan-microwave-mast-cloak.json"); // split rings, 8.5 GHz, Ez, unit-mu
const cli = cliInTempDir("verify", "cw-sweep-");
const run = cli.run;

describe("--sweep parser", () => {
  it("reads START..STOP:COUNT with units through the quantity parser", async () => {
    expect(await parseSweep("8 GHz..10 GHz:21")).toEqual({ startHz: 8e9, stopHz: 10e9, count: 21 });
    expect(await parseSweep(" 8e9 .. 1e10 : 3 ")).toEqual({ startHz: 8e9, stopHz: 1e10, count: 3 });
    expect(await parseSweep("9400 MHz..9.6 GHz:2")).toEqual({ startHz: 9.4e9, stopHz: 9.6e9, count: 2 });
    expect(await parseSweep("9 GHz..9 GHz:1")).toEqual({ startHz: 9e9, stopHz: 9e9, count: 1 });
  });

  it.each([
    ["8 GHz-10 GHz:21", /START\.\.STOP:COUNT/],
    ["8 GHz..10 GHz", /START\.\.STOP:COUNT/],
    ["8 GHz..10 GHz:0", /COUNT a whole number/],
    ["8 GHz..10 GHz:2.5", /COUNT a whole number/],
    ["8 GHz..10 GHz:100000", /COUNT a whole number/],
    ["10 GHz..8 GHz:3", /STOP above START/],
    ["8 GHz..10 GHz:1", /START = STOP/],
    ["0 Hz..10 GHz:3", /above 0/],
    ["8 mm..10 mm:3", /frequency/],
    ["eight..ten:3", /frequency/],
  ])("refuses '%s' naming --sweep and the expected form", async (text, message) => {
    const err = await parseSweep(text).then(() => null, (e: unknown) => e);
    expect(err).toBeInstanceOf(InputError);
    const issue = (err as InputError).issues[0];
    expect(issue.where).toMatch(/^--sweep/);
    expect(issue.message).toMatch(message);
  });

  it("--threshold is a factor above 1 (default 2)", () => {
    expect(parseThreshold(undefined)).toBe(2);
    expect(parseThreshold("3")).toBe(3);
    expect(parseThreshold("1.5x")).toBe(1.5);
    for (const bad of ["1", "0.5", "two", "-2", "Infinity"]) expect(() => parseThreshold(bad), bad).toThrow(InputError);
  });

  it("the command refuses a bad sweep or a lone --threshold with exit 1 and writes nothing", async () => {
    const out = join(cli.dir, "refused");
    for (const args of [
      [CLOAK, "--sweep", "8 GHz..10 GHz", "--out", out],
      [CLOAK, "--threshold", "2", "--out", out],
      [CLOAK, "--sweep", "8 GHz..10 GHz:3", "--threshold", "0.9", "--out", out],
      [CLOAK, "--workers", "2", "--out", out],
      [CLOAK, "--sweep", "8 GHz..10 GHz:3", "--workers", "0", "--out", out],
      [CLOAK, "--sweep", "8 GHz..10 GHz:3", "--workers", "1.5", "--out", out],
    ]) {
      const r = await run(args);
      expect(r.code, r.err).toBe(1);
      expect(r.err).toMatch(/error: --(sweep|threshold|workers)/);
      expect(r.out).toBe("");
    }
    expect(existsSync(out)).toBe(false);
  });

  it("--method radial where it does not apply is refused before anything is solved, naming --method", async () => {
    const out = join(cli.dir, "refused-radial");
    const r = await run([join(DEMO, "plan-microwave-rod-lens.json"), "--sweep", "8 GHz..10 GHz:3", "--method", "radial", "--out", out]);
    expect(r.code, r.err).toBe(1);
    expect(r.err).toMatch(/error: --method: radial does not apply/);
    expect(r.err).not.toMatch(/sweep: 1 of/);
    expect(existsSync(out)).toBe(false);
  });
});

describe("verify --sweep", () => {
  it("a design without a realization: bare, ideal and reduced at each frequency; CSV, SVG and manifest; no band", async () => {
    const out = join(cli.dir, "cloak");
    const r = await run([CLOAK, "--sweep", "9 GHz..9.8 GHz:3", "--resolution", "8", "--margin", "8 mm", "--json", "--out", out]);
    expect(r.code, r.err).toBe(0);
    expect(r.out.trim().split("\n")).toHaveLength(1);
    const s = JSON.parse(r.out);
    expect(s.sweep.frequenciesHz).toEqual([9e9, 9.4e9, 9.8e9]);
    expect(s.sweep.figure).toBe("vsBare");
    expect(s.sweep.cases.map((c: { name: string }) => c.name)).toEqual(["bare", "ideal", "reduced", "realized"]);
    const realized = s.sweep.cases[3];
    expect(realized.available).toBe(false);
    expect(realized.reason).toMatch(/no realization/);
    expect(realized.vsBare).toEqual([null, null, null]);
    expect(s.sweep.band).toMatchObject({ lowHz: null, highHz: null, threshold: 2 });
    expect(s.sweep.band.reason).toMatch(/no realized case/);
    expect(s.sweep.threads).toBe(0);
    expect(s.outputs.map((p: string) => p.split("/").pop())).toEqual(["verify-sweep.csv", "verify-sweep.svg", "manifest.json"]);
    expect((await checkOutputSet(out)).ok).toBe(true);
    expect(readdirSync(out).sort()).toEqual(["manifest.json", "verify-sweep.csv", "verify-sweep.svg"]);
    const text = readFileSync(join(out, "verify-sweep.csv"), "utf8");
    expect(text).not.toMatch(/NaN|Infinity/);
    const rows: Record<string, string>[] = parse(text, { columns: true });
    const header = text.split("\n")[0].split(",");
    expect(header).toEqual(["frequency_hz", "case", "method", "scattering_width_m", "absorption_width_m", "vs_bare", "uncertainty", "converged", "figure_uncertainty", "meets_limit"]);
    // --resolution asks for the grid: auto then solves every case on it, as the single-frequency check
    expect(rows.every((row) => row.method === "fdfd")).toBe(true);
    expect(s.method).toBe("fdfd");
    // nFreq × computed cases, every row full length
    expect(rows).toHaveLength(3 * 3);
    for (const line of text.trim().split("\n")) expect(line.split(",")).toHaveLength(header.length);
    expect(rows.map((row) => row.case)).toEqual(["bare", "ideal", "reduced", "bare", "ideal", "reduced", "bare", "ideal", "reduced"]);
    rows.forEach((row, k) => {
      expect(Number(row.frequency_hz)).toBe(s.sweep.frequenciesHz[Math.floor(k / 3)]);
      const c = s.sweep.cases.find((x: { name: string }) => x.name === row.case);
      expectClose(Number(row.vs_bare), c.vsBare[Math.floor(k / 3)], { rel: 1e-7, label: `row ${k}` });
      expect(row.uncertainty).toBe(""); // single grid
    });
    const svg = readFileSync(join(out, "verify-sweep.svg"), "utf8");
    expect(svg).toMatch(/^<svg/);
    expect(svg).toMatch(/frequency \(GHz\)/);
    for (const name of ["bare", "ideal", "reduced"]) expect(svg).toContain(`>${name}</text>`);
  }, 60_000);

  it("the split-ring mast cloak: realized figures move with the rings' resonance; the design frequency equals a plain verify", async () => {
    const out = join(cli.dir, "mast");
    const r = await run([MAST, "--sweep", "8.4 GHz..8.6 GHz:3", "--resolution", "8", "--json", "--out", out]);
    expect(r.code, r.err).toBe(0);
    const s = JSON.parse(r.out);
    const byName = Object.fromEntries(s.sweep.cases.map((c: { name: string }) => [c.name, c]));
    expect(Object.keys(byName)).toEqual(["bare", "ideal", "reduced", "realized", "realized-geometry"]);
    // split rings cannot be drawn: the drawn case says why at every frequency, never a copy of another case
    expect(byName["realized-geometry"].available).toBe(false);
    expect(byName["realized-geometry"].reason).toMatch(/split-ring cells are resonant metal structures/);
    expect(byName["realized-geometry"].scatteringWidthM).toEqual([null, null, null]);
    expect(s.sweep.homogenization).toBeNull();
    const plain = JSON.parse((await run([MAST, "--method", "fdfd", "--resolution", "8", "--json"])).out);
    for (const name of ["bare", "ideal", "reduced", "realized"]) {
      const one = plain.cases.find((c: { name: string }) => c.name === name);
      expectClose(byName[name].scatteringWidthM[1], one.scatteringWidthM, { rel: 1e-12, label: `${name} at 8.5 GHz` });
    }
    // rings built for μ' ≈ 0.15–0.3 with a 0.13 % tolerance band (the plan's bandwidth figure): ±1.2 %
    // in frequency moves the realized ratio by far more than the non-dispersive reduced map's
    const spread = (v: number[]) => (Math.max(...v) - Math.min(...v)) / Math.min(...v);
    expect(spread(byName.realized.vsBare)).toBeGreaterThan(3 * spread(byName.reduced.vsBare));
    // loss: the realized rings absorb, the lossless maps do not
    for (const a of byName.realized.absorptionWidthM) expect(a).toBeGreaterThan(0);
    const rows: Record<string, string>[] = parse(readFileSync(join(out, "verify-sweep.csv"), "utf8"), { columns: true });
    expect(rows).toHaveLength(3 * 4);
    // single grid: no uncertainty, the realized rows say yes/no against the band's limit, the others nothing
    for (const row of rows) {
      expect(row.figure_uncertainty).toBe("");
      expect(row.meets_limit).toBe(row.case === "realized" ? (Number(row.vs_bare) <= s.sweep.band.limit ? "yes" : "no") : "");
    }
    // the band is reported with the definition's figures
    const b = s.sweep.band;
    expect(b.threshold).toBe(2);
    expect(b.centreHz).toBe(8.5e9);
    expectClose(b.limit, 2 * byName.reduced.vsBare[1], { rel: 1e-12 });
    if (b.lowHz !== null) {
      expect(b.lowHz).toBeLessThanOrEqual(8.5e9);
      expect(b.highHz).toBeGreaterThanOrEqual(8.5e9);
    }
    expect([b.lowRangeHz, b.highRangeHz, b.lowConverged, b.highConverged, b.limitUncertainty]).toEqual([null, null, null, null, null]);
    expect(b.meetsLimit).toHaveLength(3);
  }, 120_000);
});
