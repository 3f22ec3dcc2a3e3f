/**
 * Regression tests for the failures a robustness run found (issue "Nothing breaks, nothing hides,
 * nothing waits"): each case failed before its fix. Commands run in-process; every run is also
 * held to the shared invariants (invariants.ts).
 */
import { describe, it, expect, beforeAll } from "vitest";
import { mkdirSync, readFileSync, writeFileSync, symlinkSync } from "node:fs";
import { join, resolve } from "node:path";
import { run, runProblems, listFiles, type RunResult } from "./invariants.js";
import { tempDir } from "../helpers/tempDir.js";

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
  dir = tempDir("cw-regress-");
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
    // found by the 10 000-case run (seed 20261202): a frequency whose wavelength overflows printed "Infinity µm"
    r = await ok(["material", "water", "--frequency", "1e-308"]);
    expect(r.code).toBe(1);
    expect(r.err).toContain("--frequency");
    expect(r.out + r.err).not.toMatch(/Infinity|NaN/);
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

describe("design files: clear messages at the right place", () => {
  it("a stray character is reported at its line and column, a byte-order mark is accepted, no raw line breaks quoted", async () => {
    const text = readFileSync(join(DEMO, "field-beam-bend.json"), "utf8").split("\n");
    text[2] = `${text[2]}@`;
    let r = await ok(["field", put("stray.json", text.join("\n"))]);
    expect(r.code).toBe(1);
    expect(r.err).toMatch(new RegExp(`stray\\.json:3:${text[2].length}: invalid JSON: expected a double-quoted key, got '@'`));
    expect(r.err.trim().split("\n")).toHaveLength(1);
    r = await ok(["field", put("bom.json", `\uFEFF${readFileSync(join(DEMO, "field-beam-bend.json"), "utf8")}`)]);
    expect(r.code, r.err).toBe(0);
    r = await ok(["field", put("bom2.json", `{\n  "name": "x",\uFEFF\n}`)]);
    expect(r.err).toMatch(/bom2\.json:2:15: invalid JSON: expected a double-quoted key, got byte-order mark/);
    r = await ok(["field", put("after.json", `{"name": "x"}\n}`)]);
    expect(r.err).toMatch(/after\.json:2:1: invalid JSON: unexpected '\}' after the end of the JSON value/);
  });

  it("a non-string transform.kind is described, not echoed as [object Object]", async () => {
    const d = demo("field-beam-bend.json");
    d.transform.kind = { huge: "x".repeat(120_000) };
    const r = await ok(["field", put("kindobj.json", d)]);
    expect(r.code).toBe(1);
    expect(r.err).toContain("$.transform.kind: expected a transform kind");
    expect(r.err).toContain("got an object");
    expect(r.err.length).toBeLessThan(400);
  });

  it("bare numbers are SI: the message says radians or metres", async () => {
    const d = demo("field-beam-bend.json");
    d.transform.angle = "90";
    let r = await ok(["field", put("angle90.json", d)]);
    expect(r.err).toContain("$.transform.angle");
    expect(r.err).toContain("read as 90 rad (bare numbers are SI); write '90 deg' for degrees");
    d.transform.angle = "90 deg";
    d.transform.innerRadius = 60;
    r = await ok(["field", put("inner60.json", d)]);
    expect(r.err).toContain("$.transform.outerRadius: expected outerRadius > innerRadius");
    expect(r.err).toContain("innerRadius 60 is a bare number, read as 60 m");
  });

  it("expressions too long or too deeply nested are refused with a short message", async () => {
    const d = demo("field-expression.json");
    for (const [name, x, expected] of [
      ["deep", `${"(".repeat(500)}x${")".repeat(500)}`, "nested 500 deep; expected at most 60"],
      ["deeper", `${"(".repeat(20_000)}x${")".repeat(20_000)}`, "40001 characters; expected at most 2000"],
      ["long", Array(20_000).fill("x").join("+"), "39999 characters; expected at most 2000"],
    ]) {
      d.transform.virtual.x = x;
      const r = await ok(["field", put(`${name}.json`, d)]);
      expect(r.code).toBe(1);
      expect(r.err).toContain("$.transform.virtual.x");
      expect(r.err).toContain(expected);
      expect(r.err).not.toContain("call stack");
      expect(r.err.length).toBeLessThan(400);
    }
  });
});

