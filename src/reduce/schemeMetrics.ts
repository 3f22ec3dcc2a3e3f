/**
 * What a reduction costs, per scheme: cells needing ε < 1 or μ ≠ 1, the largest anisotropy, the
 * dynamic range of every kept component, the reflection at the outer boundary, the cells where it
 * is undefined or capped, and the smallest background index that keeps ε above a floor.
 */
import type { TensorField } from "../field/tensorField.js";
import { boundaryImpedance, type BoundaryImpedance } from "./boundaryImpedance.js";
import type { Polarization } from "./polarization.js";
import { reduceWithSettings, reductionSettings, type ReduceOptions } from "./reduceField.js";
import { reductionKernel, ROUNDING_TOLERANCE } from "./reduceCell.js";
import {
  FLAG_CAPPED, FLAG_EPS_BELOW_ONE, FLAG_MAGNETIC, FLAG_OUT_OF_PLANE, FLAG_UNDEFINED, type ReducedField,
} from "./reducedField.js";
import { schemesFor } from "./schemes/registry.js";
import type { ReductionSchemeName } from "./schemes/schemeNames.js";

/** A cell named in a summary: its index, lattice position and centre (metres). */
export interface NamedCell {
  cell: number;
  i: number;
  j: number;
  k: number;
  xM: number;
  yM: number;
  zM: number;
}

/** How many cells a summary names in each list. */
export const NAMED_CELLS_LIMIT = 10;

export interface SchemeSummary {
  scheme: ReductionSchemeName;
  polarization: Polarization;
  /** cells in the device */
  cells: number;
  cellsEpsBelowOne: number;
  fractionEpsBelowOne: number;
  /** the floor used for `minBackgroundIndex` and `cellsEpsBelowFloor` */
  epsFloor: number;
  cellsEpsBelowFloor: number;
  cellsMagnetic: number;
  fractionMagnetic: number;
  muTolerance: number;
  /** largest / smallest principal value of the kept in-plane tensor, largest over the cells */
  maxAnisotropy: number;
  /** isotropic scheme: largest dropped factor σ1/σ2 (1 otherwise) */
  maxDroppedAnisotropy: number;
  /** worst normal-incidence power reflection at the outer boundary (NaN when no boundary) */
  boundaryReflection: number;
  boundaryReflectionMean: number;
  /** Z/Z_b over the outer boundary */
  boundaryImpedance: { min: number; max: number; mean: number };
  boundary: BoundaryImpedance;
  /** [min, max] of each kept component over the defined cells */
  ranges: Record<string, [number, number]>;
  /** [min, max] of the kept ε and μ principal values over the defined cells */
  epsRange: [number, number];
  muRange: [number, number];
  /** [min, max] of the scale α */
  scaleRange: [number, number];
  capped: number;
  cappedCells: NamedCell[];
  undefinedCells: number;
  undefinedList: NamedCell[];
  /** cells whose ε or μ couple the plane to z (the polarizations do not decouple exactly there) */
  outOfPlaneCells: number;
  backgroundIndex: number;
  /** smallest background index with no kept ε below epsFloor (1 when vacuum suffices; Infinity when ε ≤ 0 somewhere) */
  minBackgroundIndex: number;
  /** matched scheme: the constant scale applied */
  matchScale: number;
}

function named(field: TensorField, c: number): NamedCell {
  const g = field.grid;
  return { cell: c, i: g.i[c], j: g.j[c], k: g.k[c], xM: g.xM[c], yM: g.yM[c], zM: g.zM[c] };
}

/**
 * Smallest background index n_b such that, in a non-magnetic dielectric background of index n_b,
 * no defined cell of this reduction needs a permittivity below `epsFloor`:
 *   n_b = sqrt(epsFloor / min_cells(k·ε_min)), k = settings.epsAtUnitIndex,
 * because every scheme's ε scales as n_b² in such a background (see backgroundMedium). Returns 1
 * when vacuum already suffices, Infinity when some cell needs ε ≤ 0, NaN when no cell is defined.
 */
export function minBackgroundIndex(reduced: ReducedField, epsFloor = 1): number {
  const k = reduced.settings.epsAtUnitIndex;
  let lo = Infinity;
  let defined = 0;
  for (let c = 0; c < reduced.count; c++) {
    if (reduced.flags[c] & FLAG_UNDEFINED) continue;
    defined++;
    const e = reduced.epsMin[c] * k;
    if (e < lo) lo = e;
  }
  if (defined === 0) return NaN;
  if (!(lo > 0)) return Infinity;
  return Math.max(1, Math.sqrt(epsFloor / lo));
}

