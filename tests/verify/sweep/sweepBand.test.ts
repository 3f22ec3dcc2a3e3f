/**
 * The band of a sweep (src/verify/sweep/sweepBand.ts) on synthetic series whose answer is known by
 * hand: edges where linear interpolation crosses the limit, open edges at the ends of the sweep,
 * no band when the realized device fails at the centre, and both senses of the figure.
 */
import { describe, expect, it } from "vitest";
import { sweepBand } from "../../../src/verify/sweep/sweepBand.js";
import { sweepFrequencies, sweepFrequencyFormat } from "../../../src/verify/sweep/sweepFrequencies.js";
import { expectClose } from "../../helpers/close.js";

const fs = [8e9, 8.5e9, 9e9, 9.5e9, 10e9];

describe("sweepBand", () => {
  it("lower is better: edges where the realized ratio crosses 2× the reduced one at the centre", () => {
    // reduced 0.3 at 9 GHz → limit 0.6; realized 0.9 0.5 0.2 0.4 0.8
    const b = sweepBand({ frequenciesHz: fs, realized: [0.9, 0.5, 0.2, 0.4, 0.8], reduced: [0.35, 0.32, 0.3, 0.31, 0.33], sense: "lower-is-better", threshold: 2, designFrequencyHz: 9e9 });
    expect(b.reason).toBeNull();
    expectClose(b.limit!, 0.6, { rel: 1e-12 });
    expect(b.centreHz).toBe(9e9);
    // low edge between 8 GHz (0.9) and 8.5 GHz (0.5): margin −0.3 and +0.1 → 8.5 − 0.5·0.1/0.4 = 8.375 GHz
    expectClose(b.lowHz!, 8.375e9, { rel: 1e-12 });
    // high edge between 9.5 GHz (0.4) and 10 GHz (0.8): margin +0.2, −0.2 → 9.75 GHz
    expectClose(b.highHz!, 9.75e9, { rel: 1e-12 });
    expect(b.openLow).toBe(false);
    expect(b.openHigh).toBe(false);
  });

  it("an edge that reaches the end of the sweep is open", () => {
    const b = sweepBand({ frequenciesHz: fs, realized: [0.1, 0.1, 0.1, 0.1, 0.7], reduced: [0.3, 0.3, 0.3, 0.3, 0.3], sense: "lower-is-better", threshold: 2, designFrequencyHz: 9e9 });
    expect(b.lowHz).toBe(8e9);
    expect(b.openLow).toBe(true);
    expectClose(b.highHz!, 9.5e9 + 0.5e9 * (0.5 / 0.6), { rel: 1e-12 });
    expect(b.openHigh).toBe(false);
  });

  it("higher is better (delivered power): the realized power must stay above the reduced power / T", () => {
    const b = sweepBand({ frequenciesHz: fs, realized: [0.2, 0.5, 0.8, 0.45, 0.3], reduced: [0.8, 0.85, 0.9, 0.85, 0.8], sense: "higher-is-better", threshold: 2, designFrequencyHz: 9e9 });
    expectClose(b.limit!, 0.45, { rel: 1e-12 });
    // low: between 8 (0.2, −0.25) and 8.5 (0.5, +0.05) → 8.5 − 0.5·0.05/0.3
    expectClose(b.lowHz!, 8.5e9 - 0.5e9 * (0.05 / 0.3), { rel: 1e-12 });
    // high: 9.5 GHz sits exactly on the limit (margin 0 counts as working); 10 GHz fails → edge at 9.5 GHz
    expectClose(b.highHz!, 9.5e9, { rel: 1e-12 });
  });

  it("no band when the realized device misses the limit at the centre", () => {
    const b = sweepBand({ frequenciesHz: fs, realized: [0.3, 0.4, 0.9, 0.4, 0.3], reduced: [0.3, 0.3, 0.3, 0.3, 0.3], sense: "lower-is-better", threshold: 2, designFrequencyHz: 9e9 });
    expect(b.lowHz).toBeNull();
    expect(b.highHz).toBeNull();
    expect(b.reason).toMatch(/misses the limit at the centre/);
  });

  it("centre off the sweep points: the reference and the realized figure are interpolated there", () => {
    // design frequency 8.75 GHz, between points: reduced 0.2 and 0.4 → 0.3, limit 0.6; realized 0.4 and 0.8 → 0.6 (on the limit)
    const b = sweepBand({ frequenciesHz: [8.5e9, 9e9], realized: [0.4, 0.8], reduced: [0.2, 0.4], sense: "lower-is-better", threshold: 2, designFrequencyHz: 8.75e9 });
    expectClose(b.reference!, 0.3, { rel: 1e-12 });
    expectClose(b.lowHz!, 8.5e9, { rel: 1e-12 });
    expect(b.openLow).toBe(true);
    expectClose(b.highHz!, 8.75e9, { rel: 1e-12 });
  });

  it("design frequency outside the sweep: the sweep's middle is the centre", () => {
    const b = sweepBand({ frequenciesHz: fs, realized: [1, 1, 1, 1, 1], reduced: [1, 1, 1, 1, 1], sense: "lower-is-better", threshold: 1.5, designFrequencyHz: 20e9 });
    expect(b.centreHz).toBe(9e9);
    expect(b.lowHz).toBe(8e9);
    expect(b.highHz).toBe(10e9);
    expect(b.openLow && b.openHigh).toBe(true);
  });

  it("a null figure ends the band where it is; no reference gives no band", () => {
    const b = sweepBand({ frequenciesHz: fs, realized: [0.1, null, 0.1, 0.1, 0.1], reduced: [0.3, 0.3, 0.3, 0.3, 0.3], sense: "lower-is-better", threshold: 2, designFrequencyHz: 9e9 });
    expect(b.lowHz).toBe(9e9);
    expect(b.openLow).toBe(false);
    const none = sweepBand({ frequenciesHz: fs, realized: [0.1, 0.1, 0.1, 0.1, 0.1], reduced: [0.3, 0.3, null, 0.3, 0.3], sense: "lower-is-better", threshold: 2, designFrequencyHz: 9e9 });
    expect(none.lowHz).toBeNull();
    expect(none.reason).toMatch(/reduced design has no figure/);
  });

  it("one frequency: the band is that frequency (open both ways) or none", () => {
    const b = sweepBand({ frequenciesHz: [9e9], realized: [0.5], reduced: [0.3], sense: "lower-is-better", threshold: 2, designFrequencyHz: 9e9 });
    expect([b.lowHz, b.highHz, b.openLow, b.openHigh]).toEqual([9e9, 9e9, true, true]);
  });

  it("without uncertainties (a single grid) the edges have no range and every point is yes or no", () => {
    const b = sweepBand({ frequenciesHz: fs, realized: [0.9, 0.5, 0.2, 0.4, 0.8], reduced: [0.35, 0.32, 0.3, 0.31, 0.33], sense: "lower-is-better", threshold: 2, designFrequencyHz: 9e9, realizedUncertainty: [null, null, null, null, null], realizedConverged: [null, null, null, null, null] });
    expect([b.lowRangeHz, b.highRangeHz, b.lowConverged, b.highConverged, b.mayVanish]).toEqual([null, null, null, null, false]);
    expect(b.meetsLimit).toEqual(["no", "yes", "yes", "yes", "no"]);
  });

  it("an edge between two uncertain points is as uncertain as they are: its range is the band's edge with every margin at its optimistic and at its pessimistic end", () => {
    // limit 0.6 (± 2 × 0.01 from the reference); realized 0.9 ± 0.05, 0.5 ± 0.05 → margins −0.3 ± 0.07, +0.1 ± 0.07
    // optimistic: −0.23, +0.17 → 8.5 − 0.5·0.17/0.40; pessimistic: −0.37, +0.03 → 8.5 − 0.5·0.03/0.40
    const u = [0.05, 0.05, 0.01, 0.01, 0.01];
    const b = sweepBand({
      frequenciesHz: fs, realized: [0.9, 0.5, 0.2, 0.4, 0.8], reduced: [0.35, 0.32, 0.3, 0.31, 0.33], sense: "lower-is-better", threshold: 2, designFrequencyHz: 9e9,
      realizedUncertainty: u, reducedUncertainty: [0.01, 0.01, 0.01, 0.01, 0.01], realizedConverged: [true, true, true, true, true],
    });
    expectClose(b.limitUncertainty!, 0.02, { rel: 1e-12 });
    expectClose(b.lowHz!, 8.375e9, { rel: 1e-12 }); // the nominal edge is unchanged
    expectClose(b.lowRangeHz![0], 8.5e9 - 0.5e9 * (0.17 / 0.4), { rel: 1e-12 });
    expectClose(b.lowRangeHz![1], 8.5e9 - 0.5e9 * (0.03 / 0.4), { rel: 1e-12 });
    // high: 0.4 ± 0.01 and 0.8 ± 0.01 → margins +0.2 ± 0.03, −0.2 ± 0.03
    expectClose(b.highRangeHz![0], 9.5e9 + 0.5e9 * (0.17 / 0.4), { rel: 1e-12 });
    expectClose(b.highRangeHz![1], 9.5e9 + 0.5e9 * (0.23 / 0.4), { rel: 1e-12 });
    expect([b.lowConverged, b.highConverged, b.mayVanish]).toEqual([true, true, false]);
    expect(b.meetsLimit).toEqual(["no", "yes", "yes", "yes", "no"]);
  });

  it("a point within its uncertainty of the limit widens the edge past it, and an unconverged point there marks the edge not converged", () => {
    // 8.5 GHz: 0.58 ± 0.05 against the limit 0.6 (uncertain); 8 GHz fails for sure
    const b = sweepBand({
      frequenciesHz: fs, realized: [0.9, 0.58, 0.2, 0.4, 0.8], reduced: [0.3, 0.3, 0.3, 0.3, 0.3], sense: "lower-is-better", threshold: 2, designFrequencyHz: 9e9,
      realizedUncertainty: [0.01, 0.05, 0.01, 0.01, 0.01], realizedConverged: [true, false, true, true, true],
    });
    expect(b.meetsLimit).toEqual(["no", "uncertain", "yes", "yes", "no"]);
    // pessimistic: 8.5 GHz fails (0.6 − 0.63 < 0) → the edge moves between 8.5 and 9 GHz: margins −0.03, +0.39
    expectClose(b.lowRangeHz![1], 9e9 - 0.5e9 * (0.39 / 0.42), { rel: 1e-12 });
    // optimistic: 8.5 GHz works with +0.07, 8 GHz fails with −0.29
    expectClose(b.lowRangeHz![0], 8.5e9 - 0.5e9 * (0.07 / 0.36), { rel: 1e-12 });
    expect(b.lowConverged).toBe(false);
    expect(b.highConverged).toBe(true);
  });

  it("higher is better: the ranges follow the delivered share's uncertainty; a centre within its uncertainty of the limit may vanish", () => {
    const b = sweepBand({
      frequenciesHz: fs, realized: [0.2, 0.5, 0.47, 0.45, 0.3], reduced: [0.8, 0.85, 0.9, 0.85, 0.8], sense: "higher-is-better", threshold: 2, designFrequencyHz: 9e9,
      realizedUncertainty: [0.03, 0.03, 0.03, 0.03, 0.03], realizedConverged: [true, true, true, true, true],
    });
    expectClose(b.limit!, 0.45, { rel: 1e-12 });
    expect(b.mayVanish).toBe(true); // 0.47 − 0.03 < 0.45
    expect(b.lowRangeHz![1]).toBe(9e9);
    expect(b.highRangeHz![0]).toBe(9e9);
    expect(b.meetsLimit).toEqual(["no", "yes", "uncertain", "uncertain", "no"]);
  });

  it("refuses mismatched, unsorted or empty input and a threshold not above 1", () => {
    expect(() => sweepBand({ frequenciesHz: [1, 2], realized: [1, 1], reduced: [1, 1], sense: "lower-is-better", threshold: 2, designFrequencyHz: 1, realizedUncertainty: [0.1] })).toThrow(RangeError);
    expect(() => sweepBand({ frequenciesHz: [], realized: [], reduced: [], sense: "lower-is-better", threshold: 2, designFrequencyHz: 1 })).toThrow(RangeError);
    expect(() => sweepBand({ frequenciesHz: [2, 1], realized: [1, 1], reduced: [1, 1], sense: "lower-is-better", threshold: 2, designFrequencyHz: 1 })).toThrow(RangeError);
    expect(() => sweepBand({ frequenciesHz: [1, 2], realized: [1], reduced: [1, 1], sense: "lower-is-better", threshold: 2, designFrequencyHz: 1 })).toThrow(RangeError);
    expect(() => sweepBand({ frequenciesHz: [1, 2], realized: [1, 1], reduced: [1, 1], sense: "lower-is-better", threshold: 1, designFrequencyHz: 1 })).toThrow(RangeError);
  });
});

