/**
 * The full-wave check of a 2D device: each case (the bare hidden object, the ideal, reduced and
 * realized devices) is a Scene solved by FDFD on a ladder of grids, and each figure is extrapolated
 * to zero step with an uncertainty (richardson.ts). Pure; the command line wraps it.
 *
 * Grid: step h = λ0 / (n_max · N) for N points per wavelength in the densest material of any case
 * (n_max from the cases' index hints and the background), or finer where the device's smaller side
 * would get fewer than MIN_STEPS_ACROSS steps on the first rung (all rungs scale alike); window = device box + margin (default
 * half a background wavelength) each side, plus a PML of clamp(⌈λ_b/(2h)⌉, 10, 20) nodes. Every
 * case of a rung is solved on the same grid, so ratios such as σ/σ_bare compare like with like.
 *
 * Ladder: `resolution` alone runs one grid (no convergence evidence). Otherwise N0 follows the
 * requested accuracy (N0 = 12 at 2 %, growing as accuracy^(−1/2)), three rungs N0, √2·N0, 2·N0 are
 * solved, and while a figure's uncertainty exceeds the accuracy another rung (×√2) is added, up to
 * MAX_RUNGS and the solver's size limit. A requested grid that does not fit is refused, never
 * silently coarsened.
 */
import { SPEED_OF_LIGHT_M_PER_S as C0 } from "../core/physicalConstants.js";
import { InputError } from "../core/errors.js";
import { formatDuration } from "../core/timeEstimate.js";
import { DEFAULT_SOLVER_BYTES, formatBytes, solveCost } from "./assemble.js";
import { inPml, type FdfdGrid } from "./fdfdGrid.js";
import { addedRungs, DEFAULT_ACCURACY, gridSeconds, ladderGrids, MAX_AUTO_UNKNOWNS, MAX_RESOLUTION, MAX_RUNGS } from "./ladderGrids.js";
import { gridWavenumberAt, type Illumination } from "./illumination.js";
import { crossSections, farField, fluxBox, groundFarField, groundFluxBox, relativeDifference, type NodeBox } from "./metrics.js";
import { richardson } from "./richardson.js";
import { clampFigure, widthReading } from "./widthReading.js";
import { beamLobes, type BeamLobe } from "./beamLobes.js";
import type { Scene, ScenePolarization } from "./scene.js";
import { solveScene, type SceneSolution } from "./solve.js";

export { DEFAULT_ACCURACY, MAX_AUTO_UNKNOWNS, MAX_RESOLUTION, MAX_RUNGS, MIN_STEPS_ACROSS } from "./ladderGrids.js";
export const MIN_RESOLUTION = 6;
/** A device smaller than this fraction of the background wavelength is refused (nothing to resolve). */
export const SMALLEST_DEVICE_WAVELENGTHS = 0.01;
/** Angular samples of far-field patterns (one per degree). */
export const PATTERN_ANGLES = 360;
/** Reflected patterns above a ground plane: directions 0 … 180° in steps of 1/GROUND_STEPS_PER_DEGREE. */
export const GROUND_STEPS_PER_DEGREE = 4;
const groundAngles = new Float64Array(180 * GROUND_STEPS_PER_DEGREE).map((_, a) => ((a + 0.5) * Math.PI) / (180 * GROUND_STEPS_PER_DEGREE));

export type CaseName = "flat" | "bare" | "ideal" | "reduced" | "realized" | "realized-geometry";

export interface CaseSpec {
  name: CaseName;
  /** null: the case cannot be computed, `reason` says why */
  scene: Scene | null;
  reason?: string;
  /** largest local index of the case's material (for the grid step) */
  indexHint: number;
  /** largest grid step this case needs on the coarsest rung (drawn inclusions: smallest feature / 8); runCheck.ts solves such a case on its own ladder */
  maxStepM?: number;
  /** drawn cases: the smallest drawn feature, metres (drawnLadder.ts sizes the case's own grids from it) */
  featureM?: number;
}

