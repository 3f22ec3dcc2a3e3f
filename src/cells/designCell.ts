/**
 * Design one unit cell: for a family, lattice, pitch, frequency and two evaluated materials, find
 * the fill fraction (and so the dimensions) whose effective response meets the target, then check
 * what the cell can promise: the error on each targeted axis, the smallest feature against the
 * process, the pitch against the wavelength (homogenization), and the Maxwell Garnett/Bruggeman
 * spread. Resonant families (wire medium, split ring) also report their band and passivity limit.
 * Pure: materials come in already evaluated at the design frequency.
 *
 * Matching: one target → the family's inverse for that axis (closed form or bounded iteration);
 * two targets on a uniaxial family (one geometric degree of freedom) → the fill that minimizes the
 * larger of the two errors (golden-section search over the fill range; the error is quasi-convex
 * in the fill because each axis is monotone in it). Out of reach → the closest reachable fill,
 * valid = false and a reason. Valid means: every targeted value within `tolerance`, the process
 * (when given) can make it, and the cell is not too coarse ("refuse"); a "warn" homogenization and
 * a spread above the tolerance are notes, not failures.
 */
import { cAbs, cSub } from "../core/complex.js";
import { ProgrammerError } from "../core/errors.js";
import { axisClosedForm, axisRule, axisValue, type Axis, type CellFamily, type FillResult } from "./cellFamily.js";
import { homogenizationFor, homogenizationNote, matchError, processCheckFor } from "./cellChecks.js";
import type { CellDesign, CellDesignRequest, CellTarget } from "./cellDesignTypes.js";
import { designResonantCell } from "./designResonantCell.js";
import { cellSpread } from "./mixingSpread.js";
import { getCellFamily } from "./registry.js";

export const DEFAULT_TOLERANCE = 0.05;
const AXES: Axis[] = ["parallel", "perpendicular", "perpendicularY"];

/** Design a cell (see the module comment). Throws ProgrammerError for a malformed request. */
export function designCell(request: CellDesignRequest): CellDesign {
  const family = getCellFamily(request.familyId);
  checkRequest(request, family);
  if (family.resonant) return designResonantCell(request, family);
  return designMixedCell(request, family);
}

function checkRequest(req: CellDesignRequest, family: CellFamily): void {
  const bad = (what: string) => {
    throw new ProgrammerError(`designCell: ${what}`, req);
  };
  if (!(req.pitchM > 0) || !Number.isFinite(req.pitchM)) bad("pitchM must be a finite number > 0");
  if (!(req.frequencyHz > 0) || !Number.isFinite(req.frequencyHz)) bad("frequencyHz must be a finite number > 0");
  if (!family.lattices.includes(req.lattice)) bad(`${family.id} takes lattices ${family.lattices.join(", ")}, not ${req.lattice}`);
  if (req.fill !== undefined) {
    const [lo, hi] = family.fillRange(req.lattice);
    if (!(req.fill >= lo && req.fill <= hi)) bad(`fill ${req.fill} outside ${family.id}'s range [${lo}, ${hi}]`);
  }
  const t = req.target ?? {};
  if (req.fill === undefined && t.parallel === undefined && t.perpendicular === undefined && t.perpendicularY === undefined && t.mu === undefined && req.splitRing === undefined) {
    bad("give a target or a fill");
  }
  if (t.perpendicularY !== undefined && req.lattice !== "rect") bad("a perpendicularY target needs a rect lattice");
}

function goldenMin(fn: (x: number) => number, lo: number, hi: number): number {
  const g = (Math.sqrt(5) - 1) / 2;
  let a = lo;
  let b = hi;
  let c = b - g * (b - a);
  let d = a + g * (b - a);
  let fc = fn(c);
  let fd = fn(d);
  for (let k = 0; k < 200 && b - a > 1e-14; k++) {
    if (fc <= fd) {
      b = d; d = c; fd = fc; c = b - g * (b - a); fc = fn(c);
    } else {
      a = c; c = d; fc = fd; d = a + g * (b - a); fd = fn(d);
    }
  }
  const x = 0.5 * (a + b);
  // the ends may be better when the optimum sits on the range boundary
  return [lo, x, hi].reduce((best, v) => (fn(v) < fn(best) ? v : best), x);
}

