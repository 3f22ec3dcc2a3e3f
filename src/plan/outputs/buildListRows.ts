/**
 * The build list: one CSV row per device cell. This file makes the bytes in chunks (pure); the
 * writer in io/planOutputs.ts streams the chunks to disk, so a 10⁶-cell plan never holds the
 * whole text in memory.
 *
 * Columns: cell, i, j, [k,] x_<u>, y_<u>, [z_<u>,] axis_deg, region, level, target_<c>…,
 * achieved_<c>…, rel_error, quantization_error, zero_target_abs_error, family, host, inclusion,
 * lattice, orientation, fill_fraction, <dimension>_<u>…, loss_tangent, flags — <u> the design's
 * length unit (designUnit.ts: um for optical work, mm otherwise), numbers to 6 significant digits.
 * Per-level columns (recipe, achieved values) are formatted once per level.
 */
import { designUnit, unitColumn } from "./designUnit.js";
import { orientationCode } from "./orientationText.js";
import type { Plan } from "../planTypes.js";
import { flagList } from "../flags.js";
import { csvField, fmt } from "./csvText.js";
import { runEveryBranch, writeFmt } from "./decimalBytes.js";

/** Dimension keys (metres, "radius_m") used by any level's recipe, sorted by name. */
export function dimensionColumns(plan: Plan): string[] {
  const set = new Set<string>();
  for (const lv of plan.levels) if (lv.recipe) for (const k of Object.keys(lv.recipe.dimensions)) set.add(k);
  return [...set].sort();
}

/** The header row (without the line break). */
export function buildListHeader(plan: Plan): string {
  const three = plan.grid.dimension === 3;
  const u = designUnit(plan.design.wavelengthM).suffix;
  const cols = ["cell", "i", "j", ...(three ? ["k"] : []), `x_${u}`, `y_${u}`, ...(three ? [`z_${u}`] : []), "axis_deg", "region", "level"];
  for (const c of plan.components) cols.push(`target_${c.name}`);
  for (const c of plan.components) cols.push(`achieved_${c.name}`);
  cols.push("rel_error", "quantization_error", "zero_target_abs_error", "family", "host", "inclusion", "lattice", "orientation", "fill_fraction");
  cols.push(...dimensionColumns(plan).map((d) => unitColumn(d, designUnit(plan.design.wavelengthM))));
  cols.push("loss_tangent", "flags");
  return cols.join(",");
}

/** Per-level text: the achieved values (",a,b,c") and the recipe columns after the errors. */
function levelTexts(plan: Plan): { achieved: string[]; recipe: string[] } {
  const dims = dimensionColumns(plan);
  const perM = designUnit(plan.design.wavelengthM).perM;
  const achieved: string[] = [];
  const recipe: string[] = [];
  for (const lv of plan.levels) {
    const r = lv.recipe;
    achieved.push(plan.components.map((_, c) => `,${r ? fmt(r.achieved[c]) : ""}`).join(""));
    if (r) {
      const parts = [r.family, r.host, r.inclusion, r.lattice, orientationCode(r)].map(csvField);
      parts.push(fmt(r.fillFraction));
      for (const d of dims) parts.push(d in r.dimensions ? fmt(r.dimensions[d] * perM) : "");
      parts.push(fmt(r.lossTangent, 4));
      recipe.push(`,${parts.join(",")}`);
    } else {
      recipe.push(",".repeat(6 + dims.length + 1));
    }
  }
  return { achieved, recipe };
}

/** Bytes per emitted chunk of the build list (rows are never split between chunks). */
export const BUILD_LIST_CHUNK_BYTES = 1 << 20;

const COMMA = 44, NEWLINE = 10, DIGIT_0 = 48, DIGIT_9 = 57;

/** Room for the cell number's digits (up to 2⁵³). */
const COUNTER_END = 17;

/** Regions up to this many get their number's text made once. */
const MAX_REGION_TEXTS = 1 << 16;

/** A non-negative integer in decimal at `at`; returns the position after it. */
function putInt(buf: Uint8Array, at: number, v: number): number {
  if (v < 10) { buf[at] = DIGIT_0 + v; return at + 1; }
  if (v > 0x7fffffff) return putAscii(buf, at, String(v));
  const end = at + (v < 100 ? 2 : v < 1e3 ? 3 : v < 1e4 ? 4 : v < 1e5 ? 5 : v < 1e6 ? 6 : v < 1e7 ? 7 : v < 1e8 ? 8 : v < 1e9 ? 9 : 10);
  let p = end;
  for (let t = v | 0; t > 0;) {
    const q = (t / 10) | 0;
    buf[--p] = DIGIT_0 + t - q * 10;
    t = q;
  }
  return end;
}