export interface VerifyInput {
  polarization: ScenePolarization;
  /** relative ε, μ of the background the device sits in */
  background: { eps: number; mu: number };
  frequencyHz: number;
  /** box holding every case's scatterer, metres */
  deviceBox: { minX: number; maxX: number; minY: number; maxY: number };
  cases: CaseSpec[];
  illumination?: Illumination;
  /** a conducting ground plane y < groundYM in every case (carpet-type devices) */
  groundYM?: number;
  /** one grid at N points per wavelength (no ladder) */
  resolution?: number;
  /** largest step on the coarsest rung (finer rungs scale alike), e.g. to put enough steps across drawn inclusions */
  maxStepM?: number;
  /** relative accuracy the ladder aims at (default 2 %) */
  accuracy?: number;
  /** free space around the device on each side, metres (default half a background wavelength) */
  marginM?: number;
  /** compute the bistatic pattern of each case (radial devices) */
  pattern?: boolean;
  /** memory one solve may use, bytes (default DEFAULT_SOLVER_BYTES; the sweep gives each worker its share) */
  solverBytes?: number;
  /** where `solverBytes` comes from, for a refusal (e.g. "CELLWRIGHT_MEMORY_LIMIT less the 60 MB the command holds") */
  solverBytesSource?: string;
  onProgress?: (step: string, fraction: number) => void;
  /** told once, before the first solve: estimated seconds of the planned solves and what they are */
  onEstimate?: (seconds: number, what: string) => void;
}

export interface LadderPoint {
  resolution: number;
  stepM: number;
  scatteringWidthM: number;
  vsBare: number | null;
  deliveredPower: number | null;
}

export interface CaseResult {
  name: CaseName;
  /** false when the case could not be computed (`reason`) */
  available: boolean;
  reason: string | null;
  /** scattering width σ_s ≥ 0, metres, extrapolated to zero step (plane wave); for a beam, scattered power / peak incident intensity (widthReading.ts) */
  scatteringWidthM: number | null;
  /** absolute uncertainty of σ_s, metres (null for a single grid) */
  scatteringWidthUncertaintyM: number | null;
  /** σ_s cannot be told from zero: it is below this width, metres (null when it can; widthReading.ts) */
  scatteringWidthBelowM: number | null;
  /** relative uncertainty of the case's headline figure: σ_s's against max(σ_s, σ_bare, device width), or the delivered share's (absolute) when larger (null for a single grid) */
  uncertainty: number | null;
  /** uncertainty ≤ accuracy (null for a single grid) */
  converged: boolean | null;
  /** σ_s / σ_s(bare) ≥ 0, extrapolated (null without a bare object) */
  vsBare: number | null;
  /** absolute uncertainty of vsBare (null without one: no bare object, a single grid) */
  vsBareUncertainty: number | null;
  /** absorption width on the finest grid, metres (≈ 0 for lossless maps) */
  absorptionWidthM: number | null;
  /** optical theorem on the finest grid: (σ_ext from the forward far field − σ_s − σ_abs)/σ_s; above a ground plane (beams), (P_reflected + P_absorbed − P_incident)/P_incident */
  powerBalance: number | null;
  /** ‖u − u_ideal‖/‖u_ideal‖ outside the device box, finest grid (null for ideal and bare) */
  fieldErrorVsIdeal: number | null;
  /** beams: fraction of the outgoing power within the ideal device's output lobe; above a ground plane, the share of the incident beam's power reflected within the flat ground's specular lobe */
  deliveredPower: number | null;
  /** absolute uncertainty of deliveredPower (null without one) */
  deliveredPowerUncertainty: number | null;
  /** beams: the outgoing (above a ground plane: reflected) beam's lobes on the finest grid, beamLobes.ts; more than one when the device splits the beam (null for plane waves) */
  lobes: BeamLobe[] | null;
  /** beams: main output direction (the peak; for a split beam the lobes' power-weighted mean) minus the ideal device's, degrees; above a ground plane, the reflected beam's direction minus the specular one */
  deviationDeg: number | null;
  /** bistatic scattering width σ(φ), metres, φ = 0 … 359° from +x (when requested) */
  bistaticM: Float64Array | null;
  ladder: LadderPoint[];
  /** |u_total| per node on the finest grid (for pictures) */
  magnitude: Float64Array | null;
}

