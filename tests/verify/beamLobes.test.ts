/**
 * beamLobes.ts on patterns whose lobes are known in closed form: Gaussian lobes
 * P(φ) = Σ A_i exp(−2(φ − φ_i)²/θ²) (the far-field power of a 2D Gaussian beam in the paraxial
 * limit, θ = 2/(k w0): Goodman, "Introduction to Fourier Optics", 3rd ed., 2005, §3.10). A lobe's
 * share is then A_i θ √(π/2) over the pattern's sum (the lobes well apart); a beam split
 * symmetrically has its main direction on the axis.
 */
import { describe, expect, it } from "vitest";
import { beamLobes } from "../../src/verify/beamLobes.js";
import { expectClose } from "../helpers/close.js";

/** Σ A exp(−2(φ−φc)²/θ²) on a circular 1° grid (φ = 0 … 359°), angles in degrees. */
function pattern(lobes: { centreDeg: number; amp: number }[], thetaDeg: number, floor = 0): Float64Array {
  const p = new Float64Array(360);
  for (let a = 0; a < 360; a++) {
    let v = floor;
    for (const l of lobes) {
      let d = Math.abs(a - l.centreDeg) % 360;
      if (d > 180) d = 360 - d;
      v += l.amp * Math.exp((-2 * d * d) / (thetaDeg * thetaDeg));
    }
    p[a] = v;
  }
  return p;
}

describe("beamLobes", () => {
  it("one Gaussian lobe: its direction (sub-degree by the parabola), all the power, main = peak", () => {
    const r = beamLobes(pattern([{ centreDeg: 30.3, amp: 1 }], 6), 0, 1, true);
    expect(r.lobes).toHaveLength(1);
    expect(Math.abs(r.lobes[0].directionDeg - 30.3)).toBeLessThan(0.05);
    expectClose(r.lobes[0].share, 1, { rel: 1e-6 });
    expect(r.mainDeg).toBe(r.lobes[0].directionDeg);
  });

  it("a beam split symmetrically at ±15°: two lobes with equal shares (½ each), main direction 0°", () => {
    const r = beamLobes(pattern([{ centreDeg: 15, amp: 1 }, { centreDeg: -15, amp: 1 }], 6), 0, 1, true);
    expect(r.lobes.map((l) => Math.round(l.directionDeg * 100) / 100).sort((a, b) => a - b)).toEqual([-15, 15]);
    for (const l of r.lobes) expectClose(l.share, 0.5, { abs: 1e-6 });
    expect(Math.abs(r.mainDeg)).toBeLessThan(1e-9);
  });

  it("unequal lobes 2:1 at 170° and −170°: shares 2/3 and 1/3, main direction their power-weighted mean across ±180°", () => {
    const r = beamLobes(pattern([{ centreDeg: 170, amp: 2 }, { centreDeg: 190, amp: 1 }], 4), 0, 1, true);
    expect(r.lobes).toHaveLength(2);
    const shares = r.lobes.map((l) => l.share).sort();
    expectClose(shares[0], 1 / 3, { abs: 1e-6 });
    expectClose(shares[1], 2 / 3, { abs: 1e-6 });
    // mean of unit vectors at 170° (2/3) and −170° (1/3)
    const c = (2 / 3) * Math.cos((170 * Math.PI) / 180) + (1 / 3) * Math.cos((-170 * Math.PI) / 180);
    const s = (2 / 3) * Math.sin((170 * Math.PI) / 180) + (1 / 3) * Math.sin((-170 * Math.PI) / 180);
    expectClose(r.mainDeg, (Math.atan2(s, c) * 180) / Math.PI, { abs: 0.05 });
  });

  it("a side lobe below half power and ripple on a lobe's flank are not lobes", () => {
    const side = beamLobes(pattern([{ centreDeg: 0, amp: 1 }, { centreDeg: 40, amp: 0.4 }], 6), 0, 1, true);
    expect(side.lobes).toHaveLength(1);
    expect(side.lobes[0].share).toBeLessThan(0.75); // the side lobe's power belongs to no lobe
    // two peaks 4° apart under one envelope: the dip between them stays above half: one lobe
    const ripple = beamLobes(pattern([{ centreDeg: 0, amp: 1 }, { centreDeg: 4, amp: 0.9 }], 3), 0, 1, true);
    expect(ripple.lobes).toHaveLength(1);
  });

  it("open patterns (a reflected half-space, 0.125° … 179.875°): lobes at 60° and 120°, no wrap-around", () => {
    const n = 720, p = new Float64Array(n);
    for (let a = 0; a < n; a++) { const d = (a + 0.5) / 4; p[a] = Math.exp(-2 * ((d - 60) / 5) ** 2) + Math.exp(-2 * ((d - 120) / 5) ** 2); }
    const r = beamLobes(p, 0.125, 0.25, false);
    expect(r.lobes.map((l) => Math.round(l.directionDeg))).toEqual([60, 120]);
    expect(Math.abs(r.mainDeg - 90)).toBeLessThan(1e-6);
  });

  it("no power, no lobes", () => {
    expect(beamLobes(new Float64Array(360), 0, 1, true)).toEqual({ lobes: [], mainDeg: 0 });
  });
});