/** ASCII text (numbers) at `at`; returns the position after it. */
function putAscii(buf: Uint8Array, at: number, t: string): number {
  for (let k = 0; k < t.length; k++) buf[at++] = t.charCodeAt(k);
  return at;
}

/** Bytes made once (the header) at `at`; returns the position after them. */
function putBytes(buf: Uint8Array, at: number, b: Uint8Array): number {
  buf.set(b, at);
  return at + b.length;
}

/**
 * A text made once (per-level and per-index texts), kept as little-endian 32-bit words so a row
 * copies it four bytes at a time; up to three bytes past `len` are written too (the next field,
 * or the buffer's slack, takes them).
 */
interface Text { words: Int32Array; len: number }

function makeText(bytes: Uint8Array): Text {
  const padded = new Uint8Array((bytes.length + 3) & ~3);
  padded.set(bytes);
  return { words: new Int32Array(padded.buffer), len: bytes.length };
}

/** `t` at `at` through the buffer's DataView; returns the position after it. */
function putText(view: DataView, at: number, t: Text): number {
  const w = t.words;
  for (let q = 0, n = w.length; q < n; q++) view.setInt32(at + 4 * q, w[q], true);
  return at + t.len;
}

/** `fmt(x, digits)` at `at` without making a string (decimalBytes.ts). */
const putNumber = writeFmt;

/** Most bytes one number takes (fmt's longest: "-1.23457e-100" and then some). */
const NUMBER_BYTES = 24;

/** Everything a row needs besides the cell index: the plan's per-cell arrays and the texts made once. */
interface RowSource {
  three: boolean;
  m: number;
  gi: Int32Array; gj: Int32Array; gk: Int32Array;
  /** "x," "y," "z," and "i," "j," "k," by lattice index */
  xs: Text[]; ys: Text[]; zs: Text[]; is: Text[]; js: Text[]; ks: Text[];
  targets: Float64Array[];
  axisAngleRad: Float64Array; region: Int32Array; level: Int32Array;
  relError: Float64Array; quantizationError: Float64Array; zeroTargetAbsError: Float64Array | null;
  flags: Uint16Array;
  achieved: Text[]; recipe: Text[]; noAchieved: Text; noRecipe: Text;
  /** "r," by region index (null when there are too many regions to list: then written digit by digit) */
  regionTexts: Text[] | null;
  /** "l" by level index */
  levelNumbers: Text[];
  /** scratch for the cell number's digits */
  counter: Uint8Array;
  /** flag text by mask, for every mask that occurs (the empty text elsewhere) */
  flagTexts: Text[];
  /** the previous value of each target column and its bytes (a constant column reuses them) */
  lastTarget: Float64Array; lastLength: Int32Array; lastBytes: Uint8Array;
}

const DEG_PER_RAD = 180 / Math.PI;

/**
 * The flag text of every mask in `flags` (index = mask), the empty text for the rest: made before
 * the rows, so the row loop has no branch that first runs after it was optimized.
 */
function flagTexts(flags: Uint16Array, text: (t: string) => Text): Text[] {
  let most = 0;
  for (let c = 0; c < flags.length; c++) if (flags[c] > most) most = flags[c];
  const none = text("");
  const texts = new Array<Text>(most + 1).fill(none);
  for (let c = 0; c < flags.length; c++) {
    const f = flags[c];
    if (f !== 0 && texts[f] === none) texts[f] = text(flagList(f));
  }
  return texts;
}

/**
 * Rows from cell `from` on into `buf` at `at`, until `at` passes `limit` or the cells run out;
 * returns the cell after the last row written and leaves the end position in `end[0]`. A plain
 * synchronous function with its state in locals and parameters, called once per chunk; texts
 * made once are copied four bytes at a time, the cell number is an ASCII counter.
 */
