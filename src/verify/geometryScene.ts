/**
 * The realized device drawn as its recipes mean it to be built (verify's `realized-geometry` case):
 * every inclusion at its real size and place, in plan view, each point taking the bulk material it
 * lies in. The solver's
 * grid then resolves the inclusions (drawnLadder.ts: 2, 3 and 4.5 steps across the smallest drawn
 * feature), and its sub-pixel averaging (gridCoefficients.ts: arithmetic for the field along
 * an interface, harmonic across it) handles the inclusion boundaries. The scene also tells the grid
 * the exact area of each material in a grid cell's box (`boxParts`, exactBoxParts below, with
 * discRectArea.ts), so the arithmetic mean Ez needs carries no sampling error, and, for a box cut by
 * one disc's boundary alone, that boundary's exact normal (discBoxNormal.ts), so the Kottke average
 * Hz needs carries none either.
 *
 * The 2D solver needs cells that do not vary along z, so only these are drawn:
 * - rods and holes along z (`orientation` z): a disc of the recipe's radius; square-lattice recipes
 *   at their cell centres, hexagonal-lattice ones on the built sites of the hexagonal lattice of
 *   their pitch (src/plan/layout/planHexSites.ts: one site per (√3/2)·a², each with the recipe of
 *   the cell containing it, sites whose share would cross the outline or reach a cell of another
 *   kind left out), rect-lattice ones (aspect b/a = m/n) as m × n discs per cell, spacing p/m along
 *   the lattice's x axis and p/n along y, that axis along the grid axis nearer the cell's principal
 *   axis 1 (src/plan/layout/rectSites.ts: the lattice stands on the grid, as in the layout files;
 *   plan/latticeMisalignment.ts counts the turn), so the drawn area fraction is the recipe's fill
 *   in every case — the very sites the layout files draw. Discs that touch or overlap anywhere are
 *   refused (a safeguard: the sites' edge rule keeps hexagonal discs apart, and a rect disc stays
 *   in its p/mx × p/my share of the cell unless its own recipe's discs meet);
 * - laminates whose layer normal lies in the plane: one layer of thickness `thickness_m` across the
 *   cell, its normal along x or y (the lattice axis nearer the cell's principal axis, as the layout);
 * - solid cells: the cell square of the material.
 * What the polarization sees per point: Ez — b = ε (the field along z, along the rods), T = μ·I;
 * Hz — b = μ, T = ε·I (the field in the plane, across the rods). Bulk materials are isotropic.
 *
 * Refused, with the reason (never drawn wrong): rods, holes or laminates that vary along z (lying in
 * the plane, stacked along z) — the section a 2D solve would extrude is a different structure;
 * spheres and cubes — their section extruded along z is a rod or bar lattice, whose effective medium
 * is the 2D one, not the 3D one the recipe used (Maxwell Garnett for spheres vs cylinders:
 * Sihvola, "Electromagnetic Mixing Formulas and Applications", 1999, ch. 3), so the difference
 * would not be the plan's homogenization error; split rings, wires and printed strut lattices
 * (resonant metal or 3D printed parts); metal inclusions (their skin depth is far below any grid);
 * cells without a recipe are background in both realized cases and need no drawing.
 */
import type { Complex } from "../core/complex.js";
import type { Plan, Recipe } from "../plan/planTypes.js";
import { diskConductor, type Conductor } from "./conductor.js";
import { HEX_ROW, builtSiteAt, nearestHexSite, type HexSites } from "../plan/layout/hexSites.js";
import { droppedSitesNote, planHexSites, type PlanHexSites } from "../plan/layout/planHexSites.js";
import { rectCellCounts, rectSiteM } from "../plan/layout/rectSites.js";
import { rectTiling } from "../cells/lattice.js";
import { gridMisalignmentRad } from "../plan/latticeMisalignment.js";
import type { DeviceGrid } from "../field/deviceGrid.js";
import { deviceBounds, latticeLookup, type HiddenDisk } from "./deviceScene.js";
import { discBoxNormal } from "./discBoxNormal.js";
import { discRectArea } from "./discRectArea.js";
import { BOX_MAX_PARTS, BOX_PART, SAMPLE_BACKGROUND, SAMPLE_MEDIUM, SAMPLE_PEC, S_B, S_TXX, S_TXY, S_TYY, type Scene, type ScenePolarization } from "./scene.js";

/** A bulk material at the design frequency. */
export interface BulkMaterial {
  eps: Complex;
  mu: Complex;
  /** metals are not drawn (skin depth far below the grid) */
  isMetal: boolean;
}

