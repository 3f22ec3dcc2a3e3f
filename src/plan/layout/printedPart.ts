/**
 * The printed part of a plan, pure: the closed triangle surface of the material a 3D printer lays
 * down, cell by cell, in metres (the STL writer, src/io/layout/stlWriter.ts, turns it into a binary
 * STL in millimetres). The device is invariant along z; the part stands on z = 0 and is `heightM`
 * high: cubic-lattice recipes (struts, spheres, cubes) are stacked in whole cells (the height is
 * rounded to a whole number of pitches, said in the notes), 2D recipes (rods and holes along z) are
 * one prism of the full height.
 *
 * Shapes (the printed phase is the one that is not a gas; a non-gas second phase is a filler poured
 * or foamed around the part afterwards and is not in the STL — said in the notes):
 * - strut lattice: the cubic lattice of square struts drawn with its node at the cell centre (three
 *   bars of width w through the centre, each reaching the cell faces) — the same periodic lattice
 *   as struts along the cube edges shifted by half a pitch, so every cell holds exactly its own
 *   solid fraction 3(w/a)² − 2(w/a)³ and neighbouring cells meet face to face;
 * - spheres or cubes of the printed material in a gas host: closed bodies inside their cell (they
 *   do not touch: the part is many loose bodies, said in the notes); gas spheres or cubes in a
 *   printed host: a solid cell with a closed void;
 * - rods of the printed material along z in a gas host: a prism per cell; gas rods (holes) along z
 *   in a printed host: the cell's square minus the hole. On a hexagonal lattice the rods and holes
 *   stand on the plan's built hexagonal sites (planHexSites.ts: the sites of the 2D layouts and of
 *   the drawn full-wave case), so they cross cell edges: a rod is a prism per site; the cells of
 *   hexagonal holes join, per 4-connected group, into one slab whose top and bottom faces are
 *   triangulated with the holes cut out (slabFace.ts) and whose holes' walls are drawn per site.
 *   Rect-lattice rods and holes (aspect m/n) are m × n per cell, placed as in the 2D layouts
 *   (layoutShapes.ts: lattice axes snapped to the grid), drawn the same way;
 * - a solid recipe of the printed material: the whole cell.
 * Other recipes (laminates, rods lying in the plane, split rings, wires) are not drawn (listed with
 * the reason).
 *
 * Watertight by construction: cells meet on shared faces, where each side offers a centred
 * rectangle (a strut's cross-section, a whole face, or nothing); what is drawn on the face is the
 * difference of the two (nothing when equal, a frame of four trapezoids when one holds the other),
 * using only the rectangles' corners, so every edge is shared by exactly two triangles. Shared
 * coordinates are computed by one formula from integer cell indices (bit-identical from either
 * side), and dimensions are rounded to a quantum q = max(1 nm, 10⁻⁶ × the largest coordinate) so
 * that distinct coordinates stay distinct in the STL's 32-bit floats. Cells that would touch only
 * along an edge (solid cells on a diagonal) would make a non-manifold part: the part is refused
 * with the cells named.
 *
 * Tessellation (stated, chosen from the process's resolution): circles are regular N-gons and
 * spheres geodesic icospheres, each enlarged to the area or volume of the true shape (so every
 * cell's solid fraction is the recipe's), with the smallest N in 16…64 (icosphere subdivision 1…3)
 * whose largest deviation from the true surface is at most a quarter of the process's smallest
 * feature: finer facets than the printer resolves add bytes and nothing else.
 *
 * Why not a CSG library (@jscad/modeling, manifold-3d): the cells meet exactly on shared faces, so
 * no boolean is needed; a general union of 10⁴–10⁵ solids would be slow and hold the whole mesh as
 * objects (hundreds of bytes a triangle), where this streams cell by cell with no per-triangle
 * allocation.
 */
import type { Plan, Recipe } from "../planTypes.js";
import { HEX_ROW } from "./hexSites.js";
import { rectTiling } from "../../cells/lattice.js";
import { rectCellCounts, rectSiteM } from "./rectSites.js";
import { droppedSitesNote, planHexSites } from "./planHexSites.js";
import { slabFace, type FaceMesh } from "./slabFace.js";

export type PrintedShape =
  | { kind: "cross"; e: number }
  | { kind: "sphere"; r: number; void: boolean }
  | { kind: "cube"; s: number; void: boolean }
  /** `hex`: on the plan's hexagonal sites; `tile`: a rect lattice's m × n per cell (m along principal axis 1); else at the cell centre */
  | { kind: "rod"; r: number; hole: boolean; hex?: boolean; tile?: { m: number; n: number } }
  | { kind: "block" };

/** A triangle sink: three vertices (metres), counter-clockwise seen from outside. */
export type TriangleSink = (ax: number, ay: number, az: number, bx: number, by: number, bz: number, cx: number, cy: number, cz: number) => void;

export interface PrintedLevel {
  level: number;
  what: string;
  /** printed volume over cell volume, as drawn (equal-area / equal-volume facets: the recipe's) */
  volumeFraction: number;
}

