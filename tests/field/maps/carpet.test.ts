/**
 * Carpet (ground-plane) maps: a bump on the bottom side of a rectangle, virtual rectangle = the
 * rectangle itself (Li & Pendry, "Hiding under the carpet: a new strategy for cloaking",
 * Phys. Rev. Lett. 101, 203901 (2008)). Identities and invariants, plus the index range of a
 * smooth bump against a published design.
 */
import { describe, it, expect } from "vitest";
import fc from "fast-check";
import { expectClose } from "../../helpers/close.js";
import { computeTensorField } from "../../../src/field/computeTensorField.js";
import { quasiConformal } from "../../../src/field/transforms/quasiConformal.js";
import type { FieldDesign, QuasiConformalSpec } from "../../../src/field/transformSpec.js";

const W = 12, H = 3;
/** cos² bump of height h and width w centred at c (zero outside), as a graph side. */
const bump = (h: number, w: number, c = 0): QuasiConformalSpec["sides"]["bottom"] => ({
  kind: "graph", text: "bump", f: (x) => (Math.abs(x - c) < w / 2 ? h * Math.cos((Math.PI * (x - c)) / w) ** 2 : 0),
});
const carpet = (h: number, w: number, nodes: [number, number] = [97, 25], fit: "none" | "module" = "none", c = 0): QuasiConformalSpec => ({
  kind: "quasi-conformal", rectangle: { minM: [-W / 2, 0], maxM: [W / 2, H] }, fit, nodes,
  sides: { bottom: bump(h, w, c), right: { kind: "straight" }, top: { kind: "straight" }, left: { kind: "straight" } },
});
const design = (spec: QuasiConformalSpec, eps = 1): FieldDesign => ({
  name: "carpet", sourcePath: "carpet.json", background: { eps, mu: 1 }, transform: spec, grid: { pitchM: 0.25 },
});

