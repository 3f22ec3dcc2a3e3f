/**
 * The polygon index (field/polygonIndex.ts) answers exactly like the per-point even–odd ray cast
 * it replaced (tests/helpers/rayCastPolygon.ts, an identity check: same rule, same arithmetic),
 * on random simple and self-intersecting polygons, points on vertices and edges, and grid rows.
 */
import { describe, it, expect } from "vitest";
import fc from "fast-check";
import { polygonIndex } from "../../src/field/polygonIndex.js";
import { makeRegion } from "../../src/field/region.js";
import { buildDeviceGrid } from "../../src/field/buildDeviceGrid.js";
import { rayCastContains } from "../helpers/rayCastPolygon.js";

const SEED = 42;

/** vertices on a coarse integer lattice: many horizontal edges, shared vertices, collinear runs, points on edges */
const latticePolygon = fc.array(fc.tuple(fc.integer({ min: -6, max: 6 }), fc.integer({ min: -6, max: 6 })), { minLength: 3, maxLength: 40 });
/** arbitrary doubles in a box: generic positions, edges crossing each other everywhere */
const floatPolygon = fc.array(
  fc.tuple(fc.double({ min: -1, max: 1, noNaN: true }), fc.double({ min: -1, max: 1, noNaN: true })),
  { minLength: 3, maxLength: 60 },
);
const split = (pts: [number, number][]) => ({ xs: Float64Array.from(pts, (p) => p[0]), ys: Float64Array.from(pts, (p) => p[1]) });

function agreeAtPoints(pts: [number, number][], queries: [number, number][]): void {
  const { xs, ys } = split(pts);
  const index = polygonIndex(xs, ys);
  const wrong: string[] = [];
  for (const [x, y] of queries) {
    // twice: the first query on a row counts directly, the second uses the row's sorted crossings
    const want = rayCastContains(xs, ys, x, y);
    if (index.contains(x, y) !== want) wrong.push(`(${x}, ${y}) first query`);
    if (index.contains(x, y) !== want) wrong.push(`(${x}, ${y}) repeated on the row`);
  }
  expect(wrong.slice(0, 5)).toEqual([]);
}

function agreeOnRows(pts: [number, number][], x0: number, pitch: number, cells: number, rowsY: number[]): void {
  const { xs, ys } = split(pts);
  const index = polygonIndex(xs, ys);
  const out = new Uint8Array(cells);
  const wrong: string[] = [];
  for (const y of rowsY) {
    index.containsRow(out, y, x0, pitch);
    for (let i = 0; i < cells; i++) {
      const x = x0 + i * pitch;
      if ((out[i] === 1) !== rayCastContains(xs, ys, x, y)) wrong.push(`row y = ${y}, cell ${i} (x = ${x})`);
    }
  }
  expect(wrong.slice(0, 5)).toEqual([]);
}

describe("polygon index: identical to the per-point ray cast", () => {
  it("lattice polygons, points on vertices, edges and half-way (on-edge rule included)", () => {
    fc.assert(
      fc.property(latticePolygon, (pts) => {
        const q: [number, number][] = [];
        for (let y = -7; y <= 7; y += 0.5) for (let x = -7; x <= 7; x += 0.5) q.push([x, y]);
        agreeAtPoints(pts as [number, number][], q);
      }),
      { seed: SEED, numRuns: 150 },
    );
  });

  it("random self-intersecting polygons at random points", () => {
    fc.assert(
      fc.property(floatPolygon, fc.array(fc.tuple(fc.double({ min: -1.2, max: 1.2, noNaN: true }), fc.double({ min: -1.2, max: 1.2, noNaN: true })), { minLength: 1, maxLength: 80 }), (pts, q) => {
        // also query at the vertices themselves
        agreeAtPoints(pts as [number, number][], [...(q as [number, number][]), ...(pts as [number, number][])]);
      }),
      { seed: SEED, numRuns: 300 },
    );
  });

  it("whole rows of a grid: lattice polygons on grids aligned with their vertices", () => {
    fc.assert(
      fc.property(latticePolygon, fc.integer({ min: -8, max: 0 }), fc.constantFrom(0.5, 1, 0.25, 1 / 3), fc.integer({ min: 1, max: 70 }), (pts, start, pitch, cells) => {
        const rows: number[] = [];
        for (let y = -7; y <= 7; y += 0.5) rows.push(y);
        agreeOnRows(pts as [number, number][], start, pitch, cells, rows);
      }),
      { seed: SEED, numRuns: 150 },
    );
  });

  it("whole rows of a grid: random polygons, random grids", () => {
    fc.assert(
      fc.property(
        floatPolygon,
        fc.double({ min: -1.5, max: 1, noNaN: true }),
        fc.double({ min: 1e-3, max: 0.5, noNaN: true }),
        fc.integer({ min: 1, max: 200 }),
        fc.array(fc.double({ min: -1.2, max: 1.2, noNaN: true }), { minLength: 1, maxLength: 20 }),
        (pts, x0, pitch, cells, rows) => {
          // rows through the vertices too
          agreeOnRows(pts as [number, number][], x0, pitch, cells, [...rows, ...(pts as [number, number][]).map((p) => p[1])]);
        },
      ),
      { seed: SEED, numRuns: 300 },
    );
  });

  it("edge cases: NaN and infinite queries, a row left or right of the polygon, a far grid origin", () => {
    const pts: [number, number][] = [[0, 0], [2, 0], [2, 2], [0, 2]];
    agreeAtPoints(pts, [[NaN, 1], [1, NaN], [Infinity, 1], [-Infinity, 1], [1, Infinity], [0, 0], [2, 2], [0, 2], [2, 0], [1, 0], [1, 2]]);
    agreeOnRows(pts, -10, 1, 5, [0, 1, 2, 3]); // entirely left
    agreeOnRows(pts, 5, 1, 5, [0, 1]); // entirely right
    agreeOnRows(pts, 1e17, 1, 5, [1]); // x0 + i·pitch rounds: equal neighbours
    agreeOnRows(pts, -3, 1e-3, 6000, [1]);
  });
});

