/**
 * The device's geometry for the fab, pure: one closed polygon per cell (in the plane of the device,
 * metres, the cell centred at its build-list position), grouped by level — what the layout writers
 * (src/io/layout/) turn into GDSII or DXF. The device is invariant along z, so its plan view is the
 * whole drawing:
 *
 * - rods, holes and wires along z (`orientation` z): a circle of the recipe's radius, drawn as a
 *   regular polygon of CIRCLE_VERTICES vertices whose circumradius is enlarged so the polygon's area
 *   equals the circle's: R = r·sqrt(2π / (N·sin(2π/N))) (area of a regular N-gon ½N R² sin(2π/N));
 * - laminates whose layer normal lies in the plane: one strip of the fabricated layer, thickness
 *   `thickness_m`, across the cell, its normal along the lattice axis (x or y) nearer the cell's
 *   principal axis; area fraction t/a = fill;
 * - a solid cell of a material: the whole cell square (a solid of air or vacuum: nothing drawn).
 *
 * Other recipes (strut lattices, cubes, spheres: 3D printed parts; split rings on standing boards;
 * rods, holes or wires lying in the plane; laminates stacked along z) have no one-polygon plan view
 * and are listed in `notDrawn` with the reason, never drawn wrong. Cells sit on the device's square
 * grid and square-lattice inclusions at their cell centres. Hexagonal-lattice inclusions stand on
 * the sites of one hexagonal lattice of the pitch (hexSites.ts: anchored on the grid's centre, each
 * site with the recipe of the cell containing it, sites whose share would cross the device outline
 * or reach a cell built another way left out and counted in `notes`), the same sites the drawn
 * full-wave case uses, so the drawn area fraction is the recipe's fill away from the edges of a
 * level's region. A rect-lattice recipe (aspect m/n) tiles the cell exactly: m × n
 * circles, spacing p/m along the lattice's x axis and p/n along y, the x axis along the grid axis
 * (x or y) nearer the cell's principal axis 1 — snapped like laminates; the largest angle between
 * a snapped axis and the principal axis it stands for is said in `notes`.
 */
import type { Plan, Recipe } from "../planTypes.js";
import { rectTiling } from "../../cells/lattice.js";
import { droppedSitesNote, planHexSites } from "./planHexSites.js";
import { HEX_ROW } from "./hexSites.js";
import { rectCellCounts, rectSiteM } from "./rectSites.js";

export const CIRCLE_VERTICES = 64;

/** One closed polygon (x, y pairs, metres, counter-clockwise, last point ≠ first). */
export interface LayoutPolygon {
  cell: number;
  /** centre of the shape, metres: the cell centre, or the hexagonal site (hexSites.ts) */
  cxM: number;
  cyM: number;
  xy: Float64Array;
}

export interface LayoutLevel {
  /** 1-based level, the layer number */
  level: number;
  /** what is drawn: the fabricated phase's material ("air holes in silicon-nir"…) */
  what: string;
  polygons: LayoutPolygon[];
  /**
   * drawn area over area where the level's recipe repeats (analytic: the recipe's fill; for square
   * and rect lattices also the fraction of every cell), to check against the drawing
   */
  areaFraction: number;
  /** hexagonal-lattice levels: sites built, and sites left out at the edge of their kind's cells (hexSites.ts) */
  sites?: { built: number; dropped: number };
}

export interface Layout {
  levels: LayoutLevel[];
  /** levels not drawn and why */
  notDrawn: { level: number; reason: string }[];
  notes: string[];
  pitchM: number;
}

const GASES = new Set(["air", "vacuum"]);

function circle(cx: number, cy: number, r: number): Float64Array {
  const n = CIRCLE_VERTICES;
  const R = r * Math.sqrt((2 * Math.PI) / (n * Math.sin((2 * Math.PI) / n)));
  const xy = new Float64Array(2 * n);
  for (let k = 0; k < n; k++) {
    const t = (2 * Math.PI * k) / n;
    xy[2 * k] = cx + R * Math.cos(t);
    xy[2 * k + 1] = cy + R * Math.sin(t);
  }
  return xy;
}

