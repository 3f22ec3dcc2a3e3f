/**
 * All recipes for one level: materials × families × lattices × orientations allowed by the design
 * and the process. A recipe is kept only if its fill fraction lies inside the family's geometric
 * range, the process can make its smallest feature and gap in its material, its cell is fine enough
 * to homogenize (coarser than λ/4 in the densest material is refused), and every target component
 * lies inside the reach of the material pair (the pair's own bounds for ordinary mixes). Resonant
 * families are tried only where needed: wire media where a permittivity below 1 is asked for, split
 * rings where a permeability other than 1 is.
 */
import { EPS0_F_PER_M } from "../../core/physicalConstants.js";
import { cAbs, complex, cSub, refractiveIndex, type Complex } from "../../core/complex.js";
import { axisClosedForm, axisRule, axisSolvedError, axisValue, type CellFamily } from "../../cells/cellFamily.js";
import type { Lattice } from "../../cells/lattice.js";
import { processCheckFor } from "../../cells/cellChecks.js";
import { homogenizationCheck } from "../../cells/homogenization.js";
import { designSplitRing, ringModelSpread, splitRingBandwidth } from "../../cells/splitRing.js";
import { printedOuterRadiusM } from "../../cells/printedRing.js";
import { bandwidthWithinTolerance, wireCutoffError } from "../../cells/wireMedium.js";
import { largestErrors, relErr } from "../quantize/relativeError.js";
import { solidCandidates } from "./solidCandidates.js";
import type { Recipe } from "../planTypes.js";
import { axisFor, orientationsFor, type Direction } from "./componentMapping.js";
import { rectTableReady } from "../../cells/homogenize/rectCircleTable.js";
import { rectTiling } from "../../cells/lattice.js";
import { misalignedRelError } from "../latticeMisalignment.js";
import type { EvaluatedMaterial, MatchContext } from "./matchContext.js";
import { mixingSpread } from "./mixingSpread.js";

export interface Candidate extends Recipe {
  /** "ok" or "warn" (λ/10 … λ/4) */
  homogenization: "ok" | "warn";
}

export interface LevelSearch {
  candidates: Candidate[];
  /** counts of the reasons recipes were refused, for the report when none is left */
  refusals: Map<string, number>;
}

/** Families whose printed or standing phase holds itself up, so air may be the host. */
const GAS_HOST_FAMILIES = new Set(["strut-lattice", "rods-in-host"]);

function dimensionsToColumns(dims: Record<string, number>): Record<string, number> {
  const out: Record<string, number> = {};
  for (const [k, v] of Object.entries(dims)) {
    const key = (k.endsWith("M") ? `${k.slice(0, -1)}_m` : k).replace(/([a-z0-9])([A-Z])/g, "$1_$2").toLowerCase();
    out[key] = v;
  }
  return out;
}

/**
 * A rect recipe names its spacings along the principal axes (the lattice's x along 1, y along 2):
 * `spacing1M`, `spacing2M` (build-list columns spacing1_m, spacing2_m); other recipes unchanged.
 */
function recipeDimensions(dims: Record<string, number>, pitchM: number): Record<string, number> {
  if (dims.spacingYM === undefined) return dims;
  const { spacingYM, ...rest } = dims;
  return { ...rest, spacing1M: pitchM, spacing2M: spacingYM };
}

function refuse(s: LevelSearch, reason: string): void {
  s.refusals.set(reason, (s.refusals.get(reason) ?? 0) + 1);
}