function fillRows(r: RowSource, buf: Uint8Array, view: DataView, at: number, from: number, count: number, limit: number, end: Int32Array): number {
  const { three, m, gi, gj, gk, xs, ys, zs, is, js, ks, targets, axisAngleRad, region, level, relError, quantizationError, zeroTargetAbsError, flags } = r;
  const { achieved, recipe, noAchieved, noRecipe, flagTexts, lastTarget, lastLength, lastBytes } = r;
  const { regionTexts, levelNumbers, counter } = r;
  // the cell number as ASCII digits ending at counter[COUNTER_END - 1], incremented per row
  const first = String(from + 1);
  let cs = COUNTER_END - first.length;
  for (let q = 0; q < first.length; q++) counter[cs + q] = first.charCodeAt(q);
  end[0] = at;
  let c = from;
  for (; c < count && at < limit; c++) {
    const lv = level[c];
    for (let q = cs; q < COUNTER_END; q++) buf[at++] = counter[q];
    buf[at++] = COMMA;
    let q = COUNTER_END - 1;
    while (counter[q] === DIGIT_9) { counter[q] = DIGIT_0; q--; }
    if (q < cs) { cs = q; counter[q] = DIGIT_0 + 1; } else counter[q]++;
    const i = gi[c], j = gj[c];
    at = putText(view, at, is[i]);
    at = putText(view, at, js[j]);
    if (three) at = putText(view, at, ks[gk[c]]);
    at = putText(view, at, xs[i]);
    at = putText(view, at, ys[j]);
    if (three) at = putText(view, at, zs[gk[c]]);
    at = putNumber(buf, at, axisAngleRad[c] * DEG_PER_RAD, 4); buf[at++] = COMMA;
    if (regionTexts !== null) at = putText(view, at, regionTexts[region[c]]);
    else { at = putInt(buf, at, region[c] + 1); buf[at++] = COMMA; }
    if (lv >= 0) at = putText(view, at, levelNumbers[lv]);
    for (let k = 0; k < m; k++) {
      buf[at++] = COMMA;
      // a value equal to the column's previous one (a constant component) reuses its bytes
      const v = targets[k][c];
      const from = k * NUMBER_BYTES;
      if (v === lastTarget[k]) {
        for (let q = 0, len = lastLength[k]; q < len; q++) buf[at++] = lastBytes[from + q];
      } else {
        const e = putNumber(buf, at, v, 6);
        for (let q = at; q < e; q++) lastBytes[from + q - at] = buf[q];
        lastTarget[k] = v;
        lastLength[k] = e - at;
        at = e;
      }
    }
    at = putText(view, at, lv >= 0 ? achieved[lv] : noAchieved);
    buf[at++] = COMMA; at = putNumber(buf, at, relError[c], 4);
    buf[at++] = COMMA; at = putNumber(buf, at, quantizationError[c], 4);
    buf[at++] = COMMA;
    if (zeroTargetAbsError) at = putNumber(buf, at, zeroTargetAbsError[c], 4);
    at = putText(view, at, lv >= 0 ? recipe[lv] : noRecipe);
    buf[at++] = COMMA;
    at = putText(view, at, flagTexts[flags[c]]);
    buf[at++] = NEWLINE;
    // stored per row, not after the loop: code after a loop that was optimized while running (on-stack
    // replacement) has no type feedback and was thrown away at the end of every chunk
    end[0] = at;
  }
  return c;
}

/** Rows per call of `fillRows`. */
const ROWS_PER_CALL = 32;

/**
 * `fillRows` up to `limit`, a few rows per call: the row loop is then compiled once, as a function
 * between calls, instead of first while one long call runs in the interpreter (on-stack
 * replacement) and then again as a function — each compilation of it costs about 50 ms of CPU.
 */
function fillChunk(r: RowSource, buf: Uint8Array, view: DataView, at: number, from: number, count: number, limit: number, end: Int32Array): number {
  let c = from;
  end[0] = at;
  while (c < count && end[0] < limit) c = fillRows(r, buf, view, end[0], c, Math.min(count, c + ROWS_PER_CALL), limit, end);
  return c;
}

/**
 * Calls `emit` with successive chunks of the build list as UTF-8 bytes (whole rows, about
 * `BUILD_LIST_CHUNK_BYTES` each, the header first). A chunk's bytes stay valid until the promise
 * `emit` returned for it settles (it should settle once the bytes are written); the next chunk is
 * made meanwhile in a second buffer, and the one after waits for it (back-pressure). Rows are
 * written straight into the buffer — no string per row or per number: a 10⁶-row list made by
 * string concatenation spends most of its time flattening and encoding ropes and collecting them.
 */