/** How one recipe is drawn in its cell (local coordinates, cell centre at 0). */
export type CellDrawing =
  | { kind: "solid"; material: string }
  | { kind: "disc"; radiusM: number; inside: string; outside: string }
  /** a layer of `inside` of thickness t centred on the cell, normal along x (`normalX`) or y */
  | { kind: "layer"; thicknessM: number; normalX: boolean | null; inside: string; outside: string };

/** The drawing of a recipe, or why it has none. `normalX` of a layer is decided per cell (axis angle). */
export function cellDrawing(r: Recipe): CellDrawing | { reason: string } {
  if (r.family === "solid") return { kind: "solid", material: r.host };
  if (r.family === "rods-in-host" || r.family === "holes-in-slab") {
    const radius = r.dimensions.radius_m;
    if (!(radius > 0)) return { reason: `${r.family} without a radius` };
    if (r.orientation !== "z") return { reason: `${r.family} lying in the plane (along axis ${r.orientation}) varies along z: a 2D (z-invariant) solve cannot draw it` };
    return { kind: "disc", radiusM: radius, inside: r.inclusion || "vacuum", outside: r.host };
  }
  if (r.family === "laminate") {
    const t = r.dimensions.thickness_m;
    if (!(t > 0)) return { reason: "laminate without a layer thickness" };
    if (r.orientation === "z") return { reason: "laminate stacked along z varies along z: a 2D (z-invariant) solve cannot draw it" };
    return { kind: "layer", thicknessM: t, normalX: null, inside: r.inclusion || "vacuum", outside: r.host };
  }
  if (r.family === "spheres-in-host" || r.family === "cubes-in-host") {
    return { reason: `${r.family} are 3D inclusions: their section extruded along z would be a rod lattice with the 2D, not the 3D, effective medium` };
  }
  if (r.family === "split-ring" || r.family === "wire-medium") return { reason: `${r.family} cells are resonant metal structures, far below any grid that fits` };
  if (r.family === "strut-lattice") return { reason: "strut-lattice cells are 3D printed lattices with no z-invariant section" };
  return { reason: `${r.family} has no drawable 2D section` };
}

export interface GeometrySceneInput {
  plan: Pick<Plan, "grid" | "level" | "levels" | "axisAngleRad">;
  /** bulk materials by id at the design frequency (the plan's own values, layer core included) */
  materials: ReadonlyMap<string, BulkMaterial>;
  polarization: ScenePolarization;
  background: { eps: number; mu: number };
  hidden: HiddenDisk | null;
  /** further conductors every case stands on (a carpet's bump) */
  extraConductors?: readonly Conductor[];
}

export type GeometrySceneResult =
  | { ok: true; scene: Scene; smallestFeatureM: number; indexHint: number; notes: string[] }
  | { ok: false; reason: string };

const VACUUM: BulkMaterial = { eps: { re: 1, im: 0 }, mu: { re: 1, im: 0 }, isMetal: false };

/** Per-cell drawing codes of the scene. */
const K_NONE = 0, K_SOLID = 1, K_DISC = 2, K_LAYER = 3, K_HEX_DISC = 4;

interface DiscCentres { x: Float64Array; y: Float64Array; cell: Int32Array; hexCount: number }

/**
 * Centres of every drawn disc: square-lattice discs at their cell centres, rect-lattice ones
 * `cols` × `rows` per cell (rectSites.ts; 1 × 1 for square), hexagonal ones on the built sites
 * (planHexSites.ts).
 */
function discCentres(g: DeviceGrid, hexSites: PlanHexSites | null, kindOf: Uint8Array, cols: Uint8Array, rows: Uint8Array): DiscCentres {
  const hex = hexSites?.sites ?? { xM: new Float64Array(0), yM: new Float64Array(0), cell: new Int32Array(0) };
  const a = g.pitchM;
  let sq = 0;
  for (let c = 0; c < g.count; c++) if (kindOf[c] === K_DISC) sq += cols[c] * rows[c];
  const m = sq + hex.cell.length;
  const out: DiscCentres = { x: new Float64Array(m), y: new Float64Array(m), cell: new Int32Array(m), hexCount: hex.cell.length };
  let k = 0;
  for (let c = 0; c < g.count; c++) {
    if (kindOf[c] !== K_DISC) continue;
    const cx = g.originXM + g.i[c] * a, cy = g.originYM + g.j[c] * a;
    for (let q = 0; q < rows[c]; q++) {
      for (let p = 0; p < cols[c]; p++) {
        out.x[k] = cols[c] === 1 ? g.xM[c] : rectSiteM(cx, p, cols[c], a);
        out.y[k] = rows[c] === 1 ? g.yM[c] : rectSiteM(cy, q, rows[c], a);
        out.cell[k++] = c;
      }
    }
  }
  out.x.set(hex.xM, k); out.y.set(hex.yM, k); out.cell.set(hex.cell, k);
  return out;
}

