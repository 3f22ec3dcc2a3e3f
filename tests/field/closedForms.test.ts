/**
 * Each built-in transform against its published closed form, at several points, after rotating
 * the Cartesian result into the local polar (or spherical) basis.
 */
import { describe, it, expect } from "vitest";
import { expectClose } from "../helpers/close.js";
import { makeTransform } from "../../src/field/transforms/registry.js";
import { pointEvaluator } from "../../src/field/computeTensorField.js";
import type { FieldDesign, TransformSpec } from "../../src/field/transformSpec.js";
import { computeTensorField } from "../../src/field/computeTensorField.js";
import { reductionSettings } from "../../src/reduce/reduceField.js";
import { reducePoint } from "../../src/reduce/reducePoint.js";
import { cylindrical, quad, sphericalBasis } from "./polarBasis.js";

const TOL = { rel: 1e-12, abs: 1e-13 };

function evalAt(spec: TransformSpec, x: number, y: number, z = 0, epsB = 1, muB = 1) {
  const ev = pointEvaluator(makeTransform(spec), epsB, muB);
  const eps = new Float64Array(6), mu = new Float64Array(6);
  const detJ = ev(x, y, z, eps, mu);
  return { eps, mu, detJ };
}

const ANGLES = [0, 0.4, 1.3, 2.9, -2.2];

describe("linear cylindrical cloak", () => {
  const a = 0.0271, b = 0.0589; // Schurig et al., Science 314, 977 (2006): a = 27.1 mm, b = 58.9 mm (from memory)
  const spec: TransformSpec = { kind: "radial-cloak", innerRadiusM: a, outerRadiusM: b, profile: "linear" };
  for (const rp of [0.028, 0.035, 0.045, 0.0589]) {
    for (const phi of ANGLES) {
      it(`r' = ${rp}, φ = ${phi}`, () => {
        const { eps, mu } = evalAt(spec, rp * Math.cos(phi), rp * Math.sin(phi));
        const e = cylindrical(eps, phi), m = cylindrical(mu, phi);
        // Pendry, Schurig, Smith, Science 312, 1780 (2006): ε_r = (r'−a)/r', ε_θ = r'/(r'−a),
        // ε_z = (b/(b−a))² (r'−a)/r'; μ the same.
        expectClose(e.rr, (rp - a) / rp, { ...TOL, label: "eps_r" });
        expectClose(e.tt, rp / (rp - a), { ...TOL, label: "eps_theta" });
        expectClose(e.zz, (b / (b - a)) ** 2 * (rp - a) / rp, { ...TOL, label: "eps_z" });
        expectClose(e.rt, 0, { abs: 1e-12, label: "eps_rtheta" });
        expectClose([m.rr, m.tt, m.zz], [e.rr, e.tt, e.zz], { ...TOL, label: "mu" });
      });
    }
  }
  it("reduced set (unit-mu, Ez) from the reduction code: ε_z = (b/(b−a))², μ_r = ((r−a)/r)², μ_θ = 1", () => {
    // Schurig et al., Science 314, 977 (2006): the reduced Ez set μ_r = ((r−a)/r)², μ_θ = 1,
    // ε_z = (b/(b−a))², which is 3.4306 at a = 27.1 mm, b = 58.9 mm (from memory)
    const design: FieldDesign = { name: "reduced cloak", sourcePath: "closed-form", background: { eps: 1, mu: 1 }, transform: spec, grid: { pitchM: 0.004 } };
    const field = computeTensorField(design);
    const settings = reductionSettings(field, { polarization: "Ez", scheme: "unit-mu" });
    for (const rp of [0.03, 0.04, 0.055]) {
      const r = reducePoint(field, settings, rp * Math.cos(0.7), rp * Math.sin(0.7), 0);
      expectClose(r.components.eps_zz, (b / (b - a)) ** 2, { rel: 1e-12, label: `eps_z at r' = ${rp}` });
      expectClose(r.principal, [((rp - a) / rp) ** 2, 1], { rel: 1e-12, abs: 1e-13, label: `mu_r, mu_theta at r' = ${rp}` });
    }
    const r = reducePoint(field, settings, 0.04, 0, 0);
    expectClose(r.components.eps_zz, 3.4306, { rel: 1e-4, label: "published 3.4306" });
  });
});

