/**
 * One frequency of the sweep: the cases of the full-wave check rebuilt at f and solved on their own
 * ladder (verifyDevice.ts). Ideal and reduced maps are frequency-independent tensors, but the device's
 * electrical size changes, so they are solved again at every f, and so is the bare object (each
 * ratio is to the bare object at the same frequency). The realized map takes each recipe's values
 * at f (recipeAtFrequency.ts: dispersive materials, wire media, split rings). Pure: the shell runs
 * these on worker threads, one frequency per task, from a SweepContext that is plain data (it
 * crosses the thread boundary by structured clone).
 *
 * Cost: one verifyDevice per frequency (every case on every rung); memory: that of its finest rung.
 */
import type { Material } from "../../media/material.js";
import { deviceCases, type DeviceCasesInput } from "../deviceCases.js";
import type { Illumination } from "../illumination.js";
import { verifyDevice, type CaseName } from "../verifyDevice.js";
import { planAtFrequency } from "./recipeAtFrequency.js";

/** Cases a sweep solves, in this order (others, such as realized-geometry, stay at the design frequency). */
export const SWEEP_CASES: readonly CaseName[] = ["flat", "bare", "ideal", "reduced", "realized"];

/**
 * Everything a sweep point needs: the inputs of deviceCases (without the drawn case's bulk
 * materials, which the sweep does not solve) plus the sweep's own. Plain data (no functions), so it
 * can be sent to a worker.
 */
export type SweepContext = Omit<DeviceCasesInput, "materials"> & {
  /** the material catalog the plan was made with (to re-evaluate recipes); empty without a plan */
  catalog: Material[];
  illumination: Illumination;
  resolution?: number;
  accuracy?: number;
  marginM?: number;
  /** memory one solve may use (the worker's share), bytes */
  solverBytes?: number;
};

/** The figures of one case at one frequency (null where they do not apply). */
export interface SweepCaseFigures {
  name: CaseName;
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

export interface SweepPoint {
  frequencyHz: number;
  /** the scene stands on a ground plane (carpets): the beam figure is the specular share */
  ground: boolean;
  cases: SweepCaseFigures[];
  resolutions: number[];
  grid: { nx: number; ny: number; stepM: number };
  notes: string[];
}

/** Solve the sweep's cases at one frequency (see file comment). Throws what verifyDevice throws. */
export function solveSweepPoint(ctx: SweepContext, frequencyHz: number, onProgress?: (step: string, fraction: number) => void): SweepPoint {
  const { catalog, illumination: _i, resolution: _r, accuracy: _a, marginM: _m, solverBytes: _s, ...caseInput } = ctx;
  const plan = ctx.plan ? planAtFrequency(ctx.plan, catalog, frequencyHz) : null;
  const built = deviceCases({ ...caseInput, plan });
  const cases = built.cases.filter((c) => SWEEP_CASES.includes(c.name));
  const r = verifyDevice({
    polarization: ctx.polarization, background: ctx.background, frequencyHz, deviceBox: built.deviceBox, cases,
    illumination: ctx.illumination, resolution: ctx.resolution, accuracy: ctx.accuracy, marginM: ctx.marginM, solverBytes: ctx.solverBytes,
    groundYM: built.ground?.groundYM,
    onProgress,
  });
  const fin = (v: number | null): number | null => (v !== null && Number.isFinite(v) ? v : null);
  return {
    frequencyHz,
    ground: built.ground != null,
    cases: r.cases.map((c) => ({
      name: c.name, available: c.available, reason: c.reason,
      scatteringWidthM: fin(c.scatteringWidthM), scatteringWidthUncertaintyM: fin(c.scatteringWidthUncertaintyM),
      absorptionWidthM: fin(c.absorptionWidthM), vsBare: fin(c.vsBare), vsBareUncertainty: fin(c.vsBareUncertainty),
      deliveredPower: fin(c.deliveredPower), deliveredPowerUncertainty: fin(c.deliveredPowerUncertainty), deviationDeg: fin(c.deviationDeg), uncertainty: fin(c.uncertainty), converged: c.converged,
    })),
    resolutions: r.resolutions,
    grid: { nx: r.grid.nx, ny: r.grid.ny, stepM: r.grid.h },
    notes: [...built.notes, ...r.notes],
  };
}
