/**
 * The settings of a plan: the design's `polarization`, `reduction` and `realization` keys with
 * defaults, overridden by the command line or an interactive session.
 */
import type { RealizationSpec } from "../io/design/realizationSchema.js";
import type { ReductionSpec } from "../io/design/reductionSchema.js";
import { DEFAULT_MAX_ANISOTROPY, DEFAULT_TOLERANCE, type PlanOverrides, type PlanSettings } from "./planTypes.js";

/** The parts of a design the settings come from. */
export interface SettingsSource {
  polarization?: "Ez" | "Hz";
  reduction?: ReductionSpec;
  realization?: RealizationSpec;
}

/**
 * Resolve the settings. Defaults: polarization Ez, scheme full, unit axis larger, background index
 * 1, levels as the tolerance allows, tolerance 0.05 (common practice for a first build), every
 * material, family and lattice, no process, maxAnisotropy 10, no loss or bandwidth check, no layer.
 */
export function resolveSettings(design: SettingsSource, overrides: PlanOverrides = {}): PlanSettings {
  const red = design.reduction;
  const rz = design.realization ?? {};
  const base: PlanSettings = {
    polarization: design.polarization ?? "Ez",
    scheme: red?.scheme ?? "full",
    unitAxis: red?.unitAxis ?? "larger",
    backgroundIndex: red?.backgroundIndex ?? 1,
    levels: rz.levels ?? null,
    tolerance: rz.tolerance ?? DEFAULT_TOLERANCE,
    materials: rz.materials ? [...rz.materials] : null,
    families: rz.families ? [...rz.families] : null,
    process: rz.process ?? null,
    lattice: rz.lattice ?? null,
    aspect: rz.aspect ?? null,
    maxAnisotropy: rz.maxAnisotropy ?? DEFAULT_MAX_ANISOTROPY,
    lossBudgetDb: rz.lossBudgetDb ?? null,
    bandwidth: rz.bandwidth ?? null,
    layer: rz.layer ? { coreId: rz.layer.core, thicknessM: rz.layer.thickness, belowId: rz.layer.below, aboveId: rz.layer.above } : null,
    heightM: rz.height ?? null,
  };
  const out = { ...base };
  for (const [k, v] of Object.entries(overrides)) {
    if (v !== undefined) (out as Record<string, unknown>)[k] = Array.isArray(v) ? [...v] : v;
  }
  return out;
}

/**
 * The background index a reduction is handed: the one given — by an override (command line,
 * session) or by the design's `reduction.backgroundIndex`, 1 included (a background of index 1) —
 * or undefined when none is, which keeps the design's own background (`$.background`, as the field
 * was computed). `plan`, `reduce`, `verify` and the session all reduce with it, so they reduce
 * alike; the settings' `backgroundIndex` (1 when none is given) is what they show.
 */
export function givenBackgroundIndex(design: SettingsSource, overrides: PlanOverrides = {}): number | undefined {
  return overrides.backgroundIndex ?? design.reduction?.backgroundIndex;
}
