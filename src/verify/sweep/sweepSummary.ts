/**
 * A finished sweep as figures: which figure of merit applies (σ/σ_bare with a hidden object,
 * delivered power for a beam — the specular share above a ground plane —, σ_s otherwise), one series per case, the band (sweepBand.ts), the
 * `--json` object and the human table. Pure.
 */
import { formatFrequency, formatLength } from "../formatQuantity.js";
import { sweepBand, type FigureSense, type SweepBand } from "./sweepBand.js";
import type { SweepCaseFigures, SweepPoint } from "./sweepPoint.js";
import type { SweepSeries } from "./sweepSvg.js";

export interface SweepFigure {
  /** the JSON key of the figure in each case */
  name: "vsBare" | "deliveredPower" | "scatteringWidthM";
  /** axis and table label */
  label: string;
  unit: "" | "m";
  sense: FigureSense;
}

/** The figure of merit of a sweep (see file comment). */
export function sweepFigure(hasBare: boolean, beam: boolean, ground = false): SweepFigure {
  if (beam && ground) return { name: "deliveredPower", label: "specular share (fraction)", unit: "", sense: "higher-is-better" };
  if (beam) return { name: "deliveredPower", label: "delivered power (fraction)", unit: "", sense: "higher-is-better" };
  if (hasBare) return { name: "vsBare", label: "σ/σ_bare", unit: "", sense: "lower-is-better" };
  return { name: "scatteringWidthM", label: "scattering width σ_s", unit: "m", sense: "lower-is-better" };
}

export interface SweepResult {
  frequenciesHz: number[];
  points: SweepPoint[];
  /** case names in order, with availability (from the first point) */
  caseNames: string[];
  figure: SweepFigure;
  band: SweepBand | null;
  notes: string[];
}

/** Put the points (any order) together: ascending frequencies, the figure, the band. */
export function summarizeSweep(points: readonly SweepPoint[], options: { designFrequencyHz: number; threshold: number; beam: boolean }): SweepResult {
  const sorted = [...points].sort((a, b) => a.frequencyHz - b.frequencyHz);
  const first = sorted[0];
  const caseNames = first.cases.map((c) => c.name);
  const hasBare = first.cases.some((c) => c.name === "bare" && c.available);
  const figure = sweepFigure(hasBare, options.beam, first.ground);
  const frequenciesHz = sorted.map((p) => p.frequencyHz);
  const series = (name: string): (number | null)[] => sorted.map((p) => figureOf(p.cases.find((c) => c.name === name), figure));
  const uncertainties = (name: string): (number | null)[] => sorted.map((p) => uncertaintyOf(p.cases.find((c) => c.name === name), figure));
  const realizedThere = first.cases.some((c) => c.name === "realized" && c.available);
  const band = realizedThere
    ? sweepBand({
      frequenciesHz, realized: series("realized"), reduced: series("reduced"), sense: figure.sense, threshold: options.threshold, designFrequencyHz: options.designFrequencyHz,
      realizedUncertainty: uncertainties("realized"), reducedUncertainty: uncertainties("reduced"),
      realizedConverged: sorted.map((p) => p.cases.find((c) => c.name === "realized")?.converged ?? null),
    })
    : null;
  const notes: string[] = [];
  for (const p of sorted) for (const n of p.notes) if (!notes.includes(n)) notes.push(n);
  return { frequenciesHz, points: sorted, caseNames, figure, band, notes };
}

function figureOf(c: SweepCaseFigures | undefined, figure: SweepFigure): number | null {
  if (!c || !c.available) return null;
  return c[figure.name];
}

/** The absolute uncertainty of a case's figure of merit (null: none, a single grid). */
export function uncertaintyOf(c: SweepCaseFigures | undefined, figure: SweepFigure): number | null {
  if (!c || !c.available) return null;
  if (figure.name === "vsBare") return c.vsBareUncertainty;
  if (figure.name === "deliveredPower") return c.deliveredPowerUncertainty;
  return c.scatteringWidthUncertaintyM;
}

/** One plotted series per computed case. */
export function sweepSeries(r: SweepResult): SweepSeries[] {
  return r.caseNames
    .filter((name) => r.points[0].cases.find((c) => c.name === name)?.available)
    .map((name) => {
      const cs = r.points.map((p) => p.cases.find((c) => c.name === name));
      return { name, values: cs.map((c) => figureOf(c, r.figure)), converged: cs.map((c) => c?.converged ?? null) };
    });
}