function rect(cx: number, cy: number, w: number, h: number): Float64Array {
  return Float64Array.from([cx - w / 2, cy - h / 2, cx + w / 2, cy - h / 2, cx + w / 2, cy + h / 2, cx - w / 2, cy + h / 2]);
}

/** Angle (rad) between principal axis 1 and the grid axis it is snapped to. */
export function snapAngleRad(axisRad: number): number {
  const t = axisRad + Math.PI / 2;
  return Math.acos(Math.min(1, Math.max(Math.abs(Math.cos(t)), Math.abs(Math.sin(t)))));
}

/** How one level's recipe is drawn in a cell (one or more polygons), or why it is not. */
function shapeOf(r: Recipe, a: number): { draw: ((cx: number, cy: number, axisRad: number) => Float64Array[]) | null; what: string; fraction: number; reason?: string } {
  const fab = r.family === "holes-in-slab" ? `air holes in ${r.host}` : `${r.inclusion || r.host}`;
  if (r.family === "solid") {
    if (GASES.has(r.host)) return { draw: null, what: r.host, fraction: 0, reason: `solid ${r.host}: an empty cell, nothing to draw` };
    return { draw: (cx, cy) => [rect(cx, cy, a, a)], what: `solid ${r.host}`, fraction: 1 };
  }
  const radius = r.dimensions.radius_m;
  if ((r.family === "holes-in-slab" || r.family === "rods-in-host" || r.family === "wire-medium") && Number.isFinite(radius)) {
    if (r.orientation !== "z") return { draw: null, what: fab, fraction: 0, reason: `${r.family} lying in the plane (along ${r.orientation}) has no one-polygon plan view` };
    if (r.lattice === "rect") {
      const t = r.aspect !== undefined ? rectTiling(r.aspect) : null;
      if (!t) return { draw: null, what: fab, fraction: 0, reason: `rect-lattice recipe without a tiling aspect (${r.aspect})` };
      return {
        draw: (cx, cy, axisRad) => {
          // m circles along the lattice's x axis (principal axis 1), n along y, snapped to the grid (rectSites.ts)
          const [mx, my] = rectCellCounts(t, axisRad, new Int32Array(2));
          const out: Float64Array[] = [];
          for (let j = 0; j < my; j++) for (let i = 0; i < mx; i++) out.push(circle(rectSiteM(cx, i, mx, a), rectSiteM(cy, j, my, a), radius));
          return out;
        },
        what: `${fab} (rect lattice ${t.m} × ${t.n} per cell)`,
        fraction: (t.m * t.n * Math.PI * radius * radius) / (a * a),
      };
    }
    // hexagonal lattice: drawn on the plan's sites (planLayout), one site per (√3/2)·a²
    if (r.lattice === "hex") return { draw: (cx, cy) => [circle(cx, cy, radius)], what: `${fab} (hexagonal lattice)`, fraction: (Math.PI * radius * radius) / (HEX_ROW * a * a) };
    return { draw: (cx, cy) => [circle(cx, cy, radius)], what: fab, fraction: (Math.PI * radius * radius) / (a * a) };
  }
  if (r.family === "laminate" && Number.isFinite(r.dimensions.thickness_m)) {
    if (r.orientation === "z") return { draw: null, what: fab, fraction: 0, reason: "laminate stacked along z: uniform in the plan view" };
    const t = r.dimensions.thickness_m;
    return {
      draw: (cx, cy, axisRad) => {
        // the layer normal is the principal axis (2 at axisRad, 1 across it), snapped to x or y
        const normal = r.orientation === "2" ? axisRad : axisRad + Math.PI / 2;
        return [Math.abs(Math.cos(normal)) >= Math.abs(Math.sin(normal)) ? rect(cx, cy, t, a) : rect(cx, cy, a, t)];
      },
      what: `${r.inclusion} layers in ${r.host}`,
      fraction: t / a,
    };
  }
  return { draw: null, what: fab, fraction: 0, reason: `${r.family} cells are 3D or stand on boards: no plan-view drawing (a 3D or board layout is not written yet)` };
}

