/**
 * Evaluation of a solved structured map at physical points: the two solved coordinates (û, v̂)
 * and their physical gradients from the Hermite interpolants (chain rule through the mesh
 * geometry: ∂(û, v̂)/∂(x′, y′) = ∂(û, v̂)/∂(s, t) · [∂(x′, y′)/∂(s, t)]⁻¹), the inverse point search
 * (û, v̂) → physical by Newton's method over the whole mesh, boundary samples with outward
 * normals, and the anisotropy and fold statistics over the solver's cells. Pure; evaluation
 * allocates nothing.
 */
import type { BoundarySamples } from "../tensorField.js";
import { evalHermite, type HermiteField, type Locator, type MeshLocation } from "./hermitePatch.js";
import { stretchRatio } from "./computedMapInfo.js";

export interface StructuredMap {
  gx: HermiteField;
  gy: HermiteField;
  u: HermiteField;
  v: HermiteField;
  locator: Locator;
}

/** Newton iterations allowed when searching the physical point of given (û, v̂). */
export const INVERSE_MAX_ITERATIONS = 60;

export interface MapEvaluator {
  /**
   * At physical (x, y): out = [û, v̂, ∂û/∂x, ∂û/∂y, ∂v̂/∂x, ∂v̂/∂y]; false outside the domain.
   */
  at(out: Float64Array, xM: number, yM: number): boolean;
  /** physical point of solved coordinates (û, v̂) into out[0..1]; false when not found */
  pointOf(out: Float64Array, uHat: number, vHat: number): boolean;
}

export function mapEvaluator(m: StructuredMap): MapEvaluator {
  const { gx, gy, u, v, locator } = m;
  const nu = gx.nu, nv = gx.nv;
  const loc: MeshLocation = { i: 0, j: 0, s: 0, t: 0 };
  const ex = new Float64Array(3), ey = new Float64Array(3), eu = new Float64Array(3), ev = new Float64Array(3);
  const evalAt = (out: Float64Array, i: number, j: number, s: number, t: number): number => {
    evalHermite(gx, i, j, s, t, ex, 0); evalHermite(gy, i, j, s, t, ey, 0);
    evalHermite(u, i, j, s, t, eu, 0); evalHermite(v, i, j, s, t, ev, 0);
    const det = ex[1] * ey[2] - ex[2] * ey[1];
    // inverse of [[x_s, x_t], [y_s, y_t]] is [[y_t, −x_t], [−y_s, x_s]] / det
    out[0] = eu[0]; out[1] = ev[0];
    out[2] = (eu[1] * ey[2] - eu[2] * ey[1]) / det;
    out[3] = (-eu[1] * ex[2] + eu[2] * ex[1]) / det;
    out[4] = (ev[1] * ey[2] - ev[2] * ey[1]) / det;
    out[5] = (-ev[1] * ex[2] + ev[2] * ex[1]) / det;
    return det;
  };
  // nearest node in (û, v̂) as the starting point of the inverse search
  const n = nu * nv;
  return {
    at(out, x, y) {
      if (!locator.locate(x, y, loc)) return false;
      evalAt(out, loc.i, loc.j, loc.s, loc.t);
      return true;
    },
    pointOf(out, uh, vh) {
      let best = 0, bestD = Infinity;
      for (let p = 0; p < n; p++) {
        const d = (u.f[p] - uh) ** 2 + (v.f[p] - vh) ** 2;
        if (d < bestD) { bestD = d; best = p; }
      }
      // global index coordinates (a, b): cell floor, local remainder
      let a = best % nu, b = Math.floor(best / nu);
      for (let it = 0; it < INVERSE_MAX_ITERATIONS; it++) {
        const i = Math.min(nu - 2, Math.max(0, Math.floor(a))), j = Math.min(nv - 2, Math.max(0, Math.floor(b)));
        const s = a - i, t = b - j;
        evalHermite(u, i, j, s, t, eu, 0); evalHermite(v, i, j, s, t, ev, 0);
        const ru = eu[0] - uh, rv = ev[0] - vh;
        const det = eu[1] * ev[2] - eu[2] * ev[1];
        if (!(Math.abs(det) > 0)) return false;
        const da = (ev[2] * ru - eu[2] * rv) / det, db = (-ev[1] * ru + eu[1] * rv) / det;
        a -= Math.max(-1, Math.min(1, da)); b -= Math.max(-1, Math.min(1, db));
        if (a < -1e-9 || a > nu - 1 + 1e-9 || b < -1e-9 || b > nv - 1 + 1e-9) {
          a = Math.min(nu - 1, Math.max(0, a)); b = Math.min(nv - 1, Math.max(0, b));
        }
        if (Math.abs(da) + Math.abs(db) < 1e-12) {
          const i2 = Math.min(nu - 2, Math.max(0, Math.floor(a))), j2 = Math.min(nv - 2, Math.max(0, Math.floor(b)));
          evalHermite(gx, i2, j2, a - i2, b - j2, ex, 0); evalHermite(gy, i2, j2, a - i2, b - j2, ey, 0);
          evalHermite(u, i2, j2, a - i2, b - j2, eu, 0); evalHermite(v, i2, j2, a - i2, b - j2, ev, 0);
          if (Math.abs(eu[0] - uh) + Math.abs(ev[0] - vh) > 1e-10) return false;
          out[0] = ex[0]; out[1] = ey[0];
          return true;
        }
      }
      return false;
    },
  };
}

