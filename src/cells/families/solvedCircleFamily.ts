/**
 * Circles (rods or holes) whose field-across value comes from the solved cell problem
 * (homogenize/homogenizationTable.ts) instead of Maxwell Garnett: the family built by
 * mixingFamily keeps its rules as the closed form (reported beside the solved value), and the
 * perpendicular axis is replaced by the table wherever the table covers the cell (contrast
 * 10⁻³…10³, fill up to 0.70 square / 0.80 hex). Beyond those fills (circles nearly touching) the
 * closed form is scaled to meet the solved value at the table's edge (continuous, monotone) and the
 * cell is marked `unsolved`: its uncertainty is then the MG/Bruggeman spread.
 * Along the circles the Wiener mean is exact and stays.
 *
 * Rect lattices (aspect b/a in the context): both in-plane values (x: `perpendicular`, y:
 * `perpendicularY`) come from homogenize/rectCircleTable.ts, a fill table solved on first use per
 * (contrast, aspect); aspect 1 is the square lattice's shipped table. The same continuation beyond
 * the solved fills (per component) and the same first-order loss term apply.
 */
import { cAbs, cDiv, cMul, complex, cSub, type Complex } from "../../core/complex.js";
import { ProgrammerError } from "../../core/errors.js";
import { getMixingRule } from "../../media/mixing/registry.js";
import type { Axis, AxisPermittivity, CellContext, CellFamily, FillResult } from "../cellFamily.js";
import { circleTableValue, solvedInPlane, tableMaxFill, type TableLattice } from "../homogenize/homogenizationTable.js";
import { RECT_ASPECT_RANGE, rectCircleValue, rectMaxSolvedFill } from "../homogenize/rectCircleTable.js";
import type { Lattice } from "../lattice.js";
import { fillWithinRange, mixingFamily, type MixingFamilySpec } from "./mixingFamily.js";

const tableLattice = (l: Lattice): TableLattice | null => (l === "square" || l === "hex" ? l : null);

/** Largest solved fill of a lattice (rect: per aspect). */
function solvedMaxFill(lattice: Lattice, aspect: number): number {
  if (lattice === "rect") return aspect === 1 ? tableMaxFill("square") : rectMaxSolvedFill(aspect);
  const tl = tableLattice(lattice);
  return tl ? tableMaxFill(tl) : 0;
}

/** Why the table does not cover (host, inclusion, fill) on `lattice`, or null when it does. */
export function unsolvedReason(lattice: Lattice, host: Complex, inclusion: Complex, fill: number, aspect = 1): string | null {
  if (!tableLattice(lattice) && lattice !== "rect") return `no solved table for a ${lattice} lattice`;
  const u = inclusion.re / host.re;
  if (!(host.re > 0) || !(inclusion.re > 0)) return "a phase with Re ε ≤ 0 (metal) is not in the solved table";
  if (u < 1e-3 || u > 1e3) return `contrast ${Number(u.toPrecision(3))} outside the solved table (10⁻³…10³)`;
  const fMax = solvedMaxFill(lattice, aspect);
  if (fill > fMax + 1e-12) return `fill ${Number(fill.toPrecision(3))} above the solved ${Number(fMax.toPrecision(3))} (circles nearly touching)`;
  return null;
}

/** Aspect of a rect lattice from the context (1 elsewhere); ProgrammerError outside the solver's range. */
function aspectOf(lattice: Lattice, context?: CellContext): number {
  if (lattice !== "rect") return 1;
  const a = context?.aspect ?? 1;
  if (!(a >= RECT_ASPECT_RANGE[0] && a <= RECT_ASPECT_RANGE[1])) throw new ProgrammerError(`rect lattice aspect ${a} outside ${RECT_ASPECT_RANGE.join("…")}`);
  return a;
}

/**
 * Solved in-plane values (relative to the host, complex; first order in Im u) along x and y, their
 * error estimate and the loss term's. Rect lattices use the per-aspect table, aspect 1 the square one.
 */
