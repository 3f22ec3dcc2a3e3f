/** The machine-readable summary of a plan (summary.json, and stdout with `plan --json`). */
import type { Plan, PlanSummary } from "../planTypes.js";
import { planHexSites } from "../layout/planHexSites.js";

/** Build the summary object; `outputs` are the paths written (empty before writing). */
export function planSummary(plan: Plan, outputs: string[]): PlanSummary {
  const f = plan.figures;
  const materials = f.billOfMaterials.map((b) => b.material);
  return {
    design: plan.design.name,
    cells: plan.grid.count,
    levels: plan.levels.length,
    regions: plan.regions.length,
    flags: { ...f.flagCounts },
    maxRelError: Number.isFinite(f.maxRelError) ? f.maxRelError : null,
    medianRelError: Number.isFinite(f.medianRelError) ? f.medianRelError : null,
    lossDb: f.lossDb,
    boundaryReflection: f.boundaryReflection,
    minBandwidth: f.minBandwidth,
    materials,
    heightM: f.height.heightM,
    billOfMaterials: f.billOfMaterials.map((b) => ({ material: b.material, cells: b.cells, volumeM3: b.volume, order: { ...b.order } })),
    outputs,
    buildable: plan.buildable,
    verdict: { buildable: plan.verdict.buildable, missed: plan.verdict.missed.map(({ what, value, limit, levels, worst }) => ({ what, value, limit, ...(levels ? { levels: [...levels] } : {}), ...(worst && Number.isFinite(worst.value) ? { worst: { ...worst } } : {}) })) },
    ...(plan.remedies ? { remedies: plan.remedies.remedies.map((r) => ({ label: r.label, changes: r.changes, buildable: r.buildable, overrides: r.overrides, pitchM: r.pitchM, ...(r.design ? { design: { ...r.design } } : {}), effects: r.effects.map(({ what, before, after, limit }) => ({ what, before, after, limit })) })) } : {}),
    ...(plan.remedies?.notes ? { remedyNotes: [...plan.remedies.notes] } : {}),
    polarization: plan.settings.polarization,
    scheme: plan.settings.scheme,
    tolerance: plan.settings.tolerance,
    ...hexSitesSummary(plan),
    warnings: [...(plan.timeWarning !== undefined ? [plan.timeWarning] : []), ...plan.warnings],
  };
}

/** The `hexSites` entry of a plan with hexagonal-lattice levels (none otherwise). */
function hexSitesSummary(plan: Plan): { hexSites?: NonNullable<PlanSummary["hexSites"]> } {
  const p = planHexSites(plan);
  if (!p) return {};
  const levels = p.hexLevels.filter((l) => plan.levels[l].cellCount > 0).map((l) => ({ level: plan.levels[l].index, cells: plan.levels[l].cellCount, built: p.builtPerLevel[l], leftOut: p.droppedPerLevel[l] }));
  return { hexSites: { built: p.sites.cell.length, leftOut: p.sites.dropped, levels } };
}
