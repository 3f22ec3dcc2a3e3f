/**
 * `npm run bench`: one frequency sweep of the split-ring mast cloak (8 frequencies, one grid at 10
 * points per wavelength) through the built command line, frequencies on the worker pool against
 * the same sweep held to one thread (a memory budget that admits one worker), median of three
 * whole-process runs each; then the reduced radial cloak swept at 3 frequencies by the exact radial
 * solver (`--method auto`) against the grid ladder at --accuracy 10 % (`--method fdfd`), with the
 * estimate each printed. Nothing here decides pass or fail.
 */
import { spawnSync } from "node:child_process";
import { join } from "node:path";

const RUNS = 3;

/** One whole `verify --sweep` process: wall seconds, its estimate and the exit code. */
function sweepRun(args: string[]): { seconds: number; estimate: number; code: number | null } {
  const root = join(import.meta.dirname, "..", "..");
  const t0 = process.hrtime.bigint();
  const p = spawnSync(process.execPath, [join(root, "dist", "cli", "main.js"), "verify", join(root, "demo-designs", "field-radial-cloak.json"), ...args, "--json"], { encoding: "utf8" });
  const seconds = Number(process.hrtime.bigint() - t0) / 1e9;
  if (p.status !== 0 && p.status !== 2) throw new Error(`sweep failed (exit ${p.status}): ${p.stderr.split("\n").filter(Boolean).pop()}`);
  return { seconds, estimate: JSON.parse(p.stdout).estimate.solvingSeconds, code: p.status };
}

function once(env: NodeJS.ProcessEnv): { seconds: number; workers: number; threads: number; band: string } {
  const root = join(import.meta.dirname, "..", "..");
  const args = [join(root, "dist", "cli", "main.js"), "verify", join(root, "demo-designs", "plan-microwave-mast-cloak.json"), "--sweep", "8.3 GHz..8.7 GHz:8", "--resolution", "10", "--json"];
  const t0 = process.hrtime.bigint();
  const p = spawnSync(process.execPath, args, { encoding: "utf8", env: { ...process.env, ...env } });
  const seconds = Number(process.hrtime.bigint() - t0) / 1e9;
  if (p.status !== 0 && p.status !== 2) throw new Error(`sweep failed (exit ${p.status}): ${p.stderr.split("\n").filter(Boolean).pop()}`);
  const s = JSON.parse(p.stdout).sweep;
  const b = s.band;
  return { seconds, workers: s.workers, threads: s.threads, band: b.lowHz === null ? "none" : `${(b.lowHz / 1e9).toFixed(3)}–${(b.highHz / 1e9).toFixed(3)} GHz` };
}

export async function sweepBench(log: (line: string) => void): Promise<void> {
  for (const [label, env] of [["worker pool", {}], ["one thread", { CELLWRIGHT_MEMORY_LIMIT: "150 MB" }]] as const) {
    const runs = Array.from({ length: RUNS }, () => once(env));
    const t = runs.map((r) => r.seconds).sort((a, b) => a - b);
    log(`mast cloak, 8 frequencies, ${label.padEnd(12)} median ${t[Math.floor(RUNS / 2)].toFixed(1)} s (${t.map((x) => x.toFixed(1)).join(", ")})  workers ${runs[0].workers}, threads ${runs[0].threads}, band ${runs[0].band}`);
  }
  const sweep = ["--scheme", "unit-mu", "--sweep", "9 GHz..9.8 GHz:3"];
  for (const [label, extra] of [["radial (auto)", []], ["grid at 10 %", ["--method", "fdfd", "--accuracy", "10%"]]] as const) {
    const runs = Array.from({ length: RUNS }, () => sweepRun([...sweep, ...extra]));
    const t = runs.map((r) => r.seconds).sort((a, b) => a - b);
    log(`reduced radial cloak, 3 frequencies, ${label.padEnd(13)} median ${t[Math.floor(RUNS / 2)].toFixed(1)} s wall (${t.map((x) => x.toFixed(1)).join(", ")})  estimated solving ${runs[0].estimate.toFixed(1)} s, exit ${runs[0].code}`);
  }
}
