/**
 * The beam figures of verifyDevice (`--beam`): the share of the outgoing power delivered into the
 * intended output lobe and the deviation of the output direction, against analytic cases.
 *
 * - A 2D Gaussian beam of waist w0 is the angular spectrum a(θ) = exp(−(k w0 sin θ)²/4)·k cos θ,
 *   |θ| < π/2 (Goodman, "Introduction to Fourier Optics", 3rd ed., 2005, §3.10; illumination.ts);
 *   through vacuum its far-field power pattern is |a(φ − φ0)|², so the delivered share is
 *   ∫_{−Θ}^{Θ}|a|² / ∫_{−π/2}^{π/2}|a|², Θ the lobe half-width, computed here by quadrature, and the
 *   output direction is φ0 (deviation 0).
 * - A lossless block symmetric about the beam axis cannot turn the beam (mirror symmetry): the
 *   deviation is 0 and no power is lost (power balance by the optical theorem, Bohren & Huffman 1983).
 * - A flat perfect conductor reflects the beam specularly (image theory: Balanis, "Advanced
 *   Engineering Electromagnetics", 2nd ed., 2012, §7.4): the output direction is the mirror angle
 *   −φ0 and the reflected share equals the incident beam's lobe share above.
 * - The ideal beam shifter (Rahm, Cummer, Schurig, Pendry & Smith, Phys. Rev. Lett. 100, 063903
 *   (2008)) moves the beam sideways without tilting it: deviation ≈ 0.
 * - A beam wider than a symmetric block is split in two mirror lobes (waist 2λ on a 1.2λ block of
 *   ε = 2.2): by the same mirror symmetry the lobes sit at ±θ with equal power and the main
 *   direction (their power-weighted mean, beamLobes.ts) is the axis: deviation 0, two lobes
 *   reported (it used to report one of the two peaks, 15°).
 */
import { describe, expect, it } from "vitest";
import { join } from "node:path";
import { loadDesign } from "../../src/io/design/loadDesign.js";
import { loadFieldForDesign } from "../../src/io/fieldCsv.js";
import { reduceField } from "../../src/reduce/reduceField.js";
import { deviceCases } from "../../src/verify/deviceCases.js";
import type { Illumination } from "../../src/verify/illumination.js";
import { SAMPLE_MEDIUM, S_B, S_TXX, S_TXY, S_TYY, emptyScene, type Scene } from "../../src/verify/scene.js";
import { verifyDevice, type CaseSpec } from "../../src/verify/verifyDevice.js";
import { expectClose } from "../helpers/close.js";

const C0 = 299_792_458;
const f = 10e9, lambda = C0 / f, k = (2 * Math.PI) / lambda;
const vacuum = { eps: 1, mu: 1 };

/** Delivered share of a beam of waist w0 through vacuum into ±halfRad (Simpson's rule on the angular power spectrum). */
function analyticShare(w0: number, halfRad: number): number {
  const p = (t: number): number => Math.exp(-((k * w0 * Math.sin(t)) ** 2) / 2) * Math.cos(t) ** 2;
  const simpson = (a: number, b: number, n = 4000): number => {
    const h = (b - a) / n;
    let s = p(a) + p(b);
    for (let i = 1; i < n; i++) s += (i % 2 ? 4 : 2) * p(a + i * h);
    return (s * h) / 3;
  };
  return simpson(-halfRad, halfRad) / simpson(-Math.PI / 2, Math.PI / 2);
}

/** Lobe half-width used by verifyDevice: 1.5 × the far-field 1/e² half-angle 2/(k w0), at least 3° (common practice for "within the beam"). */
const lobeHalf = (w0: number): number => Math.max((3 * Math.PI) / 180, (1.5 * 2) / (k * w0));

function block(side: number, eps: number): Scene {
  const h = side / 2;
  return {
    polarization: "Ez", background: vacuum, bounds: { minX: -h, maxX: h, minY: -h, maxY: h },
    sample(x, y, out) {
      if (Math.abs(x) > h || Math.abs(y) > h) return 0;
      out[S_B] = eps; out[S_B + 1] = 0; out[S_TXX] = 1; out[S_TXX + 1] = 0; out[S_TYY] = 1; out[S_TYY + 1] = 0; out[S_TXY] = 0; out[S_TXY + 1] = 0;
      return SAMPLE_MEDIUM;
    },
  };
}

function beamRun(cases: CaseSpec[], ill: Illumination, box: { minX: number; maxX: number; minY: number; maxY: number }, extra: Partial<Parameters<typeof verifyDevice>[0]> = {}) {
  return verifyDevice({ polarization: "Ez", background: vacuum, frequencyHz: f, deviceBox: box, cases, illumination: ill, resolution: 12, marginM: 0.6 * lambda, ...extra });
}