describe("quadratic cylindrical cloak", () => {
  const a = 0.02, b = 0.05;
  const spec: TransformSpec = { kind: "radial-cloak", innerRadiusM: a, outerRadiusM: b, profile: "quadratic" };
  // Cai et al., Appl. Phys. Lett. 91, 111105 (2007): g(0) = a, g(b) = b, g'(b) = 1 ⇒
  // g(r) = a + (1 − 2a/b) r + (a/b²) r² (solved here from the three conditions).
  const g = (r: number) => a + (1 - (2 * a) / b) * r + (a / (b * b)) * r * r;
  const dg = (r: number) => 1 - (2 * a) / b + (2 * a * r) / (b * b);
  const virtualRadius = (rp: number): number => {
    let lo = 0, hi = b; // bisection, independent of the implementation's closed-form inverse
    for (let k = 0; k < 200; k++) { const mid = 0.5 * (lo + hi); if (g(mid) < rp) lo = mid; else hi = mid; }
    return 0.5 * (lo + hi);
  };
  for (const rp of [0.021, 0.03, 0.042, 0.05]) {
    for (const phi of ANGLES.slice(0, 3)) {
      it(`r' = ${rp}, φ = ${phi}`, () => {
        const r = virtualRadius(rp);
        const { eps } = evalAt(spec, rp * Math.cos(phi), rp * Math.sin(phi));
        const e = cylindrical(eps, phi);
        // general radial rule (Schurig, Pendry, Smith, Opt. Express 14, 9794 (2006)):
        // ε_r = g'(r) r/r', ε_θ = r'/(r g'(r)), ε_z = r/(r' g'(r))
        expectClose(e.rr, (dg(r) * r) / rp, { rel: 1e-10, label: "eps_r" });
        expectClose(e.tt, rp / (r * dg(r)), { rel: 1e-10, label: "eps_theta" });
        expectClose(e.zz, r / (rp * dg(r)), { rel: 1e-10, label: "eps_z" });
        // non-magnetic Hz set (Cai et al. 2007): ε_r μ_z = (r/r')², ε_θ μ_z = 1/g'(r)²
        expectClose(e.rr * e.zz, (r / rp) ** 2, { rel: 1e-10, label: "eps_r mu_z" });
        expectClose(e.tt * e.zz, 1 / dg(r) ** 2, { rel: 1e-10, label: "eps_theta mu_z" });
      });
    }
  }
  it("matched outer boundary: ε = μ = identity at r' = b (g'(b) = 1, g(b) = b)", () => {
    const { eps } = evalAt(spec, b, 0);
    expectClose([eps[0], eps[1], eps[2]], [1, 1, 1], { rel: 1e-12, label: "eps at b" });
  });
});

describe("spherical cloak", () => {
  const a = 0.015, b = 0.035;
  const spec: TransformSpec = { kind: "spherical-cloak", innerRadiusM: a, outerRadiusM: b };
  const points: [number, number, number][] = [[0.01, 0.012, 0.009], [-0.02, 0.005, -0.018], [0.0, 0.0301, 0.01], [0.022, -0.011, 0.003]];
  for (const [x, y, z] of points) {
    it(`(${x}, ${y}, ${z})`, () => {
      const rp = Math.hypot(x, y, z);
      const { eps, mu } = evalAt(spec, x, y, z);
      const [rh, th, ph] = sphericalBasis(x, y, z);
      // Pendry, Schurig, Smith, Science 312, 1780 (2006): ε_r = μ_r = (b/(b−a))(r'−a)²/r'²,
      // ε_θ = ε_φ = b/(b−a)
      expectClose(quad(eps, rh, rh), (b / (b - a)) * (rp - a) ** 2 / rp ** 2, { ...TOL, label: "eps_r" });
      expectClose(quad(eps, th, th), b / (b - a), { ...TOL, label: "eps_theta" });
      expectClose(quad(eps, ph, ph), b / (b - a), { ...TOL, label: "eps_phi" });
      expectClose([quad(eps, rh, th), quad(eps, rh, ph), quad(eps, th, ph)], [0, 0, 0], { abs: 1e-12, label: "off-diagonal" });
      expectClose(quad(mu, rh, rh), quad(eps, rh, rh), { ...TOL, label: "mu_r" });
    });
  }
});

describe("concentrator", () => {
  const r1 = 0.015, r2 = 0.03, r3 = 0.06;
  const spec: TransformSpec = { kind: "concentrator", innerRadiusM: r1, compressedRadiusM: r2, outerRadiusM: r3 };
  it("core r' < R1: ε_r = ε_θ = 1, ε_z = (R2/R1)²", () => {
    // Rahm et al., Photonics Nanostruct. 6, 87 (2008), r' = (R1/R2) r; general radial rule with g' = r'/r
    for (const [x, y] of [[0.001, 0.002], [0, 0], [-0.01, 0.008]]) {
      const { eps } = evalAt(spec, x, y);
      const c = cylindrical(eps, Math.atan2(y, x));
      expectClose([c.rr, c.tt, c.zz], [1, 1, (r2 / r1) ** 2], { ...TOL, label: "core" });
    }
  });
  for (const rp of [0.016, 0.03, 0.045, 0.06]) {
    it(`shell r' = ${rp}`, () => {
      // r' = R1 + (r − R2)(R3 − R1)/(R3 − R2) (Rahm et al. 2008); general radial rule
      const gp = (r3 - r1) / (r3 - r2);
      const r = r2 + (rp - r1) / gp;
      const phi = 0.7;
      const { eps } = evalAt(spec, rp * Math.cos(phi), rp * Math.sin(phi));
      const c = cylindrical(eps, phi);
      expectClose(c.rr, (gp * r) / rp, { ...TOL, label: "eps_r" });
      expectClose(c.tt, rp / (r * gp), { ...TOL, label: "eps_theta" });
      expectClose(c.zz, r / (rp * gp), { ...TOL, label: "eps_z" });
    });
  }
});

