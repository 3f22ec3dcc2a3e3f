import { describe, expect, it } from "vitest";
import { circleTableValue } from "../../../src/cells/homogenize/homogenizationTable.js";
import { circleCell } from "../../../src/cells/homogenize/cellShape.js";
import { homogenizeCell } from "../../../src/cells/homogenize/homogenizeCell.js";
import { rectCircleNode, rectCircleValue, rectErrorEnvelope, rectMaxSolvedFill, rectTable } from "../../../src/cells/homogenize/rectCircleTable.js";
import { expectClose } from "../../helpers/close.js";

/**
 * Square array of cylinders, closed form (Keller-symmetric version): Perrins, McKenzie, McPhedran,
 * Proc. R. Soc. A 369, 207 (1979); ~1e-5 from their multipole solution at f = 0.5 (shared
 * references, "Homogenization"). The rect lattice at aspect 1 is the square array.
 */
function perrinsSquare(u: number, f: number): number {
  const T = (1 + u) / (1 - u);
  return 1 - (2 * f) / (T + f - (0.305827 * f ** 4 * T) / (T * T - 1.402958 * f ** 8) - (0.013362 * f ** 8) / T);
}

/** Maxwell Garnett for cylinders, field across (Maxwell Garnett 1904; Sihvola 1999), host 1. */
const mgCylinder = (u: number, f: number): number => (1 + u + f * (u - 1)) / (1 + u - f * (u - 1));

/**
 * Trace bounds on the effective tensor of a two-phase 2D composite, phases ε1 < ε2, fractions f1,
 * f2 (Lurie & Cherkaev, Proc. R. Soc. Edinburgh 99A, 71 (1984); Murat & Tartar 1985; Milton, "The
 * Theory of Composites", 2002, §23 — equation numbers from memory): with d = 2,
 *   Tr[(ε* − ε1)⁻¹] ≤ d/(f2(ε2 − ε1)) + f1/(f2 ε1),   Tr[(ε2 − ε*)⁻¹] ≤ d/(f1(ε2 − ε1)) − f2/(f1 ε2).
 * For an isotropic ε* they are exactly the two Hashin–Shtrikman bounds (checked by reduction in the
 * first test below), so they are the HS bounds of an anisotropic tensor. Returns the slack of each
 * (≥ 0 when inside).
 */
function traceBoundSlack(e1: number, e2: number, f2: number, xx: number, yy: number): [number, number] {
  const f1 = 1 - f2;
  const lower = 2 / (f2 * (e2 - e1)) + f1 / (f2 * e1) - (1 / (xx - e1) + 1 / (yy - e1));
  const upper = 2 / (f1 * (e2 - e1)) - f2 / (f1 * e2) - (1 / (e2 - xx) + 1 / (e2 - yy));
  return [lower, upper];
}

