/**
 * widthReading.ts: a scattering width is never negative, its uncertainty near zero is judged on the
 * problem's scale, and a width the check cannot tell from zero reads "≈ 0, below X". The grid's
 * noise floor is measured here: a vacuum scene and an identity-map device (a disk whose tensor is the
 * background's, written in a rotating frame) on a ladder of grids.
 * An ideal rotator is invisible: σ_s = 0 exactly (Chen & Chan, "Transformation media that rotate
 * electromagnetic fields", Appl. Phys. Lett. 90, 241105 (2007)); on the ladder it converges towards
 * zero and its Richardson extrapolation overshoots below zero, the case this rule is for.
 */
import { describe, expect, it } from "vitest";
import { computeTensorField } from "../../src/field/computeTensorField.js";
import type { FieldDesign } from "../../src/field/transformSpec.js";
import { reduceField } from "../../src/reduce/reduceField.js";
import { deviceCases } from "../../src/verify/deviceCases.js";
import { richardson } from "../../src/verify/richardson.js";
import { emptyScene, SAMPLE_BACKGROUND, SAMPLE_MEDIUM, type Scene } from "../../src/verify/scene.js";
import { verifyDevice } from "../../src/verify/verifyDevice.js";
import { clampFigure, widthReading, ZERO_WIDTH_FRACTION } from "../../src/verify/widthReading.js";

const C0 = 299_792_458;
const f = 10e9, lambda = C0 / f;

describe("widthReading", () => {
  it("a negative extrapolation is clamped to zero, the uncertainty still holds the extrapolated value, and it reads as zero", () => {
    // the figures the issue quotes: −17.7 nm with a relative uncertainty of 870 % (of itself)
    const r = widthReading(-17.7e-9, 8.7 * 17.7e-9, { referenceM: null, deviceWidthM: 0.1 });
    expect(r.valueM).toBe(0);
    expect(r.uncertaintyM).toBeCloseTo(8.7 * 17.7e-9, 20);
    expect(r.belowM).toBeCloseTo(8.7 * 17.7e-9, 20);
    expect(r.relative!).toBeLessThan(1e-5); // judged on the device's width, 0.1 m
  });

  it("an overshoot larger than its own uncertainty widens the uncertainty to reach it", () => {
    const r = widthReading(-5e-3, 1e-3, { referenceM: null, deviceWidthM: 0.1 });
    expect(r.valueM).toBe(0);
    expect(r.uncertaintyM).toBe(5e-3);
    expect(r.belowM).toBe(5e-3);
    expect(r.relative).toBeCloseTo(0.05, 12);
  });

  it("a width clear of zero keeps its value; the scale is the largest of itself, the bare width and the device width", () => {
    const big = widthReading(0.3, 0.003, { referenceM: 0.1, deviceWidthM: 0.05 });
    expect(big).toEqual({ valueM: 0.3, uncertaintyM: 0.003, relative: 0.01, belowM: null });
    const small = widthReading(0.01, 0.002, { referenceM: 0.1, deviceWidthM: 0.05 });
    expect(small.relative).toBeCloseTo(0.02, 12);
    expect(small.belowM).toBeNull();
    const noBare = widthReading(0.01, 0.002, { referenceM: null, deviceWidthM: 0.05 });
    expect(noBare.relative).toBeCloseTo(0.04, 12);
  });

  it("below 1e-6 of the device's width a width reads as zero even without a ladder; a single grid keeps a null uncertainty", () => {
    const r = widthReading(1e-9, null, { referenceM: null, deviceWidthM: 0.1 });
    expect(r.uncertaintyM).toBeNull();
    expect(r.relative).toBeNull();
    expect(r.belowM).toBeCloseTo(ZERO_WIDTH_FRACTION * 0.1, 15);
    expect(widthReading(1e-3, null, { referenceM: null, deviceWidthM: 0.1 }).belowM).toBeNull();
    expect(widthReading(0, 0, { referenceM: null, deviceWidthM: 0 })).toEqual({ valueM: 0, uncertaintyM: 0, relative: 0, belowM: 0 });
  });

  it("bounded figures (σ/σ_bare ≥ 0, a share in [0, 1]) are clamped, their uncertainty reaching the extrapolated value", () => {
    expect(clampFigure(-0.01, 0.004, 0)).toEqual({ value: 0, uncertainty: 0.01 });
    expect(clampFigure(-0.01, 0.04, 0)).toEqual({ value: 0, uncertainty: 0.04 });
    expect(clampFigure(0.5, 0.01, 0)).toEqual({ value: 0.5, uncertainty: 0.01 });
    expect(clampFigure(1.02, 0.01, 0, 1).value).toBe(1);
    expect(clampFigure(1.02, 0.01, 0, 1).uncertainty).toBeCloseTo(0.02, 12);
    expect(clampFigure(0.3, null, 0)).toEqual({ value: 0.3, uncertainty: null });
  });
});