function solvedXY(lattice: Lattice, host: Complex, inclusion: Complex, fill: number, aspect: number): { x: Complex; y: Complex; error: number; lossError: number } {
  if (lattice !== "rect" || aspect === 1) {
    const s = solvedInPlane(lattice === "rect" ? "square" : (lattice as TableLattice), host, inclusion, fill);
    return { x: s.eps, y: s.eps, error: s.error, lossError: s.lossError };
  }
  const u = cDiv(inclusion, host);
  const v = rectCircleValue(u.re, aspect, fill);
  // second-order loss term ½u″²|F″|: estimated as u″²|F′|/u′ (one pole term of F has |F″| ≤ 2|F′|/u′)
  const lossError = Math.max((u.im * u.im * Math.abs(v.dxx)) / (u.re * Math.abs(v.xx)), (u.im * u.im * Math.abs(v.dyy)) / (u.re * Math.abs(v.yy)));
  return { x: cMul(host, complex(v.xx, u.im * v.dxx)), y: cMul(host, complex(v.yy, u.im * v.dyy)), error: v.error, lossError };
}

/** Real solved value along x or y relative to nothing (ε′ in absolute units), for the inverse. */
function solvedRe(lattice: Lattice, host: Complex, inclusion: Complex, fill: number, aspect: number, axis: "perpendicular" | "perpendicularY"): number {
  const u = inclusion.re / host.re;
  if (lattice !== "rect" || aspect === 1) return host.re * circleTableValue(lattice === "rect" ? "square" : (lattice as TableLattice), u, fill).f;
  const v = rectCircleValue(u, aspect, fill);
  return host.re * (axis === "perpendicular" ? v.xx : v.yy);
}