describe("carpet maps", () => {
  it("a flat bump gives the identity: K = I, ε′ = μ′ = background everywhere", () => {
    const t = quasiConformal(carpet(0, 4));
    const m = t.computedMap!;
    expectClose(m.conformalModule!, H / W, { rel: 1e-12, label: "module of the rectangle" });
    expectClose(m.maxAnisotropy, 1, { abs: 1e-9, label: "anisotropy" });
    const f = computeTensorField(design(carpet(0, 4), 2.25));
    for (let c = 0; c < f.grid.count; c++) {
      expectClose([f.eps.xx[c], f.eps.yy[c], f.eps.zz[c], f.eps.xy[c]], [2.25, 2.25, 2.25, 0], { abs: 1e-9, label: `cell ${c}` });
      expectClose([f.mu.xx[c], f.mu.yy[c], f.mu.zz[c]], [1, 1, 1], { abs: 1e-9, label: `mu cell ${c}` });
    }
  });

  it("the anisotropy falls as the bump flattens, like the module mismatch, and vanishes with fit = module", () => {
    const heights = [0.8, 0.4, 0.2, 0.1];
    const a = heights.map((h) => quasiConformal(carpet(h, 4)).computedMap!);
    for (let k = 1; k < a.length; k++) expect(a[k].maxAnisotropy).toBeLessThan(a[k - 1].maxAnisotropy);
    // continuum: every cell has σ₁/σ₂ = (H/W)/M (the module mismatch); the area mean follows it
    // to a tenth of the error estimate, the max (found at the bump's ends, where its curvature jumps) within the map's own
    // Jacobian error estimate
    for (const m of a) {
      const mismatch = m.virtualAspect! / m.conformalModule!;
      expectClose(m.maxAnisotropy, mismatch, { rel: m.jacobianErrorEstimate, label: "max anisotropy vs aspect/module" });
      expect(Math.abs(m.meanAnisotropy - mismatch)).toBeLessThan(0.1 * m.jacobianErrorEstimate * mismatch);
    }
    const fitted = quasiConformal(carpet(0.4, 4, [97, 25], "module")).computedMap!;
    expect(fitted.maxAnisotropy).toBeLessThan(1 + fitted.jacobianErrorEstimate);
    expect(Math.abs(fitted.meanAnisotropy - 1)).toBeLessThan(0.1 * fitted.jacobianErrorEstimate);
    expect(fitted.maxAnisotropy).toBeLessThan(a[1].maxAnisotropy);
  });

  it("a smooth bump's index range lies inside a published carpet design's range", () => {
    // Liu, Ji, Mock, Chin, Cui, Smith, "Broadband ground-plane cloak", Science 323, 366 (2009):
    // index from 1.08 to 1.67 in a background of about 1.33 (from memory; the paper's values).
    // The paper's bump proportions are not known to us, so we take a gentle cos² bump (h/w = 0.05,
    // domain height 3/4 of the bump width) in the same background and require its index
    // n = n_b √det K (isotropic reduction, E along z) to stay inside the published range. A bump
    // twice as tall (h/w = 0.1) would reach n ≈ 1.87: outside, as the published design is gentler.
    const nb = 1.33;
    const f = computeTensorField(design(carpet(0.2, 4), nb * nb));
    let lo = Infinity, hi = -Infinity;
    for (let c = 0; c < f.grid.count; c++) {
      const n = Math.sqrt(f.eps.zz[c]);
      lo = Math.min(lo, n); hi = Math.max(hi, n);
    }
    expect(lo).toBeGreaterThanOrEqual(1.08);
    expect(hi).toBeLessThanOrEqual(1.67);
    expect(hi - lo).toBeGreaterThan(0.05); // a real bump, not the identity
  });

  it("fast-check: random smooth bumps → det J > 0 everywhere and ε′ symmetric positive definite", () => {
    fc.assert(fc.property(
      fc.double({ min: 0.05, max: 1.5, noNaN: true }), fc.double({ min: 1.5, max: 8, noNaN: true }), fc.double({ min: -1.5, max: 1.5, noNaN: true }),
      (h, w, c) => {
        const f = computeTensorField(design(carpet(h, w, [49, 17], "none", c)));
        expect(f.grid.count).toBeGreaterThan(50);
        for (let q = 0; q < f.grid.count; q++) {
          expect(f.detJ[q]).toBeGreaterThan(0);
          const xx = f.eps.xx[q], yy = f.eps.yy[q], xy = f.eps.xy[q];
          expect(xx).toBeGreaterThan(0);
          expect(xx * yy - xy * xy).toBeGreaterThan(0);
          expect(f.eps.zz[q]).toBeGreaterThan(0);
          expect(f.epsPrincipal[0][q]).toBeGreaterThan(0);
        }
      }), { seed: 1102, numRuns: 12 });
  });

  it("interpolation between cells agrees with a finer solve within the reported error estimate", () => {
    const coarse = quasiConformal(carpet(0.4, 4, [97, 25])), fine = quasiConformal(carpet(0.4, 4, [193, 49]));
    const est = coarse.computedMap!.jacobianErrorEstimate;
    expect(est).toBeGreaterThan(0);
    expect(est).toBeLessThan(1e-2);
    const a = new Float64Array(9), b = new Float64Array(9);
    let worst = 0;
    for (const [x, y] of [[0.13, 0.9], [-1.37, 0.41], [2.71, 1.3], [0.5, 2.2], [-4.1, 0.2]]) {
      coarse.jacobianK(a, x, y, 0); fine.jacobianK(b, x, y, 0);
      worst = Math.max(worst, Math.hypot(a[0] - b[0], a[1] - b[1], a[3] - b[3], a[4] - b[4]) / Math.hypot(b[0], b[1], b[3], b[4]));
    }
    // the estimate is a max over all solver cells; these probes must be within it (×1.5 for the fine map's own error)
    expect(worst).toBeLessThan(1.5 * est);
  });
});
