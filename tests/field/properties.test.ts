/**
 * Invariants of the transformation-medium kernel (Pendry, Schurig, Smith, Science 312, 1780
 * (2006): ε' = J ε_b Jᵀ / det J): the identity map returns the background; ε' is symmetric and
 * positive definite for orientation-preserving maps; det ε' = det ε_b / det J.
 */
import { describe, it, expect } from "vitest";
import fc from "fast-check";
import { expectClose } from "../helpers/close.js";
import { materialFromK } from "../../src/field/materialFromK.js";
import { computeTensorField } from "../../src/field/computeTensorField.js";
import { sym3Eigen } from "../../src/core/eigen.js";
import { symDet, readSym } from "../../src/core/symTensor.js";
import { parseDesign } from "../../src/io/design/loadDesign.js";

const finite = (lo: number, hi: number) => fc.double({ min: lo, max: hi, noNaN: true, noDefaultInfinity: true });

/** det of a row-major 3×3 */
const det3 = (k: number[]): number =>
  k[0] * (k[4] * k[8] - k[5] * k[7]) - k[1] * (k[3] * k[8] - k[5] * k[6]) + k[2] * (k[3] * k[7] - k[4] * k[6]);

describe("materialFromK", () => {
  it("the identity K gives the identity S (so ε' = ε_b)", () => {
    const s = new Float64Array(6);
    const det = materialFromK(s, Float64Array.from([1, 0, 0, 0, 1, 0, 0, 0, 1]));
    expect(det).toBe(1);
    expect(Array.from(s)).toEqual([1, 1, 1, 0, 0, 0]);
  });

  it("S is positive definite and det S = det K = 1/det J for det K > 0", () => {
    fc.assert(
      fc.property(fc.array(finite(-1, 1), { minLength: 9, maxLength: 9 }), finite(-3, 3), (entries, shift) => {
        let k = entries.map((v, q) => (q % 4 === 0 ? v + shift : v));
        const d = det3(k);
        fc.pre(Math.abs(d) > 1e-3);
        if (d < 0) k = [-k[0], -k[1], -k[2], ...k.slice(3)]; // flip a row: orientation-preserving
        const s = new Float64Array(6);
        const detK = materialFromK(s, Float64Array.from(k));
        expectClose(detK, Math.abs(d), { rel: 1e-12, label: "det K" });
        const vals = sym3Eigen(new Float64Array(3), s);
        expect(vals[0]).toBeGreaterThan(0);
        // det(J Jᵀ / det J) = det J² / det J³ = 1/det J = det K
        expectClose(symDet(s), detK, { rel: 1e-8, label: "det S" });
      }),
      { seed: 42, numRuns: 200 },
    );
  });

  it("reports det K ≤ 0 (a folding map) through its return value", () => {
    const s = new Float64Array(6);
    expect(materialFromK(s, Float64Array.from([-1, 0, 0, 0, 1, 0, 0, 0, 1]))).toBe(-1);
    expect(materialFromK(s, Float64Array.from([0, 0, 0, 0, 1, 0, 0, 0, 1]))).toBe(0);
    expect(Number.isNaN(materialFromK(s, Float64Array.from([NaN, 0, 0, 0, 1, 0, 0, 0, 1])))).toBe(true);
  });
});

describe("computed fields", () => {
  it("the identity expression map returns the background in every cell", async () => {
    await fc.assert(
      fc.asyncProperty(finite(1, 12), finite(1, 4), async (eps, mu) => {
        const design = await parseDesign({
          name: "identity", frequency: "10 GHz", background: { eps, mu },
          transform: { kind: "expression", virtual: { x: "x", y: "y" }, region: { circle: { radius: "10 mm" } } },
          grid: { pitch: "2 mm" },
        }, "identity.json");
        const f = computeTensorField(design);
        const t = new Float64Array(6);
        for (let c = 0; c < f.grid.count; c++) {
          expectClose(readSym(t, f.eps, c), [eps, eps, eps, 0, 0, 0], { rel: 1e-14, label: `eps cell ${c}` });
          expectClose(readSym(t, f.mu, c), [mu, mu, mu, 0, 0, 0], { rel: 1e-14, label: `mu cell ${c}` });
          expectClose(f.detJ[c], 1, { rel: 1e-14, label: "det J" });
        }
      }),
      { seed: 42, numRuns: 20 },
    );
  });

  it("cloaks of any radii (inner offset 0.1 % of the shell): positive-definite ε', det ε' = ε_b³/det J", () => {
    fc.assert(
      fc.property(finite(0.005, 0.03), finite(1.2, 4), finite(1, 10), fc.boolean(), (a, ratio, epsB, quadratic) => {
        const b = a * ratio;
        fc.pre(!quadratic || b > 2.05 * a);
        const f = computeTensorField({
          name: "p", sourcePath: "p.json", background: { eps: epsB, mu: 1 },
          transform: { kind: "radial-cloak", innerRadiusM: a, outerRadiusM: b, profile: quadratic ? "quadratic" : "linear", innerOffsetM: 1e-3 * (b - a) },
          grid: { pitchM: b / 8 },
        });
        const t = new Float64Array(6), v = new Float64Array(3);
        for (let c = 0; c < f.grid.count; c++) {
          readSym(t, f.eps, c);
          sym3Eigen(v, t);
          expect(f.epsPrincipal[0][c]).toBeGreaterThan(0);
          expect(f.muPrincipal[0][c]).toBeGreaterThan(0);
          expectClose(symDet(t), epsB ** 3 / f.detJ[c], { rel: 1e-9, label: `det eps cell ${c}` });
          // engine principal values vs Jacobi/closed form on the stored tensor (absolute slack: the
          // Cartesian components carry rounding of order 1e-16 × the largest value)
          expectClose([f.epsPrincipal[0][c], f.epsPrincipal[1][c], f.epsPrincipal[2][c]], Array.from(v), { rel: 1e-9, abs: 1e-12 * v[2], label: "principal" });
          expectClose(f.epsPrincipal[0][c] * f.epsPrincipal[1][c] * f.epsPrincipal[2][c], epsB ** 3 / f.detJ[c], { rel: 1e-9, label: "product of principal values" });
        }
      }),
      { seed: 42, numRuns: 100 },
    );
  });
});
