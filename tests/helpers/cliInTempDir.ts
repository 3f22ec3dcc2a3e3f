/**
 * One command of the command line run in-process with a fresh temporary working folder per test
 * file (made before the tests, removed after): `run(args)` gives the exit code and both streams.
 */
import { beforeAll } from "vitest";
import { join } from "node:path";
import { bufferIo } from "../../src/cli/cliIo.js";
import { runCli } from "../../src/cli/run.js";
import { tempDir } from "./tempDir.js";

export const DEMO_DIR = join(import.meta.dirname, "..", "..", "demo-designs");

export interface CliRun { code: number; out: string; err: string }

export function cliInTempDir(command: string, prefix: string): { readonly dir: string; run: (args: string[]) => Promise<CliRun> } {
  let dir = "";
  beforeAll(() => { dir = tempDir(prefix); });
  return {
    get dir() { return dir; },
    async run(args: string[]): Promise<CliRun> {
      const io = bufferIo(dir);
      const code = await runCli([command, ...args], io);
      return { code, out: io.out(), err: io.err() };
    },
  };
}
