import fc from "fast-check";
import { describe, expect, it } from "vitest";
import type { Complex } from "../../../src/core/complex.js";
import { InputError } from "../../../src/core/errors.js";
import type { MixingParams } from "../../../src/media/mixing/mixingRule.js";
import { getMixingRule, MIXING_RULE_IDS, MIXING_RULES } from "../../../src/media/mixing/registry.js";
import { expectClose } from "../../helpers/close.js";

const c = (re: number, im = 0): Complex => ({ re, im });
const PARAMS: MixingParams = { depolarization: 0.2 };

describe("mixing-rule registry", () => {
  it("lists the seven rules of the contract, each under its own id", () => {
    expect(MIXING_RULE_IDS.sort()).toEqual(["bruggeman-2d", "bruggeman-3d", "mg-cylinder", "mg-ellipsoid", "mg-sphere", "parallel", "series"]);
    for (const id of MIXING_RULE_IDS) expect(MIXING_RULES[id].id).toBe(id);
  });

  it("getMixingRule rejects an unknown id with the closest ids", () => {
    expect(() => getMixingRule("mg-sphre")).toThrow(InputError);
    expect(() => getMixingRule("mg-sphre")).toThrow(/did you mean mg-sphere/);
  });

  // Identity: an inverse must undo its forward (style: one test sweeping the whole registry).
  it("every inverse undoes its forward (real positive phases: same fill; complex phases: same Re ε)", () => {
    const phase = fc.double({ min: 1, max: 50, noNaN: true });
    const loss = fc.double({ min: 0, max: 5, noNaN: true });
    const fill = fc.double({ min: 0, max: 1, noNaN: true });
    for (const rule of Object.values(MIXING_RULES)) {
      fc.assert(
        fc.property(phase, phase, fill, (h, i, f) => {
          fc.pre(Math.abs(h - i) > 1e-3);
          const eps = rule.forward(c(h), c(i), f, PARAMS);
          const inv = rule.inverse(c(h), c(i), eps.re, PARAMS);
          expect(inv.converged, `${rule.id} h=${h} i=${i} f=${f}`).toBe(true);
          expectClose(inv.fill, f, { abs: 1e-7, label: `${rule.id} fill (h=${h}, i=${i})` });
        }),
        { seed: 42, numRuns: 200 },
      );
      fc.assert(
        fc.property(phase, phase, loss, loss, fill, (h, i, lh, li, f) => {
          fc.pre(Math.abs(h - i) > 1e-2);
          const host = c(h, lh);
          const inclusion = c(i, li);
          const eps = rule.forward(host, inclusion, f, PARAMS);
          const inv = rule.inverse(host, inclusion, eps.re, PARAMS);
          expect(inv.converged, `${rule.id} ${JSON.stringify({ h, i, lh, li, f })}`).toBe(true);
          // the real part may be non-monotone in f for lossy phases; the smallest fill is returned
          expect(inv.fill).toBeLessThanOrEqual(f + 1e-9);
          expectClose(rule.forward(host, inclusion, inv.fill, PARAMS).re, eps.re, { rel: 1e-8, abs: 1e-10, label: `${rule.id} Re ε` });
        }),
        { seed: 42, numRuns: 100 },
      );
    }
  });

  // Identities (style §10): f = 0 gives the host, f = 1 the inclusion, equal phases give that value.
  it("f = 0 gives the host, f = 1 the inclusion, equal phases give that value", () => {
    const phase = fc.record({ re: fc.double({ min: -30, max: 60, noNaN: true }), im: fc.double({ min: 0, max: 10, noNaN: true }) });
    for (const rule of Object.values(MIXING_RULES)) {
      fc.assert(
        fc.property(phase, phase, fc.double({ min: 0, max: 1, noNaN: true }), (h, i, f) => {
          fc.pre(Math.hypot(h.re, h.im) > 0.1 && Math.hypot(i.re, i.im) > 0.1);
          const at0 = rule.forward(h, i, 0, PARAMS);
          const at1 = rule.forward(h, i, 1, PARAMS);
          const same = rule.forward(h, h, f, PARAMS);
          // components are compared relative to the magnitude of the phases (rounding in the roots)
          const tol = { abs: 1e-12 * Math.max(1, Math.hypot(h.re, h.im), Math.hypot(i.re, i.im)) };
          expectClose([at0.re, at0.im], [h.re, h.im], { ...tol, label: `${rule.id} f=0` });
          expectClose([at1.re, at1.im], [i.re, i.im], { ...tol, label: `${rule.id} f=1` });
          expectClose([same.re, same.im], [h.re, h.im], { ...tol, label: `${rule.id} equal phases` });
        }),
        { seed: 42, numRuns: 200 },
      );
    }
  });

  it("every rule keeps a mixture of passive phases passive (Im ε ≥ 0)", () => {
    const phase = fc.record({ re: fc.double({ min: -30, max: 60, noNaN: true }), im: fc.double({ min: 0.01, max: 10, noNaN: true }) });
    for (const rule of Object.values(MIXING_RULES)) {
      fc.assert(
        fc.property(phase, phase, fc.double({ min: 0, max: 1, noNaN: true }), (h, i, f) => {
          const eps = rule.forward(h, i, f, PARAMS);
          expect(eps.im, `${rule.id} ${JSON.stringify({ h, i, f })}`).toBeGreaterThanOrEqual(-1e-9 * Math.hypot(eps.re, eps.im));
        }),
        { seed: 42, numRuns: 200 },
      );
    }
  });

  it("every inverse reports an unreachable target with NaN fill and a reason naming the limit", () => {
    for (const rule of Object.values(MIXING_RULES)) {
      const above = rule.inverse(c(2), c(5), 6, PARAMS);
      expect(above.fill, rule.id).toBeNaN();
      expect(above.converged).toBe(false);
      expect(above.reason, rule.id).toMatch(/above the largest value 5/);
      const below = rule.inverse(c(2), c(5), 1.5, PARAMS);
      expect(below.reason, rule.id).toMatch(/below the smallest value 2/);
      const lossy = rule.inverse(c(2, 0.1), c(5, 0.3), 9, PARAMS);
      expect(lossy.fill, rule.id).toBeNaN();
      expect(lossy.reason, rule.id).toMatch(/above the largest value/);
    }
  });

  it("equal phases: the inverse says no fill fraction changes the value", () => {
    for (const rule of Object.values(MIXING_RULES)) {
      const r = rule.inverse(c(3), c(3), 4, PARAMS);
      expect(r.fill, rule.id).toBeNaN();
      expect(r.reason, rule.id).toBeTruthy();
      expect(rule.inverse(c(3), c(3), 3, PARAMS).fill, rule.id).toBe(0);
    }
  });
});