/**
 * Samples just inside the mesh boundary with outward unit normals, about `count` in all, spread
 * over the four sides in proportion to their node counts (counter-clockwise: bottom, right, top,
 * left). `skipBottom` leaves out the bottom side (a ground plane is not an outer boundary).
 */
export function meshBoundarySamples(gx: HermiteField, gy: HermiteField, count: number, skipBottom = false): BoundarySamples {
  const nu = gx.nu, nv = gx.nv;
  const inset = 1e-7;
  const per = Math.max(2, Math.round(count / (skipBottom ? 3 : 4)));
  const xs: number[] = [], ys: number[] = [], nxs: number[] = [], nys: number[] = [];
  const ex = new Float64Array(3), ey = new Float64Array(3);
  const push = (a: number, b: number, side: "bottom" | "right" | "top" | "left"): void => {
    const i = Math.min(nu - 2, Math.max(0, Math.floor(a))), j = Math.min(nv - 2, Math.max(0, Math.floor(b)));
    evalHermite(gx, i, j, a - i, b - j, ex, 0); evalHermite(gy, i, j, a - i, b - j, ey, 0);
    let nx: number, ny: number;
    if (side === "bottom") { nx = ey[1]; ny = -ex[1]; }
    else if (side === "top") { nx = -ey[1]; ny = ex[1]; }
    else if (side === "right") { nx = ey[2]; ny = -ex[2]; }
    else { nx = -ey[2]; ny = ex[2]; }
    const len = Math.hypot(nx, ny);
    if (!(len > 0)) return;
    xs.push(ex[0]); ys.push(ey[0]); nxs.push(nx / len); nys.push(ny / len);
  };
  for (let k = 0; k < per; k++) {
    const f = (k + 0.5) / per;
    if (!skipBottom) push(f * (nu - 1), inset, "bottom");
    push(nu - 1 - inset, f * (nv - 1), "right");
    push((1 - f) * (nu - 1), nv - 1 - inset, "top");
    push(inset, (1 - f) * (nv - 1), "left");
  }
  return { xM: Float64Array.from(xs), yM: Float64Array.from(ys), normalX: Float64Array.from(nxs), normalY: Float64Array.from(nys) };
}

/** Statistics of the virtual-coordinate Jacobian over the solver's cells. */
export interface MapCellStats {
  maxAnisotropy: number;
  meanAnisotropy: number;
  /** first cell (i, j) where det ∂(û, v̂)/∂(x′, y′) ≤ 0 (checked at cell corners and centre), or null */
  folded: { i: number; j: number; xM: number; yM: number; det: number } | null;
  bounds: { minX: number; maxX: number; minY: number; maxY: number };
}

/**
 * Anisotropy σ₁/σ₂ of diag(scaleU, scaleV)·∂(û, v̂)/∂(x′, y′) at every cell centre (mean weighted
 * by cell area), the first folded cell, and the bounding box of the interpolated domain.
 */
