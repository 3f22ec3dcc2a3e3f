import { describe, expect, it } from "vitest";
import { checkerboardCell, circleCell, laminateCell } from "../../../src/cells/homogenize/cellShape.js";
import { homogenizeCell } from "../../../src/cells/homogenize/homogenizeCell.js";
import { hashinShtrikmanBounds } from "../../../src/media/bounds.js";
import { expectClose } from "../../helpers/close.js";

/**
 * Square array of cylinders, closed form in the version that respects Keller's symmetry:
 * ε/ε_h = 1 − 2f/(T + f − 0.305827 f⁴T/(T² − 1.402958 f⁸) − 0.013362 f⁸/T), T = (1 + u)/(1 − u).
 * Perrins, McKenzie, McPhedran, Proc. R. Soc. A 369, 207 (1979); accurate to ~1e-5 at f = 0.5
 * against their multipole solution (shared references, "Homogenization").
 */
function perrinsSquare(u: number, f: number): number {
  const T = (1 + u) / (1 - u);
  return 1 - (2 * f) / (T + f - (0.305827 * f ** 4 * T) / (T * T - 1.402958 * f ** 8) - (0.013362 * f ** 8) / T);
}

describe("solved cell problem: square arrays of cylinders (Perrins et al. 1979)", () => {
  // the solver's stated accuracy: 1e-3 relative after the 32/64/128 ladder
  for (const [u, f] of [[10, 0.5], [0.1, 0.5], [1 / 12, 0.5], [100, 0.3]] as const) {
    it(`u = ${Number(u.toPrecision(3))}, f = ${f}: within 1e-3 of the closed form, and the error estimate covers the error`, () => {
      const h = homogenizeCell(circleCell("square", f), u, 32);
      const ref = perrinsSquare(u, f);
      expectClose(h.xx, ref, { rel: 1e-3, label: "ε_xx/ε_h" });
      expect(h.converged).toBe(true);
      expect(h.errorEstimate).toBeGreaterThanOrEqual(Math.abs(h.xx - ref) / ref);
      expect(h.yy).toBe(h.xx);
      expect(h.ladder.map((s) => s.nx)).toEqual([32, 64, 128]);
      for (const s of h.ladder) expect(s.residual).toBeLessThan(1e-9);
    });
  }
});

describe("exact identities", () => {
  it("Keller's reciprocal theorem: ε(ε₁, ε₂)·ε(ε₂, ε₁) = ε₁ε₂ (Keller, J. Math. Phys. 5, 548 (1964))", () => {
    // with ε_h = 1: F(u)·F(1/u) = 1 for square symmetry; a rectangular cell pairs xx with yy
    for (const f of [0.3, 0.5]) {
      const a = homogenizeCell(circleCell("square", f), 10, 32);
      const b = homogenizeCell(circleCell("square", f), 0.1, 32);
      expectClose(a.xx * b.xx, 1, { rel: 1e-3, label: `square f=${f}` });
    }
    const a = homogenizeCell(circleCell("rect", 0.3, 1.5), 10, 32);
    const b = homogenizeCell(circleCell("rect", 0.3, 1.5), 0.1, 32);
    expect(Math.abs(a.xx - a.yy)).toBeGreaterThan(0.05); // anisotropic cell
    expectClose(a.xx * b.yy, 1, { rel: 2e-3, label: "rect xx·yy" });
    expectClose(a.yy * b.xx, 1, { rel: 2e-3, label: "rect yy·xx" });
  });

  it("Dykhne's checkerboard: ε = √(ε₁ε₂) (Sov. Phys. JETP 32, 63 (1971))", () => {
    // the corner singularities slow the grid convergence (the ladder estimate says so); 1 % stated
    const h = homogenizeCell(checkerboardCell(), 10, 32);
    expectClose(h.xx, Math.sqrt(10), { rel: 0.01 });
    expect(h.errorEstimate).toBeGreaterThan(1e-3);
  });

  it("laminate: the Wiener series and parallel means (exact; Wiener 1912)", () => {
    const h = homogenizeCell(laminateCell(0.3), 8, 32);
    expectClose(h.xx, 1 / (0.7 / 1 + 0.3 / 8), { rel: 1e-6, label: "across the layers" });
    expectClose(h.yy, 0.7 + 0.3 * 8, { rel: 1e-6, label: "along the layers" });
  });

  it("low fill: the Maxwell Garnett limit (Rayleigh 1892; the next term is O(f⁴))", () => {
    // compare the polarization F − 1 (MG and the exact value differ by ~1e-7 here; 1 % is the
    // solver's accuracy on so small a circle: 10 cells across its radius on the finest grid)
    const f = 0.02, u = 10;
    const mg = 1 + (2 * f * (u - 1)) / (u + 1 - f * (u - 1));
    const h = homogenizeCell(circleCell("square", f), u, 32);
    expectClose(h.xx - 1, mg - 1, { rel: 0.01 });
  });

  it("every solved value lies inside the 2D Hashin–Shtrikman bounds (Hashin & Shtrikman 1962)", () => {
    for (const lattice of ["square", "hex"] as const) {
      for (const [u, f] of [[12, 0.6], [1 / 12, 0.6], [1000, 0.2]] as const) {
        const h = homogenizeCell(circleCell(lattice, f), u, 16);
        const [lo, hi] = hashinShtrikmanBounds(1, u, f, 2);
        expect(h.xx).toBeGreaterThanOrEqual(lo * (1 - 1e-12));
        expect(h.xx).toBeLessThanOrEqual(hi * (1 + 1e-12));
      }
    }
  });
});
