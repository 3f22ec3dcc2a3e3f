/**
 * The patch test of the drawn Hz averaging at a planar interface along a grid axis: the exact static
 * field of a dielectric half-space in a uniform field — u piecewise linear, u and β ∂u/∂n continuous
 * (β = 1/ε, the in-plane coefficient of Hz) — must satisfy the discrete equations exactly, wherever
 * the interface falls between the nodes. This is the laminate exactness of the Kottke average
 * (Kottke, Farjadpour & Johnson, Phys. Rev. E 77, 036611 (2008): harmonic mean across the interface,
 * arithmetic mean along it — the Wiener bounds of a laminate, exact for fields along and across its
 * layers). At oblique interfaces the scheme is not exact: its residual carries a mean dipole layer,
 * the measured cause of the first-order Hz drawing (DEVELOPERS.md "Accuracy of the drawing").
 */
import { describe, expect, it } from "vitest";
import { gridCoefficients } from "../../src/verify/gridCoefficients.js";
import { BOX_PART, SAMPLE_BACKGROUND, SAMPLE_MEDIUM, S_B, S_TXX, S_TYY, type Scene } from "../../src/verify/scene.js";
import { applyOperator } from "../../src/verify/stencil.js";

const EPS = 9.6;

/** Dielectric (ε) where along·(x, y) < offset, air beyond; exact box parts and normal, like a drawn scene's. */
function halfSpace(alongX: boolean, offset: number): Scene {
  const coord = (x: number, y: number): number => (alongX ? x : y);
  const medium = (out: Float64Array, o: number): void => {
    out.fill(0, o, o + 8);
    out[o + S_B] = 1; out[o + S_TXX] = EPS; out[o + S_TYY] = EPS;
  };
  return {
    polarization: "Hz", background: { eps: 1, mu: 1 }, bounds: { minX: -20, maxX: 20, minY: -20, maxY: 20 },
    sample: (x, y, out) => (coord(x, y) >= offset ? SAMPLE_BACKGROUND : (medium(out, 0), SAMPLE_MEDIUM)),
    boxParts: (x, y, h, out, normal) => {
      const air = Math.min(1, Math.max(0, (coord(x, y) + h / 2 - offset) / h));
      let k = 0;
      if (air > 0) { out.fill(0, 0, BOX_PART); out[0] = air; out[1] = SAMPLE_BACKGROUND; out[2 + S_B] = 1; out[2 + S_TXX] = 1; out[2 + S_TYY] = 1; k++; }
      if (air < 1) { out[BOX_PART * k] = 1 - air; out[BOX_PART * k + 1] = SAMPLE_MEDIUM; medium(out, BOX_PART * k + 2); k++; }
      if (normal) { normal[0] = k === 2 && alongX ? 1 : 0; normal[1] = k === 2 && !alongX ? 1 : 0; }
      return k;
    },
  };
}

describe("drawn Hz averaging: patch test at a planar interface along a grid axis", () => {
  it.each([[true, 0.13], [true, 0.5], [true, 0.91], [false, 0.27], [false, 0.74]] as const)("interface normal along x: %s, offset %s h: the exact piecewise-linear static field leaves no residual", (alongX, offset) => {
    const n = 21, g = { nx: n, ny: n, h: 1, x0: -10, y0: -10, pml: 0 };
    const c = gridCoefficients(g, halfSpace(alongX, offset), 4);
    for (const field of ["normal", "tangential"] as const) {
      const uRe = new Float64Array(n * n), uIm = new Float64Array(n * n);
      for (let j = 0; j < n; j++) {
        for (let i = 0; i < n; i++) {
          const x = g.x0 + i, y = g.y0 + j;
          const s = (alongX ? x : y) - offset, t = alongX ? y : x;
          // normal: ∂u/∂n = 1 in the dielectric, 1/ε in air (equal flux β ∂u/∂n); tangential: u = t, continuous
          uRe[i + n * j] = field === "normal" ? (s < 0 ? s : s / EPS) : 0.7 * t + (s < 0 ? s : s / EPS);
        }
      }
      const oRe = new Float64Array(n * n), oIm = new Float64Array(n * n);
      applyOperator(g, c, null, 0, uRe, uIm, oRe, oIm);
      let worst = 0;
      for (let j = 1; j < n - 1; j++) for (let i = 1; i < n - 1; i++) worst = Math.max(worst, Math.abs(oRe[i + n * j]), Math.abs(oIm[i + n * j]));
      // the residual is a sum of O(1) terms: zero to rounding
      expect(worst, `${field} field`).toBeLessThan(1e-12);
    }
  });
});
