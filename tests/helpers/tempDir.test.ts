/**
 * The temporary folders of the test run: tempDir removes what it makes (after the test, or after
 * the file for a folder made outside a test), the run has a TMPDIR of its own, and the run's
 * teardown reports and removes what a test left (tests/setup/runTempDir.ts).
 */
import { describe, it, expect, beforeAll } from "vitest";
import { existsSync, mkdirSync, mkdtempSync, readdirSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { basename, dirname, join } from "node:path";
import { spawnSync } from "node:child_process";
import { tempDir } from "./tempDir.js";
import { RUN_PREFIX, startRunTempDir } from "../setup/runTempDir.js";

describe("tempDir", () => {
  let fileDir = "";
  let testDir = "";
  beforeAll(() => {
    fileDir = tempDir("cw-helper-file-");
  });

  it("makes a fresh folder under the run's temporary folder", () => {
    testDir = tempDir("cw-helper-test-");
    writeFileSync(join(testDir, "a.txt"), "a");
    mkdirSync(join(testDir, "out"));
    expect(dirname(testDir)).toBe(tmpdir());
    expect(basename(testDir)).toMatch(/^cw-helper-test-/);
    expect(existsSync(fileDir)).toBe(true);
  });

  it("removes a test's folder (with what was written in it) when that test finishes", () => {
    expect(testDir).not.toBe("");
    expect(existsSync(testDir)).toBe(false);
  });

  it("keeps a folder made in beforeAll for the file's later tests", () => {
    expect(existsSync(fileDir)).toBe(true);
  });
});

describe("the run's temporary folder", () => {
  it("is the run's own, and a spawned command inherits it", () => {
    expect(basename(tmpdir())).toMatch(new RegExp(`^${RUN_PREFIX}\\d+-`));
    const child = spawnSync(process.execPath, ["-e", "process.stdout.write(require('node:os').tmpdir())"], { encoding: "utf8" });
    expect(child.stdout).toBe(tmpdir());
  });

  it("teardown lists what a test left, removes it and restores TMPDIR; a clean run reports nothing", () => {
    const parent = tempDir("cw-helper-parent-");
    const env: NodeJS.ProcessEnv = { TMPDIR: "/before" };
    const clean = startRunTempDir(parent, env);
    expect(env.TMPDIR).toBe(clean.runDir);
    mkdirSync(join(clean.runDir, "tsx-0")); // a tool's cache, not a leak
    expect(clean.finish()).toEqual([]);
    expect(env.TMPDIR).toBe("/before");
    expect(readdirSync(parent)).toEqual([]);

    const leaky = startRunTempDir(parent, env);
    mkdirSync(join(leaky.runDir, "cw-e2e-abc123"));
    writeFileSync(join(leaky.runDir, "cw-e2e-abc123", "build-list.csv"), "x");
    writeFileSync(join(leaky.runDir, "stray.txt"), "x");
    const report = leaky.finish();
    expect(report[0]).toBe(`error: the tests left 2 entries in the run's temporary folder ${leaky.runDir} (now removed):`);
    expect(report).toContain("  cw-e2e-abc123/ (1 entry: build-list.csv)");
    expect(report).toContain("  stray.txt");
    expect(readdirSync(parent)).toEqual([]);
  });

  it("removes the folders of killed runs whose process is gone, never a live run's", () => {
    const parent = tempDir("cw-helper-parent-");
    const gone = spawnSync(process.execPath, ["-e", "process.stdout.write(String(process.pid))"], { encoding: "utf8" });
    const deadPid = Number(gone.stdout);
    const dead = mkdtempSync(join(parent, `${RUN_PREFIX}${deadPid}-`));
    const live = mkdtempSync(join(parent, `${RUN_PREFIX}${process.pid}-`));
    const other = mkdtempSync(join(parent, "someone-else-"));
    const run = startRunTempDir(parent, {}, 1);
    expect(run.abandoned).toBe(1);
    expect(existsSync(dead)).toBe(false);
    expect(existsSync(live)).toBe(true);
    expect(existsSync(other)).toBe(true);
    expect(run.finish()).toEqual([]);
  });
});
