import { describe, expect, it } from "vitest";
import { ProgrammerError } from "../../src/core/errors.js";
import { frontWork, gridFactorCost, gridOrdering, LEAF_NODES } from "../../src/numerics/gridNestedDissection.js";

describe("nested-dissection ordering of a grid", () => {
  it("is a permutation; every front's pivots are contiguous and its boundary is eliminated later", () => {
    for (const [nx, ny] of [[1, 1], [1, 9], [9, 1], [4, 4], [5, 17], [33, 20]]) {
      const o = gridOrdering(nx, ny);
      const seen = new Uint8Array(o.n);
      for (let q = 0; q < o.n; q++) { expect(o.iperm[o.perm[q]]).toBe(q); seen[o.perm[q]]++; }
      expect(seen.every((x) => x === 1)).toBe(true);
      let next = 0;
      for (let f = 0; f < o.fronts; f++) {
        expect(o.sepStart[f]).toBe(next);
        next += o.sepSize[f];
        for (let t = o.boundPtr[f]; t < o.boundPtr[f + 1]; t++) {
          expect(o.bound[t]).toBeGreaterThanOrEqual(next);
          if (t > o.boundPtr[f]) expect(o.bound[t]).toBeGreaterThan(o.bound[t - 1]);
        }
      }
      expect(next).toBe(o.n);
      expect(o.boundSize[o.fronts - 1]).toBe(0); // the root has no boundary
    }
  });

  it("every nine-point coupling of a pivot lands inside its front (the structure the numeric phase relies on)", () => {
    const nx = 23, ny = 14, o = gridOrdering(nx, ny);
    const frontOf = new Int32Array(o.n);
    for (let f = 0; f < o.fronts; f++) for (let k = 0; k < o.sepSize[f]; k++) frontOf[o.sepStart[f] + k] = f;
    for (let v = 0; v < o.n; v++) {
      const q = o.iperm[v], f = frontOf[q], i = v % nx, j = (v - i) / nx;
      const members = new Set<number>();
      for (let k = 0; k < o.sepSize[f]; k++) members.add(o.sepStart[f] + k);
      for (let t = o.boundPtr[f]; t < o.boundPtr[f + 1]; t++) members.add(o.bound[t]);
      for (let dj = -1; dj <= 1; dj++) for (let di = -1; di <= 1; di++) {
        const a = i + di, b = j + dj;
        if (a < 0 || b < 0 || a >= nx || b >= ny) continue;
        const qu = o.iperm[a + nx * b];
        if (qu >= q) expect(members.has(qu), `node ${v} → ${a + nx * b}`).toBe(true);
      }
    }
  });

  it("the cost estimated before allocating equals the symbolic phase of the ordering", () => {
    for (const [nx, ny] of [[1, 1], [7, 3], [40, 25], [101, 64]]) {
      expect(gridFactorCost(nx, ny)).toEqual(gridOrdering(nx, ny).cost);
    }
  });

  it("a leaf is one dense front: an n ≤ LEAF_NODES grid costs what dense LDLᵀ costs (n³/6 + O(n²))", () => {
    const c = gridFactorCost(4, 4);
    expect(LEAF_NODES).toBeGreaterThanOrEqual(16);
    expect(c.fronts).toBe(1);
    expect(c.factorEntries).toBe((16 * 17) / 2);
    expect(c.work).toBe(frontWork(16, 16));
    // Σ_k [(m) + m(m+1)/2], m = 15 … 0: an identity
    let w = 0;
    for (let m = 0; m < 16; m++) w += m + (m * (m + 1)) / 2;
    expect(c.work).toBe(w);
  });

  it("fill grows like n log n and work like n^1.5 on a ladder of square grids (George 1973: fill ≈ (31/4) n log₂ n, work ≈ (829/84) n^1.5 for nested dissection of a k × k grid)", () => {
    const sizes = [25, 50, 100, 200, 400, 800];
    const costs = sizes.map((s) => gridFactorCost(s, s));
    for (let k = 0; k < sizes.length; k++) {
      const n = sizes[k] ** 2;
      // measured 2.4 … 3.0 and 9.8 … 11.4: within George's leading constants (31/4; 829/84 plus 20 % for the nine-point ring)
      expect(costs[k].factorEntries / (n * Math.log2(n))).toBeLessThan(31 / 4);
      expect(costs[k].work / n ** 1.5).toBeLessThan((829 / 84) * 1.2);
      if (k === 0) continue;
      const m = sizes[k - 1] ** 2;
      // doubling the side: n → 4n; fill must not grow faster than 4·log(4n)/log(n) (+10 %; measured +3 … +7 %, a lower-order n term fading), work not faster than 8 (+5 %)
      expect(costs[k].factorEntries / costs[k - 1].factorEntries).toBeLessThan(4 * (Math.log(n) / Math.log(m)) * 1.1);
      expect(costs[k].work / costs[k - 1].work).toBeLessThan(8 * 1.05);
    }
    // and far below a band solver's n·w²/2 on the same 400 × 400 grid (measured 20 times less work)
    expect(costs[4].work).toBeLessThan((400 * 400 * 401 * 401) / 2 / 10);
  });

  it("refuses sizes that are not positive integers", () => {
    expect(() => gridOrdering(0, 4)).toThrow(ProgrammerError);
    expect(() => gridFactorCost(3.5, 4)).toThrow(ProgrammerError);
    expect(() => gridFactorCost(Number.NaN, 4)).toThrow(ProgrammerError);
  });
});
