import { describe, expect, it } from "vitest";
import { bufferIo } from "../../src/cli/cliIo.js";
import { parseComplexText } from "../../src/cli/commands/mix.js";
import { EXIT_INPUT, EXIT_NOT_BUILDABLE, EXIT_OK, runCli } from "../../src/cli/run.js";
import { expectClose } from "../helpers/close.js";

async function run(argv: string[]) {
  const io = bufferIo();
  const code = await runCli(argv, io);
  return { code, out: io.out(), err: io.err() };
}

describe("cellwright mix", () => {
  it("--fill --json: ε_eff with Wiener and Hashin–Shtrikman bounds (1 and 4 at 1/2, by hand from the formulas)", async () => {
    const r = await run(["mix", "--rule", "mg-sphere", "--host", "1", "--inclusion", "4", "--fill", "0.5", "--json"]);
    expect(r.code).toBe(EXIT_OK);
    const j = JSON.parse(r.out);
    expect(j.rule).toBe("mg-sphere");
    expect(j.fill).toBe(0.5);
    expectClose([j.eps.re, j.eps.im], [2, 0], { abs: 1e-14, label: "ε" });
    expectClose(j.bounds.wiener, [1.6, 2.5], { rel: 1e-14, label: "Wiener" });
    expectClose(j.bounds.hashinShtrikman, [2, 16 / 7], { rel: 1e-14, label: "HS 3D" });
    expect(j.bounds.applies).toBe(true);
    expect(j.mgBruggemanSpread).toBeGreaterThan(0);
    expect(r.err).toBe("");
  });

  it("--target solves the fill fraction and reports convergence", async () => {
    const r = await run(["mix", "--rule", "bruggeman-2d", "--host", "1", "--inclusion", "4", "--target", "2", "--json"]);
    expect(r.code).toBe(EXIT_OK);
    const j = JSON.parse(r.out);
    // 2D Bruggeman gives sqrt(1·4) = 2 at f = 1/2 (Keller–Dykhne)
    expectClose(j.fill, 0.5, { abs: 1e-12 });
    expect(j.inverse).toMatchObject({ converged: true, iterations: 0 });
    expectClose(j.inverse.target.re, 2, { rel: 1e-15 });
  });

  it("material ids at a frequency; complex target compares the loss", async () => {
    const r = await run(["mix", "--rule", "mg-sphere", "--host", "ptfe", "--inclusion", "alumina-96", "--target", "3+0.01i", "--frequency", "10 GHz", "--json"]);
    expect(r.code).toBe(EXIT_OK);
    const j = JSON.parse(r.out);
    expect(j.host.material).toBe("ptfe");
    expectClose(j.host.eps.re, 2.05, { rel: 1e-12 });
    expectClose(j.eps.re, 3, { rel: 1e-9 });
    expect(j.inverse.converged).toBe(true);
    expectClose(j.inverse.lossMismatch, j.eps.im - 0.01, { rel: 1e-12 });
    expect(j.bounds.applies).toBe(true);
  });

  it("mg-ellipsoid takes --depolarization or --aspect (aspect 1 is the sphere)", async () => {
    const a = await run(["mix", "--rule", "mg-ellipsoid", "--host", "1", "--inclusion", "4", "--fill", "0.5", "--aspect", "1", "--json"]);
    expect(a.code).toBe(EXIT_OK);
    expectClose(JSON.parse(a.out).eps.re, 2, { rel: 1e-14 });
    const n = await run(["mix", "--rule", "mg-ellipsoid", "--host", "1", "--inclusion", "4", "--fill", "0.5", "--depolarization", "0", "--json"]);
    expectClose(JSON.parse(n.out).eps.re, 2.5, { rel: 1e-14 }); // N = 0: the parallel mean
    const missing = await run(["mix", "--rule", "mg-ellipsoid", "--host", "1", "--inclusion", "4", "--fill", "0.5"]);
    expect(missing.code).toBe(EXIT_INPUT);
    expect(missing.err).toMatch(/needs exactly one of --depolarization N or --aspect M/);
    const wrong = await run(["mix", "--rule", "mg-sphere", "--host", "1", "--inclusion", "4", "--fill", "0.5", "--depolarization", "0.2"]);
    expect(wrong.code).toBe(EXIT_INPUT);
    expect(wrong.err).toMatch(/--depolarization: only for --rule mg-ellipsoid/);
  });

  it("a target outside the pair's range exits 2 with the bound it violates", async () => {
    const r = await run(["mix", "--rule", "mg-cylinder", "--host", "1", "--inclusion", "4", "--target", "5", "--json"]);
    expect(r.code).toBe(EXIT_NOT_BUILDABLE);
    const j = JSON.parse(r.out);
    expect(j.fill).toBeNull();
    expect(j.reachable).toBe(false);
    expect(j.inverse.reason).toMatch(/above the larger phase value 4/);
    expect(r.err).toMatch(/error: --target: target 5 is above the larger phase value 4/);
    const human = await run(["mix", "--rule", "series", "--host", "1", "--inclusion", "4", "--target", "0.5"]);
    expect(human.code).toBe(EXIT_NOT_BUILDABLE);
    expect(human.out).toMatch(/no fill fraction reaches the target/);
  });

  it("bad input: fill outside [0, 1], unknown rule or material, a material without a frequency", async () => {
    const big = await run(["mix", "--rule", "parallel", "--host", "1", "--inclusion", "4", "--fill", "1.2"]);
    expect(big.code).toBe(EXIT_INPUT);
    expect(big.err).toMatch(/--fill: expected a fill fraction in \[0, 1\], got '1.2'/);
    const neg = await run(["mix", "--rule", "parallel", "--host", "1", "--inclusion", "4", "--fill=-0.1"]);
    expect(neg.code).toBe(EXIT_INPUT);
    expect(neg.err).toMatch(/--fill: expected a fill fraction in \[0, 1\], got '-0.1'/);
    const rule = await run(["mix", "--rule", "maxwell", "--host", "1", "--inclusion", "4", "--fill", "0.1"]);
    expect(rule.code).toBe(EXIT_INPUT);
    expect(rule.err).toMatch(/unknown mixing rule 'maxwell'/);
    const mat = await run(["mix", "--rule", "parallel", "--host", "aluminia-96", "--inclusion", "4", "--fill", "0.1", "--frequency", "1 GHz"]);
    expect(mat.code).toBe(EXIT_INPUT);
    expect(mat.err).toMatch(/--host: unknown material 'aluminia-96'; did you mean alumina-96/);
    const noF = await run(["mix", "--rule", "parallel", "--host", "ptfe", "--inclusion", "4", "--fill", "0.1"]);
    expect(noF.code).toBe(EXIT_INPUT);
    expect(noF.err).toMatch(/--host: material 'ptfe' needs --frequency/);
    const both = await run(["mix", "--rule", "parallel", "--host", "1", "--inclusion", "4", "--fill", "0.1", "--target", "2"]);
    expect(both.code).toBe(EXIT_INPUT);
    expect(both.err).toMatch(/exactly one of --fill F or --target EPS/);
  });

  it("a material outside its range warns on stderr and still mixes", async () => {
    const r = await run(["mix", "--rule", "parallel", "--host", "ptfe", "--inclusion", "4", "--fill", "0.5", "--frequency", "1 THz", "--json"]);
    expect(r.code).toBe(EXIT_OK);
    expect(r.err).toMatch(/warning: --host: ptfe: 1 THz is outside the valid range/);
    JSON.parse(r.out);
  });

  it("lossy or negative phases: bounds not applicable (null), the rule still answers", async () => {
    const r = await run(["mix", "--rule", "mg-sphere", "--host", "2", "--inclusion=-10+1i", "--fill", "0.1", "--json"]);
    expect(r.code).toBe(EXIT_OK);
    const j = JSON.parse(r.out);
    expect(j.bounds.applies).toBe(false);
    expect(j.bounds.wiener).toEqual([null, null]);
    expect(j.eps.im).toBeGreaterThan(0);
  });

  it("human output lists fill, ε_eff, bounds and the MG–Bruggeman spread", async () => {
    const r = await run(["mix", "--rule", "bruggeman-3d", "--host", "1", "--inclusion", "10", "--fill", "0.4"]);
    expect(r.code).toBe(EXIT_OK);
    expect(r.out).toMatch(/fill\s+0.4/);
    expect(r.out).toMatch(/Wiener\s+/);
    expect(r.out).toMatch(/HS 3D\s+/);
    expect(r.out).toMatch(/MG vs Br .*uncertain: verify with a full-wave unit-cell simulation/);
  });
});

describe("parseComplexText", () => {
  it("reads real, complex and pure imaginary numbers; other text is not a number", () => {
    expect(parseComplexText("4")).toEqual({ re: 4, im: 0 });
    expect(parseComplexText("-10+1i")).toEqual({ re: -10, im: 1 });
    expect(parseComplexText("2.2-0.01j")).toEqual({ re: 2.2, im: -0.01 });
    expect(parseComplexText("3+i")).toEqual({ re: 3, im: 1 });
    expect(parseComplexText("1e1+2e-3i")).toEqual({ re: 10, im: 0.002 });
    expect(parseComplexText("0.5i")).toEqual({ re: 0, im: 0.5 });
    expect(parseComplexText("ptfe")).toBeUndefined();
    expect(parseComplexText("alumina-96")).toBeUndefined();
    expect(parseComplexText("")).toBeUndefined();
    expect(parseComplexText("Infinity")).toBeUndefined();
  });
});
