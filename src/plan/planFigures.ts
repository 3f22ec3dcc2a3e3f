/** Device-level figures of a plan: loss along straight paths, errors, bill of materials. */
import { selectKth } from "../core/selectKth.js";
import type { DeviceGrid } from "../field/deviceGrid.js";
import type { BillOfMaterialsRow, PlanLevel } from "./planTypes.js";
import { printedMeanRadiusM } from "../cells/printedRing.js";

/** 20·log10(e): nepers of field amplitude to decibels. */
export const DB_PER_NEPER = 20 / Math.LN10;

export interface LossPath {
  lossDb: number;
  lengthM: number;
  direction: [number, number];
}

/**
 * Attenuation along every straight row and column of cells (and z line in 3D):
 * A = 20·log10(e) · k0 · Σ Im n · pitch over the device cells of the line, in dB (the field decays
 * as exp(−k0 ∫ Im n ds) for exp(−iωt)). Returns the line with the largest attenuation (ties: the
 * longest). `indexIm` holds Im n per cell.
 */
export function worstStraightPath(grid: DeviceGrid, indexIm: Float64Array, k0: number): LossPath {
  return worstPath(grid, (c) => indexIm[c], k0);
}

/**
 * `worstStraightPath` where Im n is one value per level (`levelIndexIm[level[c]]`, 0 for cells
 * without a level): the same sums, without a per-cell array of them.
 */
export function worstStraightPathByLevel(grid: DeviceGrid, level: Int32Array, levelIndexIm: ArrayLike<number>, k0: number): LossPath {
  return worstPath(grid, (c) => { const l = level[c]; return l >= 0 ? levelIndexIm[l] : 0; }, k0);
}

function worstPath(grid: DeviceGrid, imOf: (cell: number) => number, k0: number): LossPath {
  const { nx, ny, nz } = grid;
  const rows = new Float64Array(ny * nz), rowN = new Int32Array(ny * nz);
  const cols = new Float64Array(nx * nz), colN = new Int32Array(nx * nz);
  const zl = new Float64Array(grid.dimension === 3 ? nx * ny : 0), zN = new Int32Array(zl.length);
  for (let c = 0; c < grid.count; c++) {
    const i = grid.i[c], j = grid.j[c], k = grid.k[c];
    const v = imOf(c);
    rows[k * ny + j] += v; rowN[k * ny + j]++;
    cols[k * nx + i] += v; colN[k * nx + i]++;
    if (zl.length) { zl[j * nx + i] += v; zN[j * nx + i]++; }
  }
  let best: LossPath = { lossDb: 0, lengthM: 0, direction: [1, 0] };
  const consider = (sum: Float64Array, count: Int32Array, direction: [number, number]): void => {
    for (let q = 0; q < sum.length; q++) {
      const db = DB_PER_NEPER * k0 * sum[q] * grid.pitchM;
      const len = count[q] * grid.pitchM;
      if (db > best.lossDb || (db === best.lossDb && len > best.lengthM)) best = { lossDb: db, lengthM: len, direction };
    }
  };
  consider(rows, rowN, [1, 0]);
  consider(cols, colN, [0, 1]);
  if (zl.length) consider(zl, zN, [0, 0]);
  return best;
}

/** Below this many finite entries the median copies them; above, it selects within histogram buckets. */
const MEDIAN_COPY_LIMIT = 1 << 14;
const LITTLE_ENDIAN = new Uint8Array(Uint32Array.of(1).buffer)[0] === 1;

/**
 * Median of the finite entries (NaN when none); the mean of the two middle ones for an even
 * count. Large arrays are not copied: a first pass counts entries per bucket of the top 16 bits
 * of an order-preserving key of their bit pattern, and only the bucket(s) holding the middle
 * ranks are copied and searched (selectKth), so 10⁶ errors cost a few hundred kB, not 8 MB.
 */
