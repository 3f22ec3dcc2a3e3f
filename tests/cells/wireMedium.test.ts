import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { complex } from "../../src/core/complex.js";
import { passivityBandwidthBound } from "../../src/cells/passivity.js";
import { EPS0 } from "../../src/cells/physicalConstants.js";
import {
  bandwidthWithinTolerance,
  correctedWirePlasmaHz,
  radiusForTarget,
  radiusForThickWirePlasma,
  thickWirePlasmaHz,
  thinWirePlasmaHz,
  wireDampingRadPerS,
  wireMediumResponse,
  wirePlasma,
} from "../../src/cells/wireMedium.js";
import { expectClose } from "../helpers/close.js";

const air = complex(1);

describe("wire-medium plasma frequency", () => {
  it("thin-wire formula: a = 5 mm, r = 1 µm gives about 8.2 GHz", () => {
    // Pendry, Holden, Stewart, Youngs, PRL 76, 4773 (1996): f_p ≈ 8.2 GHz (from memory; 3 % covers the doubt)
    expectClose(thinWirePlasmaHz(5e-3, 1e-6), 8.2e9, { rel: 0.03 });
  });

  it("the corrected and thick-wire forms agree for thin wires and exceed the thin-wire estimate", () => {
    // Belov et al. 2002 and Maslovski et al. 2002 (constants from memory): for r ≪ a their logarithms
    // differ by ln(2π) − 0.5275 − ln 4 ≈ −0.076, i.e. well under 1 % in f_p at ln(a/r) ≈ 8.5.
    const corr = correctedWirePlasmaHz(5e-3, 1e-6);
    const thick = thickWirePlasmaHz(5e-3, 1e-6);
    expectClose(corr, thick, { rel: 0.01 });
    expect(thick).toBeGreaterThan(thinWirePlasmaHz(5e-3, 1e-6));
    const p = wirePlasma(5e-3, 1e-6);
    expect(p.thinWireApplies).toBe(true);
    expect(wirePlasma(5e-3, 0.5e-3).thinWireApplies).toBe(false);
  });

  it("thick-wire form diverges as the wires touch and its inverse undoes it", () => {
    expect(thickWirePlasmaHz(1, 0.4999999)).toBeGreaterThan(thickWirePlasmaHz(1, 0.3));
    expect(Number.isNaN(thickWirePlasmaHz(1, 0.5))).toBe(true);
    for (const r of [1e-7, 1e-4, 1e-2, 0.2, 0.45]) {
      expectClose(radiusForThickWirePlasma(1, thickWirePlasmaHz(1, r)), r, { rel: 1e-9, label: `r=${r}` });
    }
  });

  it("damping at DC equals Pendry's γ = ε₀a²ωp²/(πr²σ)", () => {
    // Pendry, Holden, Robbins, Stewart, JPCM 10, 4785 (1998); at 1 kHz the skin depth of copper (~2 mm) ≫ r
    const a = 5e-3, r = 1e-6, sigma = 5.8e7, fp = 8e9;
    const wp = 2 * Math.PI * fp;
    expectClose(wireDampingRadPerS(a, r, fp, sigma, 1e3), (EPS0 * a * a * wp * wp) / (Math.PI * r * r * sigma), { rel: 1e-12 });
    expect(wireDampingRadPerS(a, r, fp, Infinity, 1e9)).toBe(0);
  });
});

describe("ε(ω) and the radius for a target", () => {
  it("a lossless Drude wire medium: ε = 1 − ωp²/ω² (Pendry 1996)", () => {
    const r = wireMediumResponse({ pitchM: 5e-3, radiusM: 1e-6, frequencyHz: 5e9, hostEps: air, conductivitySPerM: Infinity });
    expectClose(r.eps.re, 1 - (r.plasma.usedHz / 5e9) ** 2, { rel: 1e-12 });
    expect(r.eps.im).toBe(0);
  });

  it("lossy wires are passive: Im ε ≥ 0", () => {
    fc.assert(
      fc.property(fc.double({ min: 1e-6, max: 0.2, noNaN: true }), fc.double({ min: 1e8, max: 1e11, noNaN: true }), (ratio, f) => {
        return wireMediumResponse({ pitchM: 5e-3, radiusM: ratio * 5e-3, frequencyHz: f, hostEps: air, conductivitySPerM: 5.8e7 }).eps.im >= 0;
      }),
      { seed: 42, numRuns: 200 },
    );
  });

  it("radiusForTarget reaches the target, lossless and with copper", () => {
    for (const sigma of [Infinity, 5.8e7]) {
      for (const t of [-3, -0.5, 0.2, 0.6]) {
        const r = radiusForTarget(t, 20e-3, 3e9, air, sigma);
        expect(r.converged, `σ=${sigma} t=${t}`).toBe(true);
        expectClose(r.achieved.re, t, { abs: 1e-8, label: `σ=${sigma} t=${t}` });
      }
    }
  });

  it("refuses targets at or above the host, and those needing absurdly thin wires", () => {
    expect(Number.isNaN(radiusForTarget(1.2, 5e-3, 5e9, air, Infinity).radiusM)).toBe(true);
    expect(radiusForTarget(1.2, 5e-3, 5e9, air, Infinity).reason).toMatch(/not below/);
    // at a = 5 mm, 5 GHz even r = 1e-7·a gives f_p ≈ 6 GHz > 5 GHz, so ε' = 0.99 is out of reach
    const thin = radiusForTarget(0.99, 5e-3, 5e9, air, Infinity);
    expect(Number.isNaN(thin.radiusM)).toBe(true);
    expect(thin.reason).toMatch(/thinner than/);
  });
});