/** Search every allowed recipe for the level target (values in ctx.components order). */
export function levelCandidates(target: number[], ctx: MatchContext): LevelSearch {
  const search: LevelSearch = { candidates: [], refusals: new Map() };
  const comps = ctx.components;
  const epsIdx = comps.map((c, k) => (c.kind === "eps" ? k : -1)).filter((k) => k >= 0);
  const muIdx = comps.map((c, k) => (c.kind === "mu" ? k : -1)).filter((k) => k >= 0);
  const magneticIdx = muIdx.filter((k) => relErr(1, target[k]) > ctx.tolerance);
  const needsSubunity = epsIdx.some((k) => target[k] < 1);
  const inPlane = comps.filter((c) => c.axis !== "z").map((c) => comps.indexOf(c));
  const inPlaneIsotropic = inPlane.length < 2 || relErr(target[inPlane[0]], target[inPlane[1]]) < 1e-9;
  const solids = ctx.materials.filter((m) => !m.isMetal && m.material.class !== "gas" && !m.isFluid);
  // isFluid: liquids (a liquid is never the host)
  const dielectrics = ctx.materials.filter((m) => !m.isMetal);
  const metals = ctx.materials.filter((m) => m.isMetal);
  search.candidates.push(...solidCandidates(target, ctx));

  for (const family of ctx.families) {
    // rect lattices only when the design asks for them (realization.lattice)
    const lattices = family.lattices.filter((l) => (ctx.lattice === null && l !== "rect") || l === ctx.lattice);
    if (lattices.length === 0) { refuse(search, `${family.id} has no ${ctx.lattice} lattice`); continue; }
    if (family.id === "split-ring") {
      if (magneticIdx.length === 0) continue; // resonant: only where needed
      if (magneticIdx.length > 1) { refuse(search, "split rings give μ ≠ 1 along one axis only; two magnetic components are asked for"); continue; }
      // Printed rings go on boards: unless the design names its materials, only laminates host them.
      const boards = ctx.materialsChosen ? solids : solids.filter((m) => m.material.class === "laminate");
      if (boards.length === 0) { refuse(search, "split rings need a board (a laminate) to be printed on"); continue; }
      let first = true; // explain a miss in numbers once per level (it costs a search of its own)
      for (const lattice of lattices) for (const host of boards) for (const metal of metals) {
        splitRing(search, target, ctx, family, lattice, host, metal, magneticIdx[0], epsIdx, first);
        first = false;
      }
      continue;
    }
    if (magneticIdx.length > 0) { refuse(search, `${family.id} cannot give μ ≠ 1`); continue; }
    if (family.resonant) {
      if (!needsSubunity) continue; // wire media only where ε < 1 is needed
      for (const lattice of lattices) for (const o of orientationsFor(family, inPlaneIsotropic)) for (const host of solids) for (const metal of metals) mixed(search, target, ctx, family, lattice, o, host, metal, epsIdx);
      continue;
    }
    for (const lattice of lattices) {
      if (lattice === "rect") { rectRecipes(search, target, ctx, family, dielectrics, epsIdx); continue; }
      for (const o of orientationsFor(family, inPlaneIsotropic)) {
        for (const host of dielectrics) {
          // the host is the continuous phase: a solid, or air around a self-supporting print
          if (host.isFluid || (host.material.class === "gas" && !GAS_HOST_FAMILIES.has(family.id))) continue;
          for (const inc of dielectrics) {
            if (inc === host) continue;
            // the process shapes the fabricated phase: it cannot be air (air rods in a host are holes)
            if (family.fabricatedPhase === "inclusion" && inc.material.class === "gas") continue;
            // the pair's own bounds: every ordinary mix lies between its two phases
            const lo = Math.min(host.eps.re, inc.eps.re), hi = Math.max(host.eps.re, inc.eps.re);
            if (epsIdx.some((k) => target[k] < lo * (1 - ctx.tolerance) || target[k] > hi * (1 + ctx.tolerance))) { refuse(search, "target outside the bounds of the material pair"); continue; }
            mixed(search, target, ctx, family, lattice, o, host, inc, epsIdx);
          }
        }
      }
    }
  }
  return dropFarOff(search, ctx.tolerance);
}

/** Fill tables a plan may solve for rect lattices (1–2 s each, 7–20 s for contrasts beyond 10^±1.5; see MatchContext). */
export const RECT_TABLES_PER_PLAN = 6;

