/**
 * Split-ring resonators in two styles (RingStyle):
 * - "printed": edge-coupled rings etched on a board, the quasi-static LC circuit of printedRing.ts
 *   (Marqués et al. 2002; Baena et al. 2005) — the realistic model for PCB rings;
 * - "split-cylinder": Pendry's stacked double split cylinders, below.
 * Both give the same Lorentz form; they differ in how ω0, F and Γ follow from the sizes.
 *
 * Split cylinders: a stack (spacing l) of double split rings — inner radius r, ring width c,
 * radial gap d between the two rings — on a cubic lattice of pitch a. For a magnetic field along
 * the ring axis it gives a Lorentz permeability
 *   μ(ω) = 1 − Fω²/(ω² − ω0² + iΓω),   F = πr²/a²                       (exp(−iωt); Im μ ≥ 0)
 *   ω0² = 3lc₀²/(π ε_h ln(2c/d) r³),   Γ = 2lR'/(μ₀r)
 * (Pendry, Holden, Robbins, Stewart, "Magnetism from conductors and enhanced nonlinear phenomena",
 * IEEE Trans. Microw. Theory Tech. 47, 2075 (1999) — exact form from memory). R' = 1/(σ c t_eff) is
 * the ring resistance per unit length of circumference, t_eff the metal thickness capped at two
 * skin depths (both faces; common practice). The host factor ε_h (rings embedded in the host
 * scale the inter-ring capacitance) is our extension; it is 1 in air.
 * μ → 1 at low frequency, μ → μ∞ = 1 − F at high frequency, Re μ = 0 at ω0/sqrt(1 − F).
 * Values of μ' between 1 − F and 1 are out of reach for a ring of that F.
 * The capacitance formula assumes a narrow gap (d ≲ c); it is undefined for d ≥ 2c.
 */
import type { Complex } from "../core/complex.js";
import { C0, MU0 } from "./physicalConstants.js";
import { printedMeanRadiusM, printedRingCircuit, printedRingDampingRadPerS, type PrintedRingCircuit, type PrintedRingGeometry } from "./printedRing.js";
import { solvePrintedRing } from "./printedRingDesign.js";
import { skinDepthM, stripEffectiveThicknessM } from "./skinDepth.js";
import { toleranceBand, type ToleranceBand } from "./toleranceBand.js";

const TWO_PI = 2 * Math.PI;
/** Narrowest gap treated as makeable at all, 1 nm (common practice: below a few atomic layers). */
export const MIN_BUILDABLE_GAP_M = 1e-9;

export type RingStyle = "printed" | "split-cylinder";
export const RING_STYLES: readonly RingStyle[] = ["printed", "split-cylinder"];

/**
 * The default style: printed when the process is PCB etching or the host is a laminate (board),
 * and also for any other solid host (rings in a solid are etched on boards of it; when only ε' is
 * known, ε' > 1 counts as solid) — ours; split cylinders for rings in air or another gas.
 */
export function defaultRingStyle(ctx: { hostClass?: string; processId?: string; hostEpsRe?: number }): RingStyle {
  if (ctx.processId === "pcb-etching" || ctx.hostClass === "laminate") return "printed";
  if (ctx.hostClass === "gas" || ctx.hostClass === "liquid") return "split-cylinder";
  if (ctx.hostClass !== undefined) return "printed";
  return (ctx.hostEpsRe ?? 1) > 1 ? "printed" : "split-cylinder";
}

/**
 * Ring geometry for both styles: the printed ring's fields (printedRing.ts; for split cylinders
 * ringRadiusM is the inner ring radius r and ringGapM the radial gap d between the two rings,
 * stackSpacingM the spacing along the axis) plus the style and the printed cut.
 */
export interface SplitRingGeometry extends PrintedRingGeometry {
  /** model of the rings (absent: split-cylinder) */
  ringStyle?: RingStyle;
  /** printed: width of the cut in each ring, m (does not enter the circuit model) */
  splitGapM?: number;
}

/** F = πr²/a², the fraction of the cell the ring encloses (Pendry et al. 1999). */
export const splitRingFill = (ringRadiusM: number, pitchM: number): number => (Math.PI * ringRadiusM * ringRadiusM) / (pitchM * pitchM);

/** X = 3lc₀²/(π ε_h ω0² r³), so that ln(2c/d) = X at resonance ω0. */
function capacitanceLog(stackM: number, ringRadiusM: number, resonanceHz: number, hostEpsRe: number): number {
  const w0 = TWO_PI * resonanceHz;
  return (3 * stackM * C0 * C0) / (Math.PI * hostEpsRe * w0 * w0 * ringRadiusM ** 3);
}