export interface VerifyResult {
  method: "fdfd";
  polarization: ScenePolarization;
  frequencyHz: number;
  /** finest grid */
  grid: FdfdGrid;
  resolutions: number[];
  accuracy: number;
  densestIndex: number;
  backgroundIndex: number;
  marginM: number;
  illumination: Illumination;
  cases: CaseResult[];
  deviceMask: Uint8Array;
  /** the ground plane's line when the scene stands on one (carpets), else null */
  groundYM: number | null;
  notes: string[];
}

/** Whether grid g fits the solver's memory (assemble.ts); the figure over its limit when not. */
export function gridFits(g: FdfdGrid, limitBytes = DEFAULT_SOLVER_BYTES): { ok: boolean; over: string } {
  const c = solveCost(g);
  if (c.megabytes * 1e6 > limitBytes) return { ok: false, over: `about ${formatBytes(c.megabytes * 1e6)} for the direct solver (limit ${formatBytes(limitBytes)})` };
  return { ok: true, over: "" };
}

interface Rung { resolution: number; g: FdfdGrid }

/** What one solve of one case on one rung yields. */
interface RunFigures {
  sol: SceneSolution;
  sigma: number;
  abs: number;
  /** extinction width from the forward far field (plane waves) */
  ext: number | null;
  /** bistatic width σ(φ) per degree */
  pattern: Float64Array | null;
  /** beams: outgoing power pattern |T_tot(φ)|², its main direction and lobes (ground scenes: reflected, over groundAngles) */
  beamPower: Float64Array | null;
  peakDeg: number | null;
  lobes: BeamLobe[] | null;
  /** ground scenes: Σ|T|² of the flat ground's reflection over groundAngles (the incident beam's power) */
  imagePower: number | null;
}

/**
 * Why a device `sizeM` across cannot be checked at a background wavelength `lambdaBM` (null: it
 * can): below SMALLEST_DEVICE_WAVELENGTHS of a wavelength the field does not see it.
 */
export function deviceScaleProblem(sizeM: number, lambdaBM: number): string | null {
  if (sizeM >= SMALLEST_DEVICE_WAVELENGTHS * lambdaBM) return null;
  return `the device is ${fmt(sizeM)} m across, ${(sizeM / lambdaBM).toPrecision(2)} of the wavelength in the background (${fmt(lambdaBM)} m): below 1/${Math.round(1 / SMALLEST_DEVICE_WAVELENGTHS)} of a wavelength a full-wave check shows nothing; check the frequency and the device size`;
}