/**
 * Rods or holes along z on rect lattices (realization.lattice "rect"). For each material pair the
 * aspect-1 lattice (the square table: free) is tried first; the other aspects only when it misses
 * the level's target by more than a quarter of the tolerance (an anisotropic target the square
 * lattice meets only roughly, if at all) and the pair reaches the target at aspect 1 at all. A pair's aspects R and 1/R share one
 * solved table; a plan solves at most RECT_TABLES_PER_PLAN new ones (a counted refusal beyond).
 */
function rectRecipes(s: LevelSearch, target: number[], ctx: MatchContext, family: CellFamily, dielectrics: EvaluatedMaterial[], epsIdx: number[]): void {
  const aspects = ctx.aspects ?? [];
  for (const host of dielectrics) {
    if (host.isFluid || host.material.class === "gas" && !GAS_HOST_FAMILIES.has(family.id)) continue;
    for (const inc of dielectrics) {
      if (inc === host) continue;
      if (family.fabricatedPhase === "inclusion" && inc.material.class === "gas") continue;
      const lo = Math.min(host.eps.re, inc.eps.re), hi = Math.max(host.eps.re, inc.eps.re);
      if (epsIdx.some((k) => target[k] < lo * (1 - ctx.tolerance) || target[k] > hi * (1 + ctx.tolerance))) { refuse(s, "target outside the bounds of the material pair"); continue; }
      const before = s.candidates.length;
      if (aspects.includes(1)) mixed(s, target, ctx, family, "rect", "z", host, inc, epsIdx, 1);
      const square = s.candidates.slice(before);
      if (aspects.includes(1) && (square.length === 0 || square.every((c) => c.relError <= ctx.tolerance / 4))) continue;
      const u = inc.eps.re / host.eps.re;
      for (const aspect of aspects) {
        if (aspect === 1) continue;
        if (!rectTableReady(u, aspect) && u > 0 && Number.isFinite(u)) {
          const budget = ctx.rectTables ?? { left: Infinity };
          if (budget.left <= 0) { refuse(s, `rect lattice not solved: this plan's ${RECT_TABLES_PER_PLAN} fill tables are spent`); continue; }
          budget.left--;
        }
        mixed(s, target, ctx, family, "rect", "z", host, inc, epsIdx, aspect);
      }
    }
  }
}

/**
 * A recipe that misses the level's target by more than FAR_OFF_FACTOR × the tolerance does not
 * "reach the target": it is refused (the level then carries `norecipe` and says how close the best
 * one came) instead of being built with a huge error. Between 1× and FAR_OFF_FACTOR× the recipe is
 * kept and its cells are flagged `inexact`. The factor is our choice (common practice is to accept
 * a near miss for a first build and to refuse a gross one).
 */
export const FAR_OFF_FACTOR = 4;

function dropFarOff(search: LevelSearch, tolerance: number): LevelSearch {
  const limit = FAR_OFF_FACTOR * tolerance;
  const kept = search.candidates.filter((c) => c.relError <= limit);
  if (kept.length === search.candidates.length) return search;
  const best = Math.min(...search.candidates.map((c) => c.relError));
  const dropped = search.candidates.length - kept.length;
  search.refusals.set(
    `the closest recipe misses the target by ${Number((best * 100).toPrecision(3))} % (refused beyond ${FAR_OFF_FACTOR}× the tolerance)`,
    dropped,
  );
  return { candidates: kept, refusals: search.refusals };
}

/** Check the process on the part it shapes (cells/cellChecks.ts `processCheckFor`); returns reasons (empty when fine). */
function processReasons(ctx: MatchContext, family: CellFamily, host: EvaluatedMaterial, inc: EvaluatedMaterial, featureM: number, gapM: number): string[] {
  return processCheckFor(ctx.process ?? undefined, family.fabricatedPhase, host.material.class, inc.material.class, { featureM, gapM })?.reasons ?? [];
}

