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
  const { nx, ny, nz } = grid;
  const rows = new Float64Array(ny * nz), rowN = new Int32Array(ny * nz);
  const cols = new Float64Array(nx * nz), colN = new Int32Array(nx * nz);
  const zl = new Float64Array(grid.dimension === 3 ? nx * ny : 0), zN = new Int32Array(zl.length);
  for (let c = 0; c < grid.count; c++) {
    const i = grid.i[c], j = grid.j[c], k = grid.k[c];
    const v = indexIm[c];
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

/** Median of the finite entries (NaN when none). */
export function finiteMedian(values: Float64Array): number {
  let n = 0;
  for (let c = 0; c < values.length; c++) if (Number.isFinite(values[c])) n++;
  if (n === 0) return NaN;
  const a = new Float64Array(n);
  n = 0;
  for (let c = 0; c < values.length; c++) if (Number.isFinite(values[c])) a[n++] = values[c];
  if (n % 2) return selectKth(a, (n - 1) >> 1);
  // even count: the upper middle, then the largest entry below it (all now left of it)
  const upper = selectKth(a, n / 2);
  let lower = a[0];
  for (let c = 1; c < n / 2; c++) if (a[c] > lower) lower = a[c];
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

export function billOfMaterials(levels: PlanLevel[], cellSize: number, dimension: 2 | 3, isGas: (id: string) => boolean): BillOfMaterialsRow[] {
  const rows = new Map<string, BillOfMaterialsRow>();
  const add = (id: string, cells: number, volume: number): void => {
    if (!id || isGas(id)) return;
    const r = rows.get(id) ?? { material: id, cells: 0, volume: 0, volumeUnit: dimension === 3 ? "m3" : "m2" };
    r.cells += cells;
    r.volume += volume;
    rows.set(id, r);
  };
  const cell = dimension === 3 ? cellSize ** 3 : cellSize ** 2;
  for (const lv of levels) {
    const r = lv.recipe;
    if (!r) continue;
    const ring = splitRingFractions(r.dimensions, cellSize);
    const hostFraction = ring ? ring.board : 1 - r.fillFraction;
    const inclusionFraction = ring ? ring.metal : r.fillFraction;
    add(r.host, lv.cellCount, hostFraction * cell * lv.cellCount);
    add(r.inclusion, lv.cellCount, inclusionFraction * cell * lv.cellCount);
  }
  return [...rows.values()].sort((a, b) => b.volume - a.volume || a.material.localeCompare(b.material));
}