/** Run the check (see file comment). Throws InputError for bad options, a device too small, or a grid too large. */
export function verifyDevice(input: VerifyInput): VerifyResult {
  const { polarization, background, frequencyHz, cases } = input;
  const accuracy = input.accuracy ?? DEFAULT_ACCURACY;
  if (!(accuracy >= 1e-3 && accuracy <= 0.5)) throw new InputError({ where: "--accuracy", message: `expected a relative accuracy from 0.1 % to 50 %, got ${accuracy}` });
  if (input.resolution !== undefined && !(input.resolution >= MIN_RESOLUTION && input.resolution <= MAX_RESOLUTION)) {
    throw new InputError({ where: "--resolution", message: `expected points per wavelength from ${MIN_RESOLUTION} to ${MAX_RESOLUTION}, got ${input.resolution}` });
  }
  const nb = Math.sqrt(background.eps * background.mu);
  const lambda0 = C0 / frequencyHz, lambdaB = lambda0 / nb;
  const box = input.deviceBox;
  const size = Math.max(box.maxX - box.minX, box.maxY - box.minY);
  const tooSmall = deviceScaleProblem(size, lambdaB);
  if (tooSmall !== null) throw new InputError({ where: "frequency", message: tooSmall });
  const marginM = input.marginM ?? lambdaB / 2;
  if (!(marginM >= 0 && Number.isFinite(marginM))) throw new InputError({ where: "--margin", message: `expected a length ≥ 0, got ${marginM}` });
  const ladder = ladderGrids({
    polarization, background, frequencyHz, deviceBox: box, groundYM: input.groundYM, resolution: input.resolution, accuracy, marginM, maxStepM: input.maxStepM,
    caseIndexHints: cases.filter((c) => c.scene).map((c) => c.indexHint),
  });
  const { nMax, makeGrid, wanted } = ladder;
  const solverBytes = input.solverBytes ?? DEFAULT_SOLVER_BYTES;
  const refuse = (res: number, g: FdfdGrid, over: string): never => {
    throw new InputError({
      where: input.resolution !== undefined ? "--resolution" : "--accuracy",
      message: `the grid for ${res} points per wavelength in the densest material (index ${nMax.toPrecision(3)}) is ${g.nx} × ${g.ny} nodes, step ${fmt(g.h)} m, which needs ${over}${input.solverBytesSource ? ` (${input.solverBytesSource})` : ""}; ${largestFitting(makeGrid, res, solverBytes)}`,
    });
  };
  const rungs: Rung[] = [];
  for (const res of wanted) {
    const g = makeGrid(res);
    const fit = gridFits(g, solverBytes);
    if (!fit.ok) {
      if (rungs.length >= 2) break; // two rungs still give an estimate (nominal order)
      refuse(res, g, fit.over);
    }
    rungs.push({ resolution: res, g });
  }
  const notes: string[] = [];
  const live0 = cases.filter((c) => c.scene !== null).length;
  if (input.onEstimate && live0 > 0) {
    // the planned rungs, and the finer ones the ladder may add (the same rule as below)
    let planned = 0;
    for (const r of rungs) planned += gridSeconds(r.g, live0);
    let atMost = planned, grids = rungs.length, last = rungs[rungs.length - 1].g;
    const added = input.resolution === undefined ? addedRungs(ladder, rungs[rungs.length - 1].resolution, rungs.length) : [];
    for (const r of added) { atMost += gridSeconds(r.grid, live0); grids++; last = r.grid; }
    const solves = (n: number): string => `${live0 * n} solve${live0 * n === 1 ? "" : "s"}`;
    input.onEstimate(atMost, grids > rungs.length
      ? `up to ${solves(grids)} (${live0} case${live0 === 1 ? "" : "s"} on up to ${grids} grids, the finest ${last.nx} × ${last.ny} nodes; about ${formatDuration(planned)} if the first ${rungs.length} converge)`
      : `${solves(grids)} (${live0} case${live0 === 1 ? "" : "s"} on ${grids} grid${grids === 1 ? "" : "s"}, the finest ${last.nx} × ${last.ny} nodes)`);
  }
  const ill = input.illumination ?? { kind: "plane", angleRad: 0 };
  const k0 = (2 * Math.PI * frequencyHz) / C0;
  const kb = k0 * nb;
  const angles = new Float64Array(PATTERN_ANGLES).map((_, a) => (2 * Math.PI * a) / PATTERN_ANGLES);
  const live = cases.filter((c) => c.scene !== null);
  // per rung, per live case
  const per: RunFigures[][] = [];
  let total = rungs.length * live.length, done = 0;
  const solveRung = (r: Rung): void => {
    const row: RunFigures[] = [];
    let boxN: NodeBox | null = null;
    for (const c of live) {
      const frac0 = done / total;
      const sol = solveScene(c.scene!, r.g, k0, { illumination: ill, groundYM: input.groundYM, onProgress: (f) => input.onProgress?.(`${c.name} at ${r.resolution} points per wavelength`, frac0 + f / total) });
      done++;
      boxN ??= input.groundYM === undefined ? fluxBox(sol) : groundFluxBox(sol, input.groundYM);
      if (!boxN) throw new InputError({ where: "--margin", message: "no room between the device and the PML for the power contour; give a larger margin" });
      const cs = crossSections(sol, boxN);
      let pattern: Float64Array | null = null, ext: number | null = null, beamPower: Float64Array | null = null, peakDeg: number | null = null, imagePower: number | null = null, lobes: BeamLobe[] | null = null;
      if (input.groundYM !== undefined && ill.kind === "beam") {
        const gk = (phi: number): number => gridWavenumberAt(kb, r.g.h, phi);
        const ff = groundFarField(sol, boxN, input.groundYM, polarization === "Ez" ? -1 : 1, groundAngles, gk);
        const lobe = reflectedLobe(sol, ff, groundAngles, gk, input.groundYM);
        peakDeg = lobe.peakDeg; beamPower = lobe.totalPower; imagePower = lobe.imagePower; lobes = lobe.lobes;
      } else if (input.groundYM === undefined) {
        const gk = (phi: number): number => gridWavenumberAt(kb, r.g.h, phi);
        const ff = farField(sol, boxN, angles, gk);
        pattern = new Float64Array(PATTERN_ANGLES);
        for (let a = 0; a < PATTERN_ANGLES; a++) pattern[a] = (4 / kb) * (ff.re[a] ** 2 + ff.im[a] ** 2);
        if (ill.kind === "plane") {
          // forward amplitude at the incidence angle (interpolated between whole degrees)
          const t = forwardAmplitude(sol, boxN, ill.angleRad, gk);
          ext = -(4 / kb) * t;
        } else {
          const lobe = beamLobe(sol, ff, angles, kb);
          peakDeg = lobe.peakDeg; beamPower = lobe.totalPower; lobes = lobe.lobes;
        }
      }
      row.push({ sol, sigma: cs.scatteringM, abs: cs.absorptionM, ext, pattern, beamPower, peakDeg, imagePower, lobes });
    }
    per.push(row);
  };
  for (const r of rungs) solveRung(r);
  const extrapolate = (): CaseResult[] => buildResults(input, live, cases, rungs, per, accuracy, ill);
  let results = extrapolate();
  while (input.resolution === undefined && rungs.length < MAX_RUNGS && results.some((c) => c.available && c.converged === false)) {
    const res = Math.round(rungs[rungs.length - 1].resolution * Math.SQRT2);
    if (res > MAX_RESOLUTION) break;
    const g = makeGrid(res);
    if (!gridFits(g, solverBytes).ok || g.nx * g.ny > MAX_AUTO_UNKNOWNS) { notes.push(`a finer rung (${res} points per wavelength, ${g.nx} × ${g.ny} nodes) is beyond what the ladder adds on its own; it stops at ${rungs[rungs.length - 1].resolution}`); break; }
    const r = { resolution: res, g };
    rungs.push(r);
    total += live.length;
    solveRung(r);
    results = extrapolate();
  }
  input.onProgress?.("metrics", 1);
  const finest = per[per.length - 1];
  const n = rungs[rungs.length - 1].g.nx * rungs[rungs.length - 1].g.ny;
  const deviceMask = new Uint8Array(n);
  for (const r of finest) for (let k = 0; k < n; k++) if (r.sol.coefficients.deviceNode[k]) deviceMask[k] = 1;
  if (input.resolution !== undefined) notes.push("single grid (--resolution): no convergence ladder, figures carry no uncertainty");
  return {
    method: "fdfd", polarization, frequencyHz, grid: rungs[rungs.length - 1].g, resolutions: rungs.map((r) => r.resolution), accuracy,
    densestIndex: nMax, backgroundIndex: nb, marginM, illumination: ill, cases: results, deviceMask, groundYM: input.groundYM ?? null, notes,
  };
}