function homogenization(ctx: MatchContext, phases: Complex[], spacingM = ctx.pitchM): { status: "ok" | "warn" | "refuse"; ratio: number } {
  let nMax = 1;
  for (const e of phases) {
    const n = refractiveIndex(e).re;
    if (Number.isFinite(n) && n > nMax) nMax = n;
  }
  return homogenizationCheck(spacingM, ctx.frequencyHz, nMax);
}

/**
 * Relative uncertainty of a wire medium's ε from its cut-off: ε = ε_h − (ω_p/ω)², so
 * δε = 2(δω_p/ω_p)·|ε − ε_h|, over |ε|.
 */
function wireUncertainty(eps: Complex, host: Complex, ratio: number): number {
  return (2 * wireCutoffError(ratio) * Math.abs(eps.re - host.re)) / Math.max(Math.abs(eps.re), 1e-3);
}

function indexIm(eps: Complex, mu: Complex): number {
  const n = refractiveIndex(eps, mu);
  return Number.isFinite(n.im) ? Math.max(0, n.im) : 0;
}

/**
 * A mixing family (or wire medium) with one fill fraction solved from one of the ε components.
 * Rect lattices (`aspect` = b/a = m/n): the device cell of pitch p holds m × n circles, so the
 * family's pitch is a = p/m and its y spacing b = p/n; the lattice's x axis lies along principal
 * axis 1 (componentMapping.ts).
 */
