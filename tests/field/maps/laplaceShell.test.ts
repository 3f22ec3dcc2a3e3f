/**
 * laplace-shell: with two concentric circles the solved virtual radius is linear in r′, i.e. the
 * linear radial cloak r = b(r′ − a)/(b − a) of Pendry, Schurig & Smith, "Controlling
 * electromagnetic fields", Science 312, 1780 (2006), whose tensors are ε_r = (r′−a)/r′,
 * ε_θ = r′/(r′−a), ε_z = (b/(b−a))²(r′−a)/r′ (Schurig et al., Science 314, 977 (2006)).
 * Bilinear elements hold linear functions exactly, so the agreement is to rounding.
 */
import { describe, it, expect } from "vitest";
import { expectClose } from "../../helpers/close.js";
import { laplaceShell } from "../../../src/field/transforms/laplaceShell.js";
import { radialCloak } from "../../../src/field/transforms/radialCloak.js";
import { computeTensorField } from "../../../src/field/computeTensorField.js";
import type { LaplaceShellSpec } from "../../../src/field/transformSpec.js";

const a = 0.02, b = 0.05;
const circle = (r: number) => ({ kind: "polar" as const, text: String(r), r: () => r });

describe("laplace-shell", () => {
  it("two concentric circles reproduce the linear radial cloak's map and Jacobian", () => {
    const shell = laplaceShell({ kind: "laplace-shell", center: [0.01, -0.005], inner: circle(a), outer: circle(b), innerScale: 0, nodes: [64, 9] });
    const ref = radialCloak({ kind: "radial-cloak", innerRadiusM: a, outerRadiusM: b, profile: "linear", center: [0.01, -0.005] });
    const v1 = new Float64Array(3), v2 = new Float64Array(3), k1 = new Float64Array(9), k2 = new Float64Array(9);
    let n = 0;
    for (let r = 0.021; r < 0.05; r += 0.0037) for (let th = 0.05; th < 6.28; th += 0.41) {
      const x = 0.01 + r * Math.cos(th), y = -0.005 + r * Math.sin(th);
      expect(shell.inverse(v1, x, y, 0)).toBe(true);
      ref.inverse(v2, x, y, 0);
      expectClose(Array.from(v1), Array.from(v2), { abs: 1e-14, label: `virtual point at r′ = ${r}` });
      shell.jacobianK(k1, x, y, 0); ref.jacobianK(k2, x, y, 0);
      expectClose(Array.from(k1), Array.from(k2), { abs: 1e-11, rel: 1e-11, label: `K at r′ = ${r}, θ = ${th}` });
      n++;
    }
    expect(n).toBeGreaterThan(100);
    expect(shell.computedMap!.jacobianErrorEstimate).toBeLessThan(1e-10);
  });

  it("the engine gives the published linear-cloak tensors (ε_z = (b/(b−a))²(r′−a)/r′)", () => {
    const spec: LaplaceShellSpec = { kind: "laplace-shell", center: [0, 0], inner: circle(a), outer: circle(b), innerScale: 0, nodes: [64, 9] };
    const f = computeTensorField({ name: "c", sourcePath: "c.json", background: { eps: 1, mu: 1 }, transform: spec, grid: { pitchM: 0.004 } });
    for (let c = 0; c < f.grid.count; c++) {
      const r = Math.hypot(f.grid.xM[c], f.grid.yM[c]);
      expectClose(f.eps.zz[c], ((b / (b - a)) ** 2 * (r - a)) / r, { rel: 1e-10, label: `ε_z at r′ = ${r}` });
      // in-plane principal values (r′−a)/r′ and r′/(r′−a): the trace, and a determinant of 1
      expectClose(f.eps.xx[c] + f.eps.yy[c], (r - a) / r + r / (r - a), { rel: 1e-9, label: `in-plane trace at r′ = ${r}` });
      expectClose(f.eps.xx[c] * f.eps.yy[c] - f.eps.xy[c] ** 2, 1, { rel: 1e-9, label: `in-plane det at r′ = ${r}` });
    }
  });

  it("an elliptical shell: identity on the outer curve, the inner curve shrinks to the centre, no folding", () => {
    const ell = (ax: number, by: number) => ({ kind: "polar" as const, text: "ellipse", r: (t: number) => (ax * by) / Math.hypot(by * Math.cos(t), ax * Math.sin(t)) });
    const t = laplaceShell({ kind: "laplace-shell", center: [0, 0], inner: ell(0.02, 0.012), outer: ell(0.05, 0.04), innerScale: 0, nodes: [96, 17] });
    const v = new Float64Array(3), k = new Float64Array(9);
    // at the solver's node angles the interpolated curves are the given ones
    for (let q = 0; q < 96; q += 5) {
      const th = (2 * Math.PI * q) / 96;
      const ro = ell(0.05, 0.04).r(th) * (1 - 1e-9), ri = ell(0.02, 0.012).r(th) * (1 + 1e-6);
      expect(t.inverse(v, ro * Math.cos(th), ro * Math.sin(th), 0)).toBe(true);
      expectClose([v[0], v[1]], [ro * Math.cos(th), ro * Math.sin(th)], { abs: 1e-9, label: "outer curve fixed" });
      expect(t.inverse(v, ri * Math.cos(th), ri * Math.sin(th), 0)).toBe(true);
      expect(Math.hypot(v[0], v[1])).toBeLessThan(1e-6);
      for (const f of [0.1, 0.5, 0.9]) {
        const r = ri + f * (ro - ri);
        t.jacobianK(k, r * Math.cos(th), r * Math.sin(th), 0);
        expect(k[0] * k[4] - k[1] * k[3]).toBeGreaterThan(0);
      }
    }
  });
});
