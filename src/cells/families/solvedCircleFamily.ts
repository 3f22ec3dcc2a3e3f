/**
 * Circles (rods or holes) whose field-across value comes from the solved cell problem
 * (homogenize/homogenizationTable.ts) instead of Maxwell Garnett: the family built by
 * mixingFamily keeps its rules as the closed form (reported beside the solved value), and the
 * perpendicular axis is replaced by the table wherever the table covers the cell (contrast
 * 10⁻³…10³, fill up to 0.70 square / 0.80 hex). Beyond those fills (circles nearly touching) the
 * closed form is scaled to meet the solved value at the table's edge (continuous, monotone) and the
 * cell is marked `unsolved`: its uncertainty is then the MG/Bruggeman spread.
 * Along the circles the Wiener mean is exact and stays.
 */
import { cAbs, cDiv, cMul, cSub, type Complex } from "../../core/complex.js";
import { getMixingRule } from "../../media/mixing/registry.js";
import type { AxisPermittivity, CellFamily, FillResult } from "../cellFamily.js";
import { circleTableValue, solvedInPlane, tableMaxFill, type TableLattice } from "../homogenize/homogenizationTable.js";
import type { Lattice } from "../lattice.js";
import { fillWithinRange, mixingFamily, type MixingFamilySpec } from "./mixingFamily.js";

const tableLattice = (l: Lattice): TableLattice | null => (l === "square" || l === "hex" ? l : null);

/** Why the table does not cover (host, inclusion, fill) on `lattice`, or null when it does. */
export function unsolvedReason(lattice: Lattice, host: Complex, inclusion: Complex, fill: number): string | null {
  const tl = tableLattice(lattice);
  if (!tl) return `no solved table for a ${lattice} lattice`;
  const u = inclusion.re / host.re;
  if (!(host.re > 0) || !(inclusion.re > 0)) return "a phase with Re ε ≤ 0 (metal) is not in the solved table";
  if (u < 1e-3 || u > 1e3) return `contrast ${Number(u.toPrecision(3))} outside the solved table (10⁻³…10³)`;
  if (fill > tableMaxFill(tl) + 1e-12) return `fill ${Number(fill.toPrecision(3))} above the solved table's ${tableMaxFill(tl)} (circles nearly touching)`;
  return null;
}

export function solvedCircleFamily(spec: MixingFamilySpec): CellFamily {
  const base = mixingFamily(spec);
  const perpRule = getMixingRule(spec.rules.perpendicular);
  const parRule = getMixingRule(spec.rules.parallel);
  return {
    ...base,
    effectivePermittivity(host, inclusion, fill, lattice): AxisPermittivity {
      const par = parRule.forward(host, inclusion, fill, spec.params);
      const closedPerp = perpRule.forward(host, inclusion, fill, spec.params);
      const closedForm = { parallel: par, perpendicular: closedPerp, rules: { ...spec.rules } };
      const why = unsolvedReason(lattice, host, inclusion, fill);
      const tl = tableLattice(lattice);
      if (why && tl && fill > tableMaxFill(tl) && unsolvedReason(lattice, host, inclusion, 0) === null) {
        // beyond the solved fills: the closed form scaled to meet the solved value at the table's
        // edge (continuous and monotone), with the MG/Bruggeman spread as its uncertainty
        const fMax = tableMaxFill(tl);
        const edge = solvedInPlane(tl, host, inclusion, fMax).eps;
        const perp = cMul(edge, cDiv(closedPerp, perpRule.forward(host, inclusion, fMax, spec.params)));
        return { parallel: par, perpendicular: perp, rules: { ...spec.rules }, closedForm, solvedError: { parallel: 0, perpendicular: NaN }, unsolved: why };
      }
      if (why) {
        return { parallel: par, perpendicular: closedPerp, rules: { ...spec.rules }, closedForm, solvedError: { parallel: 0, perpendicular: NaN }, unsolved: why };
      }
      const s = solvedInPlane(tl!, host, inclusion, fill);
      return {
        parallel: par,
        perpendicular: s.eps,
        rules: { parallel: spec.rules.parallel, perpendicular: "solved-cell" },
        closedForm,
        solvedError: { parallel: 0, perpendicular: s.error + s.lossError },
      };
    },
    fillForTarget(host, inclusion, targetRe, axis, lattice): FillResult {
      if (axis === "parallel") return fillWithinRange(spec, host, inclusion, targetRe, axis, lattice);
      const tl = tableLattice(lattice);
      const [lo, hi] = spec.fillRange(lattice);
      const fMax = tl ? Math.min(hi, tableMaxFill(tl)) : lo;
      const why = unsolvedReason(lattice, host, inclusion, 0);
      if (!tl || why) return fillWithinRange(spec, host, inclusion, targetRe, axis, lattice);
      const u = inclusion.re / host.re;
      const at = (f: number) => host.re * circleTableValue(tl, u, f).f;
      const e0 = at(0), e1 = at(fMax);
      const between = (targetRe - e0) * (targetRe - e1) <= 0;
      if (!between) {
        // beyond the solved range: the scaled closed form (see effectivePermittivity) may still reach it
        const scale = e1 / perpRule.forward(host, inclusion, fMax, spec.params).re;
        const inv = perpRule.inverse(host, inclusion, targetRe / scale, spec.params);
        if (Number.isFinite(inv.fill) && inv.fill > fMax && inv.fill <= hi + 1e-12) {
          const fill = Math.min(hi, inv.fill);
          return { ...inv, fill, achieved: this.effectivePermittivity(host, inclusion, fill, lattice).perpendicular, ruleFill: fill, inRange: true };
        }
        const closed = fillWithinRange(spec, host, inclusion, targetRe, axis, lattice);
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
      const eff = this.effectivePermittivity(host, inclusion, fill, lattice);
      const close = cAbs(cSub(eff.perpendicular, { re: targetRe, im: eff.perpendicular.im })) <= 1e-9 * Math.max(1, Math.abs(targetRe));
      return { fill, achieved: eff.perpendicular, converged: close, iterations: it, ruleFill: fill, inRange: true };
    },
  };
}
