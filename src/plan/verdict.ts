/**
 * The verdict of a plan: is it buildable as asked? Yes only when every cell has a recipe AND the
 * plan meets every requirement the design states:
 *
 * - `recipes`: cells without a recipe (limit 0);
 * - `tolerance`: the largest error of a cell with a recipe against its own target, quantization
 *   included (Plan.relError: complex, no floor), and the absolute error of components whose target
 *   is exactly zero, against `realization.tolerance`;
 * - `loss`: attenuation along the worst straight row or column (dB) against `lossBudgetDb`;
 * - `bandwidth`: the narrowest bandwidth of a resonant level against the required `bandwidth`
 *   (non-resonant cells count as broadband);
 * - `anisotropy`: the largest in-plane anisotropy ratio of the targets against `maxAnisotropy`;
 * - `process`: levels whose recipe the process cannot tell from a neighbouring level's
 *   (`unresolvable`, limit 0), and any feature below the process's smallest feature;
 * - `homogenization`: the fraction of cells with a recipe flagged `coarse` (limit 0; cells refused
 *   for coarseness have no recipe and count under `recipes`) — cells whose pitch is above
 *   λ/10 in their densest material and, for rods and holes along z, whose lowest band departs from
 *   the long-wavelength index by more than the tolerance — with the coarse levels and the worst
 *   figure (`worst`: the largest band deviation against the tolerance where the band was solved,
 *   else the largest pitch ratio against λ/10). Their effective-medium values, on which
 *   every other figure rests, are not to be trusted, so a coarse plan is not called buildable;
 * - `model-uncertainty`: the largest model uncertainty of a used level's recipe (Recipe.spread: the
 *   solved cell's error estimate, the Maxwell Garnett/Bruggeman spread where no solved model covers
 *   the cell, the lattice cut-off's error for wire media, the spread of the two standard ring
 *   inductances for printed split rings) against the tolerance, with the levels above it. Their
 *   cells carry the `uncertain` flag: the plan cannot promise their values within the tolerance,
 *   so it is not called buildable until a full-wave unit-cell simulation (or another recipe) settles them.
 *
 * A requirement the design does not state (no loss budget, no bandwidth, no process) is not
 * checked. Each miss carries its figure, its limit and a plain sentence.
 */
import type { DeviceFigures, MissedRequirement, PlanLevel, PlanSettings, Verdict } from "./planTypes.js";
import { F_COARSE } from "./flags.js";
import { HOMOGENIZATION_OK } from "../cells/homogenization.js";

export interface VerdictInput {
  cells: number;
  figures: DeviceFigures;
  settings: PlanSettings;
  levels: PlanLevel[];
  /** largest |achieved| of zero-target components over cells (NaN when none) */
  maxZeroTargetAbsError: number;
}

const pct = (x: number): string => `${Number((x * 100).toPrecision(3))} %`;
const num = (x: number): string => String(Number(x.toPrecision(4)));

