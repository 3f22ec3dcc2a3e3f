/**
 * A device on its lattice of unit cells as a Scene: a point takes the material of the lattice cell
 * that contains it when that cell belongs to the device, the background otherwise; a hidden region
 * (the inside of a cloak) is a perfect electric conductor.
 */
import type { DeviceGrid } from "../field/deviceGrid.js";
import { diskConductor, type Conductor } from "./conductor.js";
import type { MaterialMap } from "./materialMap.js";
import { SAMPLE_BACKGROUND, SAMPLE_MEDIUM, SAMPLE_PEC, S_B, S_TXX, S_TXY, S_TYY, type Scene, type ScenePolarization } from "./scene.js";

/** A disk modelled as a perfect electric conductor (the object a cloak hides). */
export interface HiddenDisk {
  centerM: [number, number];
  radiusM: number;
}

/** Lattice index → device cell (−1 outside the device), over the nx × ny bounding lattice. */
export function latticeLookup(grid: DeviceGrid): Int32Array {
  const lut = new Int32Array(grid.nx * grid.ny).fill(-1);
  for (let c = 0; c < grid.count; c++) lut[grid.i[c] + grid.nx * grid.j[c]] = c;
  return lut;
}

/** Bounding box of the device cells (cell edges), metres. */
export function deviceBounds(grid: DeviceGrid): { minX: number; maxX: number; minY: number; maxY: number } {
  let minX = Infinity, maxX = -Infinity, minY = Infinity, maxY = -Infinity;
  for (let c = 0; c < grid.count; c++) {
    minX = Math.min(minX, grid.xM[c]); maxX = Math.max(maxX, grid.xM[c]);
    minY = Math.min(minY, grid.yM[c]); maxY = Math.max(maxY, grid.yM[c]);
  }
  const p = grid.pitchM / 2;
  return { minX: minX - p, maxX: maxX + p, minY: minY - p, maxY: maxY + p };
}

/**
 * Scene of a 2D device: `map` per device cell (null: no device, only the hidden disk — the bare
 * obstacle), in a background of relative (eps, mu).
 */
export function deviceScene(grid: DeviceGrid, polarization: ScenePolarization, background: { eps: number; mu: number }, map: MaterialMap | null, hidden: HiddenDisk | null, extraConductors: Conductor[] = []): Scene {
  const lut = latticeLookup(grid);
  const box = deviceBounds(grid);
  const bounds = map ? { ...box } : { minX: 0, maxX: 0, minY: 0, maxY: 0 };
  if (hidden) {
    const [cx, cy] = hidden.centerM, r = hidden.radiusM;
    if (!map) Object.assign(bounds, { minX: cx - r, maxX: cx + r, minY: cy - r, maxY: cy + r });
    else Object.assign(bounds, { minX: Math.min(bounds.minX, cx - r), maxX: Math.max(bounds.maxX, cx + r), minY: Math.min(bounds.minY, cy - r), maxY: Math.max(bounds.maxY, cy + r) });
  }
  const p = grid.pitchM, ox = grid.originXM, oy = grid.originYM;
  const conductors: Conductor[] = [...(hidden ? [diskConductor(hidden.centerM, hidden.radiusM)] : []), ...extraConductors];
  const zero = new Float64Array(0);
  const bIm = map?.bIm ?? zero, xxIm = map?.txxIm ?? zero, yyIm = map?.tyyIm ?? zero, xyIm = map?.txyIm ?? zero;
  const lossy = bIm.length > 0;
  return {
    polarization,
    background,
    bounds,
    conductors,
    sample(x, y, out) {
      for (const cd of conductors) if (cd.signedDistanceM(x, y) < 0) return SAMPLE_PEC;
      if (!map) return SAMPLE_BACKGROUND;
      const i = Math.round((x - ox) / p), j = Math.round((y - oy) / p);
      if (i < 0 || j < 0 || i >= grid.nx || j >= grid.ny) return SAMPLE_BACKGROUND;
      const c = lut[i + grid.nx * j];
      if (c < 0) return SAMPLE_BACKGROUND;
      out[S_B] = map.b[c]; out[S_B + 1] = lossy ? bIm[c] : 0;
      out[S_TXX] = map.txx[c]; out[S_TXX + 1] = lossy ? xxIm[c] : 0;
      out[S_TYY] = map.tyy[c]; out[S_TYY + 1] = lossy ? yyIm[c] : 0;
      out[S_TXY] = map.txy[c]; out[S_TXY + 1] = lossy ? xyIm[c] : 0;
      return SAMPLE_MEDIUM;
    },
  };
}
