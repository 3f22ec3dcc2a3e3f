import { describe, it, expect } from "vitest";
import fc from "fast-check";
import { findRegions, findRegionsByLattice } from "../../src/plan/findRegions.js";
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

describe("findRegions by runs (row-major grids)", () => {
  /** A grid of the cells of an nx × ny × nz box that `keep` accepts, row-major (k, j, i). */
  function sparseGrid(nx: number, ny: number, nz: number, keep: (i: number, j: number, k: number) => boolean): DeviceGrid {
    const cells: [number, number, number][] = [];
    for (let k = 0; k < nz; k++) for (let j = 0; j < ny; j++) for (let i = 0; i < nx; i++) if (keep(i, j, k)) cells.push([i, j, k]);
    const n = cells.length;
    const g: DeviceGrid = {
      dimension: nz > 1 ? 3 : 2, pitchM: 1, nx, ny, nz, originXM: 0, originYM: 0, originZM: 0, count: n,
      i: Int32Array.from(cells, (c) => c[0]), j: Int32Array.from(cells, (c) => c[1]), k: Int32Array.from(cells, (c) => c[2]),
      xM: Float64Array.from(cells, (c) => c[0]), yM: Float64Array.from(cells, (c) => c[1]), zM: Float64Array.from(cells, (c) => c[2]),
    };
    return g;
  }

  it("labels exactly as the breadth-first search on random sparse 2D and 3D grids (property)", () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 1, max: 14 }), fc.integer({ min: 1, max: 14 }), fc.integer({ min: 1, max: 4 }),
        fc.integer({ min: 1, max: 4 }), fc.double({ min: 0, max: 0.6, noNaN: true }), fc.integer({ min: 0, max: 2 ** 30 }),
        (nx, ny, nz, levelsN, holes, seed) => {
          let s = seed;
          const rnd = (): number => ((s = (s * 1103515245 + 12345) % 2147483648) / 2147483648);
          const keepMap = Array.from({ length: nx * ny * nz }, () => rnd() >= holes);
          const g = sparseGrid(nx, ny, nz, (i, j, k) => keepMap[(k * ny + j) * nx + i]);
          if (g.count === 0) return;
          // blocky levels (so regions span several rows), some cells without a level (-1)
          const level = Int32Array.from({ length: g.count }, (_, c) => {
            const v = ((g.i[c] >> 1) + 3 * (g.j[c] >> 1) + 5 * g.k[c] + Math.floor(rnd() * 1.3)) % (levelsN + 1);
            return v === levelsN ? -1 : v;
          });
          const fast = findRegions(g, level);
          const slow = findRegionsByLattice(g, level);
          expect(Array.from(fast.region)).toEqual(Array.from(slow.region));
          expect(fast.regions).toEqual(slow.regions);
        },
      ),
      { seed: 29, numRuns: 400 },
    );
  });

  it("falls back to the lattice search for cells not in row-major order, with the same partition", () => {
    const g = grid(3, 2);
    // swap two cells of the listing: (1,0) and (0,1)
    const perm = [0, 3, 2, 1, 4, 5];
    const h: DeviceGrid = { ...g, i: Int32Array.from(perm, (c) => g.i[c]), j: Int32Array.from(perm, (c) => g.j[c]) };
    const lv = Int32Array.from([0, 0, 1, 0, 1, 1]);
    expect(findRegions(h, lv)).toEqual(findRegionsByLattice(h, lv));
    expect(findRegions(h, lv).regions.map((r) => r.cellCount)).toEqual([3, 3]);
  });
});