describe("rotator", () => {
  const a = 0.025, b = 0.05, th0 = Math.PI / 2;
  const spec: TransformSpec = { kind: "rotator", innerRadiusM: a, outerRadiusM: b, angleRad: th0 };
  for (const rp of [0.026, 0.035, 0.0499999]) {
    for (const phi of ANGLES) {
      it(`r' = ${rp}, φ = ${phi}`, () => {
        const { eps, detJ } = evalAt(spec, rp * Math.cos(phi), rp * Math.sin(phi));
        const c = cylindrical(eps, phi);
        // Chen, Chan, Appl. Phys. Lett. 90, 241105 (2007): θ' = θ + θ0(b−r)/(b−a); in the polar
        // basis ε_rr = 1, ε_rθ = −τ, ε_θθ = 1 + τ², τ = r'θ0/(b−a) (from memory; re-derived with
        // the general rule of Schurig et al. 2006), ε_z = 1, in-plane det = 1.
        const tau = (rp * th0) / (b - a);
        expectClose([c.rr, c.rt, c.tt, c.zz], [1, -tau, 1 + tau * tau, 1], { ...TOL, label: "rotator" });
        expectClose(c.rr * c.tt - c.rt * c.rt, 1, { rel: 1e-12, label: "in-plane det" });
        expectClose(detJ, 1, { rel: 1e-12, label: "det J" });
      });
    }
  }
});

describe("beam shifter", () => {
  it("ε = μ = [[1, a, 0], [a, 1 + a², 0], [0, 0, 1]], a = shift/length", () => {
    const L = 0.06, s = 0.01, slope = s / L;
    const spec: TransformSpec = { kind: "beam-shifter", lengthM: L, heightM: 0.04, shiftM: s };
    for (const [x, y] of [[0.001, 0], [0.03, 0.015], [0.059, -0.019]]) {
      const { eps, mu } = evalAt(spec, x, y);
      // Rahm, Cummer, Schurig, Pendry, Smith, Phys. Rev. Lett. 100, 063903 (2008)
      const expected = [1, 1 + slope * slope, 1, slope, 0, 0];
      expectClose(eps, expected, { ...TOL, label: "eps" });
      expectClose(mu, expected, { ...TOL, label: "mu" });
    }
  });
});

describe("beam bend", () => {
  const a = 0.04, b = 0.08, r0 = 0.06;
  const spec: TransformSpec = { kind: "beam-bend", innerRadiusM: a, outerRadiusM: b, angleRad: Math.PI / 2, referenceRadiusM: r0 };
  for (const rp of [0.041, 0.06, 0.079]) {
    for (const phi of [0.05, 0.8, 1.5]) {
      it(`r' = ${rp}, θ' = ${phi}`, () => {
        const { eps } = evalAt(spec, rp * Math.cos(phi), rp * Math.sin(phi));
        const c = cylindrical(eps, phi);
        // ε_r = R0/r', ε_θ = r'/R0, ε_z = R0/r' (Rahm, Roberts, Pendry, Smith, Opt. Express 16,
        // 11555 (2008) — from memory; the general rule of Schurig et al. 2006 gives the same)
        expectClose([c.rr, c.tt, c.zz, c.rt], [r0 / rp, rp / r0, r0 / rp, 0], { rel: 1e-12, abs: 1e-13, label: "bend" });
      });
    }
  }
  it("is outside the sector beyond its angle", () => {
    const { detJ } = evalAt(spec, -0.05, -0.01);
    expect(Number.isNaN(detJ)).toBe(true);
  });
});

describe("background scaling", () => {
  it("a background index scales ε' by ε_b and μ' by μ_b (ε' = J ε_b Jᵀ/det J)", () => {
    const spec: TransformSpec = { kind: "radial-cloak", innerRadiusM: 0.02, outerRadiusM: 0.05, profile: "linear" };
    const one = evalAt(spec, 0.03, 0.01);
    const scaled = evalAt(spec, 0.03, 0.01, 0, 2.25, 1.5);
    expectClose(scaled.eps, Array.from(one.eps, (v) => 2.25 * v), { rel: 1e-14, label: "eps" });
    expectClose(scaled.mu, Array.from(one.mu, (v) => 1.5 * v), { rel: 1e-14, label: "mu" });
  });
});
