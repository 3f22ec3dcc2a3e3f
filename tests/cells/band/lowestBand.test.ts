/**
 * The lowest band of circle lattices (cells/band/lowestBand.ts) on square, hexagonal and
 * rectangular lattices: the light line, the long-wavelength limit against the independent cell
 * solver, identities between lattices, the order of spatial dispersion and the truncation.
 */
import { describe, expect, it } from "vitest";
import { bandIndex, type BandPolarization } from "../../../src/cells/band/lowestBand.js";
import { bandDirections } from "../../../src/cells/band/bandLattice.js";
import { rectCircleNode } from "../../../src/cells/homogenize/rectCircleTable.js";
import { ProgrammerError } from "../../../src/core/errors.js";
import { expectClose } from "../../helpers/close.js";

const POLS: BandPolarization[] = ["parallel", "perpendicular"];

describe("a homogeneous cell: the lowest band is the light line (identity: no structure, no dispersion)", () => {
  const cases = [
    { lattice: "square" as const, aspect: undefined },
    { lattice: "hex" as const, aspect: undefined },
    { lattice: "rect" as const, aspect: 2 },
    { lattice: "rect" as const, aspect: 1 / 3 },
  ];
  for (const c of cases) for (const pol of POLS) {
    it(`${c.lattice}${c.aspect ? ` aspect ${c.aspect.toFixed(3)}` : ""}, ${pol}: n = √ε along every direction`, () => {
      // k₀a = 0.5 with n = 2: k = 1.0 stays below every zone edge here (the shortest: π/2 for b = 2)
      const b = bandIndex({ lattice: c.lattice, ...(c.aspect ? { aspect: c.aspect } : {}), epsHost: 4, epsCircle: 4, fill: 0.2 }, pol, 0.5);
      expect(b.inBand).toBe(true);
      expect(b.index).toHaveLength(c.lattice === "rect" ? 3 : 2);
      expectClose(b.index, b.index.map(() => 2), { rel: 1e-9, label: "band index" });
      expectClose(b.quasiStaticIndex, b.index.map(() => 2), { rel: 1e-9, label: "long-wavelength index" });
      expect(b.deviation).toBeLessThan(1e-9);
      expect(b.excessAnisotropy).toBeLessThan(1e-9);
    });
  }
});

