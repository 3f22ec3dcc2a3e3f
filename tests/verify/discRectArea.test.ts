/**
 * The exact disc ∩ rectangle area (discRectArea.ts) against closed forms: the circular segment of
 * height r − d has area r² acos(d/r) − d √(r² − d²) (Weisstein, "Circular Segment", MathWorld;
 * any table of plane areas), the whole disc πr², a quarter disc πr²/4, a rectangle inside the disc
 * its own area, and additivity when the rectangle is split.
 */
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { discRectArea } from "../../src/verify/discRectArea.js";
import { expectClose } from "../helpers/close.js";

const segment = (r: number, d: number): number => r * r * Math.acos(d / r) - d * Math.sqrt(r * r - d * d);

describe("discRectArea", () => {
  it("matches the closed forms: whole disc, quarter, segment, rectangle inside", () => {
    expectClose(discRectArea(0.3, -0.2, 1.5, -5, 5, -5, 5), Math.PI * 2.25, { rel: 1e-14, label: "whole disc" });
    expectClose(discRectArea(1, 2, 0.5, 1, 9, 2, 9), Math.PI * 0.25 / 4, { rel: 1e-14, label: "quarter" });
    for (const d of [-0.9, -0.4, 0, 0.35, 0.8, 0.999]) {
      // the part of the unit disc right of x = d
      expectClose(discRectArea(0, 0, 1, d, 3, -3, 3), segment(1, d), { rel: 1e-12, abs: 1e-15, label: `segment beyond ${d}` });
      // the same cut along y, with the disc moved
      expectClose(discRectArea(2, -1, 1, -3, 7, -1 + d, 4), segment(1, d), { rel: 1e-12, abs: 1e-15, label: `segment above ${d}` });
    }
    expectClose(discRectArea(0, 0, 1, -0.3, 0.3, -0.2, 0.5), 0.6 * 0.7, { rel: 1e-14, label: "rectangle inside" });
  });

  it("is zero for empty rectangles, zero radius and rectangles clear of the disc", () => {
    expect(discRectArea(0, 0, 1, 1, 1, -1, 1)).toBe(0);
    expect(discRectArea(0, 0, 1, -1, 1, 2, 1)).toBe(0);
    expect(discRectArea(0, 0, 0, -1, 1, -1, 1)).toBe(0);
    expect(discRectArea(0, 0, 1, 0.8, 2, 0.8, 2)).toBe(0); // the corner (0.8, 0.8) lies outside the unit disc
    expect(discRectArea(0, 0, 1, NaN, 1, -1, 1)).toBe(0);
  });

  it("adds up over a split rectangle and never exceeds the rectangle or the disc (property, fixed seed)", () => {
    fc.assert(fc.property(
      fc.double({ min: -2, max: 2, noNaN: true }), fc.double({ min: -2, max: 2, noNaN: true }), fc.double({ min: 0.01, max: 2, noNaN: true }),
      fc.double({ min: -3, max: 3, noNaN: true }), fc.double({ min: 0.01, max: 3, noNaN: true }), fc.double({ min: -3, max: 3, noNaN: true }), fc.double({ min: 0.01, max: 3, noNaN: true }),
      fc.double({ min: 0, max: 1, noNaN: true }),
      (cx, cy, r, x0, w, y0, hgt, t) => {
        const whole = discRectArea(cx, cy, r, x0, x0 + w, y0, y0 + hgt);
        const xm = x0 + t * w;
        const parts = discRectArea(cx, cy, r, x0, xm, y0, y0 + hgt) + discRectArea(cx, cy, r, xm, x0 + w, y0, y0 + hgt);
        expect(Math.abs(whole - parts)).toBeLessThan(1e-12 * (1 + whole));
        expect(whole).toBeLessThanOrEqual(w * hgt * (1 + 1e-12));
        expect(whole).toBeLessThanOrEqual(Math.PI * r * r * (1 + 1e-12));
      }), { seed: 20261203, numRuns: 500 });
  });
});