export interface PrintedPart {
  /** null when the part can be drawn; otherwise why not (nothing is written) */
  refused: string | null;
  heightM: number;
  layers: number;
  layerM: number;
  pitchM: number;
  levels: PrintedLevel[];
  notDrawn: { level: number; reason: string }[];
  notes: string[];
  circleVertices: number;
  sphereSubdivision: number;
  /** triangles of each device cell (its shape, its +x/+y faces, its outer faces) */
  cellTriangles: Float64Array;
  triangles: number;
  /** emit the triangles of device cells [from, to) */
  emit(from: number, to: number, sink: TriangleSink): void;
}

const GASES = new Set(["air", "vacuum"]);
const CIRCLE_STEPS = [16, 24, 32, 48, 64];

/** Icosphere of `level` subdivisions on the unit sphere: vertex coordinates and triangles (outward). */
function icosphere(level: number): { v: Float64Array; t: Int32Array } {
  const p = (1 + Math.sqrt(5)) / 2;
  const verts: number[][] = [[-1, p, 0], [1, p, 0], [-1, -p, 0], [1, -p, 0], [0, -1, p], [0, 1, p], [0, -1, -p], [0, 1, -p], [p, 0, -1], [p, 0, 1], [-p, 0, -1], [-p, 0, 1]];
  let faces: number[][] = [[0, 11, 5], [0, 5, 1], [0, 1, 7], [0, 7, 10], [0, 10, 11], [1, 5, 9], [5, 11, 4], [11, 10, 2], [10, 7, 6], [7, 1, 8], [3, 9, 4], [3, 4, 2], [3, 2, 6], [3, 6, 8], [3, 8, 9], [4, 9, 5], [2, 4, 11], [6, 2, 10], [8, 6, 7], [9, 8, 1]];
  const norm = (x: number[]): number[] => { const l = Math.hypot(x[0], x[1], x[2]); return [x[0] / l, x[1] / l, x[2] / l]; };
  let vs = verts.map(norm);
  for (let s = 0; s < level; s++) {
    const mid = new Map<string, number>();
    const m = (a: number, b: number): number => {
      const key = a < b ? `${a},${b}` : `${b},${a}`;
      let k = mid.get(key);
      if (k === undefined) { k = vs.length; vs.push(norm([(vs[a][0] + vs[b][0]) / 2, (vs[a][1] + vs[b][1]) / 2, (vs[a][2] + vs[b][2]) / 2])); mid.set(key, k); }
      return k;
    };
    const next: number[][] = [];
    for (const [a, b, c] of faces) { const ab = m(a, b), bc = m(b, c), ca = m(c, a); next.push([a, ab, ca], [b, bc, ab], [c, ca, bc], [ab, bc, ca]); }
    faces = next;
  }
  vs = vs.slice();
  return { v: Float64Array.from(vs.flat()), t: Int32Array.from(faces.flat()) };
}

interface SphereMesh { v: Float64Array; t: Int32Array; scale: number; deviation: number }

/** Unit icosphere scaled to the unit ball's volume; `deviation`: largest |radius − 1| over vertices and face centres. */
function sphereMesh(level: number): SphereMesh {
  const { v, t } = icosphere(level);
  let vol = 0;
  let minFace = 1;
  for (let f = 0; f < t.length; f += 3) {
    const a = 3 * t[f], b = 3 * t[f + 1], c = 3 * t[f + 2];
    vol += (v[a] * (v[b + 1] * v[c + 2] - v[b + 2] * v[c + 1]) - v[a + 1] * (v[b] * v[c + 2] - v[b + 2] * v[c]) + v[a + 2] * (v[b] * v[c + 1] - v[b + 1] * v[c])) / 6;
    const cx = (v[a] + v[b] + v[c]) / 3, cy = (v[a + 1] + v[b + 1] + v[c + 1]) / 3, cz = (v[a + 2] + v[b + 2] + v[c + 2]) / 3;
    minFace = Math.min(minFace, Math.hypot(cx, cy, cz));
  }
  const scale = Math.cbrt(((4 / 3) * Math.PI) / vol);
  return { v, t, scale, deviation: Math.max(scale - 1, 1 - scale * minFace) };
}

const SPHERES = [1, 2, 3].map(sphereMesh);

/** Circumradius of the regular N-gon with the area of a circle of radius r. */
export function equalAreaRadius(r: number, n: number): number {
  return r * Math.sqrt((2 * Math.PI) / (n * Math.sin((2 * Math.PI) / n)));
}

