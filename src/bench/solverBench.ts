/**
 * The verify solver at 200², 400², 700² (and 1000² with `--large`) nodes: a point source in free
 * space with a PML (12 nodes, 15 points per wavelength), the same operator `solveLinear` factors
 * for every verify case. Prints per size the symbolic estimate (factor entries, work, memory) and
 * the medians over repeats of assembly, factorization, solve (with the residual check) and the
 * whole call (wall, and CPU seconds of this process, which tell the cost when other work shares the cores), plus the process's peak resident memory (maxRSS; sizes run in increasing order, so it
 * is the peak of the largest size so far). bench/sparseSolveScipy.py solves the same grid with
 * scipy's general sparse LU for comparison.
 */
import { gridOrdering } from "../numerics/gridNestedDissection.js";
import { factorGridMatrix, solveWithFactor } from "../numerics/sparseLdltSolve.js";
import { assembleSparseOperator, solveCost } from "../verify/assemble.js";
import { gridForWindow, type FdfdGrid } from "../verify/fdfdGrid.js";
import { backgroundGridCoefficients } from "../verify/gridCoefficients.js";
import { pmlStretch } from "../verify/pml.js";

const median = (v: number[]): number => { const s = [...v].sort((a, b) => a - b); return s[s.length >> 1]; };

function benchGrid(nodes: number): FdfdGrid {
  const h = 1 / 15, pml = 12;
  const half = ((nodes - 1 - 2 * pml) * h) / 2;
  return gridForWindow({ minX: -half, maxX: half, minY: -half, maxY: half }, h, pml);
}

export async function solverBench(log: (line: string) => void): Promise<void> {
  const large = process.argv.includes("--large");
  const sizes = large ? [200, 400, 700, 1000] : [200, 400, 700];
  const k0 = 2 * Math.PI;
  log(`nodes        unknowns  factor M entries  work G  est. MB   assemble s  order s  factor s  solve s  total s  cpu s  residual   peak RSS MB  (medians)`);
  for (const s of sizes) {
    const g = benchGrid(s);
    const cost = solveCost(g);
    const runs = s <= 400 ? 5 : s <= 700 ? 3 : 1;
    const t: number[][] = [[], [], [], [], [], []];
    let residual = 0;
    for (let r = 0; r < runs; r++) {
      const c = backgroundGridCoefficients(g, { polarization: "Ez", background: { eps: 1, mu: 1 } });
      const n = g.nx * g.ny, fRe = new Float64Array(n), fIm = new Float64Array(n);
      fRe[(g.nx >> 1) + g.nx * (g.ny >> 1)] = 1 / (g.h * g.h);
      const t0 = performance.now(), cpu0 = process.cpuUsage();
      const m = assembleSparseOperator(g, c, pmlStretch(g, k0, 1), k0, null, fRe, fIm);
      const t1 = performance.now();
      const ord = gridOrdering(g.nx, g.ny);
      const t2 = performance.now();
      const fac = factorGridMatrix(m, ord);
      const t3 = performance.now();
      if (!fac.ok) { log(`${s}²: ${fac.reason}`); return; }
      const sol = solveWithFactor(m, fac.factor, fac.pivotRatio, fRe, fIm);
      const t4 = performance.now(), cpu = process.cpuUsage(cpu0);
      if (!sol.ok) { log(`${s}²: ${sol.reason}`); return; }
      residual = sol.residual;
      t[0].push(t1 - t0); t[1].push(t2 - t1); t[2].push(t3 - t2); t[3].push(t4 - t3); t[4].push(t4 - t0); t[5].push((cpu.user + cpu.system) / 1000);
      (globalThis as { gc?: () => void }).gc?.();
    }
    const rss = process.resourceUsage().maxRSS / 1024;
    const sec = (v: number[]): string => (median(v) / 1000).toFixed(2).padStart(8);
    log(
      `${`${g.nx}×${g.ny}`.padEnd(12)} ${String(cost.unknowns).padStart(8)} ${(cost.factorEntries / 1e6).toFixed(1).padStart(17)} ${(cost.work / 1e9).toFixed(2).padStart(7)} ${cost.megabytes.toFixed(0).padStart(7)}  ` +
        `${sec(t[0])}  ${sec(t[1])} ${sec(t[2])} ${sec(t[3])} ${sec(t[4])} ${sec(t[5])}  ${residual.toExponential(1)}  ${rss.toFixed(0).padStart(10)}   (${runs} runs)`,
    );
  }
  if (!large) log("(1000 × 1000 nodes: npm run bench -- --large)");
}
