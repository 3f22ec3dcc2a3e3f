/**
 * The full-wave check of a 2D device: the ideal, reduced and realized material maps (and, for a
 * cloak, the bare hidden object) each simulated under a plane wave along +x on one FDFD grid, with
 * scattering widths and field differences. Pure; the command line wraps it.
 *
 * Grid: step h = λ0 / (n_max · N) with N points per wavelength (`resolution`, default 12) in the
 * densest material of any case (n_max = max sqrt(|b| λ_max(T)) and the background index); window =
 * device box + margin (default half a background wavelength) each side, plus a PML of
 * clamp(⌈λ_b/(2h)⌉, 10, 20) nodes. When that grid needs more memory than the direct solver may use
 * (assemble.ts checkGridSize), the check is refused with an InputError that gives the estimate and
 * the largest resolution that fits; the resolution is never lowered silently.
 */
import { SPEED_OF_LIGHT_M_PER_S as C0 } from "../core/physicalConstants.js";
import { InputError } from "../core/errors.js";
import type { DeviceGrid } from "../field/deviceGrid.js";
import { checkGridSize, DEFAULT_SOLVER_BYTES, gridFits } from "./assemble.js";
import { deviceBounds, deviceScene, type HiddenDisk } from "./deviceScene.js";
import { gridForWindow, type FdfdGrid } from "./fdfdGrid.js";
import { largestIndex, type MaterialMap } from "./materialMap.js";
import { crossSections, fluxBox, observationMask, relativeDifference } from "./metrics.js";
import type { ScenePolarization } from "./scene.js";
import { formatLength } from "./formatQuantity.js";
import { solveScene, type SceneSolution } from "./solve.js";

export const DEFAULT_RESOLUTION = 12;
export const MIN_RESOLUTION = 10;

export type CaseName = "ideal" | "reduced" | "realized";

export interface VerifyInput {
  grid: DeviceGrid;
  polarization: ScenePolarization;
  /** relative ε, μ of the background the device sits in */
  background: { eps: number; mu: number };
  frequencyHz: number;
  cases: { name: CaseName; map: MaterialMap }[];
  /** the object a cloak hides, modelled as a perfect conductor (null for other devices) */
  hidden: HiddenDisk | null;
  /** points per wavelength in the densest material (default DEFAULT_RESOLUTION) */
  resolution?: number;
  /** free space around the device on each side, metres (default half a background wavelength) */
  marginM?: number;
  onProgress?: (step: string, fraction: number) => void;
}

export interface CaseResult {
  name: CaseName | "bare";
  /** scattering width σ_s, metres */
  scatteringWidthM: number;
  /** σ_s divided by the device's geometric width across the beam (y extent) */
  scatteringPerWidth: number;
  /** σ_s / σ_s(bare hidden object); null when there is no hidden object */
  vsBare: number | null;
  /** absorption width, metres (≈ 0 for lossless maps; a check on the solution) */
  absorptionWidthM: number;
  /** ‖u − u_ideal‖ / ‖u_ideal‖ over the observation region (null for ideal and bare) */
  fieldErrorVsIdeal: number | null;
  /** ‖u_s‖ / ‖u_inc‖ over the observation region: the field change the device makes vs empty space */
  scatteredFieldRelative: number;
  /** device cells without a value (set to background) */
  missingCells: number;
  /** |u_total| per node (for pictures) */
  magnitude: Float64Array;
}

export interface VerifyResult {
  polarization: ScenePolarization;
  frequencyHz: number;
  grid: FdfdGrid;
  /** points per wavelength actually used in the densest material */
  resolution: number;
  requestedResolution: number;
  densestIndex: number;
  backgroundIndex: number;
  marginM: number;
  /** device extent across the beam (y), metres */
  deviceWidthM: number;
  /** nodes in the observation region */
  observationNodes: number;
  cases: CaseResult[];
  /** 1 on nodes of any device or hidden region (for pictures) */
  deviceMask: Uint8Array;
  notes: string[];
}

function chooseGrid(box: { minX: number; maxX: number; minY: number; maxY: number }, lambda0: number, nMax: number, nb: number, requested: number, marginM: number): { g: FdfdGrid; resolution: number } {
  const gridAt = (res: number): FdfdGrid => {
    const h = lambda0 / (nMax * res);
    const pml = Math.min(20, Math.max(10, Math.ceil(lambda0 / nb / (2 * h))));
    return gridForWindow({ minX: box.minX - marginM, maxX: box.maxX + marginM, minY: box.minY - marginM, maxY: box.maxY + marginM }, h, pml);
  };
  const g = gridAt(requested);
  if (gridFits(g)) return { g, resolution: requested };
  // never lower the resolution silently: refuse, naming the largest one that fits
  let fits = 0;
  for (let res = requested - 1; res >= MIN_RESOLUTION && fits === 0; res--) if (gridFits(gridAt(res))) fits = res;
  checkGridSize(g, "--resolution", DEFAULT_SOLVER_BYTES, fits > 0
    ? `the largest resolution that fits is ${fits} points per wavelength (in the densest material, index ${nMax.toPrecision(3)})`
    : `even ${MIN_RESOLUTION} points per wavelength does not fit (densest index ${nMax.toPrecision(3)}); try a smaller --margin`);
  return { g, resolution: requested };
}