/**
 * The narrowest wall between two drawn discs (centre distance − r₁ − r₂; ≤ 0 when they touch or
 * overlap), where, and their radii. Discs are bucketed by the pitch-sized square they stand in;
 * radii are below a/2 when the wall is positive, so only neighbours within two buckets can come
 * closer than a pitch. Infinity for fewer than two discs. O(discs).
 */
function narrowestWall(d: DiscCentres, radius: Float64Array, a: number): { value: number; at: [number, number]; radii: number[] } {
  const m = d.cell.length;
  let best = Infinity, at: [number, number] = [0, 0], radii: number[] = [];
  if (m < 2) return { value: best, at, radii };
  let minX = Infinity, minY = Infinity, maxX = -Infinity, maxY = -Infinity;
  for (let k = 0; k < m; k++) { minX = Math.min(minX, d.x[k]); maxX = Math.max(maxX, d.x[k]); minY = Math.min(minY, d.y[k]); maxY = Math.max(maxY, d.y[k]); }
  const bx = Math.floor((maxX - minX) / a) + 1, by = Math.floor((maxY - minY) / a) + 1;
  const head = new Int32Array(bx * by).fill(-1), next = new Int32Array(m);
  const bucket = (k: number): number => Math.floor((d.x[k] - minX) / a) + bx * Math.floor((d.y[k] - minY) / a);
  for (let k = 0; k < m; k++) { const b = bucket(k); next[k] = head[b]; head[b] = k; }
  for (let k = 0; k < m; k++) {
    const ib = Math.floor((d.x[k] - minX) / a), jb = Math.floor((d.y[k] - minY) / a), rk = radius[d.cell[k]];
    for (let q = Math.max(0, jb - 2); q <= Math.min(by - 1, jb + 2); q++) {
      for (let p = Math.max(0, ib - 2); p <= Math.min(bx - 1, ib + 2); p++) {
        for (let o = head[p + bx * q]; o >= 0; o = next[o]) {
          if (o <= k) continue;
          const ro = radius[d.cell[o]];
          const w = Math.hypot(d.x[o] - d.x[k], d.y[o] - d.y[k]) - rk - ro;
          if (w < best) { best = w; at = [(d.x[o] + d.x[k]) / 2, (d.y[o] + d.y[k]) / 2]; radii = [rk, ro]; }
        }
      }
    }
  }
  return { value: best, at, radii };
}

/** "levels 1, 2, 4: why; level 3: why" — one entry per distinct reason. */
function groupByReason(refused: { level: number; reason: string }[]): string {
  const by = new Map<string, number[]>();
  for (const r of refused) by.set(r.reason, [...(by.get(r.reason) ?? []), r.level]);
  return [...by].map(([why, ls]) => `${ls.length > 1 ? "levels" : "level"} ${ls.join(", ")}: ${why}`).join("; ");
}

