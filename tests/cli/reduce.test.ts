/**
 * `cellwright reduce` end to end on the demo designs: the comparison table, --json, --scheme with
 * --out, --at, and refused combinations (one message, exit 1, no file).
 */
import { describe, expect, it } from "vitest";
import { existsSync, readFileSync, readdirSync, writeFileSync } from "node:fs";
import { join } from "node:path";
import { DEMO_DIR, cliInTempDir } from "../helpers/cliInTempDir.js";
import { expectClose } from "../helpers/close.js";

const DEMO = DEMO_DIR;
const CLOAK = join(DEMO, "field-radial-cloak.json"); // linear cloak, a = 20 mm, b = 50 mm, polarization Ez
const SPHERE = join(DEMO, "field-spherical-cloak.json");
const IMPORTED = join(DEMO, "field-imported.json");
const A = 0.02, B = 0.05;
const cli = cliInTempDir("reduce", "cw-reduce-");
const run = cli.run;

function withKeys(extra: Record<string, unknown>, name: string): string {
  const json = { ...JSON.parse(readFileSync(CLOAK, "utf8")), ...extra };
  writeFileSync(join(cli.dir, name), JSON.stringify(json));
  return name;
}

describe("reduce (comparison table)", () => {
  it("lists every Ez scheme, fits 80 columns, and names the costs", async () => {
    const r = await run([CLOAK]);
    expect(r.code).toBe(0);
    expect(r.err).toBe("");
    const lines = r.out.trimEnd().split("\n");
    for (const l of lines) expect(l.length, l).toBeLessThanOrEqual(80);
    for (const s of ["full", "unit-mu", "isotropic", "matched"]) expect(lines.some((l) => l.startsWith(`  ${s} `))).toBe(true);
    expect(r.out).not.toMatch(/non-magnetic +\d/);
    expect(r.out).toMatch(/ε<1 cells/);
    expect(r.out).toMatch(/R edge/);
  });

  it("marks the design's own scheme", async () => {
    const file = withKeys({ reduction: { scheme: "unit-mu" } }, "chosen.json");
    const r = await run([file]);
    expect(r.code).toBe(0);
    expect(r.out).toMatch(/^\* unit-mu /m);
    expect(r.out).toMatch(/design's own choice/);
  });

  it("3D design: one row, full only, and says there is no polarization reduction", async () => {
    const r = await run([SPHERE]);
    expect(r.code).toBe(0);
    expect(r.out).toMatch(/no polarization reduction/);
    expect(r.out).toMatch(/^  full /m);
    expect(r.out).not.toMatch(/^  isotropic /m);
  });

  it("a design without a polarization is shown for Ez, with a note on stderr", async () => {
    const json = JSON.parse(readFileSync(CLOAK, "utf8"));
    delete json.polarization;
    writeFileSync(join(cli.dir, "nopol.json"), JSON.stringify(json));
    const r = await run(["nopol.json"]);
    expect(r.code).toBe(0);
    expect(r.err).toMatch(/showing Ez/);
    expect(r.out).toMatch(/^Ez: /m);
  });
});

describe("reduce --json", () => {
  it("prints one object with every scheme's metrics", async () => {
    const r = await run([CLOAK, "--json"]);
    expect(r.code).toBe(0);
    expect(r.out.trim().split("\n")).toHaveLength(1);
    const j = JSON.parse(r.out);
    expect(j.polarization).toBe("Ez");
    expect(j.schemes.map((s: { scheme: string }) => s.scheme)).toEqual(["full", "unit-mu", "isotropic", "matched"]);
    for (const s of j.schemes) {
      expect(Object.keys(s)).toEqual(expect.arrayContaining(["scheme", "cellsEpsBelowOne", "cellsMagnetic", "maxAnisotropy", "boundaryReflection", "ranges", "capped"]));
    }
    const by = Object.fromEntries(j.schemes.map((s: { scheme: string }) => [s.scheme, s]));
    // ideal set reflectionless (the map is the identity on r = b); reduced set Z = 1 − a/b,
    // R = (a/(2b−a))² = 1/16 (Yan, Ruan, Qiu, Opt. Express 15, 17772 (2007))
    expect(by.full.boundaryReflection).toBeLessThan(1e-15);
    expectClose(by["unit-mu"].boundaryReflection, (A / (2 * B - A)) ** 2, { rel: 1e-9 });
    expect(by.matched.boundaryReflection).toBeLessThan(1e-15);
    // unit-mu: ε_z = (b/(b−a))² everywhere (Schurig et al., Science 314, 977 (2006))
    expectClose(by["unit-mu"].ranges.eps_zz, [25 / 9, 25 / 9], { rel: 1e-12, label: "eps_zz range" });
    expect(by["unit-mu"].cellsEpsBelowOne).toBe(0);
    expect(by.isotropic.cellsMagnetic).toBe(0);
    expect(j.minBackgroundIndex).toBe(1);
    expect(j.schemes[0].capped).toBeGreaterThan(0);
  });

  it("Hz: the non-magnetic set needs ε < 1 and a large background index", async () => {
    const r = await run([CLOAK, "--polarization", "Hz", "--json"]);
    const j = JSON.parse(r.out);
    const nm = j.schemes.find((s: { scheme: string }) => s.scheme === "non-magnetic");
    expect(nm.cellsMagnetic).toBe(0);
    expect(nm.cellsEpsBelowOne).toBeGreaterThan(0);
    // n_b = sqrt(1/min ε_r), min ε_r = (b/(b−a))²((r−a)/r)² at the offset radius r = a + 0.5 mm (Cai et al. 2007)
    const r0 = A + 0.0005;
    expectClose(nm.minBackgroundIndex, 1 / Math.sqrt((B / (B - A)) ** 2 * ((r0 - A) / r0) ** 2), { rel: 1e-6 });
  });
});

describe("reduce --scheme", () => {
  it("--out writes one row per cell with the documented columns", async () => {
    const r = await run([CLOAK, "--scheme", "unit-mu", "--out", "reduced.csv", "--json"]);
    expect(r.code).toBe(0);
    const j = JSON.parse(r.out);
    expect(j.schemes).toHaveLength(1);
    const text = readFileSync(join(cli.dir, "reduced.csv"), "utf8").trimEnd().split("\n");
    expect(text[0]).toBe("i,j,x_m,y_m,eps_zz,mu_xx,mu_yy,mu_xy,principal_min,principal_max,anisotropy,dropped_anisotropy,scale,eps_min,eps_max,mu_min,mu_max,flags");
    expect(text.length - 1).toBe(j.cells);
    const row = text[1].split(",");
    expectClose(Number(row[4]), 25 / 9, { rel: 1e-12, label: "eps_zz" });
    expect(row[17]).toMatch(/magnetic/);
  });

  it("human summary names the scheme, ranges and boundary", async () => {
    const r = await run([CLOAK, "--scheme", "matched"]);
    expect(r.code).toBe(0);
    expect(r.out).toMatch(/scheme matched/);
    expect(r.out).toMatch(/matching constant 1\.67/); // b/(b−a) = 5/3
    for (const l of r.out.trimEnd().split("\n")) expect(l.length).toBeLessThanOrEqual(80);
  });
});

describe("reduce --at", () => {
  it("Ez/unit-mu at r = 30 mm: ε_z = (b/(b−a))², μ_r = ((r−a)/r)², μ_θ = 1 (Schurig et al. 2006)", async () => {
    const r = await run([CLOAK, "--scheme", "unit-mu", "--at", "30 mm,0 mm", "--json"]);
    expect(r.code).toBe(0);
    const j = JSON.parse(r.out);
    expect(j.scheme).toBe("unit-mu");
    expect(Object.keys(j.components)).toEqual(["eps_zz", "mu_xx", "mu_yy", "mu_xy"]);
    expectClose(j.components.eps_zz, 25 / 9, { rel: 1e-12 });
    expectClose(j.components.mu_xx, 1 / 9, { rel: 1e-12 });
    expectClose(j.components.mu_yy, 1, { rel: 1e-12 });
    expectClose(j.principal, [1 / 9, 1], { rel: 1e-12, label: "principal" });
    expectClose(j.anisotropy, 9, { rel: 1e-12 });
    expectClose(j.scale, 1 / 3, { rel: 1e-12 }); // α = 1/μ_θ = (r−a)/r
  });

  it("Hz/non-magnetic at r = 30 mm: ε_r = (b/(b−a))²((r−a)/r)², ε_θ = (b/(b−a))² (Cai et al. 2007)", async () => {
    const r = await run([CLOAK, "--polarization", "Hz", "--scheme", "non-magnetic", "--at", "0 mm,30 mm", "--json"]);
    const j = JSON.parse(r.out);
    expect(Object.keys(j.components)).toEqual(["mu_zz", "eps_xx", "eps_yy", "eps_xy"]);
    // on the y axis ε_yy = ε_r and ε_xx = ε_θ
    expectClose(j.components.eps_yy, (25 / 9) * (1 / 9), { rel: 1e-12 });
    expectClose(j.components.eps_xx, 25 / 9, { rel: 1e-12 });
    expectClose(j.components.mu_zz, 1, { rel: 1e-15 });
  });

  it("outside the device is refused", async () => {
    const r = await run([CLOAK, "--scheme", "full", "--at", "80 mm,0 mm"]);
    expect(r.code).toBe(1);
    expect(r.err).toMatch(/outside the device/);
  });
});

describe("reduce refuses invalid combinations", () => {
  it("unit-mu with Hz, naming the Hz schemes", async () => {
    const r = await run([CLOAK, "--polarization", "Hz", "--scheme", "unit-mu", "--out", "x.csv"]);
    expect(r.code).toBe(1);
    expect(r.err.trim().split("\n")).toHaveLength(1);
    expect(r.err).toMatch(/--scheme: .*valid for Hz: full, non-magnetic, isotropic, matched/);
    expect(existsSync(join(cli.dir, "x.csv"))).toBe(false);
  });
  it("non-magnetic with Ez", async () => {
    const r = await run([CLOAK, "--scheme", "non-magnetic"]);
    expect(r.code).toBe(1);
    expect(r.err).toMatch(/valid for Ez: full, unit-mu, isotropic, matched/);
  });
  it("a polarization or a 2D scheme on a 3D design", async () => {
    const a = await run([SPHERE, "--polarization", "Ez"]);
    expect(a.code).toBe(1);
    expect(a.err).toMatch(/3D design has no polarization reduction.*only scheme 'full'/);
    const b = await run([SPHERE, "--scheme", "isotropic"]);
    expect(b.code).toBe(1);
    expect(b.err).toMatch(/valid for 3D: full/);
  });
  it("a design whose reduction.scheme does not fit its polarization, with the JSON path", async () => {
    const file = withKeys({ polarization: "Hz", reduction: { scheme: "unit-mu" } }, "badpair.json");
    const r = await run([file]);
    expect(r.code).toBe(1);
    expect(r.err).toMatch(/badpair\.json: \$\.reduction\.scheme: .*valid for Hz/);
  });
  it("bad flag values", async () => {
    expect((await run([CLOAK, "--polarization", "TE"])).err).toMatch(/--polarization: expected Ez or Hz/);
    expect((await run([CLOAK, "--background-index", "-2"])).err).toMatch(/--background-index: expected a refractive index/);
    expect((await run([CLOAK, "--unit-axis", "big"])).err).toMatch(/--unit-axis: expected larger or smaller/);
  });
  it("leaves no temporary files behind", () => {
    expect(readdirSync(cli.dir).filter((f) => f.endsWith(".tmp"))).toEqual([]);
  });
});

describe("reduce on an imported field", () => {
  it("estimates the boundary from the edge cells and gives the sheared slab's values", async () => {
    const r = await run([IMPORTED, "--polarization", "Hz", "--scheme", "full", "--json"]);
    expect(r.code).toBe(0);
    const j = JSON.parse(r.out);
    expect(j.schemes[0].boundarySource).toBe("edge-cells");
    // ε = [[1, s, 0], [s, 1+s², 0], [0, 0, 1]], s = 0.25 (Rahm et al., PRL 100, 063903 (2008))
    expectClose(j.schemes[0].ranges.eps_xy, [0.25, 0.25], { rel: 1e-12, label: "eps_xy" });
    expectClose(j.schemes[0].ranges.eps_yy, [1.0625, 1.0625], { rel: 1e-12, label: "eps_yy" });
  });
});

describe("reduce with --polarization switching away from the design's scheme", () => {
  it("shows the other polarization's table, with no starred row (the design's unit-mu serves Ez only)", async () => {
    const r = await run([join(process.cwd(), "demo-designs/plan-microwave-mast-cloak.json"), "--polarization", "Hz", "--json"]);
    expect(r.code, r.err).toBe(0);
    const j = JSON.parse(r.out);
    expect(j.polarization).toBe("Hz");
    expect(j.chosen).toBeNull();
    expect(j.schemes.map((s: { scheme: string }) => s.scheme)).toContain("non-magnetic");
  });
});