describe("beam figures against analytic cases", () => {
  const w0 = 2 * lambda;
  it.each([30, -170])("a beam at %d° through vacuum: delivered share = the angular spectrum's lobe share, deviation 0", (deg) => {
    const ang = (deg * Math.PI) / 180;
    const ill: Illumination = { kind: "beam", angleRad: ang, waistM: w0, focusM: [0, 0] };
    // no ideal case: the intended direction is the beam's own
    const r = beamRun([{ name: "reduced", scene: emptyScene("Ez", vacuum), indexHint: 1 }], ill, { minX: -lambda, maxX: lambda, minY: -lambda, maxY: lambda });
    const c = r.cases[0];
    const expected = analyticShare(w0, lobeHalf(w0));
    expect(expected).toBeGreaterThan(0.99); // ≈ erf(1.5·√2) = 0.9973 in the paraxial limit
    expectClose(c.deliveredPower!, expected, { abs: 2e-3, label: "delivered share (1° far-field sampling)" });
    expect(Math.abs(c.deviationDeg!)).toBeLessThan(0.05);
    expect(Math.abs(c.scatteringWidthM!)).toBeLessThan(1e-9 * lambda);
  });

  it("a lossless block centred on the beam axis does not turn the beam (mirror symmetry) and loses no power", () => {
    const side = 3 * lambda;
    const ill: Illumination = { kind: "beam", angleRad: 0, waistM: lambda, focusM: [0, 0] };
    const r = beamRun([{ name: "reduced", scene: block(side, 2.2), indexHint: Math.sqrt(2.2) }], ill, { minX: -side / 2, maxX: side / 2, minY: -side / 2, maxY: side / 2 });
    const c = r.cases[0];
    expect(Math.abs(c.deviationDeg!)).toBeLessThan(0.05);
    expect(c.scatteringWidthM!).toBeGreaterThan(0.01 * lambda); // the block does scatter
    expect(c.deliveredPower!).toBeLessThan(analyticShare(lambda, lobeHalf(lambda)));
    expect(Math.abs(c.absorptionWidthM!) / c.scatteringWidthM!).toBeLessThan(1e-6);
  });

  it("a beam wider than a symmetric block splits into two mirror lobes of equal power; the main direction stays on the axis", () => {
    const side = 1.2 * lambda;
    const ill: Illumination = { kind: "beam", angleRad: 0, waistM: 2 * lambda, focusM: [0, 0] };
    const r = beamRun([{ name: "reduced", scene: block(side, 2.2), indexHint: Math.sqrt(2.2) }], ill, { minX: -side / 2, maxX: side / 2, minY: -side / 2, maxY: side / 2 });
    const c = r.cases[0];
    expect(c.lobes).toHaveLength(2);
    const [a, b] = c.lobes!;
    expect(Math.abs(a.directionDeg + b.directionDeg), "mirror directions").toBeLessThan(0.05);
    expect(Math.abs(a.directionDeg)).toBeGreaterThan(5); // measured ±15.05° at 12 points per wavelength
    expectClose(a.share, b.share, { rel: 1e-3, label: "equal lobe powers" });
    expect(Math.abs(c.deviationDeg!)).toBeLessThan(0.05);
  });

  it.each(["Ez", "Hz"] as const)("%s: a beam at −60° on a flat conducting ground leaves at the mirror angle +60° with the incident lobe share (image theory)", (pol) => {
    const ang = (-60 * Math.PI) / 180;
    const ill: Illumination = { kind: "beam", angleRad: ang, waistM: w0, focusM: [0, 0] };
    const r = verifyDevice({
      polarization: pol, background: vacuum, frequencyHz: f, deviceBox: { minX: -lambda, maxX: lambda, minY: 0, maxY: lambda },
      cases: [{ name: "flat", scene: emptyScene(pol, vacuum), indexHint: 1 }], illumination: ill, groundYM: 0, resolution: 12, marginM: 2 * lambda,
    });
    const c = r.cases[0];
    expect(Math.abs(c.deviationDeg!), "deviation from the specular direction").toBeLessThan(0.05);
    expectClose(c.deliveredPower!, analyticShare(w0, lobeHalf(w0)), { abs: 3e-3, label: "specular share" });
    expect(Math.abs(c.powerBalance!), "reflected + absorbed = incident").toBeLessThan(0.01);
  }, 60_000);

  it("the ideal beam shifter of the demo moves the beam without tilting it (Rahm et al. 2008): deviation ≈ 0, nearly all power in the lobe", async () => {
    const design = await loadDesign(join(import.meta.dirname, "..", "..", "demo-designs", "field-beam-shifter.json"), process.cwd());
    const field = await loadFieldForDesign(design);
    const ideal = reduceField(field, { polarization: "Ez", scheme: "full" });
    const built = deviceCases({ transform: design.transform, fieldBackground: design.background, background: vacuum, polarization: "Ez", grid: field.grid, ideal, reduced: ideal, plan: null });
    const spec = built.cases.find((c) => c.name === "ideal")!;
    const b = built.deviceBox, lam = C0 / design.frequencyHz;
    // along +x through the slab, focused at its centre; waist 12 mm: the 1/e² radius stays below the
    // slab's half-height (20 mm) over its length (Rayleigh range π w0²/λ = 36 mm)
    const ill: Illumination = { kind: "beam", angleRad: 0, waistM: 0.012, focusM: [(b.minX + b.maxX) / 2, (b.minY + b.maxY) / 2] };
    // default ladder (12, 17, 24 points per wavelength): measured −0.33° and 0.989 (a single grid at 12
    // gives 2.3°, at 20 −0.6°: the deviation is read on the finest rung, not extrapolated)
    const r = verifyDevice({ polarization: "Ez", background: vacuum, frequencyHz: design.frequencyHz, deviceBox: b, cases: [{ ...spec, name: "reduced" }], illumination: ill, marginM: 0.5 * lam });
    const c = r.cases[0];
    expect(Math.abs(c.deviationDeg!), "output direction minus input direction").toBeLessThan(1);
    expect(c.deliveredPower!).toBeGreaterThan(0.95);
  }, 120_000);
});
