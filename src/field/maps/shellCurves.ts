/**
 * Closed boundary curves of a shell around a centre, as radius functions r(θ): a polar expression
 * directly, a point list (closed polygon) by intersecting each ray from the centre with it. Both
 * must be star-shaped about the centre (one crossing per ray). Checks name the place: a curve that
 * is not star-shaped, not finite or not positive, an inner curve reaching the outer one.
 * Lengths in metres, angles in radians from +x. Pure.
 */
import type { ClosedCurve } from "../transformSpec.js";

/** Rays used to check the curves. */
export const CHECK_RAYS = 2048;

export interface CurveIssue { path: string; message: string }

/** Radius of a closed polygon along direction θ from (cx, cy); NaN when the ray misses it, −1 when it crosses more than once. */
function rayRadius(xs: Float64Array, ys: Float64Array, cx: number, cy: number, theta: number): number {
  const dx = Math.cos(theta), dy = Math.sin(theta);
  const n = xs.length;
  let hit = NaN, hits = 0;
  for (let k = 0; k < n; k++) {
    const m = (k + 1) % n;
    const ax = xs[k] - cx, ay = ys[k] - cy, bx = xs[m] - cx, by = ys[m] - cy;
    const ex = bx - ax, ey = by - ay;
    const den = dx * ey - dy * ex;
    if (den === 0) continue;
    // ray t·d = a + u·e
    const t = (ax * ey - ay * ex) / den, u = (ax * dy - ay * dx) / den;
    if (t > 0 && u >= 0 && u < 1) { hits++; hit = t; }
  }
  return hits > 1 ? -1 : hit;
}

/** r(θ) of a closed curve about (cx, cy). */
export function radiusFunction(curve: ClosedCurve, cx: number, cy: number): (thetaRad: number) => number {
  if (curve.kind === "polar") return curve.r;
  const n = curve.pointsM.length;
  const xs = new Float64Array(n), ys = new Float64Array(n);
  for (let k = 0; k < n; k++) { xs[k] = curve.pointsM[k][0]; ys[k] = curve.pointsM[k][1]; }
  return (theta) => rayRadius(xs, ys, cx, cy, theta);
}

const fmt = (v: number): string => String(Number(v.toPrecision(5)));

/** Every problem with the two curves (paths below $.transform). */
export function shellCurveIssues(inner: ClosedCurve, outer: ClosedCurve, center: [number, number]): CurveIssue[] {
  const [cx, cy] = center;
  const fi = radiusFunction(inner, cx, cy), fo = radiusFunction(outer, cx, cy);
  const issues: CurveIssue[] = [];
  for (const [name, f] of [["inner", fi], ["outer", fo]] as const) {
    for (let k = 0; k < CHECK_RAYS; k++) {
      const th = (2 * Math.PI * k) / CHECK_RAYS, r = f(th);
      if (r === -1) {
        issues.push({ path: name, message: `the ray from the centre at θ = ${fmt((th * 180) / Math.PI)} deg crosses the curve more than once; expected a curve star-shaped about the centre` });
        break;
      }
      if (!Number.isFinite(r) || !(r > 0)) {
        issues.push({ path: name, message: `radius ${Number.isFinite(r) ? fmt(r) + " m" : "undefined"} at θ = ${fmt((th * 180) / Math.PI)} deg; expected a positive finite radius around the centre (does the curve enclose the centre?)` });
        break;
      }
    }
  }
  if (issues.length) return issues;
  for (let k = 0; k < CHECK_RAYS; k++) {
    const th = (2 * Math.PI * k) / CHECK_RAYS, a = fi(th), b = fo(th);
    if (!(a < b)) {
      issues.push({ path: "inner", message: `the inner curve reaches the outer curve at θ = ${fmt((th * 180) / Math.PI)} deg (${fmt(a)} m against ${fmt(b)} m); expected it inside everywhere` });
      break;
    }
  }
  return issues;
}
