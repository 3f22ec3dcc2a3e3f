/**
 * The ring innerM < r ≤ outerM about (cx, cy) as a transform's region: its bounding box (of the
 * nominal outer radius `boxRadiusM`), its point test and its lattice-row test by runs
 * (rowRuns.ts: the point test only near the two circles). Shared by the transforms whose device is
 * an annulus (radial cloak, rotator) so their membership cannot drift apart.
 */
import type { Bounds3 } from "./transform.js";
import { rowRuns, ZONE_REL } from "../rowRuns.js";

export interface AnnulusRegion {
  bounds: Bounds3;
  contains(x: number, y: number): boolean;
  containsRow(out: Uint8Array, y: number, z: number, x0: number, pitch: number): void;
}

export function annulusRegion(cx: number, cy: number, innerM: number, outerM: number, boxRadiusM: number): AnnulusRegion {
  const runs = rowRuns(4), half = ZONE_REL * (boxRadiusM + Math.abs(cx) + Math.abs(cy));
  const contains = (x: number, y: number): boolean => {
    const r = Math.sqrt((x - cx) * (x - cx) + (y - cy) * (y - cy));
    return r > innerM && r <= outerM;
  };
  return {
    bounds: { minX: cx - boxRadiusM, maxX: cx + boxRadiusM, minY: cy - boxRadiusM, maxY: cy + boxRadiusM, minZ: 0, maxZ: 0 },
    contains,
    containsRow(out, y, z, x0, pitch) {
      runs.reset();
      runs.ring(cx, y - cy, innerM, half);
      runs.ring(cx, y - cy, outerM, half);
      runs.fill(out, x0, pitch, y, z, contains);
    },
  };
}