function mixed(
  s: LevelSearch, target: number[], ctx: MatchContext, family: CellFamily, lattice: Lattice, o: Direction,
  host: EvaluatedMaterial, inc: EvaluatedMaterial, epsIdx: number[], aspect?: number,
): void {
  const comps = ctx.components;
  const tiling = aspect !== undefined ? rectTiling(aspect) : null;
  const pitchM = tiling ? ctx.pitchM / tiling.m : ctx.pitchM;
  const context = { pitchM, frequencyHz: ctx.frequencyHz, conductivitySPerM: inc.material.conductivitySPerM, ...(aspect !== undefined ? { aspect } : {}) };
  // resonant families need a conducting inclusion (σ, or ωε₀·Im ε): refused here as a counted
  // reason, so that any error the family throws is a bug that reaches the user, not a skipped cell
  if (family.resonant && !((inc.material.conductivitySPerM ?? 0) > 0 || inc.eps.im > 0)) {
    refuse(s, `${family.id} needs a conducting inclusion`);
    return;
  }
  let best: { fill: number; achieved: Complex[]; err: number } | null = null;
  let lastReason = "";
  for (const k of epsIdx) {
    const axis = axisFor(family, o, comps[k].axis, lattice);
    const r = family.fillForTarget(host.eps, inc.eps, target[k], axis, lattice, context);
    if (!r.inRange || !Number.isFinite(r.fill)) { lastReason = r.reason ?? "fill fraction out of range"; continue; }
    const ap = family.effectivePermittivity(host.eps, inc.eps, r.fill, lattice, context);
    const achieved = comps.map((c) => (c.kind === "eps" ? axisValue(ap, axisFor(family, o, c.axis, lattice)) : complex(1)));
    const err = largestErrors(achieved.map((a) => a.re), achieved.map((a) => a.im), target).rel;
    if (!best || err < best.err) best = { fill: r.fill, achieved, err };
  }
  if (!best) { refuse(s, lastReason ? `fill out of the family's range (${family.id})` : "no fill fraction found"); return; }
  // rect lattices answer two in-plane targets with one fill: between the fills that meet each
  // exactly, the fill that minimizes the larger error (golden section; each axis is monotone in
  // the fill, so the larger error is quasi-convex between them)
  if (lattice === "rect" && epsIdx.length > 1) {
    const fills = epsIdx.map((k) => family.fillForTarget(host.eps, inc.eps, target[k], axisFor(family, o, comps[k].axis, lattice), lattice, context))
      .filter((r) => r.inRange && Number.isFinite(r.fill)).map((r) => r.fill);
    if (fills.length > 1) {
      const at = (f: number) => {
        const ap = family.effectivePermittivity(host.eps, inc.eps, f, lattice, context);
        const achieved = comps.map((c) => (c.kind === "eps" ? axisValue(ap, axisFor(family, o, c.axis, lattice)) : complex(1)));
        return { fill: f, achieved, err: largestErrors(achieved.map((a) => a.re), achieved.map((a) => a.im), target).rel };
      };
      let a = Math.min(...fills), b = Math.max(...fills);
      const g = (Math.sqrt(5) - 1) / 2;
      for (let it = 0; it < 60 && b - a > 1e-10; it++) {
        const c = b - g * (b - a), d = a + g * (b - a);
        if (at(c).err <= at(d).err) b = d;
        else a = c;
      }
      const m = at(0.5 * (a + b));
      if (m.err < best.err) best = m;
    }
  }
  let { fill, achieved, err } = best;
  // a rect lattice or an in-plane laminate stands on the grid: where the level's principal axes
  // are turned from it, the built tensor is turned too (its error as the cells will carry it, at
  // the level's largest angle)
  const k1 = comps.findIndex((c) => c.axis === "1"), k2 = comps.findIndex((c) => c.axis === "2");
  if ((lattice === "rect" || (family.id === "laminate" && (o === "1" || o === "2"))) && (ctx.turnRad ?? 0) > 1e-12 && k1 >= 0 && k2 >= 0 && target[k1] !== 0 && target[k2] !== 0 && achieved[k1].re !== achieved[k2].re) {
    const others = comps.map((_, k) => k).filter((k) => k !== k1 && k !== k2);
    const rest = others.length ? largestErrors(others.map((k) => achieved[k].re), others.map((k) => achieved[k].im), others.map((k) => target[k])).rel : 0;
    const turned = misalignedRelError(achieved[k1].re, achieved[k1].im, achieved[k2].re, achieved[k2].im, target[k1], target[k2], ctx.turnRad!);
    err = Math.max(rest, turned);
  }
  const feature = family.smallestFeatureM(fill, pitchM, lattice, aspect);
  const proc = processReasons(ctx, family, host, inc, feature.featureM, feature.gapM);
  if (proc.length) { refuse(s, `below the process limit: ${proc[0]}`); return; }
  const effs = epsIdx.map((k) => achieved[k]);
  // a rect cell is judged by its longer spacing (at most the device pitch)
  const h = homogenization(ctx, [...(inc.isMetal ? [] : [inc.eps]), host.eps, ...effs], pitchM * Math.max(1, aspect ?? 1));
  if (h.status === "refuse") { refuse(s, "cell coarser than λ/4 in its densest material"); return; }
  // spread, loss and bandwidth along the dominant (first) ε component
  const dom = epsIdx[0];
  const domAxis = axisFor(family, o, comps[dom].axis, lattice);
  const ap = family.effectivePermittivity(host.eps, inc.eps, fill, lattice, context);
  // model uncertainty per targeted axis: the solver's error estimate on a solved axis, the
  // MG/Bruggeman spread on a closed-form axis, the cut-off's error on a wire axis
  let spread = 0;
  const notes: string[] = [];
  for (const k of epsIdx) {
    const axis = axisFor(family, o, comps[k].axis, lattice);
    const rule = axisRule(ap, axis);
    const value = axisValue(ap, axis);
    const u = rule === "solved-cell" ? (axisSolvedError(ap, axis) ?? 0)
      : rule === "wire-medium" ? wireUncertainty(value, host.eps, family.dimensionsFromFill(fill, pitchM, lattice).radiusM / pitchM)
      : mixingSpread(rule, family.dimension, host.eps, inc.eps, fill);
    spread = Math.max(spread, Number.isFinite(u) ? u : 1);
    const closed = axisClosedForm(ap, axis);
    if (rule === "solved-cell" && closed) {
      const d = cAbs(cSub(closed.value, value)) / cAbs(value);
      if (d > ctx.tolerance) notes.push(`${axis}: the closed form (${closed.rule}) differs from the solved cell by ${Number((100 * d).toPrecision(3))} %; the solved value is used`);
    }
  }
  if (ap.unsolved) notes.push(`not solved (${ap.unsolved}): closed form used`);
  const eDom = axisValue(ap, domAxis);
  let bandwidth: number | null = null;
  if (family.resonant) {
    const wireIdx = epsIdx.find((k) => axisFor(family, o, comps[k].axis, lattice) === "parallel");
    if (wireIdx !== undefined) {
      const dims = family.dimensionsFromFill(fill, ctx.pitchM, lattice);
      const band = bandwidthWithinTolerance(
        { pitchM: ctx.pitchM, radiusM: dims.radiusM, frequencyHz: ctx.frequencyHz, hostEps: host.eps, conductivitySPerM: context.conductivitySPerM ?? Infinity },
        target[wireIdx], ctx.tolerance * Math.max(Math.abs(target[wireIdx]), 0.01),
      );
      bandwidth = band.fractional;
    }
  }
  const mu = complex(1);
  s.candidates.push({
    family: family.id,
    host: host.material.id,
    inclusion: inc.material.id,
    lattice,
    ...(aspect !== undefined ? { aspect } : {}),
    fillFraction: fill,
    dimensions: dimensionsToColumns(recipeDimensions(family.dimensionsFromFill(fill, pitchM, lattice, aspect), pitchM)),
    achieved: achieved.map((a) => a.re),
    achievedIm: achieved.map((a) => a.im),
    relError: err,
    lossTangent: eDom.re !== 0 ? Math.abs(eDom.im / eDom.re) : Infinity,
    indexIm: indexIm(eDom, mu),
    spread,
    bandwidth,
    featureM: Math.min(feature.featureM, feature.gapM > 0 ? feature.gapM : Infinity),
    resonant: family.resonant,
    score: 0,
    notes,
    homogenization: h.status,
    pitchRatio: h.ratio,
    orientation: family.isotropic ? null : o,
  });
}