/** Resonance frequency f0 (Hz) of the rings; NaN when d ≥ 2c (the model's log is not positive). */
export function splitRingResonanceHz(g: SplitRingGeometry, hostEpsRe = 1): number {
  const lg = Math.log((2 * g.ringWidthM) / g.ringGapM);
  if (!(lg > 0)) return NaN;
  const l = g.stackSpacingM ?? g.pitchM;
  return Math.sqrt((3 * l * C0 * C0) / (Math.PI * hostEpsRe * lg * g.ringRadiusM ** 3)) / TWO_PI;
}

/** Gap d (m) between the rings that puts the resonance at f0: d = 2c·exp(−X). */
export function ringGapForResonance(g: Omit<SplitRingGeometry, "ringGapM">, resonanceHz: number, hostEpsRe = 1): number {
  return 2 * g.ringWidthM * Math.exp(-capacitanceLog(g.stackSpacingM ?? g.pitchM, g.ringRadiusM, resonanceHz, hostEpsRe));
}

/** Damping Γ (rad/s) = 2lR'/(μ₀r), R' = 1/(σ c t_eff) at frequency f. 0 for a perfect conductor. */
export function splitRingDampingRadPerS(g: SplitRingGeometry, conductivitySPerM: number, frequencyHz: number): number {
  if (conductivitySPerM === Infinity) return 0;
  const tEff = stripEffectiveThicknessM(g.metalThicknessM, skinDepthM(conductivitySPerM, frequencyHz));
  const rPerLength = 1 / (conductivitySPerM * g.ringWidthM * tEff);
  return (2 * (g.stackSpacingM ?? g.pitchM) * rPerLength) / (MU0 * g.ringRadiusM);
}

/** Lorentz μ = 1 − Fω²/(ω² − ω0² + iΓω) at f (Hz). */
export function lorentzMu(fill: number, resonanceHz: number, gammaRadPerS: number, frequencyHz: number): Complex {
  const w = TWO_PI * frequencyHz;
  const w0 = TWO_PI * resonanceHz;
  const dr = w * w - w0 * w0;
  const di = gammaRadPerS * w;
  const m = dr * dr + di * di;
  const num = fill * w * w;
  // −num/(dr + i di) = −num(dr − i di)/m
  return { re: 1 - (num * dr) / m, im: (num * di) / m };
}

export interface ResonanceChoice {
  /** resonance frequency, Hz; NaN when the target is out of reach for this F */
  resonanceHz: number;
  reason?: string;
}

/**
 * Resonance f0 that gives the lossless Lorentz μ' = targetMu at f: f0² = f²(1 − F/(1 − μ')).
 * Out of reach when 1 − F ≤ μ' ≤ 1 (μ' = 1 needs no rings).
 */
export function resonanceForTargetMu(targetMu: number, frequencyHz: number, fill: number): ResonanceChoice {
  if (targetMu >= 1 - fill && targetMu <= 1) {
    return { resonanceHz: NaN, reason: `μ' = ${targetMu} lies between the high-frequency limit 1 − F = ${(1 - fill).toPrecision(4)} and 1; use smaller rings (F < ${(1 - targetMu).toPrecision(4)})` };
  }
  return { resonanceHz: frequencyHz * Math.sqrt(1 - fill / (1 - targetMu)) };
}

export interface SplitRingResponse {
  /** Lorentz strength F (split cylinders: the area fraction πr²/a²; printed: μ₀π²r0⁴/(a²lL_s)) */
  fill: number;
  resonanceHz: number;
  /** Re μ = 0 (lossless) at f0/sqrt(1 − F), Hz; NaN when F ≥ 1 */
  magneticPlasmaHz: number;
  muHighFrequency: number;
  gammaRadPerS: number;
  skinDepthM: number;
  mu: Complex;
  ringStyle?: RingStyle;
  /** printed: the LC circuit (inductance, capacitance, ε_eff) */
  circuit?: PrintedRingCircuit;
}

const asComplex = (e: number | Complex): Complex => (typeof e === "number" ? { re: e, im: 0 } : e);

/**
 * μ at the design frequency for rings of geometry g (resonance from the geometry unless given).
 * hostEps: the host's (split cylinders) or board's (printed) relative permittivity; its imaginary
 * part adds the board's loss to the printed ring's damping.
 */
