/**
 * sweepSummary.ts and sweepCsv.ts: the figures' uncertainties reach the band (its edge ranges, the
 * per-frequency verdict) and every output (JSON, CSV columns at the end, the human sentence). The
 * series are synthetic with answers worked by hand (sweepBand.test.ts checks the band rule itself).
 */
import { parse } from "csv-parse/sync";
import { describe, expect, it } from "vitest";
import { sweepCsvColumns, sweepCsvText } from "../../../src/verify/sweep/sweepCsv.js";
import type { SweepCaseFigures, SweepPoint } from "../../../src/verify/sweep/sweepPoint.js";
import { bandSentence, summarizeSweep, sweepJson } from "../../../src/verify/sweep/sweepSummary.js";
import { expectClose } from "../../helpers/close.js";

const fs = [8e9, 8.5e9, 9e9, 9.5e9, 10e9];

function figures(name: SweepCaseFigures["name"], vsBare: number, u: number | null, converged: boolean | null): SweepCaseFigures {
  return {
    name, method: "fdfd", available: true, reason: null, scatteringWidthM: vsBare * 0.1, scatteringWidthUncertaintyM: u === null ? null : u * 0.1, absorptionWidthM: 0,
    vsBare, vsBareUncertainty: u, deliveredPower: null, deliveredPowerUncertainty: null, deviationDeg: null, uncertainty: u === null ? null : u / Math.max(vsBare, 1), converged,
  };
}

function points(realized: number[], uReal: (number | null)[], conv: (boolean | null)[]): SweepPoint[] {
  // given out of order: the summary sorts them
  return [4, 0, 3, 1, 2].map((k) => ({
    frequencyHz: fs[k], method: "fdfd" as const, homogenization: null, ground: false, resolutions: [12, 17, 24], grid: { nx: 10, ny: 10, stepM: 1e-3 }, background: { eps: 1, mu: 1 }, backgroundLossTangent: null, notes: [],
    cases: [figures("bare", 1, uReal[k] === null ? null : 0, conv[k]), figures("reduced", 0.3, uReal[k] === null ? null : 0.01, conv[k]), figures("realized", realized[k], uReal[k], conv[k])],
  }));
}

