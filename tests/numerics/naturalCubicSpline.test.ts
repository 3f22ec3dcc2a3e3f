/**
 * Natural cubic spline: passes through its nodes, reproduces straight lines exactly (identities),
 * and for sin on [0, π] — whose second derivative vanishes at both ends, as the natural end
 * conditions assume — the error falls like h⁴ and stays under (5/384)·h⁴·max|f⁗|, the bound Hall &
 * Meyer prove for the spline with exact end conditions ("Optimal error bounds for cubic spline
 * interpolation", J. Approx. Theory 16, 105 (1976)); for sin the natural end moments are exact.
 */
import { describe, expect, it } from "vitest";
import { naturalSplineAt, naturalSplineMoments } from "../../src/numerics/naturalCubicSpline.js";
import { expectClose } from "../helpers/close.js";

function maxErrorOnSin(n: number): number {
  const x = Array.from({ length: n + 1 }, (_, i) => (i * Math.PI) / n);
  const y = x.map(Math.sin);
  const m = naturalSplineMoments(x, y);
  let worst = 0;
  for (let j = 0; j <= 2000; j++) {
    const t = (j * Math.PI) / 2000;
    worst = Math.max(worst, Math.abs(naturalSplineAt(x, y, m, t) - Math.sin(t)));
  }
  return worst;
}

describe("naturalCubicSpline", () => {
  it("interpolates its nodes and reproduces a line exactly (uneven nodes)", () => {
    const x = [0, 0.3, 1.1, 1.2, 2.5, 4];
    const line = x.map((v) => 2 - 0.7 * v);
    const m = naturalSplineMoments(x, line);
    for (const t of [0, 0.1, 0.7, 1.15, 3, 4, 4.5]) expectClose(naturalSplineAt(x, line, m, t), 2 - 0.7 * t, { rel: 1e-13, abs: 1e-13, label: `line at ${t}` });
    const y = [1, -2, 0.5, 3, 3, -1];
    const my = naturalSplineMoments(x, y);
    for (let i = 0; i < x.length; i++) expectClose(naturalSplineAt(x, y, my, x[i]), y[i], { rel: 1e-13, abs: 1e-13, label: `node ${i}` });
    expect(my[0]).toBe(0);
    expect(my[x.length - 1]).toBe(0);
  });

  it("errors on sin stay within the h⁴ bound and fall at fourth order", () => {
    const e10 = maxErrorOnSin(10), e20 = maxErrorOnSin(20);
    const h10 = Math.PI / 10, h20 = Math.PI / 20;
    expect(e10).toBeLessThanOrEqual((5 / 384) * h10 ** 4); // Hall & Meyer (1976), max|sin⁗| = 1
    expect(e20).toBeLessThanOrEqual((5 / 384) * h20 ** 4);
    const order = Math.log2(e10 / e20);
    expect(order).toBeGreaterThan(3.7);
    expect(order).toBeLessThan(4.3);
  });
});
