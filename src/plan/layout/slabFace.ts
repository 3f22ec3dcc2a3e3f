/**
 * The flat top (or bottom) face of a printed slab made of whole grid cells and pierced by holes that
 * cross cell edges (the holes of a hexagonal-lattice recipe: hexSites.ts), as triangles — for the
 * printed part (printedPart.ts). Pure.
 *
 * The slab is one 4-connected component of cells. Its outline is traced along the cells' edges with
 * a vertex at EVERY cell corner (the neighbouring cells' faces and the slab's side walls meet it
 * there, so the STL stays watertight: no vertex of a neighbour may fall inside one of our edges);
 * where two of its cells touch only at a corner the trace turns left, keeping them apart. The
 * outline (counter-clockwise), the loops around cells of other kinds inside it (clockwise) and the
 * holes' polygons (which must lie strictly inside the component) are triangulated by earcut (npm,
 * ISC: ear clipping with hole bridging, no Steiner points). earcut drops vertices that lie on a
 * straight run of the outline; every triangle edge that spans such vertices is split back at them
 * (a fan from the opposite corner, or from the triangle's centroid when more than one of its edges
 * is split), so each cell corner is a vertex again. The triangulated area is checked against the
 * polygon's (outline − inner loops − holes); a mismatch is a bug.
 *
 * Cost: earcut bridges holes one by one, between linear and O(holes × vertices). Measured (tsx,
 * 2-core machine at load 8, CPU seconds): 2209 holes of 16 vertices in a 48 × 42-cell slab 0.38 s,
 * of 64 vertices 2.3 s; 10 197 holes of 16 vertices in 100 × 90 cells 3.2 s.
 */
import earcut from "earcut";
import { ProgrammerError } from "../../core/errors.js";

export interface FaceMesh {
  /** vertex coordinates x, y (metres): the outline, the inner loops, the holes, then any centroids added */
  xy: Float64Array;
  /** triangles, three vertex indices each (orientation not fixed: the caller orients them) */
  tri: Uint32Array;
  /** the polygon's area (outline − inner loops − holes), m² */
  areaM2: number;
}

export interface SlabCells {
  /** lattice indices (i, j) of the component's cells */
  i: Int32Array;
  j: Int32Array;
  /** is lattice cell (i, j) one of the component's cells */
  has(i: number, j: number): boolean;
  /** x of the left edge of lattice column i, y of the bottom edge of row j (the cells' own formula: shared bit for bit) */
  xEdge(i: number): number;
  yEdge(j: number): number;
}

/** Signed area of a closed ring of n points in xy from `from` (shoelace). */
function ringArea(xy: ArrayLike<number>, from: number, n: number): number {
  let s = 0;
  for (let k = 0; k < n; k++) {
    const p = 2 * (from + k), q = 2 * (from + ((k + 1) % n));
    s += xy[p] * xy[q + 1] - xy[q] * xy[p + 1];
  }
  return s / 2;
}

/** The boundary loops of the component, as corner lists [I, J, I, J, …] (corner (I, J) = bottom-left of cell (I, J)). */
function traceLoops(c: SlabCells): number[][] {
  // directed edges keyed by their start corner; counter-clockwise around each cell, only where the
  // neighbour across is not in the component
  const out = new Map<string, [number, number][]>();
  const add = (i0: number, j0: number, i1: number, j1: number): void => {
    const k = `${i0},${j0}`;
    const list = out.get(k);
    if (list) list.push([i1, j1]);
    else out.set(k, [[i1, j1]]);
  };
  let edges = 0;
  for (let t = 0; t < c.i.length; t++) {
    const i = c.i[t], j = c.j[t];
    if (!c.has(i, j - 1)) { add(i, j, i + 1, j); edges++; }
    if (!c.has(i + 1, j)) { add(i + 1, j, i + 1, j + 1); edges++; }
    if (!c.has(i, j + 1)) { add(i + 1, j + 1, i, j + 1); edges++; }
    if (!c.has(i - 1, j)) { add(i, j + 1, i, j); edges++; }
  }
  const loops: number[][] = [];
  let used = 0;
  for (const [start, list] of out) {
    while (list.length) {
      const [si, sj] = start.split(",").map(Number);
      const loop: number[] = [si, sj];
      let [pi, pj] = [si, sj];
      let [ni, nj] = list.shift()!;
      used++;
      while (!(ni === si && nj === sj)) {
        loop.push(ni, nj);
        const next = out.get(`${ni},${nj}`);
        if (!next || !next.length) throw new ProgrammerError(`slabFace: the outline breaks off at corner (${ni}, ${nj})`);
        let pick = 0;
        if (next.length > 1) {
          // two ways on (cells touching at this corner only): turn left
          const dx = ni - pi, dy = nj - pj;
          pick = next.findIndex(([qi, qj]) => dx * (qj - nj) - dy * (qi - ni) > 0);
          if (pick < 0) pick = 0;
        }
        const [qi, qj] = next.splice(pick, 1)[0];
        used++;
        [pi, pj, ni, nj] = [ni, nj, qi, qj];
      }
      loops.push(loop);
    }
  }
  if (used !== edges) throw new ProgrammerError(`slabFace: traced ${used} of ${edges} outline edges`);
  return loops;
}

/**
 * The face of the component `cells` with the given holes (closed polygons, xy pairs, strictly inside
 * the component, not touching each other). Throws on a bug (an outline that does not close, a
 * triangulation whose area differs from the polygon's).
 */
