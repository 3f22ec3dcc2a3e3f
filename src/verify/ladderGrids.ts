/**
 * The grids of the full-wave check's ladder, before anything is solved: the step for N points per
 * wavelength in the densest material of any case (or finer, so the coarsest rung puts
 * MIN_STEPS_ACROSS steps across the device's smaller side; every rung scales alike), the window
 * (device box + margin) and the PML, the resolutions the ladder starts with, and the worst grid
 * the ladder may add on its own. verifyDevice.ts solves on these grids; the frequency sweep
 * (sweep/sweepConcurrency.ts) sizes its worker pool from them, so both read one definition.
 */
import { SPEED_OF_LIGHT_M_PER_S as C0 } from "../core/physicalConstants.js";
import { solveSeconds } from "../core/timeEstimate.js";
import { DEFAULT_SOLVER_BYTES, solveCost } from "./assemble.js";
import { gridForWindow, type FdfdGrid } from "./fdfdGrid.js";
import type { ScenePolarization } from "./scene.js";

/** Steps across the device's smaller side on the coarsest rung (a small device is resolved by its size, not only by the wavelength). */
export const MIN_STEPS_ACROSS = 16;
export const MAX_RESOLUTION = 200;
export const MAX_RUNGS = 5;
/** Largest grid the ladder adds on its own to reach the accuracy (a requested grid may be larger, up to the memory limit). */
export const MAX_AUTO_UNKNOWNS = 1.2e6;
/** Accuracy the default ladder aims at (2 %). */
export const DEFAULT_ACCURACY = 0.02;

/** First rung of the ladder for a relative accuracy: N0 = 12 at 2 %, growing as accuracy^(−1/2), within [8, 48]. */
export function ladderStart(accuracy: number): number {
  return Math.min(48, Math.max(8, Math.round(12 * Math.sqrt(DEFAULT_ACCURACY / accuracy))));
}

export interface LadderGridInput {
  polarization: ScenePolarization;
  background: { eps: number; mu: number };
  frequencyHz: number;
  deviceBox: { minX: number; maxX: number; minY: number; maxY: number };
  /** largest local index of the cases that have a scene */
  caseIndexHints: readonly number[];
  groundYM?: number;
  /** one grid at N points per wavelength (no ladder) */
  resolution?: number;
  accuracy: number;
  marginM: number;
  /** largest step on the coarsest rung (finer rungs scale alike): drawn inclusions need it */
  maxStepM?: number;
}

export interface LadderGrids {
  /** densest index over the background and the cases */
  nMax: number;
  /** the grid for N points per wavelength in the densest material */
  makeGrid: (res: number) => FdfdGrid;
  /** resolutions solved before any rung is added */
  wanted: number[];
}

/** The ladder's grids (see file comment). */
export function ladderGrids(input: LadderGridInput): LadderGrids {
  const { polarization, background, frequencyHz, marginM } = input;
  const box = input.deviceBox;
  const nb = Math.sqrt(background.eps * background.mu);
  const lambda0 = C0 / frequencyHz, lambdaB = lambda0 / nb;
  let nMax = nb;
  for (const hint of input.caseIndexHints) nMax = Math.max(nMax, hint);
  const baseRes = input.resolution ?? ladderStart(input.accuracy);
  const across = Math.min(box.maxX - box.minX, box.maxY - box.minY);
  const makeGrid = (res: number): FdfdGrid => {
    const h = Math.min(lambda0 / (nMax * res), (across / MIN_STEPS_ACROSS) * (baseRes / res), (input.maxStepM ?? Infinity) * (baseRes / res));
    const pml = Math.min(20, Math.max(10, Math.ceil(lambdaB / (2 * h))));
    // above a ground plane the window stops two steps below it (everything lower is conductor)
    const minY = input.groundYM !== undefined ? Math.max(box.minY - marginM, input.groundYM - 2 * h) : box.minY - marginM;
    const g = gridForWindow({ minX: box.minX - marginM, maxX: box.maxX + marginM, minY, maxY: box.maxY + marginM }, h, pml);
    if (input.groundYM !== undefined) {
      // the ground plane on a row of nodes (Ez) or of faces (Hz): the flat ground's reflection is then grid-exact
      const shift = polarization === "Ez" ? 0 : 0.5;
      const j = Math.round((input.groundYM - g.y0) / h - shift);
      g.y0 = input.groundYM - (j + shift) * h;
    }
    return g;
  };
  const n0 = baseRes;
  const wanted = input.resolution !== undefined ? [input.resolution] : [n0, Math.round(n0 * Math.SQRT2), 2 * n0];
  return { nMax, makeGrid, wanted };
}

/**
 * The rungs the ladder may add on its own after the rung at `fromRes` when `have` rungs are solved:
 * ×√2 each, up to MAX_RUNGS, MAX_RESOLUTION, MAX_AUTO_UNKNOWNS and `limitBytes` (verifyDevice.ts
 * adds them while a figure is not converged).
 */
export function addedRungs(l: LadderGrids, fromRes: number, have: number, limitBytes = DEFAULT_SOLVER_BYTES): { resolution: number; grid: FdfdGrid }[] {
  const out: { resolution: number; grid: FdfdGrid }[] = [];
  let res = fromRes;
  for (let rungs = have; rungs < MAX_RUNGS; rungs++) {
    res = Math.round(res * Math.SQRT2);
    if (res > MAX_RESOLUTION) break;
    const grid = l.makeGrid(res);
    if (solveCost(grid).megabytes * 1e6 > limitBytes || grid.nx * grid.ny > MAX_AUTO_UNKNOWNS) break;
    out.push({ resolution: res, grid });
  }
  return out;
}

/** Estimated CPU seconds of `cases` solves on grid g (one idle core; core/timeEstimate.ts rates). */
export function gridSeconds(g: FdfdGrid, cases: number): number {
  const c = solveCost(g);
  return cases * solveSeconds(c.work, c.unknowns);
}

/**
 * Estimated CPU seconds of one check of `cases` cases on the ladder: `planned` for the wanted rungs,
 * `atMost` with the rungs the ladder may add (none on a single grid).
 */
export function ladderSeconds(l: LadderGrids, cases: number, limitBytes = DEFAULT_SOLVER_BYTES): { planned: number; atMost: number } {
  let planned = 0;
  for (const res of l.wanted) planned += gridSeconds(l.makeGrid(res), cases);
  let atMost = planned;
  if (l.wanted.length >= 2) for (const r of addedRungs(l, l.wanted[l.wanted.length - 1], l.wanted.length, limitBytes)) atMost += gridSeconds(r.grid, cases);
  return { planned, atMost };
}

/**
 * Peak memory of one check's largest solve, bytes: the largest of the wanted rungs, or — when
 * `withAddedRungs` — also of the rungs the ladder may add on its own (addedRungs).
 */
export function ladderPeakBytes(l: LadderGrids, withAddedRungs: boolean, limitBytes = DEFAULT_SOLVER_BYTES): number {
  let peak = 0;
  for (const res of l.wanted) peak = Math.max(peak, solveCost(l.makeGrid(res)).megabytes * 1e6);
  if (!withAddedRungs || l.wanted.length < 2) return peak;
  for (const r of addedRungs(l, l.wanted[l.wanted.length - 1], l.wanted.length, limitBytes)) peak = Math.max(peak, solveCost(r.grid).megabytes * 1e6);
  return peak;
}
