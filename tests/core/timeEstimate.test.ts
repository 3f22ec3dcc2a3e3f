/**
 * Time estimates (core/timeEstimate.ts): the formulas, the 10 s threshold, the wording, and the
 * wiring — verify tells its estimate before the first solve (the planned grids' solveCost), and
 * small plan and verify runs print no warning. The rate constants themselves come from the bench
 * (npm run bench); no test times anything.
 */
import { describe, expect, it } from "vitest";
import { resolve } from "node:path";
import { join } from "node:path";
import {
  PLAN_SECONDS_FIXED, PLAN_SECONDS_PER_CELL, SOLVER_SECONDS_PER_NODE, SOLVER_SECONDS_PER_OPERATION, WARN_ABOVE_SECONDS,
  expectedTimeWarning, formatDuration, planSeconds, solveSeconds,
} from "../../src/core/timeEstimate.js";
import { solveCost } from "../../src/verify/assemble.js";
import { cylinderScene } from "../../src/verify/cylinderScene.js";
import { verifyDevice, type CaseSpec } from "../../src/verify/verifyDevice.js";
import { bufferIo } from "../../src/cli/cliIo.js";
import { runCli } from "../../src/cli/run.js";
import { tempDir } from "../helpers/tempDir.js";

describe("time estimates", () => {
  it("plan: fixed part plus a rate per cell; verify: per operation plus per node (identities)", () => {
    expect(planSeconds(0)).toBe(PLAN_SECONDS_FIXED);
    expect(planSeconds(1e6) - planSeconds(0)).toBeCloseTo(1e6 * PLAN_SECONDS_PER_CELL, 12);
    expect(solveSeconds(1e9, 0)).toBe(1e9 * SOLVER_SECONDS_PER_OPERATION);
    expect(solveSeconds(0, 1e6)).toBe(1e6 * SOLVER_SECONDS_PER_NODE);
  });

  it("warns only above 10 s, and never for a non-figure", () => {
    expect(WARN_ABOVE_SECONDS).toBe(10);
    expect(expectedTimeWarning(10, "x")).toBeNull();
    expect(expectedTimeWarning(3, "x")).toBeNull();
    for (const bad of [NaN, Infinity, -5]) expect(expectedTimeWarning(bad, "x")).toBeNull();
    expect(expectedTimeWarning(42, "planning 1.20e+7 cells")).toBe(
      "expect about 40 s for planning 1.20e+7 cells (estimate for one idle core, from the rates npm run bench measures)",
    );
    // a 10⁶-cell plan is a few seconds: no word; 10⁷ cells is over the threshold
    expect(expectedTimeWarning(planSeconds(1e6), "p")).toBeNull();
    expect(expectedTimeWarning(planSeconds(1e7), "p")).toMatch(/^expect about \d+ s for p/);
  });

  it("durations read as a person plans: seconds, then minutes, then hours", () => {
    expect(formatDuration(0.2)).toBe("1 s");
    expect(formatDuration(12.4)).toBe("12 s");
    expect(formatDuration(42)).toBe("40 s");
    expect(formatDuration(89)).toBe("90 s");
    expect(formatDuration(600)).toBe("10 min");
    expect(formatDuration(4 * 3600)).toBe("4 h");
  });
});

describe("verify tells its estimate before the first solve", () => {
  const C0 = 299_792_458, f = 10e9, lambda = C0 / f;
  const vacuum = { eps: 1, mu: 1 };
  const input = (resolution: number, a = 0.3 * lambda) => ({
    polarization: "Ez" as const, background: vacuum, frequencyHz: f, deviceBox: { minX: -a, maxX: a, minY: -a, maxY: a }, resolution, marginM: 0.3 * lambda,
    cases: [
      { name: "ideal", scene: cylinderScene("Ez", vacuum, a, { kind: "pec" }), indexHint: 1 },
      { name: "realized", scene: null, reason: "none", indexHint: 0 },
    ] as CaseSpec[],
  });

  it("the seconds are the planned grids' solve estimates times the cases solved", () => {
    let told: { seconds: number; what: string } | null = null;
    const r = verifyDevice({ ...input(10), onEstimate: (seconds, what) => { told = { seconds, what }; } });
    const c = solveCost(r.grid);
    expect(told).not.toBeNull();
    expect(told!.seconds).toBeCloseTo(solveSeconds(c.work, c.unknowns), 12); // one live case, one grid
    expect(told!.what).toBe(`1 solve (1 case on 1 grid, the finest ${r.grid.nx} × ${r.grid.ny} nodes)`);
  });

  it("a ladder is announced with the finer grids it may add: at least what the grids it used cost", () => {
    let told: { seconds: number; what: string } | null = null;
    const { resolution: _, ...ladder } = input(10);
    const r = verifyDevice({ ...ladder, onEstimate: (seconds, what) => { told = { seconds, what }; } });
    const finest = solveCost(r.grid);
    expect(r.resolutions.length).toBeGreaterThanOrEqual(3);
    expect(told!.seconds).toBeGreaterThanOrEqual(solveSeconds(finest.work, finest.unknowns));
    expect(told!.what).toMatch(/^up to 5 solves \(1 case on up to 5 grids, the finest \d+ × \d+ nodes; about \d+ s if the first 3 converge\)$/);
  });

  it("a fine grid is announced before any solving starts", () => {
    const stop = new Error("stop after the estimate");
    let seconds = 0;
    expect(() => verifyDevice({ ...input(200, 2 * lambda), onEstimate: (s) => { seconds = s; throw stop; }, onProgress: () => { throw new Error("solved before the estimate"); } })).toThrow(stop);
    expect(seconds).toBeGreaterThan(WARN_ABOVE_SECONDS); // about 10⁶ nodes: a direct solve of many seconds
    expect(expectedTimeWarning(seconds, "verify")).not.toBeNull();
  });
});

describe("small runs print no time warning", () => {
  it("plan and verify of a small demo: nothing on stderr, nothing in the JSON warnings", async () => {
    const out = tempDir("cw-time-");
    const demo = resolve("demo-designs/plan-concentrator-subunity.json");
    const io = bufferIo(process.cwd());
    await runCli(["plan", demo, "--out", out, "--json"], io);
    expect(io.err()).not.toContain("expect about");
    const summary = JSON.parse(io.out());
    expect(Array.isArray(summary.warnings)).toBe(true);
    expect(summary.warnings.join("\n")).not.toContain("expect about");
    const v = bufferIo(process.cwd());
    await runCli(["verify", resolve("demo-designs/field-rotator.json"), "--resolution", "8", "--json"], v);
    expect(v.err()).not.toContain("expect about");
    expect(JSON.parse(v.out()).warnings).toEqual([]);
  });
});