export function slabFace(cells: SlabCells, holes: readonly Float64Array[]): FaceMesh {
  const loops = traceLoops(cells);
  // the outline first (the one counter-clockwise loop), then the inner loops, then the holes
  const coords: number[] = [];
  const ringStart: number[] = [], ringLen: number[] = [];
  const areas = loops.map((l) => {
    let s = 0;
    for (let k = 0; k < l.length; k += 2) {
      const q = (k + 2) % l.length;
      s += l[k] * l[q + 1] - l[q] * l[k + 1];
    }
    return s;
  });
  const outer = areas.findIndex((s) => s > 0);
  if (outer < 0 || areas.filter((s) => s > 0).length !== 1) throw new ProgrammerError(`slabFace: ${areas.filter((s) => s > 0).length} outer outlines in one component`);
  const order = [outer, ...loops.map((_, k) => k).filter((k) => k !== outer)];
  for (const k of order) {
    ringStart.push(coords.length / 2);
    ringLen.push(loops[k].length / 2);
    for (let t = 0; t < loops[k].length; t += 2) coords.push(cells.xEdge(loops[k][t]), cells.yEdge(loops[k][t + 1]));
  }
  const traced = order.length;
  for (const h of holes) {
    ringStart.push(coords.length / 2);
    ringLen.push(h.length / 2);
    for (let t = 0; t < h.length; t++) coords.push(h[t]);
  }
  let areaM2 = 0;
  for (let r = 0; r < ringStart.length; r++) {
    const s = ringArea(coords, ringStart[r], ringLen[r]);
    areaM2 += r === 0 ? Math.abs(s) : -Math.abs(s);
  }
  const tri = earcut(coords, ringStart.slice(1), 2);

  // Cell corners on a triangle's edge: earcut leaves out the outline vertices on straight runs,
  // and where loops meet along a grid line (a pinch, an inner loop's corner on the outline's line)
  // it may run an edge through a corner another triangle uses. Every traced vertex lying strictly
  // inside a triangle's edge is put back on it. The traced loops run along grid lines only, so
  // the corners are looked up by the line they lie on (coordinates are exact: one formula).
  const nV = coords.length / 2;
  const onX = new Map<number, [number, number][]>(), onY = new Map<number, [number, number][]>(); // x → [y, vertex], y → [x, vertex]
  const seen = new Set<string>();
  for (let v = 0; v < ringStart[traced - 1] + ringLen[traced - 1]; v++) {
    const x = coords[2 * v], y = coords[2 * v + 1], k = `${x},${y}`;
    if (seen.has(k)) continue; // a pinch corner appears in two loops: one index is enough
    seen.add(k);
    (onX.get(x) ?? onX.set(x, []).get(x)!).push([y, v]);
    (onY.get(y) ?? onY.set(y, []).get(y)!).push([x, v]);
  }
  /** Traced vertices strictly inside segment p → q, ordered from p. */
  const inside = (p: number, q: number): number[] | null => {
    const px = coords[2 * p], py = coords[2 * p + 1], qx = coords[2 * q], qy = coords[2 * q + 1];
    let list: [number, number][] | undefined, a: number, b: number;
    if (px === qx) { list = onX.get(px); a = py; b = qy; } else if (py === qy) { list = onY.get(py); a = px; b = qx; } else return null;
    if (!list) return null;
    const lo = Math.min(a, b), hi = Math.max(a, b);
    const hits = list.filter(([t]) => t > lo && t < hi).sort((u, w) => (a < b ? u[0] - w[0] : w[0] - u[0]));
    return hits.length ? hits.map((h) => h[1]) : null;
  };
  const outTri: number[] = [];
  const extra: number[] = [];
  for (let t = 0; t < tri.length; t += 3) {
    const v = [tri[t], tri[t + 1], tri[t + 2]];
    const runs = [0, 1, 2].map((e) => inside(v[e], v[(e + 1) % 3]));
    const split = runs.filter((x) => x !== null).length;
    if (split === 0) { outTri.push(v[0], v[1], v[2]); continue; }
    if (split === 1) {
      const e = runs.findIndex((x) => x !== null);
      const a = v[e], b = v[(e + 1) % 3], c = v[(e + 2) % 3];
      const chain = [a, ...runs[e]!, b];
      for (let k = 0; k + 1 < chain.length; k++) outTri.push(chain[k], chain[k + 1], c);
      continue;
    }
    // several split edges: a fan from the centroid around the triangle's boundary
    const ring: number[] = [];
    for (let e = 0; e < 3; e++) ring.push(v[e], ...(runs[e] ?? []));
    const ci = nV + extra.length / 2;
    extra.push((coords[2 * v[0]] + coords[2 * v[1]] + coords[2 * v[2]]) / 3, (coords[2 * v[0] + 1] + coords[2 * v[1] + 1] + coords[2 * v[2] + 1]) / 3);
    for (let k = 0; k < ring.length; k++) outTri.push(ring[k], ring[(k + 1) % ring.length], ci);
  }
  const xy = Float64Array.from([...coords, ...extra]);
  const out = Uint32Array.from(outTri);
  let got = 0;
  for (let t = 0; t < out.length; t += 3) {
    const a = 2 * out[t], b = 2 * out[t + 1], c = 2 * out[t + 2];
    got += Math.abs((xy[b] - xy[a]) * (xy[c + 1] - xy[a + 1]) - (xy[b + 1] - xy[a + 1]) * (xy[c] - xy[a])) / 2;
  }
  if (Math.abs(got - areaM2) > 1e-9 * Math.abs(ringArea(coords, 0, ringLen[0]))) throw new ProgrammerError(`slabFace: triangulated area ${got} m² differs from the face's ${areaM2} m²`);
  return { xy, tri: out, areaM2 };
}