describe("sweep summary with uncertainties", () => {
  it("the band carries its edge ranges into JSON, CSV and the sentence; an unconverged point at an edge marks it", () => {
    const r = summarizeSweep(points([0.9, 0.58, 0.2, 0.4, 0.8], [0.01, 0.05, 0.01, 0.01, 0.01], [true, false, true, true, true]), { designFrequencyHz: 9e9, threshold: 2, beam: false });
    expect(r.frequenciesHz).toEqual(fs);
    const b = r.band!;
    // limit 0.6 ± 0.02; 8.5 GHz: margin 0.02 ± 0.07 → uncertain; pessimistic edge between 8.5 and 9 GHz: −0.05, +0.37
    expectClose(b.limitUncertainty!, 0.02, { rel: 1e-12 });
    expect(b.meetsLimit).toEqual(["no", "uncertain", "yes", "yes", "no"]);
    expectClose(b.lowRangeHz![1], 9e9 - 0.5e9 * (0.37 / 0.42), { rel: 1e-12 });
    expect(b.lowConverged).toBe(false);
    const json = sweepJson(r, 2) as unknown as { band: Record<string, unknown>; cases: { name: string; vsBareUncertainty: (number | null)[] }[] };
    expect(json.band.lowRangeHz).toEqual(b.lowRangeHz);
    expect(json.band.lowConverged).toBe(false);
    expect(json.band.meetsLimit).toEqual(["no", "uncertain", "yes", "yes", "no"]);
    expect(json.cases.find((c) => c.name === "realized")!.vsBareUncertainty).toEqual([0.01, 0.05, 0.01, 0.01, 0.01]);
    const text = sweepCsvText(r.points, { hasBare: true, beam: false, figure: r.figure, meetsLimit: b.meetsLimit });
    const header = text.split("\n")[0].split(",");
    expect(header.slice(-2)).toEqual(["figure_uncertainty", "meets_limit"]);
    expect(header).toEqual(sweepCsvColumns({ hasBare: true, beam: false, figure: r.figure, meetsLimit: null }));
    const rows: Record<string, string>[] = parse(text, { columns: true });
    const real = rows.filter((row) => row.case === "realized");
    expect(real.map((row) => row.meets_limit)).toEqual(["no", "uncertain", "yes", "yes", "no"]);
    expect(real.map((row) => Number(row.figure_uncertainty))).toEqual([0.01, 0.05, 0.01, 0.01, 0.01]);
    expect(rows.filter((row) => row.case !== "realized").every((row) => row.meets_limit === "")).toBe(true);
    const sentence = bandSentence(r, 2);
    expect(sentence).toMatch(/band: 8\.\d+ GHz \(8\.\d+ GHz … 8\.\d+ GHz\) \[not converged\] … 9\.\d+ GHz \(9\.\d+ GHz … 9\.\d+ GHz\)/);
    expect(sentence).toMatch(/within the figures' uncertainties/);
  });

  it("a single grid: the band has no ranges and says so", () => {
    const none = [null, null, null, null, null];
    const r = summarizeSweep(points([0.9, 0.5, 0.2, 0.4, 0.8], none, none), { designFrequencyHz: 9e9, threshold: 2, beam: false });
    expect(r.band!.lowRangeHz).toBeNull();
    expect(bandSentence(r, 2)).toMatch(/edges without uncertainty \(a single grid per frequency\)/);
    const rows: Record<string, string>[] = parse(sweepCsvText(r.points, { hasBare: true, beam: false, figure: r.figure, meetsLimit: r.band!.meetsLimit }), { columns: true });
    expect(rows.every((row) => row.figure_uncertainty === "")).toBe(true);
  });

  it("a beam's drawn case: the delivered-share homogenization difference and its uncertainty in CSV (realized-geometry rows) and JSON", () => {
    const beamCase = (name: SweepCaseFigures["name"], share: number): SweepCaseFigures => ({
      name, method: "fdfd", available: true, reason: null, scatteringWidthM: 0.02, scatteringWidthUncertaintyM: 1e-4, absorptionWidthM: 0,
      vsBare: null, vsBareUncertainty: null, deliveredPower: share, deliveredPowerUncertainty: 0.002, deviationDeg: 1, uncertainty: 0.005, converged: true,
    });
    const pts: SweepPoint[] = fs.slice(0, 2).map((f, k) => ({
      frequencyHz: f, method: "fdfd" as const, ground: false, resolutions: [12, 17, 24], grid: { nx: 10, ny: 10, stepM: 1e-3 }, background: { eps: 1, mu: 1 }, backgroundLossTangent: null, notes: [],
      homogenization: {
        difference: 0.03 + k, differenceUncertainty: 0.001, differenceScale: "larger-width" as const, relative: 0.05,
        deliveredPowerDifference: -0.0125 - k, deliveredPowerDifferenceUncertainty: 0.0025, converged: true, stepsAcrossFeature: [2, 3, 4.5],
      },
      cases: [beamCase("reduced", 0.9), beamCase("realized", 0.85), beamCase("realized-geometry", 0.84)],
    }));
    const r = summarizeSweep(pts, { designFrequencyHz: 8e9, threshold: 2, beam: true });
    const layout = { hasBare: false, beam: true, figure: r.figure, meetsLimit: null, drawn: true };
    const text = sweepCsvText(r.points, layout);
    const header = text.split("\n")[0].split(",");
    expect(header.slice(-4)).toEqual(["homogenization_difference", "homogenization_uncertainty", "homogenization_delivered_difference", "homogenization_delivered_uncertainty"]);
    const rows: Record<string, string>[] = parse(text, { columns: true });
    const drawn = rows.filter((row) => row.case === "realized-geometry");
    expect(drawn.map((row) => Number(row.homogenization_delivered_difference))).toEqual([-0.0125, -1.0125]);
    expect(drawn.map((row) => Number(row.homogenization_delivered_uncertainty))).toEqual([0.0025, 0.0025]);
    expect(rows.filter((row) => row.case !== "realized-geometry").every((row) => row.homogenization_delivered_difference === "" && row.homogenization_delivered_uncertainty === "")).toBe(true);
    for (const row of rows) expect(Object.keys(row).length).toBe(header.length);
    const json = sweepJson(r, 2) as unknown as { homogenization: { deliveredPowerDifference: number[]; deliveredPowerDifferenceUncertainty: number[] } };
    expect(json.homogenization.deliveredPowerDifference).toEqual([-0.0125, -1.0125]);
    expect(json.homogenization.deliveredPowerDifferenceUncertainty).toEqual([0.0025, 0.0025]);
  });
});
