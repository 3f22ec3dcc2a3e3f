/**
 * A finished sweep as figures: which figure of merit applies (σ/σ_bare with a hidden object,
 * delivered power for a beam — the specular share above a ground plane —, σ_s otherwise), one series per case, the band (sweepBand.ts), the
 * `--json` object and the human table. The drawn realized case (`realized-geometry`), where it was
 * swept, gets its own band against the same limit (`drawnBand`) and the plan's homogenization error
 * per frequency. A case is listed when it was computed at any frequency; where it was not, its
 * figures are null and `reason` says why. The background each frequency's scenes stood in is listed
 * (`background`: the design's, or its background material's ε at f, backgroundAtFrequency.ts). Pure.
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
  /** the drawn realized case's band against the same limit (null: not swept) */
  drawnBand: SweepBand | null;
  /** the design's background material, followed at each frequency (null: a fixed background) */
  backgroundMaterial: string | null;
  notes: string[];
}

const availableAt = (points: readonly SweepPoint[], name: string): boolean => points.some((p) => p.cases.some((c) => c.name === name && c.available));

/** Put the points (any order) together: ascending frequencies, the figure, the band. */
export function summarizeSweep(points: readonly SweepPoint[], options: { designFrequencyHz: number; threshold: number; beam: boolean; backgroundMaterial?: string | null }): SweepResult {
  const sorted = [...points].sort((a, b) => a.frequencyHz - b.frequencyHz);
  const first = sorted[0];
  const caseNames = first.cases.map((c) => c.name);
  const hasBare = first.cases.some((c) => c.name === "bare" && c.available);
  const figure = sweepFigure(hasBare, options.beam, first.ground);
  const frequenciesHz = sorted.map((p) => p.frequencyHz);
  const series = (name: string): (number | null)[] => sorted.map((p) => figureOf(p.cases.find((c) => c.name === name), figure));
  const uncertainties = (name: string): (number | null)[] => sorted.map((p) => uncertaintyOf(p.cases.find((c) => c.name === name), figure));
  const bandOf = (name: string): SweepBand | null => (availableAt(sorted, name)
    ? sweepBand({
      frequenciesHz, realized: series(name), reduced: series("reduced"), sense: figure.sense, threshold: options.threshold, designFrequencyHz: options.designFrequencyHz,
      realizedUncertainty: uncertainties(name), reducedUncertainty: uncertainties("reduced"),
      realizedConverged: sorted.map((p) => p.cases.find((c) => c.name === name)?.converged ?? null),
    })
    : null);
  const notes: string[] = [];
  for (const p of sorted) for (const n of p.notes) if (!notes.includes(n)) notes.push(n);
  return { frequenciesHz, points: sorted, caseNames, figure, band: bandOf("realized"), drawnBand: bandOf("realized-geometry"), backgroundMaterial: options.backgroundMaterial ?? null, notes };
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
    .filter((name) => availableAt(r.points, name))
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
    /** the solvers used at each frequency */
    method: r.points.map((p) => p.method),
    cases: r.caseNames.map((name) => {
      return {
        name,
        available: availableAt(r.points, name),
        reason: caseReason(r, name),
        method: col(name, "method"),
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
    band: bandJson(b, r, threshold, "the design has no realized case"),
    drawnBand: r.drawnBand ? bandJson(r.drawnBand, r, threshold, "") : null,
    homogenization: r.points.some((p) => p.homogenization !== null)
      ? {
        differenceScale: r.points.find((p) => p.homogenization !== null)!.homogenization!.differenceScale,
        difference: r.points.map((p) => p.homogenization?.difference ?? null),
        differenceUncertainty: r.points.map((p) => p.homogenization?.differenceUncertainty ?? null),
        relative: r.points.map((p) => p.homogenization?.relative ?? null),
        deliveredPowerDifference: r.points.map((p) => p.homogenization?.deliveredPowerDifference ?? null),
        deliveredPowerDifferenceUncertainty: r.points.map((p) => p.homogenization?.deliveredPowerDifferenceUncertainty ?? null),
        converged: r.points.map((p) => p.homogenization?.converged ?? null),
        stepsAcrossFeature: r.points.map((p) => p.homogenization?.stepsAcrossFeature ?? null),
      }
      : null,
    background: {
      material: r.backgroundMaterial,
      eps: r.points.map((p) => p.background.eps),
      mu: r.points.map((p) => p.background.mu),
      lossTangent: r.backgroundMaterial === null ? null : r.points.map((p) => p.backgroundLossTangent),
    },
    converged: sweepConverged(r),
  };
}

/** Every computed figure within the accuracy asked, the homogenization error's too (exit code 2 otherwise). */
export function sweepConverged(r: SweepResult): boolean {
  return r.points.every((p) => p.cases.every((c) => !c.available || c.converged !== false) && p.homogenization?.converged !== false);
}

/** Why a case is not computed: everywhere (its reason), at some frequencies (which, and why), or null when computed at all. */
export function caseReason(r: SweepResult, name: string): string | null {
  const missing = r.points.map((p) => ({ f: p.frequencyHz, c: p.cases.find((c) => c.name === name) })).filter((x) => !x.c || !x.c.available);
  if (missing.length === 0) return null;
  const reasons = [...new Set(missing.map((x) => x.c?.reason ?? "not computed"))];
  if (missing.length === r.points.length && reasons.length === 1) return reasons[0];
  return reasons.map((why) => `at ${missing.filter((x) => (x.c?.reason ?? "not computed") === why).map((x) => formatFrequency(x.f)).join(", ")}: ${why}`).join("; ");
}

function bandJson(b: SweepBand | null, r: SweepResult, threshold: number, noneReason: string): Record<string, unknown> {
  return b
    ? {
      lowHz: b.lowHz, highHz: b.highHz, openLow: b.openLow, openHigh: b.openHigh, threshold: b.threshold, centreHz: b.centreHz, reference: b.reference, limit: b.limit, sense: b.sense, reason: b.reason,
      lowRangeHz: b.lowRangeHz, highRangeHz: b.highRangeHz, lowConverged: b.lowConverged, highConverged: b.highConverged, mayVanish: b.mayVanish, limitUncertainty: b.limitUncertainty, meetsLimit: b.meetsLimit,
    }
    : {
      lowHz: null, highHz: null, openLow: false, openHigh: false, threshold, centreHz: null, reference: null, limit: null, sense: r.figure.sense, reason: noneReason,
      lowRangeHz: null, highRangeHz: null, lowConverged: null, highConverged: null, mayVanish: false, limitUncertainty: null, meetsLimit: r.frequenciesHz.map(() => null),
    };
}

/** The band in one sentence (of the realized case, or with `drawn` of the drawn realized case). */
export function bandSentence(r: SweepResult, threshold: number, drawn = false): string {
  const b = drawn ? r.drawnBand : r.band;
  const who = drawn ? "drawn realized (realized-geometry)" : "realized";
  if (!b) return drawn ? `no band of the drawn realized case: ${caseReason(r, "realized-geometry") ?? "not swept"}` : `no band: the design has no realized case (threshold ${threshold}×)`;
  const what = b.sense === "lower-is-better" ? `at most ${fmtFig(b.limit, r.figure)} (${b.threshold}× the reduced design's ${fmtFig(b.reference, r.figure)} at ${formatFrequency(b.centreHz)})` : `at least ${fmtFig(b.limit, r.figure)} (the reduced design's ${fmtFig(b.reference, r.figure)} at ${formatFrequency(b.centreHz)} / ${b.threshold})`;
  if (b.lowHz === null || b.highHz === null) return `${drawn ? "drawn realized (realized-geometry): " : ""}no band: ${b.reason}; the ${who} ${r.figure.label} must be ${what}`;
  const range = (x: [number, number] | null, conv: boolean | null): string =>
    (x && x[1] > x[0] ? ` (${formatFrequency(x[0])} … ${formatFrequency(x[1])})` : "") + (conv === false ? " [not converged]" : "");
  const lo = `${b.openLow ? "≤ " : ""}${formatFrequency(b.lowHz)}${range(b.lowRangeHz, b.lowConverged)}`;
  const hi = `${b.openHigh ? "≥ " : ""}${formatFrequency(b.highHz)}${range(b.highRangeHz, b.highConverged)}`;
  const frac = b.lowHz > 0 ? ` (${Number(((100 * (b.highHz - b.lowHz)) / b.centreHz).toPrecision(3))} % of the centre${b.openLow || b.openHigh ? ", at least" : ""})` : "";
  const ranged = b.lowRangeHz !== null && (b.lowRangeHz[1] > b.lowRangeHz[0] || b.highRangeHz![1] > b.highRangeHz![0]);
  return [
    `${drawn ? "band of the drawn realized case" : "band"}: ${lo} … ${hi}${frac}, where the ${who} ${r.figure.label} stays ${what}${b.openLow || b.openHigh ? "; ≤/≥: the band reaches the end of the sweep" : ""}`,
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
  const hom = r.points.some((p) => p.homogenization !== null);
  if (hom) {
    head.push("homogenization Δ");
    r.points.forEach((p, k) => {
      const e = p.homogenization;
      rows[k].push(e === null ? "—" : `${e.difference >= 0 ? "+" : "−"}${Math.abs(e.difference).toPrecision(2)}${e.differenceUncertainty === null ? "" : ` ± ${Number(e.differenceUncertainty.toPrecision(2))}`}${e.converged === false ? "*" : ""}`);
    });
  }
  const methods = [...new Set(r.points.map((p) => p.method))];
  const widths = head.map((h, k) => Math.max(h.length, ...rows.map((row) => row[k].length)));
  const line = (cells: string[]): string => `  ${cells.map((c, k) => (k === 0 ? c.padEnd(widths[k]) : c.padStart(widths[k]))).join("  ")}`.trimEnd();
  const anyUnconverged = rows.some((row) => row.some((c) => c.endsWith("*")));
  const scale = r.points.find((p) => p.homogenization !== null)?.homogenization?.differenceScale;
  const solvers = r.caseNames.filter((n) => availableAt(r.points, n)).map((n) => {
    const ms = [...new Set(r.points.map((p) => p.cases.find((c) => c.name === n)).filter((c) => c?.available).map((c) => c!.method))];
    return `${n} ${ms.join("/")}`;
  });
  return [
    designName,
    `  ${header}`,
    `  solvers: ${solvers.join(", ")}${methods.length > 1 ? ` (run: ${methods.join(", ")} at different frequencies)` : ""}`,
    `  ${r.figure.label} per case and frequency${anyUnconverged ? " (* not converged to the accuracy asked)" : ""}`,
    line(head),
    ...rows.map(line),
    ...(hom ? [`  homogenization Δ: (σ_geometry − σ_realized)/${scale === "bare" ? "σ_bare" : "the larger width"} at each frequency, the drawn structure against its effective-medium map on the same grids`] : []),
    `  ${bandSentence(r, threshold)}`,
    ...(r.caseNames.includes("realized-geometry") && availableAt(r.points, "realized") ? [`  ${bandSentence(r, threshold, true)}`] : []),
    ...(r.backgroundMaterial !== null ? [`  background ('${r.backgroundMaterial}', followed): Re ε ${r.points.map((p) => `${Number(p.background.eps.toPrecision(6))} at ${formatFrequency(p.frequencyHz)}`).join(", ")}`] : []),
    ...r.notes.map((n) => `  note: ${n}`),
  ].join("\n") + "\n";
}
