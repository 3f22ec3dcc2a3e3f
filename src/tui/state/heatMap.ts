/**
 * Terminal heat map of one per-cell quantity, as a pure function: a lattice of values in, rows of
 * styled glyph runs and a legend out. No ink or react here, so it is tested without rendering.
 *
 * Each map cell is one or two character cells wide. A terminal character is about twice as tall as
 * it is wide, so a two-character cell is roughly square; when the lattice does not fit, blocks of
 * lattice cells are merged into one map cell (downsampling), keeping the aspect ratio where the
 * space allows. Values are binned into a glyph ramp whose density grows with the value, so the map
 * and its legend read without colour too; colours repeat the same information. A quantity that is
 * constant over the device is one flat fill with one legend entry; the cursor is a glyph of its own
 * (drawn inverted as well), so neither depends on colour.
 */
import { formatValue } from "./formatValue.js";

/** Glyphs of the eight value bins, lightest to densest. */
export const VALUE_GLYPHS = ["·", ":", "-", "=", "+", "*", "#", "@"] as const;
/** Colours of the eight value bins (cool to warm, all readable on a dark or light background). */
export const VALUE_COLOURS = ["#5b74e8", "#3e9fe0", "#2fbfb0", "#5cc95c", "#b5cf3f", "#e8c048", "#ee8a3a", "#e2504a"] as const;
/** Glyph and colour of a cell inside the device whose value is missing (no recipe, not a number). */
export const MISSING_GLYPH = "?";
export const MISSING_COLOUR = "#ff5fd7";
/** Glyph and colour of the flat fill of a constant quantity. */
export const CONSTANT_GLYPH = "=";
export const CONSTANT_COLOUR = "#5cc95c";
/** Glyph of the map cell under the cursor (repeated for two-character cells; also drawn inverted). */
export const CURSOR_GLYPH = "◆";
/**
 * Spread below which a quantity counts as constant, relative to its magnitude: floating-point
 * noise of a constant (1e-16 … 1e-12) and anything the legend's three significant digits could not
 * tell apart.
 */
export const CONSTANT_REL_SPREAD = 1e-6;
/** Glyphs of categories (levels 1…, or custom), used when there are few enough of them. */
export const CATEGORY_GLYPHS = "123456789ABCDEFGHJKLMNPQRSTUVWXYZ";
export const CATEGORY_COLOURS = ["#5b9cf2", "#f2a65b", "#6fd17a", "#e56b8c", "#b48cf0", "#e8d45a", "#4fd0d6", "#c98f62", "#9fb0c8", "#f07ad0"] as const;

export type MapScale =
  | {
      /** every value equal (within `CONSTANT_REL_SPREAD`): one flat fill, one legend entry */
      kind: "constant";
      value: number;
    }
  | {
      kind: "continuous";
      /** value at the bottom of the first bin and the top of the last */
      min: number;
      max: number;
      /** bins equal in log10 (only when min > 0) */
      log: boolean;
    }
  | {
      kind: "categorical";
      /** label of each category; a cell's value is its category index */
      labels: string[];
      /** glyph of each category (default: 1, 2, … A, B, …) */
      glyphs?: string[];
      colours?: (string | null)[];
    };

/** How a block of lattice cells is summarised in one map cell when downsampling. */
export type BlockSummary = "mean" | "max" | "mode";

export interface MapLayout {
  /** characters per map cell (1 or 2) */
  cellWidth: 1 | 2;
  /** lattice cells merged per map cell along x and y */
  blockX: number;
  blockY: number;
  /** map cells across and down */
  cols: number;
  rows: number;
}

export interface GlyphRun {
  text: string;
  colour: string | null;
  /** drawn inverted (the cursor) */
  inverse: boolean;
}

export interface LegendEntry {
  glyph: string;
  colour: string | null;
  label: string;
}

export interface HeatMapView {
  layout: MapLayout;
  /** one array of runs per screen row, top row first (largest y) */
  rows: GlyphRun[][];
  legend: LegendEntry[];
  /** map cell under the cursor (column, row from the top), or null */
  cursorCell: { col: number; row: number } | null;
  /** some device cell has no value (the legend then lists the missing glyph) */
  hasMissing: boolean;
}