/** Build the drawn scene (see file comment), or say why the plan cannot be drawn. */
export function geometryScene(input: GeometrySceneInput): GeometrySceneResult {
  const { plan, materials, polarization } = input;
  const g = plan.grid;
  const a = g.pitchM;
  if (g.dimension !== 2) return { ok: false, reason: "the design's cells are 3D" };
  const used = new Uint8Array(plan.levels.length);
  for (let c = 0; c < g.count; c++) if (plan.level[c] >= 0) used[plan.level[c]] = 1;
  const drawings: (CellDrawing | null)[] = [];
  const refused: { level: number; reason: string }[] = [];
  const mat = (id: string): BulkMaterial | undefined => (id === "vacuum" ? materials.get(id) ?? VACUUM : materials.get(id));
  let feature = Infinity, index = 0;
  const hexLevels = new Set<number>();
  /** per level: the rect tiling (m × n circles per cell), or null */
  const tiles: ({ m: number; n: number } | null)[] = plan.levels.map(() => null);
  plan.levels.forEach((lv, l) => {
    const r = lv.recipe;
    if (!used[l] || !r) { drawings.push(null); return; }
    const d = cellDrawing(r);
    if ("reason" in d) { drawings.push(null); refused.push({ level: lv.index, reason: `${d.reason}` }); return; }
    const ids = d.kind === "solid" ? [d.material] : [d.inside, d.outside];
    for (const id of ids) {
      const m = mat(id);
      if (!m) { refused.push({ level: lv.index, reason: `material '${id}' has no value at the design frequency` }); drawings.push(null); return; }
      if (m.isMetal) { refused.push({ level: lv.index, reason: `metal '${id}' (its skin depth is far below any grid that fits)` }); drawings.push(null); return; }
      index = Math.max(index, Math.sqrt(Math.hypot(m.eps.re, m.eps.im) * Math.hypot(m.mu.re, m.mu.im)));
    }
    if (d.kind === "disc") {
      if (r.lattice !== "square" && r.lattice !== "hex" && r.lattice !== "rect") { refused.push({ level: lv.index, reason: `a ${r.lattice} lattice is not drawn (square, hexagonal and rectangular lattices only)` }); drawings.push(null); return; }
      let spacing = a;
      if (r.lattice === "rect") {
        const t = r.aspect !== undefined ? rectTiling(r.aspect) : null;
        if (!t) { refused.push({ level: lv.index, reason: `rect-lattice recipe without a tiling aspect (${r.aspect})` }); drawings.push(null); return; }
        tiles[l] = t;
        spacing = a / Math.max(t.m, t.n); // the shorter of the spacings p/m and p/n
      }
      // the wall to a neighbour of the same level (spacing − 2r) beside the disc's diameter; mixed neighbours below
      feature = Math.min(feature, 2 * d.radiusM, spacing - 2 * d.radiusM);
      if (r.lattice === "hex") hexLevels.add(l);
    } else if (d.kind === "layer") {
      if (d.thicknessM >= a) { refused.push({ level: lv.index, reason: `a layer ${d.thicknessM.toPrecision(3)} m thick fills the ${a.toPrecision(3)} m cell` }); drawings.push(null); return; }
      feature = Math.min(feature, d.thicknessM, a - d.thicknessM);
    }
    drawings.push(d);
  });
  if (drawings.every((d) => d === null) && !refused.length) return { ok: false, reason: "no cell of the plan has a recipe: there is nothing to draw" };
  if (refused.length) return { ok: false, reason: `not every cell can be drawn in 2D — ${groupByReason(refused)}` };
  const lut = latticeLookup(g);
  const n = g.count;
  // per cell: drawing kind code, radius or thickness, normalX, inside and outside material values
  const kindOf = new Uint8Array(n), size = new Float64Array(n), normalX = new Uint8Array(n);
  // discs per cell along grid x and y: 1 × 1 (square lattice), or a rect tiling turned to the cell (rectSites.ts)
  const cols = new Uint8Array(n).fill(1), rows = new Uint8Array(n).fill(1);
  const counts = new Int32Array(2);
  let rectCells = 0, rectDiscs = 0, maxTurn = 0;
  const inside = new Float64Array(4 * n), outside = new Float64Array(4 * n);
  const put = (dst: Float64Array, c: number, m: BulkMaterial): void => { dst[4 * c] = m.eps.re; dst[4 * c + 1] = m.eps.im; dst[4 * c + 2] = m.mu.re; dst[4 * c + 3] = m.mu.im; };
  for (let c = 0; c < n; c++) {
    const l = plan.level[c];
    const d = l >= 0 ? drawings[l] : null;
    if (!d) { kindOf[c] = K_NONE; continue; } // no recipe: background, as in the homogenized realized map
    if (d.kind === "solid") { kindOf[c] = K_SOLID; put(inside, c, mat(d.material)!); continue; }
    put(inside, c, mat(d.inside)!); put(outside, c, mat(d.outside)!);
    if (d.kind === "disc") {
      kindOf[c] = hexLevels.has(l) ? K_HEX_DISC : K_DISC; size[c] = d.radiusM;
      const t = tiles[l];
      if (t) {
        rectCellCounts(t, plan.axisAngleRad[c], counts);
        cols[c] = counts[0]; rows[c] = counts[1];
        rectCells++; rectDiscs += counts[0] * counts[1]; maxTurn = Math.max(maxTurn, gridMisalignmentRad(plan.axisAngleRad[c]));
      }
      continue;
    }
    kindOf[c] = K_LAYER; size[c] = d.thicknessM;
    // the layer normal is the principal axis (2 at axisAngle, 1 across it), snapped to x or y (layoutShapes.ts)
    const r = plan.levels[l].recipe!;
    const th = plan.axisAngleRad[c], nrm = r.orientation === "2" ? th : th + Math.PI / 2;
    normalX[c] = Math.abs(Math.cos(nrm)) >= Math.abs(Math.sin(nrm)) ? 1 : 0;
  }
  // the discs as built: square-lattice recipes at their cell centres, rect ones m × n per cell, hexagonal ones on the built hexagonal sites
  const hexPlan = hexLevels.size ? planHexSites(plan) : null;
  const discs = discCentres(g, hexPlan, kindOf, cols, rows);
  const wall = narrowestWall(discs, size, a);
  if (wall.value <= 0) {
    const [x, y] = wall.at;
    return { ok: false, reason: `discs touch or overlap near (${x.toPrecision(3)} m, ${y.toPrecision(3)} m) (radii ${wall.radii.map((v) => v.toPrecision(3)).join(" and ")} m, pitch ${a.toPrecision(3)} m): the drawn structure would not be the recipes' lattices` };
  }
  feature = Math.min(feature, wall.value);
  if (!Number.isFinite(feature)) feature = a; // solid cells only: the cell is the feature
  // the cells' box, grown to every disc (the grid samples only inside the bounds; a clipped disc
  // would lose a share that changes with the grid step — it did, before hexagonal sites were kept
  // inside the outline, by 4 % of σ in Ez)
  const bounds = deviceBounds(g);
  for (let k = 0; k < discs.cell.length; k++) {
    const r = size[discs.cell[k]];
    bounds.minX = Math.min(bounds.minX, discs.x[k] - r); bounds.maxX = Math.max(bounds.maxX, discs.x[k] + r);
    bounds.minY = Math.min(bounds.minY, discs.y[k] - r); bounds.maxY = Math.max(bounds.maxY, discs.y[k] + r);
  }
  const conductors: Conductor[] = [...(input.extraConductors ?? [])];
  if (input.hidden) {
    const [cx, cy] = input.hidden.centerM, r = input.hidden.radiusM;
    conductors.push(diskConductor(input.hidden.centerM, r));
    bounds.minX = Math.min(bounds.minX, cx - r); bounds.maxX = Math.max(bounds.maxX, cx + r);
    bounds.minY = Math.min(bounds.minY, cy - r); bounds.maxY = Math.max(bounds.maxY, cy + r);
  }
  const ox = g.originXM, oy = g.originYM;
  const ez = polarization === "Ez";
  const anyHex = hexPlan !== null, nm = new Int32Array(2);
  const hexBuilt = hexPlan?.sites;
  let rHexMax = 0;
  for (let c = 0; c < n; c++) if (kindOf[c] === K_HEX_DISC) rHexMax = Math.max(rHexMax, size[c]);
  const boxParts = exactBoxParts({ g, lut, kindOf, size, normalX, cols, rows, inside, outside, conductors, ez, background: input.background, rHexMax, hexBuilt });
  const scene: Scene = {
    polarization,
    background: input.background,
    bounds,
    conductors,
    sample(x, y, out) {
      for (const cd of conductors) if (cd.signedDistanceM(x, y) < 0) return SAMPLE_PEC;
      let c = -1, within = false;
      if (anyHex) {
        // a hexagonal-lattice disc: the nearest site, if it is built and the point is within its radius
        nearestHexSite(g, x, y, nm);
        const k = builtSiteAt(hexBuilt!, nm[0], nm[1]);
        if (k >= 0) {
          const sc = hexBuilt!.cell[k];
          const dx = x - hexBuilt!.xM[k], dy = y - hexBuilt!.yM[k];
          if (dx * dx + dy * dy < size[sc] * size[sc]) { c = sc; within = true; }
        }
      }
      if (c < 0) {
        const i = Math.round((x - ox) / a), j = Math.round((y - oy) / a);
        if (i < 0 || j < 0 || i >= g.nx || j >= g.ny) return SAMPLE_BACKGROUND;
        c = lut[i + g.nx * j];
        if (c < 0 || kindOf[c] === K_NONE) return SAMPLE_BACKGROUND;
        const lx = x - (ox + i * a), ly = y - (oy + j * a);
        const k = kindOf[c];
        if (k === K_DISC) {
          // the nearest of the cell's cols × rows discs (one for a square lattice: the cell centre)
          const mx = cols[c], my = rows[c];
          const dx = mx === 1 ? lx : lx - (rectSiteM(0, Math.min(mx - 1, Math.max(0, Math.floor(((lx + a / 2) * mx) / a))), mx, a));
          const dy = my === 1 ? ly : ly - (rectSiteM(0, Math.min(my - 1, Math.max(0, Math.floor(((ly + a / 2) * my) / a))), my, a));
          within = dx * dx + dy * dy < size[c] * size[c];
        } else within = k === K_SOLID || (k === K_LAYER ? Math.abs(normalX[c] ? lx : ly) < size[c] / 2 : false);
      }
      const src = within ? inside : outside, o = 4 * c;
      // Ez: b = ε, T = μ·I; Hz: b = μ, T = ε·I
      const bRe = ez ? src[o] : src[o + 2], bIm = ez ? src[o + 1] : src[o + 3];
      const tRe = ez ? src[o + 2] : src[o], tIm = ez ? src[o + 3] : src[o + 1];
      out[S_B] = bRe; out[S_B + 1] = bIm;
      out[S_TXX] = tRe; out[S_TXX + 1] = tIm;
      out[S_TYY] = tRe; out[S_TYY + 1] = tIm;
      out[S_TXY] = 0; out[S_TXY + 1] = 0;
      return SAMPLE_MEDIUM;
    },
    boxParts,
  };
  const notes: string[] = [];
  if (hexPlan) {
    let hexCells = 0;
    for (let c = 0; c < n; c++) if (kindOf[c] === K_HEX_DISC) hexCells++;
    notes.push(`realized-geometry: hexagonal-lattice recipes (levels ${[...hexLevels].map((l) => plan.levels[l].index).join(", ")}) are drawn on the hexagonal lattice of their pitch anchored on the grid's centre (${discs.hexCount} sites built where their ${hexCells} cells' area holds ${(hexCells / HEX_ROW).toFixed(1)}), each site with the recipe of the cell containing it — the sites of the layout files`);
    const dropped = droppedSitesNote(hexPlan, plan);
    if (dropped) notes.push(`realized-geometry: ${dropped}`);
  }
  if (rectCells) {
    const rectLevels = plan.levels.flatMap((lv, l) => (tiles[l] && used[l] ? [`${lv.index} (${tiles[l]!.m} × ${tiles[l]!.n})`] : []));
    notes.push(`realized-geometry: rect-lattice recipes (levels ${rectLevels.join(", ")} per cell) are drawn m × n discs per cell with the lattice axes along the grid axes nearer the cells' principal axes, as the layout files draw them: ${rectDiscs} discs in ${rectCells} cells; largest turn from the principal axes ${Number(((maxTurn * 180) / Math.PI).toPrecision(3))}° (the homogenized realized map stands on the same axes)`);
  }
  return { ok: true, scene, smallestFeatureM: feature, indexHint: index, notes };
}

