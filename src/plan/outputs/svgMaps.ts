/**
 * maps.svg: the device's level map and flag map side by side, each with its legend (colour scale
 * for the levels, one swatch per flag). Large grids are drawn at most MAX_SIDE cells per side (each
 * drawn cell shows the first device cell of its block); runs of equal colour along a row are drawn
 * as one rectangle, so the file stays small. 3D devices show their middle z slice.
 */
import type { Plan } from "../planTypes.js";
import { FLAGS, FLAG_BIT, type FlagName } from "../flags.js";
import { fmt } from "./csvText.js";

export const MAX_SIDE = 240;
const MAP_PX = 360;

/** Flags from most to least severe: a cell is coloured by the first it carries. */
const FLAG_ORDER: { name: FlagName; colour: string }[] = [
  { name: "norecipe", colour: "#b2182b" },
  { name: "unreachable", colour: "#e34a33" },
  { name: "undersize", colour: "#f46d43" },
  { name: "coarse", colour: "#fdae61" },
  { name: "subunity", colour: "#7b3294" },
  { name: "magnetic", colour: "#c2a5cf" },
  { name: "anisotropic", colour: "#1b7837" },
  { name: "uncertain", colour: "#fee08b" },
  { name: "inexact", colour: "#d6604d" },
  { name: "narrowband", colour: "#4393c3" },
  { name: "capped", colour: "#878787" },
];
const NO_FLAG = "#d9f0d3";

/** A perceptual ramp from dark blue through green to yellow (t in [0, 1]). */
export function rampColour(t: number): string {
  const stops = [
    [68, 1, 84], [59, 82, 139], [33, 145, 140], [94, 201, 98], [253, 231, 37],
  ];
  const x = Math.min(1, Math.max(0, t)) * (stops.length - 1);
  const k = Math.min(stops.length - 2, Math.floor(x));
  const u = x - k;
  const c = stops[k].map((v, n) => Math.round(v + u * (stops[k + 1][n] - v)));
  return `#${c.map((v) => v.toString(16).padStart(2, "0")).join("")}`;
}

/** `text` cut to at most `max` characters, with an ellipsis when cut. */
function clip(text: string, max: number): string {
  return text.length <= max ? text : `${text.slice(0, Math.max(1, max - 1))}…`;
}

function esc(text: string): string {
  return text.replace(/&/g, "&amp;").replace(/</g, "&lt;").replace(/>/g, "&gt;");
}

/** Raster of per-cell colour indices (-1 = outside the device), downsampled to ≤ MAX_SIDE a side. */
function raster(plan: Plan, colourOf: (cell: number) => number): { w: number; h: number; data: Int32Array } {
  const g = plan.grid;
  const step = Math.max(1, Math.ceil(Math.max(g.nx, g.ny) / MAX_SIDE));
  const w = Math.ceil(g.nx / step), h = Math.ceil(g.ny / step);
  const data = new Int32Array(w * h).fill(-1);
  const kMid = Math.floor(g.nz / 2);
  for (let c = 0; c < g.count; c++) {
    if (g.k[c] !== kMid) continue;
    const x = Math.floor(g.i[c] / step), y = Math.floor(g.j[c] / step);
    const at = (h - 1 - y) * w + x; // j grows upward
    if (data[at] < 0) data[at] = colourOf(c);
  }
  return { w, h, data };
}

function rects(r: { w: number; h: number; data: Int32Array }, palette: string[], x0: number, y0: number): string {
  const s = MAP_PX / Math.max(r.w, r.h);
  // Edges snapped to whole pixels, each rectangle ending where the next begins: fractional
  // sizes leave hairline seams between rows when the picture is rasterized.
  const edge = (k: number): number => Math.round(k * s);
  const out: string[] = [];
  for (let y = 0; y < r.h; y++) {
    let x = 0;
    while (x < r.w) {
      const v = r.data[y * r.w + x];
      let e = x + 1;
      while (e < r.w && r.data[y * r.w + e] === v) e++;
      if (v >= 0) {
        out.push(`<rect x="${x0 + edge(x)}" y="${y0 + edge(y)}" width="${edge(e) - edge(x)}" height="${edge(y + 1) - edge(y)}" fill="${palette[v]}"/>`);
      }
      x = e;
    }
  }
  return out.join("\n");
}

