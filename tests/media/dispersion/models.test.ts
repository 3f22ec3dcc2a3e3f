import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { debyePermittivity } from "../../../src/media/dispersion/debye.js";
import { waterDebyeTerms } from "../../../src/media/dispersion/debyeWater.js";
import { SPEED_OF_LIGHT, VACUUM_PERMITTIVITY } from "../../../src/media/dispersion/dispersionModel.js";
import { drudeDcConductivity } from "../../../src/media/dispersion/drude.js";
import { DISPERSION_MODELS } from "../../../src/media/dispersion/registry.js";
import { wavelengthUm } from "../../../src/media/dispersion/sellmeier.js";
import { validateDispersionParams } from "../../../src/media/dispersion/validateParams.js";
import { expectClose } from "../../helpers/close.js";

const hzOfUm = (um: number) => SPEED_OF_LIGHT / (um * 1e-6);
const hzOfCm1 = (cm1: number) => cm1 * 100 * SPEED_OF_LIGHT;

describe("dispersion models", () => {
  it("Sellmeier with Malitson's coefficients: fused silica n(0.5876 µm) = 1.45846 (Malitson, JOSA 55, 1205 (1965))", () => {
    const p = { b1: 0.6961663, c1_um2: 0.0684043 ** 2, b2: 0.4079426, c2_um2: 0.1162414 ** 2, b3: 0.8974794, c3_um2: 9.896161 ** 2 };
    const eps = DISPERSION_MODELS.sellmeier.evaluate(p, hzOfUm(0.5876));
    expectClose(Math.sqrt(eps.re), 1.45846, { abs: 5e-6 });
    expect(eps.im).toBe(0);
  });

  it("Debye: static limit ε_s, high-frequency limit ε∞, loss peak (ε_s − ε∞)/2 at ωτ = 1 (Debye 1929, from the formula)", () => {
    const tau = 1e-11;
    expectClose(debyePermittivity(80, 5, tau, 1).re, 80, { rel: 1e-12 });
    expectClose(debyePermittivity(80, 5, tau, 1e18).re, 5, { rel: 1e-9 });
    const peak = debyePermittivity(80, 5, tau, 1 / (2 * Math.PI * tau));
    expectClose([peak.re, peak.im], [42.5, 37.5], { rel: 1e-12, label: "ωτ = 1" });
  });

  it("water at 25 °C: ε_s ≈ 78.4 and τ ≈ 8.27 ps (Kaatze, J. Chem. Eng. Data 34, 371 (1989))", () => {
    const t = waterDebyeTerms(25);
    expectClose(t.epsStatic, 78.4, { abs: 0.05, label: "ε_s" });
    expectClose(t.tauS, 8.27e-12, { rel: 2e-3, label: "τ" });
    // ε∞ = 5.77 − 2.74e-2·25 = 5.085 (Kaatze's fit, evaluated by hand)
    expectClose(t.epsInf, 5.085, { rel: 1e-12, label: "ε∞" });
    // colder water relaxes more slowly and has a higher static permittivity (same fits)
    expect(waterDebyeTerms(5).tauS).toBeGreaterThan(t.tauS);
    expect(waterDebyeTerms(5).epsStatic).toBeGreaterThan(t.epsStatic);
  });

  it("Drude with Ordal's gold parameters equals 1 − ω_p²/(ω(ω + iω_τ)) evaluated in cm⁻¹ (Ordal et al., Appl. Opt. 22, 1099 (1983))", () => {
    const p = { eps_inf: 1, plasma_hz: hzOfCm1(72800), gamma_hz: hzOfCm1(215) };
    for (const w of [100, 1000, 5000]) {
      // ε = 1 − 72800²/(w² + i·215·w) in wavenumbers
      const d = w * w * w * w + (215 * w) ** 2;
      const expected = { re: 1 - (72800 ** 2 * w * w) / d, im: (72800 ** 2 * 215 * w) / d };
      const eps = DISPERSION_MODELS.drude.evaluate(p, hzOfCm1(w));
      expectClose([eps.re, eps.im], [expected.re, expected.im], { rel: 1e-12, label: `${w} cm⁻¹` });
    }
  });

  it("Drude's low-frequency limit is the conduction term iσ/(ωε₀) with σ = ε₀ω_p²/Γ (free-electron model, identity)", () => {
    const fp = hzOfCm1(72800);
    const g = hzOfCm1(215);
    const sigma = drudeDcConductivity(fp, g);
    const f = 1e6;
    const eps = DISPERSION_MODELS.drude.evaluate({ eps_inf: 1, plasma_hz: fp, gamma_hz: g }, f);
    expectClose(eps.im, sigma / (2 * Math.PI * f * VACUUM_PERMITTIVITY), { rel: 1e-6 });
    // Ordal's gold Drude fit implies σ ≈ 4.1e7 S/m, the handbook DC value (CRC handbook, from memory)
    expectClose(sigma, 4.1e7, { rel: 0.03 });
  });

  it("Lorentz: ε(0) = ε∞ + ΣΔε; silicon carbide crosses zero near ω_LO (Lyddane–Sachs–Teller; Spitzer's SiC values, from memory)", () => {
    const p = { eps_inf: 6.7, pole1_delta_eps: (6.7 * (969 ** 2 - 793 ** 2)) / 793 ** 2, pole1_f0_hz: hzOfCm1(793), pole1_gamma_hz: hzOfCm1(4.76) };
    expectClose(DISPERSION_MODELS.lorentz.evaluate(p, 1).re, 6.7 * (969 / 793) ** 2, { rel: 1e-9, label: "static" });
    expectClose(DISPERSION_MODELS.lorentz.evaluate(p, hzOfCm1(969)).re, 0, { abs: 0.01, label: "at LO" });
    expect(DISPERSION_MODELS.lorentz.evaluate(p, hzOfCm1(850)).re).toBeLessThan(0); // reststrahlen band
  });

  it("constant with tan δ and conductivity: ε = ε'(1 + i tan δ) + iσ/(ωε₀) (Pozar, Microwave Engineering, §1.3)", () => {
    const eps = DISPERSION_MODELS.constant.evaluate({ eps_r: 11.68, tan_delta: 0, sigma_s_per_m: 0.01 }, 1e10);
    // tan δ = σ/(ω ε₀ ε') as in references.md for high-resistivity silicon
    expectClose(eps.im / eps.re, 0.01 / (2 * Math.PI * 1e10 * VACUUM_PERMITTIVITY * 11.68), { rel: 1e-12 });
  });

  it("parameter validation names unknown, missing and out-of-sign parameters", () => {
    const m = DISPERSION_MODELS.constant;
    expect(validateDispersionParams(m, { eps_r: 2, tan_delt: 0.1 }).map((i) => i.message).join("\n")).toMatch(/unknown parameter 'tan_delt'.*did you mean tan_delta/);
    expect(validateDispersionParams(m, { eps_r: 2 }).map((i) => i.message).join()).toMatch(/needs tan_delta/);
    expect(validateDispersionParams(m, { eps_r: 2, tan_delta: -1 }).map((i) => i.message).join()).toMatch(/tan_delta must be ≥ 0/);
    expect(validateDispersionParams(DISPERSION_MODELS.lorentz, { eps_inf: 1, pole2_delta_eps: 1, pole2_f0_hz: 1, pole2_gamma_hz: 1 }).map((i) => i.message).join()).toMatch(/without gaps/);
    expect(validateDispersionParams(DISPERSION_MODELS.debye, { eps_s: 2, eps_inf: 5, tau_s: 1e-9 }).map((i) => i.message).join()).toMatch(/eps_s must be ≥ eps_inf/);
    expect(validateDispersionParams(DISPERSION_MODELS.sellmeier, { b1: 1 }).map((i) => i.message).join()).toMatch(/needs c1_um2/);
  });

  it("every model is passive (Im ε ≥ 0) for passive parameters at any frequency", () => {
    const samples: Record<string, Record<string, number>> = {
      constant: { eps_r: 3, tan_delta: 0.01, sigma_s_per_m: 1 },
      debye: { eps_s: 80, eps_inf: 5, tau_s: 1e-11 },
      "debye-water": { temperature_c: 20 },
      lorentz: { eps_inf: 2, pole1_delta_eps: 3, pole1_f0_hz: 1e13, pole1_gamma_hz: 1e11, pole2_delta_eps: 1, pole2_f0_hz: 1e15, pole2_gamma_hz: 1e13 },
      drude: { eps_inf: 1, plasma_hz: 2e15, gamma_hz: 1e13 },
      "drude-lorentz": { eps_inf: 5, plasma_hz: 2e15, gamma_hz: 1e13, pole1_delta_eps: 1, pole1_f0_hz: 6e14, pole1_gamma_hz: 1e14 },
      sellmeier: { b1: 1, c1_um2: 0.01 },
    };
    for (const [id, model] of Object.entries(DISPERSION_MODELS)) {
      expect(validateDispersionParams(model, samples[id]), id).toEqual([]);
      fc.assert(
        fc.property(fc.double({ min: 0, max: 17, noNaN: true }), (logF) => {
          const eps = model.evaluate(samples[id], 10 ** logF);
          expect(eps.im, `${id} at 1e${logF} Hz`).toBeGreaterThanOrEqual(0);
        }),
        { seed: 42, numRuns: 200 },
      );
    }
  });

  it("wavelength conversion: 1550 nm ↔ 193.41 THz (c exact)", () => {
    expectClose(wavelengthUm(193.414489e12), 1.55, { rel: 1e-8 });
  });
});
