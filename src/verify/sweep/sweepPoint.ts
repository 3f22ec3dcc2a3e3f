/**
 * One frequency of the sweep: the cases of the full-wave check rebuilt at f and solved as the
 * single-frequency check solves them (runCheck.ts), so `--method` means the same in both: `auto`
 * takes the exact radial solver for every case whose tensors depend on r only (a radial cloak's
 * bare conductor, ideal and reduced shells, a concentrator) and the grid for the rest; `radial` and
 * `fdfd` force one. Each case says which solver computed it. Ideal and reduced maps are
 * frequency-independent tensors, but the device's electrical size changes, so they are solved again
 * at every f, and so is the bare object (each ratio is to the bare object at the same frequency).
 * The realized map takes each recipe's values at f (recipeAtFrequency.ts: dispersive materials,
 * wire media, split rings). The drawn realized case (`realized-geometry`, geometryScene.ts) keeps
 * the plan's geometry (radii, widths, sites) and takes its bulk materials at f (bulkMaterialsAt:
 * catalog dispersion, the layer's mode at f); it runs on its own ladder beside the homogenized
 * realized map at f (drawnLadder.ts, drawnRun.ts), which gives the plan's homogenization error at
 * every frequency. Its time budget per frequency is decided by the shell before anything is solved
 * (`drawn`: the --drawn-time share, or why it is not swept). A background material named by the
 * design (`backgroundDispersion`) is followed at f (backgroundAtFrequency.ts): the medium around
 * the device takes its ε at f, and the ideal and reduced maps are scaled with it. Pure: the shell runs these on worker
 * threads, one frequency per task, from a SweepContext that is plain data (it crosses the thread
 * boundary by structured clone).
 *
 * Cost: one runCheck per frequency (sweepConcurrency.ts sweepPeakBytes estimates it: the grid
 * cases' ladder, the radial cases, the drawn ladder); memory: that of its largest grid.
 */
import type { Material } from "../../media/material.js";
import { bulkMaterialsAt } from "../bulkMaterials.js";
import { deviceCases, type DeviceCasesInput } from "../deviceCases.js";
import { formatFrequencyPrecise } from "../../core/formatQuantity.js";
import type { Illumination } from "../illumination.js";
import { runCheck, type MethodOption } from "../runCheck.js";
import type { CaseName, CaseSpec } from "../verifyDevice.js";
import { planAtFrequency } from "./recipeAtFrequency.js";
import { backgroundAt, scaleReducedEps, type BackgroundDispersion } from "./backgroundAtFrequency.js";

/** Cases a sweep solves, in this order (those the scene has). */
export const SWEEP_CASES: readonly CaseName[] = ["flat", "bare", "ideal", "reduced", "realized", "realized-geometry"];

/** The drawn case in a sweep: its estimated-time budget at each frequency, or why it is not swept. */
export type SweepDrawn = { seconds: number } | { reason: string };

/**
 * Everything a sweep point needs: the inputs of deviceCases (the drawn case's bulk materials are
 * evaluated at each frequency from the catalog) plus the sweep's own. Plain data (no functions), so
 * it can be sent to a worker.
 */
export type SweepContext = Omit<DeviceCasesInput, "materials"> & {
  /** the material catalog the plan was made with (to re-evaluate recipes and draw inclusions); empty without a plan */
  catalog: Material[];
  illumination: Illumination;
  /** the solver per case, as the single-frequency check (default auto) */
  method?: MethodOption;
  /** the option that asks for the grid (--resolution, --margin), if any: auto then takes the grid */
  gridOption?: string | null;
  /** the drawn case's budget per frequency (absent: not swept, as before the shell decides) */
  drawn?: SweepDrawn;
  resolution?: number;
  accuracy?: number;
  marginM?: number;
  /** memory one solve may use (the worker's share), bytes */
  solverBytes?: number;
  /** the design's background material, followed at each frequency (absent: the background is fixed) */
  backgroundDispersion?: BackgroundDispersion;
};

