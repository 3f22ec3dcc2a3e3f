/**
 * `laplace-shell`: a cloak (innerScale 0) or concentrator (innerScale > 1, core magnified
 * uniformly) between two closed curves around a centre, the virtual radius ρ(r′, θ) solved by
 * field/maps/solveShellMap.ts; the direction is kept. With x = c + ρ·e_r(θ):
 *   K = ∂ρ/∂r′ e_r e_rᵀ + (∂ρ/∂θ / r′) e_r e_θᵀ + (ρ/r′) e_θ e_θᵀ
 * (the radial rule of Pendry, Schurig & Smith, Science 312, 1780 (2006), plus the angular
 * derivative a non-circular shell needs). ρ and its derivatives come from one C¹ interpolant, so
 * `inverse` and `jacobianK` agree. Inside the inner curve of a concentrator x = c + λ(x′ − c).
 */
import type { LaplaceShellSpec } from "../transformSpec.js";
import type { Transform } from "./transform.js";
import { INNER_SLACK, OUTER_SLACK, BOUNDARY_INSET } from "./transform.js";
import { evalHermite } from "../maps/hermitePatch.js";
import { solveShellMap, type SolvedShellMap } from "../maps/solveShellMap.js";
import { stretchRatio } from "../maps/computedMapInfo.js";

/** Bisection steps allowed in the radial search of `forward`. */
export const SHELL_SEARCH_STEPS = 200;

interface ShellEval {
  /** locate (x, y): fills state, returns 0 outside, 1 in the shell, 2 in a concentrator's core */
  where(x: number, y: number): 0 | 1 | 2;
  /** after where() = 1: out = [ρ, ∂ρ/∂r, ∂ρ/∂θ], plus polar state */
  st: { rp: number; c: number; s: number; i: number; sl: number; rin: number; rout: number };
  radial(out: Float64Array): void;
}

function shellEvaluator(sol: SolvedShellMap, spec: LaplaceShellSpec, singularInner: boolean): ShellEval {
  const n = sol.nTheta, m = sol.nRadial;
  const [cx, cy] = spec.center;
  const er = new Float64Array(3), ep = new Float64Array(3), e0 = new Float64Array(3), e1 = new Float64Array(3);
  const thetaStep = (2 * Math.PI) / n;
  const st = { rp: 0, c: 1, s: 0, i: 0, sl: 0, rin: 0, rout: 0 };
  return {
    st,
    where(x, y) {
      const dx = x - cx, dy = y - cy, rp = Math.hypot(dx, dy);
      if (!(rp > 0)) return spec.innerScale > 0 ? 2 : 0;
      let th = Math.atan2(dy, dx);
      if (th < 0) th += 2 * Math.PI;
      const A = th / thetaStep;
      const i = Math.min(n - 1, Math.floor(A)), sl = Math.min(1, A - i);
      evalHermite(sol.r, i, 0, sl, 0, e0, 0);
      evalHermite(sol.r, i, m - 2, sl, 1, e1, 0);
      st.rp = rp; st.c = dx / rp; st.s = dy / rp; st.i = i; st.sl = sl; st.rin = e0[0]; st.rout = e1[0];
      if (rp > e1[0] * OUTER_SLACK) return 0;
      if (singularInner ? rp <= e0[0] * INNER_SLACK : rp < e0[0]) return spec.innerScale > 0 ? 2 : 0;
      return 1;
    },
    radial(out) {
      const g = Math.min(m - 1, Math.max(0, ((st.rp - st.rin) / (st.rout - st.rin)) * (m - 1)));
      const j = Math.min(m - 2, Math.floor(g)), t = g - j;
      evalHermite(sol.rho, st.i, j, st.sl, t, ep, 0);
      evalHermite(sol.r, st.i, j, st.sl, t, er, 0);
      const rhoR = ep[2] / er[2];
      out[0] = ep[0];
      out[1] = rhoR;
      out[2] = (ep[1] - rhoR * er[1]) / thetaStep;
    },
  };
}

