/**
 * Printed (PCB-etched) edge-coupled split-ring resonator: two concentric copper strips of width c,
 * separated by d, each split once on opposite sides, etched on one face of a dielectric board.
 * Quasi-static LC circuit (Marqués, Medina, Rafii-El-Idrissi, "Role of bianisotropy in negative
 * permeability and left-handed metamaterials", Phys. Rev. B 65, 144440 (2002); Baena et al.,
 * "Equivalent-circuit models for split-ring resonators and complementary split-ring resonators
 * coupled to planar transmission lines", IEEE Trans. Microw. Theory Tech. 53, 1451 (2005)):
 *   ω0 = 1/sqrt(L_s C_s),   C_s = C0/4,   C0 = 2π r0 C_pul,   r0 = r_in + c + d/2 (mean radius)
 * C0 is the whole capacitance between the rings; the splits cut it into two halves C0/2 in series.
 * C_pul is the per-unit-length capacitance of two coplanar strips (below); L_s the inductance of
 * one ring of radius r0 and width c. The splits' own (gap) capacitance is neglected (the model's
 * assumption; fair when the split is no narrower than d and c, d ≪ r0).
 *
 * Geometry convention, shared with the split-cylinder style: ringRadiusM is the inner radius of the
 * inner ring, the outer ring's outer radius is r_in + 2c + d, ringGapM is the strip separation d.
 */
import { ellipticKRatio } from "../core/ellipticK.js";
import { EPS0, MU0 } from "./physicalConstants.js";
import { skinDepthM, stripEffectiveThicknessM } from "./skinDepth.js";

const TWO_PI = 2 * Math.PI;

export interface PrintedRingGeometry {
  /** cell side a (in the board plane), m */
  pitchM: number;
  /** inner radius of the inner ring, m */
  ringRadiusM: number;
  /** strip width c of each ring, m */
  ringWidthM: number;
  /** separation d between the two strips, m */
  ringGapM: number;
  /** spacing l of the boards (ring planes), m (default: the pitch) */
  stackSpacingM?: number;
  /** copper thickness, m (default: thick compared with the skin depth) */
  metalThicknessM?: number;
  /** board thickness, m (default: a thick board, ε_eff = (ε+1)/2) */
  boardThicknessM?: number;
}

/** r0 = r_in + c + d/2, the mean radius (middle of the slot between the rings), m. */
export const printedMeanRadiusM = (g: PrintedRingGeometry): number => g.ringRadiusM + g.ringWidthM + 0.5 * g.ringGapM;
/** r_in + 2c + d, the outer radius of the outer ring, m. */
export const printedOuterRadiusM = (g: PrintedRingGeometry): number => g.ringRadiusM + 2 * g.ringWidthM + g.ringGapM;

/**
 * Per-unit-length capacitance (F/m) of two coplanar strips of width w separated by s:
 *   C_pul = ε₀ ε_eff K(k')/K(k),   k = s/(s + 2w)
 * (Gupta, Garg, Bahl, Bhartia, "Microstrip Lines and Slotlines", 2nd ed. 1996, ch. 7, coplanar
 * strips by conformal mapping; zero-thickness strips). Narrow gap: ≈ ε₀ε_eff(2/π)ln(4(s+2w)/s).
 * Example: w = s(√2 − 1)/2 makes k = 1/√2, where K(k') = K(k) and C_pul = ε₀ε_eff exactly.
 */
export function coplanarStripsCapacitancePerM(stripWidthM: number, separationM: number, epsEff: number): number {
  const k = separationM / (separationM + 2 * stripWidthM);
  return EPS0 * epsEff * ellipticKRatio(k);
}

/**
 * Filling factor q of coplanar strips on one face of a board, ε_eff = 1 + q(ε_sub − 1).
 * Thick board (h omitted or ∞): q = 1/2, half the field in the board — the common-practice value.
 * Board of thickness h (Gupta et al. 1996, ch. 7, coplanar strips on a finite substrate — from memory):
 *   q = ½ · K(k₁)K(k')/(K(k₁')K(k)),   k₁ = sinh(πs/4h)/sinh(π(s + 2w)/4h)
 * which tends to ½ as h → ∞ and to 0 as h → 0.
 */
