/**
 * The build-list writer against the disk, for `npm run bench`: the rows of the 1.05 × 10⁶-cell
 * bench design (bench/plan-bend-1e6.json) made into a sink that keeps nothing, first in this
 * process (its row loop not yet compiled: what one `cellwright plan` pays) and then warm (median
 * of 8), in MB per CPU second of the process (all threads: the compiler's too) and per elapsed
 * second; beside it, the same bytes written to a file in 1 MB writes, with fdatasync at the end
 * and without (page cache only), median of 3 each. The writer is close to the disk when its MB
 * per CPU second is near the disk's MB per second. Nothing here decides pass or fail.
 */
import { closeSync, fdatasyncSync, openSync, rmSync, writeSync, mkdtempSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import { loadFieldForDesign } from "../io/fieldCsv.js";
import { loadDesign } from "../io/design/loadDesign.js";
import { loadMaterialCatalog } from "../io/materialCatalog.js";
import { loadProcessCatalog } from "../io/processCatalog.js";
import { emitBuildList } from "../plan/outputs/buildListRows.js";
import { planFromField } from "../plan/runPlan.js";
import type { Plan } from "../plan/planTypes.js";

const median = (xs: number[]): number => [...xs].sort((p, q) => p - q)[xs.length >> 1];

/** One emit into a sink that only counts: bytes, CPU ms, elapsed ms. */
async function timeEmit(plan: Plan): Promise<{ bytes: number; cpuMs: number; wallMs: number }> {
  let bytes = 0;
  const c0 = process.cpuUsage();
  const t0 = performance.now();
  await emitBuildList(plan, (chunk) => { bytes += chunk.length; });
  const wallMs = performance.now() - t0;
  const c = process.cpuUsage(c0);
  return { bytes, cpuMs: (c.user + c.system) / 1e3, wallMs };
}

/** Elapsed ms to write `chunks` to a new file in `dir`, with or without fdatasync before closing. */
function timeDisk(chunks: readonly Uint8Array[], dir: string, sync: boolean): number {
  const path = join(dir, "disk-rate.bin");
  const t0 = performance.now();
  const fd = openSync(path, "w");
  try {
    for (const c of chunks) writeSync(fd, c);
    if (sync) fdatasyncSync(fd);
  } finally {
    closeSync(fd);
  }
  const ms = performance.now() - t0;
  rmSync(path, { force: true });
  return ms;
}

export async function buildListBench(log: (line: string) => void): Promise<void> {
  const designPath = fileURLToPath(new URL("../../bench/plan-bend-1e6.json", import.meta.url));
  const design = await loadDesign(designPath);
  const catalogs = { materials: await loadMaterialCatalog(), processes: await loadProcessCatalog() };
  // the field as `cellwright plan` makes it (derived arrays only on read)
  const plan = planFromField(design, await loadFieldForDesign(design), catalogs);
  const first = await timeEmit(plan);
  const warm: { cpuMs: number; wallMs: number }[] = [];
  for (let k = 0; k < 8; k++) warm.push(await timeEmit(plan));
  const mb = first.bytes / 1e6;
  const chunks: Uint8Array[] = [];
  await emitBuildList(plan, (chunk) => { chunks.push(Uint8Array.from(chunk)); });
  const dir = mkdtempSync(join(tmpdir(), "cw-bench-disk-"));
  let syncMs: number, cacheMs: number;
  try {
    syncMs = median([0, 1, 2].map(() => timeDisk(chunks, dir, true)));
    cacheMs = median([0, 1, 2].map(() => timeDisk(chunks, dir, false)));
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
  const rate = (ms: number): string => `${(mb / (ms / 1e3)).toFixed(0)} MB/s`;
  const warmCpu = median(warm.map((w) => w.cpuMs)), warmWall = median(warm.map((w) => w.wallMs));
  log(`${plan.grid.count} rows, ${mb.toFixed(1)} MB (${design.name})`);
  log(`writer, first in this process: ${first.cpuMs.toFixed(0)} ms CPU, ${first.wallMs.toFixed(0)} ms elapsed: ${rate(first.cpuMs)} per CPU second, ${rate(first.wallMs)} elapsed`);
  log(`writer, warm (median of 8):    ${warmCpu.toFixed(0)} ms CPU, ${warmWall.toFixed(0)} ms elapsed: ${rate(warmCpu)} per CPU second, ${rate(warmWall)} elapsed`);
  log(`disk, the same bytes in 1 MB writes (median of 3): with fdatasync ${rate(syncMs)}, page cache only ${rate(cacheMs)}`);
  log(`writer / disk with fdatasync: first ${(syncMs / first.cpuMs).toFixed(2)}, warm ${(syncMs / warmCpu).toFixed(2)} (1 = the writer keeps up with the disk on one core)`);
}
