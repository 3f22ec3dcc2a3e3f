/**
 * Regression tests for the failures a robustness run found (issue "Nothing breaks, nothing hides,
 * nothing waits"): each case failed before its fix. Commands run in-process; every run is also
 * held to the shared invariants (invariants.ts).
 */
import { describe, it, expect, beforeAll } from "vitest";
import { mkdtempSync, mkdirSync, readFileSync, writeFileSync, symlinkSync } from "node:fs";
import { tmpdir } from "node:os";
import { join, resolve } from "node:path";
import { run, runProblems, listFiles, type RunResult } from "./invariants.js";

const DEMO = resolve("demo-designs");
let dir = "";

function demo(name: string): any {
  return JSON.parse(readFileSync(join(DEMO, name), "utf8"));
}
function put(name: string, content: unknown): string {
  const path = join(dir, name);
  writeFileSync(path, typeof content === "string" ? content : JSON.stringify(content, null, 2));
  return path;
}
/** An imported field: `cells` rows of [x, y, eps_xx, eps_yy, eps_zz]. */
function imported(name: string, cells: number[][], pitch = "2 mm"): string {
  const rows = ["x_m,y_m,eps_xx,eps_yy,eps_zz,eps_xy,eps_xz,eps_yz", ...cells.map(([x, y, a, b, c]) => `${x},${y},${a},${b},${c},0,0,0`)];
  put(`${name}.csv`, rows.join("\n") + "\n");
  return put(`${name}.json`, { name, frequency: "10 GHz", transform: { kind: "imported", file: `${name}.csv` }, grid: { pitch }, polarization: "Ez" });
}
function square(n: number, value: (i: number, j: number) => number[]): number[][] {
  const out: number[][] = [];
  for (let j = 0; j < n; j++) for (let i = 0; i < n; i++) out.push([0.001 + 0.002 * i, 0.001 + 0.002 * j, ...value(i, j)]);
  return out;
}
async function ok(argv: string[], outDir: string | null = null): Promise<RunResult> {
  const r = await run(argv, dir);
  expect(runProblems(r, outDir, true), `${argv.join(" ")}\n${r.err}`).toEqual([]);
  return r;
}

beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), "cw-regress-"));
});

describe("output rows are complete and finite", () => {
  it("plan: cells whose target is undefined (beam bend, referenceRadius 1e-30 mm) get full rows", async () => {
    const d = demo("field-beam-bend.json");
    d.transform.referenceRadius = "1e-30 mm";
    d.grid.pitch = "4 mm";
    const out = join(dir, "bend30");
    const r = await ok(["plan", put("bend30.json", d), "--out", out], out);
    expect([0, 2]).toContain(r.code);
  });

  it("plan: an imported cell whose ε is not positive definite gets a full row (Ez and Hz)", async () => {
    const design = imported("npd", square(4, (i, j) => (i === 1 && j === 1 ? [-1e-12, 2, 2] : [2, 2, 2])));
    for (const pol of ["Ez", "Hz"]) {
      const out = join(dir, `npd-${pol}`);
      await ok(["plan", design, "--polarization", pol, "--out", out], out);
    }
  });

  it("field --out: no Infinity for all-zero imported ε nor for a beam shifter with shift 1e300 m", async () => {
    const zero = imported("zero", square(3, () => [0, 0, 0]));
    await ok(["field", zero, "--out", join(dir, "zero-out", "f.csv")], join(dir, "zero-out"));
    const d = demo("field-beam-shifter.json");
    d.transform.shift = "1e300 m";
    d.grid.pitch = "5 mm";
    await ok(["field", put("shift300.json", d), "--out", join(dir, "shift-out", "f.csv")], join(dir, "shift-out"));
  });
});

describe("accepted nonsense is refused", () => {
  it("a cap below the background is refused at $.transform.cap", async () => {
    const d = demo("field-radial-cloak.json");
    d.transform.cap = 0.5;
    const r = await ok(["field", put("cap05.json", d)]);
    expect(r.code).toBe(1);
    expect(r.err).toContain("$.transform.cap");
    expect(r.err).toContain("below the background");
  });
});
