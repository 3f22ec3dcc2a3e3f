/**
 * Temporary folders for tests, removed when they are done with, passed or failed. Every test that
 * needs a folder on disk takes it from here, so nothing is left in the machine's temporary folder;
 * the run checks that (tests/setup/runTempDir.ts fails a run that leaves anything behind).
 *
 *   it("…", () => { const dir = tempDir("cw-plan-"); … })        removed when this test finishes
 *   beforeAll(() => { dir = tempDir("cw-reduce-"); })             removed after the file's last test
 *
 * Whatever a spawned `cellwright` writes inside the folder (an --out under it) goes with it.
 */
import { afterAll, onTestFinished, TestRunner } from "vitest";
import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";

function remove(dir: string): void {
  rmSync(dir, { recursive: true, force: true, maxRetries: 3 });
}

// folders made outside a test (in a beforeAll or a describe body): removed after the file's tests.
// This module is evaluated once per test file (vitest isolates files), while the file is collected,
// so the hook belongs to that file.
const forFile: string[] = [];
afterAll(() => {
  for (const dir of forFile.splice(0)) remove(dir);
});

/**
 * A fresh folder `<tmpdir>/<prefix>XXXXXX`. Made inside a test, it is removed when that test
 * finishes (also when it fails or times out); made in a hook or a describe body, after the file's
 * last test.
 */
export function tempDir(prefix: string): string {
  const dir = mkdtempSync(join(tmpdir(), prefix));
  if (TestRunner.getCurrentTest()) onTestFinished(() => remove(dir));
  else forFile.push(dir);
  return dir;
}
