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
import { NUMBER_ROOM, runEveryBranch, writeFmt } from "./decimalBytes.js";
import { HOST_LITTLE_ENDIAN, makeTextPool } from "./textPool.js";

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

/**
 * How many texts the build list makes once: regions up to `regions` get their number's text (with
 * their level's), pairs of level and flag mask up to `tails` the row's end as one text. Past
 * either, those columns are written in parts (same bytes); tests lower them to reach that path.
 */
export interface BuildListTextLimits { regions: number; tails: number }

export const BUILD_LIST_TEXT_LIMITS: BuildListTextLimits = { regions: 1 << 16, tails: 1 << 14 };

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

/** Text `id` of the pool at `at` through the buffer's DataView; returns the position after it. */
function putText(view: DataView, at: number, words: Float64Array, start: Int32Array, length: Int32Array, id: number): number {
  const len = length[id];
  for (let q = start[id], n = q + ((len + 7) >> 3), p = at; q < n; q++, p += 8) view.setFloat64(p, words[q], HOST_LITTLE_ENDIAN);
  return at + len;
}

/** `fmt(x, digits)` at `at` without making a string (decimalBytes.ts). */
const putNumber = writeFmt;

/**
 * Everything a row needs besides the cell index: the plan's per-cell arrays and the ids of the
 * texts made once (textPool.ts); a text that depends on an index has the id `first + index`.
 */
interface RowSource {
  three: boolean;
  m: number;
  gi: Int32Array; gj: Int32Array; gk: Int32Array;
  targets: Float64Array[];
  axisAngleRad: Float64Array; region: Int32Array; level: Int32Array;
  relError: Float64Array; quantizationError: Float64Array; zeroTargetAbsError: Float64Array | null;
  flags: Uint16Array;
  words: Float64Array; start: Int32Array; length: Int32Array;
  /** "i," "j," "k," and "x," "y," "z," by lattice index */
  firstI: number; firstJ: number; firstK: number; firstX: number; firstY: number; firstZ: number;
  /** ",a,b,c" (achieved values) by level; the empty one for no level */
  firstAchieved: number; noAchieved: number;
  /**
   * "r,l" (region and its level) by region index, when every cell's level is its region's; -1 when
   * not, or when there are too many regions to list: then the region is written digit by digit and
   * "l" is text `firstLevel + level`
   */
  firstRegion: number;
  firstLevel: number;
  /**
   * The row's end — recipe columns, flags, line break — by level and flag mask: text
   * `firstTail + (level + 1) · masks + maskIndex[mask]` (level −1: no recipe). When there would be
   * more than `MAX_TAIL_TEXTS` of them, `masks` is 0 and the end is written in parts: text
   * `firstTail + level + 1` (the recipe columns), a comma, text `firstFlags + maskIndex[mask]`, a
   * line break.
   */
  firstTail: number; masks: number; maskIndex: Int32Array; firstFlags: number;
  /** scratch for the cell number's digits */
  counter: Uint8Array;
  /**
   * the previous value of each target column and where its bytes are in the buffer being filled (a
   * constant column copies them); `fillChunk` forgets them when it starts a buffer
   */
  lastTarget: Float64Array; lastAt: Int32Array; lastLength: Int32Array;
}

const DEG_PER_RAD = 180 / Math.PI;

/**
 * Rows from cell `from` on into `buf` at `at`, until `at` passes `limit` or the cells run out;
 * returns the cell after the last row written and leaves the end position in `end[0]`. A plain
 * synchronous function with its state in locals and parameters, called once per chunk; texts
 * made once are copied eight bytes at a time from the pool, the cell number is an ASCII counter.
 */
