/**
 * Sizing printed split rings for a target permeability: hold the strip width and separation at
 * makeable sizes, solve the ring radius (or, with the radius given, the separation) so that Re μ
 * meets the target at the design frequency, and when no size does, say why in numbers.
 * The circuit is printedRing.ts; the Lorentz response is supplied by the caller (splitRing.ts),
 * so this file does not depend on it.
 */
import { printedDefaultSizeM, printedMeanRadiusM, printedOuterRadiusM, printedRingCircuit, type PrintedRingGeometry } from "./printedRing.js";

/** What solvePrintedRing needs: the cell, the sizes held fixed, and the process limits. */
export interface PrintedRingSpec {
  pitchM: number;
  frequencyHz: number;
  targetMu: number;
  /** board ε' (the ring's capacitance) */
  epsSub: number;
  /** strip width c (default: printedDefaultSizeM) */
  ringWidthM?: number;
  /** strip separation d: held fixed when given, else printedDefaultSizeM — or solved when ringRadiusM is given */
  ringGapM?: number;
  /** inner radius: when given, the separation d is solved instead of the radius */
  ringRadiusM?: number;
  splitGapM?: number;
  stackSpacingM?: number;
  metalThicknessM?: number;
  boardThicknessM?: number;
  minFeatureM?: number;
  minGapM?: number;
}

export interface PrintedRingSolution {
  geometry: (PrintedRingGeometry & { splitGapM: number }) | null;
  /** why there is none */
  reasons: string[];
  /** what to watch */
  notes: string[];
}

const SCAN_POINTS = 240;
const CROWD_POINTS = 120;

/** Sizes held fixed and the range of the free one (inner radius, or separation when the radius is given). */
function layout(s: PrintedRingSpec) {
  const a = s.pitchM;
  const c = s.ringWidthM ?? printedDefaultSizeM(a, s.minFeatureM);
  const wall = printedDefaultSizeM(a, s.minGapM);
  const room = (a - wall) / 2; // outer radius allowed
  const minOpen = Math.max(s.minGapM ?? 0, c);
  const fixed = { pitchM: a, ringWidthM: c, stackSpacingM: s.stackSpacingM, metalThicknessM: s.metalThicknessM, boardThicknessM: s.boardThicknessM };
  const split = (d: number) => s.splitGapM ?? Math.max(s.minGapM ?? 0, d);
  if (s.ringRadiusM === undefined) {
    const d = s.ringGapM ?? printedDefaultSizeM(a, s.minGapM);
    return { free: "ring radius" as const, c, d, wall, lo: minOpen, hi: room - 2 * c - d, build: (r: number) => ({ ...fixed, ringRadiusM: r, ringGapM: d, splitGapM: split(d) }) };
  }
  const r = s.ringRadiusM;
  return { free: "strip separation" as const, c, d: NaN, wall, lo: Math.max(s.minGapM ?? 0, c / 100), hi: room - 2 * c - r, build: (d: number) => ({ ...fixed, ringRadiusM: r, ringGapM: d, splitGapM: split(d) }) };
}

/**
 * Printed-ring sizes whose Re μ (from `reMuAt`, loss included) equals the target at the design
 * frequency. One size is free — the inner radius (default) or, when the radius is given, the strip
 * separation — and is scanned over everything that fits the cell with a wall ≥ max(minimum gap,
 * a/25, or the process minimum) to the neighbours; every crossing is refined by bisection and the one with the least Im μ
 * (farthest from the resonance: least loss, widest band) is kept. When none exists the reason
 * says how far off the best ring is and what pitch or board permittivity would reach the target.
 */
