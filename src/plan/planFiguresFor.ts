/** Assemble the DeviceFigures of a plan from its per-cell arrays and levels. */
import type { Process } from "../cells/process.js";
import type { DeviceGrid } from "../field/deviceGrid.js";
import type { ReducedField } from "../reduce/reducedField.js";
import { countFlags, FLAGS } from "./flags.js";
import type { EvaluatedMaterial } from "./match/matchContext.js";
import { VACUUM_ID } from "./match/solidCandidates.js";
import { billOfMaterials, finiteMedian, worstStraightPathByLevel } from "./planFigures.js";
import { deviceHeight } from "./deviceHeight.js";
import type { DeviceFigures, PlanLevel, PlanSettings } from "./planTypes.js";

export interface FiguresInput {
  grid: DeviceGrid;
  level: Int32Array;
  levels: PlanLevel[];
  regions: Int32Array;
  regionCount: number;
  flags: Uint16Array;
  relError: Float64Array;
  reduced: ReducedField;
  settings: PlanSettings;
  k0: number;
  boundaryReflection: number | null;
  materials: EvaluatedMaterial[];
  process: Process | null;
}

export function planFiguresFor(inp: FiguresInput): DeviceFigures {
  const { grid, level, levels, flags, relError, settings } = inp;
  const n = grid.count;
  const levelIm = levels.map((lv) => lv.recipe?.indexIm ?? 0);
  let maxErr = NaN, maxAniso = 1;
  for (let c = 0; c < n; c++) {
    const e = relError[c];
    if (Number.isFinite(e) && !(e <= maxErr)) maxErr = e;
    const a = inp.reduced.anisotropy[c];
    if (Number.isFinite(a) && a > maxAniso) maxAniso = a;
  }
  const path = worstStraightPathByLevel(grid, level, levelIm, inp.k0);
  // regions where each flag occurs
  const seen = FLAGS.map(() => new Uint8Array(inp.regionCount));
  for (let c = 0; c < n; c++) {
    const m = flags[c];
    if (m === 0 || inp.regions[c] < 0) continue;
    for (let k = 0; k < FLAGS.length; k++) if (m & (1 << k)) seen[k][inp.regions[c]] = 1;
  }
  const flagRegions: Record<string, number[]> = {};
  FLAGS.forEach((f, k) => {
    const ids: number[] = [];
    seen[k].forEach((v, r) => { if (v) ids.push(r + 1); });
    flagRegions[f.name] = ids;
  });
  let minBw: number | null = null, smallest: number | null = null;
  for (const lv of levels) {
    const r = lv.recipe;
    if (!r) continue;
    if (r.bandwidth !== null && (minBw === null || r.bandwidth < minBw)) minBw = r.bandwidth;
    if (Number.isFinite(r.featureM) && (smallest === null || r.featureM < smallest)) smallest = r.featureM;
  }
  const gas = new Set(inp.materials.filter((m) => m.material.class === "gas").map((m) => m.material.id));
  const classes = new Map(inp.materials.map((m) => [m.material.id, m.material.class as string]));
  const height = deviceHeight(settings, grid.pitchM, (2 * Math.PI) / inp.k0, levels.some((lv) => lv.recipe?.family === "split-ring"));
  return {
    flagCounts: countFlags(flags),
    flagRegions,
    maxRelError: maxErr,
    medianRelError: finiteMedian(relError),
    lossDb: path.lossDb,
    lossPathM: path.lengthM,
    lossPathDirection: path.direction,
    lossBudgetDb: settings.lossBudgetDb,
    lossWithinBudget: settings.lossBudgetDb === null ? null : path.lossDb <= settings.lossBudgetDb,
    boundaryReflection: inp.boundaryReflection,
    minBandwidth: minBw,
    bandwidthRequired: settings.bandwidth,
    bandwidthMet: settings.bandwidth === null || minBw === null ? null : minBw >= settings.bandwidth,
    smallestFeatureM: smallest,
    processMinFeatureM: inp.process ? inp.process.minFeatureM : null,
    billOfMaterials: billOfMaterials(levels, grid.pitchM, grid.dimension, (id) => gas.has(id) || id === VACUUM_ID, { heightM: height.heightM, classOf: (id) => classes.get(id), process: settings.process, layer: !!settings.layer }),
    height,
    largestAnisotropy: maxAniso,
  };
}