/** The lattice a map is drawn on: the device grid's shape and each device cell's indices. */
export interface MapLattice {
  nx: number;
  ny: number;
  count: number;
  i: ArrayLike<number>;
  j: ArrayLike<number>;
}

/**
 * The smallest downsampling that fits `nx × ny` lattice cells into `maxWidth × maxHeight`
 * characters. Tries two characters per cell with square blocks first (b × b cells per map cell),
 * then one character per cell with blocks b wide and 2b tall (both keep the aspect ratio), b = 1, 2, …
 */
export function chooseLayout(nx: number, ny: number, maxWidth: number, maxHeight: number): MapLayout {
  const w = Math.max(1, Math.floor(maxWidth));
  const h = Math.max(1, Math.floor(maxHeight));
  for (let b = 1; ; b++) {
    const cols2 = Math.ceil(nx / b);
    const rows2 = Math.ceil(ny / b);
    if (cols2 * 2 <= w && rows2 <= h) return { cellWidth: 2, blockX: b, blockY: b, cols: cols2, rows: rows2 };
    const cols1 = Math.ceil(nx / b);
    const rows1 = Math.ceil(ny / (2 * b));
    if (cols1 <= w && rows1 <= h) return { cellWidth: 1, blockX: b, blockY: 2 * b, cols: cols1, rows: rows1 };
    if (b > nx + ny) return { cellWidth: 1, blockX: b, blockY: 2 * b, cols: cols1, rows: rows1 };
  }
}

/**
 * A continuous scale over the finite values: min … max, logarithmic when every value is positive
 * and they span more than a factor `logAbove` (default 30). Values equal within
 * `CONSTANT_REL_SPREAD` of their magnitude (or all zero) give the constant scale; no finite value
 * gives 0 … 1.
 */
export function continuousScaleOf(values: ArrayLike<number>, logAbove = 30): MapScale {
  let min = Infinity;
  let max = -Infinity;
  for (let c = 0; c < values.length; c++) {
    const v = values[c];
    if (!Number.isFinite(v)) continue;
    if (v < min) min = v;
    if (v > max) max = v;
  }
  if (min === Infinity) return { kind: "continuous", min: 0, max: 1, log: false };
  if (max - min <= CONSTANT_REL_SPREAD * Math.max(Math.abs(min), Math.abs(max))) return { kind: "constant", value: min + (max - min) / 2 };
  const log = min > 0 && max / min > logAbove;
  return { kind: "continuous", min, max, log };
}

/** Bin (0 … bins−1) of a value on a continuous scale; −1 for a missing value. */
export function binOf(scale: Extract<MapScale, { kind: "continuous" }>, v: number, bins = VALUE_GLYPHS.length): number {
  if (!Number.isFinite(v)) return -1;
  let t: number;
  if (scale.log && v > 0) t = (Math.log10(v) - Math.log10(scale.min)) / (Math.log10(scale.max) - Math.log10(scale.min));
  else t = (v - scale.min) / (scale.max - scale.min);
  const b = Math.floor(t * bins);
  return b < 0 ? 0 : b >= bins ? bins - 1 : b;
}

/** Lower edge of bin `b` (b = bins gives the top of the scale). */
export function binEdge(scale: Extract<MapScale, { kind: "continuous" }>, b: number, bins = VALUE_GLYPHS.length): number {
  const t = b / bins;
  if (scale.log) return 10 ** (Math.log10(scale.min) + t * (Math.log10(scale.max) - Math.log10(scale.min)));
  return scale.min + t * (scale.max - scale.min);
}

function categoryGlyph(scale: Extract<MapScale, { kind: "categorical" }>, k: number): string {
  return scale.glyphs?.[k] ?? CATEGORY_GLYPHS[k % CATEGORY_GLYPHS.length];
}

function categoryColour(scale: Extract<MapScale, { kind: "categorical" }>, k: number): string | null {
  if (scale.colours && k < scale.colours.length) return scale.colours[k];
  return CATEGORY_COLOURS[k % CATEGORY_COLOURS.length];
}

export interface LegendOptions {
  missingLabel?: string;
  /** number format of the value labels (default: three significant digits) */
  format?: (v: number) => string;
  /** label each mark with its lower edge only ("· 0.1  : 0.2 …"), the last with its full range */
  compact?: boolean;
}