export function solvedCircleFamily(spec: MixingFamilySpec): CellFamily {
  const base = mixingFamily(spec);
  const perpRule = getMixingRule(spec.rules.perpendicular);
  const parRule = getMixingRule(spec.rules.parallel);
  const solvedLattice = (l: Lattice) => l === "rect" || tableLattice(l) !== null;
  return {
    ...base,
    effectivePermittivity(host, inclusion, fill, lattice, context): AxisPermittivity {
      const aspect = aspectOf(lattice, context);
      const rect = lattice === "rect";
      const par = parRule.forward(host, inclusion, fill, spec.params);
      const closedPerp = perpRule.forward(host, inclusion, fill, spec.params);
      const closedForm = { parallel: par, perpendicular: closedPerp, ...(rect ? { perpendicularY: closedPerp } : {}), rules: { ...spec.rules, ...(rect ? { perpendicularY: spec.rules.perpendicular } : {}) } };
      const closedRules = { ...spec.rules, ...(rect ? { perpendicularY: spec.rules.perpendicular } : {}) };
      const unsolvedErr = { parallel: 0, perpendicular: NaN, ...(rect ? { perpendicularY: NaN } : {}) };
      const why = unsolvedReason(lattice, host, inclusion, fill, aspect);
      const fMax = solvedMaxFill(lattice, aspect);
      if (why && solvedLattice(lattice) && fill > fMax && unsolvedReason(lattice, host, inclusion, 0, aspect) === null) {
        // beyond the solved fills: the closed form scaled to meet the solved value at the table's
        // edge (continuous and monotone), with the MG/Bruggeman spread as its uncertainty
        const edge = solvedXY(lattice, host, inclusion, fMax, aspect);
        const ratio = cDiv(closedPerp, perpRule.forward(host, inclusion, fMax, spec.params));
        return {
          parallel: par, perpendicular: cMul(edge.x, ratio), ...(rect ? { perpendicularY: cMul(edge.y, ratio) } : {}),
          rules: closedRules, closedForm, solvedError: unsolvedErr, unsolved: why,
        };
      }
      if (why) {
        return { parallel: par, perpendicular: closedPerp, ...(rect ? { perpendicularY: closedPerp } : {}), rules: closedRules, closedForm, solvedError: unsolvedErr, unsolved: why };
      }
      const s = solvedXY(lattice, host, inclusion, fill, aspect);
      const e = s.error + s.lossError;
      return {
        parallel: par,
        perpendicular: s.x,
        ...(rect ? { perpendicularY: s.y } : {}),
        rules: { parallel: spec.rules.parallel, perpendicular: "solved-cell", ...(rect ? { perpendicularY: "solved-cell" as const } : {}) },
        closedForm,
        solvedError: { parallel: 0, perpendicular: e, ...(rect ? { perpendicularY: e } : {}) },
      };
    },
    fillForTarget(host, inclusion, targetRe, axis: Axis, lattice, context): FillResult {
      const aspect = aspectOf(lattice, context);
      if (axis === "parallel") return fillWithinRange(spec, host, inclusion, targetRe, axis, lattice, aspect);
      const inPlane: "perpendicular" | "perpendicularY" = lattice === "rect" ? axis : "perpendicular";
      const [lo, hi] = spec.fillRange(lattice, aspect);
      const fMax = Math.min(hi, solvedMaxFill(lattice, aspect));
      const why = unsolvedReason(lattice, host, inclusion, 0, aspect);
      if (!solvedLattice(lattice) || why) return fillWithinRange(spec, host, inclusion, targetRe, axis, lattice, aspect);
      const at = (f: number) => solvedRe(lattice, host, inclusion, f, aspect, inPlane);
      const value = (f: number) => {
        const ap = this.effectivePermittivity(host, inclusion, f, lattice, context);
        return inPlane === "perpendicularY" ? ap.perpendicularY ?? ap.perpendicular : ap.perpendicular;
      };
      const e0 = at(0), e1 = at(fMax);
      const between = (targetRe - e0) * (targetRe - e1) <= 0;
      if (!between) {
        // beyond the solved range: the scaled closed form (see effectivePermittivity) may still reach it
        const scale = e1 / perpRule.forward(host, inclusion, fMax, spec.params).re;
        const inv = perpRule.inverse(host, inclusion, targetRe / scale, spec.params);
        if (Number.isFinite(inv.fill) && inv.fill > fMax && inv.fill <= hi + 1e-12) {
          const fill = Math.min(hi, inv.fill);
          return { ...inv, fill, achieved: value(fill), ruleFill: fill, inRange: true };
        }
        const closed = fillWithinRange(spec, host, inclusion, targetRe, axis, lattice, aspect);
        const achieved = Math.abs(targetRe - e0) < Math.abs(targetRe - e1) ? e0 : e1;
        const reason = Number.isFinite(inv.fill) && inv.fill > hi
          ? `ε' = ${targetRe} needs fill ${Number(inv.fill.toPrecision(4))}, above the geometric limit ${Number(hi.toPrecision(4))} (${spec.limitNote(lattice)})`
          : closed.reason ?? `no fill fraction of this pair reaches ε' = ${targetRe}`;
        return { fill: NaN, achieved: { re: achieved, im: 0 }, converged: false, iterations: 0, ruleFill: Number.isFinite(inv.fill) ? inv.fill : closed.ruleFill, inRange: false, reason };
      }
      let a = 0, b = fMax;
      let it = 0;
      for (; it < 80 && b - a > 1e-12; it++) {
        const m = 0.5 * (a + b);
        if ((at(m) - targetRe) * (e0 - targetRe) > 0) a = m;
        else b = m;
      }
      const fill = Math.min(hi, Math.max(lo, 0.5 * (a + b)));
      const achieved = value(fill);
      const close = cAbs(cSub(achieved, { re: targetRe, im: achieved.im })) <= 1e-9 * Math.max(1, Math.abs(targetRe));
      return { fill, achieved, converged: close, iterations: it, ruleFill: fill, inRange: true };
    },
  };
}
