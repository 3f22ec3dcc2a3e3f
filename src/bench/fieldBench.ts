/**
 * Tensor-engine timings for `npm run bench`: cells per second for the linear cloak (closed-form
 * K; also as `plan` asks for it, with the derived arrays made only on read) and an expression map
 * (compiled derivatives) at about 1e4, 1e5 and 1e6 cells, and the peak
 * resident memory seen. Targets: ≥ 1e7 cells/s built-in, ≥ 1e6 cells/s expression maps.
 * Nothing here decides pass or fail.
 */
import { computeTensorField } from "../field/computeTensorField.js";
import type { TensorField } from "../field/tensorField.js";
import { parseDesign } from "../io/design/loadDesign.js";

const SIZES = [1e4, 1e5, 1e6];

/** Pitch giving about `cells` cells in an annulus a = 0.4 R, b = R (area 0.84 π R²). */
const pitchFor = (cells: number, outerM: number): number => Math.sqrt((0.84 * Math.PI * outerM * outerM) / cells);

export async function fieldBench(log: (line: string) => void): Promise<void> {
  let peakRss = process.memoryUsage().rss;
  const sample = (): void => { peakRss = Math.max(peakRss, process.memoryUsage().rss); };
  const b = 0.05, a = 0.02;
  const f = `(${b} / (${b} - ${a})) * (1 - ${a} / sqrt(x^2 + y^2))`;
  let sink = 0; // consume results so nothing is optimized away
  const consume = (field: TensorField): void => { sink += field.eps.xx[field.grid.count >> 1] + field.grid.count; };
  for (const which of ["linear cloak", "linear cloak, plan's path", "expression map"] as const) {
    for (const cells of SIZES) {
      const pitch = pitchFor(cells, b);
      const transform = which !== "expression map"
        ? { kind: "radial-cloak", innerRadius: a, outerRadius: b }
        : { kind: "expression", virtual: { x: `x * ${f}`, y: `y * ${f}` }, region: { annulus: { innerRadius: a, outerRadius: b } } };
      const design = await parseDesign({ name: "bench", frequency: "10 GHz", transform, grid: { pitch } }, "bench.json");
      consume(computeTensorField(design)); // warm-up
      sample();
      const runs = cells >= 1e6 ? 2 : cells >= 1e5 ? 5 : 20;
      let best = Infinity, n = 0;
      for (let r = 0; r < runs; r++) {
        (globalThis as { gc?: () => void }).gc?.(); // start each run from a collected heap when --expose-gc
        const t0 = process.hrtime.bigint();
        // plan's path: det J, principal values and anisotropy are made only if read (a plan never reads them)
        const field = computeTensorField(design, undefined, undefined, { derived: which === "linear cloak, plan's path" ? "lazy" : "eager" });
        const dt = Number(process.hrtime.bigint() - t0) / 1e9;
        best = Math.min(best, dt);
        n = field.grid.count;
        consume(field);
        sample();
      }
      log(`${which.padEnd(26)} ${String(n).padStart(8)} cells  ${(n / best / 1e6).toFixed(2).padStart(7)} M cells/s  (best of ${runs}, ${which === "linear cloak, plan's path" ? "grid and tensors; derived arrays on read" : "whole field incl. grid and eigenvalues"})`);
    }
  }
  log(`peak RSS ${(peakRss / 2 ** 20).toFixed(0)} MiB  (checksum ${sink.toExponential(3)})`);
}
