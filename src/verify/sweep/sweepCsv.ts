/**
 * verify-sweep.csv: one row per frequency and computed case, frequencies ascending, cases in
 * SWEEP_CASES order (flat, bare, ideal, reduced, realized, realized-geometry: those the scene has
 * and that were computed at that frequency). Columns (units in the names): frequency_hz, case,
 * method (radial or fdfd: the solver that computed the row), scattering_width_m,
 * absorption_width_m, then vs_bare (only when the scene has a bare object), delivered_power and
 * deviation_deg (only for a beam; above a ground plane delivered_power is the specular share), then
 * uncertainty (relative, of the headline figure) and converged (true/false), then
 * figure_uncertainty (absolute, of the sweep's figure of merit: vs_bare, delivered_power or
 * scattering_width_m) and meets_limit (realized and realized-geometry rows: yes, no, or uncertain
 * when the band's limit is within the figure's uncertainty; empty on other rows; sweepBand.ts);
 * when the drawn case was swept, last homogenization_difference and homogenization_uncertainty
 * (realized-geometry rows: (σ_geometry − σ_realized)/σ_bare, or over the larger width without a
 * bare object, on the drawn case's own grids, and its absolute uncertainty; empty elsewhere), and
 * for a beam then homogenization_delivered_difference and homogenization_delivered_uncertainty
 * (the drawn structure's delivered share minus the homogenized map's, on the same grids); when
 * the design names a background material, last background_eps (the relative permittivity of the
 * background every case stood in at that frequency: the material's dispersion followed,
 * backgroundAtFrequency.ts).
 * A field that does not apply is empty (a single grid has no uncertainty); never NaN or Infinity.
 */
import { csvField, fmt } from "../../plan/outputs/csvText.js";
import type { LimitVerdict } from "./sweepBand.js";
import type { SweepPoint } from "./sweepPoint.js";
import { uncertaintyOf, type SweepFigure } from "./sweepSummary.js";

export interface SweepCsvLayout {
  hasBare: boolean;
  beam: boolean;
  /** the sweep's figure of merit (for figure_uncertainty) */
  figure: SweepFigure;
  /** the band's verdict per point, in the points' order (null: no band) */
  meetsLimit: readonly (LimitVerdict | null)[] | null;
  /** the drawn case's band verdict per point (null: no band); with `drawn` the homogenization columns */
  drawnMeetsLimit?: readonly (LimitVerdict | null)[] | null;
  /** the drawn realized case was computed at some frequency: add the homogenization columns */
  drawn?: boolean;
  /** the design names a background material: add background_eps */
  background?: boolean;
}

/** Column names for a layout, in order. */
export function sweepCsvColumns(layout: SweepCsvLayout): string[] {
  return [
    "frequency_hz", "case", "method", "scattering_width_m", "absorption_width_m",
    ...(layout.hasBare ? ["vs_bare"] : []),
    ...(layout.beam ? ["delivered_power", "deviation_deg"] : []),
    "uncertainty", "converged", "figure_uncertainty", "meets_limit",
    ...(layout.drawn ? ["homogenization_difference", "homogenization_uncertainty"] : []),
    ...(layout.drawn && layout.beam ? ["homogenization_delivered_difference", "homogenization_delivered_uncertainty"] : []),
    ...(layout.background ? ["background_eps"] : []),
  ];
}

const num = (v: number | null, digits = 8): string => (v === null ? "" : fmt(v, digits));

/** The whole CSV text (header + nFreq × nCases rows), only the computed cases. */
export function sweepCsvText(points: readonly SweepPoint[], layout: SweepCsvLayout): string {
  const lines = [sweepCsvColumns(layout).join(",")];
  for (const [k, p] of points.entries()) {
    for (const c of p.cases) {
      if (!c.available) continue;
      lines.push([
        fmt(p.frequencyHz, 12), csvField(c.name), c.method ?? "", num(c.scatteringWidthM), num(c.absorptionWidthM),
        ...(layout.hasBare ? [num(c.vsBare)] : []),
        ...(layout.beam ? [num(c.deliveredPower), num(c.deviationDeg, 6)] : []),
        num(c.uncertainty, 4), c.converged === null ? "" : String(c.converged),
        num(uncertaintyOf(c, layout.figure), 4),
        c.name === "realized" ? layout.meetsLimit?.[k] ?? "" : c.name === "realized-geometry" ? layout.drawnMeetsLimit?.[k] ?? "" : "",
        ...(layout.drawn
          ? c.name === "realized-geometry" && p.homogenization ? [num(p.homogenization.difference), num(p.homogenization.differenceUncertainty, 4)] : ["", ""]
          : []),
        ...(layout.drawn && layout.beam
          ? c.name === "realized-geometry" && p.homogenization
            ? [num(p.homogenization.deliveredPowerDifference), num(p.homogenization.deliveredPowerDifferenceUncertainty, 4)]
            : ["", ""]
          : []),
        ...(layout.background ? [num(p.background.eps, 10)] : []),
      ].join(","));
    }
  }
  return `${lines.join("\n")}\n`;
}