const fmt = (v: number): string => Number(v.toPrecision(3)).toString();

/** The largest resolution below `res` whose grid fits (memory grows about like N² log N in the resolution N, so start from that guess). */
function largestFitting(makeGrid: (res: number) => FdfdGrid, res: number, limitBytes: number): string {
  const need = solveCost(makeGrid(res)).megabytes * 1e6;
  let r = Math.floor(res * Math.sqrt(limitBytes / need));
  for (let tries = 0; tries < 12 && r >= MIN_RESOLUTION; tries++, r = Math.floor(r * 0.93)) {
    if (gridFits(makeGrid(r), limitBytes).ok) return `the largest resolution that fits is about ${r} points per wavelength (or give a smaller --margin)`;
  }
  return `even ${MIN_RESOLUTION} points per wavelength do not fit: the device and its margin are too large for the 2D check in this memory (give a smaller --margin, or more memory)`;
}

/** Re T(φ_inc): the real part of the forward far-field amplitude, for the optical theorem. */
function forwardAmplitude(sol: SceneSolution, box: NodeBox, angle: number, gk: (phi: number) => number): number {
  const ff = farField(sol, box, Float64Array.of(angle), gk);
  return ff.re[0];
}

/**
 * Beam far field: total outgoing amplitude T_tot(φ) = T_inc(φ) + T_s(φ), where a beam made of plane
 * waves of density a(θ) has T_inc(φ) = π a(φ) e^{−i k r̂·r0} in the normalization of farField.
 * Returns the power pattern |T_tot|², its lobes and main direction (beamLobes.ts).
 */
