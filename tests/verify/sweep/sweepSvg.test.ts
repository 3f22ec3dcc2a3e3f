/**
 * The sweep plot (src/verify/sweep/sweepSvg.ts): tick steps of 1, 2 or 5 × 10^k covering the range,
 * axis labels with units, one line and legend entry per case, hollow markers where not converged,
 * the band shaded and the limit dashed; no NaN in the drawing.
 */
import { describe, expect, it } from "vitest";
import { niceTicks, sweepSvg } from "../../../src/verify/sweep/sweepSvg.js";
import { sweepFigure } from "../../../src/verify/sweep/sweepSummary.js";
import { sweepBand } from "../../../src/verify/sweep/sweepBand.js";

describe("niceTicks", () => {
  it("steps of 1, 2 or 5 × 10^k, inside the range, about the count asked", () => {
    expect(niceTicks(0, 1)).toEqual([0, 0.2, 0.4, 0.6000000000000001, 0.8, 1]);
    expect(niceTicks(8, 10, 6)).toEqual([8, 8.5, 9, 9.5, 10]);
    const t = niceTicks(0, 2.38);
    expect(t[0]).toBe(0);
    expect(t[t.length - 1]).toBeLessThanOrEqual(2.38);
    expect(t[1] - t[0]).toBe(0.5);
    expect(niceTicks(3, 3)).toEqual([3]);
  });
});

describe("sweepSvg", () => {
  it("draws the cases, the axes with units, the band and the limit", () => {
    const fs = [8e9, 8.5e9, 9e9, 9.5e9, 10e9];
    const realized = [0.9, 0.5, 0.2, 0.4, 0.8], reduced = [0.35, 0.32, 0.3, 0.31, 0.33];
    const band = sweepBand({ frequenciesHz: fs, realized, reduced, sense: "lower-is-better", threshold: 2, designFrequencyHz: 9e9 });
    const svg = sweepSvg(fs, [
      { name: "bare", values: [1, 1, 1, 1, 1], converged: [true, true, true, true, true] },
      { name: "reduced", values: reduced, converged: [true, true, true, true, true] },
      { name: "realized", values: realized, converged: [true, false, true, true, null] },
    ], sweepFigure(true, false), band, "test device", "σ/σ_bare");
    expect(svg.startsWith("<svg")).toBe(true);
    expect(svg).not.toMatch(/NaN|Infinity|undefined/);
    expect(svg).toContain("frequency (GHz)");
    expect(svg).toContain(">σ/σ_bare</text>");
    for (const name of ["bare", "reduced", "realized", "band", "not converged"]) expect(svg).toContain(`>${name}</text>`);
    expect(svg).toContain("limit (reduced × 2)");
    expect((svg.match(/<path /g) ?? []).length).toBe(3);
    expect((svg.match(/fill="white" stroke="#d95f02"/g) ?? []).length).toBe(1); // one hollow realized marker
    for (const tick of [">8<", ">9<", ">10<"]) expect(svg).toContain(tick);
    expect(svg).not.toContain("edge range"); // no uncertainties given
  });

  it("with uncertainties the edges' ranges are shaded and named in the legend", () => {
    const fs = [8e9, 8.5e9, 9e9, 9.5e9, 10e9];
    const realized = [0.9, 0.5, 0.2, 0.4, 0.8], reduced = [0.35, 0.32, 0.3, 0.31, 0.33];
    const band = sweepBand({ frequenciesHz: fs, realized, reduced, sense: "lower-is-better", threshold: 2, designFrequencyHz: 9e9, realizedUncertainty: [0.05, 0.05, 0.01, 0.01, 0.01] });
    const svg = sweepSvg(fs, [{ name: "realized", values: realized, converged: [true, true, true, true, true] }], sweepFigure(true, false), band, "t");
    expect(svg).toContain(">edge range (uncertainty)</text>");
    expect((svg.match(/fill="#999" fill-opacity="0.25"/g) ?? []).length).toBe(2);
    expect(svg).not.toMatch(/NaN|Infinity|undefined/);
  });

  it("a figure in metres gets an SI-prefixed axis; a gap in a series breaks its line", () => {
    const svg = sweepSvg([1e9, 2e9, 3e9], [{ name: "realized", values: [0.004, null, 0.006], converged: [null, null, null] }], sweepFigure(false, false), null, "t");
    expect(svg).toContain("scattering width σ_s (mm)");
    expect(svg).not.toMatch(/<path /); // two isolated points: no segment to draw
    expect((svg.match(/<circle cx/g) ?? []).length).toBe(2 + 2); // two markers + the legend's series marker and "not converged"
  });
});