export function splitRingResponse(g: SplitRingGeometry, conductivitySPerM: number, frequencyHz: number, hostEps: number | Complex = 1, resonanceHz?: number): SplitRingResponse {
  const eps = asComplex(hostEps);
  const skin = conductivitySPerM === Infinity ? 0 : skinDepthM(conductivitySPerM, frequencyHz);
  if (g.ringStyle === "printed") {
    const circuit = printedRingCircuit(g, eps.re);
    const fill = circuit.strength;
    const f0 = resonanceHz ?? circuit.resonanceHz;
    const gamma = printedRingDampingRadPerS(g, circuit, conductivitySPerM, frequencyHz, eps.im);
    return {
      fill, resonanceHz: f0, magneticPlasmaHz: fill < 1 ? f0 / Math.sqrt(1 - fill) : NaN, muHighFrequency: 1 - fill,
      gammaRadPerS: gamma, skinDepthM: skin, mu: lorentzMu(fill, f0, gamma, frequencyHz), ringStyle: "printed", circuit,
    };
  }
  const fill = splitRingFill(g.ringRadiusM, g.pitchM);
  const f0 = resonanceHz ?? splitRingResonanceHz(g, eps.re);
  const gamma = splitRingDampingRadPerS(g, conductivitySPerM, frequencyHz);
  return {
    fill,
    resonanceHz: f0,
    magneticPlasmaHz: fill < 1 ? f0 / Math.sqrt(1 - fill) : NaN,
    muHighFrequency: 1 - fill,
    gammaRadPerS: gamma,
    skinDepthM: skin,
    mu: lorentzMu(fill, f0, gamma, frequencyHz),
    ringStyle: "split-cylinder",
  };
}

/**
 * Model spread of a ring design: printed rings have two standard loop inductances of equal
 * standing (printedRing.ts: Grover's round-wire loop with the strip's equivalent radius c/4, the
 * working value, and the flat-strip form of the printed-ring circuit models); the same geometry
 * evaluated with the other one gives μ_alt, and the spread is |μ_alt − μ| / |μ| (complex, no floor:
 * the relative error's own definition). Split cylinders have one published model: 0.
 */
export function ringModelSpread(g: SplitRingGeometry, response: SplitRingResponse, conductivitySPerM: number, frequencyHz: number, hostEps: number | Complex = 1): number {
  if (g.ringStyle !== "printed") return 0;
  const eps = asComplex(hostEps);
  const alt = printedRingCircuit(g, eps.re, "strip");
  const gamma = printedRingDampingRadPerS(g, alt, conductivitySPerM, frequencyHz, eps.im);
  const muAlt = lorentzMu(alt.strength, alt.resonanceHz, gamma, frequencyHz);
  const d = Math.hypot(muAlt.re - response.mu.re, muAlt.im - response.mu.im), m = Math.hypot(response.mu.re, response.mu.im);
  return m > 0 && Number.isFinite(d) ? d / m : Infinity;
}

/** Band around the design frequency where Re μ stays within ±toleranceAbs of targetMu (Γ held fixed). */
export function splitRingBandwidth(r: SplitRingResponse, frequencyHz: number, targetMu: number, toleranceAbs: number): ToleranceBand {
  return toleranceBand((f) => lorentzMu(r.fill, r.resonanceHz, r.gammaRadPerS, f).re, frequencyHz, targetMu, toleranceAbs);
}

/** Area enclosed by the rings over the cell face: πr²/a² (split cylinders), πr0²/a² with the mean radius (printed). */
export function splitRingAreaFraction(g: SplitRingGeometry): number {
  const r = g.ringStyle === "printed" ? printedMeanRadiusM(g) : g.ringRadiusM;
  return splitRingFill(r, g.pitchM);
}

export interface SplitRingDesignInput {
  pitchM: number;
  frequencyHz: number;
  targetMu: number;
  conductivitySPerM: number;
  hostEpsRe?: number;
  /** host or board loss, Im ε (printed rings: adds the board's loss to the damping) */
  hostEpsIm?: number;
  /** model; default from defaultRingStyle(hostClass, processId, hostEpsRe) */
  ringStyle?: RingStyle;
  /** host material class (laminate, ceramic, gas…), for the default style */
  hostClass?: string;
  /** process id, for the default style (pcb-etching → printed) */
  processId?: string;
  /** process limits: printed strips, separations and walls are kept at or above them */
  minFeatureM?: number;
  minGapM?: number;
  /** ring radius (printed: inner radius; the separation is then solved); split cylinders: default the largest ring whose outer edge stays at 0.45a with d ≈ c (ours), shrunk to F = (1 − μ')/2 when that F is too large */
  ringRadiusM?: number;
  /** strip width; default a/20 (split cylinders), printedDefaultSizeM (printed) (ours) */
  ringWidthM?: number;
  /** printed only: strip separation held fixed (default printedDefaultSizeM) */
  ringGapM?: number;
  /** printed only: width of the cut in each ring (default the separation) */
  splitGapM?: number;
  /** printed only: board thickness (default: thick board) */
  boardThicknessM?: number;
  stackSpacingM?: number;
  metalThicknessM?: number;
  /**
   * printed only: when no ring reaches the target, work out what would (pitch, board ε) for the
   * reason — costs tens of milliseconds; callers searching many hosts pass false (default true)
   */
  diagnose?: boolean;
}

