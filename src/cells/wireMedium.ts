/**
 * Wire medium: a square array (pitch a) of parallel thin metal wires (radius r) in a host. For a
 * field along the wires it acts as a Drude plasma with ε < ε_host below its plasma frequency:
 *   ε(ω) = ε_h − ωp²/(ω(ω + iγ))      (exp(−iωt); Im ε ≥ 0)
 * Plasma frequency (vacuum value; the host shifts the zero of ε to ωp/√ε_h):
 *   thin wire    ωp² = 2πc²/(a² ln(a/r))                 Pendry, Holden, Stewart, Youngs, PRL 76,
 *                                                         4773 (1996); Pendry et al. JPCM 10, 4785 (1998)
 *   corrected    kp² = 2π/(a²[ln(a/(2πr)) + 0.5275])     Belov, Tretyakov, Viitanen, JEWA 16, 1153
 *                                                         (2002) — constant from memory
 *   thick wire   kp² = 2π/(a² ln(a²/(4r(a−r))))          Maslovski, Tretyakov, Belov, MOTL 35, 47
 *                                                         (2002) — form from memory
 *   lattice      the lowest TM band at Γ of the wire lattice, solved (wireCutoff/wireLatticeCutoff.ts)
 * The lattice value is the one used for ε (square lattice up to r/a = 0.3, hexagonal up to 0.2;
 * error in ω_p ≤ 3·10⁻⁵ up to r/a = 0.2, 3·10⁻³ at 0.3). The closed forms are reported beside it as documented limits: the thick-wire
 * form lies 1.7 % (r/a = 0.01) to 10 % (r/a = 0.2) above the lattice value; the corrected form is
 * its static thin-wire limit (0.25 % above it at r/a = 0.001). The thin-wire form drops an O(1)
 * constant in the logarithm; it is taken as applicable when r/a ≤ 0.01 (common practice).
 * Beyond that range no value is solved: the thick-wire form is reported and the design is refused.
 * Damping from the wire resistance per length R' = 1/(σA) over the inductance per length
 * L' = 1/(ε₀a²ωp²): γ = ε₀a²ωp²/(σA), A = πr² at DC (Pendry 1998: γ = ε₀a²ωp²/(πr²σ)), the skin
 * shell when δ < r. γ is evaluated at the design frequency and held fixed across the band.
 * Validity: field along the wires, pitch well below the wavelength, good conductor (σ ≫ ωε₀).
 */
import type { Complex } from "../core/complex.js";
import { C0, EPS0 } from "./physicalConstants.js";
import { skinDepthM, wireConductingAreaM2 } from "./skinDepth.js";
import { toleranceBand, type ToleranceBand } from "./toleranceBand.js";
import { wireCutoffKpA, wireTableMaxRatio } from "./wireCutoff/wireLatticeCutoff.js";
import type { WireLattice } from "./wireCutoff/latticeSums.js";

export const THIN_WIRE_LIMIT = 0.01;
const TWO_PI = 2 * Math.PI;

/** Thin-wire plasma frequency, Hz (Pendry et al. 1996/1998). NaN unless 0 < r < a. */
export function thinWirePlasmaHz(pitchM: number, radiusM: number): number {
  const L = Math.log(pitchM / radiusM);
  if (!(radiusM > 0) || !(L > 0)) return NaN;
  return Math.sqrt((TWO_PI * C0 * C0) / (pitchM * pitchM * L)) / TWO_PI;
}

/** Corrected thin-wire plasma frequency, Hz (Belov et al. 2002; constant from memory). NaN where the bracket ≤ 0. */
export function correctedWirePlasmaHz(pitchM: number, radiusM: number): number {
  const L = Math.log(pitchM / (TWO_PI * radiusM)) + 0.5275;
  if (!(radiusM > 0) || !(L > 0)) return NaN;
  return (C0 * Math.sqrt(TWO_PI / (pitchM * pitchM * L))) / TWO_PI;
}

/** Thick-wire plasma frequency, Hz (Maslovski et al. 2002; form from memory). NaN unless 0 < r < a/2. */
export function thickWirePlasmaHz(pitchM: number, radiusM: number): number {
  const L = Math.log((pitchM * pitchM) / (4 * radiusM * (pitchM - radiusM)));
  if (!(radiusM > 0) || !(radiusM < pitchM / 2) || !(L > 0)) return NaN;
  return (C0 * Math.sqrt(TWO_PI / (pitchM * pitchM * L))) / TWO_PI;
}

