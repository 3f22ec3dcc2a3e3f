/**
 * The lattice of square (2D) or cubic (3D) cells of one pitch covering a device's bounding box;
 * a cell belongs to the device when its centre lies in the device region. One lattice cell centre
 * sits at `origin` (default: the centre of the bounding box).
 */
import { InputError } from "../core/errors.js";
import type { DeviceGrid } from "./deviceGrid.js";
import type { Bounds3 } from "./transforms/transform.js";
import { formatCount } from "../core/formatQuantity.js";

/** Largest bounding-box lattice we are willing to scan (cells). */
export const MAX_LATTICE_CELLS = 5e7;

export interface GridRequest {
  pitchM: number;
  origin?: [number, number];
  /** 3: full 3D lattice; 2: the z = 0 plane only */
  dimension: 2 | 3;
  /** where to blame in messages, e.g. "design.json: $.grid.pitch" */
  where: string;
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
  // One pass straight into the output arrays, sized for the whole lattice: pages never written
  // (the bounding box's empty corners; k and z in 2D, which stay 0) are never touched, so they
  // cost neither page faults nor resident memory. The grid holds views of the first `count`.
  const is = new Int32Array(total), js = new Int32Array(total), ks = new Int32Array(req.dimension === 3 ? total : 0);
  const xs = new Float64Array(total), ys = new Float64Array(total), zs = new Float64Array(req.dimension === 3 ? total : 0);
  let count = 0;
  const row = containsRow ? new Uint8Array(ax.n) : null;
  for (let k = 0; k < az.n; k++) {
    const z = z0 + k * p;
    for (let j = 0; j < ay.n; j++) {
      const y = y0 + j * p;
      if (row) containsRow!(row, y, z, x0, p);
      for (let i = 0; i < ax.n; i++) {
        const x = x0 + i * p;
        if (row ? row[i] === 0 : !contains(x, y, z)) continue;
        is[count] = i; js[count] = j; xs[count] = x; ys[count] = y;
        if (req.dimension === 3) { ks[count] = k; zs[count] = z; }
        count++;
      }
    }
  }
  return {
    dimension: req.dimension,
    pitchM: p,
    nx: ax.n, ny: ay.n, nz: az.n,
    originXM: x0, originYM: y0, originZM: z0,
    count,
    i: is.subarray(0, count), j: js.subarray(0, count), k: req.dimension === 3 ? ks.subarray(0, count) : new Int32Array(count),
    xM: xs.subarray(0, count), yM: ys.subarray(0, count), zM: req.dimension === 3 ? zs.subarray(0, count) : new Float64Array(count),
  };
}
