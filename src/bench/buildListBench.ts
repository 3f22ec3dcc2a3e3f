/**
 * The build-list writer against the disk, for `npm run bench`, on the rows of the 1.05 × 10⁶-cell
 * bench design (bench/plan-bend-1e6.json).
 *
 * 1. As `cellwright plan` meets it (buildListToFile.ts, fresh processes, alternated, 5 of each, with
 *    and without fdatasync): the build list written as an output set into a new folder, made by
 *    the writer as it goes, against the same bytes made beforehand and written the same way —
 *    what the file system alone takes. Their ratio is how close the writer streams to the disk.
 * 2. The writer alone, into a sink that keeps nothing: first in this process (its row loop not yet
 *    compiled) and warm (median of 8), in ms of CPU (all threads) and elapsed; beside it the same
 *    bytes written in 1 MB writes into a file whose pages the page cache has just freed (median of
 *    3, with fdatasync and without): the writer's own speed against a disk at its fastest.
 * Nothing here decides pass or fail.
 */
import { execFileSync } from "node:child_process";
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

interface FileRun { mode: "writer" | "bytes"; bytes: number; wallMs: number; cpuMs: number }

/** One fresh process writing the build list into a new output set (buildListToFile.ts). */
function fileRun(mode: "writer" | "bytes", sync: boolean): FileRun {
  const script = fileURLToPath(new URL("./buildListToFile.js", import.meta.url));
  const out = execFileSync(process.execPath, [script, mode, ...(sync ? ["sync"] : [])], { encoding: "utf8", env: process.env });
  return JSON.parse(out.trim().split("\n").pop() ?? "") as FileRun;
}

/** Part 1: writer against bytes, as plan meets them; returns the lines to print. */
function asPlanMeetsIt(mb: number): string[] {
  const lines: string[] = [];
  for (const sync of [false, true]) {
    const runs: FileRun[] = [];
    for (let k = 0; k < 5; k++) runs.push(fileRun("bytes", sync), fileRun("writer", sync));
    const of = (m: string) => runs.filter((r) => r.mode === m);
    const wall = (m: string) => median(of(m).map((r) => r.wallMs));
    const span = (m: string) => `${Math.min(...of(m).map((r) => r.wallMs)).toFixed(0)}–${Math.max(...of(m).map((r) => r.wallMs)).toFixed(0)}`;
    const pairs = of("bytes").map((b, k) => b.wallMs / of("writer")[k].wallMs);
    const rate = (ms: number) => `${(mb / (ms / 1e3)).toFixed(0)} MB/s`;
    lines.push(`into a new output set${sync ? ", fdatasync" : ""} (fresh processes, median of 5): the bytes alone ${wall("bytes").toFixed(0)} ms (${span("bytes")}, ${rate(wall("bytes"))}); the writer ${wall("writer").toFixed(0)} ms (${span("writer")}, ${rate(wall("writer"))}, ${median(of("writer").map((r) => r.cpuMs)).toFixed(0)} ms CPU)`);
    lines.push(`  writer's rate / the file system's: median of pairs ${median(pairs).toFixed(2)} (${Math.min(...pairs).toFixed(2)}–${Math.max(...pairs).toFixed(2)}; 1 = keeps up)`);
  }
  return lines;
}

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
  const planLines = asPlanMeetsIt(first.bytes / 1e6);
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
  for (const line of planLines) log(line);
  log(`writer, first in this process: ${first.cpuMs.toFixed(0)} ms CPU, ${first.wallMs.toFixed(0)} ms elapsed: ${rate(first.cpuMs)} per CPU second, ${rate(first.wallMs)} elapsed`);
  log(`writer, warm (median of 8):    ${warmCpu.toFixed(0)} ms CPU, ${warmWall.toFixed(0)} ms elapsed: ${rate(warmCpu)} per CPU second, ${rate(warmWall)} elapsed`);
  log(`disk at its fastest, the same bytes in 1 MB writes into freed pages (median of 3): with fdatasync ${rate(syncMs)}, page cache only ${rate(cacheMs)}`);
  log(`writer's CPU rate / that disk's with fdatasync: first ${(syncMs / first.cpuMs).toFixed(2)}, warm ${(syncMs / warmCpu).toFixed(2)} (1 = the writer alone keeps up with the disk at its fastest)`);
}
