/**
 * An output set is one unit even under SIGKILL: a child process writing a set is killed at every
 * step of the writer (killDriver.mjs blocks at step k, the test sends SIGKILL), and the real
 * `plan` at a few moments. Afterwards either the manifest is present and the folder is exactly
 * one set (all files of one run, sizes and checksums matching), or the manifest is missing and
 * `plan --check` says the set is incomplete. The next run into the same folder removes the killed
 * run's temporary files and leaves one complete set.
 */
import { describe, it, expect } from "vitest";
import { spawn } from "node:child_process";
import { readFileSync, readdirSync, existsSync } from "node:fs";
import { join, resolve } from "node:path";
import { checkOutputSet, MANIFEST_NAME } from "../../src/io/outputSet.js";
import { tempDir } from "../helpers/tempDir.js";

const DRIVER = resolve("tests/io/killDriver.mjs");
const STEPS = 10; // write × 4, switch, rename × 4, manifest

/** Run `args` with node; kill with SIGKILL once stdout shows a line (or after `afterMs`). */
function runAndKill(args: string[], opts: { onLine?: boolean; afterMs?: number }): Promise<{ killed: boolean; stdout: string }> {
  return new Promise((res, rej) => {
    const child = spawn(process.execPath, args, { stdio: ["ignore", "pipe", "pipe"] });
    let stdout = "";
    let killed = false;
    const kill = (): void => { if (!killed && child.exitCode === null) { killed = true; child.kill("SIGKILL"); } };
    child.stdout.on("data", (d: Buffer) => {
      stdout += d.toString();
      if (opts.onLine && stdout.includes("\n") && !stdout.startsWith("done")) kill();
    });
    if (opts.afterMs !== undefined) setTimeout(kill, opts.afterMs);
    child.on("error", rej);
    child.on("exit", () => res({ killed, stdout }));
  });
}

function tagsIn(dir: string, names: string[]): Set<string> {
  return new Set(names.map((n) => readFileSync(join(dir, n), "utf8").split("\n")[0].split(",")[1]));
}

function temps(dir: string): string[] {
  return readdirSync(dir).filter((n) => n.endsWith(".tmp"));
}

/** The folder is one complete set, or visibly incomplete: never a mixed set with a manifest. */
async function expectOneSetOrIncomplete(dir: string, names: string[] | null): Promise<"complete" | "incomplete"> {
  const check = await checkOutputSet(dir);
  if (!existsSync(join(dir, MANIFEST_NAME))) {
    expect(check.ok).toBe(false);
    expect(check.problems.join("\n")).toContain("missing");
    return "incomplete";
  }
  // only the killed run's temporary files may be reported; the listed files all match
  expect(check.problems.filter((p) => !p.includes("temporary file")), check.problems.join("\n")).toEqual([]);
  if (names) expect(tagsIn(dir, names).size).toBe(1);
  return "complete";
}

describe("output set under SIGKILL", () => {
  it("killed at every step of the writer: one set or visibly incomplete; the next run cleans up", async () => {
    const names = ["build-list.csv", "levels.csv", "report.md", "summary.json"];
    const seen = new Set<string>();
    const dir = tempDir("cw-kill-");
    const first = await runAndKill([DRIVER, dir, "old", "-1"], {});
    expect(first.stdout).toBe("done\n");
    for (let step = 0; step < STEPS; step++) {
      const r = await runAndKill([DRIVER, dir, "new", String(step)], { onLine: true });
      expect(r.killed, `step ${step}: ${r.stdout}`).toBe(true);
      seen.add(`${r.stdout.trim()}: ${await expectOneSetOrIncomplete(dir, names)}`);
      // before the switch the old set is intact; after the manifest the new one is
      if (step < 4) expect([...tagsIn(dir, names)]).toEqual(["old"]);
      if (step === 9) expect([...tagsIn(dir, names)]).toEqual(["new"]);
      // the next run (whose set is the "old" one for the next kill) removes the temporary files
      const again = await runAndKill([DRIVER, dir, "old", "-1"], {});
      expect(again.stdout).toBe("done\n");
      expect(temps(dir)).toEqual([]);
      expect((await checkOutputSet(dir)).ok).toBe(true);
      expect([...tagsIn(dir, names)]).toEqual(["old"]);
    }
    // every step was reached, and the kills inside the switch left no manifest
    expect([...seen]).toEqual([
      "write build-list.csv: complete", "write levels.csv: complete", "write report.md: complete", "write summary.json: complete",
      "switch: incomplete", "rename build-list.csv: incomplete", "rename levels.csv: incomplete", "rename report.md: incomplete",
      "rename summary.json: incomplete", "manifest: complete",
    ]);
  }, 120_000);

  it("the real plan killed at a few moments leaves one set or an incomplete one, and the next plan repairs it", async () => {
    const bin = resolve("dist/cli/main.js");
    const design = resolve("demo-designs/field-beam-bend.json");
    const dir = tempDir("cw-killplan-");
    const full = await runAndKill([bin, "plan", design, "--out", dir, "--levels", "3"], {});
    expect(full.killed).toBe(false);
    for (const ms of [700, 1800]) {
      await runAndKill([bin, "plan", design, "--out", dir, "--levels", "4"], { afterMs: ms });
      await expectOneSetOrIncomplete(dir, null);
    }
    const last = await runAndKill([bin, "plan", design, "--out", dir], {});
    expect(last.killed).toBe(false);
    expect(temps(dir)).toEqual([]);
    expect((await checkOutputSet(dir)).ok).toBe(true);
  }, 120_000);
});