describe("bandwidth and the passivity bound", () => {
  it("a lossless Drude wire medium meets the strong bound exactly", () => {
    // Landau–Lifshitz §84 (from memory): dε/dω ≥ 2(1−ε)/ω; for ε = 1 − ωp²/ω², dε/dω = 2ωp²/ω³ = 2(1−ε)/ω.
    const input = { pitchM: 5e-3, radiusM: 1e-6, frequencyHz: 5e9, hostEps: air, conductivitySPerM: Infinity };
    const eps = (f: number) => wireMediumResponse({ ...input, frequencyHz: f }).eps.re;
    const w = 2 * Math.PI * 5e9;
    const h = 5e9 * 1e-5;
    const slope = (eps(5e9 + h) - eps(5e9 - h)) / (2 * Math.PI * 2 * h);
    expectClose(slope, (2 * (1 - eps(5e9))) / w, { rel: 1e-8 });
    // so a small tolerance band has the strong bound's width, δ/(1−ε₀)
    const e0 = eps(5e9);
    const delta = 1e-4 * (1 - e0);
    const band = bandwidthWithinTolerance(input, e0, delta);
    expectClose(band.fractional, passivityBandwidthBound(e0, delta)!.strong, { rel: 1e-6 });
  });

  it("the band of a lossless Drude medium matches its closed form", () => {
    // from ε = 1 − ωp²/ω²: ω(ε) = ωp/sqrt(1−ε), band = sqrt(1−ε₀)(1/sqrt(1−ε₀−δ) − 1/sqrt(1−ε₀+δ))
    const input = { pitchM: 20e-3, radiusM: 1e-5, frequencyHz: 3e9, hostEps: air, conductivitySPerM: Infinity };
    const e0 = wireMediumResponse(input).eps.re;
    const d = 0.1;
    const u = 1 - e0;
    expectClose(bandwidthWithinTolerance(input, e0, d).fractional, Math.sqrt(u) * (1 / Math.sqrt(u - d) - 1 / Math.sqrt(u + d)), { rel: 1e-9 });
  });

  it("bandwidth within tolerance ≤ the weak passivity bound, over targets", () => {
    fc.assert(
      fc.property(fc.double({ min: -3, max: 0.7, noNaN: true }), fc.double({ min: 0.001, max: 0.5, noNaN: true }), (target, share) => {
        const r = radiusForTarget(target, 20e-3, 3e9, air, Infinity);
        if (!Number.isFinite(r.radiusM)) return false;
        const delta = share * (1 - target);
        const band = bandwidthWithinTolerance({ pitchM: 20e-3, radiusM: r.radiusM, frequencyHz: 3e9, hostEps: air, conductivitySPerM: Infinity }, target, delta);
        const bound = passivityBandwidthBound(target, delta)!;
        return band.fractional > 0 && band.fractional <= bound.weak;
      }),
      { seed: 42, numRuns: 100 },
    );
  });

  it("passivity bound: 2Δε/(1−ε₀) weak, Δε/(1−ε₀) strong, none at or above the limit", () => {
    const b = passivityBandwidthBound(0.5, 0.05)!;
    expectClose([b.weak, b.strong], [0.2, 0.1], { rel: 1e-12 });
    expect(passivityBandwidthBound(1, 0.05)).toBeNull();
    expect(passivityBandwidthBound(0.3, 0.05, 0.2)).toBeNull();
  });
});
