/**
 * Per-cell flags and achieved errors. Flags that follow from the cell's own target (subunity,
 * magnetic, anisotropic, unreachable, capped) are set cell by cell; flags that follow from the
 * level's recipe or its absence (norecipe, undersize, coarse, uncertain, narrowband) hold for every
 * cell of the level; inexact is set where the achieved value misses the cell's target by more than
 * the tolerance. A rect-lattice cell's in-plane error is that of its tensor turned into the target's
 * principal frame (latticeMisalignment.ts): its lattice stands along the grid.
 */
import type { ReducedField } from "../reduce/reducedField.js";
import {
  F_ANISOTROPIC, F_CAPPED, F_COARSE, F_INEXACT, F_MAGNETIC, F_NARROWBAND, F_NORECIPE, F_SUBUNITY, F_UNCERTAIN, F_UNDERSIZE, F_UNREACHABLE,
} from "./flags.js";
import type { Candidate, LevelSearch } from "./match/levelCandidates.js";
import type { EvaluatedMaterial } from "./match/matchContext.js";
import type { PlanLevel, PlanSettings, TargetComponent } from "./planTypes.js";
import { relErr } from "./quantize/relativeError.js";
import { gridMisalignmentRad, misalignedRelError, standsOnGrid } from "./latticeMisalignment.js";
import { ROUNDING_TOLERANCE } from "../reduce/reduceCell.js";

export interface FlagInput {
  reduced: ReducedField;
  targets: Float64Array[];
  comps: TargetComponent[];
  level: Int32Array;
  levels: PlanLevel[];
  searches: LevelSearch[];
  perLevel: Candidate[][];
  chosen: number[];
  settings: PlanSettings;
  materials: EvaluatedMaterial[];
  capped: number;
  undefinedFlag: number;
  /** principal axis 2's angle per cell (rad); with it, rect-lattice cells carry their lattice-axis misalignment (latticeMisalignment.ts) */
  axisAngleRad?: Float64Array;
}

/** Level-wide flag bits (also stored on each PlanLevel). */
function levelFlags(lv: PlanLevel, search: LevelSearch, settings: PlanSettings): number {
  let m = 0;
  const r = lv.recipe as Candidate | null;
  if (!r) {
    m |= F_NORECIPE;
    for (const reason of search.refusals.keys()) {
      if (reason.includes("process limit")) m |= F_UNDERSIZE;
      if (reason.includes("coarser than")) m |= F_COARSE;
    }
    return m;
  }
  if (r.homogenization === "warn") m |= F_COARSE;
  if (r.spread > settings.tolerance) m |= F_UNCERTAIN;
  if (settings.bandwidth !== null && r.bandwidth !== null && r.bandwidth < settings.bandwidth) m |= F_NARROWBAND;
  return m;
}

