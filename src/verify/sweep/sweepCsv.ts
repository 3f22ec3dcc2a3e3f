/**
 * verify-sweep.csv: one row per frequency and case, frequencies ascending, cases in SWEEP_CASES
 * order (flat, bare, ideal, reduced, realized: those the scene has). Columns (units in the names): frequency_hz, case, scattering_width_m, absorption_width_m,
 * then vs_bare (only when the scene has a bare object), delivered_power and deviation_deg (only
 * for a beam; above a ground plane delivered_power is the specular share), then uncertainty (relative, of the headline figure) and converged (true/false).
 * A field that does not apply is empty (a single grid has no uncertainty); never NaN or Infinity.
 */
import { csvField, fmt } from "../../plan/outputs/csvText.js";
import type { SweepPoint } from "./sweepPoint.js";

export interface SweepCsvLayout {
  hasBare: boolean;
  beam: boolean;
}

/** Column names for a layout, in order. */
export function sweepCsvColumns(layout: SweepCsvLayout): string[] {
  return [
    "frequency_hz", "case", "scattering_width_m", "absorption_width_m",
    ...(layout.hasBare ? ["vs_bare"] : []),
    ...(layout.beam ? ["delivered_power", "deviation_deg"] : []),
    "uncertainty", "converged",
  ];
}

const num = (v: number | null, digits = 8): string => (v === null ? "" : fmt(v, digits));

/** The whole CSV text (header + nFreq × nCases rows), only the computed cases. */
export function sweepCsvText(points: readonly SweepPoint[], layout: SweepCsvLayout): string {
  const lines = [sweepCsvColumns(layout).join(",")];
  for (const p of points) {
    for (const c of p.cases) {
      if (!c.available) continue;
      lines.push([
        fmt(p.frequencyHz, 12), csvField(c.name), num(c.scatteringWidthM), num(c.absorptionWidthM),
        ...(layout.hasBare ? [num(c.vsBare)] : []),
        ...(layout.beam ? [num(c.deliveredPower), num(c.deviationDeg, 6)] : []),
        num(c.uncertainty, 4), c.converged === null ? "" : String(c.converged),
      ].join(","));
    }
  }
  return `${lines.join("\n")}\n`;
}
