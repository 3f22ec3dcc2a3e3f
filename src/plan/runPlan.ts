/**
 * The planner: field → reduction → per-cell targets → levels → regions → recipes per level →
 * flags → device-level figures. Pure (no files, no clock); the command line and the interactive
 * session both call `planFromField`.
 */
import { PLAN_RECT_ASPECTS } from "../cells/lattice.js";
import { RECT_TABLES_PER_PLAN } from "./match/levelCandidates.js";
import { SPEED_OF_LIGHT_M_PER_S as C0 } from "../core/physicalConstants.js";
import { deviceScaleProblem } from "../core/physicalScale.js";
import { isVolumeDevice } from "../field/isVolumeDevice.js";
import { InputError, unknownWithSuggestion, type InputIssue } from "../core/errors.js";
import { sym2MajorAngle } from "../core/eigen.js";
import { CELL_FAMILIES } from "../cells/registry.js";
import type { Process } from "../cells/process.js";
import type { TensorField } from "../field/tensorField.js";
import { evaluateMaterial, type Material } from "../media/material.js";
import { layerReport, type LayerReport } from "../cells/slab/layerHost.js";
import { reduceField } from "../reduce/reduceField.js";
import { FLAG_CAPPED, FLAG_UNDEFINED } from "../reduce/reducedField.js";
import { schemeSummary } from "../reduce/schemeMetrics.js";
import { findRegions } from "./findRegions.js";
import { computeFlags } from "./computeFlags.js";
import { chooseRecipes } from "./match/chooseRecipes.js";
import { bandVerdict } from "./match/bandCheck.js";
import { levelCandidates, type Candidate } from "./match/levelCandidates.js";
import { gridMisalignmentRad } from "./latticeMisalignment.js";
import type { EvaluatedMaterial, MatchContext } from "./match/matchContext.js";
import { planFiguresFor } from "./planFiguresFor.js";
import { MAX_LEVELS, type LayerSetting, type Plan, type PlanLevel, type PlanOverrides, type PlanProgress, type TargetComponent } from "./planTypes.js";
import { isConstant, quantizeTargets } from "./quantize/quantizeTargets.js";
import { reductionNotes } from "./reductionNotes.js";
import { givenBackgroundIndex, resolveSettings, type SettingsSource } from "./resolveSettings.js";
import { planVerdict } from "./verdict.js";
import { markUnresolvable, mergeUnresolvable } from "./levelSteps.js";
import { RUNNERS_UP } from "./match/chooseRecipes.js";

export interface PlanCatalogs {
  materials: readonly Material[];
  processes: readonly Process[];
}

/** What the planner reads from a design. */
export interface PlanDesign extends SettingsSource {
  name: string;
  notes?: string;
  frequencyHz: number;
  sourcePath: string;
  transform: { kind: string };
}


/** Cells left without a target (flagged norecipe) are named, never dropped silently. */
function noTargetWarning(grid: TensorField["grid"], valid: Uint8Array, count: number): string {
  const c = valid.indexOf(0);
  return `${count} cell${count === 1 ? " has" : "s have"} no target and no recipe (first at x = ${grid.xM[c]} m, y = ${grid.yM[c]} m): ` +
    "the reduction is undefined there (a principal value of ε or μ ≤ 0, or singular); they are flagged norecipe";
}

