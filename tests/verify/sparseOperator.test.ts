/**
 * The sparse nested-dissection solve of the FDFD operator (assemble.ts, solve.ts) against the
 * banded LDLᵀ it replaced (kept as the reference), on scenes with a PML, a perfect conductor
 * (held nodes) and rotated anisotropy (cross terms); and the grid-size refusal.
 */
import { describe, expect, it } from "vitest";
import { InputError } from "../../src/core/errors.js";
import { factorSymBanded, solveSymFactored } from "../../src/verify/bandedLdlt.js";
import { assembleOperator, checkGridSize, gridFits, nodeOrder, solveCost } from "../../src/verify/assemble.js";
import { gridForWindow, type FdfdGrid } from "../../src/verify/fdfdGrid.js";
import { gridCoefficients } from "../../src/verify/gridCoefficients.js";
import { pmlStretch } from "../../src/verify/pml.js";
import { SAMPLE_MEDIUM, SAMPLE_PEC, S_B, S_TXX, S_TXY, S_TYY, type Scene } from "../../src/verify/scene.js";
import { solveLinear } from "../../src/verify/solve.js";
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

/** The pre-existing banded path (natural order along the shorter side, band LDLᵀ). */
function bandedSolve(g: FdfdGrid, sc: Scene, fRe: Float64Array, fIm: Float64Array, hold: Uint8Array | null): [Float64Array, Float64Array] {
  const c = gridCoefficients(g, sc, 3);
  const order = nodeOrder(g), n = g.nx * g.ny;
  const f2Re = fRe.slice(), f2Im = fIm.slice();
  const m = assembleOperator(g, c, pmlStretch(g, k0, 1), k0, order, hold, f2Re, f2Im);
  expect(factorSymBanded(m).ok).toBe(true);
  const bRe = new Float64Array(n), bIm = new Float64Array(n);
  for (let id = 0; id < n; id++) { bRe[order.row[id]] = f2Re[id]; bIm[order.row[id]] = f2Im[id]; }
  solveSymFactored(m, bRe, bIm);
  const re = new Float64Array(n), im = new Float64Array(n);
  for (let id = 0; id < n; id++) { re[id] = bRe[order.row[id]]; im[id] = bIm[order.row[id]]; }
  return [re, im];
}

describe("sparse FDFD solve", () => {
  for (const pol of ["Ez", "Hz"] as const) {
    it(`${pol}: equals the banded reference (PML, conductor, cross terms, loss) and reports its residual`, () => {
      const g = gridForWindow({ minX: -0.45, maxX: 0.45, minY: -0.4, maxY: 0.4 }, 1 / 40, 10);
      const sc = scene(pol);
      const c = gridCoefficients(g, sc, 3);
      const n = g.nx * g.ny;
      const fRe = new Float64Array(n), fIm = new Float64Array(n);
      for (let id = 0; id < n; id++) { fRe[id] = Math.sin(0.37 * id); fIm[id] = Math.cos(0.11 * id); }
      const hold = pol === "Ez" ? c.pecNode : null;
      if (pol === "Ez") expect(hold!.some((x) => x === 1)).toBe(true);
      const sol = solveLinear(g, c, pmlStretch(g, k0, 1), k0, fRe, fIm, hold);
      const [re, im] = bandedSolve(g, sc, fRe, fIm, hold);
      expectClose(sol.re, re, { rel: 1e-8, abs: 1e-9, label: `${pol} re` });
      expectClose(sol.im, im, { rel: 1e-8, abs: 1e-9, label: `${pol} im` });
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