/**
 * Split rings printed on boards of `host` standing in air (when a gas is allowed; otherwise the
 * board fills the cell), one board per cell row, the ring axis
 * along the magnetic component's principal direction (so the boards lie across it). The field
 * components the polarization needs in ε all lie in the board plane (Ez: ε_z with the ring axis in
 * the plane; Hz: the in-plane ε with the ring axis along z), so the cell's ε is the parallel
 * (Wiener) mix of board and air, and the board thickness t = f·a is chosen to match the ε target:
 * f = (ε_t − 1)/(ε_board − 1), kept between the process's smallest feature and the whole cell
 * (Wiener 1912; exact for a laminate). The rings' own electric response is neglected (stated in
 * the report's assumptions). μ along the ring axis comes from designSplitRing (printed rings on
 * that board, sized within the process limits).
 */
function splitRing(
  s: LevelSearch, target: number[], ctx: MatchContext, family: CellFamily, lattice: Lattice,
  host: EvaluatedMaterial, metal: EvaluatedMaterial, mk: number, epsIdx: number[], diagnose: boolean,
): void {
  const comps = ctx.components;
  const a = ctx.pitchM;
  const sigma = metal.material.conductivitySPerM ?? 2 * Math.PI * ctx.frequencyHz * EPS0_F_PER_M * metal.eps.im;
  // board fill from the ε target(s): geometric mean when two in-plane values are asked for
  const epsTarget = epsIdx.length ? Math.exp(epsIdx.reduce((acc, k) => acc + Math.log(Math.max(target[k], 1e-6)), 0) / epsIdx.length) : host.eps.re;
  // boards stand in the allowed gas (air) when there is one; otherwise the board fills the cell
  const gas = ctx.materials.find((m) => m.material.class === "gas");
  const around = gas ? gas.eps : null;
  const minBoardM = Math.max(ctx.process?.minFeatureM ?? 0, a / 50);
  const boardFill = around && host.eps.re > around.re
    ? Math.min(1, Math.max(minBoardM / a, (epsTarget - around.re) / (host.eps.re - around.re)))
    : 1;
  const boardThicknessM = boardFill * a;
  const cellEps: Complex = around
    ? { re: boardFill * host.eps.re + (1 - boardFill) * around.re, im: boardFill * host.eps.im + (1 - boardFill) * around.im }
    : host.eps;
  const design = designSplitRing({
    pitchM: a,
    frequencyHz: ctx.frequencyHz,
    targetMu: target[mk],
    conductivitySPerM: sigma,
    hostEpsRe: host.eps.re,
    hostEpsIm: host.eps.im,
    hostClass: host.material.class,
    processId: ctx.process?.id,
    minFeatureM: ctx.process?.minFeatureM,
    minGapM: ctx.process?.minGapM,
    boardThicknessM: boardFill < 1 ? boardThicknessM : undefined,
    diagnose,
  });
  if (!design.geometry || !design.response) { refuse(s, design.reasons[0] ?? "no split-ring geometry reaches the target"); return; }
  const g = design.geometry;
  const r = design.response;
  const achievedC: Complex[] = comps.map((c, k) => (c.kind === "eps" ? cellEps : k === mk ? r.mu : complex(1)));
  const err = largestErrors(achievedC.map((x) => x.re), achievedC.map((x) => x.im), target).rel;
  const outerRadiusM = printedOuterRadiusM(g);
  const wall = Math.max(0, a - 2 * outerRadiusM);
  const featureM = Math.min(g.ringWidthM, boardThicknessM);
  const gapM = Math.min(g.ringGapM, wall > 0 ? wall : Infinity, boardFill < 1 ? a - boardThicknessM : Infinity);
  const proc = processReasons(ctx, family, host, metal, featureM, gapM);
  if (proc.length) { refuse(s, `below the process limit: ${proc[0]}`); return; }
  const h = homogenization(ctx, [host.eps]);
  if (h.status === "refuse") { refuse(s, "cell coarser than λ/4 in its densest material"); return; }
  const band = splitRingBandwidth(r, ctx.frequencyHz, target[mk], ctx.tolerance * Math.max(Math.abs(target[mk]), 0.01));
  const epsDom = epsIdx.length ? achievedC[epsIdx[0]] : cellEps;
  const dims: Record<string, number> = { ringRadiusM: g.ringRadiusM, ringWidthM: g.ringWidthM, ringGapM: g.ringGapM, boardThicknessM };
  if (g.splitGapM !== undefined) dims.splitGapM = g.splitGapM;
  s.candidates.push({
    family: family.id,
    host: host.material.id,
    inclusion: metal.material.id,
    lattice,
    fillFraction: r.fill,
    dimensions: dimensionsToColumns(dims),
    achieved: achievedC.map((x) => x.re),
    achievedIm: achievedC.map((x) => x.im),
    relError: err,
    lossTangent: Math.max(cellEps.re !== 0 ? Math.abs(cellEps.im / cellEps.re) : 0, r.mu.re !== 0 ? Math.abs(r.mu.im / r.mu.re) : Infinity),
    indexIm: indexIm(epsDom, r.mu),
    // the two standard ring inductances (printed rings) give two values of μ: their spread is the model's uncertainty
    spread: ringModelSpread(g, r, sigma, ctx.frequencyHz, host.eps),
    bandwidth: band.fractional,
    featureM: Math.min(featureM, gapM),
    resonant: true,
    score: 0,
    notes: design.reasons,
    homogenization: h.status,
    pitchRatio: h.ratio,
    orientation: comps[mk].axis,
  });
}