interface BoxPartsInput {
  g: DeviceGrid;
  lut: Int32Array;
  kindOf: Uint8Array;
  size: Float64Array;
  normalX: Uint8Array;
  /** discs per cell along grid x and y (K_DISC cells: 1 × 1 on a square lattice, the rect tiling turned to the cell) */
  cols: Uint8Array;
  rows: Uint8Array;
  inside: Float64Array;
  outside: Float64Array;
  conductors: readonly Conductor[];
  ez: boolean;
  background: { eps: number; mu: number };
  rHexMax: number;
  /** the built hexagonal sites (planHexSites.ts), if any */
  hexBuilt: HexSites | undefined;
}

/** Most hexagonal discs that can reach one box (h ≤ a/8: the nearest site and its neighbours). */
const MAX_BOX_DISCS = 16;

/**
 * Scene.boxParts of the drawn structure: the box cut by the (at most 2 × 2) lattice cells it
 * overlaps, each cell's piece split exactly into its disc (discRectArea.ts), layer or solid and the
 * rest, less the hexagonal discs that reach into it (sample() puts a point inside a hexagonal disc
 * first, whatever cell it lies in); equal materials merged. A box within reach of a conductor is
 * left to point sampling (0), and so is everything when a hexagonal disc is wider than half a pitch
 * (sample() then clips it at the nearest-site boundary, which this exact split does not).
 */
