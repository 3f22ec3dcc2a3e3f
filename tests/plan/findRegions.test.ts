import { describe, it, expect } from "vitest";
import { findRegions } from "../../src/plan/findRegions.js";
import type { DeviceGrid } from "../../src/field/deviceGrid.js";

/** A full nx × ny grid, row-major. */
function grid(nx: number, ny: number): DeviceGrid {
  const n = nx * ny;
  const g: DeviceGrid = {
    dimension: 2, pitchM: 1, nx, ny, nz: 1, originXM: 0, originYM: 0, originZM: 0, count: n,
    i: new Int32Array(n), j: new Int32Array(n), k: new Int32Array(n),
    xM: new Float64Array(n), yM: new Float64Array(n), zM: new Float64Array(n),
  };
  for (let c = 0; c < n; c++) { g.i[c] = c % nx; g.j[c] = Math.floor(c / nx); g.xM[c] = g.i[c]; g.yM[c] = g.j[c]; }
  return g;
}

describe("findRegions", () => {
  it("joins 4-neighbours of one level and keeps diagonal touches apart", () => {
    // level map (j up): a checkerboard of 2×2 has four regions, diagonals do not connect
    const g = grid(2, 2);
    const r = findRegions(g, Int32Array.from([0, 1, 1, 0]));
    expect(r.regions.length).toBe(4);
  });
  it("numbers regions in the order of their first cell and counts their cells", () => {
    const g = grid(4, 3);
    // rows j=0: 0 0 1 1 ; j=1: 0 1 1 0 ; j=2: 0 0 0 0  → level 0 wraps round (one region, plus the lone 0 at (3,1)? it touches (3,2))
    const lv = Int32Array.from([0, 0, 1, 1, 0, 1, 1, 0, 0, 0, 0, 0]);
    const r = findRegions(g, lv);
    expect(r.regions.map((x) => [x.level, x.cellCount])).toEqual([[1, 8], [2, 4]]);
    expect(r.region[0]).toBe(0);
    expect(r.region[2]).toBe(1);
  });
});