/** The legend of a scale: every glyph with its colour and the values or category it stands for. */
export function legendOf(scale: MapScale, hasMissing: boolean, options: LegendOptions = {}): LegendEntry[] {
  const fmt = options.format ?? ((v: number) => formatValue(v));
  const out: LegendEntry[] = [];
  if (scale.kind === "constant") {
    out.push({ glyph: CONSTANT_GLYPH, colour: CONSTANT_COLOUR, label: `constant ${fmt(scale.value)}` });
  } else if (scale.kind === "continuous") {
    const last = VALUE_GLYPHS.length - 1;
    for (let b = 0; b <= last; b++) {
      const lo = fmt(binEdge(scale, b));
      const hi = fmt(binEdge(scale, b + 1));
      out.push({ glyph: VALUE_GLYPHS[b], colour: VALUE_COLOURS[b], label: options.compact && b < last ? lo : `${lo} – ${hi}` });
    }
  } else {
    scale.labels.forEach((label, k) => out.push({ glyph: categoryGlyph(scale, k), colour: categoryColour(scale, k), label }));
  }
  if (hasMissing) out.push({ glyph: MISSING_GLYPH, colour: MISSING_COLOUR, label: options.missingLabel ?? "no value" });
  return out;
}

/**
 * Draw the map. `values[c]` belongs to device cell c (lattice indices i[c], j[c]); NaN is a missing
 * value. Cells of the lattice outside the device are blank. With `cursor` (lattice indices), the
 * map cell containing it is drawn as `CURSOR_GLYPH`, inverted.
 * Runs of equal style are merged, so a row is a handful of runs, not one per cell.
 */
export function renderHeatMap(
  lattice: MapLattice,
  values: ArrayLike<number>,
  scale: MapScale,
  summary: BlockSummary,
  layout: MapLayout,
  cursor: { i: number; j: number } | null,
  missingLabel = "no value",
): HeatMapView {
  const { cols, rows, blockX, blockY, cellWidth } = layout;
  const n = cols * rows;
  const inside = new Uint32Array(n); // device cells in the block
  const counted = new Uint32Array(n); // device cells with a value
  const acc = new Float64Array(n); // sum (mean) or max
  if (summary === "max") acc.fill(-Infinity);
  const categories = scale.kind === "categorical" ? scale.labels.length : 0;
  const votes = summary === "mode" && categories > 0 ? new Uint32Array(n * categories) : null;
  let hasMissing = false;
  for (let c = 0; c < lattice.count; c++) {
    const col = Math.floor(lattice.i[c] / blockX);
    const row = Math.floor((lattice.ny - 1 - lattice.j[c]) / blockY);
    if (col < 0 || col >= cols || row < 0 || row >= rows) continue;
    const m = row * cols + col;
    inside[m]++;
    const v = values[c];
    if (!Number.isFinite(v)) {
      hasMissing = true;
      continue;
    }
    counted[m]++;
    if (summary === "mean") acc[m] += v;
    else if (summary === "max") acc[m] = v > acc[m] ? v : acc[m];
    else if (votes) {
      const k = Math.round(v);
      if (k >= 0 && k < categories) votes[m * categories + k]++;
    } else acc[m] += v;
  }
  const cursorCell =
    cursor && cursor.i >= 0 && cursor.j >= 0 && cursor.i < lattice.nx && cursor.j < lattice.ny
      ? { col: Math.floor(cursor.i / blockX), row: Math.floor((lattice.ny - 1 - cursor.j) / blockY) }
      : null;
  const outRows: GlyphRun[][] = [];
  for (let r = 0; r < rows; r++) {
    const runs: GlyphRun[] = [];
    for (let col = 0; col < cols; col++) {
      const m = r * cols + col;
      let glyph = " ";
      let colour: string | null = null;
      if (inside[m] > 0) {
        if (counted[m] === 0) {
          glyph = MISSING_GLYPH;
          colour = MISSING_COLOUR;
        } else if (scale.kind === "constant") {
          glyph = CONSTANT_GLYPH;
          colour = CONSTANT_COLOUR;
        } else if (scale.kind === "continuous") {
          const v = summary === "max" ? acc[m] : acc[m] / counted[m];
          const b = binOf(scale, v);
          glyph = VALUE_GLYPHS[b];
          colour = VALUE_COLOURS[b];
        } else {
          let k = 0;
          if (votes) {
            let best = -1;
            for (let q = 0; q < categories; q++) {
              const count = votes[m * categories + q];
              if (count > best) {
                best = count;
                k = q;
              }
            }
          } else {
            const v = summary === "max" ? acc[m] : acc[m] / counted[m];
            k = Math.min(categories - 1, Math.max(0, Math.round(v)));
          }
          glyph = categoryGlyph(scale, k);
          colour = categoryColour(scale, k);
        }
      }
      const inverse = cursorCell !== null && cursorCell.col === col && cursorCell.row === r;
      const text = (inverse ? CURSOR_GLYPH : glyph).repeat(cellWidth);
      const last = runs[runs.length - 1];
      if (last && last.colour === colour && last.inverse === inverse) last.text += text;
      else runs.push({ text, colour, inverse });
    }
    outRows.push(runs);
  }
  return { layout, rows: outRows, legend: legendOf(scale, hasMissing, { missingLabel }), cursorCell, hasMissing };
}

