/**
 * Device regions for expression maps: circle, annulus, rectangle, polygon. Each gives a bounding
 * box, a point test and outer-boundary samples. Lengths in metres.
 */
import type { BoundarySamples } from "./tensorField.js";
import type { Bounds3 } from "./transforms/transform.js";
import { circleBoundary, edgeBoundary, joinBoundaries } from "./transforms/circleBoundary.js";
import { INNER_SLACK, OUTER_SLACK } from "./transforms/transform.js";
import { polygonIndex } from "./polygonIndex.js";

export type RegionSpec =
  | { shape: "circle"; centerM: [number, number]; radiusM: number }
  | { shape: "annulus"; centerM: [number, number]; innerRadiusM: number; outerRadiusM: number }
  | { shape: "rectangle"; minM: [number, number]; maxM: [number, number] }
  | { shape: "polygon"; pointsM: [number, number][] };

export interface Region {
  bounds: Bounds3;
  contains(xM: number, yM: number): boolean;
  /** optional fast row test: out[i] = contains(x0M + i·pitchM, yM) ? 1 : 0 for i < out.length */
  containsRow?(out: Uint8Array, yM: number, x0M: number, pitchM: number): void;
  sampleBoundary(count: number): BoundarySamples;
}

/** Polygons with more vertices than half the requested boundary samples are sampled by arc length. */
function polygonBoundary(xs: Float64Array, ys: Float64Array, ccw: boolean, count: number, insetM: number): BoundarySamples {
  const n = xs.length;
  let perimeter = 0;
  for (let k = 0; k < n; k++) perimeter += Math.hypot(xs[(k + 1) % n] - xs[k], ys[(k + 1) % n] - ys[k]);
  const parts: BoundarySamples[] = [];
  if (2 * n <= count) {
    // at least two samples on every edge (corners are where edges meet)
    for (let k = 0; k < n; k++) {
      const m = (k + 1) % n;
      const dx = xs[m] - xs[k], dy = ys[m] - ys[k], len = Math.hypot(dx, dy);
      if (len === 0) continue;
      // outward normal: right of the edge for a counter-clockwise polygon
      const nx = ccw ? dy / len : -dy / len, ny = ccw ? -dx / len : dx / len;
      parts.push(edgeBoundary(xs[k], ys[k], xs[m], ys[m], nx, ny, Math.max(2, Math.round((count * len) / perimeter)), insetM));
    }
    return joinBoundaries(parts);
  }
  // many short edges: `count` samples evenly spaced along the perimeter, each on its own edge
  // with that edge's normal (two per edge would make the boundary cost grow with the vertices)
  const samples = Math.max(4, Math.floor(count));
  const out: BoundarySamples = {
    xM: new Float64Array(samples), yM: new Float64Array(samples), normalX: new Float64Array(samples), normalY: new Float64Array(samples),
  };
  let k = 0, before = 0, len = Math.hypot(xs[1 % n] - xs[0], ys[1 % n] - ys[0]);
  for (let s = 0; s < samples; s++) {
    const at = ((s + 0.5) / samples) * perimeter;
    while ((before + len < at || len === 0) && k < n - 1) {
      before += len; k++;
      const m = (k + 1) % n;
      len = Math.hypot(xs[m] - xs[k], ys[m] - ys[k]);
    }
    const m = (k + 1) % n;
    const dx = xs[m] - xs[k], dy = ys[m] - ys[k];
    const t = len > 0 ? Math.min(1, Math.max(0, (at - before) / len)) : 0.5;
    const nx = len > 0 ? (ccw ? dy / len : -dy / len) : 0, ny = len > 0 ? (ccw ? -dx / len : dx / len) : 0;
    out.xM[s] = xs[k] + t * dx - nx * insetM;
    out.yM[s] = ys[k] + t * dy - ny * insetM;
    out.normalX[s] = nx; out.normalY[s] = ny;
  }
  return out;
}