/** The SVG text of the two maps. */
export function mapsSvg(plan: Plan): string {
  const nLevels = plan.levels.length;
  const levelPalette = plan.levels.map((_, k) => rampColour(nLevels > 1 ? k / (nLevels - 1) : 0.5));
  const noLevel = nLevels; // cells without a level (undefined targets)
  levelPalette.push("#000000");
  const flagPalette = [...FLAG_ORDER.map((f) => f.colour), NO_FLAG];
  const levelRaster = raster(plan, (c) => (plan.level[c] >= 0 ? plan.level[c] : noLevel));
  const flagRaster = raster(plan, (c) => {
    const m = plan.flags[c];
    for (let k = 0; k < FLAG_ORDER.length; k++) if (m & FLAG_BIT[FLAG_ORDER[k].name]) return k;
    return FLAG_ORDER.length;
  });
  const pad = 20, top = 60, legendTop = top + MAP_PX + 24;
  const left2 = pad * 3 + MAP_PX;
  const first = plan.components.findIndex((c) => !c.constant);
  const comp = first >= 0 ? plan.components[first] : plan.components[0];
  const levelLegend: string[] = [];
  const shown = Math.min(nLevels, 16);
  for (let k = 0; k < shown; k++) {
    const idx = nLevels <= 16 ? k : Math.round((k * (nLevels - 1)) / (shown - 1));
    const lv = plan.levels[idx];
    const y = legendTop + k * 16;
    levelLegend.push(`<rect x="${pad}" y="${y}" width="12" height="12" fill="${levelPalette[idx]}"/>`);
    levelLegend.push(`<text x="${pad + 18}" y="${y + 10}">level ${lv.index}: ${esc(comp?.name ?? "")} = ${fmt(lv.target[first >= 0 ? first : 0], 4)} (${lv.cellCount} cells)${lv.recipe ? "" : " — no recipe"}</text>`);
  }
  const counts = plan.figures.flagCounts;
  const flagLegend: string[] = [];
  const present = FLAG_ORDER.filter((f) => (counts[f.name] ?? 0) > 0);
  [...present, { name: "none" as const, colour: NO_FLAG }].forEach((f, k) => {
    const y = legendTop + k * 16;
    const n = f.name === "none" ? countUnflagged(plan.flags) : counts[f.name];
    const meaning = f.name === "none" ? "no flag" : FLAGS.find((x) => x.name === f.name)!.meaning;
    flagLegend.push(`<rect x="${left2}" y="${y}" width="12" height="12" fill="${f.colour}"/>`);
    flagLegend.push(`<text x="${left2 + 18}" y="${y + 10}">${f.name} (${n} cells)<title>${esc(meaning)}</title></text>`);
  });
  const rows = Math.max(shown, present.length + 1);
  const width = left2 + MAP_PX + pad;
  const height = legendTop + rows * 16 + pad;
  return [
    `<svg xmlns="http://www.w3.org/2000/svg" width="${width}" height="${height}" viewBox="0 0 ${width} ${height}" font-family="sans-serif" font-size="11">`,
    `<rect width="${width}" height="${height}" fill="#ffffff"/>`,
    // Title on two lines so a long design name never runs past the picture's right edge.
    `<text x="${pad}" y="18" font-size="14" font-weight="bold">${esc(clip(plan.design.name, Math.floor((width - 2 * pad) / 8.5)))}</text>`,
    `<text x="${pad}" y="34">${plan.grid.count} cells, ${nLevels} levels, ${plan.regions.length} regions</text>`,
    `<text x="${pad}" y="${top - 8}">level map (colour: level, ordered by ${esc(comp?.name ?? "target")})</text>`,
    `<text x="${left2}" y="${top - 8}">flag map (colour: most severe flag)</text>`,
    `<rect x="${pad}" y="${top}" width="${MAP_PX}" height="${MAP_PX}" fill="none" stroke="#999999"/>`,
    `<rect x="${left2}" y="${top}" width="${MAP_PX}" height="${MAP_PX}" fill="none" stroke="#999999"/>`,
    `<g shape-rendering="crispEdges">`,
    rects(levelRaster, levelPalette, pad, top),
    rects(flagRaster, flagPalette, left2, top),
    `</g>`,
    ...levelLegend,
    ...(nLevels > shown ? [`<text x="${pad}" y="${legendTop + shown * 16 + 10}">(${nLevels - shown} more levels in levels.csv)</text>`] : []),
    ...flagLegend,
    `</svg>`,
    "",
  ].join("\n");
}

function countUnflagged(flags: Uint16Array): number {
  let n = 0;
  for (let c = 0; c < flags.length; c++) if (flags[c] === 0) n++;
  return n;
}
