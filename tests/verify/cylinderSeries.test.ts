import { describe, expect, it } from "vitest";
import { cylinderSeries, seriesExtinctionWidth, seriesScatteredField, seriesScatteringWidth } from "../../src/verify/cylinderSeries.js";
import { expectClose } from "../helpers/close.js";

const k0 = 2 * Math.PI; // λ0 = 1 m

describe("cylinder scattering series", () => {
  it("a lossless cylinder: extinction equals scattering (optical theorem, Bohren & Huffman 1983 §3.4, §8.4)", () => {
    for (const pol of ["Ez", "Hz"] as const) {
      for (const interior of [{ kind: "dielectric" as const, eps: 4, mu: 1 }, { kind: "dielectric" as const, eps: 2, mu: 3 }, { kind: "pec" as const }]) {
        const s = cylinderSeries({ polarization: pol, radiusM: 0.37, k0, background: { eps: 1, mu: 1 }, interior });
        expectClose(seriesExtinctionWidth(s), seriesScatteringWidth(s), { rel: 1e-10, label: `${pol} ${interior.kind}` });
      }
    }
  });

  it("matching interior scatters nothing", () => {
    const s = cylinderSeries({ polarization: "Ez", radiusM: 0.5, k0, background: { eps: 2.25, mu: 1 }, interior: { kind: "dielectric", eps: 2.25, mu: 1 } });
    expect(seriesScatteringWidth(s)).toBeLessThan(1e-25);
  });

  it("thin dielectric cylinder, Ez: σ → (π²/4) k³ a⁴ (ε − 1)² (the n = 0 term in the small-argument limit; derived from the series of Bohren & Huffman 1983 §8.4 with J0(x) ≈ 1 − x²/4)", () => {
    const a = 0.001, eps = 3; // ka ≈ 0.006: the next correction is O((ka)² ln ka) ≈ 2e-4
    const s = cylinderSeries({ polarization: "Ez", radiusM: a, k0, background: { eps: 1, mu: 1 }, interior: { kind: "dielectric", eps, mu: 1 } });
    expectClose(seriesScatteringWidth(s), ((Math.PI ** 2) / 4) * k0 ** 3 * a ** 4 * (eps - 1) ** 2, { rel: 1e-3, label: "Rayleigh width" });
  });

  it("PEC, Ez: a_n = −J_n(ka)/H_n(ka); the field on the surface cancels the incident wave", () => {
    const a = 0.4;
    const s = cylinderSeries({ polarization: "Ez", radiusM: a, k0, background: { eps: 1, mu: 1 }, interior: { kind: "pec" } });
    const n = 16, r = a * (1 + 1e-9);
    const xs = Float64Array.from({ length: n }, (_, p) => r * Math.cos((2 * Math.PI * p) / n));
    const ys = Float64Array.from({ length: n }, (_, p) => r * Math.sin((2 * Math.PI * p) / n));
    const re = new Float64Array(n), im = new Float64Array(n);
    seriesScatteredField(s, xs, ys, re, im);
    for (let p = 0; p < n; p++) {
      // u_inc + u_s = 0 on a perfect conductor for E along its axis
      expectClose(re[p] + Math.cos(k0 * xs[p]), 0, { abs: 1e-7, label: `Re u at ${p}` });
      expectClose(im[p] + Math.sin(k0 * xs[p]), 0, { abs: 1e-7, label: `Im u at ${p}` });
    }
  });

  it("points inside the cylinder give NaN, not a silent number", () => {
    const s = cylinderSeries({ polarization: "Hz", radiusM: 0.4, k0, background: { eps: 1, mu: 1 }, interior: { kind: "pec" } });
    const re = new Float64Array(1), im = new Float64Array(1);
    seriesScatteredField(s, [0.1], [0], re, im);
    expect(Number.isNaN(re[0])).toBe(true);
  });
});
