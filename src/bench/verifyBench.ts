/**
 * `npm run bench`: the time of one full `cellwright verify` of each 2D demo at the default accuracy
 * (the grid ladder, every case, extrapolation), run in-process through the command line, median of
 * three runs, with the method (the default auto: radial or grid), the rungs used and the figures'
 * convergence, and the drawn case's homogenization error where it ran (the default --drawn-time).
 * Nothing here decides pass or fail.
 */
import { readdirSync } from "node:fs";
import { join } from "node:path";
import { bufferIo } from "../cli/cliIo.js";
import { runCli } from "../cli/run.js";

const RUNS = 3;

export async function verifyBench(log: (line: string) => void): Promise<void> {
  const dir = join(import.meta.dirname, "..", "..", "demo-designs");
  const demos = readdirSync(dir).filter((f) => f.endsWith(".json") && !f.includes("spherical")).sort();
  for (const demo of demos) {
    const times: number[] = [];
    let summary = "";
    for (let r = 0; r < RUNS; r++) {
      const io = bufferIo(dir);
      const t0 = process.hrtime.bigint();
      const code = await runCli(["verify", join(dir, demo), "--json"], io);
      times.push(Number(process.hrtime.bigint() - t0) / 1e9);
      if (code > 2) { summary = `failed (exit ${code}): ${io.err().split("\n").filter(Boolean).pop()}`; break; }
      try {
        const s = JSON.parse(io.out());
        const grid = s.grid ? `, rungs ${s.resolutions.join("/")}, finest ${s.grid.nx}×${s.grid.ny}` : "";
        const h = s.homogenizationError;
        const drawn = h ? `, homogenization error (σ_geometry − σ_realized)/${h.differenceScale === "bare" ? "σ_bare" : "larger width"} ${h.difference.toFixed(3)}${h.differenceUncertainty === null ? "" : ` ± ${h.differenceUncertainty.toFixed(3)}`}${h.converged === false ? " (not converged)" : ""} (drawn grids ${h.stepsAcrossFeature.join("/")} steps across ${h.featureM} m)` : "";
        summary = `exit ${code}, method ${s.method}${grid}, converged ${s.converged}${drawn}`;
      } catch {
        summary = `exit ${code}: ${io.err().split("\n").filter(Boolean).pop()}`;
        break;
      }
    }
    times.sort((a, b) => a - b);
    log(`${demo.padEnd(36)} median ${times[Math.floor(times.length / 2)].toFixed(1)} s (${times.map((t) => t.toFixed(1)).join(", ")})  ${summary}`);
  }
}
