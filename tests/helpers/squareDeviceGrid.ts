/** An n × n device grid of square cells centred on the origin, every lattice point inside. */
import type { DeviceGrid } from "../../src/field/deviceGrid.js";

export function squareDeviceGrid(n: number, pitchM: number): DeviceGrid {
  const count = n * n;
  const g: DeviceGrid = { dimension: 2, pitchM, nx: n, ny: n, nz: 1, originXM: -((n - 1) / 2) * pitchM, originYM: -((n - 1) / 2) * pitchM, originZM: 0, count,
    i: new Int32Array(count), j: new Int32Array(count), k: new Int32Array(count), xM: new Float64Array(count), yM: new Float64Array(count), zM: new Float64Array(count) };
  for (let c = 0; c < count; c++) { g.i[c] = c % n; g.j[c] = Math.floor(c / n); g.xM[c] = g.originXM + g.i[c] * pitchM; g.yM[c] = g.originYM + g.j[c] * pitchM; }
  return g;
}
