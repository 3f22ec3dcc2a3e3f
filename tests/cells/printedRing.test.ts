import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { ellipticK, ellipticKPrime, ellipticKRatio } from "../../src/core/ellipticK.js";
import {
  coplanarStripsCapacitancePerM,
  coplanarStripsEffectivePermittivity,
  coplanarStripsFillingFactor,
  printedMeanRadiusM,
  printedOuterRadiusM,
  printedRingCircuit,
  printedRingDampingRadPerS,
  printedRingResistanceOhm,
  printedRingStrength,
  ringInductanceH,
  type PrintedRingGeometry,
} from "../../src/cells/printedRing.js";
import { EPS0, MU0 } from "../../src/cells/physicalConstants.js";
import { skinDepthM } from "../../src/cells/skinDepth.js";
import { expectClose } from "../helpers/close.js";

/*
 * Fixture for K(k) and K(k')/K(k), generated with mpmath 1.3.0 (python3):
 *   import mpmath as mp; mp.mp.dps = 30
 *   for k in ['0.1','0.3','0.5','0.7071067811865476','0.9','0.99','0.999999','1e-3','1e-6']:
 *       kk = mp.mpf(k); print(k, mp.nstr(mp.ellipk(kk**2), 17), mp.nstr(mp.ellipk(1-kk**2)/mp.ellipk(kk**2), 17))
 * (mpmath's ellipk takes the parameter m = k².)
 */
const MPMATH: [number, number, number][] = [
  [0.1, 1.574745561517356, 2.346815544873751],
  [0.3, 1.6080486199305128, 1.6341379853290105],
  [0.5, 1.685750354812596, 1.2792615711710065],
  [0.7071067811865476, 1.854074677301372, 0.9999999999999999],
  [0.9, 2.2805491384227702, 0.72553431962744784],
  [0.99, 3.3566005233611924, 0.47032696653998978],
  [0.999999, 7.9474797735623448, 0.19764719847653836],
];
const MPMATH_RATIO_SMALL_K: [number, number][] = [
  [1e-3, 5.2801558347321651],
  [1e-6, 9.6777695871635801],
];

describe("complete elliptic integral K", () => {
  it("matches Abramowitz & Stegun table 17.1 (K by modular angle α, k = sin α; 10 digits)", () => {
    expectClose(ellipticK(0), Math.PI / 2, { rel: 1e-15, label: "α = 0°" });
    expectClose(ellipticK(Math.sin(Math.PI / 6)), 1.6857503548, { rel: 1e-10, label: "α = 30°" });
    expectClose(ellipticK(Math.SQRT1_2), 1.8540746773, { rel: 1e-10, label: "α = 45°" });
    expectClose(ellipticK(Math.sin(Math.PI / 3)), 2.1565156475, { rel: 1e-10, label: "α = 60°" });
    expect(ellipticK(1)).toBe(Infinity);
  });

  it("K(1/√2) = Γ(1/4)²/(4√π) (lemniscate value; Γ(1/4) = 3.6256099082219083 from mpmath.gamma(0.25))", () => {
    expectClose(ellipticK(Math.SQRT1_2), 3.6256099082219083 ** 2 / (4 * Math.sqrt(Math.PI)), { rel: 1e-14 });
  });

  it("matches the mpmath fixture to 1e-14 (1e-11 at k = 0.999999: the double nearest 0.999999 differs from it by ~5e-17 and dK/dk ≈ 1/k'² = 5e5 there)", () => {
    for (const [k, K, ratio] of MPMATH) {
      expectClose(ellipticK(k), K, { rel: k > 0.9999 ? 1e-11 : 1e-14, label: `K(${k})` });
      expectClose(ellipticKRatio(k), ratio, { rel: k > 0.9999 ? 1e-11 : 1e-13, label: `K'/K(${k})` });
    }
    for (const [k, ratio] of MPMATH_RATIO_SMALL_K) expectClose(ellipticKRatio(k), ratio, { rel: 1e-13, label: `K'/K(${k})` });
  });

  it("Landen's transformation K(k) = K(2√k/(1+k))/(1+k) (A&S 17.5.11; identity)", () => {
    fc.assert(
      // k ≤ 0.9: above it the transformed modulus 2√k/(1+k) ≈ 1 − (1−k)²/8 is rounded in the test itself
      fc.property(fc.double({ min: 1e-6, max: 0.9, noNaN: true }), (k) => {
        const landen = ellipticK((2 * Math.sqrt(k)) / (1 + k)) / (1 + k);
        return Math.abs(ellipticK(k) - landen) <= 1e-12 * landen;
      }),
      { seed: 42, numRuns: 200 },
    );
  });

  it("reciprocity K'(k)/K(k) · K'(k')/K(k') = 1 and K'(k) = K(k') (identities)", () => {
    fc.assert(
      // k in [0.05, 0.95]: outside it, forming k' = sqrt(1 − k²) in the test itself loses digits
      fc.property(fc.double({ min: 0.05, max: 0.95, noNaN: true }), (k) => {
        const kp = Math.sqrt(1 - k * k);
        return Math.abs(ellipticKRatio(k) * ellipticKRatio(kp) - 1) <= 1e-12
          && Math.abs(ellipticKPrime(k) - ellipticK(kp)) <= 1e-12 * ellipticKPrime(k);
      }),
      { seed: 42, numRuns: 200 },
    );
  });

  it("edge cases: outside [0, 1] and NaN give NaN; the ratio's ends are Infinity and 0", () => {
    for (const k of [-0.1, 1.1, NaN, Infinity]) {
      expect(Number.isNaN(ellipticK(k))).toBe(true);
      expect(Number.isNaN(ellipticKRatio(k))).toBe(true);
    }
    expect(ellipticKRatio(0)).toBe(Infinity);
    expect(ellipticKRatio(1)).toBe(0);
    expect(ellipticKPrime(1)).toBe(Math.PI / 2);
  });
});

