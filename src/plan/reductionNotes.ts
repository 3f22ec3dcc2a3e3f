/** Plain sentences on what the chosen reduction costs, for the report. */
import type { SchemeSummary } from "../reduce/schemeMetrics.js";
import type { PlanSettings } from "./planTypes.js";
import { significantAtLeast } from "../core/formatQuantity.js";

const SCHEME_LINES: Record<string, string> = {
  full: "keeps every component the polarization sees: exact, but generally magnetic and anisotropic",
  "unit-mu": "scales each cell so one in-plane permeability becomes 1: one magnetic component remains; the impedance changes, so the boundary may reflect",
  "non-magnetic": "scales each cell so μ_z = 1: all-dielectric, at the price of an impedance mismatch and possibly ε < 1",
  isotropic: "drops the in-plane anisotropy and keeps a scalar index: simplest cells, valid for (quasi-)conformal maps",
  matched: "a reduced set with a constant scale chosen so the outer boundary is matched",
};

export function reductionNotes(s: SchemeSummary, settings: PlanSettings, epsFloor: number): string[] {
  const pct = (x: number): string => `${Number((x * 100).toPrecision(3))} %`;
  const out = [`\`${settings.scheme}\` ${SCHEME_LINES[settings.scheme] ?? ""}.`];
  out.push(`${s.cellsEpsBelowOne} of ${s.cells} cells (${pct(s.fractionEpsBelowOne)}) need a permittivity below 1; ${s.cellsMagnetic} (${pct(s.fractionMagnetic)}) need a magnetic response.`);
  if (s.capped > 0) out.push(`${s.capped} cells were capped or offset at the singular inner boundary.`);
  if (s.cellsEpsBelowFloor > 0 && Number.isFinite(s.minBackgroundIndex)) {
    out.push(`${s.cellsEpsBelowFloor} cells need ε below ${Number(epsFloor.toPrecision(4))}, the lowest allowed material; a background of index ${significantAtLeast(s.minBackgroundIndex, 4)} or more lifts every ε above it (the background-index way out; whether the plan then builds is tried under "What would help" in the verdict).`);
  }
  if (s.maxDroppedAnisotropy > 1) out.push(`Dropped anisotropy up to ${Number(s.maxDroppedAnisotropy.toPrecision(4))} (isotropic scheme).`);
  return out;
}
