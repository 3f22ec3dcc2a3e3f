/**
 * Rect-lattice fill tables for `npm run bench` (cells/homogenize/rectCircleTable.ts): the time to
 * solve one table (12 nodes, xx and yy, both ladders) for holes in a dielectric (contrast 1/8, the
 * n = 16 ladder) and rods of contrast 50 (the n = 32 ladder), aspects 3/2, 2 and 3. Nothing
 * decides pass or fail.
 */
import { buildRectTable } from "../cells/homogenize/rectCircleTable.js";

export async function rectTableBench(log: (line: string) => void): Promise<void> {
  log("contrast   aspect   table s   worst error");
  let sink = 0;
  for (const u of [1 / 8, 50]) {
    for (const aspect of [1.5, 2, 3]) {
      const t0 = performance.now();
      const t = buildRectTable(u, aspect);
      const s = (performance.now() - t0) / 1000;
      sink += t.nodes[3].xx;
      log(`${u.toPrecision(3).padStart(8)}   ${String(aspect).padStart(6)}   ${s.toFixed(2).padStart(7)}   ${t.error.toExponential(2)}`);
    }
  }
  if (!Number.isFinite(sink)) log("(non-finite result)");
}
