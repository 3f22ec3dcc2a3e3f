/**
 * Tensor-engine timings for `npm run bench`: cells per second for the linear cloak (closed-form
 * K; also as `plan` asks for it, with the derived arrays made only on read) and an expression map
 * (compiled derivatives) at about 1e4, 1e5 and 1e6 cells, into fresh arrays and into reused
 * buffers (fieldBuffers.ts), by elapsed and by CPU time, and the peak resident memory seen.
 * Targets: ≥ 1e7 cells/s built-in, ≥ 1e6 cells/s expression maps.
 * Nothing here decides pass or fail.
 */
import { computeTensorField } from "../field/computeTensorField.js";
import type { TensorField } from "../field/tensorField.js";
import { parseDesign } from "../io/design/loadDesign.js";
import { fieldBuffers } from "../field/fieldBuffers.js";

const SIZES = [1e4, 1e5, 1e6];

/** Pitch giving about `cells` cells in an annulus a = 0.4 R, b = R (area 0.84 π R²). */
const pitchFor = (cells: number, outerM: number): number => Math.sqrt((0.84 * Math.PI * outerM * outerM) / cells);

/** Median of a list. */
const median = (xs: number[]): number => [...xs].sort((p, q) => p - q)[xs.length >> 1];

export async function fieldBench(log: (line: string) => void): Promise<void> {
  let peakRss = process.memoryUsage().rss;
  const sample = (): void => { peakRss = Math.max(peakRss, process.memoryUsage().rss); };
  const b = 0.05, a = 0.02;
  const f = `(${b} / (${b} - ${a})) * (1 - ${a} / sqrt(x^2 + y^2))`;
  let sink = 0; // consume results so nothing is optimized away
  const consume = (field: TensorField): void => { sink += field.eps.xx[field.grid.count >> 1] + field.grid.count; };
  log("M cells/s, medians (best) of the runs; wall = elapsed, cpu = process CPU time (user + system, all threads).");
  log("fresh: new output arrays each run (page faults on first write); reused: one fieldBuffers() for all runs.");
  log(`${"".padEnd(26)} ${"cells".padStart(8)}  ${"fresh wall".padStart(17)} ${"fresh cpu".padStart(17)}  ${"reused wall".padStart(17)} ${"reused cpu".padStart(17)}`);
  for (const which of ["linear cloak", "linear cloak, plan's path", "expression map"] as const) {
    for (const cells of SIZES) {
      const pitch = pitchFor(cells, b);
      const transform = which !== "expression map"
        ? { kind: "radial-cloak", innerRadius: a, outerRadius: b }
        : { kind: "expression", virtual: { x: `x * ${f}`, y: `y * ${f}` }, region: { annulus: { innerRadius: a, outerRadius: b } } };
      const design = await parseDesign({ name: "bench", frequency: "10 GHz", transform, grid: { pitch } }, "bench.json");
      // plan's path: det J, principal values and anisotropy are made only if read (a plan never reads them)
      const derived = which === "linear cloak, plan's path" ? "lazy" : "eager";
      consume(computeTensorField(design, undefined, undefined, { derived })); // warm-up
      sample();
      const runs = cells >= 1e6 ? 7 : cells >= 1e5 ? 7 : 20;
      const rates: Record<string, number[]> = { freshWall: [], freshCpu: [], reusedWall: [], reusedCpu: [] };
      let n = 0;
      const buffers = fieldBuffers();
      for (const mode of ["fresh", "reused"] as const) {
        for (let r = 0; r < runs; r++) {
          (globalThis as { gc?: () => void }).gc?.(); // start each run from a collected heap when --expose-gc
          const c0 = process.cpuUsage(), t0 = process.hrtime.bigint();
          const field = computeTensorField(design, undefined, undefined, { derived, ...(mode === "reused" ? { buffers } : {}) });
          const wall = Number(process.hrtime.bigint() - t0) / 1e9, used = process.cpuUsage(c0);
          n = field.grid.count;
          rates[`${mode}Wall`].push(n / wall / 1e6);
          rates[`${mode}Cpu`].push(n / ((used.user + used.system) / 1e6) / 1e6);
          consume(field);
          sample();
        }
      }
      const cell = (xs: number[]): string => `${median(xs).toFixed(2).padStart(7)} (${Math.max(...xs).toFixed(2).padStart(6)})`;
      log(`${which.padEnd(26)} ${String(n).padStart(8)}  ${cell(rates.freshWall)} ${cell(rates.freshCpu)}  ${cell(rates.reusedWall)} ${cell(rates.reusedCpu)}  (${runs} runs each)`);
    }
  }
  log(`peak RSS ${(peakRss / 2 ** 20).toFixed(0)} MiB  (checksum ${sink.toExponential(3)})`);
}