export function solvePrintedRing(spec: PrintedRingSpec, muAt: (g: PrintedRingGeometry, epsSub: number) => { re: number; im: number }, diagnose = true): PrintedRingSolution {
  const L = layout(spec);
  const mm = (m: number) => `${Number((m * 1e3).toPrecision(3))} mm`;
  if (!(L.hi > L.lo)) {
    return { geometry: null, reasons: [`printed rings with ${mm(L.c)} strips do not fit a ${mm(spec.pitchM)} cell with a ${mm(L.wall)} wall to the next ring`], notes: [] };
  }
  const err = (x: number) => muAt(L.build(x), spec.epsSub).re - spec.targetMu;
  const xs = scanPoints(L, spec);
  const es = xs.map(err);
  let best: { x: number; im: number } | null = null;
  for (let i = 0; i + 1 < xs.length; i++) {
    if (!(es[i] * es[i + 1] <= 0) || !Number.isFinite(es[i] + es[i + 1])) continue;
    let lo = xs[i], hi = xs[i + 1], elo = es[i];
    for (let k = 0; k < 80 && hi - lo > 1e-14 * hi; k++) {
      const m = 0.5 * (lo + hi);
      const em = err(m);
      if (em * elo <= 0) hi = m;
      else { lo = m; elo = em; }
    }
    const x = 0.5 * (lo + hi);
    const g = L.build(x);
    if (!onNormalBranch(g, spec, muAt)) continue;
    const im = muAt(g, spec.epsSub).im;
    if (!best || im < best.im) best = { x, im };
  }
  if (best) {
    const g = L.build(best.x);
    const notes: string[] = [];
    const r0 = printedMeanRadiusM(g);
    if ((2 * g.ringWidthM + g.ringGapM) / r0 > 0.5) notes.push(`strips and separation (${mm(2 * g.ringWidthM + g.ringGapM)}) are not small against the mean radius ${mm(r0)}: the thin-ring circuit model is approximate`);
    return { geometry: g, reasons: [], notes };
  }
  return { geometry: null, reasons: [diagnose ? explainMiss(spec, L, muAt) : "no printed ring reaches the target"], notes: [] };
}

/**
 * Where to look for crossings: a log grid over [lo, hi] plus points crowded geometrically towards
 * the size x_res that resonates at the design frequency (f0 falls monotonically with the radius
 * and rises with the separation), where Re μ turns fastest and a coarse grid could step over a
 * pair of crossings.
 */
function scanPoints(L: ReturnType<typeof layout>, spec: PrintedRingSpec): number[] {
  const xs: number[] = [];
  const ratio = L.hi / L.lo;
  for (let i = 0; i <= SCAN_POINTS; i++) xs.push(L.lo * ratio ** (i / SCAN_POINTS));
  const f0 = (x: number) => printedRingCircuit(L.build(x), spec.epsSub).resonanceHz - spec.frequencyHz;
  const a = f0(L.lo), b = f0(L.hi);
  if (a * b < 0) {
    let lo = L.lo, hi = L.hi;
    for (let k = 0; k < 100 && hi - lo > 1e-15 * hi; k++) {
      const m = 0.5 * (lo + hi);
      if (f0(m) * a > 0) lo = m;
      else hi = m;
    }
    const xr = 0.5 * (lo + hi);
    for (let j = 0; j <= CROWD_POINTS; j++) {
      const step = 10 ** (-8 + (8 * j) / CROWD_POINTS); // 1e-8 … 1 relative
      for (const x of [xr * (1 - 0.5 * step), xr * (1 + step)]) if (x > L.lo && x < L.hi) xs.push(x);
    }
    xs.push(xr);
  }
  return xs.sort((p, q) => p - q);
}

/**
 * A crossing counts only outside the resonance line, |ω² − ω0²| > Γω, on the side the target asks
 * for (below resonance for μ' > 1, above it for μ' < 1): inside the line Re μ sweeps through every
 * value with Im μ of order Fω/Γ, which no design wants. In the Lorentz form
 * 1 − μ = Fω²(D − iΓω)/(D² + Γ²ω²), D = ω² − ω0², so |D| > Γω ⟺ Im μ < |1 − Re μ| (derived).
 */
