/**
 * GDSII stream writer (lithography). Written here because no general-purpose GDSII writer is
 * published on npm; it follows the published stream format (Calma GDSII Stream Format Manual,
 * release 6.0, 1987): big-endian records of a 2-byte length, a record type and a data type.
 *
 * What we write: HEADER (version 600), BGNLIB, LIBNAME "CELLWRIGHT", UNITS (a database unit of
 * 1 nm; the user unit is 1 µm, so 0.001 user units per database unit), one structure named
 * "DEVICE" holding every shape FLATTENED (no references), each cell's shape one BOUNDARY on
 * LAYER = its level number, DATATYPE 0, its XY closed by repeating the first point (circles are
 * 64-vertex polygons: plan/layout/layoutShapes.ts), then ENDSTR and ENDLIB. Coordinates are the
 * build list's positions in nanometres, rounded to the database unit. The dates in BGNLIB and
 * BGNSTR are fixed (2000-01-01) so the same plan gives the same bytes.
 */
import type { Layout } from "../../plan/layout/layoutShapes.js";

/** Database unit, metres. */
export const GDS_DB_UNIT_M = 1e-9;
/** User unit, metres (1 µm). */
export const GDS_USER_UNIT_M = 1e-6;
export const GDS_STRUCTURE = "DEVICE";

/** GDSII 8-byte real: sign, 7-bit excess-64 base-16 exponent, 56-bit mantissa (manual, ch. 3). */
export function gdsReal8(x: number): Uint8Array {
  const out = new Uint8Array(8);
  if (x === 0) return out;
  let sign = 0;
  if (x < 0) { sign = 0x80; x = -x; }
  let exp = 64;
  while (x >= 1) { x /= 16; exp++; }
  while (x < 1 / 16) { x *= 16; exp--; }
  // x in [1/16, 1): mantissa = x · 2^56
  let m = BigInt(Math.round(x * 2 ** 53)) << 3n;
  out[0] = sign | exp;
  for (let k = 7; k >= 1; k--) { out[k] = Number(m & 0xffn); m >>= 8n; }
  return out;
}

class Records {
  private chunks: Uint8Array[] = [];
  size = 0;
  push(type: number, dataType: number, body: Uint8Array = new Uint8Array(0)): void {
    const len = 4 + body.length;
    if (len > 0xffff) throw new Error(`GDSII record too long (${len} bytes)`);
    const head = new Uint8Array(4);
    new DataView(head.buffer).setUint16(0, len);
    head[2] = type;
    head[3] = dataType;
    this.chunks.push(head, body);
    this.size += len;
  }
  int16(type: number, values: number[]): void {
    const b = new Uint8Array(2 * values.length);
    const v = new DataView(b.buffer);
    values.forEach((x, k) => v.setInt16(2 * k, x));
    this.push(type, 0x02, b);
  }
  int32(type: number, values: ArrayLike<number>): void {
    const b = new Uint8Array(4 * values.length);
    const v = new DataView(b.buffer);
    for (let k = 0; k < values.length; k++) v.setInt32(4 * k, values[k]);
    this.push(type, 0x03, b);
  }
  ascii(type: number, s: string): void {
    const padded = s.length % 2 ? `${s}\0` : s;
    this.push(type, 0x06, Uint8Array.from(padded, (ch) => ch.charCodeAt(0)));
  }
  bytes(): Uint8Array {
    const out = new Uint8Array(this.size);
    let o = 0;
    for (const c of this.chunks) { out.set(c, o); o += c.length; }
    return out;
  }
}

const DATE = [2000, 1, 1, 0, 0, 0];

/** The layout as a GDSII stream (bytes). */
export function gdsiiBytes(layout: Layout): Uint8Array {
  const r = new Records();
  r.int16(0x00, [600]); // HEADER
  r.int16(0x01, [...DATE, ...DATE]); // BGNLIB
  r.ascii(0x02, "CELLWRIGHT"); // LIBNAME
  const units = new Uint8Array(16);
  units.set(gdsReal8(GDS_DB_UNIT_M / GDS_USER_UNIT_M), 0);
  units.set(gdsReal8(GDS_DB_UNIT_M), 8);
  r.push(0x03, 0x05, units); // UNITS
  r.int16(0x05, [...DATE, ...DATE]); // BGNSTR
  r.ascii(0x06, GDS_STRUCTURE); // STRNAME
  for (const lv of layout.levels) {
    for (const p of lv.polygons) {
      const n = p.xy.length / 2;
      const xy = new Int32Array(2 * (n + 1));
      for (let k = 0; k < n; k++) {
        xy[2 * k] = Math.round(p.xy[2 * k] / GDS_DB_UNIT_M);
        xy[2 * k + 1] = Math.round(p.xy[2 * k + 1] / GDS_DB_UNIT_M);
      }
      xy[2 * n] = xy[0];
      xy[2 * n + 1] = xy[1];
      r.push(0x08, 0x00); // BOUNDARY
      r.int16(0x0d, [lv.level]); // LAYER
      r.int16(0x0e, [0]); // DATATYPE
      r.int32(0x10, xy); // XY
      r.push(0x11, 0x00); // ENDEL
    }
  }
  r.push(0x07, 0x00); // ENDSTR
  r.push(0x04, 0x00); // ENDLIB
  return r.bytes();
}
