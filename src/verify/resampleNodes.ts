/**
 * A nodal field of one FDFD grid read at the nodes of another (bilinear between the four
 * surrounding nodes; NaN — no data — outside the source grid's interior, i.e. in or beyond its
 * PML; fieldSvg.ts draws those grey). The drawn
 * realized case is solved on a finer grid of its own (runCheck.ts); its |u| is brought onto the
 * main grid so the field picture shows every case on one grid. Pure; allocates only the result.
 */
import type { FdfdGrid } from "./fdfdGrid.js";

export function resampleNodes(from: FdfdGrid, values: Float64Array, to: FdfdGrid): Float64Array {
  const out = new Float64Array(to.nx * to.ny).fill(NaN);
  const lo = from.pml, hiX = from.nx - 1 - from.pml, hiY = from.ny - 1 - from.pml;
  for (let j = 0; j < to.ny; j++) {
    const fy = (to.y0 + j * to.h - from.y0) / from.h;
    const q = Math.floor(fy);
    if (q < lo || q + 1 > hiY) continue;
    const ty = fy - q;
    for (let i = 0; i < to.nx; i++) {
      const fx = (to.x0 + i * to.h - from.x0) / from.h;
      const p = Math.floor(fx);
      if (p < lo || p + 1 > hiX) continue;
      const tx = fx - p, k = p + from.nx * q;
      out[i + to.nx * j] = (1 - ty) * ((1 - tx) * values[k] + tx * values[k + 1]) + ty * ((1 - tx) * values[k + from.nx] + tx * values[k + from.nx + 1]);
    }
  }
  return out;
}