/** The plan's layout: one polygon per drawable cell, one layer per level. */
export function planLayout(plan: Plan): Layout {
  const g = plan.grid;
  const a = g.pitchM;
  const shapes = plan.levels.map((lv) => (lv.recipe ? shapeOf(lv.recipe, a) : null));
  const levels: LayoutLevel[] = [];
  const notDrawn: { level: number; reason: string }[] = [];
  plan.levels.forEach((lv, l) => {
    const s = shapes[l];
    if (!s) notDrawn.push({ level: lv.index, reason: "no recipe" });
    else if (!s.draw) notDrawn.push({ level: lv.index, reason: s.reason ?? "not drawable" });
    else levels.push({ level: lv.index, what: s.what, polygons: [], areaFraction: s.fraction });
  });
  const byLevel = new Map(levels.map((x) => [x.level, x]));
  const hex = planHexSites(plan);
  const onSites = new Uint8Array(plan.levels.length);
  for (const l of hex?.hexLevels ?? []) onSites[l] = 1;
  let maxSnap = -1;
  for (let c = 0; c < g.count; c++) {
    const l = plan.level[c];
    if (l < 0 || onSites[l]) continue;
    const out = byLevel.get(l + 1);
    const s = shapes[l];
    if (!out || !s?.draw) continue;
    const cx = g.originXM + g.i[c] * a, cy = g.originYM + g.j[c] * a;
    for (const xy of s.draw(cx, cy, plan.axisAngleRad[c])) out.polygons.push({ cell: c + 1, cxM: cx, cyM: cy, xy });
    if (plan.levels[l].recipe?.lattice === "rect") maxSnap = Math.max(maxSnap, snapAngleRad(plan.axisAngleRad[c]));
  }
  const notes: string[] = [];
  if (hex) {
    const { sites } = hex;
    for (let k = 0; k < sites.cell.length; k++) {
      const c = sites.cell[k], l = plan.level[c];
      const out = byLevel.get(l + 1), s = shapes[l];
      if (!out || !s?.draw) continue;
      for (const xy of s.draw(sites.xM[k], sites.yM[k], 0)) out.polygons.push({ cell: c + 1, cxM: sites.xM[k], cyM: sites.yM[k], xy });
    }
    let cells = 0;
    for (let c = 0; c < g.count; c++) if (plan.level[c] >= 0 && onSites[plan.level[c]]) cells++;
    for (const l of hex.hexLevels) {
      const out = byLevel.get(l + 1);
      if (out) out.sites = { built: hex.builtPerLevel[l], dropped: hex.droppedPerLevel[l] };
    }
    notes.push(`hexagonal-lattice levels stand on one hexagonal lattice of the pitch anchored on the grid's centre: ${sites.cell.length} sites built in their ${cells} cells (the cells' area holds ${(cells / HEX_ROW).toFixed(1)}), each with the recipe of the cell containing it`);
    const dropped = droppedSitesNote(hex, plan);
    if (dropped) notes.push(dropped);
  }
  if (maxSnap >= 0) {
    notes.push(`rect-lattice cells are drawn with their lattice axes along the grid axes nearer the cells' principal axes: largest misalignment ${Number(((maxSnap * 180) / Math.PI).toPrecision(3))}° (the planned values assume none)`);
  }
  return { levels, notDrawn, notes, pitchM: a };
}

/** Area of a closed polygon (shoelace), m². */
export function polygonArea(xy: ArrayLike<number>): number {
  let s = 0;
  const n = xy.length / 2;
  for (let k = 0; k < n; k++) {
    const j = (k + 1) % n;
    s += xy[2 * k] * xy[2 * j + 1] - xy[2 * j] * xy[2 * k + 1];
  }
  return s / 2;
}