/** The plain text of a rendered map (no colour), one line per row: what a colour-blind reader sees. */
export function heatMapText(view: HeatMapView): string[] {
  return view.rows.map((runs) => runs.map((r) => r.text).join(""));
}

/**
 * Lattice (nx·ny, row-major in j then i) → device cell index, −1 outside the device.
 * Only the first layer (k = 0) of a 3D grid is indexed.
 */
export function latticeLookup(lattice: MapLattice): Int32Array {
  const out = new Int32Array(lattice.nx * lattice.ny).fill(-1);
  for (let c = 0; c < lattice.count; c++) {
    const idx = lattice.j[c] * lattice.nx + lattice.i[c];
    if (out[idx] === -1) out[idx] = c;
  }
  return out;
}

/**
 * The device cell the cursor stands for: the cell at the cursor's lattice position, or, when that
 * position is outside the device, the device cell of the same map block nearest to it; −1 when
 * the block holds no device cell.
 */
export function cellUnderCursor(
  lattice: MapLattice,
  lookup: Int32Array,
  layout: MapLayout,
  cursor: { i: number; j: number },
): number {
  const { nx, ny } = lattice;
  if (cursor.i < 0 || cursor.j < 0 || cursor.i >= nx || cursor.j >= ny) return -1;
  const direct = lookup[cursor.j * nx + cursor.i];
  if (direct >= 0) return direct;
  const col = Math.floor(cursor.i / layout.blockX);
  const row = Math.floor((ny - 1 - cursor.j) / layout.blockY);
  const i0 = col * layout.blockX;
  const jTop = ny - 1 - row * layout.blockY;
  let best = -1;
  let bestD = Infinity;
  for (let dj = 0; dj < layout.blockY; dj++) {
    const j = jTop - dj;
    if (j < 0) break;
    for (let di = 0; di < layout.blockX; di++) {
      const i = i0 + di;
      if (i >= nx) break;
      const c = lookup[j * nx + i];
      if (c < 0) continue;
      const d = (i - cursor.i) ** 2 + (j - cursor.j) ** 2;
      if (d < bestD) {
        bestD = d;
        best = c;
      }
    }
  }
  return best;
}

/**
 * Move the cursor by (dCol, dRow) map cells (dRow > 0 moves down the screen, toward smaller y),
 * clamped to the lattice. Returns the new lattice position, centred in its map block.
 */
export function moveCursor(
  lattice: { nx: number; ny: number },
  layout: MapLayout,
  cursor: { i: number; j: number },
  dCol: number,
  dRow: number,
): { i: number; j: number } {
  const col = Math.min(layout.cols - 1, Math.max(0, Math.floor(cursor.i / layout.blockX) + dCol));
  const row = Math.min(layout.rows - 1, Math.max(0, Math.floor((lattice.ny - 1 - cursor.j) / layout.blockY) + dRow));
  const i = Math.min(lattice.nx - 1, col * layout.blockX + Math.floor((layout.blockX - 1) / 2));
  const j = Math.max(0, lattice.ny - 1 - (row * layout.blockY + Math.floor((layout.blockY - 1) / 2)));
  return { i, j };
}
