/**
 * The whole plan at about 1e4, 1e5 and 1e6 cells: field → reduction → levels → matching → all
 * outputs written (build list streamed). Prints wall time per stage and the peak resident memory
 * of the process (maxRSS, so sizes run in increasing order), and the rate the whole output set is
 * written at, per elapsed second and per CPU second of the process (the build list's size over the
 * time of writing all files; compare with the disk: `dd if=/dev/zero of=FILE bs=1M count=160`,
 * with and without conv=fdatasync). Target on a 2-core machine: 1e6 cells in at most 5 s wall and 1.5 GB peak, all
 * outputs written.
 */
import { mkdtemp, rm, stat } from "node:fs/promises";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { computeTensorField } from "../field/computeTensorField.js";
import { parseDesign } from "../io/design/loadDesign.js";
import { loadMaterialCatalog } from "../io/materialCatalog.js";
import { loadProcessCatalog } from "../io/processCatalog.js";
import { writePlanOutputs } from "../io/planOutputs.js";
import { planFromField } from "../plan/runPlan.js";

/** Printed 28 GHz bend (demo scenario) without a process limit, so every level is matched. */
function benchDesign(pitchM: number): object {
  return {
    name: `bench bend, pitch ${pitchM}`,
    frequency: "28 GHz",
    transform: { kind: "beam-bend", innerRadius: "60 mm", outerRadius: "80 mm", angle: "90 deg", referenceRadius: "80 mm" },
    grid: { pitch: pitchM },
    polarization: "Ez",
    reduction: { scheme: "isotropic", backgroundIndex: 1.2 },
    realization: { materials: ["photopolymer-resin", "air", "ptfe", "hdpe"], lattice: "cubic", tolerance: 0.01 },
  };
}

export async function planBench(log: (line: string) => void): Promise<void> {
  const catalogs = { materials: await loadMaterialCatalog(), processes: await loadProcessCatalog() };
  const areaM2 = (Math.PI / 4) * (0.08 ** 2 - 0.06 ** 2);
  log("cells      field ms  plan ms  write ms  total ms  build-list MB  write MB/s  write MB/cpu-s  peak RSS MB");
  for (const target of [1e4, 1e5, 1e6]) {
    const pitch = Math.sqrt(areaM2 / target);
    const design = await parseDesign(benchDesign(pitch), "bench.json");
    const dir = await mkdtemp(join(tmpdir(), "cw-bench-"));
    try {
      const t0 = performance.now();
      const field = computeTensorField(design);
      const t1 = performance.now();
      const plan = planFromField(design, field, catalogs);
      const t2 = performance.now(), c2 = process.cpuUsage();
      const files = await writePlanOutputs(plan, dir);
      const t3 = performance.now(), c3 = process.cpuUsage(c2);
      const writeCpuS = (c3.user + c3.system) / 1e6;
      const size = (await stat(files[0])).size / 1e6;
      const rss = process.resourceUsage().maxRSS / 1024;
      log(
        `${String(plan.grid.count).padEnd(10)} ${(t1 - t0).toFixed(0).padStart(8)} ${(t2 - t1).toFixed(0).padStart(8)} ${(t3 - t2).toFixed(0).padStart(9)} ${(t3 - t0).toFixed(0).padStart(9)} ${size.toFixed(1).padStart(14)} ${(size / ((t3 - t2) / 1e3)).toFixed(0).padStart(11)} ${(size / writeCpuS).toFixed(0).padStart(15)} ${rss.toFixed(0).padStart(12)}` +
          `   (${plan.levels.length} levels, ${plan.regions.length} regions)`,
      );
    } finally {
      await rm(dir, { recursive: true, force: true });
    }
  }
}