describe("coplanar strips (Gupta, Garg, Bahl, Bhartia, Microstrip Lines and Slotlines, 2nd ed. 1996, ch. 7)", () => {
  it("k = 1/√2 (s/(s+2w) = 1/√2) is self-dual: C_pul = ε₀ε_eff exactly (K(k) = K(k'))", () => {
    const s = 1e-4;
    const w = (s * (Math.SQRT2 - 1)) / 2;
    expectClose(coplanarStripsCapacitancePerM(w, s, 2), 2 * EPS0, { rel: 1e-13 });
  });

  it("narrow gap: C_pul → ε₀ε_eff(2/π)ln(4/k); wide gap: → ε₀ε_eff π/(2 ln(4/k')) (A&S 17.3.26: K(k) ≈ ln(4/k') as k → 1)", () => {
    const w = 1e-3;
    const s = 1e-9; // k ≈ 5e-7, relative correction O(k²)
    const k = s / (s + 2 * w);
    expectClose(coplanarStripsCapacitancePerM(w, s, 1), EPS0 * (2 / Math.PI) * Math.log(4 / k), { rel: 1e-10 });
    const s2 = 1, w2 = 1e-7; // k' ≈ 6e-4
    const k2 = s2 / (s2 + 2 * w2);
    const kp = Math.sqrt((1 - k2) * (1 + k2));
    expectClose(coplanarStripsCapacitancePerM(w2, s2, 1), (EPS0 * Math.PI) / (2 * Math.log(4 / kp)), { rel: 1e-6 });
  });

  it("depends on the ratio s/w only, rises as the gap closes, and is linear in ε_eff (invariants)", () => {
    fc.assert(
      fc.property(fc.double({ min: 1e-3, max: 1e3, noNaN: true }), fc.double({ min: 1e-3, max: 1e3, noNaN: true }), fc.double({ min: 1, max: 20, noNaN: true }), (ratio, scale, eps) => {
        const w = 1e-4, s = ratio * w;
        const c = coplanarStripsCapacitancePerM(w, s, eps);
        return Math.abs(coplanarStripsCapacitancePerM(w * scale, s * scale, eps) - c) <= 1e-12 * c
          && coplanarStripsCapacitancePerM(w, s / 2, eps) > c
          && Math.abs(coplanarStripsCapacitancePerM(w, s, 1) * eps - c) <= 1e-12 * c;
      }),
      { seed: 42, numRuns: 200 },
    );
  });

  it("thick board: ε_eff = (ε+1)/2 (common practice; the half-space limit); the finite-board form tends to it and falls with h", () => {
    const w = 1e-4, s = 1e-4;
    expectClose(coplanarStripsEffectivePermittivity(3, w, s), 2, { rel: 1e-15 });
    expectClose(coplanarStripsFillingFactor(w, s, 1), 0.5, { rel: 1e-8 }); // h = 1 m: correction of order (πs/4h)² ≈ 6e-9
    expectClose(coplanarStripsEffectivePermittivity(1, w, s, 1e-4), 1, { rel: 1e-15 });
    let last = 0;
    for (const h of [1e-6, 1e-5, 1e-4, 1e-3, 1e-2]) {
      const q = coplanarStripsFillingFactor(w, s, h);
      expect(q).toBeGreaterThan(last);
      expect(q).toBeLessThan(0.5);
      last = q;
    }
  });
});

const board = (over: Partial<PrintedRingGeometry> = {}): PrintedRingGeometry => ({ pitchM: 4e-3, ringRadiusM: 1.2e-3, ringWidthM: 0.15e-3, ringGapM: 0.15e-3, ...over });

