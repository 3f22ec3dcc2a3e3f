import { describe, it, expect } from "vitest";
import fc from "fast-check";
import { makeTransform } from "../../src/field/transforms/registry.js";
import type { Transform } from "../../src/field/transforms/transform.js";
import type { TransformSpec } from "../../src/field/transformSpec.js";
import { rowRuns } from "../../src/field/rowRuns.js";
import { buildDeviceGrid } from "../../src/field/buildDeviceGrid.js";

/**
 * A row test by runs (rowRuns.ts) must give exactly the point test's answers — the grid, and so
 * every output, depends on it. Checked by identity: containsRow against contains at every lattice
 * point, on random and on deliberately awkward rows (through the centre, tangent to a circle,
 * along an edge, on a boundary to the last bit).
 */

/** First lattice point where the row test and the point test differ, or null. */
function firstMismatch(t: Transform, y: number, x0: number, pitch: number, n: number): string | null {
  const out = new Uint8Array(n).fill(7);
  t.containsRow!(out, y, 0, x0, pitch);
  for (let i = 0; i < n; i++) {
    const x = x0 + i * pitch;
    const want = t.contains(x, y, 0) ? 1 : 0;
    if (out[i] !== want) return `${t.kind}: y = ${y}, x = ${x} (i = ${i}): row ${out[i]}, point ${want}`;
  }
  return null;
}

/** Rows worth trying for a device about (cx, cy) with these radii: random and awkward ones. */
function awkwardRows(cy: number, radii: number[], extra: number[]): number[] {
  const ys = [cy, cy + Number.EPSILON * Math.abs(cy), cy - 1e-300, ...extra];
  for (const r of radii) {
    for (const s of [1, -1]) {
      const y = cy + s * r;
      ys.push(y, y * (1 + 2 ** -52), y * (1 - 2 ** -52), y + s * 1e-12 * r, y - s * 1e-12 * r, cy + s * r * Math.SQRT1_2);
    }
  }
  return ys;
}

const SPECS = (cx: number, cy: number, a: number, b: number, angleRad: number): TransformSpec[] => [
  { kind: "radial-cloak", innerRadiusM: a, outerRadiusM: b, profile: "linear", center: [cx, cy] },
  { kind: "rotator", innerRadiusM: a, outerRadiusM: b, angleRad, center: [cx, cy] },
  { kind: "concentrator", innerRadiusM: a, compressedRadiusM: (a + b) / 2, outerRadiusM: b, center: [cx, cy] },
  { kind: "beam-bend", innerRadiusM: a, outerRadiusM: b, angleRad, referenceRadiusM: b, center: [cx, cy] },
];