function fillRows(r: RowSource, buf: Uint8Array, view: DataView, at: number, from: number, count: number, limit: number, end: Int32Array): number {
  const { three, m, gi, gj, gk, targets, axisAngleRad, region, level, relError, quantizationError, zeroTargetAbsError, flags } = r;
  const { words, start, length, firstI, firstJ, firstK, firstX, firstY, firstZ, firstAchieved, noAchieved } = r;
  const { firstRegion, firstLevel, firstTail, masks, maskIndex, firstFlags, counter, lastTarget, lastAt, lastLength } = r;
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
    at = putText(view, at, words, start, length, firstI + i);
    at = putText(view, at, words, start, length, firstJ + j);
    if (three) at = putText(view, at, words, start, length, firstK + gk[c]);
    at = putText(view, at, words, start, length, firstX + i);
    at = putText(view, at, words, start, length, firstY + j);
    if (three) at = putText(view, at, words, start, length, firstZ + gk[c]);
    at = putNumber(buf, view, at, axisAngleRad[c] * DEG_PER_RAD, 4); buf[at++] = COMMA;
    if (firstRegion >= 0) at = putText(view, at, words, start, length, firstRegion + region[c]);
    else {
      at = putInt(buf, at, region[c] + 1); buf[at++] = COMMA;
      if (lv >= 0) at = putText(view, at, words, start, length, firstLevel + lv);
    }
    for (let k = 0; k < m; k++) {
      buf[at++] = COMMA;
      // a value equal to the column's previous one (a constant component) reuses its bytes
      const v = targets[k][c];
      if (v === lastTarget[k]) {
        for (let q = lastAt[k], n = q + lastLength[k]; q < n; q++) buf[at++] = buf[q];
      } else {
        const e = putNumber(buf, view, at, v, 6);
        lastTarget[k] = v;
        lastAt[k] = at;
        lastLength[k] = e - at;
        at = e;
      }
    }
    at = putText(view, at, words, start, length, lv >= 0 ? firstAchieved + lv : noAchieved);
    buf[at++] = COMMA; at = putNumber(buf, view, at, relError[c], 4);
    buf[at++] = COMMA; at = putNumber(buf, view, at, quantizationError[c], 4);
    buf[at++] = COMMA;
    if (zeroTargetAbsError) at = putNumber(buf, view, at, zeroTargetAbsError[c], 4);
    if (masks > 0) at = putText(view, at, words, start, length, firstTail + (lv + 1) * masks + maskIndex[flags[c]]);
    else {
      at = putText(view, at, words, start, length, firstTail + lv + 1);
      buf[at++] = COMMA;
      at = putText(view, at, words, start, length, firstFlags + maskIndex[flags[c]]);
      buf[at++] = NEWLINE;
    }
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
  r.lastTarget.fill(NaN); // their bytes were in the buffer before
  let c = from;
  end[0] = at;
  while (c < count && end[0] < limit) c = fillRows(r, buf, view, end[0], c, Math.min(count, c + ROWS_PER_CALL), limit, end);
  return c;
}