/** The figures of one case at one frequency (null where they do not apply). */
export interface SweepCaseFigures {
  name: CaseName;
  /** the solver that computed the case (null: not computed) */
  method: "fdfd" | "radial" | null;
  available: boolean;
  reason: string | null;
  scatteringWidthM: number | null;
  /** absolute uncertainties of the three figures of merit (null: none, a single grid) */
  scatteringWidthUncertaintyM: number | null;
  absorptionWidthM: number | null;
  vsBare: number | null;
  vsBareUncertainty: number | null;
  deliveredPower: number | null;
  deliveredPowerUncertainty: number | null;
  deviationDeg: number | null;
  /** relative uncertainty of the headline figure (null on a single grid) */
  uncertainty: number | null;
  converged: boolean | null;
}

/** The plan's homogenization error at one frequency (drawnRun.ts): the drawn structure against its effective-medium map on the same grids. */
export interface SweepHomogenization {
  /** (σ_geometry − σ_realized)/S extrapolated to zero step; S = σ_bare, or the larger width without a bare object */
  difference: number;
  /** its absolute uncertainty (null on a single grid) */
  differenceUncertainty: number | null;
  differenceScale: "bare" | "larger-width";
  /** σ_geometry/σ_realized − 1 (null when the realized width vanishes on a rung) */
  relative: number | null;
  /** beams: delivered share of the drawn structure minus the homogenized map's (null otherwise) */
  deliveredPowerDifference: number | null;
  /** its absolute uncertainty (null: not a beam, or a single grid) */
  deliveredPowerDifferenceUncertainty: number | null;
  /** the difference's uncertainty within the accuracy (null: a single grid) */
  converged: boolean | null;
  /** grid steps across the smallest drawn feature on each rung */
  stepsAcrossFeature: number[];
}

export interface SweepPoint {
  frequencyHz: number;
  /** the solvers used at this frequency: radial, fdfd or radial+fdfd (runCheck.ts) */
  method: "fdfd" | "radial" | "radial+fdfd";
  /** the scene stands on a ground plane (carpets): the beam figure is the specular share */
  ground: boolean;
  cases: SweepCaseFigures[];
  /** the homogenization error at this frequency (null: the drawn case was not computed here) */
  homogenization: SweepHomogenization | null;
  resolutions: number[];
  /** the finest grid of the main cases (null: every case radial) */
  grid: { nx: number; ny: number; stepM: number } | null;
  /** the background the cases stood in at this frequency (relative ε and μ, real) */
  background: { eps: number; mu: number };
  /** the background material's loss tangent at f, not modelled (null: no background material) */
  backgroundLossTangent: number | null;
  notes: string[];
}

/** The background of the sweep's scenes at f: the design's, its ε scaled by the background material's dispersion when one is named. */
export function sweepBackground(ctx: Pick<SweepContext, "background" | "backgroundDispersion" | "catalog">, frequencyHz: number): { eps: number; mu: number } {
  if (!ctx.backgroundDispersion) return ctx.background;
  const s = backgroundAt(ctx.backgroundDispersion, ctx.catalog, frequencyHz).scale;
  return s === 1 ? ctx.background : { eps: ctx.background.eps * s, mu: ctx.background.mu };
}