function beamLobe(sol: SceneSolution, ff: { re: Float64Array; im: Float64Array }, angles: Float64Array, kb: number): { peakDeg: number; totalPower: Float64Array; lobes: BeamLobe[] } {
  const comp = sol.incidentComponents!;
  const ill = sol.illumination as Extract<Illumination, { kind: "beam" }>;
  const m = comp.angleRad.length, d = (comp.angleRad[m - 1] - comp.angleRad[0]) / (m - 1);
  const tot = new Float64Array(angles.length);
  for (let a = 0; a < angles.length; a++) {
    // density a(φ) by linear interpolation of the components (weights / Δθ)
    let rel = (angles[a] - comp.angleRad[0]) % (2 * Math.PI);
    if (rel < 0) rel += 2 * Math.PI;
    const x = rel / d;
    let dens = 0;
    if (x <= m - 1) { const q = Math.floor(x), f = x - q; dens = ((q < m ? comp.re[q] : 0) * (1 - f) + (q + 1 < m ? comp.re[q + 1] : 0) * f) / d; }
    const ph = -kb * (Math.cos(angles[a]) * ill.focusM[0] + Math.sin(angles[a]) * ill.focusM[1]);
    const iRe = Math.PI * dens * Math.cos(ph), iIm = Math.PI * dens * Math.sin(ph);
    const re = iRe + ff.re[a], im = iIm + ff.im[a];
    tot[a] = re * re + im * im;
  }
  const read = beamLobes(tot, 0, 360 / angles.length, true);
  return { peakDeg: read.mainDeg, totalPower: tot, lobes: read.lobes };
}

/**
 * Reflected beam above a ground plane: T_refl(φ) = T_img(φ) + T_s(φ) for 0 < φ < π, where the flat
 * ground's reflection is the image beam (illumination.ts: components at −θ with weight s·a(θ),
 * focus mirrored to (x_f, 2y_g − y_f)), so T_img(φ) = π·s·a(−φ)·e^{−iK r̂·r_img} in the normalization
 * of farField (as beamLobe). Returns |T_refl|² per angle, its peak direction (degrees), and
 * Σ|T_img|² (the flat ground's reflected power: the incident beam's power, the reference of the
 * specular fraction).
 */
function reflectedLobe(sol: SceneSolution, ff: { re: Float64Array; im: Float64Array }, angles: Float64Array, gk: (phi: number) => number, groundYM: number): { peakDeg: number; totalPower: Float64Array; imagePower: number; lobes: BeamLobe[] } {
  const comp = sol.incidentComponents!;
  const ill = sol.illumination as Extract<Illumination, { kind: "beam" }>;
  const sign = sol.scene.polarization === "Ez" ? -1 : 1;
  const m = comp.angleRad.length, d = (comp.angleRad[m - 1] - comp.angleRad[0]) / (m - 1);
  const fx = ill.focusM[0], fy = 2 * groundYM - ill.focusM[1];
  const tot = new Float64Array(angles.length);
  let image = 0;
  for (let a = 0; a < angles.length; a++) {
    const x = (-angles[a] - comp.angleRad[0]) / d;
    let dens = 0;
    if (x >= 0 && x <= m - 1) { const q = Math.floor(x), f = x - q; dens = (comp.re[q] * (1 - f) + (q + 1 < m ? comp.re[q + 1] : 0) * f) / d; }
    const ph = -gk(angles[a]) * (Math.cos(angles[a]) * fx + Math.sin(angles[a]) * fy);
    const iRe = sign * Math.PI * dens * Math.cos(ph), iIm = sign * Math.PI * dens * Math.sin(ph);
    image += iRe * iRe + iIm * iIm;
    const re = iRe + ff.re[a], im = iIm + ff.im[a];
    tot[a] = re * re + im * im;
  }
  const read = beamLobes(tot, (angles[0] * 180) / Math.PI, ((angles[1] - angles[0]) * 180) / Math.PI, false);
  return { peakDeg: read.mainDeg, totalPower: tot, imagePower: image, lobes: read.lobes };
}