/** The `sweep` object of `verify --json` (see the README for the keys). */
export function sweepJson(r: SweepResult, threshold: number): Record<string, unknown> & { converged: boolean } {
  const col = <K extends keyof SweepCaseFigures>(name: string, key: K): (SweepCaseFigures[K] | null)[] =>
    r.points.map((p) => {
      const c = p.cases.find((x) => x.name === name);
      return c && c.available ? c[key] : null;
    });
  const b = r.band;
  return {
    frequenciesHz: r.frequenciesHz,
    figure: r.figure.name,
    cases: r.caseNames.map((name) => {
      const c0 = r.points[0].cases.find((c) => c.name === name)!;
      return {
        name,
        available: c0.available,
        reason: c0.reason,
        scatteringWidthM: col(name, "scatteringWidthM"),
        absorptionWidthM: col(name, "absorptionWidthM"),
        vsBare: col(name, "vsBare"),
        deliveredPower: col(name, "deliveredPower"),
        deviationDeg: col(name, "deviationDeg"),
        uncertainty: col(name, "uncertainty"),
        converged: col(name, "converged"),
        scatteringWidthUncertaintyM: col(name, "scatteringWidthUncertaintyM"),
        vsBareUncertainty: col(name, "vsBareUncertainty"),
        deliveredPowerUncertainty: col(name, "deliveredPowerUncertainty"),
      };
    }),
    resolutions: r.points.map((p) => p.resolutions),
    band: b
      ? {
        lowHz: b.lowHz, highHz: b.highHz, openLow: b.openLow, openHigh: b.openHigh, threshold: b.threshold, centreHz: b.centreHz, reference: b.reference, limit: b.limit, sense: b.sense, reason: b.reason,
        lowRangeHz: b.lowRangeHz, highRangeHz: b.highRangeHz, lowConverged: b.lowConverged, highConverged: b.highConverged, mayVanish: b.mayVanish, limitUncertainty: b.limitUncertainty, meetsLimit: b.meetsLimit,
      }
      : {
        lowHz: null, highHz: null, openLow: false, openHigh: false, threshold, centreHz: null, reference: null, limit: null, sense: r.figure.sense, reason: "the design has no realized case",
        lowRangeHz: null, highRangeHz: null, lowConverged: null, highConverged: null, mayVanish: false, limitUncertainty: null, meetsLimit: r.frequenciesHz.map(() => null),
      },
    converged: r.points.every((p) => p.cases.every((c) => !c.available || c.converged !== false)),
  };
}

/** The band in one sentence. */
export function bandSentence(r: SweepResult, threshold: number): string {
  const b = r.band;
  if (!b) return `no band: the design has no realized case (threshold ${threshold}×)`;
  const what = b.sense === "lower-is-better" ? `at most ${fmtFig(b.limit, r.figure)} (${b.threshold}× the reduced design's ${fmtFig(b.reference, r.figure)} at ${formatFrequency(b.centreHz)})` : `at least ${fmtFig(b.limit, r.figure)} (the reduced design's ${fmtFig(b.reference, r.figure)} at ${formatFrequency(b.centreHz)} / ${b.threshold})`;
  if (b.lowHz === null || b.highHz === null) return `no band: ${b.reason}; the realized ${r.figure.label} must be ${what}`;
  const range = (x: [number, number] | null, conv: boolean | null): string =>
    (x && x[1] > x[0] ? ` (${formatFrequency(x[0])} … ${formatFrequency(x[1])})` : "") + (conv === false ? " [not converged]" : "");
  const lo = `${b.openLow ? "≤ " : ""}${formatFrequency(b.lowHz)}${range(b.lowRangeHz, b.lowConverged)}`;
  const hi = `${b.openHigh ? "≥ " : ""}${formatFrequency(b.highHz)}${range(b.highRangeHz, b.highConverged)}`;
  const frac = b.lowHz > 0 ? ` (${Number(((100 * (b.highHz - b.lowHz)) / b.centreHz).toPrecision(3))} % of the centre${b.openLow || b.openHigh ? ", at least" : ""})` : "";
  const ranged = b.lowRangeHz !== null && (b.lowRangeHz[1] > b.lowRangeHz[0] || b.highRangeHz![1] > b.highRangeHz![0]);
  return [
    `band: ${lo} … ${hi}${frac}, where the realized ${r.figure.label} stays ${what}${b.openLow || b.openHigh ? "; ≤/≥: the band reaches the end of the sweep" : ""}`,
    ...(ranged ? ["(in brackets: where each edge can lie within the figures' uncertainties)"] : []),
    ...(b.lowConverged === false || b.highConverged === false ? ["[not converged]: a sweep point at that edge is not converged to the accuracy asked"] : []),
    ...(b.mayVanish ? ["within its uncertainty the realized figure at the centre may miss the limit: the band may vanish"] : []),
    ...(b.lowRangeHz === null ? ["edges without uncertainty (a single grid per frequency)"] : []),
  ].join("\n  ");
}

function fmtFig(v: number | null, figure: SweepFigure): string {
  if (v === null || !Number.isFinite(v)) return "—";
  return figure.unit === "m" ? formatLength(v) : Number(v.toPrecision(3)).toString();
}

/** The human output: one row per frequency, one column per case, and the band. */
export function sweepTable(designName: string, header: string, r: SweepResult, threshold: number): string {
  const names = sweepSeries(r).map((s) => s.name);
  const head = ["frequency", ...names];
  const rows = r.points.map((p) => [
    formatFrequency(p.frequencyHz),
    ...names.map((n) => {
      const c = p.cases.find((x) => x.name === n);
      const v = figureOf(c, r.figure);
      if (v === null) return "—";
      const text = r.figure.unit === "m" ? formatLength(v) : Number(v.toPrecision(3)).toString();
      return c?.converged === false ? `${text}*` : text;
    }),
  ]);
  const widths = head.map((h, k) => Math.max(h.length, ...rows.map((row) => row[k].length)));
  const line = (cells: string[]): string => `  ${cells.map((c, k) => (k === 0 ? c.padEnd(widths[k]) : c.padStart(widths[k]))).join("  ")}`.trimEnd();
  const anyUnconverged = rows.some((row) => row.some((c) => c.endsWith("*")));
  return [
    designName,
    `  ${header}`,
    `  ${r.figure.label} per case and frequency${anyUnconverged ? " (* not converged to the accuracy asked)" : ""}`,
    line(head),
    ...rows.map(line),
    `  ${bandSentence(r, threshold)}`,
    ...r.notes.map((n) => `  note: ${n}`),
  ].join("\n") + "\n";
}
