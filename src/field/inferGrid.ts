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

/**
 * Largest lattice (positions of the bounding box, cells or holes) an imported field may span:
 * regions, edges and maps keep one 4-byte index per position, so a sparse field whose cells lie
 * far apart would allocate gigabytes for a handful of cells.
 */
export const MAX_IMPORTED_LATTICE = 5e7;

/**
 * The lattice offset (in [0, 1) pitches) most rows agree with, and how many do: the largest
 * cluster of x/pitch mod 1 within the tolerance (wrapping at 1). O(n log n).
 */
function majorityOffset(values: Float64Array, origin: number, pitch: number): { offset: number; count: number } {
  const n = values.length;
  const f = new Float64Array(2 * n);
  for (let r = 0; r < n; r++) {
    const t = (values[r] - origin) / pitch;
    f[r] = t - Math.floor(t);
  }
  const sorted = f.subarray(0, n).sort();
  for (let r = 0; r < n; r++) f[n + r] = sorted[r] + 1;
  let best = 0, bestAt = 0;
  for (let a = 0, b = 0; a < n; a++) {
    while (b < a + n && f[b] - f[a] <= 2 * LATTICE_TOLERANCE) b++;
    if (b - a > best) { best = b - a; bestAt = a; }
  }
  return { offset: f[bestAt] % 1, count: best };
}

function offLattice(v: number, origin: number, pitch: number, offset: number): boolean {
  const t = (v - origin) / pitch - offset;
  return Math.abs(t - Math.round(t)) > 2 * LATTICE_TOLERANCE;
}

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
  // A few stray rows off the design's lattice make the smallest gap tiny: when most rows sit on the
  // lattice of the expected pitch, blame the first stray row (in file order), not the pitch.
  if (Number.isFinite(fallbackPitchM) && Math.abs(pitch - fallbackPitchM) > 1e-6 * fallbackPitchM && n > 2) {
    const ox = majorityOffset(xs, minX, fallbackPitchM), oy = majorityOffset(ys, minY, fallbackPitchM);
    if (ox.count > n / 2 && oy.count > n / 2) {
      for (let r = 0; r < n; r++) {
        const badX = offLattice(xs[r], minX, fallbackPitchM, ox.offset), badY = offLattice(ys[r], minY, fallbackPitchM, oy.offset);
        if (badX || badY) {
          throw new InputError({
            where: rowWhere(r),
            message: `${badX ? `x_m = ${xs[r]}` : `y_m = ${ys[r]}`} is off the square grid of pitch ${fallbackPitchM} m that the other rows follow; expected a uniform grid`,
          });
        }
      }
    }
  }
  const span = (Math.round((maxX - minX) / pitch) + 1) * (Math.round((maxY - minY) / pitch) + 1);
  if (!(span <= MAX_IMPORTED_LATTICE)) {
    // name the row farthest from the median centre: usually a stray or mistyped row
    const mx = Float64Array.from(xs).sort()[n >> 1], my = Float64Array.from(ys).sort()[n >> 1];
    let far = 0, farD = -1;
    for (let r = 0; r < n; r++) {
      const d = Math.hypot(xs[r] - mx, ys[r] - my);
      if (d > farD) { farD = d; far = r; }
    }
    throw new InputError({
      where: rowWhere(far),
      message: `the ${n} cells span a lattice of ${span.toExponential(2)} positions of pitch ${pitch} m (at most ${MAX_IMPORTED_LATTICE.toExponential(0)}; each takes memory even when empty); this cell at (${xs[far]} m, ${ys[far]} m) lies ${farD.toPrecision(3)} m from the middle of the others: expected one compact device`,
    });
  }
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