/**
 * Power balance above a ground plane (beams): (P_reflected + P_absorbed − P_incident) / P_incident,
 * with the far-field powers as widths (2/(πk))·Σ|T|²·Δφ — the normalization in which the flux
 * figures are widths (σ = (1/2π)∫(4/k)|T|²dφ) — and P_absorbed the absorption width from the flux.
 * Zero up to discretization when the far-field transformation, the image beam and the flux agree.
 */
function groundPowerBalance(f: RunFigures, kb: number): number | null {
  if (!f.beamPower || f.imagePower === null || !(f.imagePower > 0)) return null;
  const dphi = groundAngles[1] - groundAngles[0];
  let refl = 0;
  for (let a = 0; a < f.beamPower.length; a++) refl += f.beamPower[a];
  const toWidth = (2 / (Math.PI * kb)) * dphi;
  const inc = f.imagePower * toWidth;
  return (refl * toWidth + f.abs - inc) / inc;
}

/** Share of the incident power reflected within ±halfDeg of centreDeg (reflected pattern over `angles`). */
function specularFraction(tot: Float64Array, angles: Float64Array, imagePower: number, centreDeg: number, halfDeg: number): number {
  let inside = 0;
  for (let a = 0; a < tot.length; a++) if (Math.abs((angles[a] * 180) / Math.PI - centreDeg) <= halfDeg) inside += tot[a];
  return imagePower > 0 ? inside / imagePower : 0;
}

/** Half-width of the output lobe counted as delivered: 1.5 × the beam's far-field 1/e² half-angle 2/(k w0), at least 3°. */
function lobeHalfWidthDeg(ill: Illumination, kb: number): number {
  if (ill.kind !== "beam") return 0;
  return Math.max(3, (1.5 * 2 * 180) / (Math.PI * kb * ill.waistM));
}

function deliveredFraction(tot: Float64Array, centreDeg: number, halfDeg: number): number {
  let inside = 0, all = 0;
  for (let a = 0; a < tot.length; a++) {
    const deg = (a * 360) / tot.length;
    let dd = Math.abs(deg - centreDeg) % 360;
    if (dd > 180) dd = 360 - dd;
    all += tot[a];
    if (dd <= halfDeg) inside += tot[a];
  }
  return all > 0 ? inside / all : 0;
}