/** The texts a build list's rows copy, pooled, with the ids the row loop needs. */
function rowTexts(plan: Plan, limits: BuildListTextLimits): Pick<RowSource, "words" | "start" | "length" | "firstI" | "firstJ" | "firstK" | "firstX" | "firstY" | "firstZ" | "firstAchieved" | "noAchieved" | "firstRegion" | "firstLevel" | "firstTail" | "masks" | "maskIndex" | "firstFlags"> & { longest: number } {
  const g = plan.grid;
  const three = g.dimension === 3;
  const encoder = new TextEncoder();
  const texts: Uint8Array[] = [];
  /** adds `list`; returns the first one's id */
  const add = (list: readonly string[]): number => {
    const first = texts.length;
    for (const t of list) texts.push(encoder.encode(t));
    return first;
  };
  const perM = designUnit(plan.design.wavelengthM).perM;
  const coordinates = (n: number, originM: number): string[] => Array.from({ length: n }, (_, i) => `${fmt((originM + i * g.pitchM) * perM)},`);
  const index = (n: number): string[] => Array.from({ length: n }, (_, i) => `${i},`);
  const level = levelTexts(plan);
  const m = plan.components.length;
  const firstI = add(index(g.nx)), firstJ = add(index(g.ny)), firstK = add(three ? index(g.nz) : []);
  const firstX = add(coordinates(g.nx, g.originXM)), firstY = add(coordinates(g.ny, g.originYM)), firstZ = add(three ? coordinates(g.nz, g.originZM) : []);
  const firstAchieved = add(level.achieved);
  const noAchieved = add([",".repeat(m)]);
  // family, host, inclusion, lattice, orientation, fill_fraction, dimensions…, loss_tangent
  const noRecipe = ",".repeat(6 + dimensionColumns(plan).length + 1);
  const firstLevel = add(plan.levels.map((_, k) => `${k + 1}`));
  // "r,l" when every cell's level is its region's (the plan finds regions within one level)
  let regionsHoldLevels = plan.regions.length <= limits.regions;
  if (regionsHoldLevels) {
    // by a typed table of the regions' levels, not an object per cell: 10⁶ cells in 1–2 ms
    const regionLevel = Int32Array.from(plan.regions, (rg) => rg.level - 1);
    const { level: cellLevel, region } = plan;
    for (let c = 0; c < cellLevel.length; c++) if (cellLevel[c] !== regionLevel[region[c]]) { regionsHoldLevels = false; break; }
  }
  const firstRegion = regionsHoldLevels ? add(plan.regions.map((rg, k) => `${k + 1},${rg.level > 0 ? rg.level : ""}`)) : -1;
  // the row's end by level and flag mask, for every mask that occurs (mask index 0: no flags)
  const maskIndex = new Int32Array(1 << 16); // flags are 16-bit masks: one pass over the cells
  const flagTexts = [""];
  const { flags } = plan;
  for (let c = 0; c < flags.length; c++) {
    const f = flags[c];
    if (f !== 0 && maskIndex[f] === 0) { maskIndex[f] = flagTexts.length; flagTexts.push(flagList(f)); }
  }
  const recipes = [noRecipe, ...level.recipe];
  const byPair = recipes.length * flagTexts.length <= limits.tails;
  const firstTail = texts.length;
  if (byPair) for (const recipe of recipes) add(flagTexts.map((f) => `${recipe},${f}\n`));
  else add(recipes);
  const firstFlags = byPair ? -1 : add(flagTexts);
  const pool = makeTextPool(texts);
  // the most bytes one text writes (its word padding included)
  let longest = 0;
  for (let id = 0; id < texts.length; id++) longest = Math.max(longest, 8 * ((pool.length[id] + 7) >> 3));
  return { ...pool, firstI, firstJ, firstK, firstX, firstY, firstZ, firstAchieved, noAchieved, firstRegion, firstLevel, firstTail, masks: byPair ? flagTexts.length : 0, maskIndex, firstFlags, longest };
}

/**
 * Calls `emit` with successive chunks of the build list as UTF-8 bytes (whole rows, about
 * `BUILD_LIST_CHUNK_BYTES` each, the header first). A chunk's bytes stay valid until the promise
 * `emit` returned for it settles (it should settle once the bytes are written); the next chunk is
 * made meanwhile in a second buffer, and the one after waits for it (back-pressure). Rows are
 * written straight into the buffer — no string per row or per number: a 10⁶-row list made by
 * string concatenation spends most of its time flattening and encoding ropes and collecting them.
 */
export async function emitBuildList(plan: Plan, emit: (chunk: Uint8Array) => Promise<void> | void, limits: BuildListTextLimits = BUILD_LIST_TEXT_LIMITS): Promise<void> {
  const g = plan.grid;
  const three = g.dimension === 3;
  const m = plan.components.length;
  const texts = rowTexts(plan, limits);
  // the most one row can take: at most 11 texts (with their word padding), the cell number, m + 4
  // numbers, the commas between, a region number written digit by digit
  const rowBytes = 11 * texts.longest + COUNTER_END + (m + 4) * (NUMBER_ROOM + 1) + 32;
  const size = BUILD_LIST_CHUNK_BYTES + Math.max(65536, rowBytes);
  const rows: RowSource = {
    three, m, gi: g.i, gj: g.j, gk: g.k,
    targets: plan.targets, axisAngleRad: plan.axisAngleRad, region: plan.region, level: plan.level,
    relError: plan.relError, quantizationError: plan.quantizationError, zeroTargetAbsError: plan.zeroTargetAbsError,
    flags: plan.flags, ...texts, counter: new Uint8Array(COUNTER_END),
    lastTarget: new Float64Array(m).fill(NaN), lastAt: new Int32Array(m), lastLength: new Int32Array(m),
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
  const header = new TextEncoder().encode(`${buildListHeader(plan)}\n`);
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
