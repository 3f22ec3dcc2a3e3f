/**
 * `verify --sweep` from the compiled command line (dist/cli/main.js, built by `npm test`'s pretest
 * step): the frequencies run on worker threads (dist/cli/sweepWorker.js) and give exactly the
 * figures of the same sweep solved in this thread from the sources.
 */
import { describe, expect, it } from "vitest";
import { spawnSync } from "node:child_process";
import { existsSync } from "node:fs";
import { join, resolve } from "node:path";
import { bufferIo } from "../../src/cli/cliIo.js";
import { runCli } from "../../src/cli/run.js";
import { checkOutputSet } from "../../src/io/outputSet.js";
import { tempDir } from "../helpers/tempDir.js";

const BIN = resolve("dist/cli/main.js");
const CLOAK = resolve("demo-designs/field-radial-cloak.json");
// --workers 2: a sweep this short would run in the command's own thread by itself (sweepTime.ts)
const ARGS = ["verify", CLOAK, "--sweep", "9 GHz..9.8 GHz:2", "--resolution", "8", "--margin", "8 mm", "--json", "--workers", "2"];
// an expression map: its transform holds compiled functions, which do not cross to a worker; the workers load it again
const EXPRESSION = resolve("demo-designs/field-expression.json");
const EXPR_ARGS = ["verify", EXPRESSION, "--sweep", "14 GHz..16 GHz:2", "--resolution", "6", "--json", "--workers", "2"];

describe("verify --sweep from the built command line", () => {
  it("runs the frequencies on worker threads and matches the in-thread sweep", async () => {
    expect(existsSync(BIN), "dist/ is missing: run npm run build").toBe(true);
    expect(existsSync(resolve("dist/cli/sweepWorker.js")), "the worker is not in dist/").toBe(true);
    const dir = tempDir("cw-sweep-built-");
    const p = spawnSync(process.execPath, [BIN, ...ARGS, "--out", join(dir, "out")], { encoding: "utf8", timeout: 110_000 });
    expect(p.status, p.stderr).toBe(0);
    const built = JSON.parse(p.stdout);
    expect(built.sweep.workers).toBe(2);
    expect(built.sweep.threads).toBe(built.sweep.workers > 1 ? built.sweep.workers : 0);
    expect((await checkOutputSet(join(dir, "out"))).ok).toBe(true);
    const io = bufferIo(dir);
    expect(await runCli(ARGS, io), io.err()).toBe(0);
    const here = JSON.parse(io.out());
    expect(here.sweep.threads).toBe(0);
    const strip = (s: Record<string, unknown>) => ({ ...s, threads: undefined, workers: undefined });
    expect(strip(built.sweep)).toEqual(strip(here.sweep));
  }, 120_000);

  it("without --workers a short sweep runs in the command's own thread and says why", () => {
    const p = spawnSync(process.execPath, [BIN, ...ARGS.slice(0, -2)], { encoding: "utf8", timeout: 110_000 });
    expect(p.status, p.stderr).toBe(0);
    const s = JSON.parse(p.stdout);
    expect([s.sweep.workers, s.sweep.threads]).toEqual([1, 0]);
    expect(s.estimate.threads).toBe(1);
    expect(s.estimate.wallSeconds).toBeGreaterThan(0);
    expect(s.estimate.wallSeconds).toBeLessThan(12); // POOL_MIN_SECONDS
    expect(s.notes.join("\n")).toMatch(/one thread: the sweep is short|cores are busy/);
  }, 120_000);

  it("a design whose transform cannot be cloned (expression map) is loaded again by the workers", async () => {
    const p = spawnSync(process.execPath, [BIN, ...EXPR_ARGS], { encoding: "utf8", timeout: 170_000 });
    expect(p.status, p.stderr).toBe(0);
    const built = JSON.parse(p.stdout);
    expect(built.sweep.threads).toBe(built.sweep.workers > 1 ? built.sweep.workers : 0);
    const io = bufferIo();
    expect(await runCli(EXPR_ARGS, io), io.err()).toBe(0);
    const strip = (s: Record<string, unknown>) => ({ ...s, threads: undefined, workers: undefined });
    expect(strip(built.sweep)).toEqual(strip(JSON.parse(io.out()).sweep));
  }, 180_000);
});