export function coplanarStripsFillingFactor(stripWidthM: number, separationM: number, boardThicknessM?: number): number {
  if (boardThicknessM === undefined || boardThicknessM === Infinity) return 0.5;
  const k = separationM / (separationM + 2 * stripWidthM);
  const x = Math.PI / (4 * boardThicknessM);
  // k₁ = sinh(xs)/sinh(x(s+2w)); for large arguments use the exponential form to avoid overflow
  const a = x * separationM, b = x * (separationM + 2 * stripWidthM);
  const k1 = b > 300 ? Math.exp(a - b) * (1 - Math.exp(-2 * a)) / (1 - Math.exp(-2 * b)) : Math.sinh(a) / Math.sinh(b);
  return (0.5 * ellipticKRatio(k)) / ellipticKRatio(k1);
}

/** ε_eff = 1 + q(ε_sub − 1) of coplanar strips on a board (see coplanarStripsFillingFactor). */
export function coplanarStripsEffectivePermittivity(epsSub: number, stripWidthM: number, separationM: number, boardThicknessM?: number): number {
  return 1 + coplanarStripsFillingFactor(stripWidthM, separationM, boardThicknessM) * (epsSub - 1);
}

/**
 * Inductance (H) of one flat ring of mean radius r0 and strip width c:
 *   L = μ₀ r0 (ln(8r0/b) − 2),   b = c/4
 * The first part is the high-frequency (surface-current) inductance of a circular loop of round
 * wire of radius b (Grover, "Inductance Calculations", 1946; Terman, "Radio Engineers' Handbook",
 * 1943 — from memory); b = c/4 is the equivalent radius of a thin flat strip of width c (the
 * logarithmic capacity of a segment is a quarter of its length: Pólya & Szegő, 1951 — from
 * memory). Valid for c ≪ r0; NaN when ln(32r0/c) ≤ 2 (a strip too wide for a ring).
 */
export function ringInductanceH(meanRadiusM: number, stripWidthM: number): number {
  const lg = Math.log((32 * meanRadiusM) / stripWidthM) - 2;
  return lg > 0 ? MU0 * meanRadiusM * lg : NaN;
}

/**
 * The other standard inductance of a flat ring of mean radius r0 and strip width c:
 *   L = μ₀ r0 (ln(8r0/c) − 1/2)
 * as used in the printed split-ring circuit models (Marqués, Medina, Rafii-El-Idrissi, Phys. Rev. B
 * 65, 144440 (2002); Baena et al., IEEE Trans. Microw. Theory Tech. 53, 1451 (2005) — from memory).
 * It exceeds ringInductanceH by μ₀r0(2 − ln 4 − 1/2) = 0.114·μ₀r0 (about 4 % for r0/c near 5),
 * which moves the resonance by about 2 % and μ' near resonance by up to ~10 %. Neither has a better
 * claim for a printed strip, so the planner carries the difference as the model's uncertainty
 * (ringModelSpread in splitRing.ts). NaN when ln(8r0/c) ≤ 1/2.
 */
export function flatRingInductanceH(meanRadiusM: number, stripWidthM: number): number {
  const lg = Math.log((8 * meanRadiusM) / stripWidthM) - 0.5;
  return lg > 0 ? MU0 * meanRadiusM * lg : NaN;
}

/** Which ring inductance a circuit uses: `loop` (ringInductanceH, the working value) or `strip` (flatRingInductanceH). */
export type RingInductanceModel = "loop" | "strip";

export interface PrintedRingCircuit {
  meanRadiusM: number;
  /** ε_eff of the strip pair */
  effectivePermittivity: number;
  /** C_pul, F/m */
  capacitancePerLengthFPerM: number;
  /** C_s = C0/4 = π r0 C_pul / 2, F */
  capacitanceF: number;
  /** L_s, H */
  inductanceH: number;
  /** f0 = 1/(2π sqrt(L_s C_s)), Hz */
  resonanceHz: number;
  /** Lorentz strength F = μ₀π²r0⁴/(a² l L_s) (see printedRingStrength) */
  strength: number;
}