describe("printed ring circuit (Marqués et al., PRB 65, 144440 (2002); Baena et al., IEEE MTT 53, 1451 (2005))", () => {
  it("ω0 = 1/sqrt(L_s C_s) with C_s = C0/4 = 2πr0 C_pul/4", () => {
    const g = board();
    const k = printedRingCircuit(g, 3);
    const r0 = printedMeanRadiusM(g);
    expectClose(r0, 1.2e-3 + 0.15e-3 + 0.075e-3, { rel: 1e-15 });
    expectClose(printedOuterRadiusM(g), 1.2e-3 + 0.45e-3, { rel: 1e-15 });
    expectClose(k.capacitanceF, (2 * Math.PI * r0 * coplanarStripsCapacitancePerM(0.15e-3, 0.15e-3, 2)) / 4, { rel: 1e-14 });
    expectClose(k.inductanceH, MU0 * r0 * (Math.log((32 * r0) / 0.15e-3) - 2), { rel: 1e-14 });
    expectClose(2 * Math.PI * k.resonanceHz, 1 / Math.sqrt(k.inductanceH * k.capacitanceF), { rel: 1e-14 });
  });

  it("scaling laws: all lengths × s ⇒ f0 ÷ s and F unchanged; ε_eff × x ⇒ f0 ÷ √x (L ∝ r0, C ∝ r0, C ∝ ε_eff)", () => {
    fc.assert(
      fc.property(fc.double({ min: 0.1, max: 10, noNaN: true }), fc.double({ min: 1, max: 12, noNaN: true }), (s, eps) => {
        const g = board();
        const big: PrintedRingGeometry = { pitchM: g.pitchM * s, ringRadiusM: g.ringRadiusM * s, ringWidthM: g.ringWidthM * s, ringGapM: g.ringGapM * s };
        const a = printedRingCircuit(g, eps), b = printedRingCircuit(big, eps);
        const x = printedRingCircuit(g, 1);
        const epsEff = (eps + 1) / 2;
        return Math.abs(b.resonanceHz * s - a.resonanceHz) <= 1e-12 * a.resonanceHz
          && Math.abs(b.strength - a.strength) <= 1e-12 * a.strength
          && Math.abs(a.resonanceHz * Math.sqrt(epsEff) - x.resonanceHz) <= 1e-12 * x.resonanceHz;
      }),
      { seed: 42, numRuns: 200 },
    );
  });

  it("a larger ring resonates lower; at a fixed mean radius a narrower separation resonates lower", () => {
    fc.assert(
      fc.property(fc.double({ min: 0.3e-3, max: 1.5e-3, noNaN: true }), fc.double({ min: 0.05e-3, max: 0.3e-3, noNaN: true }), (r, d) => {
        const f = (g: PrintedRingGeometry) => printedRingCircuit(g, 3).resonanceHz;
        const c = 0.15e-3, r0 = r + c + d / 2;
        const atMean = (dd: number) => board({ ringRadiusM: r0 - c - dd / 2, ringGapM: dd });
        return f(board({ ringRadiusM: r * 1.01, ringGapM: d })) < f(board({ ringRadiusM: r, ringGapM: d }))
          && f(atMean(d * 0.99)) < f(atMean(d));
      }),
      { seed: 42, numRuns: 200 },
    );
  });

  it("F = μ₀π²r0⁴/(a²lL) becomes Pendry's area fraction πr0²/a² for a solenoid stack, L = μ₀πr0²/l (Pendry et al. 1999)", () => {
    const r0 = 1e-3, a = 3e-3, l = 0.2e-3;
    expectClose(printedRingStrength(r0, a, l, (MU0 * Math.PI * r0 * r0) / l), (Math.PI * r0 * r0) / (a * a), { rel: 1e-14 });
  });

  it("the single-ring inductance is undefined for strips too wide for the radius (ln(32r0/c) ≤ 2)", () => {
    expect(Number.isNaN(ringInductanceH(1e-3, 32e-3 / Math.E ** 2))).toBe(true);
    expect(ringInductanceH(1e-3, 0.1e-3)).toBeGreaterThan(0);
  });

  it("damping: R ∝ 1/δ ∝ √f for thick copper; a perfect conductor and a lossless board give Γ = 0; board loss adds ω0·qε''/ε_eff", () => {
    const g = board();
    const k = printedRingCircuit(g, 3);
    const sigma = 5.8e7;
    expectClose(printedRingResistanceOhm(g, sigma, 4e10) / printedRingResistanceOhm(g, sigma, 1e10), 2, { rel: 1e-12 });
    const r0 = printedMeanRadiusM(g);
    expectClose(printedRingResistanceOhm(g, sigma, 1e10), ((2 / 3) * 2 * Math.PI * r0) / (sigma * 0.15e-3 * 2 * skinDepthM(sigma, 1e10)), { rel: 1e-14 });
    expect(printedRingDampingRadPerS(g, k, Infinity, 1e10)).toBe(0);
    const withBoard = printedRingDampingRadPerS(g, k, Infinity, 1e10, 0.004);
    expectClose(withBoard, 2 * Math.PI * k.resonanceHz * ((0.5 * 0.004) / 2), { rel: 1e-14 });
  });
});
