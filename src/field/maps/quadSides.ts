/**
 * The four sides of a computed quadrilateral map: evaluation, node placement along each side, and
 * the checks that name the place when the sides do not make a quadrilateral (corners that do not
 * meet, a point list leaving the rectangle's span, a bump reaching the opposite side, sides that
 * cross). Lengths in metres. Pure.
 *
 * Running directions: bottom and top left → right, left and right bottom → top, so the closed
 * boundary counter-clockwise is bottom, right, top reversed, left reversed.
 */
import type { QuasiConformalSpec, SideCurve, SideName } from "../transformSpec.js";

export const SIDE_NAMES: readonly SideName[] = ["bottom", "right", "top", "left"];

/** Intervals used to sample a function side for checks and arc length. */
export const DENSE_INTERVALS = 512;

export interface Rect { x0: number; y0: number; x1: number; y1: number }

export interface SideIssue {
  /** JSON path below $.transform, e.g. "sides.bottom" */
  path: string;
  message: string;
}

export const rectOf = (spec: Pick<QuasiConformalSpec, "rectangle">): Rect => ({
  x0: spec.rectangle.minM[0], y0: spec.rectangle.minM[1], x1: spec.rectangle.maxM[0], y1: spec.rectangle.maxM[1],
});

const horizontal = (name: SideName): boolean => name === "bottom" || name === "top";

/**
 * The point of a function side at its natural parameter s ∈ [0, 1] (x for bottom/top graphs,
 * y for left/right graphs, t for parametric sides); not for point lists.
 */
function functionPoint(side: SideCurve, name: SideName, r: Rect, s: number, out: Float64Array): void {
  const along = horizontal(name) ? r.x0 + s * (r.x1 - r.x0) : r.y0 + s * (r.y1 - r.y0);
  switch (side.kind) {
    case "straight":
      if (name === "bottom") { out[0] = along; out[1] = r.y0; }
      else if (name === "top") { out[0] = along; out[1] = r.y1; }
      else if (name === "left") { out[0] = r.x0; out[1] = along; }
      else { out[0] = r.x1; out[1] = along; }
      return;
    case "graph":
      if (horizontal(name)) { out[0] = along; out[1] = side.f(along); }
      else { out[0] = side.f(along); out[1] = along; }
      return;
    case "parametric":
      out[0] = side.fx(s); out[1] = side.fy(s);
      return;
    case "points":
      throw new Error("functionPoint: point lists have no function");
  }
}

/** A side sampled densely in its running direction (point lists as given). */
export function denseSide(side: SideCurve, name: SideName, r: Rect, intervals = DENSE_INTERVALS): { x: Float64Array; y: Float64Array } {
  if (side.kind === "points") {
    const n = side.pointsM.length;
    const x = new Float64Array(n), y = new Float64Array(n);
    for (let k = 0; k < n; k++) { x[k] = side.pointsM[k][0]; y[k] = side.pointsM[k][1]; }
    return { x, y };
  }
  const x = new Float64Array(intervals + 1), y = new Float64Array(intervals + 1), p = new Float64Array(2);
  for (let k = 0; k <= intervals; k++) {
    functionPoint(side, name, r, k / intervals, p);
    x[k] = p[0]; y[k] = p[1];
  }
  return { x, y };
}

/**
 * `count` nodes along a side: evenly in the natural parameter for straight sides and graphs
 * (so a bump's nodes stand above the flat side's), evenly in arc length for parametric sides
 * and point lists (the parameter is found from a dense arc-length table, then evaluated exactly).
 */
export function sideNodes(side: SideCurve, name: SideName, r: Rect, count: number): { x: Float64Array; y: Float64Array } {
  const x = new Float64Array(count), y = new Float64Array(count), p = new Float64Array(2);
  if (side.kind === "straight" || side.kind === "graph") {
    for (let k = 0; k < count; k++) {
      functionPoint(side, name, r, k / (count - 1), p);
      x[k] = p[0]; y[k] = p[1];
    }
    return { x, y };
  }
  const d = denseSide(side, name, r, Math.max(DENSE_INTERVALS, 8 * count));
  const m = d.x.length;
  const cum = new Float64Array(m);
  for (let k = 1; k < m; k++) cum[k] = cum[k - 1] + Math.hypot(d.x[k] - d.x[k - 1], d.y[k] - d.y[k - 1]);
  const total = cum[m - 1];
  let seg = 0;
  for (let q = 0; q < count; q++) {
    const target = (total * q) / (count - 1);
    while (seg < m - 2 && cum[seg + 1] < target) seg++;
    const len = cum[seg + 1] - cum[seg];
    const f = len > 0 ? Math.min(1, Math.max(0, (target - cum[seg]) / len)) : 0;
    if (side.kind === "points") {
      x[q] = d.x[seg] + f * (d.x[seg + 1] - d.x[seg]);
      y[q] = d.y[seg] + f * (d.y[seg + 1] - d.y[seg]);
    } else {
      functionPoint(side, name, r, (seg + f) / (m - 1), p);
      x[q] = p[0]; y[q] = p[1];
    }
  }
  x[0] = d.x[0]; y[0] = d.y[0]; x[count - 1] = d.x[m - 1]; y[count - 1] = d.y[m - 1];
  return { x, y };
}