describe("sweepFrequencies", () => {
  it("equally spaced, both ends exact", () => {
    const f = sweepFrequencies(8e9, 10e9, 21);
    expect(f).toHaveLength(21);
    expect(f[0]).toBe(8e9);
    expect(f[20]).toBe(10e9);
    expectClose(f[10], 9e9, { rel: 1e-15 });
    for (let k = 1; k < f.length; k++) expectClose(f[k] - f[k - 1], 1e8, { rel: 1e-6 });
    expect(sweepFrequencies(9e9, 9e9, 1)).toEqual([9e9]);
  });
  it("refuses bad ranges and counts", () => {
    expect(() => sweepFrequencies(10e9, 8e9, 3)).toThrow(RangeError);
    expect(() => sweepFrequencies(0, 8e9, 3)).toThrow(RangeError);
    expect(() => sweepFrequencies(8e9, 10e9, 0)).toThrow(RangeError);
    expect(() => sweepFrequencies(8e9, 10e9, 2.5)).toThrow(RangeError);
    expect(() => sweepFrequencies(8e9, 10e9, 1)).toThrow(RangeError);
  });
});

describe("sweepFrequencyFormat", () => {
  it("gives every frequency of a sweep its own text, with no more digits than that takes", () => {
    const fine = sweepFrequencies(193e12, 194e12, 5); // 193, 193.25, 193.5, 193.75, 194 THz
    const fmt = sweepFrequencyFormat(fine);
    expect(fine.map(fmt)).toEqual(["193 THz", "193.25 THz", "193.5 THz", "193.75 THz", "194 THz"]);
    expect(sweepFrequencies(8e9, 10e9, 21).map(sweepFrequencyFormat(sweepFrequencies(8e9, 10e9, 21))).slice(0, 3)).toEqual(["8 GHz", "8.1 GHz", "8.2 GHz"]);
    const many = sweepFrequencies(9.4e9, 9.41e9, 11);
    expect(new Set(many.map(sweepFrequencyFormat(many))).size).toBe(11);
    // a lone frequency keeps six digits
    expect(sweepFrequencyFormat([193.45e12])(193.45e12)).toBe("193.45 THz");
  });
});