/** Non-resonant families: fill from the target(s), then the checks. */
function designMixedCell(req: CellDesignRequest, family: CellFamily): CellDesign {
  const { host, inclusion, lattice, pitchM } = req;
  const aspect = lattice === "rect" ? req.aspect ?? 1 : undefined;
  const context = aspect !== undefined ? { aspect } : undefined;
  const tolerance = req.tolerance ?? DEFAULT_TOLERANCE;
  const target: CellTarget = { ...(req.target ?? {}) };
  const reasons: string[] = [];
  const notes: string[] = [];
  const [lo, hi] = family.fillRange(lattice, aspect);
  const eff = (f: number) => family.effectivePermittivity(host.eps, inclusion.eps, f, lattice, context);
  const axes = AXES.filter((a) => target[a] !== undefined);

  let fill: number;
  if (req.fill !== undefined) fill = req.fill;
  else if (axes.length === 1) {
    const axis = axes[0];
    const r: FillResult = family.fillForTarget(host.eps, inclusion.eps, target[axis]!, axis, lattice, context);
    if (r.inRange) fill = r.fill;
    else {
      reasons.push(r.reason ?? `ε' = ${target[axis]} out of reach`);
      fill = closestFill(r.ruleFill, lo, hi, (f) => matchError(axisValue(eff(f), axis), target[axis]!));
    }
  } else {
    const worst = (f: number) => Math.max(...axes.map((a) => matchError(axisValue(eff(f), a), target[a]!)));
    fill = goldenMin(worst, lo, hi);
  }

  const e = eff(fill);
  const relError: CellDesign["relError"] = { max: 0 };
  for (const a of axes) {
    relError[a] = matchError(axisValue(e, a), target[a]!);
    relError.max = Math.max(relError.max, relError[a]!);
  }
  if (relError.max > tolerance) {
    const worstAxis = axes.reduce((w, a) => (relError[a]! > relError[w]! ? a : w), axes[0]);
    if (!reasons.length) reasons.push(`${worstAxis} ε' ${fmt(axisValue(e, worstAxis).re)} misses the target ${target[worstAxis]} by ${pct(relError[worstAxis]!)} (tolerance ${pct(tolerance)})`);
  }

  const feature = family.smallestFeatureM(fill, pitchM, lattice, aspect);
  const processCheck = processCheckFor(req.process, family.fabricatedPhase, host.class, inclusion.class, { ...feature, ...(req.heightM !== undefined ? { heightM: req.heightM } : {}) });
  if (processCheck && !processCheck.ok) reasons.push(...processCheck.reasons);
  // a rect cell is judged by its longer spacing
  const homogenization = homogenizationFor(pitchM * Math.max(1, aspect ?? 1), req.frequencyHz, [host, inclusion], [e.parallel, e.perpendicular, ...(e.perpendicularY ? [e.perpendicularY] : [])]);
  if (homogenization.status === "refuse") reasons.push(homogenizationNote(homogenization));
  else if (homogenization.status === "warn") notes.push(homogenizationNote(homogenization));
  const s = cellSpread(e, host.eps, inclusion.eps, fill);
  const uncertain = s.max > tolerance;
  const solvedAxes = AXES.filter((a) => (a !== "perpendicularY" || e.perpendicularY !== undefined) && axisRule(e, a) === "solved-cell");
  if (e.unsolved) notes.push(`not covered by the solved cell problem (${e.unsolved}): closed form used`);
  if (uncertain) {
    notes.push(solvedAxes.length && !e.unsolved
      ? `the solved cell's error estimate ${pct(s.max)} exceeds the tolerance at fill ${fmt(fill)}: verify with a full-wave unit-cell simulation`
      : `Maxwell Garnett and Bruggeman differ by ${pct(s.max)} at fill ${fmt(fill)}: verify with a full-wave unit-cell simulation`);
  }
  for (const a of solvedAxes) {
    const cf = axisClosedForm(e, a);
    if (!cf) continue;
    const v = axisValue(e, a);
    const d = cAbs(cSub(cf.value, v)) / cAbs(v);
    if (d > tolerance) notes.push(`${a}: the closed form (${cf.rule}) gives ${fmt(cf.value.re)}, ${pct(d)} off the solved ${fmt(v.re)}; the solved value is used`);
  }

  return {
    familyId: family.id,
    lattice,
    aspect: aspect ?? null,
    pitchM,
    frequencyHz: req.frequencyHz,
    hostId: host.id,
    inclusionId: inclusion.id,
    fill,
    dimensions: family.dimensionsFromFill(fill, pitchM, lattice, aspect),
    achieved: { parallel: e.parallel, perpendicular: e.perpendicular, ...(e.perpendicularY ? { perpendicularY: e.perpendicularY } : {}), mu: { re: 1, im: 0 } },
    rules: e.rules,
    target,
    relError,
    tolerance,
    feature,
    processCheck,
    homogenization,
    spread: { ...s, uncertain },
    closedForm: e.closedForm ? { parallel: e.closedForm.parallel, perpendicular: e.closedForm.perpendicular, ...(e.closedForm.perpendicularY ? { perpendicularY: e.closedForm.perpendicularY } : {}), rules: e.closedForm.rules } : null,
    valid: reasons.length === 0,
    reasons,
    notes,
  };
}

/** Closest reachable fill: the rule's fill clamped to the range, or the better end when there is none. */
function closestFill(ruleFill: number, lo: number, hi: number, err: (f: number) => number): number {
  if (Number.isFinite(ruleFill)) return Math.min(hi, Math.max(lo, ruleFill));
  return err(lo) <= err(hi) ? lo : hi;
}

const fmt = (x: number): string => Number(x.toPrecision(4)).toString();
const pct = (x: number): string => `${Number((100 * x).toPrecision(3))} %`;

