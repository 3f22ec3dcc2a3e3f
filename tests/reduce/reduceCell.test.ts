import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { newCellReduction, reductionKernel } from "../../src/reduce/reduceCell.js";
import { FLAG_MAGNETIC, FLAG_OUT_OF_PLANE, FLAG_UNDEFINED, type ReductionSettings } from "../../src/reduce/reducedField.js";
import type { ReductionSchemeName } from "../../src/reduce/schemes/schemeNames.js";
import { expectClose } from "../helpers/close.js";

function settings(polarization: "Ez" | "Hz" | "3D", scheme: ReductionSchemeName, extra: Partial<ReductionSettings> = {}): ReductionSettings {
  return {
    polarization, scheme, unitAxis: "larger", muTolerance: 1e-3, backgroundIndex: 1, backgroundImpedance: 1,
    epsScale: 1, muScale: 1, matchScale: 1, epsAtUnitIndex: 1, ...extra,
  };
}

/** A symmetric positive-definite in-plane tensor from principal values and an angle, with zz = s. */
function tensor(l1: number, l2: number, angle: number, s: number): Float64Array {
  const c = Math.cos(angle), n = Math.sin(angle);
  return Float64Array.from([l1 * c * c + l2 * n * n, l1 * n * n + l2 * c * c, s, (l1 - l2) * c * n, 0, 0]);
}

const positive = fc.double({ min: 0.01, max: 100, noNaN: true });
const angle = fc.double({ min: -Math.PI, max: Math.PI, noNaN: true });

describe("reduction kernel invariants (design brief §2: in-plane × α, out-of-plane × 1/α)", () => {
  const cases: [("Ez" | "Hz"), ReductionSchemeName][] = [
    ["Ez", "full"], ["Ez", "unit-mu"], ["Hz", "full"], ["Hz", "non-magnetic"],
  ];
  for (const [pol, scheme] of cases) {
    it(`${pol}/${scheme}: P·s is unchanged, α > 0, principal values ascending`, () => {
      fc.assert(fc.property(positive, positive, angle, positive, positive, positive, angle, positive,
        (e1, e2, ea, ez, m1, m2, ma, mz) => {
          const eps = tensor(e1, e2, ea, ez), mu = tensor(m1, m2, ma, mz);
          const r = reductionKernel(settings(pol, scheme)).apply(eps, mu, false, newCellReduction());
          const P = pol === "Ez" ? mu : eps, s = pol === "Ez" ? eps[2] : mu[2];
          const c = r.components;
          expect(r.scale).toBeGreaterThan(0);
          expect(r.principalMin).toBeLessThanOrEqual(r.principalMax);
          expectClose([c[1] * c[0], c[2] * c[0], c[3] * c[0]], [P[0] * s, P[1] * s, P[3] * s], { rel: 1e-12, abs: 1e-12 * (P[0] + P[1]) * s, label: "P·s" });
        }), { seed: 42, numRuns: 200 });
    });
  }

  for (const pol of ["Ez", "Hz"] as const) {
    it(`${pol}/isotropic: non-magnetic, in-plane isotropic, s·sqrt(det P) unchanged, dropped = sqrt(λmax/λmin)`, () => {
      fc.assert(fc.property(positive, positive, angle, positive, (l1, l2, a, s) => {
        const t = tensor(l1, l2, a, s);
        const r = reductionKernel(settings(pol, "isotropic")).apply(t, t, false, newCellReduction());
        const c = r.components;
        // Li, Pendry, PRL 101, 203901 (2008): geometric-mean index, anisotropy factor σ1/σ2 dropped
        expectClose(c[1], c[2], { rel: 1e-14, label: "isotropic in-plane" });
        expect(c[3]).toBe(0);
        expectClose(pol === "Ez" ? c[1] : c[0], 1, { rel: 1e-12, label: "μ = 1" });
        expectClose(pol === "Ez" ? c[0] * c[1] : c[0] * c[1], s * Math.sqrt(l1 * l2), { rel: 1e-12, label: "s·sqrt(det P)" });
        expectClose(r.droppedAnisotropy, Math.sqrt(Math.max(l1, l2) / Math.min(l1, l2)), { rel: 1e-9, label: "dropped" });
        expect(r.flags & FLAG_MAGNETIC).toBe(0);
      }), { seed: 42, numRuns: 200 });
    });
  }
});

describe("reduction kernel edge cases", () => {
  const k = reductionKernel(settings("Ez", "unit-mu"));
  const ok = tensor(2, 3, 0.3, 1.5);
  it("NaN, ±Infinity, a zero or indefinite in-plane tensor, or s ≤ 0 are undefined (NaN components, flagged)", () => {
    for (const bad of [
      [NaN, 1, 1, 0, 0, 0], [Infinity, 1, 1, 0, 0, 0], [-Infinity, 1, 1, 0, 0, 0],
      [0, 0, 1, 0, 0, 0], [1, -1, 1, 0, 0, 0], [1, 1, 1, 2, 0, 0],
    ]) {
      const r = k.apply(ok, bad, false, newCellReduction());
      expect(r.flags & FLAG_UNDEFINED, String(bad)).toBe(FLAG_UNDEFINED);
      expect(Number.isNaN(r.components[0])).toBe(true);
    }
    for (const s of [0, -0, -1]) {
      const eps = Float64Array.from(ok); eps[2] = s;
      expect(k.apply(eps, ok, false, newCellReduction()).flags & FLAG_UNDEFINED).toBe(FLAG_UNDEFINED);
    }
  });
  it("the inputs are left unchanged and the output object is reused", () => {
    const eps = Float64Array.from(ok), mu = tensor(0.5, 4, 1, 2);
    const before = [Array.from(eps), Array.from(mu)];
    const out = newCellReduction();
    expect(k.apply(eps, mu, false, out)).toBe(out);
    expect([Array.from(eps), Array.from(mu)]).toEqual(before);
  });
  it("xz or yz ≠ 0 is flagged: the polarizations do not separate", () => {
    const mu = Float64Array.from(ok); mu[4] = 0.1;
    expect(k.apply(ok, mu, false, newCellReduction()).flags & FLAG_OUT_OF_PLANE).toBe(FLAG_OUT_OF_PLANE);
  });
  it("μ within the tolerance of 1 is not magnetic", () => {
    const r = reductionKernel(settings("Hz", "full")).apply(ok, tensor(1, 1, 0, 1 + 5e-4), false, newCellReduction());
    expect(r.flags & FLAG_MAGNETIC).toBe(0);
  });
});
