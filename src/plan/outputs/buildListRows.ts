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

/**
 * ASCII text into a byte buffer without building strings: a 10⁶-row build list made by string
 * concatenation spends most of its time flattening and encoding ropes (and in the garbage
 * collector). Characters above 127 (never in ids or numbers, possible in a custom catalog) are
 * UTF-8 encoded.
 */
class RowBytes {
  buf: Uint8Array = new Uint8Array(BUILD_LIST_CHUNK_BYTES + 65536);
  at = 0;
  private encoder: InstanceType<typeof TextEncoder> | null = null;

  text(s: string): void {
    const n = s.length;
    if (this.at + 3 * n > this.buf.length) this.grow(3 * n);
    const buf = this.buf;
    let at = this.at;
    for (let k = 0; k < n; k++) {
      const ch = s.charCodeAt(k);
      if (ch > 127) {
        this.at = at;
        this.encoder ??= new TextEncoder();
        this.at += this.encoder.encodeInto(s.slice(k), buf.subarray(at)).written;
        return;
      }
      buf[at++] = ch;
    }
    this.at = at;
  }

  /** A non-negative integer in decimal. */
  int(v: number): void {
    if (this.at + 16 > this.buf.length) this.grow(16);
    const buf = this.buf;
    if (v < 10) {
      buf[this.at++] = 48 + v;
      return;
    }
    if (v > 0x7fffffff) {
      this.text(String(v));
      return;
    }
    let at = this.at + (v < 100 ? 2 : v < 1e3 ? 3 : v < 1e4 ? 4 : v < 1e5 ? 5 : v < 1e6 ? 6 : v < 1e7 ? 7 : v < 1e8 ? 8 : v < 1e9 ? 9 : 10);
    this.at = at;
    for (let t = v | 0; t > 0; ) {
      const q = (t / 10) | 0;
      buf[--at] = 48 + t - q * 10;
      t = q;
    }
  }

  /** Bytes made once (per-level and per-index texts). */
  bytes(b: Uint8Array): void {
    const n = b.length;
    if (this.at + n > this.buf.length) this.grow(n);
    const buf = this.buf;
    let at = this.at;
    for (let k = 0; k < n; k++) buf[at++] = b[k];
    this.at = at;
  }

  /** `fmt(x, digits)` without making a string (decimalBytes.ts; `fmt` where it cannot promise the same bytes). */
  num(x: number, digits: number): void {
    if (this.at + 32 > this.buf.length) this.grow(32);
    if (x === 0) { this.buf[this.at++] = 48; return; }
    if (!Number.isFinite(x)) return;
    const end = writeDecimal(this.buf, this.at, x, digits);
    if (end >= 0) this.at = end;
    else this.text(fmt(x, digits));
  }

  byte(b: number): void {
    if (this.at + 1 > this.buf.length) this.grow(1);
    this.buf[this.at++] = b;
  }

  private grow(extra: number): void {
    const next = new Uint8Array(Math.max(2 * this.buf.length, this.at + extra));
    next.set(this.buf.subarray(0, this.at));
    this.buf = next;
  }

  /**
   * The bytes so far, then empty, writing on into the other of two buffers: the caller may hold
   * the returned view until its emit promise settles (while the next chunk is made), and the
   * buffers are reused instead of touching fresh memory for every chunk.
   */
  take(): Uint8Array {
    const out = this.buf.subarray(0, this.at);
    const other = this.spare;
    this.spare = this.buf;
    this.buf = other ?? new Uint8Array(this.spare.length);
    this.at = 0;
    return out;
  }

  private spare: Uint8Array | null = null;
}

const COMMA = 44, NEWLINE = 10;

/**
 * Calls `emit` with successive chunks of the build list as UTF-8 bytes (whole rows, about
 * `BUILD_LIST_CHUNK_BYTES` each, the header first). A chunk's bytes stay valid until the promise
 * `emit` returned for it settles (it should settle once the bytes are written); the next chunk is
 * made meanwhile, and the one after waits for it (back-pressure).
 */
export async function emitBuildList(plan: Plan, emit: (chunk: Uint8Array) => Promise<void> | void): Promise<void> {
  const g = plan.grid;
  const three = g.dimension === 3;
  const out = new RowBytes();
  let inFlight: Promise<void> | undefined;
  const flush = async (): Promise<void> => {
    const sent = Promise.resolve(emit(out.take()));
    sent.catch(() => undefined); // a failure is thrown where it is awaited, below or at the end
    await inFlight; // the buffer now being filled was the one of the chunk before
    inFlight = sent;
  };
  out.text(`${buildListHeader(plan)}\n`);
  // texts that depend on one lattice index or one level each: made once, as bytes
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
  const degPerRad = 180 / Math.PI;
  const { targets, axisAngleRad, region, relError, quantizationError, zeroTargetAbsError, flags } = plan;
  for (let c = 0; c < g.count; c++) {
    const lv = plan.level[c];
    const gi = g.i[c], gj = g.j[c];
    out.int(c + 1); out.byte(COMMA);
    out.int(gi); out.byte(COMMA);
    out.int(gj); out.byte(COMMA);
    if (three) { out.int(g.k[c]); out.byte(COMMA); }
    out.bytes(xs[gi]);
    out.bytes(ys[gj]);
    if (three) out.bytes(zs[g.k[c]]);
    out.num(axisAngleRad[c] * degPerRad, 4); out.byte(COMMA);
    out.int(region[c] + 1); out.byte(COMMA);
    if (lv >= 0) out.int(lv + 1);
    for (let k = 0; k < m; k++) { out.byte(COMMA); out.num(targets[k][c], 6); }
    out.bytes(lv >= 0 ? achieved[lv] : noAchieved);
    out.byte(COMMA); out.num(relError[c], 4);
    out.byte(COMMA); out.num(quantizationError[c], 4);
    out.byte(COMMA); out.num(zeroTargetAbsError[c], 4);
    out.bytes(lv >= 0 ? recipe[lv] : noRecipe);
    out.byte(COMMA);
    const f = flags[c];
    if (f !== 0) {
      let t = flagBytes.get(f);
      if (t === undefined) { t = enc(flagList(f)); flagBytes.set(f, t); }
      out.bytes(t);
    }
    out.byte(NEWLINE);
    if (out.at >= BUILD_LIST_CHUNK_BYTES) await flush();
  }
  if (out.at > 0) await flush();
  await inFlight;
}