describe("rect lattices: the long-wavelength limit is the solved quasi-static tensor", () => {
  // Datta, Chan, Ho, Soukoulis, "Effective dielectric constant of periodic composite structures",
  // Phys. Rev. B 48, 14936 (1993): the slope of the lowest band at Γ is the homogenized ε. The
  // reference is the independent cell solver (finite volumes + FFT-preconditioned CG,
  // homogenize/rectCircleTable.ts), itself checked against Perrins et al. (1979) at aspect 1.
  // Hz (field across the circles): a wave along x has E along y, so n(Γ–X)² = ε_yy, n(Γ–Y)² = ε_xx.
  for (const [u, fill, aspect] of [[1.5, 0.3, 2], [0.7, 0.3, 0.5], [1.5, 0.15, 3]] as const) {
    it(`contrast ${u}, fill ${fill}, aspect ${aspect}: n² along X and Y = ε_yy and ε_xx of the cell problem`, () => {
      const node = rectCircleNode(u, fill, aspect);
      const m4 = bandIndex({ lattice: "rect", aspect, epsHost: 1, epsCircle: u, fill }, "perpendicular", 0.05, 4);
      const m6 = bandIndex({ lattice: "rect", aspect, epsHost: 1, epsCircle: u, fill }, "perpendicular", 0.05, 6);
      // measured at M = 4: 1.1e-3 (1.5, 0.3, 2), 1.5e-3 (0.7, 0.3, 0.5), 6e-4 (1.5, 0.15, 3) relative in ε
      expectClose(m4.quasiStaticIndex[0] ** 2, node.yy, { rel: 2e-3, label: "ε_yy from Γ–X" });
      expectClose(m4.quasiStaticIndex[1] ** 2, node.xx, { rel: 2e-3, label: "ε_xx from Γ–Y" });
      // the truncation error shrinks with more plane waves (convergence evidence)
      expect(Math.abs(m6.quasiStaticIndex[0] ** 2 - node.yy)).toBeLessThan(Math.abs(m4.quasiStaticIndex[0] ** 2 - node.yy));
      // at k₀a = 0.05 the band index is the long-wavelength index (dispersion ∝ (k₀a)², ~1e-5 here)
      expectClose(m4.index, m4.quasiStaticIndex, { rel: 2e-5, label: "band at k₀a = 0.05" });
      // anisotropic already in the limit: the band's anisotropy is not spatial dispersion
      expect(m4.anisotropy).toBeGreaterThan(2e-3);
      expect(m4.excessAnisotropy).toBeLessThan(1e-4);
    });
  }

  it("Γ–S: the index lies on the ellipse of the quasi-static tensor, 1/n² = cos²θ/ε_yy + sin²θ/ε_xx (Hz)", () => {
    // plane wave in an anisotropic medium with H along z (Landau & Lifshitz, Electrodynamics of
    // Continuous Media, §97): k_x²/ε_yy + k_y²/ε_xx = k₀²
    const b = bandIndex({ lattice: "rect", aspect: 2, epsHost: 1, epsCircle: 1.5, fill: 0.3 }, "perpendicular", 0.05);
    const [, , s] = bandDirections("rect", 2);
    const [eyy, exx] = [b.quasiStaticIndex[0] ** 2, b.quasiStaticIndex[1] ** 2];
    const expected = 1 / Math.sqrt(s.dir[0] ** 2 / eyy + s.dir[1] ** 2 / exx);
    expectClose(b.quasiStaticIndex[2], expected, { rel: 1e-9, label: "long-wavelength Γ–S" });
  });

  it("Ez (field along the circles): the long-wavelength ε is the area average along every direction (exact)", () => {
    // Wiener's parallel bound is the exact value for a field along the inclusions (Milton, The
    // Theory of Composites, 2002, sec. 2.2)
    const b = bandIndex({ lattice: "rect", aspect: 3, epsHost: 2, epsCircle: 10, fill: 0.2 }, "parallel", 0.05);
    expectClose(b.quasiStaticIndex.map((x) => x * x), [3.6, 3.6, 3.6], { rel: 1e-6, label: "ε_zz" });
  });
});

describe("identities between lattices", () => {
  for (const pol of POLS) {
    it(`${pol}: a rect cell of aspect 1 is the square lattice (Γ–X, Γ–Y = Γ–X, Γ–S = Γ–M)`, () => {
      const cell = { epsHost: 1, epsCircle: 9.6, fill: 0.3 };
      const sq = bandIndex({ lattice: "square", ...cell }, pol, 0.8);
      const re = bandIndex({ lattice: "rect", aspect: 1, ...cell }, pol, 0.8);
      expect(re.directions).toEqual(["Γ–X", "Γ–Y", "Γ–S"]);
      expect(re.planeWaves).toBe(sq.planeWaves);
      expectClose(re.index, [sq.index[0], sq.index[0], sq.index[1]], { rel: 1e-10, label: "band index" });
      // the long-wavelength index is read at k = 1e-3/a, where the band's own dispersion (~1e-8)
      // differs between the directions
      expectClose(re.quasiStaticIndex, [sq.quasiStaticIndex[0], sq.quasiStaticIndex[0], sq.quasiStaticIndex[1]], { rel: 1e-10, label: "long-wavelength" });
      expectClose(re.deviation, sq.deviation, { rel: 1e-8, label: "deviation" });
      // spread over the mean of three directions (X, X, M) against two (X, M): the means differ by a
      // sixth of the spread, so the figures agree to about a sixth of the anisotropy itself
      expectClose(re.excessAnisotropy, sq.excessAnisotropy, { rel: sq.anisotropy, label: "added anisotropy" });
      expectClose(sq.excessAnisotropy, sq.anisotropy, { abs: 1e-7, label: "square: isotropic long-wavelength index" });
    });
  }

  it("aspect R and 1/R are the same cell turned by 90° and scaled by R: X and Y swap at k₀a·R", () => {
    // (a, b) = (1, 1/3) scaled by 3 and turned is (1, 3): k₀ in units of the x spacing scales by 1/3
    const cell = { epsHost: 1, epsCircle: 1 / 9.6, fill: 0.2 };
    const wide = bandIndex({ lattice: "rect", aspect: 3, ...cell }, "perpendicular", 0.3);
    const tall = bandIndex({ lattice: "rect", aspect: 1 / 3, ...cell }, "perpendicular", 0.9);
    expectClose([tall.index[0], tall.index[1], tall.index[2]], [wide.index[1], wide.index[0], wide.index[2]], { rel: 1e-8, label: "band index" });
  });
});