/** Check ids in the settings against the catalogs; all problems at once. */
function checkIds(design: PlanDesign, s: ReturnType<typeof resolveSettings>, catalogs: PlanCatalogs, overrides: PlanOverrides): void {
  const issues: InputIssue[] = [];
  // name the place the value came from: an override (session file, command line) or the design
  const at = (path: string): string => {
    const key = path.replace(/\[.*$/, "") as keyof PlanOverrides;
    return overrides[key] !== undefined ? `${path} (override)` : `${design.sourcePath}: $.realization.${path}`;
  };
  const matIds = catalogs.materials.map((m) => m.id);
  (s.materials ?? []).forEach((id, k) => {
    if (!matIds.includes(id)) issues.push({ where: at(`materials[${k}]`), message: unknownWithSuggestion("material", id, matIds) });
  });
  const famIds = CELL_FAMILIES.map((f) => f.id);
  (s.families ?? []).forEach((id, k) => {
    if (!famIds.includes(id)) issues.push({ where: at(`families[${k}]`), message: unknownWithSuggestion("cell family", id, famIds) });
  });
  if (s.layer) {
    const l = s.layer;
    for (const [key, id] of [["core", l.coreId], ["below", l.belowId], ["above", l.aboveId]] as const) {
      if (!matIds.includes(id)) issues.push({ where: at(`layer.${key}`), message: unknownWithSuggestion("material", id, matIds) });
    }
    if (s.materials !== null && !s.materials.includes(l.coreId)) issues.push({ where: at("layer.core"), message: `the layer's core '${l.coreId}' must be one of the allowed materials (${s.materials.join(", ")})` });
  }
  if (s.process !== null && !catalogs.processes.some((p) => p.id === s.process)) {
    issues.push({ where: at("process"), message: unknownWithSuggestion("process", s.process, catalogs.processes.map((p) => p.id)) });
  }
  if (issues.length) throw new InputError(issues);
}

/**
 * Plan a device. Throws InputError for unknown ids, a 3D field, an empty device region, or a
 * reduction that does not apply; everything else (unbuildable cells, errors) comes back as flags.
 */
export function planFromField(
  design: PlanDesign,
  field: TensorField,
  catalogs: PlanCatalogs,
  overrides: PlanOverrides = {},
  onProgress?: PlanProgress,
): Plan {
  const settings = resolveSettings(design, overrides);
  checkIds(design, settings, catalogs, overrides);
  const grid = field.grid;
  if (grid.count === 0) throw new InputError({ where: `${design.sourcePath}: $.transform`, message: "the device region holds no cell of the grid; check the region and the pitch" });
  if (grid.dimension === 3) throw new InputError({ where: `${design.sourcePath}: $.grid`, message: "the planner builds 2D devices (invariant along z); a 3D grid cannot be planned" });
  if (isVolumeDevice(field)) throw new InputError({ where: `${design.sourcePath}: $.transform`, message: `the planner builds 2D devices (invariant along z); a ${design.transform.kind} is a 3D device, and its z = 0 slice is not invariant along z` });
  const n = grid.count;
  const f = design.frequencyHz;
  const scale = deviceScaleProblem(Math.max(grid.nx, grid.ny, grid.nz) * grid.pitchM, f, "the device");
  if (scale !== null) throw new InputError({ where: `${design.sourcePath}: $.frequency`, message: scale });

  // 1. reduction → per-cell targets
  onProgress?.("reduce", 0);
  const reduced = reduceField(field, {
    polarization: settings.polarization,
    scheme: settings.scheme,
    unitAxis: settings.unitAxis,
    backgroundIndex: givenBackgroundIndex(design, overrides),
    // name the place the choice came from: an override (command line, session) or the design file
    where: {
      polarization: overrides.polarization !== undefined ? "polarization (override)" : `${design.sourcePath}: $.polarization`,
      scheme: overrides.scheme !== undefined
        ? "scheme (override)"
        : overrides.polarization !== undefined
          ? `polarization (override ${overrides.polarization}) with ${design.sourcePath}: $.reduction.scheme; choose a scheme for ${overrides.polarization} too`
          : `${design.sourcePath}: $.reduction.scheme`,
      backgroundIndex: overrides.backgroundIndex !== undefined ? "background index (override)" : `${design.sourcePath}: $.reduction.backgroundIndex`,
    },
  });
  const ez = settings.polarization === "Ez";
  const outName = ez ? "eps_zz" : "mu_zz";
  const pre = ez ? "mu" : "eps";
  const comps: TargetComponent[] = [
    { name: ez ? "eps_z" : "mu_z", kind: ez ? "eps" : "mu", axis: "z", constant: false },
    { name: `${pre}_1`, kind: ez ? "mu" : "eps", axis: "1", constant: false },
    { name: `${pre}_2`, kind: ez ? "mu" : "eps", axis: "2", constant: false },
  ];
  const targets = [reduced.components[outName], reduced.principal[0], reduced.principal[1]];
  const xx = reduced.components[`${pre}_xx`], yy = reduced.components[`${pre}_yy`], xy = reduced.components[`${pre}_xy`];
  const axisAngleRad = new Float64Array(n);
  const valid = new Uint8Array(n);
  let nValid = 0;
  for (let c = 0; c < n; c++) {
    // written only where it is not +0: an isotropic target leaves the array's pages untouched
    const angle = sym2MajorAngle(xx[c], xy[c], yy[c]);
    if (angle !== 0 || 1 / angle < 0) axisAngleRad[c] = angle;
    const ok = !(reduced.flags[c] & FLAG_UNDEFINED) && Number.isFinite(targets[0][c]) && Number.isFinite(targets[1][c]) && Number.isFinite(targets[2][c]);
    valid[c] = ok ? 1 : 0;
    if (ok) nValid++;
  }
  if (nValid === 0) throw new InputError({ where: design.sourcePath, message: "the reduction is undefined in every cell of the device" });

  // 2. quantization (on the cells where the reduction is defined)
  onProgress?.("quantize", 0);
  const sub = nValid === n ? targets : targets.map((t) => { const a = new Float64Array(nValid); let q = 0; for (let c = 0; c < n; c++) if (valid[c]) a[q++] = t[c]; return a; });
  const q = quantizeTargets(sub, { maxLevels: settings.levels, goal: settings.tolerance / 2, cap: MAX_LEVELS });
  comps.forEach((c, k) => { c.constant = isConstant(sub[k]); });
  // every cell valid (the usual case): the quantizer's arrays are the plan's (no fresh copies;
  // its error array is overwritten below, every cell having a level)
  const level = nValid === n ? q.level : new Int32Array(n).fill(-1);
  const quantizationError = nValid === n ? q.error : new Float64Array(n).fill(NaN);
  if (nValid !== n) {
    for (let c = 0, p = 0; c < n; c++) {
      if (!valid[c]) continue;
      level[c] = q.level[p];
      p++;
    }
  }
  // the reported quantization error has no floor (the quantizer's own objective keeps REL_FLOOR)
  floorlessQuantizationError(targets, level, q.centres, quantizationError);

  // 3. regions
  onProgress?.("regions", 0);
  let { region, regions } = findRegions(grid, level);

  // 4. matching, per level
  const evaluated = evaluateMaterials(catalogs.materials, settings.materials, f);
  const layer = settings.layer ? layerFor(settings.layer, settings.polarization, catalogs.materials, f) : null;
  const materials = layer ? evaluated.map((m) => (m.material.id === settings.layer!.coreId ? { ...m, eps: layer.coreEps } : m)) : evaluated;
  const families = CELL_FAMILIES.filter((fam) => settings.families === null || settings.families.includes(fam.id));
  const ctx: MatchContext = {
    polarization: settings.polarization,
    components: comps,
    pitchM: grid.pitchM,
    frequencyHz: f,
    tolerance: settings.tolerance,
    materials,
    materialsChosen: settings.materials !== null,
    families,
    lattice: settings.lattice,
    aspects: settings.lattice !== "rect" ? [] : settings.aspect ? [...new Set([settings.aspect, 1 / settings.aspect])] : PLAN_RECT_ASPECTS,
    rectTables: { left: RECT_TABLES_PER_PLAN },
    process: settings.process === null ? null : catalogs.processes.find((p) => p.id === settings.process)!,
    bandwidth: settings.bandwidth,
    backgroundIndex: reduced.settings.backgroundIndex,
  };
  const cellCounts = new Int32Array(q.centres.length);
  const maxQ = new Float64Array(q.centres.length);
  for (let c = 0; c < n; c++) {
    if (level[c] < 0) continue;
    cellCounts[level[c]]++;
    if (quantizationError[c] > maxQ[level[c]]) maxQ[level[c]] = quantizationError[c];
  }
  // rect lattices and in-plane laminates stand on the grid: each level's largest turn of its cells'
  // principal axes from it
  const turnRad = new Float64Array(q.centres.length);
  if (settings.lattice === "rect" || families.some((f) => f.id === "laminate")) {
    for (let c = 0; c < n; c++) {
      if (level[c] < 0) continue;
      const d = gridMisalignmentRad(axisAngleRad[c]);
      if (d > turnRad[level[c]]) turnRad[level[c]] = d;
    }
  }
  const searches = q.centres.map((centre, l) => {
    onProgress?.("match", l / q.centres.length);
    return levelCandidates(centre, turnRad[l] > 0 ? { ...ctx, turnRad: turnRad[l] } : ctx);
  });
  const perLevel: Candidate[][] = searches.map((s) => s.candidates);
  const chosen = chooseRecipes(perLevel, settings.tolerance);
  // the coarse flag of a chosen rod or hole recipe between λ/10 and λ/4 rests on its lowest band
  // (square, hex and rect lattices: match/bandCheck.ts)
  chosen.forEach((k, l) => {
    const r = k >= 0 ? perLevel[l][k] : null;
    if (!r || r.homogenization !== "warn") return;
    const v = bandVerdict(r, materials, settings.polarization, grid.pitchM, f, settings.tolerance);
    if (!v) return;
    const pct = (x: number) => `${Number((100 * x).toPrecision(2))} %`;
    r.homogenization = v.status;
    r.bandDeviation = v.band.inBand ? Math.max(v.band.deviation, v.band.excessAnisotropy) : Infinity;
    r.notes = [...r.notes, v.band.inBand
      ? r.lattice === "rect"
        ? `band index ${v.anchored.index.map((x) => Number(x.toPrecision(4))).join(" / ")} (${v.band.directions.join(", ")}; long-wavelength ${v.anchored.quasiStaticIndex.map((x) => Number(x.toPrecision(4))).join(" / ")}), up to ${pct(v.band.deviation)} from the long-wavelength values, added anisotropy ${pct(v.band.excessAnisotropy)}`
        : `band index ${v.anchored.index.map((x) => Number(x.toPrecision(4))).join(" / ")} (principal directions), ${pct(v.band.deviation)} from the long-wavelength value, anisotropy ${pct(v.band.anisotropy)}`
      : "the design frequency lies above the lowest band's edge: not homogenizable"];
  });
  const levels: PlanLevel[] = q.centres.map((centre, l) => {
    const list = perLevel[l];
    const k = chosen[l];
    const reasons = k >= 0 ? [] : [...searches[l].refusals.entries()].sort((a, b) => b[1] - a[1]).map(([r, cnt]) => `${r} (${cnt})`);
    if (k < 0 && reasons.length === 0) reasons.push("no allowed family, material or lattice applies to this target");
    return {
      index: l + 1,
      target: centre,
      cellCount: cellCounts[l],
      maxQuantizationError: maxQ[l],
      recipe: k >= 0 ? list[k] : null,
      runnersUp: list.filter((_, m) => m !== k).slice(0, RUNNERS_UP),
      reasons,
      flags: 0,
      unresolvable: false,
    };
  });
  markUnresolvable(levels, ctx.process?.minFeatureM ?? null);
  // level steps the process cannot make: merged where the tolerance allows (levelSteps.ts)
  const steps = mergeUnresolvable(levels, level, targets, settings.tolerance, ctx.process?.minFeatureM ?? null);
  if (steps.removed.length) {
    const newIndex = new Int32Array(levels.length).fill(-1);
    for (let l = 0, m = 0; l < levels.length; l++) if (!steps.removed.includes(l)) newIndex[l] = m++;
    for (let c = 0; c < n; c++) if (level[c] >= 0) level[c] = newIndex[level[c]];
    for (const l of [...steps.removed].reverse()) { levels.splice(l, 1); perLevel.splice(l, 1); chosen.splice(l, 1); searches.splice(l, 1); }
    floorlessQuantizationError(targets, level, levels.map((lv) => lv.target), quantizationError);
    levels.forEach((lv, l) => { lv.index = l + 1; lv.cellCount = 0; lv.maxQuantizationError = 0; });
    for (let c = 0; c < n; c++) {
      const lv = levels[level[c]];
      if (!lv) continue;
      lv.cellCount++;
      if (quantizationError[c] > lv.maxQuantizationError) lv.maxQuantizationError = quantizationError[c];
    }
    ({ region, regions } = findRegions(grid, level));
    markUnresolvable(levels, ctx.process?.minFeatureM ?? null);
  }

  // 5. flags and achieved errors
  onProgress?.("flags", 0);
  const { flags, relError, zeroTargetAbsError, warnings } = computeFlags({ reduced, targets, comps, level, levels, searches, perLevel, chosen, settings, materials, capped: FLAG_CAPPED, undefinedFlag: FLAG_UNDEFINED, axisAngleRad });
  if (nValid < n) warnings.push(noTargetWarning(grid, valid, n - nValid));
  warnings.push(...steps.notes);

  // 6. device-level figures
  onProgress?.("figures", 0);
  const cheapestEps = Math.min(...materials.filter((m) => !m.isMetal && m.eps.re > 0).map((m) => m.eps.re), Infinity);
  const summary = schemeSummary(reduced, field, { epsFloor: Number.isFinite(cheapestEps) ? cheapestEps : 1 });
  const figures = planFiguresFor({ grid, level, levels, regions: region, regionCount: regions.length, flags, relError, reduced, settings, k0: (2 * Math.PI * f) / C0, boundaryReflection: Number.isFinite(summary.boundaryReflection) ? summary.boundaryReflection : null, materials, process: ctx.process });
  const verdict = planVerdict({ cells: n, figures, settings, levels, maxZeroTargetAbsError: zeroTargetAbsError ? maxOf(zeroTargetAbsError) : NaN });
  if (regions.length * 3 > n && n >= 30) warnings.push(`the cells cannot be grouped into fewer than ${regions.length} regions (${n} cells): the levels interleave`);
  const plan: Plan = {
    design: { name: design.name, notes: design.notes ?? "", sourcePath: design.sourcePath, frequencyHz: f, wavelengthM: C0 / f, transform: design.transform.kind },
    settings,
    reductionBackground: { index: reduced.settings.backgroundIndex, given: givenBackgroundIndex(design, overrides) !== undefined },
    reductionNotes: reductionNotes(summary, settings, Number.isFinite(cheapestEps) ? cheapestEps : 1),
    grid,
    components: comps,
    targets,
    axisAngleRad,
    level,
    region,
    quantizationError,
    relError,
    zeroTargetAbsError,
    flags,
    levels,
    regions,
    quantization: { method: q.method, dimensions: q.dimensions, maxError: maxOf(quantizationError) },
    figures,
    buildable: verdict.buildable,
    verdict,
    minBackgroundIndex: summary.cellsEpsBelowFloor > 0 && Number.isFinite(summary.minBackgroundIndex) ? summary.minBackgroundIndex : null,
    remedies: null,
    warnings: layer ? [...layer.warnings, ...warnings] : warnings,
    layer,
  };
  onProgress?.("figures", 1);
  return plan;
}

/** The declared layer's mode at the design frequency (the ids were checked by checkIds). */
export function layerFor(l: LayerSetting, polarization: "Ez" | "Hz", catalog: readonly Material[], frequencyHz: number): LayerReport {
  const phase = (id: string) => {
    const m = catalog.find((x) => x.id === id)!;
    return { id, eps: evaluateMaterial(m, frequencyHz).eps, isMetal: m.class === "metal" };
  };
  return layerReport({ core: phase(l.coreId), thicknessM: l.thicknessM, below: phase(l.belowId), above: phase(l.aboveId), frequencyHz, polarization });
}

/** Largest finite entry (NaN when none). */
function maxOf(a: Float64Array): number {
  let m = NaN;
  for (let k = 0; k < a.length; k++) if (a[k] > m || (Number.isNaN(m) && Number.isFinite(a[k]))) m = a[k];
  return m;
}

/**
 * Per-cell quantization error without a floor: largest over components of |centre − t|/|t|
 * (components whose target is exactly zero are left out). Written into `out`.
 */
function floorlessQuantizationError(targets: Float64Array[], level: Int32Array, centres: number[][], out: Float64Array): void {
  for (let c = 0; c < level.length; c++) {
    const l = level[c];
    if (l < 0) continue;
    let e = 0;
    for (let k = 0; k < targets.length; k++) {
      const t = targets[k][c];
      if (t === 0) continue;
      const x = Math.abs(centres[l][k] - t) / Math.abs(t);
      if (x > e) e = x;
    }
    out[c] = e;
  }
}

/** The allowed materials evaluated at the design frequency (default: all valid there). */
export function evaluateMaterials(catalog: readonly Material[], ids: string[] | null, frequencyHz: number): EvaluatedMaterial[] {
  const chosen = ids === null ? catalog : ids.map((id) => catalog.find((m) => m.id === id)!);
  const out: EvaluatedMaterial[] = [];
  for (const m of chosen) {
    const value = evaluateMaterial(m, frequencyHz);
    if (ids === null && !value.inRange) continue;
    if (!Number.isFinite(value.eps.re) || !Number.isFinite(value.eps.im)) continue;
    out.push({ material: m, value, eps: value.eps, isMetal: m.class === "metal", isFluid: m.class === "liquid" });
  }
  return out;
}