describe("row tests by runs (containsRow) agree with the point test", () => {
  it("on random devices, pitches and rows (property)", () => {
    fc.assert(
      fc.property(
        fc.double({ min: -0.2, max: 0.2, noNaN: true }), fc.double({ min: -0.2, max: 0.2, noNaN: true }),
        fc.double({ min: 1e-3, max: 0.05, noNaN: true }), fc.double({ min: 1.05, max: 4, noNaN: true }),
        fc.constantFrom(Math.PI / 6, Math.PI / 2, Math.PI, (3 * Math.PI) / 2, 2 * Math.PI, 1.234),
        fc.double({ min: 1e-4, max: 0.2, noNaN: true }), fc.double({ min: 0, max: 1, noNaN: true }), fc.double({ min: -1.2, max: 1.2, noNaN: true }),
        (cx, cy, a, ratio, angle, pitchRel, phase, rowRel) => {
          const b = a * ratio, pitch = pitchRel * b;
          for (const spec of SPECS(cx, cy, a, b, angle)) {
            const t = makeTransform(spec);
            const x0 = t.bounds.minX - (1 + phase) * pitch;
            const n = Math.ceil((t.bounds.maxX - x0) / pitch) + 2;
            for (const y of [cy + rowRel * b, ...awkwardRows(cy, [a, b, (a + b) / 2], [])]) {
              expect(firstMismatch(t, y, x0, pitch, n)).toBeNull();
            }
          }
        },
      ),
      { seed: 7, numRuns: 300 },
    );
  });

  it("on lattices whose points fall on the boundaries exactly (integer radii and pitch 1)", () => {
    // radii 3 and 5 about (0, 0) with unit pitch: the points (±3, 0), (0, ±5), (3, 4), (4, 3)… lie on the circles
    for (const spec of SPECS(0, 0, 3, 5, Math.PI / 2).concat(SPECS(0, 0, 3, 5, Math.PI))) {
      const t = makeTransform(spec);
      for (let y = -6; y <= 6; y++) expect(firstMismatch(t, y, -7, 1, 15)).toBeNull();
      for (let y = -6; y <= 6; y += 0.5) expect(firstMismatch(t, y, -7.25, 0.25, 60)).toBeNull();
    }
  });

  it("gives the same device grid as the point test for the demo-sized bend and cloak", () => {
    for (const spec of [SPECS(0, 0, 0.06, 0.08, Math.PI / 2)[3], SPECS(0.01, -0.02, 0.02, 0.05, 0)[0]]) {
      const t = makeTransform(spec);
      const req = { pitchM: 3e-4, dimension: 2 as const, where: "test" };
      const byRow = buildDeviceGrid(t.bounds, t.contains, req, t.containsRow);
      const byPoint = buildDeviceGrid(t.bounds, t.contains, req);
      expect(byRow.count).toBeGreaterThan(1000);
      expect(byRow.count).toBe(byPoint.count);
      expect(Buffer.from(byRow.i.buffer, byRow.i.byteOffset, byRow.i.byteLength).equals(Buffer.from(byPoint.i.buffer, byPoint.i.byteOffset, byPoint.i.byteLength))).toBe(true);
      expect(Buffer.from(byRow.j.buffer, byRow.j.byteOffset, byRow.j.byteLength).equals(Buffer.from(byPoint.j.buffer, byPoint.j.byteOffset, byPoint.j.byteLength))).toBe(true);
    }
  });
});

describe("rowRuns", () => {
  it("tests every point of a zone and one point per run between zones", () => {
    const runs = rowRuns(4);
    const calls: number[] = [];
    const out = new Uint8Array(100);
    runs.reset();
    runs.zone(20.2, 20.4); // a boundary between points 20 and 21
    runs.fill(out, 0, 1, 0, 0, (x) => { calls.push(x); return x > 20.3; });
    expect([...out].map((v, i) => (v === 1 ? i : -1)).filter((i) => i >= 0)).toEqual(Array.from({ length: 79 }, (_, k) => 21 + k));
    // runs [0, 18] and [23, 99] take one test each; the zone 19…22 (one point wider each side) is tested point by point
    expect(calls).toEqual([0, 19, 20, 21, 22, 23]);
  });

  it("tests the whole row when told to, when a zone is doubtful (NaN) or when there are too many zones", () => {
    const out = new Uint8Array(10);
    for (const setUp of [(r: ReturnType<typeof rowRuns>) => r.whole(), (r: ReturnType<typeof rowRuns>) => r.zone(NaN, 1), (r: ReturnType<typeof rowRuns>) => { for (let k = 0; k < 3; k++) r.zone(k, k); }]) {
      const runs = rowRuns(2);
      runs.reset();
      setUp(runs);
      let calls = 0;
      runs.fill(out, 0, 1, 0, 0, () => { calls++; return true; });
      expect(calls).toBe(10);
      expect(out.every((v) => v === 1)).toBe(true);
    }
  });

  it("makes a row along a straight edge a zone whole, and a row across it one short zone", () => {
    const runs = rowRuns(4);
    runs.reset();
    runs.line(0, 0, 0, 1e-9);
    let calls = 0;
    runs.fill(new Uint8Array(50), -25, 1, 0, 0, () => { calls++; return false; });
    expect(calls).toBe(50);
    runs.reset();
    runs.line(0, 10, Math.PI / 4, 1e-9); // crosses y = 10 at x = 10
    const seen: number[] = [];
    runs.fill(new Uint8Array(50), -25, 1, 10, 0, (x) => { seen.push(x); return x >= 10; });
    expect(seen).toEqual([-25, 8, 9, 10, 11, 12, 13]); // runs, then the zone x = 10 widened by a point each side, then a run
  });
});