/** Run the check (see file comment). Throws InputError for a bad resolution or margin, or a grid too large. */
export function verifyDevice(input: VerifyInput): VerifyResult {
  const { grid, polarization, background, frequencyHz, cases, hidden } = input;
  const requested = input.resolution ?? DEFAULT_RESOLUTION;
  if (!(requested >= MIN_RESOLUTION && requested <= 60)) throw new InputError({ where: "--resolution", message: `expected points per wavelength from ${MIN_RESOLUTION} to 60, got ${requested}` });
  const nb = Math.sqrt(background.eps * background.mu);
  const lambda0 = C0 / frequencyHz;
  const marginM = input.marginM ?? lambda0 / nb / 2;
  if (!(marginM >= 0 && Number.isFinite(marginM))) throw new InputError({ where: "--margin", message: `expected a length ≥ 0, got ${marginM}` });
  let nMax = nb;
  for (const c of cases) nMax = Math.max(nMax, largestIndex(c.map));
  const box = deviceBounds(grid);
  if (hidden) {
    const [cx, cy] = hidden.centerM, r = hidden.radiusM;
    box.minX = Math.min(box.minX, cx - r); box.maxX = Math.max(box.maxX, cx + r);
    box.minY = Math.min(box.minY, cy - r); box.maxY = Math.max(box.maxY, cy + r);
  }
  const { g, resolution } = chooseGrid(box, lambda0, nMax, nb, requested, marginM);
  const notes: string[] = [];
  // average several design cells into one grid step when the grid is coarser than the lattice
  const subsamples = Math.min(6, Math.max(3, Math.ceil((2 * g.h) / grid.pitchM)));
  if (g.h > grid.pitchM) notes.push(`grid step ${formatLength(g.h)} is coarser than the cell pitch ${formatLength(grid.pitchM)}: cells are averaged (${subsamples}×${subsamples} samples per step)`);
  const k0 = (2 * Math.PI * frequencyHz) / C0;
  const runs: { name: CaseName | "bare"; sol: SceneSolution; missing: number }[] = [];
  const total = cases.length + (hidden ? 1 : 0);
  const run = (name: CaseName | "bare", map: MaterialMap | null): void => {
    const done = runs.length;
    const scene = deviceScene(grid, polarization, background, map, hidden);
    const sol = solveScene(scene, g, k0, { subsamples, onProgress: (f) => input.onProgress?.(name, (done + f) / total) });
    runs.push({ name, sol, missing: map?.missing ?? 0 });
  };
  if (hidden) run("bare", null);
  for (const c of cases) run(c.name, c.map);
  input.onProgress?.("metrics", 1);
  // device mask: union over runs; observation region outside it
  const n = g.nx * g.ny;
  const deviceMask = new Uint8Array(n);
  for (const r of runs) for (let k = 0; k < n; k++) if (r.sol.coefficients.deviceNode[k]) deviceMask[k] = 1;
  const obs = observationMask(g, deviceMask, 1);
  let observationNodes = 0;
  for (let k = 0; k < n; k++) observationNodes += obs[k];
  const ideal = runs.find((r) => r.name === "ideal");
  const bare = runs.find((r) => r.name === "bare");
  const widthM = box.maxY - box.minY;
  const results: CaseResult[] = runs.map((r) => {
    const fb = fluxBox(r.sol);
    if (!fb) throw new InputError({ where: "--margin", message: "no room between the device and the PML for the power contour; give a larger margin" });
    const cs = crossSections(r.sol, fb);
    const mag = new Float64Array(n);
    for (let k = 0; k < n; k++) mag[k] = Math.hypot(r.sol.totalRe[k], r.sol.totalIm[k]);
    return {
      name: r.name,
      scatteringWidthM: cs.scatteringM,
      scatteringPerWidth: cs.scatteringM / widthM,
      vsBare: 0,
      absorptionWidthM: cs.absorptionM,
      fieldErrorVsIdeal: ideal && r !== ideal && r.name !== "bare" ? relativeDifference(r.sol.totalRe, r.sol.totalIm, ideal.sol.totalRe, ideal.sol.totalIm, obs) : null,
      scatteredFieldRelative: relativeDifference(r.sol.totalRe, r.sol.totalIm, r.sol.incidentRe, r.sol.incidentIm, obs),
      missingCells: r.missing,
      magnitude: mag,
    };
  });
  const bareWidth = bare ? results[0].scatteringWidthM : null;
  for (const c of results) c.vsBare = bareWidth !== null && bareWidth > 0 ? c.scatteringWidthM / bareWidth : null;
  for (const c of results) if (c.missingCells > 0) notes.push(`${c.name}: ${c.missingCells} device cells have no value and were left as background`);
  return {
    polarization, frequencyHz, grid: g, resolution, requestedResolution: requested, densestIndex: nMax, backgroundIndex: nb,
    marginM, deviceWidthM: widthM, observationNodes, cases: results, deviceMask, notes,
  };
}
