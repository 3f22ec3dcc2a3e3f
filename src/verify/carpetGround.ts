/**
 * The ground-plane scene of a carpet (ground-plane) cloak: a quasi-conformal design whose bottom
 * side alone is replaced by a curve over x (the bump) stands on a perfect conductor. The half-space
 * below the virtual rectangle's flat bottom line y = y_g is the ground plane; the region between
 * that line and the bump curve is the conducting bump the cloak hides (Li & Pendry, Phys. Rev.
 * Lett. 101, 203901 (2008): the cloak makes the bump look like the flat ground).
 *
 * The bump conductor is the region below the bump's polyline (y_g beyond its x-span). Its signed
 * distance is the vertical gap divided by sqrt(1 + L²), L the largest slope of the polyline: for an
 * L-Lipschitz graph that is never more than the true distance and has the right sign, which is all
 * the solver's cut-cell placement needs (it bisects on the sign and uses the magnitude only to skip
 * locations that cannot touch the surface).
 */
import type { TransformSpec } from "../field/transformSpec.js";
import { denseSide, rectOf } from "../field/maps/quadSides.js";
import type { Conductor } from "./conductor.js";

/** Samples of the bump curve (a graph is exact at the samples, linear between). */
export const BUMP_SAMPLES = 2048;

export interface CarpetGround {
  /** the flat ground line: the virtual rectangle's bottom, metres */
  groundYM: number;
  /** the conducting bump (its region below the curve, including the ground half-space) */
  bump: Conductor & { kind: "bump" };
  /** the bump's box (x-span of the bottom side, y from the ground line to its highest point) */
  bumpBox: { minX: number; maxX: number; minY: number; maxY: number };
  /** highest point of the bump above the ground line, metres (0 for a flat bottom) */
  heightM: number;
  /** x of the bump's centroid (of the area it raises), the rectangle's centre when flat, metres */
  centreXM: number;
}

/**
 * The carpet ground of a design, or why the design is not one (then the check keeps its free-space
 * scene). A carpet: kind `quasi-conformal`, left, right and top sides the rectangle's own, the
 * bottom side a curve running left to right (x increasing) that never dips below the flat line.
 */
export function carpetGround(spec: TransformSpec): { ground: CarpetGround; reason: null } | { ground: null; reason: string } {
  if (spec.kind !== "quasi-conformal") return { ground: null, reason: `a ${spec.kind} map has no ground plane` };
  for (const name of ["left", "right", "top"] as const) {
    if (spec.sides[name].kind !== "straight") return { ground: null, reason: `the ${name} side is not the rectangle's own: only designs that change the bottom side alone stand on a ground plane` };
  }
  const r = rectOf(spec);
  const d = denseSide(spec.sides.bottom, "bottom", r, BUMP_SAMPLES);
  const n = d.x.length;
  const span = r.x1 - r.x0, tol = 1e-9 * Math.max(span, r.y1 - r.y0);
  let top = r.y0, slope = 0, area = 0, moment = 0;
  for (let k = 0; k < n; k++) {
    if (d.y[k] < r.y0 - tol) return { ground: null, reason: `the bottom side dips below the flat line at x = ${d.x[k].toPrecision(4)} m: a dent, not a bump on the ground` };
    top = Math.max(top, d.y[k]);
    if (k > 0) {
      const dx = d.x[k] - d.x[k - 1];
      if (!(dx > 0)) return { ground: null, reason: "the bottom side does not run left to right as a curve over x" };
      slope = Math.max(slope, Math.abs(d.y[k] - d.y[k - 1]) / dx);
      const a = 0.5 * (d.y[k] + d.y[k - 1] - 2 * r.y0) * dx;
      area += a; moment += a * 0.5 * (d.x[k] + d.x[k - 1]);
    }
  }
  const xs = d.x, ys = d.y;
  const y0 = r.y0;
  const scale = 1 / Math.sqrt(1 + slope * slope);
  /** the bump curve at x (y0 beyond the side's span), by bisection on the sorted samples */
  const curve = (x: number): number => {
    if (!(x > xs[0]) || !(x < xs[n - 1])) return y0;
    let lo = 0, hi = n - 1;
    while (hi - lo > 1) { const m = (lo + hi) >> 1; if (xs[m] <= x) lo = m; else hi = m; }
    const f = (x - xs[lo]) / (xs[hi] - xs[lo]);
    return Math.max(y0, ys[lo] + f * (ys[hi] - ys[lo]));
  };
  return {
    ground: {
      groundYM: y0,
      bump: { kind: "bump", signedDistanceM: (x, y) => (y - curve(x)) * scale },
      bumpBox: { minX: xs[0], maxX: xs[n - 1], minY: y0, maxY: top },
      heightM: top - y0,
      centreXM: area > 0 ? moment / area : 0.5 * (r.x0 + r.x1),
    },
    reason: null,
  };
}
