import { describe, expect, it } from "vitest";
import { complex } from "../../../src/core/complex.js";
import { besselJ0, expIntE1 } from "../../../src/cells/wireCutoff/latticeSums.js";
import { solveWireCutoff, thinWireConstant, wireCutoffKpA, wireTableMaxRatio } from "../../../src/cells/wireCutoff/wireLatticeCutoff.js";
import { correctedWirePlasmaHz, radiusForTarget, thickWirePlasmaHz, wirePlasma, wireMediumResponse } from "../../../src/cells/wireMedium.js";
import { expectClose } from "../../helpers/close.js";

/** |η(τ)| by its q-product, η(τ) = q^{1/24}Π(1 − qⁿ), q = e^{2πiτ} (Dedekind). */
function etaAbs(tauRe: number, tauIm: number): number {
  const qAbs = Math.exp(-2 * Math.PI * tauIm), qArg = 2 * Math.PI * tauRe;
  let re = 1, im = 0;
  for (let n = 1; n < 60; n++) {
    const qr = qAbs ** n * Math.cos(n * qArg), qi = qAbs ** n * Math.sin(n * qArg);
    const ar = 1 - qr, ai = -qi;
    [re, im] = [re * ar - im * ai, re * ai + im * ar];
  }
  return qAbs ** (1 / 24) * Math.hypot(re, im);
}

describe("special functions", () => {
  it("J₀ and E₁ against tabulated values (Abramowitz & Stegun, tables 9.1 and 5.1)", () => {
    expectClose(besselJ0(1), 0.7651976866, { abs: 1e-7 });
    expectClose(besselJ0(5), -0.1775967713, { abs: 1e-7 });
    expectClose(expIntE1(0.5), 0.5597735948, { rel: 1e-9 });
    expectClose(expIntE1(2), 0.04890051071, { rel: 1e-9 });
  });
});

describe("static thin-wire constant (Kronecker's limit formula)", () => {
  it("square lattice: c = −2 ln η(i) ≈ 0.527344 (shared references, 'Homogenization')", () => {
    expectClose(thinWireConstant("square"), 0.527344, { abs: 1e-6 });
    expectClose(thinWireConstant("square"), -2 * Math.log(etaAbs(0, 1)), { abs: 1e-10 });
  });
  it("hexagonal lattice: c = −2 ln|η(e^{iπ/3})| (the same formula for the lattice (1, τ))", () => {
    expectClose(thinWireConstant("hex"), -2 * Math.log(etaAbs(0.5, Math.sqrt(3) / 2)), { abs: 1e-10 });
  });
});

describe("lattice cut-off of perfectly conducting wires", () => {
  it("tends to the static thin-wire form as r/a → 0 (Belov, Tretyakov, Viitanen 2002)", () => {
    // the gap is the dynamic term O((k_p a)²·Σ1/G⁴), which falls only like 1/ln(a/r)
    const thin = (r: number) => Math.sqrt((2 * Math.PI) / (Math.log(1 / (2 * Math.PI * r)) + 0.527344));
    const gap = (r: number) => Math.abs(solveWireCutoff("square", r).kpA / thin(r) - 1);
    expect(gap(1e-3)).toBeLessThan(2.6e-3); // stated agreement at r/a = 0.001: 0.25 %
    expect(gap(1e-6)).toBeLessThan(gap(1e-3));
    expect(gap(1e-6)).toBeLessThan(6e-4);
  });

  it("agrees with an independent finite-difference eigen solve (fixture: bench/wire_cutoff_fd.py → bench/wire_cutoff_fd.out)", () => {
    // Richardson-extrapolated FD values, square lattice; tolerance: the stated error of the method
    expectClose(solveWireCutoff("square", 0.1).kpA, 2.358001, { rel: 2e-6 });
    expectClose(solveWireCutoff("square", 0.2).kpA, 3.401834, { rel: 3e-5 });
    expectClose(solveWireCutoff("square", 0.25).kpA, 4.060621, { rel: 3e-4 });
    expectClose(solveWireCutoff("square", 0.3).kpA, 4.853282, { rel: 3e-3 });
  });

  it("the table interpolates the solves and stops at the solved range", () => {
    // interpolation error: below 1e-5 up to r/a = 0.14, 1e-4 near the top of the range (steeper there)
    for (const r of [3e-7, 2.2e-4, 0.013, 0.137]) expectClose(wireCutoffKpA("square", r), solveWireCutoff("square", r).kpA, { rel: 1e-5, label: `r=${r}` });
    expectClose(wireCutoffKpA("square", 0.29), solveWireCutoff("square", 0.29).kpA, { rel: 1e-4 });
    for (const r of [2.2e-4, 0.137]) expectClose(wireCutoffKpA("hex", r), solveWireCutoff("hex", r).kpA, { rel: 1e-5, label: `hex r=${r}` });
    expect(Number.isNaN(wireCutoffKpA("square", wireTableMaxRatio("square") * 1.01))).toBe(true);
    expect(Number.isNaN(wireCutoffKpA("hex", 0.21))).toBe(true);
  });

  it("the thick-wire closed form lies 1.7 % above the lattice value at r/a = 0.01 and 24 % at 0.3 (issue figures)", () => {
    const rel = (r: number) => thickWirePlasmaHz(1, r) / wirePlasma(1, r).latticeHz - 1;
    expectClose(rel(0.01), 0.017, { abs: 0.001 });
    expectClose(rel(0.3), 0.24, { abs: 0.01 });
    expect(correctedWirePlasmaHz(1, 0.001) / wirePlasma(1, 0.001).latticeHz - 1).toBeLessThan(2.6e-3);
  });
});

describe("designs hit their target by the lattice value", () => {
  it("ε = −30 at 10 GHz with 4 mm pitch: the radius gives −30 (the thick-wire form would give about −45)", () => {
    const r = radiusForTarget(-30, 4e-3, 10e9, complex(1), 5.8e7);
    expect(r.converged).toBe(true);
    const eps = wireMediumResponse({ pitchM: 4e-3, radiusM: r.radiusM, frequencyHz: 10e9, hostEps: complex(1), conductivitySPerM: 5.8e7 }).eps;
    expectClose(eps.re, -30, { rel: 1e-9 });
    const thick = 1 - (thickWirePlasmaHz(4e-3, r.radiusM) / 10e9) ** 2;
    expect(thick).toBeLessThan(-40);
  });
  it("ε = −1 at 5 mm pitch lands on −1 (the thick-wire radius landed near −0.92)", () => {
    const r = radiusForTarget(-1, 5e-3, 10e9, complex(1), 5.8e7);
    expectClose(r.achieved.re, -1, { rel: 1e-9 });
  });
});
