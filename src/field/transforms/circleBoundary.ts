/** Boundary samples for circular (and sector) outer boundaries. */
import type { BoundarySamples } from "../tensorField.js";
import { BOUNDARY_INSET } from "./transform.js";

/**
 * `count` points just inside the circle of radius `radiusM` about (cx, cy), from angle `fromRad`
 * over `spanRad`, with outward radial normals.
 */
export function circleBoundary(cx: number, cy: number, radiusM: number, count: number, fromRad = 0, spanRad = 2 * Math.PI): BoundarySamples {
  const n = Math.max(4, Math.floor(count));
  const out: BoundarySamples = {
    xM: new Float64Array(n), yM: new Float64Array(n), normalX: new Float64Array(n), normalY: new Float64Array(n),
  };
  const r = radiusM * (1 - BOUNDARY_INSET);
  const closed = spanRad >= 2 * Math.PI;
  for (let s = 0; s < n; s++) {
    const th = fromRad + spanRad * (closed ? s / n : (s + 0.5) / n);
    const c = Math.cos(th), si = Math.sin(th);
    out.xM[s] = cx + r * c; out.yM[s] = cy + r * si;
    out.normalX[s] = c; out.normalY[s] = si;
  }
  return out;
}

/** Concatenate boundary sample sets. */
export function joinBoundaries(parts: BoundarySamples[]): BoundarySamples {
  const n = parts.reduce((s, p) => s + p.xM.length, 0);
  const out: BoundarySamples = {
    xM: new Float64Array(n), yM: new Float64Array(n), normalX: new Float64Array(n), normalY: new Float64Array(n),
  };
  let at = 0;
  for (const p of parts) {
    out.xM.set(p.xM, at); out.yM.set(p.yM, at); out.normalX.set(p.normalX, at); out.normalY.set(p.normalY, at);
    at += p.xM.length;
  }
  return out;
}

/**
 * Samples along a straight edge from (x0, y0) to (x1, y1), moved inward by a relative inset, with
 * the given outward unit normal.
 */
export function edgeBoundary(x0: number, y0: number, x1: number, y1: number, nx: number, ny: number, count: number, insetM: number): BoundarySamples {
  const n = Math.max(2, Math.floor(count));
  const out: BoundarySamples = {
    xM: new Float64Array(n), yM: new Float64Array(n), normalX: new Float64Array(n), normalY: new Float64Array(n),
  };
  for (let s = 0; s < n; s++) {
    const t = (s + 0.5) / n;
    out.xM[s] = x0 + t * (x1 - x0) - nx * insetM;
    out.yM[s] = y0 + t * (y1 - y0) - ny * insetM;
    out.normalX[s] = nx; out.normalY[s] = ny;
  }
  return out;
}