function exactBoxParts(p: BoxPartsInput): ((x: number, y: number, h: number, out: Float64Array, normal?: Float64Array) => number) | undefined {
  const { g, lut, kindOf, size, normalX, cols, rows, inside, outside, conductors, ez, background, rHexMax, hexBuilt } = p;
  const a = g.pitchM, ox = g.originXM, oy = g.originYM;
  const nm = new Int32Array(2);
  if (rHexMax >= a / 2) return undefined;
  const partKind = new Uint8Array(BOX_MAX_PARTS), partMat = new Float64Array(4 * BOX_MAX_PARTS), partArea = new Float64Array(BOX_MAX_PARTS);
  const bg = new Float64Array([background.eps, 0, background.mu, 0]);
  const hx = new Float64Array(MAX_BOX_DISCS), hy = new Float64Array(MAX_BOX_DISCS), hr = new Float64Array(MAX_BOX_DISCS), hc = new Int32Array(MAX_BOX_DISCS);
  let np = 0, overflow = false;
  // the discs whose circle cuts the box: how many, and the first one (centre, radius, area in the
  // box, its inside material: array and offset)
  let nCut = 0, cutX = 0, cutY = 0, cutR = 0, cutArea = 0, cutSrc = inside, cutO = 0;
  const noteDisc = (dx: number, dy: number, r: number, area: number, boxArea: number, src: Float64Array, o: number): void => {
    if (!(area > 1e-12 * boxArea) || !(area < boxArea * (1 - 1e-12))) return; // outside, or covering the box
    if (nCut++ > 0) return;
    cutX = dx; cutY = dy; cutR = r; cutArea = area; cutSrc = src; cutO = o;
  };
  const add = (area: number, kind: number, src: Float64Array, o: number): void => {
    if (!(area > 0)) return;
    for (let k = 0; k < np; k++) {
      if (partKind[k] === kind && partMat[4 * k] === src[o] && partMat[4 * k + 1] === src[o + 1] && partMat[4 * k + 2] === src[o + 2] && partMat[4 * k + 3] === src[o + 3]) { partArea[k] += area; return; }
    }
    if (np === BOX_MAX_PARTS) { overflow = true; return; }
    partKind[np] = kind;
    partMat[4 * np] = src[o]; partMat[4 * np + 1] = src[o + 1]; partMat[4 * np + 2] = src[o + 2]; partMat[4 * np + 3] = src[o + 3];
    partArea[np++] = area;
  };
  const cellAt = (i: number, j: number): number => (i >= 0 && j >= 0 && i < g.nx && j < g.ny ? lut[i + g.nx * j] : -1);
  return (xc: number, yc: number, h: number, out: Float64Array, normal?: Float64Array): number => {
    if (normal) { normal[0] = 0; normal[1] = 0; }
    for (const cd of conductors) if (cd.signedDistanceM(xc, yc) < 0.75 * h) return 0;
    const x0 = xc - h / 2, x1 = xc + h / 2, y0 = yc - h / 2, y1 = yc + h / 2;
    np = 0; overflow = false; nCut = 0;
    // hexagonal discs that reach the box
    let nh = 0;
    if (hexBuilt && rHexMax > 0) {
      // sites within a/√3 + r + h of the box's centre: the nearest one's rows ±1, columns ±2
      nearestHexSite(g, xc, yc, nm);
      for (let m = nm[1] - 1; m <= nm[1] + 1; m++) {
        for (let q = nm[0] - 2; q <= nm[0] + 2; q++) {
          const k = builtSiteAt(hexBuilt, q, m);
          if (k < 0) continue;
          const sx = hexBuilt.xM[k], sy = hexBuilt.yM[k], c = hexBuilt.cell[k], r = size[c];
          const dx = Math.max(x0 - sx, 0, sx - x1), dy = Math.max(y0 - sy, 0, sy - y1);
          if (dx * dx + dy * dy >= r * r) continue;
          if (nh === MAX_BOX_DISCS) return 0;
          if (normal) noteDisc(sx, sy, r, discRectArea(sx, sy, r, x0, x1, y0, y1), h * h, inside, 4 * c);
          hx[nh] = sx; hy[nh] = sy; hr[nh] = r; hc[nh++] = c;
        }
      }
    }
    for (let j = Math.round((y0 - oy) / a); j <= Math.round((y1 - oy) / a); j++) {
      for (let i = Math.round((x0 - ox) / a); i <= Math.round((x1 - ox) / a); i++) {
        const cx = ox + i * a, cy = oy + j * a;
        const rx0 = Math.max(x0, cx - a / 2), rx1 = Math.min(x1, cx + a / 2), ry0 = Math.max(y0, cy - a / 2), ry1 = Math.min(y1, cy + a / 2);
        if (!(rx1 > rx0 && ry1 > ry0)) continue;
        const area = (rx1 - rx0) * (ry1 - ry0);
        let hexArea = 0;
        for (let k = 0; k < nh; k++) {
          const d = discRectArea(hx[k], hy[k], hr[k], rx0, rx1, ry0, ry1);
          add(d, SAMPLE_MEDIUM, inside, 4 * hc[k]);
          hexArea += d;
        }
        const c = cellAt(i, j), kind = c < 0 ? K_NONE : kindOf[c], o = 4 * c;
        if (kind === K_NONE) add(area - hexArea, SAMPLE_BACKGROUND, bg, 0);
        else if (kind === K_SOLID) add(area - hexArea, SAMPLE_MEDIUM, inside, o);
        else if (kind === K_HEX_DISC) add(area - hexArea, SAMPLE_MEDIUM, outside, o);
        else if (kind === K_DISC) {
          // hexagonal and square or rect discs never overlap (narrowestWall), so a hexagonal disc here lies in the rest;
          // the cell's mx × my discs (1 × 1: the cell centre), each within its own sub-cell of the cell, so only those whose sub-cell meets the piece
          const mx = cols[c], my = rows[c], sx = a / mx, sy = a / my, r = size[c];
          const p0 = Math.max(0, Math.floor((rx0 - (cx - a / 2)) / sx)), p1 = Math.min(mx - 1, Math.floor((rx1 - (cx - a / 2)) / sx));
          const q0 = Math.max(0, Math.floor((ry0 - (cy - a / 2)) / sy)), q1 = Math.min(my - 1, Math.floor((ry1 - (cy - a / 2)) / sy));
          let d = 0;
          for (let q = q0; q <= q1; q++) {
            for (let pp = p0; pp <= p1; pp++) {
              const dcx = mx === 1 ? cx : rectSiteM(cx, pp, mx, a), dcy = my === 1 ? cy : rectSiteM(cy, q, my, a);
              const dd = discRectArea(dcx, dcy, r, rx0, rx1, ry0, ry1);
              d += dd;
              // a disc wider than its sub-cell is clipped at the cell's edge (sample()): not a plain circle then
              if (normal) { if (2 * r <= Math.min(sx, sy)) noteDisc(dcx, dcy, r, dd, h * h, inside, o); else nCut = 2; }
            }
          }
          add(d, SAMPLE_MEDIUM, inside, o);
          add(area - d - hexArea, SAMPLE_MEDIUM, outside, o);
        } else {
          // a layer: the slab across the cell, |x − cx| (normal x) or |y − cy| below half its thickness
          const t = size[c] / 2;
          const sx0 = normalX[c] ? Math.max(rx0, cx - t) : rx0, sx1 = normalX[c] ? Math.min(rx1, cx + t) : rx1;
          const sy0 = normalX[c] ? ry0 : Math.max(ry0, cy - t), sy1 = normalX[c] ? ry1 : Math.min(ry1, cy + t);
          let slab = 0, hexInSlab = 0;
          if (sx1 > sx0 && sy1 > sy0) {
            slab = (sx1 - sx0) * (sy1 - sy0);
            for (let k = 0; k < nh; k++) hexInSlab += discRectArea(hx[k], hy[k], hr[k], sx0, sx1, sy0, sy1);
          }
          add(slab - hexInSlab, SAMPLE_MEDIUM, inside, o);
          add(area - slab - (hexArea - hexInSlab), SAMPLE_MEDIUM, outside, o);
        }
      }
    }
    if (overflow || np === 0) return 0;
    let total = 0;
    for (let k = 0; k < np; k++) total += partArea[k];
    // one interface exactly: two materials, one circle cutting the box, and the inside material's
    // part is that disc's share and nothing more (so the rest is all the other material)
    if (normal && np === 2 && nCut === 1) {
      for (let k = 0; k < 2; k++) {
        if (partKind[k] !== SAMPLE_MEDIUM || partMat[4 * k] !== cutSrc[cutO] || partMat[4 * k + 1] !== cutSrc[cutO + 1] || partMat[4 * k + 2] !== cutSrc[cutO + 2] || partMat[4 * k + 3] !== cutSrc[cutO + 3]) continue;
        if (Math.abs(partArea[k] - cutArea) <= 1e-9 * total) discBoxNormal(cutX, cutY, cutR, x0, x1, y0, y1, normal);
      }
    }
    for (let k = 0; k < np; k++) {
      const w = BOX_PART * k, m = 4 * k;
      out[w] = partArea[k] / total; out[w + 1] = partKind[k];
      // Ez: b = ε, T = μ·I; Hz: b = μ, T = ε·I (as sample())
      const bRe = ez ? partMat[m] : partMat[m + 2], bIm = ez ? partMat[m + 1] : partMat[m + 3];
      const tRe = ez ? partMat[m + 2] : partMat[m], tIm = ez ? partMat[m + 3] : partMat[m + 1];
      out[w + 2 + S_B] = bRe; out[w + 2 + S_B + 1] = bIm;
      out[w + 2 + S_TXX] = tRe; out[w + 2 + S_TXX + 1] = tIm;
      out[w + 2 + S_TYY] = tRe; out[w + 2 + S_TYY + 1] = tIm;
      out[w + 2 + S_TXY] = 0; out[w + 2 + S_TXY + 1] = 0;
    }
    return np;
  };
}
