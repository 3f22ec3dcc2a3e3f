/**
 * maps.svg: the device's level map and flag map side by side, each with its legend (colour scale
 * for the levels, one swatch per flag), axes with ticks in the design's unit (µm optical, mm
 * otherwise: designUnit.ts, as the build list), a scale bar, and the origin (x = y = 0) marked where
 * it falls on the map (else said in the caption). The level legend names every component that
 * varies between levels (ε_z, μ_1…), so no two entries read the same. Large grids are drawn at most
 * MAX_SIDE cells per side (each drawn cell shows the first device cell of its block); runs of equal
 * colour along a row are drawn as one rectangle, so the file stays small. 3D devices show their
 * middle z slice.
 */
import type { Plan } from "../planTypes.js";
import { FLAGS, FLAG_BIT, type FlagName } from "../flags.js";
import { fmt } from "./csvText.js";
import { designUnit, type DesignUnit } from "./designUnit.js";

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

/** "eps_z" → "ε_z", "mu_1" → "μ_1". */
export function componentLabel(name: string): string {
  return name.replace(/^eps_/, "ε_").replace(/^mu_/, "μ_");
}

/** A 1-2-5 step giving about `target` intervals over `span`. */
export function niceStep(span: number, target: number): number {
  const raw = span / target;
  const p = 10 ** Math.floor(Math.log10(raw));
  const m = raw / p;
  return (m < 1.5 ? 1 : m < 3.5 ? 2 : m < 7.5 ? 5 : 10) * p;
}

/** Number text for an axis value (no float noise: rounded to the step's decimals). */
function tickText(v: number, step: number): string {
  const decimals = Math.max(0, -Math.floor(Math.log10(step) + 1e-9));
  const t = v.toFixed(decimals);
  return t === `-${(0).toFixed(decimals)}` ? (0).toFixed(decimals) : t;
}

/** Where the map sits in the picture and how device coordinates land on it. */
interface Frame { x0: number; y0: number; pxPerM: number; xLeftM: number; yTopM: number; wM: number; hM: number }

function frameOf(plan: Plan, r: { w: number; h: number }, x0: number, y0: number): Frame {
  const g = plan.grid;
  const step = Math.max(1, Math.ceil(Math.max(g.nx, g.ny) / MAX_SIDE));
  const cellPx = MAP_PX / Math.max(r.w, r.h);
  const blockM = step * g.pitchM;
  return {
    x0, y0,
    pxPerM: cellPx / blockM,
    xLeftM: g.originXM - g.pitchM / 2,
    yTopM: g.originYM - g.pitchM / 2 + r.h * blockM,
    wM: r.w * blockM,
    hM: r.h * blockM,
  };
}

