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
  return put(`${name}.json`, {
    name, frequency: "10 GHz", transform: { kind: "imported", file: `${name}.csv` }, grid: { pitch }, polarization: "Ez",
    realization: { materials: ["ptfe", "air"], families: ["laminate"] },
  });
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
    d.grid.pitch = "8 mm";
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

describe("ordinary mistakes are input errors (exit 1) naming the option or path", () => {
  it("--out too long, through a symlink loop, or onto a folder holding a directory named like an output", async () => {
    const bend = join(DEMO, "field-beam-bend.json");
    symlinkSync("loopB", join(dir, "loopA"));
    symlinkSync("loopA", join(dir, "loopB"));
    mkdirSync(join(dir, "dirout", "build-list.csv"), { recursive: true });
    const cases: [string[], string][] = [
      [["plan", bend, "--out", join(dir, "a".repeat(300), "x")], "a".repeat(40)],
      [["field", bend, "--out", join(dir, "b".repeat(300) + ".csv")], "b".repeat(40)],
      [["plan", bend, "--out", join(dir, "loopA", "x")], "loopA"],
      [["plan", bend, "--out", join(dir, "dirout")], "build-list.csv"],
    ];
    for (const [argv, named] of cases) {
      const r = await ok(argv);
      expect(r.code, r.err).toBe(1);
      expect(r.err).toContain(named);
    }
    expect(listFiles(join(dir, "dirout"))).toEqual(["build-list.csv/"]);
  });

  it("material --wavelength '1e-300 m' names its option; mix --aspect 1e-308 is a disk", async () => {
    let r = await ok(["material", "gold", "--wavelength", "1e-300 m"]);
    expect(r.code).toBe(1);
    expect(r.err).toContain("--wavelength");
    // a flat disk (aspect 1e-308) has the depolarization factor 1: a valid, finite mix now
    r = await ok(["mix", "--rule", "mg-ellipsoid", "--aspect", "1e-308", "--host", "1", "--inclusion", "4", "--fill", "0.3", "--json"]);
    expect(r.code).toBe(0);
    expect(JSON.parse(r.out).depolarization).toBe(1);
  });

  it("no NaN or Infinity in human output: gold at 1e300 m, strut lattice of pitch 1e300 m, mix host 1e300", async () => {
    const r1 = await ok(["material", "gold", "--wavelength", "1e300 m"]);
    const r2 = await ok(["cell", "strut-lattice", "--pitch", "1e3 m", "--frequency", "10 GHz", "--host", "air", "--inclusion", "photopolymer-resin", "--fill", "0.3"]);
    const r3 = await ok(["mix", "--rule", "mg-sphere", "--host", "1e300", "--inclusion", "4", "--target", "3"]);
    const r4 = await ok(["mix", "--rule", "bruggeman-3d", "--host", "1e300", "--inclusion", "4", "--fill", "0.5"]);
    for (const r of [r1, r2, r3, r4]) expect([0, 1, 2]).toContain(r.code);
  });

  it("--mu-tolerance '' is refused", async () => {
    const r = await ok(["reduce", join(DEMO, "field-radial-cloak.json"), "--mu-tolerance", ""]);
    expect(r.code).toBe(1);
    expect(r.err).toContain("--mu-tolerance");
  });
});

describe("cells without a target are named", () => {
  it("an imported cell with ε_zz = −3 is warned about and the plan exits 2", async () => {
    const design = imported("negzz", square(3, (i, j) => (i === 1 && j === 1 ? [2, 2, -3] : [2, 2, 2])));
    const out = join(dir, "negzz-out");
    const r = await ok(["plan", design, "--out", out], out);
    expect(r.code).toBe(2);
    expect(r.err).toMatch(/warning: 1 cell has no target .*x = 0\.003 m, y = 0\.003 m/);
  });
});

describe("physically meaningless scales are refused with the figure", () => {
  it("a 1 Hz design (device 1e-10 wavelengths) and a device of 10⁵ wavelengths", async () => {
    const d = demo("field-beam-bend.json");
    d.frequency = "1 Hz";
    let r = await ok(["plan", put("hz1.json", d), "--out", join(dir, "hz1")], join(dir, "hz1"));
    expect(r.code).toBe(1);
    expect(r.err).toMatch(/\$\.frequency: the device is 2\.\d+e-10 wavelengths across/);
    d.frequency = "1e15 THz";
    r = await ok(["plan", put("huge.json", d), "--out", join(dir, "huge")], join(dir, "huge"));
    expect(r.code).toBe(1);
    expect(r.err).toMatch(/wavelengths across .*10⁴/);
  });

  it("cell: a pitch of 1e300 m is refused at --pitch, not printed as Infinity", async () => {
    const r = await ok(["cell", "strut-lattice", "--pitch", "1e300 m", "--frequency", "10 GHz", "--host", "air", "--inclusion", "photopolymer-resin", "--fill", "0.3"]);
    expect(r.code).toBe(1);
    expect(r.err).toContain("--pitch");
  });
});
