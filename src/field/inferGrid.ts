/**
 * Infer the square lattice of an imported field from its cell centres: pitch = the smallest gap
 * between distinct coordinates (x or y), every centre must sit on that lattice (within 1e-6 of a
 * pitch), and no cell may appear twice. Holes are allowed (devices are rarely rectangles).
 * A centre off the lattice means a non-uniform grid: an InputError naming its row.
 */
import { InputError } from "../core/errors.js";
import type { DeviceGrid } from "./deviceGrid.js";

/** Relative distance (in pitches) a centre may sit off the lattice. */
export const LATTICE_TOLERANCE = 1e-6;

function smallestGap(values: Float64Array, scale: number): number {
  const s = Float64Array.from(values).sort();
  let gap = Infinity;
  for (let k = 1; k < s.length; k++) {
    const d = s[k] - s[k - 1];
    if (d > 1e-9 * scale && d < gap) gap = d;
  }
  return gap;
}

export interface InferredGrid {
  grid: DeviceGrid;
  /** order[c] = input row of grid cell c (grid cells are row-major: j, then i) */
  order: Int32Array;
}

/**
 * `rowWhere(r)` names input row r in messages ("field.csv:12"); `fallbackPitchM` is used when
 * the field has a single distinct coordinate on both axes.
 */
export function inferGrid(xs: Float64Array, ys: Float64Array, rowWhere: (row: number) => string, fallbackPitchM: number): InferredGrid {
  const n = xs.length;
  let minX = Infinity, maxX = -Infinity, minY = Infinity, maxY = -Infinity;
  for (let r = 0; r < n; r++) {
    minX = Math.min(minX, xs[r]); maxX = Math.max(maxX, xs[r]);
    minY = Math.min(minY, ys[r]); maxY = Math.max(maxY, ys[r]);
  }
  const scale = Math.max(maxX - minX, maxY - minY, Math.abs(minX), Math.abs(minY), 1e-300);
  let pitch = Math.min(smallestGap(xs, scale), smallestGap(ys, scale));
  if (!Number.isFinite(pitch)) pitch = fallbackPitchM;
  const nx = Math.round((maxX - minX) / pitch) + 1, ny = Math.round((maxY - minY) / pitch) + 1;
  const key = new Float64Array(n);
  const ii = new Int32Array(n), jj = new Int32Array(n);
  for (let r = 0; r < n; r++) {
    const fi = (xs[r] - minX) / pitch, fj = (ys[r] - minY) / pitch;
    const i = Math.round(fi), j = Math.round(fj);
    if (Math.abs(fi - i) > LATTICE_TOLERANCE || Math.abs(fj - j) > LATTICE_TOLERANCE) {
      const axis = Math.abs(fi - i) > LATTICE_TOLERANCE ? `x_m = ${xs[r]}` : `y_m = ${ys[r]}`;
      throw new InputError({
        where: rowWhere(r),
        message: `${axis} is off the square grid of pitch ${pitch} m inferred from the file; expected a uniform grid`,
      });
    }
    ii[r] = i; jj[r] = j; key[r] = j * nx + i;
  }
  const order = new Int32Array(n);
  for (let r = 0; r < n; r++) order[r] = r;
  order.sort((a, b) => key[a] - key[b]);
  for (let c = 1; c < n; c++) {
    if (key[order[c]] === key[order[c - 1]]) {
      const r = Math.max(order[c], order[c - 1]);
      throw new InputError({ where: rowWhere(r), message: `cell at (${xs[r]} m, ${ys[r]} m) appears twice; expected one row per cell` });
    }
  }
  const grid: DeviceGrid = {
    dimension: 2, pitchM: pitch, nx, ny, nz: 1, originXM: minX, originYM: minY, originZM: 0, count: n,
    i: new Int32Array(n), j: new Int32Array(n), k: new Int32Array(n),
    xM: new Float64Array(n), yM: new Float64Array(n), zM: new Float64Array(n),
  };
  for (let c = 0; c < n; c++) {
    const r = order[c];
    grid.i[c] = ii[r]; grid.j[c] = jj[r];
    grid.xM[c] = xs[r]; grid.yM[c] = ys[r];
  }
  return { grid, order };
}