const fmt = (v: number): string => String(Number(v.toPrecision(6)));
const pt = (x: number, y: number): string => `(${fmt(x)} m, ${fmt(y)} m)`;

/** Proper or touching intersection of segments ab and cd (excluding shared endpoints handled by the caller). */
function segmentsCross(ax: number, ay: number, bx: number, by: number, cx: number, cy: number, dx: number, dy: number): boolean {
  const o = (px: number, py: number, qx: number, qy: number, rx: number, ry: number): number => (qx - px) * (ry - py) - (qy - py) * (rx - px);
  const d1 = o(cx, cy, dx, dy, ax, ay), d2 = o(cx, cy, dx, dy, bx, by);
  const d3 = o(ax, ay, bx, by, cx, cy), d4 = o(ax, ay, bx, by, dx, dy);
  return ((d1 > 0 && d2 < 0) || (d1 < 0 && d2 > 0)) && ((d3 > 0 && d4 < 0) || (d3 < 0 && d4 > 0));
}

/**
 * Every problem with the sides of a quasi-conformal spec, each naming its JSON path below
 * $.transform. Empty when the sides bound a proper quadrilateral.
 */
export function quadSideIssues(spec: Pick<QuasiConformalSpec, "rectangle" | "sides">): SideIssue[] {
  const r = rectOf(spec);
  const issues: SideIssue[] = [];
  const size = Math.hypot(r.x1 - r.x0, r.y1 - r.y0);
  const tol = 1e-6 * size;
  const dense = {} as Record<SideName, { x: Float64Array; y: Float64Array }>;
  for (const name of SIDE_NAMES) {
    const side = spec.sides[name];
    const d = denseSide(side, name, r);
    dense[name] = d;
    for (let k = 0; k < d.x.length; k++) {
      if (!Number.isFinite(d.x[k]) || !Number.isFinite(d.y[k])) {
        const at = side.kind === "graph" ? (horizontal(name) ? `x = ${fmt(r.x0 + (k / DENSE_INTERVALS) * (r.x1 - r.x0))} m` : `y = ${fmt(r.y0 + (k / DENSE_INTERVALS) * (r.y1 - r.y0))} m`)
          : side.kind === "parametric" ? `t = ${fmt(k / DENSE_INTERVALS)}` : `point ${k}`;
        issues.push({ path: `sides.${name}`, message: `the curve has no finite value at ${at}; expected a finite position along the whole side` });
        break;
      }
    }
    if (side.kind === "points") {
      const lo = horizontal(name) ? r.x0 : r.y0, hi = horizontal(name) ? r.x1 : r.y1;
      const axis = horizontal(name) ? "x" : "y";
      for (let k = 0; k < d.x.length; k++) {
        const v = horizontal(name) ? d.x[k] : d.y[k];
        if (v < lo - tol || v > hi + tol) {
          issues.push({ path: `sides.${name}.points[${k}]`, message: `${axis} = ${fmt(v)} m leaves the rectangle's span ${fmt(lo)}…${fmt(hi)} m; expected every point within it (lengths in metres)` });
          break;
        }
      }
    }
  }
  if (issues.length) return issues;

  // corners must meet
  const first = (n: SideName): [number, number] => [dense[n].x[0], dense[n].y[0]];
  const last = (n: SideName): [number, number] => { const d = dense[n]; return [d.x[d.x.length - 1], d.y[d.y.length - 1]]; };
  const corners: [SideName, "start" | "end", SideName, "start" | "end", string][] = [
    ["left", "start", "bottom", "start", "bottom-left"],
    ["right", "start", "bottom", "end", "bottom-right"],
    ["right", "end", "top", "end", "top-right"],
    ["left", "end", "top", "start", "top-left"],
  ];
  for (const [a, ea, b, eb, label] of corners) {
    const pa = ea === "start" ? first(a) : last(a), pb = eb === "start" ? first(b) : last(b);
    if (Math.hypot(pa[0] - pb[0], pa[1] - pb[1]) > tol) {
      const blame = spec.sides[a].kind !== "straight" ? a : b;
      const other = blame === a ? b : a;
      const [pBlame, pOther] = blame === a ? [pa, pb] : [pb, pa];
      issues.push({
        path: `sides.${blame}`,
        message: `the ${label} corner does not meet: the ${blame} side ${blame === a ? ea + "s" : eb + "s"} at ${pt(pBlame[0], pBlame[1])} but the ${other} side ${blame === a ? eb + "s" : ea + "s"} at ${pt(pOther[0], pOther[1])}; corners must meet`,
      });
    }
  }
  if (issues.length) return issues;

  // a bump reaching the opposite side (both sides functions of x, or both of y)
  const pairs: [SideName, SideName][] = [["bottom", "top"], ["left", "right"]];
  for (const [lo, hi] of pairs) {
    const a = spec.sides[lo], b = spec.sides[hi];
    if ((a.kind === "graph" || a.kind === "straight") && (b.kind === "graph" || b.kind === "straight") && (a.kind === "graph" || b.kind === "graph")) {
      const da = dense[lo], db = dense[hi];
      const across = lo === "bottom" ? da.y : da.x, across2 = lo === "bottom" ? db.y : db.x;
      const along = lo === "bottom" ? da.x : da.y;
      for (let k = 0; k < across.length; k++) {
        if (across[k] >= across2[k]) {
          const blame = a.kind === "graph" ? lo : hi;
          const what = lo === "bottom" ? `x = ${fmt(along[k])} m (y = ${fmt(across[k])} m against ${fmt(across2[k])} m)` : `y = ${fmt(along[k])} m (x = ${fmt(across[k])} m against ${fmt(across2[k])} m)`;
          issues.push({ path: `sides.${blame}`, message: `the ${blame} curve reaches the ${blame === lo ? hi : lo} side at ${what}: taller than the domain; expected the ${lo} side ${lo === "bottom" ? "below" : "left of"} the ${hi} side everywhere` });
          return issues;
        }
      }
    }
  }

  // sides that cross: all pairs of segments of the closed boundary that do not share a vertex
  const segs: { side: SideName; ax: number; ay: number; bx: number; by: number }[] = [];
  for (const name of SIDE_NAMES) {
    const d = dense[name];
    for (let k = 0; k + 1 < d.x.length; k++) segs.push({ side: name, ax: d.x[k], ay: d.y[k], bx: d.x[k + 1], by: d.y[k + 1] });
  }
  const ns = segs.length;
  for (let p = 0; p < ns; p++) {
    const s = segs[p];
    const minX = Math.min(s.ax, s.bx), maxX = Math.max(s.ax, s.bx), minY = Math.min(s.ay, s.by), maxY = Math.max(s.ay, s.by);
    for (let q = p + 2; q < ns; q++) {
      const t = segs[q];
      if (Math.max(t.ax, t.bx) < minX || Math.min(t.ax, t.bx) > maxX || Math.max(t.ay, t.by) < minY || Math.min(t.ay, t.by) > maxY) continue;
      if (segmentsCross(s.ax, s.ay, s.bx, s.by, t.ax, t.ay, t.bx, t.by)) {
        const what = s.side === t.side ? `the ${s.side} side crosses itself` : `the ${s.side} and ${t.side} sides cross`;
        issues.push({ path: `sides.${t.side === "bottom" ? s.side : t.side}`, message: `${what} near ${pt(0.5 * (t.ax + t.bx), 0.5 * (t.ay + t.by))}; expected four sides that bound one region` });
        return issues;
      }
    }
  }

  // orientation: bottom, right, top reversed, left reversed must run counter-clockwise
  let area2 = 0;
  const ring: [Float64Array, Float64Array, boolean][] = [
    [dense.bottom.x, dense.bottom.y, false], [dense.right.x, dense.right.y, false],
    [dense.top.x, dense.top.y, true], [dense.left.x, dense.left.y, true],
  ];
  for (const [xs, ys, rev] of ring) {
    const n = xs.length;
    for (let k = 0; k + 1 < n; k++) {
      const a = rev ? n - 1 - k : k, b = rev ? n - 2 - k : k + 1;
      area2 += xs[a] * ys[b] - xs[b] * ys[a];
    }
  }
  if (!(area2 > 0)) issues.push({ path: "sides", message: "the sides enclose no area in the expected order; expected bottom below top and left of right (bottom and top run left to right, left and right bottom to top)" });
  return issues;
}