/** How one level's recipe is printed in a cell, or why it is not. */
function printedShape(r: Recipe, a: number): { shape: PrintedShape | null; what: string; fraction: number; reason?: string; filler?: string } {
  const hostGas = GASES.has(r.host), incGas = r.inclusion === "" || GASES.has(r.inclusion);
  const dim = (k: string): number => r.dimensions[k];
  if (r.family === "solid") {
    if (hostGas) return { shape: null, what: r.host, fraction: 0, reason: `solid ${r.host}: an empty cell, nothing to print` };
    return { shape: { kind: "block" }, what: `solid ${r.host}`, fraction: 1 };
  }
  const filler = !hostGas && !incGas ? r.host : undefined;
  if (r.family === "strut-lattice" && Number.isFinite(dim("width_m")) && !incGas) {
    const x = dim("width_m") / a;
    return { shape: { kind: "cross", e: dim("width_m") / 2 }, what: `${r.inclusion} struts`, fraction: 3 * x * x - 2 * x * x * x, filler };
  }
  if ((r.family === "spheres-in-host" || r.family === "cubes-in-host") && (incGas !== hostGas || filler)) {
    const isVoid = incGas;
    const f = r.fillFraction;
    const shape: PrintedShape = r.family === "spheres-in-host" ? { kind: "sphere", r: dim("radius_m"), void: isVoid } : { kind: "cube", s: dim("side_m"), void: isVoid };
    const body = r.family === "spheres-in-host" ? "spheres" : "cubes";
    return { shape, what: isVoid ? `${r.host} with ${r.inclusion} ${body}` : `${r.inclusion} ${body}`, fraction: isVoid ? 1 - f : f, filler };
  }
  if ((r.family === "rods-in-host" || r.family === "holes-in-slab") && Number.isFinite(dim("radius_m"))) {
    if (r.orientation !== "z") return { shape: null, what: r.family, fraction: 0, reason: `${r.family} lying in the plane (along ${r.orientation}): not drawn as a printed part yet` };
    const tile = r.lattice === "rect" ? (r.aspect !== undefined ? rectTiling(r.aspect) : null) : undefined;
    if (tile === null) return { shape: null, what: r.family, fraction: 0, reason: `rect-lattice recipe without a tiling aspect (${r.aspect})` };
    const hole = r.family === "holes-in-slab" || incGas;
    if (hole && hostGas) return { shape: null, what: r.family, fraction: 0, reason: "gas in gas: nothing to print" };
    // the area of the lattice's cell: a² (square), (√3/2)·a² a site (hexagonal), a²/(m·n) (rect: m × n circles per device cell)
    const hex = r.lattice === "hex";
    const area = (Math.PI * dim("radius_m") ** 2 * (tile ? tile.m * tile.n : 1)) / ((hex ? HEX_ROW : 1) * a * a);
    const lat = hex ? " (hexagonal lattice)" : tile ? ` (rect lattice ${tile.m} × ${tile.n} per cell)` : "";
    return { shape: { kind: "rod", r: dim("radius_m"), hole, ...(hex ? { hex } : {}), ...(tile ? { tile } : {}) }, what: hole ? `${r.host} with holes along z${lat}` : `${r.inclusion} rods along z${lat}`, fraction: hole ? 1 - area : area, filler: hole ? undefined : filler };
  }
  return { shape: null, what: r.family, fraction: 0, reason: `${r.family} cells are not drawn as a printed part (not a printed family, or both phases are gases)` };
}

/** Does the shape cover whole side faces (solid cells)? */
const fullSides = (s: PrintedShape | null): boolean => s !== null && (s.kind === "block" || (s.kind === "sphere" && s.void) || (s.kind === "cube" && s.void) || (s.kind === "rod" && s.hole));

/**
 * The printed part of `plan`, `heightM` high; `resolutionM` is the process's smallest feature
 * (null: none stated, finest tessellation). Counts every triangle (no allocation per triangle).
 */
