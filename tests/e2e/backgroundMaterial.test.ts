/**
 * `reduction.backgroundMaterial` is checked alike by every command that plans or reduces a design:
 * `plan`, `reduce`, `verify` and the interactive session refuse a mistyped id, a metal and an index
 * more than 1 % from the background index, exit 1, with one and the same message naming the JSON
 * path. The design is tests/verify/fixtures/silica-graded-block.json (background index 1.4440318,
 * Malitson's fused silica at 193.5 THz: Malitson, JOSA 55, 1205 (1965)). The commands run as a user
 * runs them (the built command line); the session, which needs a terminal, in-process.
 */
import { describe, expect, it } from "vitest";
import { spawnSync } from "node:child_process";
import { existsSync, readFileSync, writeFileSync } from "node:fs";
import { join, resolve } from "node:path";
import { bufferIo } from "../../src/cli/cliIo.js";
import { runCli } from "../../src/cli/run.js";
import { tempDir } from "../helpers/tempDir.js";

const BIN = resolve("dist/cli/main.js");
const FIXTURE = JSON.parse(readFileSync(resolve("tests/verify/fixtures/silica-graded-block.json"), "utf8"));

function cli(args: string[], cwd: string): { code: number | null; out: string; err: string } {
  const p = spawnSync(process.execPath, [BIN, ...args], { cwd, encoding: "utf8", timeout: 60_000 });
  return { code: p.status, out: p.stdout, err: p.stderr };
}

/** The error lines that name the background material (the check's message). */
function materialLines(err: string): string[] {
  return err.split("\n").filter((l) => l.includes("$.reduction.backgroundMaterial"));
}

const CASES: { name: string; reduction: Record<string, unknown>; says: string }[] = [
  { name: "a mistyped id", reduction: { backgroundMaterial: "fused-silca" }, says: "unknown material 'fused-silca'; did you mean" },
  { name: "a metal", reduction: { backgroundMaterial: "gold" }, says: "'gold' is a metal: a background must be a dielectric" },
  // 1.6 / 1.4440 − 1 = 10.8 % > 1 %
  { name: "an index 10.8 % off", reduction: { backgroundIndex: 1.6 }, says: "expected them equal within 1 % (set reduction.backgroundIndex to 1.4440)" },
];

describe.each(CASES)("reduction.backgroundMaterial: $name", ({ reduction, says }) => {
  it("plan, reduce, verify and the session refuse it, exit 1, with the same message at its JSON path", async () => {
    expect(existsSync(BIN), "dist/ is missing: run npm run build").toBe(true);
    const dir = tempDir("cw-bgmat-");
    const design = join(dir, "design.json");
    writeFileSync(design, JSON.stringify({ ...FIXTURE, reduction: { ...FIXTURE.reduction, ...reduction } }));

    const plan = cli(["plan", design, "--out", join(dir, "plan-out")], dir);
    const reduce = cli(["reduce", design], dir);
    const reduceJson = cli(["reduce", design, "--scheme", "isotropic", "--out", join(dir, "reduced.csv"), "--json"], dir);
    const verify = cli(["verify", design, "--json"], dir);
    const io = { ...bufferIo(dir), isTTY: true };
    const session = { code: await runCli(["session", design, "--out", join(dir, "session-out")], io), out: io.out(), err: io.err() };

    const expected = materialLines(plan.err);
    expect(expected, plan.err).toHaveLength(1);
    expect(expected[0]).toBe(`error: ${design}: $.reduction.backgroundMaterial: ${expected[0].split("$.reduction.backgroundMaterial: ")[1]}`);
    expect(expected[0]).toContain(says);
    for (const [name, r] of Object.entries({ plan, reduce, reduceJson, verify, session })) {
      expect(r.code, `${name}: ${r.err}`).toBe(1);
      expect(materialLines(r.err), name).toEqual(expected);
      expect(r.out, name).toBe("");
    }
    // nothing written: no output folder, no reduced CSV
    for (const p of ["plan-out", "reduced.csv", "session-out"]) expect(existsSync(join(dir, p)), p).toBe(false);
  }, 120_000);
});

describe("reduction.backgroundMaterial with a --background-index", () => {
  it("reduce checks the index it reduces with, and names the option", () => {
    const dir = tempDir("cw-bgmat-");
    const design = join(dir, "design.json");
    writeFileSync(design, JSON.stringify(FIXTURE));
    const ok = cli(["reduce", design, "--json"], dir);
    expect(ok.code, ok.err).toBe(0);
    expect(JSON.parse(ok.out).backgroundIndex).toBeCloseTo(1.4440318, 12);
    const off = cli(["reduce", design, "--background-index", "1.5"], dir);
    expect(off.code).toBe(1);
    expect(materialLines(off.err)).toEqual([
      `error: ${design}: $.reduction.backgroundMaterial: 'fused-silica-optical' has index 1.4440 at the design frequency (Re ε 2.0852), the device's background index is 1.5000 (--background-index): expected them equal within 1 % (set reduction.backgroundIndex to 1.4440)`,
    ]);
  }, 60_000);
});