function onNormalBranch(g: PrintedRingGeometry, spec: PrintedRingSpec, muAt: (g: PrintedRingGeometry, epsSub: number) => { re: number; im: number }): boolean {
  const f0 = printedRingCircuit(g, spec.epsSub).resonanceHz;
  const above = spec.frequencyHz > f0;
  if ((spec.targetMu < 1) !== above) return false;
  const m = muAt(g, spec.epsSub);
  return m.im < Math.abs(1 - m.re);
}

/** The reason for a miss: the best ring's resonance against the one needed, and what would reach it. */
function explainMiss(spec: PrintedRingSpec, L: ReturnType<typeof layout>, muAt: (g: PrintedRingGeometry, epsSub: number) => { re: number; im: number }): string {
  const mm = (m: number) => `${Number((m * 1e3).toPrecision(3))} mm`;
  const ghz = (hz: number) => `${Number((hz / 1e9).toPrecision(3))} GHz`;
  const t = spec.targetMu;
  // the lowest resonance: the largest ring (radius free) or the narrowest separation (separation free)
  const g = L.build(L.free === "ring radius" ? L.hi : L.lo);
  const k = printedRingCircuit(g, spec.epsSub);
  const sizes = `${mm(g.ringWidthM)} strips ${mm(g.ringGapM)} apart on a board of ε' = ${Number(spec.epsSub.toPrecision(3))}`;
  const ring = `the ${L.free === "ring radius" ? "largest printed ring that fits" : "printed ring of this radius with the narrowest separation"} (outer radius ${mm(printedOuterRadiusM(g))}, ${sizes}) in a ${mm(spec.pitchM)} cell`;
  if (t < 1 && t >= 1 - k.strength) return `${ring} gives at most 1 − F = ${Number((1 - k.strength).toPrecision(3))} above its resonance; μ' = ${Number(t.toPrecision(4))} lies between that and 1`;
  if (t < 1) {
    const needHz = spec.frequencyHz * Math.sqrt(1 - k.strength / (1 - t));
    if (k.resonanceHz > needHz) {
      const fixedSizes = { ...spec, ringWidthM: L.c, ...(L.free === "ring radius" ? { ringGapM: L.d } : {}), minGapM: L.wall };
      const works = (over: Partial<PrintedRingSpec>) => solvePrintedRing({ ...fixedSizes, ...over }, muAt, false).geometry !== null;
      const pitch = smallestPassing((p) => works({ pitchM: p, minGapM: L.wall }), spec.pitchM, 3 * spec.pitchM);
      const eps = smallestPassing((e) => works({ epsSub: e }), spec.epsSub, Math.max(30, 3 * spec.epsSub));
      const fixes = [
        ...(Number.isFinite(pitch) ? [`a pitch of at least ${mm(pitch)} with the same strips`] : []),
        ...(Number.isFinite(eps) ? [`a board of ε' ≥ ${Number(eps.toPrecision(3))}`] : []),
        "finer strips and separation than the process allows",
      ];
      return `${ring} resonates at ${ghz(k.resonanceHz)}; μ' = ${Number(t.toPrecision(4))} at ${ghz(spec.frequencyHz)} needs its resonance at or below ${ghz(needHz)} (the rings are too small to be tuned that low: ${fixes.join(", or ")})`;
    }
  }
  const m = muAt(g, spec.epsSub);
  return `no printed ring between these sizes gives μ' = ${Number(t.toPrecision(4))} (${ring} gives μ' = ${Number(m.re.toPrecision(3))}, resonance ${ghz(k.resonanceHz)})`;
}

/** Smallest x in [lo, hi] where ok(x) first holds, walking up in 2 % steps then bisecting; NaN if none. */
function smallestPassing(ok: (x: number) => boolean, lo: number, hi: number): number {
  if (ok(lo)) return lo;
  let a = lo;
  let b = NaN;
  for (let x = lo * 1.02; x <= hi; x *= 1.02) {
    if (ok(x)) { b = x; break; }
    a = x;
  }
  if (!Number.isFinite(b)) return NaN;
  for (let k = 0; k < 30 && b - a > 1e-4 * b; k++) {
    const m = 0.5 * (a + b);
    if (ok(m)) b = m;
    else a = m;
  }
  return b;
}