describe("noise floor of the grid ladder (vacuum, identity map)", () => {
  const box = { minX: -lambda / 2, maxX: lambda / 2, minY: -lambda / 2, maxY: lambda / 2 };
  // a disk of 'medium' equal to the background, its tensor written as R diag(1,1) Rᵀ in the polar frame
  const identity: Scene = {
    polarization: "Ez", background: { eps: 1, mu: 1 }, bounds: box, smoothMedium: true,
    sample(x, y, out) {
      if (Math.hypot(x, y) > lambda / 2) return SAMPLE_BACKGROUND;
      const t = Math.atan2(y, x), c = Math.cos(t), s = Math.sin(t);
      out.fill(0);
      out[0] = 1; out[2] = c * c + s * s; out[4] = s * s + c * c; out[6] = c * s - s * c;
      return SAMPLE_MEDIUM;
    },
  };
  it("no spurious width above rounding: vacuum exactly 0, the identity map below 1e-25 of the device's width on every rung; both read as zero and converged", () => {
    const r = verifyDevice({
      polarization: "Ez", background: { eps: 1, mu: 1 }, frequencyHz: f, deviceBox: box, marginM: 0.3 * lambda, accuracy: 0.2,
      cases: [{ name: "ideal", scene: identity, indexHint: 1 }, { name: "reduced", scene: emptyScene("Ez", { eps: 1, mu: 1 }), indexHint: 1 }],
    });
    for (const c of r.cases) {
      for (const p of c.ladder) expect(Math.abs(p.scatteringWidthM)).toBeLessThan(1e-25 * lambda);
      expect(c.scatteringWidthM).toBeGreaterThanOrEqual(0);
      expect(c.scatteringWidthBelowM).toBeCloseTo(ZERO_WIDTH_FRACTION * lambda, 12);
      expect(c.converged).toBe(true);
    }
    expect(r.cases.find((c) => c.name === "reduced")!.ladder.every((p) => p.scatteringWidthM === 0)).toBe(true);
  });
});

describe("an invisible device on the ladder", () => {
  it("ideal rotator (b = λ/2, 45°, Hz): the extrapolation overshoots below zero; the check reads ≈ 0 below its uncertainty, converged, never negative", () => {
    const design: FieldDesign = {
      name: "t", sourcePath: "t.json", background: { eps: 1, mu: 1 },
      transform: { kind: "rotator", innerRadiusM: lambda / 4, outerRadiusM: lambda / 2, angleRad: Math.PI / 4 }, grid: { pitchM: lambda / 20 },
    };
    const field = computeTensorField(design);
    const ideal = reduceField(field, { polarization: "Hz", scheme: "full" });
    const c = deviceCases({ transform: design.transform, fieldBackground: design.background, background: { eps: 1, mu: 1 }, polarization: "Hz", grid: field.grid, ideal, reduced: ideal, plan: null });
    const r = verifyDevice({ polarization: "Hz", background: { eps: 1, mu: 1 }, frequencyHz: f, deviceBox: c.deviceBox, cases: c.cases.filter((x) => x.name === "ideal"), accuracy: 0.2, marginM: 0.3 * lambda });
    const id = r.cases[0];
    const raw = richardson(id.ladder.map((p) => p.stepM), id.ladder.map((p) => p.scatteringWidthM));
    expect(raw.value).toBeLessThan(0); // the raw extrapolation: a negative width
    expect(Math.abs(raw.uncertainty! / raw.value)).toBeGreaterThan(1); // relative to itself: meaningless
    expect(id.scatteringWidthM).toBe(0);
    expect(id.scatteringWidthUncertaintyM!).toBeGreaterThanOrEqual(Math.abs(raw.value));
    expect(id.scatteringWidthBelowM).toBe(id.scatteringWidthUncertaintyM);
    // the uncertainty is a small share of the device's width (λ): converged at 20 %, and below 2 %
    expect(id.uncertainty!).toBeLessThan(0.02);
    expect(id.converged).toBe(true);
    // every rung is a width the device can be blamed for, above the noise floor and falling towards zero
    for (const p of id.ladder) expect(p.scatteringWidthM).toBeGreaterThan(1e-6 * lambda);
    expect(id.ladder[id.ladder.length - 1].scatteringWidthM).toBeLessThan(id.ladder[0].scatteringWidthM);
  });
});
