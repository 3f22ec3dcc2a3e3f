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
import { writeDecimal } from "./decimalBytes.js";

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

const COMMA = 44, NEWLINE = 10, DIGIT_0 = 48;

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

/** Bytes made once (per-level and per-index texts) at `at`; returns the position after them. */
function putBytes(buf: Uint8Array, at: number, b: Uint8Array): number {
  for (let k = 0; k < b.length; k++) buf[at++] = b[k];
  return at;
}

/** `fmt(x, digits)` at `at` without making a string (decimalBytes.ts; `fmt` where it cannot promise the same bytes). */
function putNumber(buf: Uint8Array, at: number, x: number, digits: number): number {
  if (x === 0) { buf[at] = DIGIT_0; return at + 1; }
  if (!Number.isFinite(x)) return at;
  const end = writeDecimal(buf, at, x, digits);
  return end >= 0 ? end : putAscii(buf, at, fmt(x, digits));
}

/** Most bytes one number takes (fmt's longest: "-1.23457e-100" and then some). */
const NUMBER_BYTES = 24;

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
  const xs = Array.from({ length: g.nx }, (_, i) => enc(`${fmt((g.originXM + i * g.pitchM) * perM)},`));
  const ys = Array.from({ length: g.ny }, (_, j) => enc(`${fmt((g.originYM + j * g.pitchM) * perM)},`));
  const zs = three ? Array.from({ length: g.nz }, (_, k) => enc(`${fmt((g.originZM + k * g.pitchM) * perM)},`)) : [];
  const texts = levelTexts(plan);
  const achieved = texts.achieved.map(enc), recipe = texts.recipe.map(enc);
  const m = plan.components.length;
  const noAchieved = enc(",".repeat(m));
  // family, host, inclusion, lattice, orientation, fill_fraction, dimensions…, loss_tangent
  const noRecipe = enc(",".repeat(6 + dimensionColumns(plan).length + 1));
  const flagBytes = new Map<number, Uint8Array>();
  const longest = (list: Uint8Array[]): number => list.reduce((a, b) => Math.max(a, b.length), 0);
  // the most one row can take: the buffer keeps that much room past a chunk
  const rowBytes = 4 * 11 + 10 + longest(xs) + longest(ys) + longest(zs) + (m + 4) * (NUMBER_BYTES + 1) +
    longest([...achieved, noAchieved]) + longest([...recipe, noRecipe]) + enc(flagList(0xffff)).length + 2;
  const size = BUILD_LIST_CHUNK_BYTES + Math.max(65536, rowBytes);
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
  const degPerRad = 180 / Math.PI;
  const { targets, axisAngleRad, region, relError, quantizationError, zeroTargetAbsError, flags, level } = plan;
  const gi = g.i, gj = g.j, gk = g.k;
  for (let c = 0; c < g.count; c++) {
    const lv = level[c];
    at = putInt(buf, at, c + 1); buf[at++] = COMMA;
    at = putInt(buf, at, gi[c]); buf[at++] = COMMA;
    at = putInt(buf, at, gj[c]); buf[at++] = COMMA;
    if (three) { at = putInt(buf, at, gk[c]); buf[at++] = COMMA; }
    at = putBytes(buf, at, xs[gi[c]]);
    at = putBytes(buf, at, ys[gj[c]]);
    if (three) at = putBytes(buf, at, zs[gk[c]]);
    at = putNumber(buf, at, axisAngleRad[c] * degPerRad, 4); buf[at++] = COMMA;
    at = putInt(buf, at, region[c] + 1); buf[at++] = COMMA;
    if (lv >= 0) at = putInt(buf, at, lv + 1);
    for (let k = 0; k < m; k++) { buf[at++] = COMMA; at = putNumber(buf, at, targets[k][c], 6); }
    at = putBytes(buf, at, lv >= 0 ? achieved[lv] : noAchieved);
    buf[at++] = COMMA; at = putNumber(buf, at, relError[c], 4);
    buf[at++] = COMMA; at = putNumber(buf, at, quantizationError[c], 4);
    buf[at++] = COMMA; at = putNumber(buf, at, zeroTargetAbsError[c], 4);
    at = putBytes(buf, at, lv >= 0 ? recipe[lv] : noRecipe);
    buf[at++] = COMMA;
    const f = flags[c];
    if (f !== 0) {
      let t = flagBytes.get(f);
      if (t === undefined) { t = enc(flagList(f)); flagBytes.set(f, t); }
      at = putBytes(buf, at, t);
    }
    buf[at++] = NEWLINE;
    if (at >= BUILD_LIST_CHUNK_BYTES) await flush();
  }
  if (at > 0) await flush();
  await inFlight;
}