export async function emitBuildList(plan: Plan, emit: (chunk: Uint8Array) => Promise<void> | void): Promise<void> {
  const g = plan.grid;
  const three = g.dimension === 3;
  // texts that depend on one lattice index or one level each: made once, as UTF-8 bytes
  const encoder = new TextEncoder();
  const enc = (t: string): Uint8Array => encoder.encode(t);
  const perM = designUnit(plan.design.wavelengthM).perM;
  const text = (t: string): Text => makeText(enc(t));
  const xs = Array.from({ length: g.nx }, (_, i) => text(`${fmt((g.originXM + i * g.pitchM) * perM)},`));
  const ys = Array.from({ length: g.ny }, (_, j) => text(`${fmt((g.originYM + j * g.pitchM) * perM)},`));
  const zs = three ? Array.from({ length: g.nz }, (_, k) => text(`${fmt((g.originZM + k * g.pitchM) * perM)},`)) : [];
  const index = (n: number): Text[] => Array.from({ length: n }, (_, i) => text(`${i},`));
  const is = index(g.nx), js = index(g.ny), ks = three ? index(g.nz) : [];
  const texts = levelTexts(plan);
  const achieved = texts.achieved.map(text), recipe = texts.recipe.map(text);
  const m = plan.components.length;
  const noAchieved = text(",".repeat(m));
  // family, host, inclusion, lattice, orientation, fill_fraction, dimensions…, loss_tangent
  const noRecipe = text(",".repeat(6 + dimensionColumns(plan).length + 1));
  const longest = (list: Text[]): number => list.reduce((a, b) => Math.max(a, b.len + 3), 0);
  // the most one row can take (texts with their word padding): the buffer keeps that much room past a chunk
  const rowBytes = 4 * 11 + 10 + longest(xs) + longest(ys) + longest(zs) + longest(is) + longest(js) + longest(ks) + (m + 4) * (NUMBER_BYTES + 1) +
    longest([...achieved, noAchieved]) + longest([...recipe, noRecipe]) + enc(flagList(0xffff)).length + 6;
  const size = BUILD_LIST_CHUNK_BYTES + Math.max(65536, rowBytes);
  const rows: RowSource = {
    three, m, gi: g.i, gj: g.j, gk: g.k, xs, ys, zs,
    is, js, ks, targets: plan.targets, axisAngleRad: plan.axisAngleRad, region: plan.region, level: plan.level,
    relError: plan.relError, quantizationError: plan.quantizationError, zeroTargetAbsError: plan.zeroTargetAbsError,
    flags: plan.flags, achieved, recipe, noAchieved, noRecipe, flagTexts: flagTexts(plan.flags, text),
    regionTexts: plan.regions.length <= MAX_REGION_TEXTS ? Array.from({ length: plan.regions.length }, (_, k) => text(`${k + 1},`)) : null,
    levelNumbers: plan.levels.map((_, k) => text(`${k + 1}`)), counter: new Uint8Array(COUNTER_END),
    lastTarget: new Float64Array(m).fill(NaN), lastLength: new Int32Array(m), lastBytes: new Uint8Array(m * NUMBER_BYTES),
  };
  // two buffers in turn: the caller may hold one until its emit promise settles
  let buf: Uint8Array = new Uint8Array(size);
  let spare: Uint8Array | null = null;
  let at = 0;
  let inFlight: Promise<void> | undefined;
  const flush = async (): Promise<void> => {
    const sent = Promise.resolve(emit(buf.subarray(0, at)));
    sent.catch(() => undefined); // a failure is thrown where it is awaited, below or at the end
    const next: Uint8Array = spare ?? new Uint8Array(size);
    spare = buf;
    buf = next;
    at = 0;
    await inFlight; // the buffer now being filled was the one of the chunk before
    inFlight = sent;
  };
  const header = enc(`${buildListHeader(plan)}\n`);
  if (header.length > buf.length) buf = new Uint8Array(header.length);
  at = putBytes(buf, at, header);
  if (at >= BUILD_LIST_CHUNK_BYTES) await flush();
  runEveryBranch(buf.subarray(at));
  const end = new Int32Array(1);
  const views = new WeakMap<Uint8Array, DataView>();
  const viewOf = (b: Uint8Array): DataView => {
    let v = views.get(b);
    if (!v) { v = new DataView(b.buffer, b.byteOffset, b.byteLength); views.set(b, v); }
    return v;
  };
  for (let c = 0; c < g.count;) {
    c = fillChunk(rows, buf, viewOf(buf), at, c, g.count, BUILD_LIST_CHUNK_BYTES, end);
    at = end[0];
    if (at >= BUILD_LIST_CHUNK_BYTES) await flush();
  }
  if (at > 0) await flush();
  await inFlight;
}
