/** `cellwright field`: JSON summary, --at, --out, human output, and bad input (one line, exit 1, no file). */
import { describe, it, expect } from "vitest";
import { writeFileSync, existsSync, readFileSync, readdirSync } from "node:fs";
import { join } from "node:path";
import { expectClose } from "../helpers/close.js";
import { DEMO_DIR, cliInTempDir } from "../helpers/cliInTempDir.js";

const DEMO = DEMO_DIR;
const cli = cliInTempDir("field", "cw-field-");
const run = cli.run;

function design(name: string, json: unknown): string {
  writeFileSync(join(cli.dir, name), JSON.stringify(json, null, 2));
  return name;
}

describe("field --json", () => {
  it("prints exactly one JSON object with the documented keys", async () => {
    const r = await run([join(DEMO, "field-radial-cloak.json"), "--json"]);
    expect(r.code).toBe(0);
    expect(r.out.trim().split("\n")).toHaveLength(1);
    const j = JSON.parse(r.out);
    expect(Object.keys(j)).toEqual(expect.arrayContaining(["cells", "eps", "mu", "maxAnisotropy", "cellsWithPrincipalBelowOne", "capped"]));
    expect(Object.keys(j.eps.min)).toEqual(["xx", "yy", "zz", "xy", "xz", "yz"]);
    expect(j.cells).toBeGreaterThan(100);
    expect(j.capped).toBeGreaterThan(0);
    // linear cloak: ε_z ≤ (b/(b−a))² (r'−a)/r' ≤ (b/(b−a))²(b−a)/b = b/(b−a) at r' = b
    // (Pendry, Schurig, Smith, Science 312, 1780 (2006)); a = 20 mm, b = 50 mm
    expectClose(j.eps.max.zz, 50 / 30, { rel: 0.02, label: "max eps_zz" });
    expect(j.eps.max.zz).toBeLessThanOrEqual(50 / 30 + 1e-12);
  });

  it("--at gives the exact tensors at a point, not a cell centre", async () => {
    const r = await run([join(DEMO, "field-radial-cloak.json"), "--at", "31 mm,0 mm", "--json"]);
    expect(r.code).toBe(0);
    const j = JSON.parse(r.out);
    const a = 0.02, b = 0.05, rp = 0.031;
    expectClose([j.x_m, j.y_m], [0.031, 0], { rel: 1e-15, label: "point" });
    // on the x axis ε_xx = ε_r = (r'−a)/r', ε_yy = ε_θ = r'/(r'−a), ε_zz = (b/(b−a))²(r'−a)/r' (Pendry et al. 2006)
    expectClose([j.eps.xx, j.eps.yy, j.eps.zz], [(rp - a) / rp, rp / (rp - a), (b / (b - a)) ** 2 * (rp - a) / rp], { rel: 1e-12, label: "eps" });
    expectClose(j.epsPrincipal, [(rp - a) / rp, (b / (b - a)) ** 2 * (rp - a) / rp, rp / (rp - a)], { rel: 1e-12, label: "principal" });
    // det J = 1/det K, det K = h' h/r' with h = b(r'−a)/(b−a)
    expectClose(j.detJ, 1 / ((b / (b - a)) * (b * (rp - a) / (b - a)) / rp), { rel: 1e-12, label: "det J" });
  });

  it("--at outside the device is an input error", async () => {
    const r = await run([join(DEMO, "field-radial-cloak.json"), "--at", "1 mm,0", "--json"]);
    expect(r.code).toBe(1);
    expect(r.out).toBe("");
    expect(r.err).toMatch(/^error: --at: the point .* is outside the device/);
  });
});

describe("field --out and human output", () => {
  it("writes the per-cell CSV and a summary within 80 columns", async () => {
    const out = join(cli.dir, "cloak.csv");
    const r = await run([join(DEMO, "field-radial-cloak.json"), "--out", out]);
    expect(r.code).toBe(0);
    // the summary fits 80 columns; the last line echoes the output path, whose length is the caller's
    expect(r.out).toContain(`  wrote ${out}\n`);
    for (const line of r.out.split("\n").filter((l) => l !== `  wrote ${out}`)) expect(line.length, line).toBeLessThanOrEqual(80);
    expect(r.out).toMatch(/capped cells: \d+ \(inner offset 0\.5 mm, cap 100/);
    const lines = readFileSync(out, "utf8").trimEnd().split("\n");
    expect(lines[0].split(",").slice(0, 4)).toEqual(["i", "j", "x_m", "y_m"]);
    expect(lines[0]).toMatch(/eps_p1,eps_p2,eps_p3,mu_p1,mu_p2,mu_p3,eps_anisotropy,mu_anisotropy,det_j,capped$/);
  });

  it("runs every demo design", async () => {
    for (const f of readdirSync(DEMO).filter((n) => n.startsWith("field-") && n.endsWith(".json"))) {
      const r = await run([join(DEMO, f), "--json"]);
      expect(r.code, `${f}: ${r.err}`).toBe(0);
      expect(JSON.parse(r.out).cells, f).toBeGreaterThan(0);
    }
  });
});

describe("bad input: one line naming where, exit 1, no output file", () => {
  const ok = { name: "b", frequency: "10 GHz", transform: { kind: "radial-cloak", innerRadius: "20 mm", outerRadius: "40 mm" }, grid: { pitch: "2 mm" } };
  const cases: [string, () => string, RegExp][] = [
    ["a missing key", () => { const { grid: _, ...rest } = ok; return design("missing.json", rest); }, /^error: missing\.json: \$\.grid: missing; expected/],
    ["a unit of the wrong dimension", () => design("unit.json", { ...ok, frequency: "10 mm" }), /^error: unit\.json: \$\.frequency: expected a frequency such as '10 GHz', got a length '10 mm'/],
    ["a folding expression map", () => design("fold.json", { ...ok, transform: { kind: "expression", virtual: { x: "x - x^3/0.02^2", y: "y" }, region: { circle: { radius: "30 mm" } } } }),
      /^error: fold\.json: \$\.transform\.virtual: the map \(x = 'x - x\^3\/0\.02\^2', y = 'y'\) folds \(det J ≤ 0\) at \d+ cells, first cell/],
    ["a malformed CSV row", () => {
      writeFileSync(join(cli.dir, "bad.csv"), "x_m,y_m,eps_xx,eps_yy,eps_zz,eps_xy,eps_xz,eps_yz\n0,0,1,1,1,0,0,0\n0.002,0,1,1,x1,0,0,0\n");
      return design("imp.json", { ...ok, transform: { kind: "imported", file: "bad.csv" } });
    }, /^error: .*bad\.csv:3:5: expected a finite number in column eps_zz, got 'x1'/],
  ];
  for (const [what, make, pattern] of cases) {
    it(what, async () => {
      const file = make();
      const out = join(cli.dir, `${file}.out.csv`);
      const r = await run([file, "--out", out]);
      expect(r.code).toBe(1);
      expect(r.out).toBe("");
      expect(r.err.trimEnd().split("\n")).toHaveLength(1);
      expect(r.err).toMatch(pattern);
      expect(existsSync(out)).toBe(false);
    });
  }

  it("a bad --at is rejected before any work", async () => {
    const r = await run([join(DEMO, "field-rotator.json"), "--at", "45 mm"]);
    expect(r.code).toBe(1);
    expect(r.err).toMatch(/^error: --at: expected X,Y/);
  });
});
