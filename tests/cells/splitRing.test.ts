import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { passivityBandwidthBound } from "../../src/cells/passivity.js";
import {
  designSplitRing,
  lorentzMu,
  ringGapForResonance,
  resonanceForTargetMu,
  splitRingBandwidth,
  splitRingFill,
  splitRingResonanceHz,
  splitRingResponse,
} from "../../src/cells/splitRing.js";
import { expectClose } from "../helpers/close.js";

// μ = 1 − Fω²/(ω² − ω0² + iΓω), F = πr²/a² (Pendry, Holden, Robbins, Stewart, IEEE MTT 47, 2075 (1999); form from memory)

describe("Lorentz permeability of split rings", () => {
  it("F = πr²/a²", () => {
    expectClose(splitRingFill(1e-3, 4e-3), Math.PI / 16, { rel: 1e-15 });
  });

  it("μ → 1 − F far above the resonance and → 1 far below", () => {
    const F = 0.3;
    expectClose(lorentzMu(F, 1e9, 1e7, 1e15).re, 1 - F, { rel: 1e-9 });
    expectClose(lorentzMu(F, 1e9, 1e7, 1e3).re, 1, { rel: 1e-9 });
  });

  it("resonance at ω0: Re μ = 1 and Im μ = Fω0/Γ there; lossless, μ' − 1 changes sign across ω0", () => {
    // at ω = ω0 the denominator is iΓω0, so μ = 1 + iFω0/Γ (from the Lorentz form)
    const F = 0.2, f0 = 5e9, gamma = 1e8;
    const m = lorentzMu(F, f0, gamma, f0);
    expectClose(m.re, 1, { abs: 1e-12 });
    expectClose(m.im, (F * 2 * Math.PI * f0) / gamma, { rel: 1e-12 });
    expect(lorentzMu(F, f0, 0, f0 * 0.999).re).toBeGreaterThan(1);
    expect(lorentzMu(F, f0, 0, f0 * 1.001).re).toBeLessThan(0);
  });

  it("Im μ ≥ 0 with loss (passive under exp(−iωt))", () => {
    fc.assert(
      fc.property(fc.double({ min: 0.01, max: 0.7, noNaN: true }), fc.double({ min: 1e-3, max: 1e3, noNaN: true }), fc.double({ min: 1e-4, max: 1, noNaN: true }), (F, ratio, g) => {
        return lorentzMu(F, 1e9, g * 2 * Math.PI * 1e9, ratio * 1e9).im >= 0;
      }),
      { seed: 42, numRuns: 200 },
    );
  });

  it("ring gap for a resonance and the resonance of that gap agree", () => {
    const g = { pitchM: 5e-3, ringRadiusM: 1.5e-3, ringWidthM: 0.2e-3, stackSpacingM: 0.5e-3 };
    const d = ringGapForResonance(g, 30e9);
    expectClose(splitRingResonanceHz({ ...g, ringGapM: d }), 30e9, { rel: 1e-12 });
    expect(Number.isNaN(splitRingResonanceHz({ ...g, ringGapM: 0.5e-3 }))).toBe(true);
  });

  it("the resonance chosen for a target gives it (lossless), and μ' in (1−F, 1) is out of reach", () => {
    const F = 0.25;
    for (const t of [-2, 0, 0.5, 1.8]) {
      const c = resonanceForTargetMu(t, 10e9, F);
      expectClose(lorentzMu(F, c.resonanceHz, 0, 10e9).re, t, { abs: 1e-9, label: `μ'=${t}` });
    }
    expect(resonanceForTargetMu(0.9, 10e9, F).reason).toMatch(/use smaller rings/);
  });

  it("lossless rings stay inside the strong passivity bound with μ∞ = 1 − F", () => {
    // dμ/dω = 2(μ∞−μ)/ω · ω²/(ω²−ω0²) ≥ 2(μ∞−μ)/ω above resonance (derived from the Lorentz form)
    const F = 0.3;
    for (const t of [-1, 0, 0.3, 0.6]) {
      const c = resonanceForTargetMu(t, 10e9, F);
      const resp = { fill: F, resonanceHz: c.resonanceHz, magneticPlasmaHz: NaN, muHighFrequency: 1 - F, gammaRadPerS: 0, skinDepthM: 0, mu: lorentzMu(F, c.resonanceHz, 0, 10e9) };
      const delta = 1e-3;
      const band = splitRingBandwidth(resp, 10e9, t, delta);
      expect(band.fractional).toBeGreaterThan(0);
      expect(band.fractional).toBeLessThanOrEqual(passivityBandwidthBound(t, delta, 1 - F)!.strong * (1 + 1e-6));
    }
  });

  it("designs rings for a target μ with loss from copper", () => {
    const d = designSplitRing({ pitchM: 10e-3, frequencyHz: 3e9, targetMu: 0.3, conductivitySPerM: 5.8e7, stackSpacingM: 1e-3 });
    expect(d.geometry).not.toBeNull();
    expectClose(d.response!.mu.re, 0.3, { abs: 0.02 });
    expect(d.response!.mu.im).toBeGreaterThan(0);
    const again = splitRingResponse(d.geometry!, 5.8e7, 3e9);
    expectClose(again.resonanceHz, d.response!.resonanceHz, { rel: 1e-9 });
  });
});