describe("rect-lattice circles: solved on first use (rectCircleTable.ts)", () => {
  it("the trace bounds reduce to the Hashin–Shtrikman bounds for an isotropic tensor (identity used below)", () => {
    const e1 = 1, e2 = 8, f2 = 0.3;
    const hsLow = e1 + f2 / (1 / (e2 - e1) + (1 - f2) / (2 * e1)); // Hashin & Shtrikman 1962, 2D (MG, host ε1)
    const hsUp = e2 - (1 - f2) / (1 / (e2 - e1) - f2 / (2 * e2)); // MG, host ε2
    expectClose(traceBoundSlack(e1, e2, f2, hsLow, hsLow)[0], 0, { abs: 1e-12, label: "lower at HS lower" });
    expectClose(traceBoundSlack(e1, e2, f2, hsUp, hsUp)[1], 0, { abs: 1e-12, label: "upper at HS upper" });
  });

  for (const [u, f] of [[10, 0.5], [0.1, 0.5], [1 / 8, 0.3], [4, 0.4]] as const) {
    it(`aspect 1, u = ${Number(u.toPrecision(3))}, f = ${f}: the square array of Perrins et al. (1979) within the stated envelope`, () => {
      const n = rectCircleNode(u, f, 1);
      expect(n.converged).toBe(true);
      expectClose(n.xx, perrinsSquare(u, f), { rel: rectErrorEnvelope(u), label: "xx" });
      expectClose(n.yy, n.xx, { rel: 1e-12, label: "yy = xx (square symmetry)" });
    });
  }

  it("aspect 1 calibration: the n = 16 ladder stays within its envelope of the shipped square table (32/64/128)", () => {
    // the envelope's own calibration points (module comment of rectCircleTable.ts)
    for (const lu of [-1.5, -1, -0.5, 0.5, 1, 1.5]) {
      const u = 10 ** lu;
      for (const f of [0.1, 0.3, 0.5, 0.6]) {
        expectClose(rectCircleNode(u, f, 1).xx, circleTableValue("square", u, f).f, { rel: rectErrorEnvelope(u), label: `u=10^${lu} f=${f}` });
      }
    }
  });

  it("aspect 2, 1/2: the n = 16 ladder agrees with the n = 32 ladder of homogenizeCell.ts within the envelope (second check)", () => {
    for (const [u, f, R] of [[1 / 8, 0.3, 2], [10, 0.25, 2], [1 / 8, 0.15, 0.5]] as const) {
      const a = rectCircleNode(u, f, R);
      // homogenizeCell.ts: n = 32 cells along x (the shorter side when R ≥ 1); for R < 1 the swap identity is checked
      if (R >= 1) {
        const b = homogenizeCell(circleCell("rect", f, R), u, 32);
        expectClose(a.xx, b.xx, { rel: rectErrorEnvelope(u), label: `xx u=${u} R=${R}` });
        expectClose(a.yy, b.yy, { rel: rectErrorEnvelope(u), label: `yy u=${u} R=${R}` });
      } else {
        const c = rectCircleNode(u, f, 1 / R);
        expectClose(a.xx, c.yy, { rel: 1e-12, label: "R ↔ 1/R swaps x and y" });
      }
    }
  });

  for (const [u, f, R] of [[5, 0.3, 2], [1 / 8, 0.2, 3], [20, 0.12, 0.5]] as const) {
    it(`Keller's theorem per component, u = ${u}, R = ${R}: ε_xx(ε1, ε2)·ε_yy(ε2, ε1) = ε1ε2`, () => {
      // Keller, J. Math. Phys. 5, 548 (1964); Mendelson, J. Appl. Phys. 46, 4740 (1975): for x, y the
      // principal axes, η_x*(η)·η_y*(1/η) = 1 — here F_xx(u)·F_yy(1/u) = 1 for the same geometry.
      const a = rectCircleNode(u, f, R), b = rectCircleNode(1 / u, f, R);
      expectClose(a.xx * b.yy, 1, { rel: 2 * rectErrorEnvelope(u), label: "xx(u)·yy(1/u)" });
      expectClose(a.yy * b.xx, 1, { rel: 2 * rectErrorEnvelope(u), label: "yy(u)·xx(1/u)" });
    });
  }

  it("every table node of three (contrast, aspect) pairs lies inside the Wiener and Hashin–Shtrikman (trace) bounds", () => {
    for (const [u, R] of [[1 / 8, 2], [10, 3], [3, 0.5]] as const) {
      const t = rectTable(u, R);
      expect(t.converged).toBe(true);
      expect(t.maxFill).toBeCloseTo(rectMaxSolvedFill(R), 12);
      const e1 = Math.min(1, u), e2 = Math.max(1, u);
      t.nodes.forEach((n, k) => {
        const f = t.fills[k];
        if (f === 0) { expect([n.xx, n.yy]).toEqual([1, 1]); return; }
        const f2 = u > 1 ? f : 1 - f;
        const series = 1 / (f / u + (1 - f)), parallel = f * u + (1 - f); // Wiener 1912
        const tol = t.error * Math.max(n.xx, n.yy);
        for (const v of [n.xx, n.yy]) {
          expect(v).toBeGreaterThanOrEqual(series - tol);
          expect(v).toBeLessThanOrEqual(parallel + tol);
        }
        // trace bounds, each checked with the values moved by their error estimate in its favour
        const [lo] = traceBoundSlack(e1, e2, f2, n.xx + tol, n.yy + tol);
        const [, hi] = traceBoundSlack(e1, e2, f2, n.xx - tol, n.yy - tol);
        expect(lo, `lower trace bound u=${u} R=${R} f=${f}`).toBeGreaterThanOrEqual(0);
        expect(hi, `upper trace bound u=${u} R=${R} f=${f}`).toBeGreaterThanOrEqual(0);
      });
    }
  });

  it("low fill: both components tend to Maxwell Garnett (their difference is O(f²))", () => {
    // Rayleigh 1892 / Perrins et al. 1979: the lattice enters at order f² beyond the dilute (MG) term
    for (const R of [2, 0.5]) {
      const n = rectCircleNode(10, 0.02, R);
      const mg = mgCylinder(10, 0.02);
      expectClose(n.xx, mg, { rel: 2e-3, label: `xx R=${R}` });
      expectClose(n.yy, mg, { rel: 2e-3, label: `yy R=${R}` });
    }
  });

  it("ordering: the denser row direction carries the stronger phase's effect, and it grows with the aspect", () => {
    // rods of higher ε closer along x (R > 1): ε_xx > ε_yy; holes (u < 1): ε_xx > ε_yy as well,
    // since a field along y crosses the rows of holes in series (the laminate limit, Wiener 1912)
    const r2 = rectCircleNode(10, 0.25, 2), r3 = rectCircleNode(10, 0.2, 3);
    expect(r2.xx).toBeGreaterThan(r2.yy);
    const h2 = rectCircleNode(1 / 8, 0.3, 2);
    expect(h2.xx).toBeGreaterThan(h2.yy);
    const an = (n: { xx: number; yy: number }) => n.xx / n.yy;
    const r3at = rectCircleNode(10, 0.2, 2);
    expect(an(r3)).toBeGreaterThan(an(r3at));
  });

  it("∂F/∂u from the energy identity equals a finite difference of F (same discrete problem)", () => {
    const u = 5, f = 0.3, R = 2, h = 1e-4;
    const a = rectCircleNode(u * (1 - h), f, R), b = rectCircleNode(u * (1 + h), f, R), c = rectCircleNode(u, f, R);
    expectClose(c.dxx, (b.xx - a.xx) / (2 * h * u), { rel: 1e-4, label: "dxx" });
    expectClose(c.dyy, (b.yy - a.yy) / (2 * h * u), { rel: 1e-4, label: "dyy" });
  });

  it("the spline between nodes stays within the table's error of direct solves (off-node fills)", () => {
    const u = 1 / 8, R = 2;
    const t = rectTable(u, R);
    for (const f of [0.05, 0.17, 0.29, 0.33]) {
      const v = rectCircleValue(u, R, f), d = rectCircleNode(u, f, R);
      expect(v.inTable).toBe(true);
      expectClose(v.xx, d.xx, { rel: t.error, label: `xx f=${f}` });
      expectClose(v.yy, d.yy, { rel: t.error, label: `yy f=${f}` });
    }
    expect(rectCircleValue(u, R, t.maxFill * 1.01).inTable).toBe(false);
  });
});