export function mapCellStats(m: StructuredMap, scaleU: number, scaleV: number): MapCellStats {
  const { gx } = m;
  const nu = gx.nu, nv = gx.nv;
  const ev = mapEvaluatorCells(m);
  const o = new Float64Array(7);
  let maxA = 1, sumA = 0, sumW = 0;
  let folded: MapCellStats["folded"] = null;
  let minX = Infinity, maxX = -Infinity, minY = Infinity, maxY = -Infinity;
  const probe: [number, number][] = [[0.5, 0.5], [0, 0], [1, 0], [0, 1], [1, 1], [0.5, 0], [1, 0.5], [0.5, 1], [0, 0.5]];
  for (let j = 0; j + 1 < nv; j++) {
    for (let i = 0; i + 1 < nu; i++) {
      for (let q = 0; q < probe.length; q++) {
        const [s, t] = probe[q];
        const area = ev(o, i, j, s, t);
        const a = scaleU * o[2], b = scaleU * o[3], c = scaleV * o[4], d = scaleV * o[5];
        const det = a * d - b * c;
        if (!(det > 0) || !(area > 0)) {
          if (!folded) folded = { i, j, xM: o[0], yM: o[1], det };
          continue;
        }
        if (o[0] < minX) minX = o[0]; if (o[0] > maxX) maxX = o[0];
        if (o[1] < minY) minY = o[1]; if (o[1] > maxY) maxY = o[1];
        if (q !== 0) continue;
        const r = stretchRatio(a, b, c, d);
        if (r > maxA) maxA = r;
        sumA += r * area; sumW += area;
      }
    }
  }
  return { maxAnisotropy: maxA, meanAnisotropy: sumW > 0 ? sumA / sumW : NaN, folded, bounds: { minX, maxX, minY, maxY } };
}

/** Cell-local evaluation: out = [x′, y′, ∂û/∂x, ∂û/∂y, ∂v̂/∂x, ∂v̂/∂y, -]; returns det ∂(x′, y′)/∂(s, t). */
function mapEvaluatorCells(m: StructuredMap): (out: Float64Array, i: number, j: number, s: number, t: number) => number {
  const ex = new Float64Array(3), ey = new Float64Array(3), eu = new Float64Array(3), evv = new Float64Array(3);
  return (out, i, j, s, t) => {
    evalHermite(m.gx, i, j, s, t, ex, 0); evalHermite(m.gy, i, j, s, t, ey, 0);
    evalHermite(m.u, i, j, s, t, eu, 0); evalHermite(m.v, i, j, s, t, evv, 0);
    const det = ex[1] * ey[2] - ex[2] * ey[1];
    out[0] = ex[0]; out[1] = ey[0];
    out[2] = (eu[1] * ey[2] - eu[2] * ey[1]) / det;
    out[3] = (-eu[1] * ex[2] + eu[2] * ex[1]) / det;
    out[4] = (evv[1] * ey[2] - evv[2] * ey[1]) / det;
    out[5] = (-evv[1] * ex[2] + evv[2] * ex[1]) / det;
    return det;
  };
}

/**
 * Largest ‖K_fine − K_coarse‖_F / ‖K_fine‖_F over the fine map's cell centres (K = diag(scaleU,
 * scaleV)·∂(û, v̂)/∂(x′, y′)), skipping centres the coarse map does not cover. For a second-order
 * scheme a third of this estimates the fine map's own error (Richardson).
 */
export function jacobianDifference(fine: StructuredMap, coarse: MapEvaluator, scaleU: number, scaleV: number): number {
  const ev = mapEvaluatorCells(fine);
  const nu = fine.gx.nu, nv = fine.gx.nv;
  const a = new Float64Array(7), b = new Float64Array(6);
  let worst = 0;
  for (let j = 0; j + 1 < nv; j++) {
    for (let i = 0; i + 1 < nu; i++) {
      ev(a, i, j, 0.5, 0.5);
      if (!coarse.at(b, a[0], a[1])) continue;
      const d = Math.hypot(scaleU * (a[2] - b[2]), scaleU * (a[3] - b[3]), scaleV * (a[4] - b[4]), scaleV * (a[5] - b[5]));
      const n = Math.hypot(scaleU * a[2], scaleU * a[3], scaleV * a[4], scaleV * a[5]);
      if (n > 0 && d / n > worst) worst = d / n;
    }
  }
  return worst;
}