export function finiteMedian(values: Float64Array): number {
  let n = 0;
  for (let c = 0; c < values.length; c++) if (Number.isFinite(values[c])) n++;
  if (n === 0) return NaN;
  const kLo = (n - 1) >> 1, kHi = n >> 1;
  let a: Float64Array, base = 0;
  if (n < MEDIAN_COPY_LIMIT || !LITTLE_ENDIAN || values.byteOffset % 4 !== 0) {
    a = new Float64Array(n);
    let m = 0;
    for (let c = 0; c < values.length; c++) if (Number.isFinite(values[c])) a[m++] = values[c];
  } else {
    const words = new Uint32Array(values.buffer, values.byteOffset, 2 * values.length);
    // the high word, sign bit set (positives) or every bit flipped (negatives): grows with the value
    const bucket = (c: number): number => {
      const hi = words[2 * c + 1];
      return (hi & 0x80000000 ? ~hi : hi | 0x80000000) >>> 16;
    };
    const counts = new Int32Array(1 << 16);
    for (let c = 0; c < values.length; c++) if (Number.isFinite(values[c])) counts[bucket(c)]++;
    let bLo = 0, seen = 0;
    while (seen + counts[bLo] <= kLo) seen += counts[bLo++];
    base = seen;
    let bHi = bLo, through = seen + counts[bLo];
    while (through <= kHi) through += counts[++bHi];
    a = new Float64Array(through - base);
    let m = 0;
    for (let c = 0; c < values.length; c++) {
      if (!Number.isFinite(values[c])) continue;
      const b = bucket(c);
      if (b >= bLo && b <= bHi) a[m++] = values[c];
    }
  }
  const lower = selectKth(a, kLo - base);
  if (kHi === kLo) return lower;
  // even count: the smallest entry above the lower middle (all now right of it)
  let upper = a[kLo - base + 1];
  for (let c = kLo - base + 2; c < a.length; c++) if (a[c] < upper) upper = a[c];
  return 0.5 * (lower + upper);
}

/**
 * Bill of materials: cells and volume per material (2D: cross-section per metre of height, m²;
 * 3D: m³), from each level's recipe: inclusion volume fill·cell, host (1 − fill)·cell. Gases are
 * left out (nothing to buy).
 */
/** Copper of printed boards, 35 µm ("1 oz"; common practice), for the metal volume of printed rings. */
export const PRINTED_METAL_THICKNESS_M = 35e-6;

/**
 * Volume fractions of a printed split-ring cell (pitch a): the board, t/a; the metal, two strips of
 * width w, mean radii r + w/2 and r + 1.5w + d, thickness 35 µm, one ring per cubic cell:
 * 2π(2r + 2w + d)·w·t_cu / a³. null for other recipes (their fill fraction is the inclusion's).
 */
function splitRingFractions(dims: Record<string, number>, a: number): { board: number; metal: number } | null {
  const r = dims.ring_radius_m, w = dims.ring_width_m, d = dims.ring_gap_m, t = dims.board_thickness_m;
  if (![r, w, d, t].every((v) => Number.isFinite(v))) return null;
  const meanM = printedMeanRadiusM({ pitchM: a, ringRadiusM: r, ringWidthM: w, ringGapM: d });
  // two strips whose mean radii are meanM ∓ (w + d)/2: total length 2·2π·meanM
  return { board: t / a, metal: (4 * Math.PI * meanM * w * PRINTED_METAL_THICKNESS_M) / (a * a * a) };
}

/** How the bill of materials sizes the order: by the device's height, the materials' classes and the process. */
export interface BillContext {
  /** device height along z (2D devices), metres */
  heightM: number;
  classOf: (id: string) => string | undefined;
  process: string | null;
  /** a declared layer (film) the device is made in */
  layer: boolean;
}

const LITHOGRAPHY = new Set(["deep-uv-lithography", "electron-beam-lithography"]);
const SHEET_PROCESSES = new Set(["laser-cutting", "cnc-milling"]);

/** Area in the unit a buyer reads (m², cm², mm², µm²). */
function areaQuantity(m2: number): { quantity: number; unit: string } {
  if (m2 >= 1) return { quantity: m2, unit: "m²" };
  if (m2 >= 1e-4) return { quantity: m2 * 1e4, unit: "cm²" };
  if (m2 >= 1e-6) return { quantity: m2 * 1e6, unit: "mm²" };
  return { quantity: m2 * 1e12, unit: "µm²" };
}