function buildResults(
  input: VerifyInput, live: CaseSpec[], cases: CaseSpec[], rungs: Rung[],
  per: RunFigures[][],
  accuracy: number, ill: Illumination,
): CaseResult[] {
  const hs = rungs.map((r) => r.g.h);
  const bareIdx = live.findIndex((c) => c.name === "bare");
  const idealIdx = live.findIndex((c) => c.name === "ideal");
  const kb = (2 * Math.PI * input.frequencyHz / C0) * Math.sqrt(input.background.eps * input.background.mu);
  // beams: the intended output direction is where the ideal device sends the beam, per rung
  const half = lobeHalfWidthDeg(ill, kb);
  const ground = input.groundYM !== undefined;
  const intended: (number | null)[] = per.map((row) => {
    if (ill.kind !== "beam") return null;
    if (ground) return -(ill.angleRad * 180) / Math.PI; // the flat ground's specular direction
    const ref = idealIdx >= 0 ? row[idealIdx] : null;
    return ref?.peakDeg ?? (ill.angleRad * 180) / Math.PI;
  });
  const bareX = bareIdx >= 0 ? richardson(hs, per.map((row) => row[bareIdx].sigma)) : null;
  const finest = per[per.length - 1];
  const g = rungs[rungs.length - 1].g;
  const deviceWidthM = Math.max(input.deviceBox.maxX - input.deviceBox.minX, input.deviceBox.maxY - input.deviceBox.minY);
  const obs = outsideMask(g, input.deviceBox);
  const out: CaseResult[] = [];
  for (const spec of cases) {
    const li = live.indexOf(spec);
    if (li < 0) {
      out.push({ name: spec.name, available: false, reason: spec.reason ?? "not computed", scatteringWidthM: null, scatteringWidthUncertaintyM: null, scatteringWidthBelowM: null, uncertainty: null, converged: null, vsBare: null, vsBareUncertainty: null, absorptionWidthM: null, powerBalance: null, fieldErrorVsIdeal: null, deliveredPower: null, deliveredPowerUncertainty: null, lobes: null, deviationDeg: null, bistaticM: null, ladder: [], magnitude: null });
      continue;
    }
    const ladder: LadderPoint[] = per.map((row, k) => {
      const r = row[li];
      const tot = r.beamPower;
      return {
        resolution: rungs[k].resolution, stepM: rungs[k].g.h, scatteringWidthM: r.sigma,
        vsBare: bareIdx >= 0 && row[bareIdx].sigma > 0 ? r.sigma / row[bareIdx].sigma : null,
        deliveredPower: tot && intended[k] !== null
          ? (ground ? specularFraction(tot, groundAngles, r.imagePower ?? 0, intended[k]!, half) : deliveredFraction(tot, intended[k]!, half))
          : null,
      };
    });
    const sx = richardson(hs, ladder.map((p) => p.scatteringWidthM));
    const vx = bareIdx >= 0 ? richardson(hs, ladder.map((p) => p.vsBare ?? 0)) : null;
    const dx = ill.kind === "beam" && ladder.every((p) => p.deliveredPower !== null) ? richardson(hs, ladder.map((p) => p.deliveredPower ?? 0)) : null;
    // σ ≥ 0, its uncertainty relative to max(σ, σ_bare, device width) (widthReading.ts); delivered power is a fraction (absolute)
    const width = widthReading(sx.value, sx.uncertainty, { referenceM: bareX ? bareX.value : null, deviceWidthM });
    const ratio = vx ? clampFigure(vx.value, vx.uncertainty, 0) : null;
    const share = dx ? clampFigure(dx.value, dx.uncertainty, 0, 1) : null;
    let unc = width.relative;
    if (unc !== null && share && share.uncertainty !== null) unc = Math.max(unc, share.uncertainty);
    const f = finest[li];
    const mag = new Float64Array(f.sol.totalRe.length);
    for (let k = 0; k < mag.length; k++) mag[k] = Math.hypot(f.sol.totalRe[k], f.sol.totalIm[k]);
    const ideal = idealIdx >= 0 ? finest[idealIdx] : null;
    let deviation: number | null = null;
    if (ill.kind === "beam" && f.peakDeg !== null && intended[intended.length - 1] !== null) {
      deviation = f.peakDeg - intended[intended.length - 1]!;
      if (deviation > 180) deviation -= 360;
      if (deviation < -180) deviation += 360;
    }
    out.push({
      name: spec.name, available: true, reason: null,
      scatteringWidthM: width.valueM,
      scatteringWidthUncertaintyM: width.uncertaintyM,
      scatteringWidthBelowM: width.belowM,
      uncertainty: unc,
      converged: unc === null ? null : unc <= accuracy,
      vsBare: ratio ? ratio.value : null,
      vsBareUncertainty: ratio ? ratio.uncertainty : null,
      absorptionWidthM: f.abs,
      powerBalance: ground ? groundPowerBalance(f, kb) : f.ext !== null && f.sigma > 0 ? (f.ext - f.sigma - f.abs) / f.sigma : null,
      fieldErrorVsIdeal: ideal && spec.name !== "ideal" && spec.name !== "bare" && spec.name !== "flat" ? relativeDifference(f.sol.totalRe, f.sol.totalIm, ideal.sol.totalRe, ideal.sol.totalIm, obs) : null,
      deliveredPower: share ? share.value : null,
      deliveredPowerUncertainty: share ? share.uncertainty : null,
      lobes: ill.kind === "beam" ? f.lobes : null,
      deviationDeg: deviation,
      bistaticM: input.pattern && ill.kind === "plane" ? f.pattern : null,
      ladder,
      magnitude: mag,
    });
  }
  return out;
}

/** Nodes outside the PML and at least two steps outside the device box (where a user would observe). */
function outsideMask(g: FdfdGrid, box: { minX: number; maxX: number; minY: number; maxY: number }): Uint8Array {
  const m = new Uint8Array(g.nx * g.ny);
  const pad = 2 * g.h;
  for (let j = 0; j < g.ny; j++) {
    for (let i = 0; i < g.nx; i++) {
      if (inPml(g, i, j)) continue;
      const x = g.x0 + i * g.h, y = g.y0 + j * g.h;
      if (x > box.minX - pad && x < box.maxX + pad && y > box.minY - pad && y < box.maxY + pad) continue;
      m[i + g.nx * j] = 1;
    }
  }
  return m;
}