describe("spatial dispersion", () => {
  it("rises as (k₀a)² at low frequency (inversion-symmetric lattice; Agranovich & Ginzburg, Crystal Optics with Spatial Dispersion, 1984, ch. 1)", () => {
    for (const lattice of ["square", "rect"] as const) {
      const cell = { lattice, ...(lattice === "rect" ? { aspect: 1.5 } : {}), epsHost: 1, epsCircle: 9.6, fill: 0.25 };
      const d1 = bandIndex(cell, "perpendicular", 0.1).deviation;
      const d2 = bandIndex(cell, "perpendicular", 0.2).deviation;
      expect(d2 / d1, lattice).toBeGreaterThan(3.8);
      expect(d2 / d1, lattice).toBeLessThan(4.2);
    }
  });

  it("the deviation converges with the plane waves although the index itself carries the truncation error", () => {
    // holes (ε 1 in 9.6), fill 0.3, aspect 2, k₀a = 0.3: measured deviation 1.42e-3, 1.32e-3, 1.28e-3
    // at M = 4, 6, 8, while Γ–X's index moves 0.635, 0.666, 0.679 (the inverse rule converges slowly
    // for low-index circles; the ratio to the same expansion's long-wavelength index cancels most of it)
    const cell = { lattice: "rect" as const, aspect: 2, epsHost: 1, epsCircle: 1 / 9.6, fill: 0.3 };
    const d4 = bandIndex(cell, "perpendicular", 0.3, 4).deviation;
    const d6 = bandIndex(cell, "perpendicular", 0.3, 6).deviation;
    expectClose(d4, d6, { rel: 0.15, label: "deviation at M = 4 against M = 6" });
  });

  it("above the band edge along a direction: not in band, deviation infinite", () => {
    // b = 2a: the zone edge along y is π/2, below k = k₀a·n ≈ 0.8·1.9
    const b = bandIndex({ lattice: "rect", aspect: 2, epsHost: 1, epsCircle: 9.6, fill: 0.2 }, "parallel", 0.8);
    expect(b.inBand).toBe(false);
    expect(Number.isNaN(b.index[1])).toBe(true);
    expect(b.deviation).toBe(Infinity);
  });
});

describe("input checks", () => {
  it("refuses touching circles, a bad aspect, a non-positive permittivity or frequency", () => {
    // aspect 3: circles touch along x at r = 1/2, fill π/12 ≈ 0.262
    expect(() => bandIndex({ lattice: "rect", aspect: 3, epsHost: 1, epsCircle: 9.6, fill: 0.3 }, "perpendicular", 0.5)).toThrow(ProgrammerError);
    expect(() => bandIndex({ lattice: "rect", aspect: 5, epsHost: 1, epsCircle: 9.6, fill: 0.1 }, "perpendicular", 0.5)).toThrow(ProgrammerError);
    expect(() => bandIndex({ lattice: "square", epsHost: 1, epsCircle: -2, fill: 0.1 }, "perpendicular", 0.5)).toThrow(ProgrammerError);
    expect(() => bandIndex({ lattice: "square", epsHost: 1, epsCircle: 2, fill: 0.1 }, "perpendicular", 0)).toThrow(ProgrammerError);
    expect(() => bandIndex({ lattice: "square", epsHost: 1, epsCircle: 2, fill: 0.1 }, "perpendicular", NaN)).toThrow(ProgrammerError);
  });
});