export interface SplitRingDesign {
  geometry: SplitRingGeometry | null;
  response: SplitRingResponse | null;
  /** why no geometry was found, or why the one found is not buildable */
  reasons: string[];
  /** what to watch (model validity), not a failure */
  notes?: string[];
}

/** The style designSplitRing uses for this input. */
export const ringStyleFor = (input: SplitRingDesignInput): RingStyle =>
  input.ringStyle ?? defaultRingStyle({ hostClass: input.hostClass, processId: input.processId, hostEpsRe: input.hostEpsRe });

/**
 * Ring geometry for a target μ' at the design frequency, in the style of ringStyleFor(input).
 * Printed: strip width and separation held at makeable sizes, the ring radius (or, when the
 * radius is given, the separation) solved so that Re μ (loss included) meets the target — see
 * solvePrintedRing (printedRingDesign.ts). Split cylinders: choose r (hence F), put the lossless resonance where
 * μ'(f) = target, then pick the inter-ring gap d that tunes the rings there; the achieved μ
 * includes the metal loss, so Re μ differs slightly from the target.
 */
export function designSplitRing(input: SplitRingDesignInput): SplitRingDesign {
  if (ringStyleFor(input) === "printed") return designPrinted(input);
  return designSplitCylinder(input);
}

function designPrinted(input: SplitRingDesignInput): SplitRingDesign {
  const eps: Complex = { re: input.hostEpsRe ?? 1, im: input.hostEpsIm ?? 0 };
  const sol = solvePrintedRing(
    { ...input, epsSub: eps.re },
    (g, epsSub) => splitRingResponse({ ...g, ringStyle: "printed" }, input.conductivitySPerM, input.frequencyHz, { re: epsSub, im: eps.im }).mu,
    input.diagnose ?? true,
  );
  if (!sol.geometry) return { geometry: null, response: null, reasons: sol.reasons, notes: sol.notes };
  const geometry: SplitRingGeometry = { ringStyle: "printed", ...sol.geometry };
  for (const k of Object.keys(geometry) as (keyof SplitRingGeometry)[]) if (geometry[k] === undefined) delete geometry[k];
  return { geometry, response: splitRingResponse(geometry, input.conductivitySPerM, input.frequencyHz, eps), reasons: [], notes: sol.notes };
}

function designSplitCylinder(input: SplitRingDesignInput): SplitRingDesign {
  const { pitchM: a, frequencyHz, targetMu, conductivitySPerM } = input;
  const eh = input.hostEpsRe ?? 1;
  const c = input.ringWidthM ?? a / 20;
  let r = input.ringRadiusM ?? 0.45 * a - 3 * c;
  const reasons: string[] = [];
  if (!(r > 0)) return { geometry: null, response: null, reasons: [`ring width ${c} m leaves no room for a ring in a ${a} m cell`] };
  if (input.ringRadiusM === undefined && targetMu < 1 && splitRingFill(r, a) >= 1 - targetMu) {
    r = a * Math.sqrt((1 - targetMu) / 2 / Math.PI);
  }
  const fill = splitRingFill(r, a);
  const choice = resonanceForTargetMu(targetMu, frequencyHz, fill);
  if (!Number.isFinite(choice.resonanceHz)) return { geometry: null, response: null, reasons: [choice.reason ?? "target out of reach"] };
  const base = { ringStyle: "split-cylinder" as const, pitchM: a, ringRadiusM: r, ringWidthM: c, stackSpacingM: input.stackSpacingM, metalThicknessM: input.metalThicknessM };
  const d = ringGapForResonance(base, choice.resonanceHz, eh);
  const geometry: SplitRingGeometry = { ...base, ringGapM: d };
  if (d < MIN_BUILDABLE_GAP_M) reasons.push(`the rings need a gap of ${d.toPrecision(3)} m between them to resonate at ${(choice.resonanceHz / 1e9).toPrecision(4)} GHz: below 1 nm, nothing makes it (use larger rings, closer stacking, a denser host, or printed rings on a board)`);
  if (d > c) reasons.push(`ring gap ${d.toPrecision(3)} m exceeds the ring width: outside the narrow-gap capacitance model`);
  if (r + 2 * c + d > a / 2) reasons.push(`rings (outer radius ${(r + 2 * c + d).toPrecision(3)} m) do not fit a ${a} m cell`);
  const response = splitRingResponse(geometry, conductivitySPerM, frequencyHz, eh, choice.resonanceHz);
  return { geometry, response, reasons };
}