/** Axes (ticks and labels in the design unit), a scale bar and the origin for one map. */
function axes(f: Frame, unit: DesignUnit, label: string): string[] {
  const out: string[] = [];
  const px = (xM: number): number => f.x0 + (xM - f.xLeftM) * f.pxPerM;
  const py = (yM: number): number => f.y0 + (f.yTopM - yM) * f.pxPerM;
  const r2 = (v: number): string => v.toFixed(1);
  const wPx = f.wM * f.pxPerM, hPx = f.hM * f.pxPerM;
  const bottom = f.y0 + hPx, right = f.x0 + wPx;
  out.push(`<g class="axes" stroke="#333333" stroke-width="1">`);
  out.push(`<line x1="${r2(f.x0)}" y1="${r2(bottom)}" x2="${r2(right)}" y2="${r2(bottom)}"/>`);
  out.push(`<line x1="${r2(f.x0)}" y1="${r2(f.y0)}" x2="${r2(f.x0)}" y2="${r2(bottom)}"/>`);
  out.push(`</g>`);
  const span = Math.max(f.wM, f.hM) * unit.perM;
  const step = niceStep(span, 5);
  const ticks = (lo: number, hi: number): number[] => {
    const list: number[] = [];
    for (let k = Math.ceil(lo / step - 1e-9); k * step <= hi + 1e-9 * step; k++) list.push(k * step);
    return list;
  };
  const xLo = f.xLeftM * unit.perM, xHi = (f.xLeftM + f.wM) * unit.perM;
  for (const v of ticks(xLo, xHi)) {
    const x = px(v / unit.perM);
    out.push(`<line class="tick-x" x1="${r2(x)}" y1="${r2(bottom)}" x2="${r2(x)}" y2="${r2(bottom + 4)}" stroke="#333333"/>`);
    out.push(`<text class="tick-x" x="${r2(x)}" y="${r2(bottom + 15)}" text-anchor="middle">${tickText(v, step)}</text>`);
  }
  const yLo = (f.yTopM - f.hM) * unit.perM, yHi = f.yTopM * unit.perM;
  for (const v of ticks(yLo, yHi)) {
    const y = py(v / unit.perM);
    out.push(`<line class="tick-y" x1="${r2(f.x0 - 4)}" y1="${r2(y)}" x2="${r2(f.x0)}" y2="${r2(y)}" stroke="#333333"/>`);
    out.push(`<text class="tick-y" x="${r2(f.x0 - 6)}" y="${r2(y + 4)}" text-anchor="end">${tickText(v, step)}</text>`);
  }
  out.push(`<text class="axis-title" x="${r2(f.x0 + wPx / 2)}" y="${r2(bottom + 30)}" text-anchor="middle">x (${unit.symbol}) — ${esc(label)}</text>`);
  out.push(`<text class="axis-title" x="${r2(f.x0 - 40)}" y="${r2(f.y0 - 6)}">y (${unit.symbol})</text>`);
  // scale bar: a 1-2-5 length near a quarter of the map's width, in the map's top-right corner
  const bar = niceStep(f.wM * unit.perM, 4);
  const barPx = (bar / unit.perM) * f.pxPerM;
  const bx = right - 8 - barPx, by = f.y0 + 14;
  out.push(`<g class="scale-bar"><rect x="${r2(bx - 4)}" y="${r2(by - 12)}" width="${r2(barPx + 8)}" height="20" fill="#ffffff" fill-opacity="0.8"/><line x1="${r2(bx)}" y1="${r2(by)}" x2="${r2(bx + barPx)}" y2="${r2(by)}" stroke="#000000" stroke-width="3"/><text x="${r2(bx + barPx / 2)}" y="${r2(by - 4)}" text-anchor="middle">${tickText(bar, bar)} ${unit.symbol}</text></g>`);
  // origin
  const ox = px(0), oy = py(0);
  if (ox >= f.x0 && ox <= right && oy >= f.y0 && oy <= bottom) {
    out.push(`<g class="origin" stroke="#d7191c" stroke-width="1.5"><line x1="${r2(ox - 6)}" y1="${r2(oy)}" x2="${r2(ox + 6)}" y2="${r2(oy)}"/><line x1="${r2(ox)}" y1="${r2(oy - 6)}" x2="${r2(ox)}" y2="${r2(oy + 6)}"/><circle cx="${r2(ox)}" cy="${r2(oy)}" r="3" fill="none"/></g>`);
    out.push(`<text class="origin" x="${r2(ox + 6)}" y="${r2(oy - 6)}" fill="#d7191c">origin</text>`);
  }
  return out;
}