/** Volume in the unit a buyer reads: litres or millilitres for liquids and resins, cm³ or mm³ otherwise. */
function volumeQuantity(m3: number, liquid: boolean): { quantity: number; unit: string } {
  if (liquid && m3 >= 1e-3) return { quantity: m3 * 1e3, unit: "L" };
  if (liquid && m3 >= 1e-6) return { quantity: m3 * 1e6, unit: "mL" };
  if (m3 >= 1e-6) return { quantity: m3 * 1e6, unit: "cm³" };
  return { quantity: m3 * 1e9, unit: "mm³" };
}

/**
 * Materials the plan uses (gases left out): cells, volume (m³: 2D cells are a² × the device height,
 * 3D cells a³) and the quantity a buyer orders — laminates by board area at the board's thickness
 * (a split ring's board, otherwise the device height); on a lithography process or in a declared
 * layer, the film's area (the footprint of the cells that use it); on laser cutting or CNC milling
 * the shaped host by sheet area at the device height; resins and liquids by volume in mL or L;
 * everything else by volume in cm³ (mm³ when small).
 */
export function billOfMaterials(levels: PlanLevel[], cellSize: number, dimension: 2 | 3, isGas: (id: string) => boolean, ctx: BillContext): BillOfMaterialsRow[] {
  interface Acc { row: BillOfMaterialsRow; areaM2: number; thicknesses: Set<number>; byArea: "board" | "film" | "sheet" | null }
  const rows = new Map<string, Acc>();
  const cellFoot = cellSize * cellSize;
  const cell = dimension === 3 ? cellSize ** 3 : cellFoot * ctx.heightM;
  const add = (id: string, cells: number, volume: number, asHost: boolean, boardM: number | null): void => {
    if (!id || isGas(id)) return;
    const cls = ctx.classOf(id);
    const byArea: Acc["byArea"] = cls === "laminate" ? "board"
      : (ctx.layer || (ctx.process !== null && LITHOGRAPHY.has(ctx.process))) && asHost ? "film"
      : ctx.process !== null && SHEET_PROCESSES.has(ctx.process) && asHost && cls !== "metal" ? "sheet"
      : null;
    const a = rows.get(id) ?? { row: { material: id, cells: 0, volume: 0, volumeUnit: "m3" as const, order: { quantity: 0, unit: "", what: "" } }, areaM2: 0, thicknesses: new Set<number>(), byArea };
    a.row.cells += cells;
    a.row.volume += volume;
    if (byArea === "board") { const t = boardM ?? ctx.heightM; a.areaM2 += volume / t; a.thicknesses.add(t); }
    else if (byArea) { a.areaM2 += cells * cellFoot; a.thicknesses.add(ctx.heightM); }
    rows.set(id, a);
  };
  for (const lv of levels) {
    const r = lv.recipe;
    if (!r) continue;
    const ring = splitRingFractions(r.dimensions, cellSize);
    const hostFraction = ring ? ring.board : 1 - r.fillFraction;
    const inclusionFraction = ring ? ring.metal : r.fillFraction;
    const board = ring ? r.dimensions.board_thickness_m : null;
    add(r.host, lv.cellCount, hostFraction * cell * lv.cellCount, true, board);
    add(r.inclusion, lv.cellCount, inclusionFraction * cell * lv.cellCount, false, null);
  }
  const mm = (m: number): string => (m >= 1e-4 ? `${Number((m * 1e3).toPrecision(4))} mm` : m >= 1e-6 ? `${Number((m * 1e6).toPrecision(4))} µm` : `${Number((m * 1e9).toPrecision(4))} nm`);
  const out: BillOfMaterialsRow[] = [];
  for (const a of rows.values()) {
    const t = [...a.thicknesses].sort((x, y) => x - y).map(mm).join(" / ");
    if (a.byArea) {
      const q = areaQuantity(a.areaM2);
      const what = a.byArea === "board" ? `board area, ${t} thick` : a.byArea === "film" ? `film area (wafer), ${t} thick` : `sheet area, ${t} thick`;
      a.row.order = { quantity: q.quantity, unit: q.unit, what };
    } else {
      const cls = ctx.classOf(a.row.material);
      const q = volumeQuantity(a.row.volume, cls === "resin" || cls === "liquid");
      a.row.order = { quantity: q.quantity, unit: q.unit, what: cls === "resin" ? "resin volume" : cls === "liquid" ? "liquid volume" : "material volume" };
    }
    out.push(a.row);
  }
  return out.sort((a, b) => b.volume - a.volume || a.material.localeCompare(b.material));
}