export function computeFlags(inp: FlagInput): { flags: Uint16Array; relError: Float64Array; zeroTargetAbsError: Float64Array | null; warnings: string[] } {
  const { reduced, targets, comps, level, levels, settings } = inp;
  const n = level.length;
  const flags = new Uint16Array(n);
  const relError = new Float64Array(n).fill(NaN);
  // made (NaN-filled) at the first cell with a zero target only: usually no cell has one
  let zeroTargetAbsError: Float64Array | null = null;
  const warnings: string[] = [];
  levels.forEach((lv, l) => { lv.flags = levelFlags(lv, inp.searches[l], settings); });
  // the widest ε range any allowed ordinary pair reaches
  let epsLo = Infinity, epsHi = -Infinity;
  for (const m of inp.materials) {
    if (m.isMetal) continue;
    epsLo = Math.min(epsLo, m.eps.re);
    epsHi = Math.max(epsHi, m.eps.re);
  }
  const tol = settings.tolerance;
  const epsIdx = comps.map((c, k) => (c.kind === "eps" ? k : -1)).filter((k) => k >= 0);
  const muIdx = comps.map((c, k) => (c.kind === "mu" ? k : -1)).filter((k) => k >= 0);
  const m = comps.length;
  // in-plane components (principal axes 1 and 2): a rect cell's lattice stands along the grid
  const k1 = comps.findIndex((x) => x.axis === "1"), k2 = comps.findIndex((x) => x.axis === "2");
  const rectLevel = levels.map((lv) => lv.recipe !== null && lv.recipe !== undefined && standsOnGrid(lv.recipe) && k1 >= 0 && k2 >= 0 && inp.axisAngleRad !== undefined);
  let worstTurn = 0, worstAdded = 0, worstTurnedError = 0, turnedCells = 0;
  for (let c = 0; c < n; c++) {
    let f = 0;
    const rf = reduced.flags[c];
    if (rf & inp.capped) f |= F_CAPPED;
    const l = level[c];
    if (l < 0 || rf & inp.undefinedFlag) { flags[c] = f | F_NORECIPE; continue; }
    for (const k of epsIdx) {
      const v = targets[k][c];
      if (v < 1 - ROUNDING_TOLERANCE) f |= F_SUBUNITY; // same rounding allowance as the reduction's own count
      if (v < epsLo * (1 - tol) || v > epsHi * (1 + tol)) f |= F_UNREACHABLE;
    }
    for (const k of muIdx) if (relErr(1, targets[k][c]) > tol) f |= F_MAGNETIC;
    if (reduced.anisotropy[c] > settings.maxAnisotropy) f |= F_ANISOTROPIC;
    const lv = levels[l];
    f |= lv.flags;
    const r = lv.recipe;
    if (r) {
      // complex achieved value, no floor (relativeError.ts: complexRelError); zero targets absolutely
      let e = 0, z = NaN;
      const delta = rectLevel[l] ? gridMisalignmentRad(inp.axisAngleRad![c]) : 0;
      const turned = delta > 1e-12 && targets[k1][c] !== 0 && targets[k2][c] !== 0;
      for (let k = 0; k < m; k++) {
        if (turned && (k === k1 || k === k2)) continue; // measured as a turned tensor below
        const t = targets[k][c];
        const dRe = r.achieved[k] - t, dIm = r.achievedIm[k];
        if (t === 0) {
          const a = Math.sqrt(r.achieved[k] * r.achieved[k] + dIm * dIm);
          if (!(a <= z)) z = a;
          continue;
        }
        const x = Math.sqrt(dRe * dRe + dIm * dIm) / Math.abs(t);
        if (x > e) e = x;
      }
      if (turned) {
        const t1 = targets[k1][c], t2 = targets[k2][c];
        const x = misalignedRelError(r.achieved[k1], r.achievedIm[k1], r.achieved[k2], r.achievedIm[k2], t1, t2, delta);
        const aligned = misalignedRelError(r.achieved[k1], r.achievedIm[k1], r.achieved[k2], r.achievedIm[k2], t1, t2, 0);
        if (x - aligned > 1e-12) { // square tilings (e₁ = e₂) lose nothing by turning
          turnedCells++;
          if (delta > worstTurn) worstTurn = delta;
        }
        if (x - aligned > worstAdded) { worstAdded = x - aligned; worstTurnedError = x; }
        if (x > e) e = x;
      }
      relError[c] = e;
      if (!Number.isNaN(z)) (zeroTargetAbsError ??= new Float64Array(n).fill(NaN))[c] = z;
      if (e > tol || z > tol) f |= F_INEXACT;
    }
    flags[c] = f;
  }
  if (epsLo === Infinity) warnings.push("no dielectric material is allowed at the design frequency");
  if (turnedCells > 0) {
    const deg = Number(((worstTurn * 180) / Math.PI).toPrecision(3));
    warnings.push(`${turnedCells} rect-lattice or in-plane laminate cells stand with their lattice axes or layers along the grid, up to ${deg}° from their target's principal axes; rel_error includes the turned tensor (adds up to ${Number((worstAdded * 100).toPrecision(3))} %, to ${Number((worstTurnedError * 100).toPrecision(3))} %)`);
  }
  return { flags, relError, zeroTargetAbsError, warnings };
}
