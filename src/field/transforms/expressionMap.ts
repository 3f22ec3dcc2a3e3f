/**
 * A map given by the user as expressions of the physical coordinates: x = X(x', y'),
 * y = Y(x', y') (physical → virtual). K comes from the compiled symbolic derivatives
 * (io/expressionMap.ts). `forward` (virtual → physical) inverts the map by Newton's method with
 * an iteration cap and reports failure as `false`.
 */
import type { ExpressionSpec } from "../transformSpec.js";
import type { Transform } from "./transform.js";
import { makeRegion } from "../region.js";

/** Newton iterations allowed when inverting an expression map. */
export const NEWTON_MAX_ITERATIONS = 50;

export function expressionMap(spec: ExpressionSpec): Transform {
  const region = makeRegion(spec.region);
  const f = spec.compiled;
  const v = new Float64Array(6);
  const scale = Math.max(region.bounds.maxX - region.bounds.minX, region.bounds.maxY - region.bounds.minY) || 1;
  const regionRow = region.containsRow;
  return {
    kind: "expression",
    dimension: 2,
    bounds: region.bounds,
    contains: (x, y) => region.contains(x, y),
    ...(regionRow ? { containsRow: (out: Uint8Array, y: number, _z: number, x0: number, pitch: number) => regionRow(out, y, x0, pitch) } : {}),
    forward(out, x, y, z) {
      // start from the virtual point itself (most maps are near the identity somewhere)
      let px = x, py = y;
      for (let it = 0; it < NEWTON_MAX_ITERATIONS; it++) {
        f(v, px, py);
        const rx = v[0] - x, ry = v[1] - y;
        if (Math.abs(rx) + Math.abs(ry) <= 1e-13 * scale) {
          out[0] = px; out[1] = py; out[2] = z;
          return region.contains(px, py);
        }
        const det = v[2] * v[5] - v[3] * v[4];
        if (!(Math.abs(det) > 0) || !Number.isFinite(det)) return false;
        px -= (v[5] * rx - v[3] * ry) / det;
        py -= (-v[4] * rx + v[2] * ry) / det;
      }
      return false;
    },
    inverse(out, x, y, z) {
      if (!region.contains(x, y)) return false;
      f(v, x, y);
      out[0] = v[0]; out[1] = v[1]; out[2] = z;
      return Number.isFinite(v[0]) && Number.isFinite(v[1]);
    },
    jacobianK(k, x, y) {
      f(v, x, y);
      k[0] = v[2]; k[1] = v[3]; k[2] = 0;
      k[3] = v[4]; k[4] = v[5]; k[5] = 0;
      k[6] = 0; k[7] = 0; k[8] = 1;
    },
    sampleOuterBoundary: (n) => region.sampleBoundary(n),
  };
}
