import { describe, it, expect } from "vitest";
import { readFile, writeFile } from "node:fs/promises";
import { join, resolve } from "node:path";
import { runCli, EXIT_INPUT, EXIT_OK, EXIT_NOT_BUILDABLE } from "../../src/cli/run.js";
import { bufferIo } from "../../src/cli/cliIo.js";
import { tempDir } from "../helpers/tempDir.js";

const DEMO = "tests/plan/golden/small-bend.json";

describe("cellwright plan", () => {
  it("--json prints exactly one JSON object with the summary fields", async () => {
    const out = tempDir("cw-cli-");
    const io = bufferIo();
    expect(await runCli(["plan", DEMO, "--out", out, "--json"], io)).toBe(EXIT_OK);
    const lines = io.out().trim().split("\n");
    expect(lines.length).toBe(1);
    const s = JSON.parse(lines[0]);
    for (const k of ["design", "cells", "levels", "regions", "flags", "maxRelError", "medianRelError", "lossDb", "boundaryReflection", "minBandwidth", "materials", "outputs"]) expect(s).toHaveProperty(k);
    expect(s.outputs.map((p: string) => p.slice(out.length + 1))).toEqual(["build-list.csv", "levels.csv", "report.md", "maps.svg", "summary.json", "manifest.json"]);
    expect(JSON.parse(await readFile(join(out, "summary.json"), "utf8"))).toEqual(s);
    const check = bufferIo();
    expect(await runCli(["plan", "--check", out, "--json"], check), check.err()).toBe(EXIT_OK);
    expect(JSON.parse(check.out()).files.map((f: { name: string }) => f.name)).toEqual(s.outputs.slice(0, 5).map((p: string) => p.slice(out.length + 1)));
  }, 30_000);

  it("--background-index takes the concentrator out of ε < 1 (the way out its report names)", async () => {
    // The concentrator demo needs ε below 1 as designed; the reduction reports the smallest
    // background index that lifts every ε to the floor (n_b = sqrt(floor / min ε)). Planning with
    // that index must leave no cell flagged subunity.
    const demo = "demo-designs/plan-concentrator-subunity.json";
    const r = bufferIo();
    await runCli(["reduce", demo, "--scheme", "non-magnetic", "--eps-floor", "1", "--json"], r);
    const nb = JSON.parse(r.out()).minBackgroundIndex as number;
    expect(nb).toBeGreaterThan(1);
    const before = bufferIo(), after = bufferIo();
    await runCli(["plan", demo, "--out", tempDir("cw-cli-"), "--json"], before);
    await runCli(["plan", demo, "--out", tempDir("cw-cli-"), "--json", "--background-index", String(nb)], after);
    expect(JSON.parse(before.out()).flags.subunity).toBeGreaterThan(0);
    expect(JSON.parse(after.out()).flags.subunity ?? 0).toBe(0);
    const bad = bufferIo();
    expect(await runCli(["plan", demo, "--background-index", "0.5"], bad)).toBe(EXIT_INPUT);
    expect(bad.err()).toContain("--background-index");
  }, 60_000);

  it("--levels and --tolerance override the design", async () => {
    const out = tempDir("cw-cli-");
    const io = bufferIo();
    await runCli(["plan", DEMO, "--out", out, "--json", "--levels", "2", "--tolerance", "0.2"], io);
    const s = JSON.parse(io.out());
    expect(s.levels).toBeLessThanOrEqual(2);
    expect(s.tolerance).toBe(0.2);
  }, 30_000);

  it("--session takes the design and overrides from a session file", async () => {
    const dir = tempDir("cw-cli-");
    const session = join(dir, "session.json");
    await writeFile(session, JSON.stringify({ cellwrightSession: 1, design: resolve(DEMO), overrides: { levels: 3 } }));
    const io = bufferIo();
    const code = await runCli(["plan", "--session", session, "--out", join(dir, "out"), "--json"], io);
    const summary = JSON.parse(io.out());
    expect(summary.levels).toBeLessThanOrEqual(3);
    // three levels cannot hold the demo's 5 % tolerance: the verdict says so and the exit code follows
    expect(code).toBe(summary.verdict.buildable ? EXIT_OK : EXIT_NOT_BUILDABLE);
  }, 30_000);

  it("rejects a bad tolerance and a missing design", async () => {
    const io = bufferIo();
    expect(await runCli(["plan", DEMO, "--tolerance", "2"], io)).toBe(EXIT_INPUT);
    expect(io.err()).toContain("--tolerance");
    const io2 = bufferIo();
    expect(await runCli(["plan"], io2)).toBe(EXIT_INPUT);
  });
});

describe("plan --session mistakes are named in the session file", () => {
  it("an unknown material among the session's overrides, and a session of another design", async () => {
    const dir = tempDir("cw-sess-");
    const session = join(dir, "s.json");
    await writeFile(session, JSON.stringify({ cellwrightSession: 1, design: resolve(DEMO), overrides: { materials: ["photopolymer-resin", "plaa"] } }));
    const io = bufferIo();
    expect(await runCli(["plan", "--session", session, "--out", join(dir, "out")], io)).toBe(EXIT_INPUT);
    expect(io.err()).toContain(`${session}: $.overrides.materials[1]`);
    expect(io.err()).toContain("did you mean");
    const other = bufferIo();
    expect(await runCli(["plan", "demo-designs/plan-silicon-chip-bend.json", "--session", session, "--out", join(dir, "out")], other)).toBe(EXIT_INPUT);
    expect(other.err()).toContain("this session file is for");
  }, 30_000);
});
