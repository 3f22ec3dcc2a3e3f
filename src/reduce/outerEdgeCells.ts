/**
 * The cells on a device's outer edge, with estimated outward normals, for fields that come without
 * a sampled boundary (imported fields). "Outer" means next to a lattice site connected to the
 * outside of the bounding box, so the hole of a cloak (its inner edge) is not included.
 */
import type { DeviceGrid } from "../field/deviceGrid.js";

export interface OuterEdgeCells {
  /** device-cell indices on the outer edge */
  cell: Int32Array;
  /** unit outward normals (normalZ = 0 in 2D) */
  normalX: Float64Array;
  normalY: Float64Array;
  normalZ: Float64Array;
}

/** Radius, in lattice steps, of the window whose outside sites set the normal. */
const NORMAL_WINDOW = 3;

/**
 * Outer edge cells of a grid: flood-fill the empty lattice sites from the padded border
 * (face-connected), take device cells with a face neighbour outside, and estimate each normal as
 * the normalized sum of unit vectors towards the outside sites within NORMAL_WINDOW steps (exact for
 * a straight edge, within a few degrees on a staircased circle of radius ≳ 10 cells).
 */
export function outerEdgeCells(grid: DeviceGrid): OuterEdgeCells {
  const three = grid.dimension === 3;
  const NX = grid.nx + 2, NY = grid.ny + 2, NZ = three ? grid.nz + 2 : 1;
  const kOff = three ? 1 : 0;
  const size = NX * NY * NZ;
  // 0 = empty (not yet reached), 1 = device cell, 2 = outside
  const state = new Uint8Array(size);
  const site = (i: number, j: number, k: number) => (k * NY + j) * NX + i;
  for (let c = 0; c < grid.count; c++) state[site(grid.i[c] + 1, grid.j[c] + 1, grid.k[c] + kOff)] = 1;
  const stack = new Int32Array(size);
  let top = 0;
  stack[top++] = 0;
  state[0] = 2;
  const di = [1, -1, 0, 0, 0, 0], dj = [0, 0, 1, -1, 0, 0], dk = [0, 0, 0, 0, 1, -1];
  const faces = three ? 6 : 4;
  while (top > 0) {
    const s = stack[--top];
    const i = s % NX, j = Math.floor(s / NX) % NY, k = Math.floor(s / (NX * NY));
    for (let f = 0; f < faces; f++) {
      const a = i + di[f], b = j + dj[f], d = k + dk[f];
      if (a < 0 || b < 0 || d < 0 || a >= NX || b >= NY || d >= NZ) continue;
      const t = site(a, b, d);
      if (state[t] === 0) { state[t] = 2; stack[top++] = t; }
    }
  }
  const outside = (a: number, b: number, d: number) =>
    a < 0 || b < 0 || d < 0 || a >= NX || b >= NY || d >= NZ || state[site(a, b, d)] === 2;

  const cells: number[] = [];
  for (let c = 0; c < grid.count; c++) {
    const i = grid.i[c] + 1, j = grid.j[c] + 1, k = grid.k[c] + kOff;
    for (let f = 0; f < faces; f++) {
      if (outside(i + di[f], j + dj[f], k + dk[f])) { cells.push(c); break; }
    }
  }
  const n = cells.length;
  const out: OuterEdgeCells = {
    cell: Int32Array.from(cells),
    normalX: new Float64Array(n), normalY: new Float64Array(n), normalZ: new Float64Array(n),
  };
  const W = NORMAL_WINDOW, Wz = three ? W : 0;
  for (let e = 0; e < n; e++) {
    const c = cells[e];
    const i = grid.i[c] + 1, j = grid.j[c] + 1, k = grid.k[c] + kOff;
    let sx = 0, sy = 0, sz = 0;
    for (let a = -W; a <= W; a++) {
      for (let b = -W; b <= W; b++) {
        for (let d = -Wz; d <= Wz; d++) {
          const r2 = a * a + b * b + d * d;
          if (r2 === 0 || r2 > W * W + 0.5) continue;
          if (!outside(i + a, j + b, k + d)) continue;
          const r = Math.sqrt(r2);
          sx += a / r; sy += b / r; sz += d / r;
        }
      }
    }
    const len = Math.hypot(sx, sy, sz);
    if (len > 0) {
      out.normalX[e] = sx / len; out.normalY[e] = sy / len; out.normalZ[e] = sz / len;
    } else {
      // symmetric surroundings (a one-cell-thick sliver): any face direction that is outside
      for (let f = 0; f < faces; f++) {
        if (outside(i + di[f], j + dj[f], k + dk[f])) { out.normalX[e] = di[f]; out.normalY[e] = dj[f]; out.normalZ[e] = dk[f]; break; }
      }
    }
  }
  return out;
}