/** Inverse of thickWirePlasmaHz: r = a(1 − sqrt(1 − e^(−Λ)))/2 with Λ = 2πc²/(a²ωp²). */
export function radiusForThickWirePlasma(pitchM: number, plasmaHz: number): number {
  const w = TWO_PI * plasmaHz;
  const lambda = (TWO_PI * C0 * C0) / (pitchM * pitchM * w * w);
  const e = Math.exp(-lambda);
  // 1 − sqrt(1 − e) written to keep precision for tiny e
  return (pitchM * (e / (1 + Math.sqrt(1 - e)))) / 2;
}

/** Lattice (exact) plasma frequency, Hz, of wires r on `lattice` at pitch a; NaN beyond wireTableMaxRatio. */
export function latticeWirePlasmaHz(pitchM: number, radiusM: number, lattice: WireLattice = "square"): number {
  const kpA = wireCutoffKpA(lattice, radiusM / pitchM);
  return Number.isFinite(kpA) ? (C0 * kpA) / (TWO_PI * pitchM) : NaN;
}

export { wireTableMaxRatio, wireCutoffError } from "./wireCutoff/wireLatticeCutoff.js";

export interface WirePlasma {
  thinWireHz: number;
  correctedHz: number;
  thickWireHz: number;
  /** the lattice value (lowest TM band at Γ), NaN beyond wireTableMaxRatio (0.3 square, 0.2 hex) */
  latticeHz: number;
  /** the value used for ε: the lattice value, or the thick-wire form where none is solved */
  usedHz: number;
  used: "lattice" | "thick-wire";
  /** r/a ≤ 0.01: the thin-wire formula's assumption holds */
  thinWireApplies: boolean;
  /** (thin − used)/used: how far the thin-wire formula is off */
  thinWireRelDiff: number;
}

/** The lattice plasma frequency and the closed-form estimates for wires of radius r at pitch a. */
export function wirePlasma(pitchM: number, radiusM: number, lattice: WireLattice = "square"): WirePlasma {
  const thin = thinWirePlasmaHz(pitchM, radiusM);
  const thick = thickWirePlasmaHz(pitchM, radiusM);
  const exact = latticeWirePlasmaHz(pitchM, radiusM, lattice);
  const used = Number.isFinite(exact) ? exact : thick;
  return {
    thinWireHz: thin,
    correctedHz: correctedWirePlasmaHz(pitchM, radiusM),
    thickWireHz: thick,
    latticeHz: exact,
    usedHz: used,
    used: Number.isFinite(exact) ? "lattice" : "thick-wire",
    thinWireApplies: radiusM / pitchM <= THIN_WIRE_LIMIT,
    thinWireRelDiff: (thin - used) / used,
  };
}

/** Damping rate γ (rad/s) of the wire plasma: ε₀a²ωp²/(σA). 0 for a perfect conductor (σ = ∞). */
export function wireDampingRadPerS(pitchM: number, radiusM: number, plasmaHz: number, conductivitySPerM: number, frequencyHz: number): number {
  if (conductivitySPerM === Infinity) return 0;
  const wp = TWO_PI * plasmaHz;
  const area = wireConductingAreaM2(radiusM, skinDepthM(conductivitySPerM, frequencyHz));
  return (EPS0 * pitchM * pitchM * wp * wp) / (conductivitySPerM * area);
}

/** Drude ε(ω) = ε_h − ωp²/(ω(ω + iγ)) at f (Hz), with ωp from plasmaHz and γ in rad/s. */
export function drudeEps(hostEps: Complex, plasmaHz: number, gammaRadPerS: number, frequencyHz: number): Complex {
  const w = TWO_PI * frequencyHz;
  const wp2 = (TWO_PI * plasmaHz) ** 2;
  const d = w * w * w * w + gammaRadPerS * gammaRadPerS * w * w;
  return { re: hostEps.re - (wp2 * w * w) / d, im: hostEps.im + (wp2 * gammaRadPerS * w) / d };
}

export interface WireMediumInput {
  pitchM: number;
  radiusM: number;
  frequencyHz: number;
  hostEps: Complex;
  /** metal DC conductivity, S/m (Infinity: perfect conductor) */
  conductivitySPerM: number;
  /** wire lattice (default square) */
  lattice?: WireLattice;
}

export interface WireMediumResponse {
  plasma: WirePlasma;
  /** zero of Re ε in the host, ≈ ωp/sqrt(ε_h') (lossless), Hz */
  effectivePlasmaHz: number;
  gammaRadPerS: number;
  skinDepthM: number;
  /** ε along the wires at the design frequency */
  eps: Complex;
  /** fill fraction of metal πr²/a² */
  fill: number;
}