/** Cost summary of one reduced field (`field` is the one it was reduced from). */
export function schemeSummary(reduced: ReducedField, field: TensorField, options: { epsFloor?: number } = {}): SchemeSummary {
  const epsFloor = options.epsFloor ?? 1;
  const n = reduced.count;
  let below = 0, belowFloor = 0, magnetic = 0, capped = 0, undef = 0, outOfPlane = 0;
  let maxAniso = -Infinity, maxDropped = -Infinity;
  const cappedCells: NamedCell[] = [], undefinedList: NamedCell[] = [];
  const names = reduced.componentNames;
  const mins = names.map(() => Infinity), maxs = names.map(() => -Infinity);
  const arrays = names.map((nm) => reduced.components[nm]);
  let eLo = Infinity, eHi = -Infinity, mLo = Infinity, mHi = -Infinity, sLo = Infinity, sHi = -Infinity;
  for (let c = 0; c < n; c++) {
    const f = reduced.flags[c];
    if (f & FLAG_CAPPED) { capped++; if (cappedCells.length < NAMED_CELLS_LIMIT) cappedCells.push(named(field, c)); }
    if (f & FLAG_OUT_OF_PLANE) outOfPlane++;
    if (f & FLAG_UNDEFINED) { undef++; if (undefinedList.length < NAMED_CELLS_LIMIT) undefinedList.push(named(field, c)); continue; }
    if (f & FLAG_EPS_BELOW_ONE) below++;
    if (f & FLAG_MAGNETIC) magnetic++;
    if (reduced.epsMin[c] < epsFloor * (1 - ROUNDING_TOLERANCE)) belowFloor++;
    if (reduced.anisotropy[c] > maxAniso) maxAniso = reduced.anisotropy[c];
    if (reduced.droppedAnisotropy[c] > maxDropped) maxDropped = reduced.droppedAnisotropy[c];
    for (let k = 0; k < arrays.length; k++) {
      const v = arrays[k][c];
      if (v < mins[k]) mins[k] = v;
      if (v > maxs[k]) maxs[k] = v;
    }
    if (reduced.epsMin[c] < eLo) eLo = reduced.epsMin[c];
    if (reduced.epsMax[c] > eHi) eHi = reduced.epsMax[c];
    if (reduced.muMin[c] < mLo) mLo = reduced.muMin[c];
    if (reduced.muMax[c] > mHi) mHi = reduced.muMax[c];
    if (reduced.scale[c] < sLo) sLo = reduced.scale[c];
    if (reduced.scale[c] > sHi) sHi = reduced.scale[c];
  }
  const defined = n - undef;
  const pair = (lo: number, hi: number): [number, number] => (defined > 0 ? [lo, hi] : [NaN, NaN]);
  const ranges: Record<string, [number, number]> = {};
  names.forEach((nm, k) => { ranges[nm] = pair(mins[k], maxs[k]); });
  const boundary = boundaryImpedance(field, reductionKernel(reduced.settings));
  return {
    scheme: reduced.scheme,
    polarization: reduced.polarization,
    cells: n,
    cellsEpsBelowOne: below,
    fractionEpsBelowOne: n > 0 ? below / n : 0,
    epsFloor,
    cellsEpsBelowFloor: belowFloor,
    cellsMagnetic: magnetic,
    fractionMagnetic: n > 0 ? magnetic / n : 0,
    muTolerance: reduced.settings.muTolerance,
    maxAnisotropy: defined > 0 ? maxAniso : NaN,
    maxDroppedAnisotropy: defined > 0 ? maxDropped : NaN,
    boundaryReflection: boundary.reflectionMax,
    boundaryReflectionMean: boundary.reflectionMean,
    boundaryImpedance: { min: boundary.impedanceMin, max: boundary.impedanceMax, mean: boundary.impedanceMean },
    boundary,
    ranges,
    epsRange: pair(eLo, eHi),
    muRange: pair(mLo, mHi),
    scaleRange: pair(sLo, sHi),
    capped,
    cappedCells,
    undefinedCells: undef,
    undefinedList,
    outOfPlaneCells: outOfPlane,
    backgroundIndex: reduced.settings.backgroundIndex,
    minBackgroundIndex: minBackgroundIndex(reduced, epsFloor),
    matchScale: reduced.settings.matchScale,
  };
}

export interface CompareOptions extends Omit<ReduceOptions, "polarization" | "scheme"> {
  epsFloor?: number;
}

/**
 * Summaries of every scheme valid for the polarization, in table order. A scheme that cannot be
 * computed for this field (matched without an outer boundary) is left out and named in `skipped`.
 */
export function compareSchemes(field: TensorField, polarization: Polarization, options: CompareOptions = {}): SchemeSummary[] & { skipped?: { scheme: string; reason: string }[] } {
  const out: SchemeSummary[] & { skipped?: { scheme: string; reason: string }[] } = [];
  out.skipped = [];
  for (const scheme of schemesFor(polarization)) {
    let settings;
    try {
      settings = reductionSettings(field, { ...options, polarization, scheme: scheme.name });
    } catch (err) {
      if (scheme.matchBoundary) {
        out.skipped.push({ scheme: scheme.name, reason: (err as Error).message });
        continue;
      }
      throw err;
    }
    out.push(schemeSummary(reduceWithSettings(field, settings), field, { epsFloor: options.epsFloor }));
  }
  return out;
}