/**
 * Magnetic strength F of a lattice of rings (one per a × a × l cell), the F in
 * μ = 1 − Fω²/(ω² − ω0² + iΓω):  F = μ₀ π² r0⁴ / (a² l L_s).
 * From the ring's magnetic polarizability α = μ₀²π²r0⁴/L_s · ω²/(ω0² − ω²) (Marqués et al. 2002,
 * eq. for α_zz^mm — form from memory) times the ring density 1/(a²l), without the local-field
 * correction. For a tight stack (L_s → μ₀πr0²/l, a solenoid) it becomes Pendry's area fraction
 * πr0²/a² (Pendry et al. 1999); isolated printed rings have a larger L_s and so a smaller F.
 */
export function printedRingStrength(meanRadiusM: number, pitchM: number, stackSpacingM: number, inductanceH: number): number {
  return (MU0 * Math.PI * Math.PI * meanRadiusM ** 4) / (pitchM * pitchM * stackSpacingM * inductanceH);
}

/** The LC circuit of a printed ring on a board of relative permittivity epsSub (real part). */
export function printedRingCircuit(g: PrintedRingGeometry, epsSub: number, inductance: RingInductanceModel = "loop"): PrintedRingCircuit {
  const r0 = printedMeanRadiusM(g);
  const epsEff = coplanarStripsEffectivePermittivity(epsSub, g.ringWidthM, g.ringGapM, g.boardThicknessM);
  const cPul = coplanarStripsCapacitancePerM(g.ringWidthM, g.ringGapM, epsEff);
  const cs = (TWO_PI * r0 * cPul) / 4;
  const l = inductance === "loop" ? ringInductanceH(r0, g.ringWidthM) : flatRingInductanceH(r0, g.ringWidthM);
  return {
    meanRadiusM: r0,
    effectivePermittivity: epsEff,
    capacitancePerLengthFPerM: cPul,
    capacitanceF: cs,
    inductanceH: l,
    resonanceHz: 1 / (TWO_PI * Math.sqrt(l * cs)),
    strength: printedRingStrength(r0, g.pitchM, g.stackSpacingM ?? g.pitchM, l),
  };
}

/**
 * Ring resistance (Ω) seen by the circulating current: R = (2/3)·2πr0/(σ c t_eff).
 * Each ring carries a current that falls linearly from I to 0 towards its split while the other
 * ring carries the rest (Marqués et al. 2002, the model's current distribution), so the mean of
 * I₁² + I₂² is (2/3)I² (derived). t_eff: the copper thickness capped at two skin depths (both
 * faces; common practice). Current crowding at the strip edges is ignored (underestimates R).
 */
export function printedRingResistanceOhm(g: PrintedRingGeometry, conductivitySPerM: number, frequencyHz: number): number {
  if (conductivitySPerM === Infinity) return 0;
  const tEff = stripEffectiveThicknessM(g.metalThicknessM, skinDepthM(conductivitySPerM, frequencyHz));
  return ((2 / 3) * TWO_PI * printedMeanRadiusM(g)) / (conductivitySPerM * g.ringWidthM * tEff);
}

/**
 * Damping Γ (rad/s) of the Lorentz form: Γ = R/L_s + ω0·tanδ_eff.
 * Metal: series resistance over inductance. Board: a lossy capacitor has Q = 1/tanδ at resonance,
 * which adds ω0 tanδ_eff (series-RLC algebra); tanδ_eff = q ε''_sub / ε_eff with q the filling
 * factor (only the board share of the field is lossy). Evaluated at the design frequency and
 * held fixed over the band (the copper's √f change is neglected).
 */
export function printedRingDampingRadPerS(g: PrintedRingGeometry, circuit: PrintedRingCircuit, conductivitySPerM: number, frequencyHz: number, epsSubIm = 0): number {
  const metal = printedRingResistanceOhm(g, conductivitySPerM, frequencyHz) / circuit.inductanceH;
  const q = coplanarStripsFillingFactor(g.ringWidthM, g.ringGapM, g.boardThicknessM);
  const tanEff = Math.max(0, (q * epsSubIm) / circuit.effectivePermittivity);
  return metal + TWO_PI * circuit.resonanceHz * tanEff;
}

/**
 * Default strip width, separation and wall for a pitch a: the process's minimum (not below a/50)
 * when one is given — the narrowest makeable strips give the lowest resonance — else a/25 (ours).
 */
export const printedDefaultSizeM = (pitchM: number, processMinM?: number): number =>
  processMinM !== undefined && processMinM > 0 ? Math.max(processMinM, pitchM / 50) : pitchM / 25;