export function laplaceShell(spec: LaplaceShellSpec): Transform {
  const sol = solveShellMap(spec);
  const cloak = spec.innerScale === 0;
  const ev = shellEvaluator(sol, spec, cloak);
  const [cx, cy] = spec.center, lambda = spec.innerScale;
  const q = new Float64Array(3);
  const writeK = (k: Float64Array, rho: number, rhoR: number, rhoT: number, rp: number, c: number, s: number): void => {
    const a = rhoR, b = rhoT / rp, d = rho / rp;
    k[0] = a * c * c - b * c * s + d * s * s;
    k[1] = a * c * s + b * c * c - d * s * c;
    k[3] = a * s * c - b * s * s - d * c * s;
    k[4] = a * s * s + b * s * c + d * c * c;
    k[2] = 0; k[5] = 0; k[6] = 0; k[7] = 0; k[8] = 1;
  };
  // anisotropy over the solver's cell centres, the error estimate from a half-resolution solve
  const stats = (): { max: number; mean: number } => {
    const kk = new Float64Array(9);
    let max = 1, sum = 0, wsum = 0;
    const e = shellEvaluator(sol, spec, cloak);
    for (let j = 0; j + 1 < sol.nRadial; j++) for (let i = 0; i < sol.nTheta; i++) {
      const th = ((i + 0.5) * 2 * Math.PI) / sol.nTheta;
      const ea = new Float64Array(3), eb = new Float64Array(3);
      evalHermite(sol.r, i, j, 0.5, 0, ea, 0); evalHermite(sol.r, i, j, 0.5, 1, eb, 0);
      const rp = 0.5 * (ea[0] + eb[0]);
      if (e.where(cx + rp * Math.cos(th), cy + rp * Math.sin(th)) !== 1) continue;
      e.radial(q);
      writeK(kk, q[0], q[1], q[2], rp, Math.cos(th), Math.sin(th));
      const ratio = stretchRatio(kk[0], kk[1], kk[3], kk[4]);
      if (!Number.isFinite(ratio)) continue;
      const area = rp * (eb[0] - ea[0]);
      if (ratio > max) max = ratio;
      sum += ratio * area; wsum += area;
    }
    return { max, mean: wsum > 0 ? sum / wsum : 1 };
  };
  let maxR = 0;
  for (let i = 0; i < sol.nTheta; i++) maxR = Math.max(maxR, sol.r.f[(sol.nRadial - 1) * sol.r.nu + i]);
  maxR *= 1.01;
  const transform: Transform = {
    kind: "laplace-shell",
    dimension: 2,
    bounds: { minX: cx - maxR, maxX: cx + maxR, minY: cy - maxR, maxY: cy + maxR, minZ: 0, maxZ: 0 },
    contains: (x, y) => ev.where(x, y) !== 0,
    inverse(out, x, y, z) {
      const w = ev.where(x, y);
      if (w === 0) return false;
      if (w === 2) { out[0] = cx + lambda * (x - cx); out[1] = cy + lambda * (y - cy); out[2] = z; return true; }
      ev.radial(q);
      out[0] = cx + q[0] * ev.st.c; out[1] = cy + q[0] * ev.st.s; out[2] = z;
      return true;
    },
    forward(out, x, y, z) {
      const dx = x - cx, dy = y - cy, R = Math.hypot(dx, dy);
      if (!(R > 0)) return false;
      const c = dx / R, s = dy / R;
      // locate the ray's inner and outer radius, then bisect ρ(r′) = R along it (ρ increases with r′)
      ev.where(cx + c, cy + s);
      const rin = ev.st.rin, rout = ev.st.rout;
      if (!cloak && R < lambda * rin) { out[0] = cx + dx / lambda; out[1] = cy + dy / lambda; out[2] = z; return true; }
      let lo = rin, hi = rout;
      const rhoAt = (r: number): number => { ev.where(cx + r * c, cy + r * s); ev.st.rp = r; ev.st.rin = rin; ev.st.rout = rout; ev.radial(q); return q[0]; };
      if (R > rhoAt(rout) * OUTER_SLACK || R <= rhoAt(rin)) return false;
      for (let it = 0; it < SHELL_SEARCH_STEPS && hi - lo > 1e-15 * rout; it++) {
        const mid = 0.5 * (lo + hi);
        if (rhoAt(mid) < R) lo = mid; else hi = mid;
      }
      const r = 0.5 * (lo + hi);
      out[0] = cx + r * c; out[1] = cy + r * s; out[2] = z;
      return true;
    },
    jacobianK(k, x, y) {
      const w = ev.where(x, y);
      if (w === 2) { k.fill(0); k[0] = lambda; k[4] = lambda; k[8] = 1; return; }
      if (w === 0) { k.fill(NaN); return; }
      ev.radial(q);
      writeK(k, q[0], q[1], q[2], ev.st.rp, ev.st.c, ev.st.s);
    },
    sampleOuterBoundary(count) {
      const nS = Math.max(8, count);
      const xs = new Float64Array(nS), ys = new Float64Array(nS), nx = new Float64Array(nS), ny = new Float64Array(nS);
      const e = new Float64Array(3);
      const thetaStep = (2 * Math.PI) / sol.nTheta;
      for (let p = 0; p < nS; p++) {
        const th = ((p + 0.5) * 2 * Math.PI) / nS;
        const A = th / thetaStep, i = Math.min(sol.nTheta - 1, Math.floor(A));
        evalHermite(sol.r, i, sol.nRadial - 2, A - i, 1, e, 0);
        const r = e[0] * (1 - BOUNDARY_INSET), dr = e[1] / thetaStep;
        const c = Math.cos(th), s = Math.sin(th);
        // outward normal ∝ r e_r − r′(θ) e_θ
        const vx = r * c + dr * s, vy = r * s - dr * c, len = Math.hypot(vx, vy);
        xs[p] = cx + r * c; ys[p] = cy + r * s; nx[p] = vx / len; ny[p] = vy / len;
      }
      return { xM: xs, yM: ys, normalX: nx, normalY: ny };
    },
  };
  if (cloak) {
    transform.clampToInnerOffset = (p, offset) => {
      if (ev.where(p[0], p[1]) === 1 && ev.st.rp >= ev.st.rin + offset) return false;
      const dx = p[0] - cx, dy = p[1] - cy, rp = Math.hypot(dx, dy);
      if (!(rp > 0)) return false;
      const target = ev.st.rin + offset;
      p[0] = cx + (dx / rp) * target; p[1] = cy + (dy / rp) * target;
      return true;
    };
  }
  const half = (v: number): number => Math.max(5, Math.floor(v / 2));
  const coarseSol = solveShellMap({ ...spec, nodes: [half(spec.nodes[0]) * 2 === spec.nodes[0] ? spec.nodes[0] / 2 : half(spec.nodes[0]), Math.max(3, Math.floor((spec.nodes[1] - 1) / 2) + 1)] });
  const coarse = shellEvaluator(coarseSol, spec, cloak);
  const { max, mean } = stats();
  let worst = 0;
  const ka = new Float64Array(9), kb = new Float64Array(9);
  for (let j = 0; j + 1 < sol.nRadial; j++) for (let i = 0; i < sol.nTheta; i++) {
    const th = ((i + 0.5) * 2 * Math.PI) / sol.nTheta;
    const ea = new Float64Array(3), eb = new Float64Array(3);
    evalHermite(sol.r, i, j, 0.5, 0, ea, 0); evalHermite(sol.r, i, j, 0.5, 1, eb, 0);
    const rp = 0.5 * (ea[0] + eb[0]), x = cx + rp * Math.cos(th), y = cy + rp * Math.sin(th);
    if (ev.where(x, y) !== 1 || coarse.where(x, y) !== 1) continue;
    ev.radial(q); writeK(ka, q[0], q[1], q[2], rp, Math.cos(th), Math.sin(th));
    coarse.radial(q); writeK(kb, q[0], q[1], q[2], rp, Math.cos(th), Math.sin(th));
    const nrm = Math.hypot(ka[0], ka[1], ka[3], ka[4]);
    if (nrm > 0) worst = Math.max(worst, Math.hypot(ka[0] - kb[0], ka[1] - kb[1], ka[3] - kb[3], ka[4] - kb[4]) / nrm);
  }
  transform.computedMap = {
    conformalModule: null, conformalModuleBounds: null, virtualAspect: null,
    maxAnisotropy: max, meanAnisotropy: mean,
    nodes: [spec.nodes[0], spec.nodes[1]],
    residual: sol.residual,
    jacobianErrorEstimate: worst / 3,
  };
  return transform;
}