export function planVerdict(inp: VerdictInput): Verdict {
  const { figures: f, settings: s } = inp;
  const missed: MissedRequirement[] = [];
  const without = f.flagCounts.norecipe ?? 0;
  if (without > 0) {
    missed.push({ what: "recipes", value: without, limit: 0, text: `${without} of ${inp.cells} cells have no recipe` });
  }
  const err = Math.max(Number.isFinite(f.maxRelError) ? f.maxRelError : 0, Number.isFinite(inp.maxZeroTargetAbsError) ? inp.maxZeroTargetAbsError : 0);
  if (err > s.tolerance) {
    missed.push({ what: "tolerance", value: err, limit: s.tolerance, text: `largest error ${pct(err)} (quantization and loss included) against a tolerance of ${pct(s.tolerance)}` });
  }
  if (f.lossBudgetDb !== null && f.lossDb > f.lossBudgetDb) {
    missed.push({ what: "loss", value: f.lossDb, limit: f.lossBudgetDb, text: `loss ${num(f.lossDb)} dB along the worst straight path against a budget of ${num(f.lossBudgetDb)} dB` });
  }
  if (f.bandwidthRequired !== null && f.minBandwidth !== null && f.minBandwidth < f.bandwidthRequired) {
    missed.push({ what: "bandwidth", value: f.minBandwidth, limit: f.bandwidthRequired, text: `narrowest bandwidth ${pct(f.minBandwidth)} against the ${pct(f.bandwidthRequired)} required` });
  }
  if (f.largestAnisotropy > s.maxAnisotropy) {
    missed.push({ what: "anisotropy", value: f.largestAnisotropy, limit: s.maxAnisotropy, text: `largest in-plane anisotropy ${num(f.largestAnisotropy)} against a limit of ${num(s.maxAnisotropy)}` });
  }
  const unresolvable = inp.levels.filter((l) => l.unresolvable).length;
  if (unresolvable > 0) {
    missed.push({ what: "process", value: unresolvable, limit: 0, text: `${unresolvable} levels differ from a neighbouring level by less than the process can make (unresolvable)` });
  } else if (f.processMinFeatureM !== null && f.smallestFeatureM !== null && f.smallestFeatureM < f.processMinFeatureM * (1 - 1e-9)) {
    missed.push({ what: "process", value: f.smallestFeatureM, limit: f.processMinFeatureM, text: `smallest feature ${num(f.smallestFeatureM * 1e6)} µm below the process limit of ${num(f.processMinFeatureM * 1e6)} µm` });
  }
  // coarse cells WITH a recipe: a cell refused for coarseness has no recipe and is counted under
  // `recipes` with its reason (counting it twice made "→ met" remedies of plans that still build nothing)
  const coarse = inp.levels.reduce((acc, l) => acc + (l.recipe && (l.flags & F_COARSE) !== 0 ? l.cellCount : 0), 0);
  if (coarse > 0) {
    const worst = worstCoarseness(inp.levels, s.tolerance);
    const worstText = worst === null ? ""
      : worst.figure === "band-deviation"
        ? `; worst: level ${worst.level}, ${Number.isFinite(worst.value) ? `its band index ${pct(worst.value)} off the long-wavelength value (tolerance ${pct(worst.limit)})` : "the design frequency above its lowest band's edge"}`
        : `; worst: level ${worst.level}, pitch ${num(worst.value)} of the wavelength in its densest material (λ/10 = ${worst.limit})`;
    const coarseLevels = inp.levels.filter((l) => l.recipe && l.cellCount > 0 && (l.flags & F_COARSE) !== 0).map((l) => l.index);
    missed.push({
      what: "homogenization", value: coarse / inp.cells, limit: 0,
      ...(coarseLevels.length ? { levels: coarseLevels } : {}),
      ...(worst ? { worst } : {}),
      text: `${coarse} of ${inp.cells} cells (${pct(coarse / inp.cells)}) are coarse: the pitch is above λ/10 in their densest material (for rods and holes along z, their lowest band departs from the long-wavelength index by more than the tolerance)${worstText}`,
    });
  }
  const uncertain = inp.levels.filter((l) => l.cellCount > 0 && l.recipe !== null && l.recipe.spread > s.tolerance);
  if (uncertain.length > 0) {
    const worst = uncertain.reduce((a, b) => (b.recipe!.spread > a.recipe!.spread ? b : a));
    const ids = uncertain.map((l) => l.index);
    const cells = uncertain.reduce((acc, l) => acc + l.cellCount, 0);
    missed.push({
      what: "model-uncertainty",
      value: worst.recipe!.spread,
      limit: s.tolerance,
      levels: ids,
      text: `${ids.length === 1 ? "level" : "levels"} ${listText(ids)} (${cells} cells): model uncertainty up to ${pct(worst.recipe!.spread)} (level ${worst.index}, ${worst.recipe!.family}: ${spreadSource(worst.recipe!.family, worst.recipe!.notes)}) against a tolerance of ${pct(s.tolerance)}: their values are not promised until a full-wave unit-cell simulation of these cells settles them`,
    });
  }
  return { buildable: missed.length === 0, missed };
}

/**
 * The worst figure behind the coarse levels: a band-checked level's band deviation against the
 * tolerance wins (it is the measured departure), else the largest pitch ratio against λ/10.
 */
function worstCoarseness(levels: readonly PlanLevel[], tolerance: number): NonNullable<MissedRequirement["worst"]> | null {
  let band: NonNullable<MissedRequirement["worst"]> | null = null, pitch: NonNullable<MissedRequirement["worst"]> | null = null;
  for (const l of levels) {
    const r = l.recipe;
    if (!r || l.cellCount === 0 || (l.flags & F_COARSE) === 0) continue;
    if (r.bandDeviation !== undefined) {
      if (!band || r.bandDeviation > band.value) band = { figure: "band-deviation", value: r.bandDeviation, limit: tolerance, level: l.index };
    } else if (r.pitchRatio !== undefined && (!pitch || r.pitchRatio > pitch.value)) {
      pitch = { figure: "pitch-ratio", value: r.pitchRatio, limit: HOMOGENIZATION_OK, level: l.index };
    }
  }
  return band ?? pitch;
}

/** "1, 2, 5" — at most 12 numbers, then "… (n more)". */
function listText(ids: number[]): string {
  return ids.length <= 12 ? ids.join(", ") : `${ids.slice(0, 12).join(", ")} … (${ids.length - 12} more)`;
}

/** Where a recipe's uncertainty comes from (Recipe.spread), in words. */
function spreadSource(family: string, notes: readonly string[]): string {
  if (family === "split-ring") return "the spread between the two standard ring inductances";
  if (family === "wire-medium") return "the error of the lattice cut-off";
  if (notes.some((n) => n.startsWith("not solved"))) return "Maxwell Garnett and Bruggeman disagree where no solved model covers the cell";
  if (family === "rods-in-host" || family === "holes-in-slab") return "the solved cell's error estimate";
  return "Maxwell Garnett and Bruggeman disagree";
}

/** Relative size of a miss (how far past its limit, ≥ 0): 0 when met; used to rank remedies. */
export function missSeverity(m: { what: string; value: number; limit: number }): number {
  if (m.what === "bandwidth") return m.value > 0 ? Math.log(m.limit / m.value) : 10;
  if (m.limit === 0) return Math.log1p(m.value);
  return Math.log(m.value / m.limit);
}