describe("memory is estimated before allocating", () => {
  it("a sparse imported lattice (one cell 100 m away) is refused naming that row", async () => {
    const design = imported("far", [[0.001, 0.001, 2, 2, 2], [0.003, 0.001, 2, 2, 2], [100.001, 100.001, 2, 2, 2]]);
    for (const cmd of ["reduce", "plan"]) {
      const r = await ok(cmd === "plan" ? [cmd, design, "--out", join(dir, "far-out")] : [cmd, design], join(dir, "far-out"));
      expect(r.code).toBe(1);
      expect(r.err).toMatch(/far\.csv:4: the 3 cells span a lattice of 2\.50e\+9 positions .* lies 141 m from the middle/);
    }
  });

  it("a pitch whose cells exceed the memory budget is refused with the estimate and a pitch that fits", async () => {
    const d = demo("plan-printed-bend.json");
    d.grid.pitch = "0.05 mm"; // 8.8e5 cells: about 0.5 GB for plan
    process.env.CELLWRIGHT_MEMORY_LIMIT = "100 MB";
    try {
      const r = await ok(["plan", put("fine.json", d), "--out", join(dir, "fine")], join(dir, "fine"));
      expect(r.code).toBe(1);
      expect(r.err).toMatch(/\$\.grid\.pitch: a pitch of 0\.00005 m gives 8\.80e\+5 cells; plan needs about 0\.49\d* GB .* more than 0\.0977 GB \(CELLWRIGHT_MEMORY_LIMIT\); expected a pitch of at least 0\.000\d+ m/);
    } finally {
      delete process.env.CELLWRIGHT_MEMORY_LIMIT;
    }
  });

  it("a pitch of 1e-300 m (cell count past the number range) is refused without 'Infinity'", async () => {
    // found by the 10 000-case run (seed 20261202): "gives Infinity lattice cells"
    const d = demo("plan-microwave-mast-cloak.json");
    d.grid.pitch = 1e-300;
    const r = await ok(["field", put("tiny.json", d)]);
    expect(r.code).toBe(1);
    expect(r.err).toMatch(/\$\.grid\.pitch: a pitch of 1e-300 m gives more than 1\.80e\+308 lattice cells/);
  });

  it("a CSV with one point off the grid blames that point's line", async () => {
    const cells = square(4, () => [2, 2, 2]);
    cells[6][0] += 0.0003; // the 7th data row, line 8
    const design = imported("offgrid", cells);
    const r = await ok(["field", design]);
    expect(r.code).toBe(1);
    expect(r.err).toMatch(/offgrid\.csv:8: x_m = 0\.0053 is off the square grid of pitch 0\.002 m/);
  });
});

describe("large polygon regions do not wait", () => {
  it("reduce on a self-intersecting polygon of 100 000 points completes (it hung past 60 s)", async () => {
    // vertices at pseudo-random angles and radii (fixed sequence): nearly every edge crosses many others
    let seed = 12345;
    const rnd = (): number => (seed = (seed * 1103515245 + 12345) % 2147483648) / 2147483648;
    const points: [number, number][] = [];
    for (let k = 0; k < 100_000; k++) {
      const t = 2 * Math.PI * rnd(), r = 0.02 + 0.03 * rnd();
      points.push([r * Math.cos(t), r * Math.sin(t)]);
    }
    const d = demo("field-expression.json");
    d.transform.region = { polygon: points };
    d.grid.pitch = "4 mm";
    const r = await ok(["reduce", put("bigpolygon.json", d), "--json"]);
    expect(r.code, r.err).toBe(0);
    const out = JSON.parse(r.out);
    expect(out.cells).toBeGreaterThan(0);
    expect(out.schemes[0].boundarySamples).toBeGreaterThan(0);
  });
});

