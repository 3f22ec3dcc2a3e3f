/**
 * One fresh process, as `cellwright plan` runs: the bench design planned, then its build list
 * written as an output set into a new folder (io/outputSet.ts: a stream of 1 MB writes with its
 * CRC-32, renamed into place, the manifest last), either made by the writer as it goes
 * ("writer") or copied from the same bytes made before the clock starts ("bytes": what the file
 * system alone takes). With "sync" as the second argument the file is fdatasync'ed before the
 * clock stops. Prints one JSON line {mode, bytes, wallMs, cpuMs}; buildListBench.ts runs it.
 */
import { closeSync, fdatasyncSync, mkdtempSync, openSync, rmSync, statSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import { loadFieldForDesign } from "../io/fieldCsv.js";
import { loadDesign } from "../io/design/loadDesign.js";
import { loadMaterialCatalog } from "../io/materialCatalog.js";
import { loadProcessCatalog } from "../io/processCatalog.js";
import { writeOutputSet } from "../io/outputSet.js";
import { emitBuildList } from "../plan/outputs/buildListRows.js";
import { planFromField } from "../plan/runPlan.js";

async function main(): Promise<void> {
  const mode = process.argv[2] === "bytes" ? "bytes" : "writer";
  const sync = process.argv[3] === "sync";
  const design = await loadDesign(fileURLToPath(new URL("../../bench/plan-bend-1e6.json", import.meta.url)));
  const catalogs = { materials: await loadMaterialCatalog(), processes: await loadProcessCatalog() };
  const plan = planFromField(design, await loadFieldForDesign(design), catalogs);
  let made: Uint8Array[] | null = null;
  if (mode === "bytes") {
    made = [];
    const list = made;
    await emitBuildList(plan, (chunk) => { list.push(Uint8Array.from(chunk)); });
  }
  const dir = mkdtempSync(join(tmpdir(), "cw-bench-file-"));
  try {
    const c0 = process.cpuUsage();
    const t0 = performance.now();
    const [path] = await writeOutputSet(dir, [{
      name: "build-list.csv",
      produce: async (write) => {
        if (made) for (const chunk of made) await write(chunk);
        else await emitBuildList(plan, write);
      },
    }]);
    if (sync) {
      const fd = openSync(path, "r+");
      try { fdatasyncSync(fd); } finally { closeSync(fd); }
    }
    const wallMs = performance.now() - t0;
    const c = process.cpuUsage(c0);
    const bytes = statSync(path).size;
    process.stdout.write(`${JSON.stringify({ mode, bytes, wallMs, cpuMs: (c.user + c.system) / 1e3 })}\n`);
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

main().catch((err) => {
  process.stderr.write(`${(err as Error).stack ?? String(err)}\n`);
  process.exitCode = 1;
});
