/**
 * Binary STL writer (3D printing): the printed part of plan/layout/printedPart.ts in millimetres.
 * Format (the de-facto binary STL layout): an 80-byte header (text, never starting with "solid"),
 * a little-endian uint32 triangle count, then per triangle 12 float32 (facet normal, three
 * vertices, counter-clockwise seen from outside) and a uint16 attribute byte count of 0.
 * Written here rather than with @jscad/stl-serializer because that serializer takes a whole
 * geometry of polygon objects (hundreds of bytes a triangle held at once), where this streams the
 * part cell by cell into one reused 1 MB buffer; the format is four lines of arithmetic.
 *
 * The size is known before anything is written (84 + 50 bytes per triangle, from the part's exact
 * count): `stlEstimate` gives it and `STL_MAX_BYTES` is the largest file written (a limit of our own:
 * above it the command refuses with the estimate instead of writing gigabytes).
 */
import type { PrintedPart } from "../../plan/layout/printedPart.js";

export const STL_MAX_BYTES = 256 * 1024 * 1024;
const CHUNK_TRIANGLES = 20_000;

export function stlBytesFor(triangles: number): number {
  return 84 + 50 * triangles;
}

/** The STL's bytes as chunks (the buffer is reused: consume each chunk before asking for the next). */
export function* stlChunks(part: PrintedPart, title: string): Generator<Uint8Array> {
  const head = new Uint8Array(84);
  const text = `binary STL, millimetres: printed part of ${title}`.replace(/[^\x20-\x7e]/g, "?").slice(0, 80);
  for (let k = 0; k < text.length; k++) head[k] = text.charCodeAt(k);
  new DataView(head.buffer).setUint32(80, part.triangles, true);
  yield head;
  let cap = CHUNK_TRIANGLES;
  for (const n of part.cellTriangles) cap = Math.max(cap, n);
  const buf = new Uint8Array(50 * cap);
  const v = new DataView(buf.buffer);
  const f = new Float32Array(9);
  let count = 0;
  const sink = (ax: number, ay: number, az: number, bx: number, by: number, bz: number, cx: number, cy: number, cz: number): void => {
    f[0] = ax * 1e3; f[1] = ay * 1e3; f[2] = az * 1e3; f[3] = bx * 1e3; f[4] = by * 1e3; f[5] = bz * 1e3; f[6] = cx * 1e3; f[7] = cy * 1e3; f[8] = cz * 1e3;
    const ux = f[3] - f[0], uy = f[4] - f[1], uz = f[5] - f[2], wx = f[6] - f[0], wy = f[7] - f[1], wz = f[8] - f[2];
    let nx = uy * wz - uz * wy, ny = uz * wx - ux * wz, nz = ux * wy - uy * wx;
    const l = Math.sqrt(nx * nx + ny * ny + nz * nz);
    if (l > 0) { nx /= l; ny /= l; nz /= l; } else { nx = 0; ny = 0; nz = 0; }
    const o = 50 * count++;
    v.setFloat32(o, nx, true); v.setFloat32(o + 4, ny, true); v.setFloat32(o + 8, nz, true);
    for (let k = 0; k < 9; k++) v.setFloat32(o + 12 + 4 * k, f[k], true);
    v.setUint16(o + 48, 0, true);
  };
  let from = 0;
  const cells = part.cellTriangles.length;
  while (from < cells) {
    let to = from, n = 0;
    while (to < cells && n + part.cellTriangles[to] <= cap) n += part.cellTriangles[to++];
    count = 0;
    part.emit(from, to, sink);
    if (count !== n) throw new Error(`stl: cells ${from + 1}–${to} gave ${count} triangles, counted ${n}`);
    if (count) yield buf.subarray(0, 50 * count);
    from = to;
  }
}
