/**
 * The sparse nested-dissection solve of the FDFD operator (assemble.ts, solve.ts) checked by the
 * matrix-free operator (stencil.ts `applyOperator`, which never builds a matrix): the solution
 * must satisfy L u = f on the open nodes and u = f on the held ones, on scenes with a PML, a
 * perfect conductor (held nodes) and rotated anisotropy (cross terms); and the grid-size refusal.
 * (The solver itself is compared with banded and dense references in tests/numerics.)
 */
import { describe, expect, it } from "vitest";
import { InputError } from "../../src/core/errors.js";
import { checkGridSize, gridFits, solveCost } from "../../src/verify/assemble.js";
import { gridForWindow, type FdfdGrid } from "../../src/verify/fdfdGrid.js";
import { gridCoefficients } from "../../src/verify/gridCoefficients.js";
import { pmlStretch } from "../../src/verify/pml.js";
import { SAMPLE_MEDIUM, SAMPLE_PEC, S_B, S_TXX, S_TXY, S_TYY, type Scene } from "../../src/verify/scene.js";
import { solveLinear } from "../../src/verify/solve.js";
import { applyOperator } from "../../src/verify/stencil.js";
import { expectClose } from "../helpers/close.js";

const k0 = 2 * Math.PI;

/** A rotated anisotropic lossy block with a perfectly conducting disk in it. */
function scene(pol: "Ez" | "Hz"): Scene {
  const t1 = 2.5, t2 = 0.7, th = 0.6, c = Math.cos(th), s = Math.sin(th);
  return {
    polarization: pol,
    background: { eps: 1, mu: 1 },
    bounds: { minX: -0.3, maxX: 0.3, minY: -0.25, maxY: 0.25 },
    sample(x, y, out) {
      if (Math.abs(x) > 0.3 || Math.abs(y) > 0.25) return 0;
      if (x * x + y * y < 0.1 ** 2) return SAMPLE_PEC;
      out[S_B] = 1.8; out[S_B + 1] = 0.05;
      out[S_TXX] = t1 * c * c + t2 * s * s; out[S_TXX + 1] = 0;
      out[S_TYY] = t1 * s * s + t2 * c * c; out[S_TYY + 1] = 0;
      out[S_TXY] = (t1 - t2) * c * s; out[S_TXY + 1] = 0.01;
      return SAMPLE_MEDIUM;
    },
  };
}

/** Relative residual of u against L u = f (open nodes) and u = f (held nodes), by the matrix-free operator. */
function matrixFreeResidual(g: FdfdGrid, sc: Scene, uRe: Float64Array, uIm: Float64Array, fRe: Float64Array, fIm: Float64Array, hold: Uint8Array | null): { open: number; held: number } {
  const c = gridCoefficients(g, sc, 3);
  const n = g.nx * g.ny;
  const oRe = new Float64Array(n), oIm = new Float64Array(n);
  applyOperator(g, c, pmlStretch(g, k0, 1), k0, uRe, uIm, oRe, oIm);
  let num = 0, den = 0, held = 0;
  for (let id = 0; id < n; id++) {
    if (hold && hold[id]) { held = Math.max(held, Math.hypot(uRe[id] - fRe[id], uIm[id] - fIm[id])); continue; }
    num += (oRe[id] - fRe[id]) ** 2 + (oIm[id] - fIm[id]) ** 2;
    den += fRe[id] ** 2 + fIm[id] ** 2;
  }
  return { open: Math.sqrt(num / den), held };
}

describe("sparse FDFD solve", () => {
  for (const pol of ["Ez", "Hz"] as const) {
    it(`${pol}: satisfies the matrix-free operator (PML, conductor, cross terms, loss) and reports its residual`, () => {
      const g = gridForWindow({ minX: -0.45, maxX: 0.45, minY: -0.4, maxY: 0.4 }, 1 / 40, 10);
      const sc = scene(pol);
      const c = gridCoefficients(g, sc, 3);
      const n = g.nx * g.ny;
      const fRe = new Float64Array(n), fIm = new Float64Array(n);
      for (let id = 0; id < n; id++) { fRe[id] = Math.sin(0.37 * id); fIm[id] = Math.cos(0.11 * id); }
      const hold = pol === "Ez" ? c.pecNode : null;
      if (pol === "Ez") expect(hold!.some((x) => x === 1)).toBe(true);
      const sol = solveLinear(g, c, pmlStretch(g, k0, 1), k0, fRe, fIm, hold);
      const r = matrixFreeResidual(g, sc, sol.re, sol.im, fRe, fIm, hold);
      expect(r.open).toBeLessThan(1e-9);
      expect(r.held).toBeLessThan(1e-12);
      // the check can fail: a solution off by a small perturbation is seen
      const bent = sol.re.slice(); bent[7 + g.nx * 9] += 1e-6; // an open node (the conductor sits at the centre)
      expect(matrixFreeResidual(g, sc, bent, sol.im, fRe, fIm, hold).open).toBeGreaterThan(1e-9);
      expect(sol.residual).toBeLessThan(1e-10);
      expect(sol.pivotRatio).toBeGreaterThan(0);
    });
  }

  it("refuses a grid whose memory estimate exceeds the limit, with the grid, the estimate and the limit in the message", () => {
    const g = gridForWindow({ minX: -1, maxX: 1, minY: -1, maxY: 1 }, 1 / 200, 12);
    const cost = solveCost(g);
    expect(cost.unknowns).toBe(g.nx * g.ny);
    expect(gridFits(g, cost.megabytes * 1e6 * 1.01)).toBe(true);
    expect(gridFits(g, cost.megabytes * 1e6 * 0.99)).toBe(false);
    let err: unknown = null;
    try { checkGridSize(g, "--resolution", 100e6, "the largest resolution that fits is 20"); } catch (e) { err = e; }
    expect(err).toBeInstanceOf(InputError);
    const msg = (err as InputError).message;
    expect(msg).toContain(`${g.nx} × ${g.ny} nodes`);
    expect(msg).toContain(`${Math.round(cost.megabytes)} MB`);
    expect(msg).toContain("100 MB allowed");
    expect(msg).toContain("largest resolution that fits is 20");
    expect(() => checkGridSize(g)).not.toThrow(); // 425² nodes fit the default
  });
});
