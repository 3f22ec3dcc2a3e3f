/**
 * slabFace: the face of a slab of whole cells with holes that cross cell edges. Checked by
 * identities, no outside source needed: the triangles cover the face's area exactly (outline −
 * inner loops − holes, shoelace), and they form a closed 2D mesh whose only boundary edges are the
 * outline's unit cell edges (every cell corner a vertex: what the neighbours' faces and the slab's
 * walls meet) and the holes' polygon edges — each interior edge used twice, in opposite directions,
 * once the triangles are oriented counter-clockwise.
 */
import { describe, expect, it } from "vitest";
import { slabFace, type SlabCells } from "../../../src/plan/layout/slabFace.js";
import { expectClose } from "../../helpers/close.js";

function cellsOf(list: [number, number][]): SlabCells {
  const set = new Set(list.map(([i, j]) => `${i},${j}`));
  return { i: Int32Array.from(list.map((c) => c[0])), j: Int32Array.from(list.map((c) => c[1])), has: (i, j) => set.has(`${i},${j}`), xEdge: (i) => (i - 0.5) * 1e-3, yEdge: (j) => (j - 0.5) * 1e-3 };
}

function ngon(cx: number, cy: number, r: number, n: number): Float64Array {
  const out = new Float64Array(2 * n);
  for (let k = 0; k < n; k++) { out[2 * k] = cx + r * Math.cos((2 * Math.PI * k) / n); out[2 * k + 1] = cy + r * Math.sin((2 * Math.PI * k) / n); }
  return out;
}

/** The mesh's boundary (directed edges used once after orienting every triangle counter-clockwise) must be exactly `expected` (either direction). */
function checkMesh(xy: Float64Array, tri: Uint32Array, expectedBoundary: Set<string>): void {
  const key = (p: number, q: number): string => `${xy[2 * p].toFixed(12)},${xy[2 * p + 1].toFixed(12)}>${xy[2 * q].toFixed(12)},${xy[2 * q + 1].toFixed(12)}`;
  const directed = new Map<string, number>();
  for (let t = 0; t < tri.length; t += 3) {
    let [a, b, c] = [tri[t], tri[t + 1], tri[t + 2]];
    const s = (xy[2 * b] - xy[2 * a]) * (xy[2 * c + 1] - xy[2 * a + 1]) - (xy[2 * b + 1] - xy[2 * a + 1]) * (xy[2 * c] - xy[2 * a]);
    expect(s, `triangle ${t / 3} not degenerate`).not.toBe(0);
    if (s < 0) [b, c] = [c, b];
    for (const [p, q] of [[a, b], [b, c], [c, a]]) { const k = key(p, q); directed.set(k, (directed.get(k) ?? 0) + 1); }
  }
  const boundary = new Set<string>();
  for (const [k, n] of directed) {
    expect(n, `edge ${k} used once per direction`).toBe(1);
    const [p, q] = k.split(">");
    if (!directed.has(`${q}>${p}`)) boundary.add([p, q].sort().join("|"));
  }
  expect(boundary).toEqual(expectedBoundary);
}

const pt = (x: number, y: number): string => `${x.toFixed(12)},${y.toFixed(12)}`;
const seg = (x0: number, y0: number, x1: number, y1: number): string => [pt(x0, y0), pt(x1, y1)].sort().join("|");

/** The unit edges of the component's outline (cells' sides with no cell of the component across). */
function outlineEdges(c: SlabCells): Set<string> {
  const out = new Set<string>();
  for (let t = 0; t < c.i.length; t++) {
    const i = c.i[t], j = c.j[t], x0 = c.xEdge(i), x1 = c.xEdge(i + 1), y0 = c.yEdge(j), y1 = c.yEdge(j + 1);
    if (!c.has(i, j - 1)) out.add(seg(x0, y0, x1, y0));
    if (!c.has(i + 1, j)) out.add(seg(x1, y0, x1, y1));
    if (!c.has(i, j + 1)) out.add(seg(x1, y1, x0, y1));
    if (!c.has(i - 1, j)) out.add(seg(x0, y1, x0, y0));
  }
  return out;
}

function ringEdges(h: Float64Array): string[] {
  const n = h.length / 2, out: string[] = [];
  for (let k = 0; k < n; k++) { const q = (k + 1) % n; out.push(seg(h[2 * k], h[2 * k + 1], h[2 * q], h[2 * q + 1])); }
  return out;
}

describe("slabFace", () => {
  it("a 6 × 4 block with holes across cell edges: area exact, every outline corner kept, closed around the holes", () => {
    const list: [number, number][] = [];
    for (let i = 0; i < 6; i++) for (let j = 0; j < 4; j++) list.push([i, j]);
    const c = cellsOf(list);
    // holes of radius 0.3 mm on a hexagonal lattice of 1 mm, centres on cell edges and inside cells
    const holes: Float64Array[] = [];
    for (let m = 0; m < 3; m++) for (let n = 0; n < 5; n++) holes.push(ngon((n + 0.5 + (m % 2) * 0.5) * 1e-3, (0.4 + m * Math.sqrt(3) / 2) * 1e-3, 0.3e-3, 16));
    const f = slabFace(c, holes);
    const holeArea = 0.5 * 16 * (0.3e-3) ** 2 * Math.sin((2 * Math.PI) / 16);
    expectClose(f.areaM2, 24e-6 - holes.length * holeArea, { rel: 1e-12, label: "face area" });
    const expected = outlineEdges(c);
    for (const h of holes) for (const e of ringEdges(h)) expected.add(e);
    checkMesh(f.xy, f.tri, expected);
  });

  it("an L with an inner cell missing and a corner pinch (cells touching at one corner): separate loops, still closed", () => {
    // 4 × 4 minus the inner cell (1, 1) and the cell (2, 2): cells (2, 1) and (1, 2) touch at one corner
    const list: [number, number][] = [];
    for (let i = 0; i < 4; i++) for (let j = 0; j < 4; j++) if (!(i === 1 && j === 1) && !(i === 2 && j === 2)) list.push([i, j]);
    const c = cellsOf(list);
    const holes = [ngon(3e-3, 0.5e-3, 0.3e-3, 16), ngon(0, 2.5e-3, 0.25e-3, 16)];
    const f = slabFace(c, holes);
    const holeArea = (r: number): number => 0.5 * 16 * r * r * Math.sin((2 * Math.PI) / 16);
    expectClose(f.areaM2, 14e-6 - holeArea(0.3e-3) - holeArea(0.25e-3), { rel: 1e-12, label: "face area" });
    const expected = outlineEdges(c);
    for (const h of holes) for (const e of ringEdges(h)) expected.add(e);
    checkMesh(f.xy, f.tri, expected);
  });
});
