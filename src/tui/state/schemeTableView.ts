/**
 * The Reduction screen's table, from the reduction cost summaries (reduce/schemeMetrics.ts):
 * one row per scheme valid for the polarization, with what each simplification costs.
 */
import type { SchemeSummary } from "../../reduce/schemeMetrics.js";
import { REDUCTION_SCHEMES } from "../../reduce/schemes/registry.js";
import type { Polarization } from "../../plan/planTypes.js";
import { formatPercent, formatValue } from "./formatValue.js";
import type { SchemeTableView } from "./sessionState.js";
import { significantAtLeast } from "../../core/formatQuantity.js";

export const SCHEME_COLUMNS = ["ε<1 cells", "μ≠1 cells", "max aniso", "edge R", "min n_b"] as const;

function cellsText(count: number, fraction: number): string {
  return count === 0 ? "0" : `${count} ${formatPercent(fraction).replace(" ", "")}`;
}

/** Table rows for the summaries of one polarization, with notes on skipped schemes. */
export function schemeTableView(
  polarization: Polarization,
  summaries: readonly SchemeSummary[],
  skipped: readonly { scheme: string; reason: string }[] = [],
): SchemeTableView {
  const rows = summaries.map((s) => ({
    scheme: s.scheme as string,
    summary: REDUCTION_SCHEMES[s.scheme]?.summary ?? "",
    cells: [
      cellsText(s.cellsEpsBelowOne, s.fractionEpsBelowOne),
      cellsText(s.cellsMagnetic, s.fractionMagnetic),
      formatValue(s.maxAnisotropy),
      Number.isFinite(s.boundaryReflection) ? formatPercent(s.boundaryReflection) : "—",
      formatValue(significantAtLeast(s.minBackgroundIndex, 3)),
    ],
  }));
  const notes = [
    "ε<1 / μ≠1 cells: cells needing them (no plain dielectric mix gives either)",
    "max aniso: largest / smallest in-plane principal value over the cells",
    "edge R: worst normal-incidence power reflection at the outer boundary",
    "min n_b: smallest background index lifting every needed ε to 1 or more",
  ];
  for (const s of skipped) notes.push(`${s.scheme} left out: ${s.reason}`);
  return { polarization, columns: [...SCHEME_COLUMNS], rows, notes };
}
