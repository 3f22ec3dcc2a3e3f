/**
 * Maxwell's equations have no length scale: a scene shrunk by 10⁻⁶ together with its wavelength
 * scatters the same field (an identity). Regression: rows of nodes held inside a conductor used to
 * carry a unit diagonal next to stencil rows of size 1/h² ≈ 10¹⁵ on optical grids, which the direct
 * solver's relative pivot test took for a zero pivot (the silicon carpet demo failed this way).
 */
import { describe, expect, it } from "vitest";
import { cylinderScene } from "../../src/verify/cylinderScene.js";
import { gridForWindow } from "../../src/verify/fdfdGrid.js";
import { crossSections, fluxBox } from "../../src/verify/metrics.js";
import { solveScene } from "../../src/verify/solve.js";

describe("scale invariance of the FDFD solve", () => {
  for (const pol of ["Ez", "Hz"] as const) {
    it(`${pol}: a conducting cylinder at λ0 = 1 m and at λ0 = 1 µm gives the same scattering width in wavelengths`, () => {
      const width = (scale: number): number => {
        const g = gridForWindow({ minX: -0.5 * scale, maxX: 0.5 * scale, minY: -0.5 * scale, maxY: 0.5 * scale }, scale / 30, 12);
        const sol = solveScene(cylinderScene(pol, { eps: 1, mu: 1 }, 0.25 * scale, { kind: "pec" }), g, (2 * Math.PI) / scale);
        return crossSections(sol, fluxBox(sol)!).scatteringM / scale;
      };
      const big = width(1), small = width(1e-6);
      expect(big).toBeGreaterThan(0.1);
      expect(Math.abs(small / big - 1)).toBeLessThan(1e-9);
    });
  }
});