/** The cases of one sweep point, built at f (the drawn case at f, or with the reason it is not swept). */
export function sweepCases(ctx: SweepContext, frequencyHz: number): ReturnType<typeof deviceCases> {
  const { catalog, illumination: _i, resolution: _r, accuracy: _a, marginM: _m, solverBytes: _s, method: _me, gridOption: _g, drawn, backgroundDispersion: _bd, ...caseInput } = ctx;
  const plan = ctx.plan ? planAtFrequency(ctx.plan, catalog, frequencyHz) : null;
  const swept = drawn !== undefined && "seconds" in drawn;
  const materials = ctx.plan && swept ? bulkMaterialsAt(catalog, frequencyHz, ctx.plan) : undefined;
  // a dispersive background: the surroundings at f, the ideal and reduced maps scaled with them
  const background = sweepBackground(ctx, frequencyHz);
  const s = background.eps / ctx.background.eps;
  const built = deviceCases({ ...caseInput, background, ideal: scaleReducedEps(ctx.ideal, s), reduced: scaleReducedEps(ctx.reduced, s), plan, materials });
  const cases = built.cases.filter((c) => SWEEP_CASES.includes(c.name));
  // a drawn case the shell did not budget is not solved; it says why (never a copy of another case)
  const out = plan && !swept
    ? cases.map((c): CaseSpec => (c.name === "realized-geometry" ? { name: c.name, scene: null, reason: drawn && "reason" in drawn ? drawn.reason : "not swept", indexHint: 0 } : c))
    : cases;
  return { ...built, cases: out };
}

/** Solve the sweep's cases at one frequency (see file comment). Throws what runCheck throws. */
export function solveSweepPoint(ctx: SweepContext, frequencyHz: number, onProgress?: (step: string, fraction: number) => void): SweepPoint {
  const built = sweepCases(ctx, frequencyHz);
  const drawnSeconds = ctx.drawn && "seconds" in ctx.drawn ? ctx.drawn.seconds : 0;
  const background = sweepBackground(ctx, frequencyHz);
  const r = runCheck({
    method: ctx.method ?? "auto", transform: ctx.transform, gridOption: ctx.gridOption ?? null,
    polarization: ctx.polarization, background, frequencyHz, deviceBox: built.deviceBox, cases: built.cases,
    illumination: ctx.illumination, resolution: ctx.resolution, accuracy: ctx.accuracy, marginM: ctx.marginM, solverBytes: ctx.solverBytes,
    groundYM: built.ground?.groundYM, drawnSeconds,
    onProgress,
  });
  const fin = (v: number | null): number | null => (v !== null && Number.isFinite(v) ? v : null);
  const e = r.homogenizationError;
  return {
    frequencyHz,
    method: r.method,
    ground: built.ground != null,
    cases: r.cases.map((c) => ({
      name: c.name, method: c.available ? c.method : null, available: c.available, reason: c.reason,
      scatteringWidthM: fin(c.scatteringWidthM), scatteringWidthUncertaintyM: fin(c.scatteringWidthUncertaintyM),
      absorptionWidthM: fin(c.absorptionWidthM), vsBare: fin(c.vsBare), vsBareUncertainty: fin(c.vsBareUncertainty),
      deliveredPower: fin(c.deliveredPower), deliveredPowerUncertainty: fin(c.deliveredPowerUncertainty), deviationDeg: fin(c.deviationDeg), uncertainty: fin(c.uncertainty), converged: c.converged,
    })),
    homogenization: e && Number.isFinite(e.difference)
      ? {
        difference: e.difference, differenceUncertainty: fin(e.differenceUncertainty), differenceScale: e.differenceScale,
        relative: fin(e.relative), deliveredPowerDifference: fin(e.deliveredPowerDifference), deliveredPowerDifferenceUncertainty: fin(e.deliveredPowerDifferenceUncertainty), converged: e.converged, stepsAcrossFeature: e.stepsAcrossFeature,
      }
      : null,
    resolutions: r.resolutions,
    grid: r.grid ? { nx: r.grid.nx, ny: r.grid.ny, stepM: r.grid.h } : null,
    background,
    backgroundLossTangent: ctx.backgroundDispersion ? backgroundAt(ctx.backgroundDispersion, ctx.catalog, frequencyHz).lossTangent : null,
    // the drawn case's ladder note differs per frequency: say which
    notes: [...built.notes, ...r.notes.map((n) => (n.startsWith("realized-geometry: drawn on grids") ? `at ${formatFrequencyPrecise(frequencyHz)}, ${n}` : n))],
  };
}