describe("polygon regions: grids through the row test", () => {
  it("the device grid of a polygon region holds exactly the cells the ray cast puts inside", () => {
    fc.assert(
      fc.property(floatPolygon, fc.double({ min: 0.01, max: 0.3, noNaN: true }), (pts, pitch) => {
        const spec = { shape: "polygon" as const, pointsM: pts as [number, number][] };
        const region = makeRegion(spec);
        const req = { pitchM: pitch, dimension: 2 as const, where: "test" };
        const withRow = buildDeviceGrid(region.bounds, (x, y) => region.contains(x, y), req, (out, y, _z, x0, p) => region.containsRow!(out, y, x0, p));
        const { xs, ys } = split(spec.pointsM);
        const plain = buildDeviceGrid(region.bounds, (x, y) => rayCastContains(xs, ys, x, y), req);
        expect(withRow.count).toBe(plain.count);
        expect(Array.from(withRow.i)).toEqual(Array.from(plain.i));
        expect(Array.from(withRow.j)).toEqual(Array.from(plain.j));
      }),
      { seed: SEED, numRuns: 100 },
    );
  });

  it("a 100 000-vertex self-intersecting polygon: grid, point tests and boundary samples complete and match spot checks", () => {
    // vertices at random angles and radii: nearly every edge is a chord crossing many others
    const n = 100_000;
    const rnd = fc.sample(fc.tuple(fc.double({ min: 0, max: 2 * Math.PI, noNaN: true }), fc.double({ min: 0.02, max: 0.05, noNaN: true })), { seed: SEED, numRuns: n });
    const pts = rnd.map(([t, r]) => [r * Math.cos(t), r * Math.sin(t)] as [number, number]);
    const region = makeRegion({ shape: "polygon", pointsM: pts });
    const { xs, ys } = split(pts);
    const grid = buildDeviceGrid(region.bounds, (x, y) => region.contains(x, y), { pitchM: 0.004, dimension: 2, where: "test" }, (out, y, _z, x0, p) => region.containsRow!(out, y, x0, p));
    expect(grid.count).toBeGreaterThan(0);
    // spot check: every 7th lattice point of the bounding box against the ray cast
    let inside = 0, checked = 0;
    for (let j = 0; j < grid.ny; j += 3) {
      for (let i = 0; i < grid.nx; i += 7) {
        const x = grid.originXM + i * grid.pitchM, y = grid.originYM + j * grid.pitchM;
        const want = rayCastContains(xs, ys, x, y);
        expect(region.contains(x, y), `(${x}, ${y})`).toBe(want);
        let inGrid = false;
        for (let c = 0; c < grid.count; c++) if (grid.i[c] === i && grid.j[c] === j) { inGrid = true; break; }
        expect(inGrid, `grid cell (${i}, ${j})`).toBe(want);
        if (want) inside++;
        checked++;
      }
    }
    expect(checked).toBeGreaterThan(10);
    expect(inside).toBeGreaterThan(0);
    const samples = region.sampleBoundary(256);
    expect(samples.xM.length).toBe(256);
    expect(samples.xM.every(Number.isFinite) && samples.normalX.every(Number.isFinite)).toBe(true);
  });
});

describe("polygon boundary samples", () => {
  it("small polygons keep two or more samples per edge; large ones get the requested count", () => {
    const square = makeRegion({ shape: "polygon", pointsM: [[0, 0], [1, 0], [1, 1], [0, 1]] });
    expect(square.sampleBoundary(256).xM.length).toBe(256);
    const tri = makeRegion({ shape: "polygon", pointsM: [[0, 0], [1, 0], [0, 1e-6]] });
    expect(tri.sampleBoundary(8).xM.length).toBeGreaterThanOrEqual(6);
    const ring: [number, number][] = [];
    for (let k = 0; k < 1000; k++) ring.push([Math.cos((2 * Math.PI * k) / 1000), Math.sin((2 * Math.PI * k) / 1000)]);
    const big = makeRegion({ shape: "polygon", pointsM: ring }).sampleBoundary(256);
    expect(big.xM.length).toBe(256);
    for (let s = 0; s < 256; s++) {
      // on the ring (inset 1e-9 of the size) with a unit outward normal
      expect(Math.abs(Math.hypot(big.xM[s], big.yM[s]) - 1)).toBeLessThan(1e-4);
      expect(Math.abs(Math.hypot(big.normalX[s], big.normalY[s]) - 1)).toBeLessThan(1e-12);
      expect(big.xM[s] * big.normalX[s] + big.yM[s] * big.normalY[s]).toBeGreaterThan(0.99);
    }
  });
});
