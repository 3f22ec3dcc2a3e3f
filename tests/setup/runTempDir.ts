/**
 * vitest globalSetup: the run gets its own temporary folder, and a test that leaves anything in it
 * fails the run.
 *
 * Setup makes `<tmpdir>/cellwright-test-run-<pid>-XXXXXX` and points TMPDIR at it; the test workers
 * and every `cellwright` process a test spawns inherit it, so os.tmpdir() (and tests/helpers/tempDir.ts)
 * make their folders inside. Teardown lists what is still there, removes the folder whatever it
 * holds, and sets a failing exit code when the list is not empty: a leak shows up on the run that
 * introduced it instead of piling up in /tmp.
 *
 * Two runs at once (a developer's and CI's, two worktrees) each look only at their own folder. A run
 * that was killed before its teardown leaves its folder behind; the next run removes such folders
 * when the process named in them no longer exists (a live run's folder is never touched).
 *
 * Not checked: tsx's compile cache (`tsx-<uid>`), made by the one test that starts the command line
 * from its sources; it is a tool's cache, not a test's output, and goes with the folder.
 */
import { mkdtempSync, readdirSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { isAlive } from "../../src/io/outputSet.js";

export const RUN_PREFIX = "cellwright-test-run-";
const TOOL_CACHES = /^tsx-\d+$/;

/** Remove the folders of runs whose process is gone (killed before teardown); returns how many. */
function removeAbandonedRuns(parent: string): number {
  let removed = 0;
  for (const name of readdirSync(parent)) {
    const m = new RegExp(`^${RUN_PREFIX}(\\d+)-`).exec(name);
    if (!m || isAlive(Number(m[1]))) continue;
    rmSync(join(parent, name), { recursive: true, force: true });
    removed++;
  }
  return removed;
}

/** Entries under `dir` (folders with their contents, two levels deep), for the leak report. */
function describeEntries(dir: string, names: string[]): string[] {
  return names.flatMap((name) => {
    let inner: string[] = [];
    try {
      inner = readdirSync(join(dir, name));
    } catch {
      return [`  ${name}`];
    }
    const shown = inner.slice(0, 5).join(", ");
    return [`  ${name}/ (${inner.length} entr${inner.length === 1 ? "y" : "ies"}${inner.length ? `: ${shown}${inner.length > 5 ? ", …" : ""}` : ""})`];
  });
}

/**
 * Make the run's folder under `parent` (after removing killed runs' folders there) and point
 * `env.TMPDIR` at it. The returned `finish` restores TMPDIR, removes the folder and returns the
 * report lines of what the tests left in it (empty: nothing).
 */
export function startRunTempDir(parent: string, env: NodeJS.ProcessEnv = process.env, pid = process.pid): { runDir: string; abandoned: number; finish: () => string[] } {
  const abandoned = removeAbandonedRuns(parent);
  const runDir = mkdtempSync(join(parent, `${RUN_PREFIX}${pid}-`));
  const previous = env.TMPDIR;
  env.TMPDIR = runDir;
  const finish = (): string[] => {
    if (previous === undefined) delete env.TMPDIR;
    else env.TMPDIR = previous;
    let left: string[] = [];
    try {
      left = readdirSync(runDir).filter((n) => !TOOL_CACHES.test(n)).sort();
    } catch {
      // the folder itself was removed by a test: nothing to list
    }
    const report = left.length ? describeEntries(runDir, left) : [];
    rmSync(runDir, { recursive: true, force: true });
    if (!report.length) return [];
    return [
      `error: the tests left ${left.length} entr${left.length === 1 ? "y" : "ies"} in the run's temporary folder ${runDir} (now removed):`,
      ...report,
      "a test that makes a folder takes it from tests/helpers/tempDir.ts, which removes it",
    ];
  };
  return { runDir, abandoned, finish };
}

/** vitest globalSetup: the run's folder under the caller's temporary folder; a leak fails the run. */
export default function setup(): () => void {
  const parent = tmpdir();
  const run = startRunTempDir(parent);
  if (run.abandoned > 0) process.stderr.write(`note: removed ${run.abandoned} temporary folder${run.abandoned === 1 ? "" : "s"} of earlier test runs that were killed (${join(parent, RUN_PREFIX)}*)\n`);
  return () => {
    const report = run.finish();
    if (report.length) {
      process.stderr.write(`\n${report.join("\n")}\n\n`);
      process.exitCode = 1;
    }
  };
}