/** The SVG text of the two maps. */
export function mapsSvg(plan: Plan): string {
  const nLevels = plan.levels.length;
  const unit = designUnit(plan.design.wavelengthM);
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
  const left = 60, gap = 80, top = 66, legendTop = top + MAP_PX + 44;
  const left2 = left + MAP_PX + gap;
  const pad = 20;
  // the components that differ between levels (all when none does)
  let varying = plan.components.map((c, k) => ({ c, k })).filter(({ k }) => plan.levels.some((lv) => lv.target[k] !== plan.levels[0].target[k]));
  if (varying.length === 0) varying = plan.components.slice(0, 1).map((c) => ({ c, k: 0 }));
  const first = varying[0];
  const levelLegend: string[] = [];
  const shown = Math.min(nLevels, 16);
  for (let k = 0; k < shown; k++) {
    const idx = nLevels <= 16 ? k : Math.round((k * (nLevels - 1)) / (shown - 1));
    const lv = plan.levels[idx];
    const y = legendTop + k * 16;
    // components equal to each other at this level read as one: "ε_1 = ε_2 = 4.941"
    const groups: { names: string[]; value: number }[] = [];
    for (const { c, k: ck } of varying) {
      const v = lv.target[ck];
      const g = groups.find((x) => x.value === v);
      if (g) g.names.push(componentLabel(c.name)); else groups.push({ names: [componentLabel(c.name)], value: v });
    }
    const values = groups.map((g) => `${g.names.join(" = ")} = ${fmt(g.value, 4)}`).join(", ");
    levelLegend.push(`<rect x="${left}" y="${y}" width="12" height="12" fill="${levelPalette[idx]}"/>`);
    levelLegend.push(`<text class="legend-level" x="${left + 18}" y="${y + 10}">level ${lv.index}: ${esc(values)} (${lv.cellCount} cells)${lv.recipe ? "" : " — no recipe"}</text>`);
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
  const height = legendTop + rows * 16 + 16 + pad;
  const f1 = frameOf(plan, levelRaster, left, top);
  const f2 = frameOf(plan, flagRaster, left2, top);
  const originOnMap = (() => { const x = (0 - f1.xLeftM) * f1.pxPerM, y = (f1.yTopM - 0) * f1.pxPerM; return x >= 0 && x <= f1.wM * f1.pxPerM && y >= 0 && y <= f1.hM * f1.pxPerM; })();
  const caption = `${plan.grid.count} cells of ${fmt(plan.grid.pitchM * unit.perM, 4)} ${unit.symbol}, ${nLevels} levels, ${plan.regions.length} regions; ${originOnMap ? "origin (x = y = 0) marked in red" : "the origin (x = y = 0) lies outside the maps"}`;
  return [
    `<svg xmlns="http://www.w3.org/2000/svg" width="${width}" height="${height}" viewBox="0 0 ${width} ${height}" font-family="sans-serif" font-size="11">`,
    `<rect width="${width}" height="${height}" fill="#ffffff"/>`,
    // Title on two lines so a long design name never runs past the picture's right edge.
    `<text x="${pad}" y="18" font-size="14" font-weight="bold">${esc(clip(plan.design.name, Math.floor((width - 2 * pad) / 8.5)))}</text>`,
    `<text class="caption" x="${pad}" y="34">${esc(caption)}</text>`,
    `<text x="${left}" y="${top - 20}">level map (colour: level, ordered by ${esc(componentLabel(first.c.name))})</text>`,
    `<text x="${left2}" y="${top - 20}">flag map (colour: most severe flag)</text>`,
    `<rect x="${left}" y="${top}" width="${MAP_PX}" height="${MAP_PX}" fill="none" stroke="#cccccc"/>`,
    `<rect x="${left2}" y="${top}" width="${MAP_PX}" height="${MAP_PX}" fill="none" stroke="#cccccc"/>`,
    `<g shape-rendering="crispEdges">`,
    rects(levelRaster, levelPalette, left, top),
    rects(flagRaster, flagPalette, left2, top),
    `</g>`,
    ...axes(f1, unit, "levels"),
    ...axes(f2, unit, "flags"),
    ...levelLegend,
    ...(nLevels > shown ? [`<text x="${left}" y="${legendTop + shown * 16 + 10}">(${nLevels - shown} more levels in levels.csv)</text>`] : []),
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