/** ε along the wires at the design frequency, with the plasma estimates and the damping. */
export function wireMediumResponse(input: WireMediumInput): WireMediumResponse {
  const { pitchM, radiusM, frequencyHz, hostEps, conductivitySPerM } = input;
  const plasma = wirePlasma(pitchM, radiusM, input.lattice ?? "square");
  const gamma = wireDampingRadPerS(pitchM, radiusM, plasma.usedHz, conductivitySPerM, frequencyHz);
  return {
    plasma,
    effectivePlasmaHz: plasma.usedHz / Math.sqrt(hostEps.re),
    gammaRadPerS: gamma,
    skinDepthM: conductivitySPerM === Infinity ? 0 : skinDepthM(conductivitySPerM, frequencyHz),
    eps: drudeEps(hostEps, plasma.usedHz, gamma, frequencyHz),
    fill: (Math.PI * radiusM * radiusM) / (input.lattice === "hex" ? (Math.sqrt(3) / 2) * pitchM * pitchM : pitchM * pitchM),
  };
}

export interface RadiusResult {
  /** wire radius, m; NaN when the target cannot be reached */
  radiusM: number;
  achieved: Complex;
  converged: boolean;
  iterations: number;
  reason?: string;
}

/** Thinnest wire searched, as a fraction of the pitch. */
export const MIN_RADIUS_RATIO = 1e-7;

/**
 * Wire radius whose Re ε at the design frequency equals targetEps (< Re ε_h). Bisection in ln r
 * over [1e-7·a, wireTableMaxRatio·a] (the solved lattice range): Re ε falls monotonically as the wires thicken
 * (ωp rises, γ falls).
 * Example: radiusForTarget(0.5, 5e-3, 10e9, {re:1,im:0}, Infinity).radiusM ≈ 8e-9 (lossless:
 * ε = 0.5 needs f_p = 7.07 GHz, a wire of a few nm in 5 mm cells by the lattice value).
 */
export function radiusForTarget(targetEps: number, pitchM: number, frequencyHz: number, hostEps: Complex, conductivitySPerM: number, lattice: WireLattice = "square"): RadiusResult {
  const reEps = (r: number): number => wireMediumResponse({ pitchM, radiusM: r, frequencyHz, hostEps, conductivitySPerM, lattice }).eps.re;
  const rLo = MIN_RADIUS_RATIO * pitchM;
  const rHi = wireTableMaxRatio(lattice) * pitchM;
  const none = (reason: string): RadiusResult => ({ radiusM: NaN, achieved: { re: NaN, im: NaN }, converged: false, iterations: 0, reason });
  if (!(targetEps < hostEps.re)) return none(`a wire medium lowers ε below the host's ${hostEps.re}; target ${targetEps} is not below it`);
  if (reEps(rLo) < targetEps) return none(`ε' = ${targetEps} needs wires thinner than ${MIN_RADIUS_RATIO}·pitch (ε' ≥ ${reEps(rLo).toPrecision(4)} is the reach at this pitch and frequency; use a smaller pitch)`);
  if (reEps(rHi) > targetEps) return none(`ε' = ${targetEps} is below the reach of wires of radius ${wireTableMaxRatio(lattice)}·pitch, the thickest solved (${reEps(rHi).toPrecision(4)}); use a larger pitch`);
  let lo = Math.log(rLo);
  let hi = Math.log(rHi);
  let k = 0;
  for (; k < 200 && hi - lo > 1e-13; k++) {
    const m = 0.5 * (lo + hi);
    if (reEps(Math.exp(m)) > targetEps) lo = m;
    else hi = m;
  }
  const r = Math.exp(0.5 * (lo + hi));
  const achieved = wireMediumResponse({ pitchM, radiusM: r, frequencyHz, hostEps, conductivitySPerM, lattice }).eps;
  return { radiusM: r, achieved, converged: Math.abs(achieved.re - targetEps) <= 1e-9 * Math.max(1, Math.abs(targetEps)), iterations: k };
}

/**
 * Band (Hz and fractional) around the design frequency where Re ε stays within ±toleranceAbs of
 * targetEps, for the wire medium of `input` (γ and the host ε held at their design-frequency values).
 * Compare with passivityBandwidthBound(targetEps, toleranceAbs).
 */
export function bandwidthWithinTolerance(input: WireMediumInput, targetEps: number, toleranceAbs: number): ToleranceBand {
  const r = wireMediumResponse(input);
  return toleranceBand((f) => drudeEps(input.hostEps, r.plasma.usedHz, r.gammaRadPerS, f).re, input.frequencyHz, targetEps, toleranceAbs);
}

export { passivityBandwidthBound } from "./passivity.js";