export function printedPart(plan: Plan, heightM: number, resolutionM: number | null): PrintedPart {
  const g = plan.grid;
  const a = g.pitchM;
  const notes: string[] = [];
  const notDrawn: { level: number; reason: string }[] = [];
  const levels: PrintedLevel[] = [];
  const raw = plan.levels.map((lv) => (lv.recipe ? printedShape(lv.recipe, a) : null));
  const fillers = new Set<string>();
  plan.levels.forEach((lv, l) => {
    const s = raw[l];
    if (!s) notDrawn.push({ level: lv.index, reason: "no recipe" });
    else if (!s.shape) notDrawn.push({ level: lv.index, reason: s.reason ?? "not drawable" });
    else { levels.push({ level: lv.index, what: s.what, volumeFraction: s.fraction }); if (s.filler) fillers.add(s.filler); }
  });
  const empty = (refused: string): PrintedPart => ({ refused, heightM, layers: 0, layerM: 0, pitchM: a, levels, notDrawn, notes, circleVertices: 0, sphereSubdivision: 0, cellTriangles: new Float64Array(0), triangles: 0, emit: () => undefined });
  if (g.dimension !== 2) return empty("the device grid is 3D: printed parts are drawn for 2D devices only");
  if (levels.length === 0) return empty("no level has a printed shape");
  if (fillers.size) notes.push(`the host ${[...fillers].join(", ")} fills around the printed part and is not in the STL`);

  // tessellation from the process's resolution
  let maxR = 0;
  for (const s of raw) if (s?.shape && (s.shape.kind === "rod" || s.shape.kind === "sphere")) maxR = Math.max(maxR, s.shape.r);
  const allowed = resolutionM === null ? 0 : resolutionM / 4;
  const N = CIRCLE_STEPS.find((n) => equalAreaRadius(maxR, n) - maxR * Math.cos(Math.PI / n) <= allowed) ?? 64;
  const sphereLevel = SPHERES.findIndex((m) => m.deviation * maxR <= allowed);
  const sph = SPHERES[sphereLevel < 0 ? SPHERES.length - 1 : sphereLevel];

  const three = raw.some((s) => s?.shape && (s.shape.kind === "cross" || s.shape.kind === "sphere" || s.shape.kind === "cube"));
  const layers = three ? Math.max(1, Math.round(heightM / a)) : 1;
  const layerM = three ? a : heightM;
  if (three && Math.abs(layers * a - heightM) > 1e-9 * heightM) notes.push(`printed height ${layers} cells (${Number((layers * a * 1e3).toPrecision(6))} mm) for the asked ${Number((heightM * 1e3).toPrecision(6))} mm: cubic cells stack in whole pitches`);

  // dimension quantum (see the module comment)
  let maxCoord = layers * layerM;
  for (let c = 0; c < g.count; c++) maxCoord = Math.max(maxCoord, Math.abs(g.originXM + g.i[c] * a) + a, Math.abs(g.originYM + g.j[c] * a) + a);
  const q = Math.max(1e-9, maxCoord * 1e-6);
  const round = (x: number): number => Math.round(x / q) * q;
  const h = a / 2;
  const shapes: (PrintedShape | null)[] = raw.map((s, l) => {
    const sh = s?.shape ?? null;
    if (!sh) return null;
    const bad = (why: string): null => { notDrawn.push({ level: plan.levels[l].index, reason: why }); const k = levels.findIndex((x) => x.level === plan.levels[l].index); if (k >= 0) levels.splice(k, 1); return null; };
    switch (sh.kind) {
      case "block": return sh;
      case "cross": { const e = round(sh.e); if (e <= 0) return bad("struts of zero width"); return e >= h - q ? { kind: "block" } : { kind: "cross", e }; }
      case "sphere": { const R = round(sh.r * sph.scale); if (R <= 0) return sh.void ? { kind: "block" } : bad("spheres of zero size"); return R >= h - q ? bad("spheres touching their neighbours: no watertight part") : { ...sh, r: R }; }
      case "cube": { const s2 = round(sh.s / 2); if (s2 <= 0) return sh.void ? { kind: "block" } : bad("cubes of zero size"); return s2 >= h - q ? (sh.void ? bad("cube voids filling the cell") : { kind: "block" }) : { ...sh, s: s2 }; }
      case "rod": {
        const R = round(equalAreaRadius(sh.r, N));
        if (R <= 0) return sh.hole ? { kind: "block" } : bad("rods of zero size");
        const half = sh.tile ? h / Math.max(sh.tile.m, sh.tile.n) : h; // half the closest spacing
        return R >= half - q ? bad("rods or holes touching their neighbours: no watertight part") : { ...sh, r: R };
      }
    }
  });
  if (levels.length === 0) return empty("no level has a printed shape");
  if (shapes.some((x) => (x?.kind === "sphere" || x?.kind === "cube") && !x.void) || shapes.some((x) => x?.kind === "rod" && !x.hole)) {
    notes.push("spheres, cubes or rods of the printed material stand free in a gas host: the STL holds them as separate bodies, which need a holder or a base to print");
  }

  // lattice lookup
  const nx = g.nx, ny = g.ny;
  const at = new Int32Array(nx * ny).fill(-1);
  for (let c = 0; c < g.count; c++) at[g.j[c] * nx + g.i[c]] = c;
  const shapeAt = (i: number, j: number): PrintedShape | null => {
    if (i < 0 || j < 0 || i >= nx || j >= ny) return null;
    const c = at[j * nx + i];
    if (c < 0) return null;
    const l = plan.level[c];
    return l < 0 ? null : shapes[l];
  };
  // solid cells meeting only along an edge
  for (let c = 0; c < g.count; c++) {
    const i = g.i[c], j = g.j[c];
    if (!fullSides(shapeAt(i, j))) continue;
    for (const dj of [1, -1]) {
      if (fullSides(shapeAt(i + 1, j + dj)) && !fullSides(shapeAt(i + 1, j)) && !fullSides(shapeAt(i, j + dj))) {
        return empty(`cells ${c + 1} and ${at[(j + dj) * nx + i + 1] + 1} are solid and touch only along an edge: the printed part would not be watertight there`);
      }
    }
  }

  const H = layers * layerM;
  const zAt = (k: number): number => k * layerM;
  const xFace = (i: number, side: number): number => g.originXM + (i + side * 0.5) * a;
  const yFace = (j: number, side: number): number => g.originYM + (j + side * 0.5) * a;
  const cosN = new Float64Array(N), sinN = new Float64Array(N);
  for (let k = 0; k < N; k++) { cosN[k] = Math.cos((2 * Math.PI * k) / N); sinN[k] = Math.sin((2 * Math.PI * k) / N); }

  // rods and holes off the cell centre — hexagonal ones on the plan's built sites, rect ones m × n
  // per cell — listed per device cell (site centres in siteX, siteY); the cells of such holes in
  // 4-connected groups, each one slab whose faces are triangulated once (slabFace.ts)
  type SiteRod = { kind: "rod"; r: number; hole: boolean; hex?: boolean; tile?: { m: number; n: number } };
  const onSites = (sh: PrintedShape | null): sh is SiteRod => sh !== null && sh.kind === "rod" && (sh.hex === true || sh.tile !== undefined);
  const hexPlan = shapes.some((sh) => onSites(sh) && sh.hex) ? planHexSites(plan) : null;
  const siteStart = new Int32Array(g.count + 1);
  const siteX: number[] = [], siteY: number[] = [];
  const faceOfCell = new Int32Array(g.count).fill(-1);
  const faces: FaceMesh[] = [];
  let hexBuilt = 0, rectBuilt = 0;
  if (shapes.some(onSites)) {
    const byCell: number[][] = Array.from({ length: g.count }, () => []);
    if (hexPlan) {
      const { sites } = hexPlan;
      for (let k = 0; k < sites.cell.length; k++) { const sh = shapes[plan.level[sites.cell[k]]]; if (onSites(sh) && sh.hex) byCell[sites.cell[k]].push(k); }
    }
    for (let c = 0; c < g.count; c++) {
      siteStart[c] = siteX.length;
      for (const k of byCell[c]) { siteX.push(hexPlan!.sites.xM[k]); siteY.push(hexPlan!.sites.yM[k]); hexBuilt++; }
      const sh = plan.level[c] >= 0 ? shapes[plan.level[c]] : null;
      if (onSites(sh) && sh.tile) {
        // m circles along the lattice's x axis (principal axis 1), n along y, snapped to the grid (rectSites.ts)
        const [mx, my] = rectCellCounts(sh.tile, plan.axisAngleRad[c], new Int32Array(2));
        const X = g.originXM + g.i[c] * a, Y = g.originYM + g.j[c] * a;
        for (let jj = 0; jj < my; jj++) for (let ii = 0; ii < mx; ii++) { siteX.push(rectSiteM(X, ii, mx, a)); siteY.push(rectSiteM(Y, jj, my, a)); rectBuilt++; }
      }
    }
    siteStart[g.count] = siteX.length;
    const holeCell = (c: number): boolean => { const sh = plan.level[c] >= 0 ? shapes[plan.level[c]] : null; return onSites(sh) && sh.hole; };
    const group = new Int32Array(g.count).fill(-1);
    for (let c0 = 0; c0 < g.count; c0++) {
      if (!holeCell(c0) || group[c0] >= 0) continue;
      const id = faces.length, members: number[] = [c0];
      group[c0] = id;
      for (let t = 0; t < members.length; t++) {
        const c = members[t];
        for (const [di, dj] of [[1, 0], [-1, 0], [0, 1], [0, -1]]) {
          const i = g.i[c] + di, j = g.j[c] + dj;
          if (i < 0 || j < 0 || i >= nx || j >= ny) continue;
          const o = at[j * nx + i];
          if (o >= 0 && group[o] < 0 && holeCell(o)) { group[o] = id; members.push(o); }
        }
      }
      const holes: Float64Array[] = [];
      for (const c of members) {
        const R = (shapes[plan.level[c]] as { r: number }).r;
        for (let t = siteStart[c]; t < siteStart[c + 1]; t++) {
          const X = siteX[t], Y = siteY[t];
          const ring = new Float64Array(2 * N);
          for (let m = 0; m < N; m++) { ring[2 * m] = X + R * cosN[m]; ring[2 * m + 1] = Y + R * sinN[m]; }
          holes.push(ring);
        }
      }
      const inGroup = new Set(members.map((c) => g.i[c] + nx * g.j[c]));
      faces.push(slabFace({
        i: Int32Array.from(members.map((c) => g.i[c])),
        j: Int32Array.from(members.map((c) => g.j[c])),
        has: (i, j) => i >= 0 && j >= 0 && i < nx && j < ny && inGroup.has(i + nx * j),
        xEdge: (i) => xFace(i, -1),
        yEdge: (j) => yFace(j, -1),
      }, holes));
      faceOfCell[Math.min(...members)] = id;
    }
    if (hexPlan) notes.push(`hexagonal-lattice rods and holes stand on the plan's built hexagonal sites (${hexBuilt} sites, the sites of the 2D layouts and of the drawn full-wave case)`);
    if (rectBuilt) notes.push(`rect-lattice rods and holes: m × n per cell, as in the 2D layouts (${rectBuilt} in all)`);
    if (faces.length) notes.push(`the cells of these holes form ${faces.length} slab${faces.length === 1 ? "" : "s"} whose faces are triangulated around the holes`);
    const dropped = hexPlan ? droppedSitesNote(hexPlan, plan) : null;
    if (dropped) notes.push(dropped);
  }
  function emitCell(c: number, sink: TriangleSink, kFrom = 0, kTo = layers): void {
    const i = g.i[c], j = g.j[c];
    const s = shapeAt(i, j);
    const X = g.originXM + i * a, Y = g.originYM + j * a;
    const x0 = xFace(i, -1), x1 = xFace(i, 1), y0 = yFace(j, -1), y1 = yFace(j, 1);
    // a triangle oriented so its normal points along (dx, dy, dz)
    const tri = (ax: number, ay: number, az: number, bx: number, by: number, bz: number, cx: number, cy: number, cz: number, dx: number, dy: number, dz: number): void => {
      const ux = bx - ax, uy = by - ay, uz = bz - az, vx = cx - ax, vy = cy - ay, vz = cz - az;
      const d = (uy * vz - uz * vy) * dx + (uz * vx - ux * vz) * dy + (ux * vy - uy * vx) * dz;
      if (d >= 0) sink(ax, ay, az, bx, by, bz, cx, cy, cz);
      else sink(ax, ay, az, cx, cy, cz, bx, by, bz);
    };
    // quad (p0 p1 p2 p3 in order around it)
    const quad = (p: number[], dx: number, dy: number, dz: number): void => {
      tri(p[0], p[1], p[2], p[3], p[4], p[5], p[6], p[7], p[8], dx, dy, dz);
      tri(p[0], p[1], p[2], p[6], p[7], p[8], p[9], p[10], p[11], dx, dy, dz);
    };
    // a point on a face: axis 0 (x = w, u = y, v = z) or 1 (y = w, u = x, v = z) or 2 (z = w, u = x, v = y)
    const pt = (axis: number, w: number, u: number, v: number): number[] => (axis === 0 ? [w, u, v] : axis === 1 ? [u, w, v] : [u, v, w]);
    /** Difference of two centred rectangles on a face: `outer` (half sizes) drawn, minus `inner` (or none). */
    const frame = (axis: number, w: number, _uc: number, _vc: number, ou0: number, ou1: number, ov0: number, ov1: number, inner: [number, number, number, number] | null, dir: number): void => {
      const d = [0, 0, 0];
      d[axis] = dir;
      const P = (u: number, v: number): number[] => pt(axis, w, u, v);
      if (!inner) { quad([...P(ou0, ov0), ...P(ou1, ov0), ...P(ou1, ov1), ...P(ou0, ov1)], d[0], d[1], d[2]); return; }
      const [iu0, iu1, iv0, iv1] = inner;
      const O = [P(ou0, ov0), P(ou1, ov0), P(ou1, ov1), P(ou0, ov1)];
      const I = [P(iu0, iv0), P(iu1, iv0), P(iu1, iv1), P(iu0, iv1)];
      for (let k = 0; k < 4; k++) {
        const k1 = (k + 1) % 4;
        tri(...(O[k] as [number, number, number]), ...(O[k1] as [number, number, number]), ...(I[k1] as [number, number, number]), d[0], d[1], d[2]);
        tri(...(O[k] as [number, number, number]), ...(I[k1] as [number, number, number]), ...(I[k] as [number, number, number]), d[0], d[1], d[2]);
      }
    };
    /** Side patch of a shape on a face: [u0, u1, v0, v1] or null. */
    const patch = (sh: PrintedShape | null, uc: number, u0: number, u1: number, vc: number, v0: number, v1: number): [number, number, number, number] | null => {
      if (!sh) return null;
      if (fullSides(sh)) return [u0, u1, v0, v1];
      if (sh.kind === "cross") return [uc - sh.e, uc + sh.e, vc - sh.e, vc + sh.e];
      return null;
    };
    const same = (p: [number, number, number, number] | null, r: [number, number, number, number] | null): boolean => p === r || (p !== null && r !== null && p[0] === r[0] && p[1] === r[1] && p[2] === r[2] && p[3] === r[3]);
    const contains = (p: [number, number, number, number], r: [number, number, number, number]): boolean => p[0] < r[0] && p[1] > r[1] && p[2] < r[2] && p[3] > r[3];
    /** The face between this cell (on the `side` −1/+1 of the face) and its neighbour `n`. */
    const sideFace = (axis: 0 | 1, side: number, n: PrintedShape | null, k: number): void => {
      const zc = zAt(k) + layerM / 2, z0 = zAt(k), z1 = zAt(k + 1);
      const w = axis === 0 ? (side > 0 ? x1 : x0) : (side > 0 ? y1 : y0);
      const uc = axis === 0 ? Y : X, u0 = axis === 0 ? y0 : x0, u1 = axis === 0 ? y1 : x1;
      const mine = patch(s, uc, u0, u1, zc, z0, z1);
      const theirs = patch(n, uc, u0, u1, zc, z0, z1);
      if (same(mine, theirs)) return;
      if (!theirs) { frame(axis, w, uc, zc, mine![0], mine![1], mine![2], mine![3], null, side); return; }
      if (!mine) { frame(axis, w, uc, zc, theirs[0], theirs[1], theirs[2], theirs[3], null, -side); return; }
      if (contains(mine, theirs)) frame(axis, w, uc, zc, mine[0], mine[1], mine[2], mine[3], theirs, side);
      else if (contains(theirs, mine)) frame(axis, w, uc, zc, theirs[0], theirs[1], theirs[2], theirs[3], mine, -side);
      else throw new Error(`printedPart: face patches of cell ${c + 1} neither equal nor nested`);
    };
    if (!s) {
      // an empty cell still owns its +x/+y faces with a printed neighbour
      for (let k = kFrom; k < kTo; k++) {
        const nxs = shapeAt(i + 1, j), nys = shapeAt(i, j + 1);
        if (nxs) sideFace(0, 1, nxs, k);
        if (nys) sideFace(1, 1, nys, k);
      }
      return;
    }
    for (let k = kFrom; k < kTo; k++) {
      const Z = zAt(k) + layerM / 2, z0 = zAt(k), z1 = zAt(k + 1);
      // shared faces: +x, +y always from this cell; −x, −y when no device cell is there
      sideFace(0, 1, shapeAt(i + 1, j), k);
      sideFace(1, 1, shapeAt(i, j + 1), k);
      if (i === 0 || at[j * nx + i - 1] < 0) sideFace(0, -1, null, k);
      if (j === 0 || at[(j - 1) * nx + i] < 0) sideFace(1, -1, null, k);
      switch (s.kind) {
        case "cross": {
          const e = s.e;
          // six arms, four sides each; arm ends on the cell faces (x0/x1, y0/y1, z0/z1)
          const lo = [X - e, Y - e, Z - e], hi = [X + e, Y + e, Z + e];
          const ends = [[x0, x1], [y0, y1], [z0, z1]];
          for (let ax = 0; ax < 3; ax++) {
            for (const end of [0, 1]) {
              const from = end ? hi[ax] : ends[ax][0], to = end ? ends[ax][1] : lo[ax];
              for (let side = 0; side < 3; side++) {
                if (side === ax) continue;
                const other = 3 - ax - side;
                for (const sgn of [-1, 1]) {
                  const pos = sgn > 0 ? hi[side] : lo[side];
                  const P = (along: number, across: number): number[] => { const p = [0, 0, 0]; p[ax] = along; p[side] = pos; p[other] = across; return p; };
                  const d = [0, 0, 0];
                  d[side] = sgn;
                  quad([...P(from, lo[other]), ...P(to, lo[other]), ...P(to, hi[other]), ...P(from, hi[other])], d[0], d[1], d[2]);
                }
              }
            }
          }
          if (k === 0) frame(2, z0, X, Y, X - e, X + e, Y - e, Y + e, null, -1);
          if (k === layers - 1) frame(2, z1, X, Y, X - e, X + e, Y - e, Y + e, null, 1);
          break;
        }
        case "block":
        case "sphere":
        case "cube": {
          if (s.kind === "block" || s.void) {
            if (k === 0) frame(2, z0, X, Y, x0, x1, y0, y1, null, -1);
            if (k === layers - 1) frame(2, z1, X, Y, x0, x1, y0, y1, null, 1);
          }
          if (s.kind === "sphere") {
            const out = s.void ? -1 : 1;
            const R = s.r; // the vertex radius (scaled to the sphere's volume)
            for (let f = 0; f < sph.t.length; f += 3) {
              const A = 3 * sph.t[f], B = 3 * sph.t[f + 1], C = 3 * sph.t[f + 2];
              const v = sph.v;
              const ax = X + R * v[A], ay = Y + R * v[A + 1], az = Z + R * v[A + 2];
              const bx = X + R * v[B], by = Y + R * v[B + 1], bz = Z + R * v[B + 2];
              const cx = X + R * v[C], cy = Y + R * v[C + 1], cz = Z + R * v[C + 2];
              tri(ax, ay, az, bx, by, bz, cx, cy, cz, out * (ax + bx + cx - 3 * X), out * (ay + by + cy - 3 * Y), out * (az + bz + cz - 3 * Z));
            }
          } else if (s.kind === "cube") {
            const out = s.void ? -1 : 1, e = s.s;
            const lo = [X - e, Y - e, Z - e], hi = [X + e, Y + e, Z + e];
            for (let ax = 0; ax < 3; ax++) {
              for (const sgn of [-1, 1]) {
                const u = (ax + 1) % 3, v = (ax + 2) % 3;
                const P = (pu: number, pv: number): number[] => { const p = [0, 0, 0]; p[ax] = sgn > 0 ? hi[ax] : lo[ax]; p[u] = pu; p[v] = pv; return p; };
                const d = [0, 0, 0];
                d[ax] = sgn * out;
                quad([...P(lo[u], lo[v]), ...P(hi[u], lo[v]), ...P(hi[u], hi[v]), ...P(lo[u], hi[v])], d[0], d[1], d[2]);
              }
            }
          }
          break;
        }
        case "rod": {
          if (s.hex || s.tile) {
            // the sites standing in this cell: hole walls (facing the hole's axis) or rod prisms
            const R = s.r, out = s.hole ? -1 : 1;
            for (let t = siteStart[c]; t < siteStart[c + 1]; t++) {
              const SX = siteX[t], SY = siteY[t];
              for (let m = 0; m < N; m++) {
                const m1 = (m + 1) % N;
                const ax = SX + R * cosN[m], ay = SY + R * sinN[m], bx = SX + R * cosN[m1], by = SY + R * sinN[m1];
                quad([ax, ay, z0, bx, by, z0, bx, by, z1, ax, ay, z1], out * (cosN[m] + cosN[m1]), out * (sinN[m] + sinN[m1]), 0);
              }
              if (!s.hole) {
                for (const [kk, zz, dz] of [[0, z0, -1], [layers - 1, z1, 1]] as const) {
                  if (k !== kk) continue;
                  for (let m = 1; m < N - 1; m++) tri(SX + R * cosN[0], SY + R * sinN[0], zz, SX + R * cosN[m], SY + R * sinN[m], zz, SX + R * cosN[m + 1], SY + R * sinN[m + 1], zz, 0, 0, dz);
                }
              }
            }
            // the slab's faces, once per group of hole cells (from its first cell)
            const f = faceOfCell[c];
            if (s.hole && f >= 0) {
              const { xy, tri: ft } = faces[f];
              for (const [kk, zz, dz] of [[0, z0, -1], [layers - 1, z1, 1]] as const) {
                if (k !== kk) continue;
                for (let t = 0; t < ft.length; t += 3) {
                  const p = 2 * ft[t], q = 2 * ft[t + 1], u = 2 * ft[t + 2];
                  tri(xy[p], xy[p + 1], zz, xy[q], xy[q + 1], zz, xy[u], xy[u + 1], zz, 0, 0, dz);
                }
              }
            }
            break;
          }
          const R = s.r, out = s.hole ? -1 : 1;
          for (let m = 0; m < N; m++) {
            const m1 = (m + 1) % N;
            const ax = X + R * cosN[m], ay = Y + R * sinN[m], bx = X + R * cosN[m1], by = Y + R * sinN[m1];
            const dx = out * (cosN[m] + cosN[m1]), dy = out * (sinN[m] + sinN[m1]);
            quad([ax, ay, z0, bx, by, z0, bx, by, z1, ax, ay, z1], dx, dy, 0);
          }
          for (const [kk, zz, dz] of [[0, z0, -1], [layers - 1, z1, 1]] as const) {
            if (k !== kk) continue;
            if (!s.hole) {
              for (let m = 1; m < N - 1; m++) tri(X + R * cosN[0], Y + R * sinN[0], zz, X + R * cosN[m], Y + R * sinN[m], zz, X + R * cosN[m + 1], Y + R * sinN[m + 1], zz, 0, 0, dz);
            } else {
              // square minus N-gon (N divisible by 4, vertex 0 on +x): each polygon edge to the corner of its quadrant
              const cx = [x1, x0, x0, x1], cy = [y1, y1, y0, y0];
              const q4 = N / 4;
              for (let m = 0; m < N; m++) {
                const m1 = (m + 1) % N, quadrant = Math.floor(m / q4);
                tri(X + R * cosN[m], Y + R * sinN[m], zz, X + R * cosN[m1], Y + R * sinN[m1], zz, cx[quadrant], cy[quadrant], zz, 0, 0, dz);
              }
              for (let qd = 0; qd < 4; qd++) {
                const m = ((qd + 1) * q4) % N;
                tri(X + R * cosN[m], Y + R * sinN[m], zz, cx[qd], cy[qd], zz, cx[(qd + 1) % 4], cy[(qd + 1) % 4], zz, 0, 0, dz);
              }
            }
          }
          break;
        }
      }
    }
  }

  // counted without emitting every layer: the layers between the bottom and the top are alike
  const cellTriangles = new Float64Array(g.count);
  let total = 0;
  let n = 0;
  const count: TriangleSink = () => { n++; };
  for (let c = 0; c < g.count; c++) {
    n = 0;
    emitCell(c, count, 0, 1);
    if (layers > 1) emitCell(c, count, layers - 1, layers);
    if (layers > 2) { const ends = n; n = 0; emitCell(c, count, 1, 2); n = ends + (layers - 2) * n; }
    cellTriangles[c] = n;
    total += n;
  }
  return {
    refused: null,
    heightM: H,
    layers,
    layerM,
    pitchM: a,
    levels,
    notDrawn,
    notes,
    circleVertices: shapes.some((x) => x?.kind === "rod") ? N : 0,
    sphereSubdivision: shapes.some((x) => x?.kind === "sphere") ? (sphereLevel < 0 ? SPHERES.length : sphereLevel + 1) : 0,
    cellTriangles,
    triangles: total,
    emit(from, to, sink) { for (let c = from; c < to; c++) emitCell(c, sink); },
  };
}