describe("found by the generated cases", () => {
  it("an empty reduction object names the missing scheme, not 'got undefined'", async () => {
    const d = demo("field-radial-cloak.json");
    d.reduction = {};
    const r = await ok(["reduce", put("noscheme.json", d)]);
    expect(r.code).toBe(1);
    expect(r.err).toContain("$.reduction.scheme: expected one of");
    expect(r.err).toContain("got nothing (the key is missing)");
  });

  it("verify --sweep far below the device's scale (1 Hz) is an input error at --sweep, as the single check refuses it (was exit 3: grid ordering)", async () => {
    const r = await ok(["verify", put("sweep-cloak.json", demo("field-radial-cloak.json")), "--resolution", "6", "--sweep", "1 Hz..2 Hz:2"]);
    expect(r.code, r.err).toBe(1);
    expect(r.err).toContain("--sweep: at 1 Hz, the device is");
    expect(r.err).toContain("below 1/100 of a wavelength");
  });

  it("verify --sweep at absurd frequencies (10⁹ THz) is refused by the memory estimate with a finite figure (was exit 3: grid ordering)", async () => {
    for (const band of ["1000 THz..2000 THz:2", "1e9 THz..2e9 THz:2"]) {
      const r = await ok(["verify", put("sweep-cloak.json", demo("field-radial-cloak.json")), "--resolution", "6", "--sweep", band]);
      expect(r.code, r.err).toBe(1);
      expect(r.err).toMatch(/--sweep: at .* THz one solve of the check needs about [\d.e+]+ GB/);
    }
  });

  it("verify honours the memory budget (CELLWRIGHT_MEMORY_LIMIT) for its solver: a 2 m margin's 1308² grid is refused at once (was solved for 3 minutes in 2.8 GB)", async () => {
    const before = process.env.CELLWRIGHT_MEMORY_LIMIT;
    process.env.CELLWRIGHT_MEMORY_LIMIT = "200 MB";
    try {
      const r = await ok(["verify", put("budget-cloak.json", demo("field-radial-cloak.json")), "--resolution", "6", "--margin", "2"]);
      expect(r.code, r.err).toBe(1);
      expect(r.err).toContain("--resolution: the grid for 6 points per wavelength");
      expect(r.err).toContain("CELLWRIGHT_MEMORY_LIMIT");
      expect(r.err).toContain("smaller --margin");
    } finally {
      if (before === undefined) delete process.env.CELLWRIGHT_MEMORY_LIMIT;
      else process.env.CELLWRIGHT_MEMORY_LIMIT = before;
    }
  });

  it("plan checks reduction.backgroundMaterial as verify does: a mistyped id and a mismatched index are input errors at its JSON path (were read only by verify)", async () => {
    const d = JSON.parse(readFileSync(resolve("tests/verify/fixtures/silica-graded-block.json"), "utf8"));
    const typo = await ok(["plan", put("bg-typo.json", { ...d, reduction: { ...d.reduction, backgroundMaterial: "fused-silca" } }), "--out", join(dir, "bg-typo-out")]);
    expect(typo.code, typo.err).toBe(1);
    expect(typo.err).toContain("$.reduction.backgroundMaterial: unknown material 'fused-silca'");
    expect(typo.err).toContain("did you mean");
    const off = await ok(["plan", put("bg-index.json", { ...d, reduction: { ...d.reduction, backgroundIndex: 1.6 } }), "--out", join(dir, "bg-index-out")]);
    expect(off.code, off.err).toBe(1);
    expect(off.err).toContain("$.reduction.backgroundMaterial");
    expect(off.err).toContain("set reduction.backgroundIndex to 1.444");
  });
});