/** Build the point test, bounds and boundary sampler of a region. */
export function makeRegion(spec: RegionSpec): Region {
  switch (spec.shape) {
    case "circle": {
      const [cx, cy] = spec.centerM, r = spec.radiusM, r2 = (r * OUTER_SLACK) ** 2;
      return {
        bounds: { minX: cx - r, maxX: cx + r, minY: cy - r, maxY: cy + r, minZ: 0, maxZ: 0 },
        contains: (x, y) => (x - cx) * (x - cx) + (y - cy) * (y - cy) <= r2,
        sampleBoundary: (n) => circleBoundary(cx, cy, r, n),
      };
    }
    case "annulus": {
      const [cx, cy] = spec.centerM, a2 = (spec.innerRadiusM * INNER_SLACK) ** 2, b = spec.outerRadiusM, b2 = (b * OUTER_SLACK) ** 2;
      return {
        bounds: { minX: cx - b, maxX: cx + b, minY: cy - b, maxY: cy + b, minZ: 0, maxZ: 0 },
        contains: (x, y) => {
          const d = (x - cx) * (x - cx) + (y - cy) * (y - cy);
          return d > a2 && d <= b2;
        },
        sampleBoundary: (n) => circleBoundary(cx, cy, b, n),
      };
    }
    case "rectangle": {
      const [x0, y0] = spec.minM, [x1, y1] = spec.maxM;
      const inset = 1e-9 * Math.max(x1 - x0, y1 - y0);
      return {
        bounds: { minX: x0, maxX: x1, minY: y0, maxY: y1, minZ: 0, maxZ: 0 },
        contains: (x, y) => x >= x0 && x <= x1 && y >= y0 && y <= y1,
        sampleBoundary: (n) => {
          const per = Math.max(2, Math.floor(n / 4));
          return joinBoundaries([
            edgeBoundary(x0, y0, x1, y0, 0, -1, per, inset),
            edgeBoundary(x1, y0, x1, y1, 1, 0, per, inset),
            edgeBoundary(x1, y1, x0, y1, 0, 1, per, inset),
            edgeBoundary(x0, y1, x0, y0, -1, 0, per, inset),
          ]);
        },
      };
    }
    case "polygon": {
      const pts = spec.pointsM;
      const n = pts.length;
      const xs = new Float64Array(n), ys = new Float64Array(n);
      for (let k = 0; k < n; k++) { xs[k] = pts[k][0]; ys[k] = pts[k][1]; }
      let area2 = 0, minX = Infinity, maxX = -Infinity, minY = Infinity, maxY = -Infinity;
      for (let k = 0; k < n; k++) {
        const m = (k + 1) % n;
        area2 += xs[k] * ys[m] - xs[m] * ys[k];
        minX = Math.min(minX, xs[k]); maxX = Math.max(maxX, xs[k]); minY = Math.min(minY, ys[k]); maxY = Math.max(maxY, ys[k]);
      }
      const ccw = area2 > 0;
      const bounds = { minX, maxX, minY, maxY, minZ: 0, maxZ: 0 };
      const inset = 1e-9 * Math.max(bounds.maxX - bounds.minX, bounds.maxY - bounds.minY);
      // even–odd rule, half-open in y (field/polygonIndex.ts); self-intersecting polygons allowed
      const index = polygonIndex(xs, ys);
      return {
        bounds,
        contains: (x, y) => index.contains(x, y),
        containsRow: (out, y, x0, pitch) => index.containsRow(out, y, x0, pitch),
        sampleBoundary: (count) => polygonBoundary(xs, ys, ccw, count, inset),
      };
    }
  }
}

/** Twice the signed area of a polygon (positive when counter-clockwise). */
export function polygonArea2(points: [number, number][]): number {
  let s = 0;
  for (let k = 0; k < points.length; k++) {
    const [x0, y0] = points[k], [x1, y1] = points[(k + 1) % points.length];
    s += x0 * y1 - x1 * y0;
  }
  return s;
}
