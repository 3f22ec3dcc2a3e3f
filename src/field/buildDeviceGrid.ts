/**
 * The lattice of square (2D) or cubic (3D) cells of one pitch covering a device's bounding box;
 * a cell belongs to the device when its centre lies in the device region. One lattice cell centre
 * sits at `origin` (default: the centre of the bounding box).
 */
import { InputError } from "../core/errors.js";
import type { DeviceGrid } from "./deviceGrid.js";
import type { Bounds3 } from "./transforms/transform.js";
import { formatCount } from "../core/formatQuantity.js";
import type { FieldBuffers } from "./fieldBuffers.js";

/** Largest bounding-box lattice we are willing to scan (cells). */
export const MAX_LATTICE_CELLS = 5e7;

export interface GridRequest {
  pitchM: number;
  origin?: [number, number];
  /** 3: full 3D lattice; 2: the z = 0 plane only */
  dimension: 2 | 3;
  /** where to blame in messages, e.g. "design.json: $.grid.pitch" */
  where: string;
  /** reuse these for the index arrays (fieldBuffers.ts; the grid is then valid until their next use) */
  buffers?: FieldBuffers;
}

function axis(min: number, max: number, centre: number, pitch: number): { first: number; n: number } {
  const first = Math.ceil((min - centre) / pitch - 0.5 - 1e-9);
  const last = Math.floor((max - centre) / pitch + 0.5 + 1e-9);
  return { first, n: Math.max(0, last - first + 1) };
}

/** A row of the point test at once: out[i] = contains(x0M + i·pitchM, yM, zM) ? 1 : 0. */
export type ContainsRow = (out: Uint8Array, yM: number, zM: number, x0M: number, pitchM: number) => void;

/**
 * Build the device grid. `contains` is called once per lattice point, or `containsRow` (when
 * given, e.g. for a large polygon) once per lattice row with the same answers.
 * Throws InputError at `where` when the lattice would be too large.
 */
export function buildDeviceGrid(
  bounds: Bounds3,
  contains: (x: number, y: number, z: number) => boolean,
  req: GridRequest,
  containsRow?: ContainsRow,
): DeviceGrid {
  const p = req.pitchM;
  const ox = req.origin ? req.origin[0] : 0.5 * (bounds.minX + bounds.maxX);
  const oy = req.origin ? req.origin[1] : 0.5 * (bounds.minY + bounds.maxY);
  const oz = 0.5 * (bounds.minZ + bounds.maxZ);
  const ax = axis(bounds.minX, bounds.maxX, ox, p);
  const ay = axis(bounds.minY, bounds.maxY, oy, p);
  const az = req.dimension === 3 ? axis(bounds.minZ, bounds.maxZ, oz, p) : { first: 0, n: 1 };
  const total = ax.n * ay.n * az.n;
  if (total > MAX_LATTICE_CELLS) {
    throw new InputError({
      where: req.where,
      message: `a pitch of ${p} m gives ${formatCount(total)} lattice cells; expected at most ${MAX_LATTICE_CELLS.toExponential(0)} (use a coarser pitch)`,
    });
  }
  const x0 = ox + ax.first * p, y0 = oy + ay.first * p, z0 = req.dimension === 3 ? oz + az.first * p : 0;
  // One pass straight into the index arrays, sized for the whole lattice: pages never written
  // (the bounding box's empty corners; k in 2D) are never touched, so they cost neither page
  // faults nor resident memory. The grid holds views of the first `count`.
  const ints = (name: string, size: number): Int32Array => (req.buffers ? req.buffers.i32(name, size, false) : new Int32Array(size));
  const is = ints("grid.i", total), js = ints("grid.j", total), ks = ints("grid.k", req.dimension === 3 ? total : 0);
  let count = 0;
  const row = containsRow ? new Uint8Array(ax.n) : null;
  for (let k = 0; k < az.n; k++) {
    const z = z0 + k * p;
    for (let j = 0; j < ay.n; j++) {
      const y = y0 + j * p;
      if (row) containsRow!(row, y, z, x0, p);
      for (let i = 0; i < ax.n; i++) {
        if (row ? row[i] === 0 : !contains(x0 + i * p, y, z)) continue;
        is[count] = i; js[count] = j;
        if (req.dimension === 3) ks[count] = k;
        count++;
      }
    }
  }
  return latticeGrid(req.dimension, p, ax.n, ay.n, az.n, x0, y0, z0, count, is.subarray(0, count), js.subarray(0, count),
    req.dimension === 3 ? ks.subarray(0, count) : new Int32Array(count));
}

/**
 * A grid of lattice cells whose centres follow from their indices: xM[c] = originXM + i[c]·pitchM
 * (the very expression the scan tested, so the same doubles), likewise y and z. The centre arrays
 * are made on first read: a plan never reads them (the build list formats one text per lattice
 * index), and at 10⁶ cells they are 16 MB of fresh pages. Read-only downstream.
 */
export function latticeGrid(
  dimension: 2 | 3, pitchM: number, nx: number, ny: number, nz: number, x0: number, y0: number, z0: number,
  count: number, i: Int32Array, j: Int32Array, k: Int32Array,
): DeviceGrid {
  const centres = (index: Int32Array, origin: number): Float64Array => {
    const out = new Float64Array(count);
    for (let c = 0; c < count; c++) out[c] = origin + index[c] * pitchM;
    return out;
  };
  let xs: Float64Array | null = null, ys: Float64Array | null = null, zs: Float64Array | null = null;
  return {
    dimension, pitchM, nx, ny, nz,
    originXM: x0, originYM: y0, originZM: z0,
    count, i, j, k,
    get xM() { return (xs ??= centres(i, x0)); },
    get yM() { return (ys ??= centres(j, y0)); },
    // in 2D every centre has z = 0 (a zero array whose pages are never touched)
    get zM() { return (zs ??= dimension === 3 ? centres(k, z0) : new Float64Array(count)); },
  };
}
