/**
 * A plan's recipes re-evaluated at another frequency: the cell as built (family, materials,
 * lattice, orientation, fill fraction and sizes are fixed by the plan at the design frequency)
 * answers with its own effective values at f. This is what the frequency sweep feeds to the
 * realized case, so dispersion shows up full-wave:
 * - every material through its catalog dispersion model at f (Drude, Lorentz, Debye …; a declared
 *   layer's core through its slab mode at f, as the planner does at the design frequency);
 * - mixing families through the same family model the matcher used (family.effectivePermittivity
 *   at the recipe's fill), so a wire medium follows its Drude form ε(f) = ε_h − f_p²/(f(f + iγ/2π))
 *   with the lattice plasma frequency fixed by the built radius (Pendry et al., J. Phys.: Condens.
 *   Matter 10, 4785 (1998); Belov, Tretyakov & Viitanen, J. Electromagn. Waves Appl. 16, 1153
 *   (2002)) and γ from the skin depth at f;
 * - split rings through the Lorentz μ(f) of the built geometry (splitRingResponse: resonance from
 *   the sizes and the board's ε at f, damping at f; Pendry et al., IEEE Trans. MTT 47, 2075 (1999);
 *   Marqués et al., Phys. Rev. B 65, 144440 (2002) for printed rings), with the board/air cell ε as
 *   the parallel (Wiener) mix the matcher used;
 * - solid cells as their material at f.
 * At the design frequency each function gives back the plan's own achieved values (a test checks
 * this for every demo), so the sweep's centre is the plan and nothing else.
 */
import { EPS0_F_PER_M } from "../../core/physicalConstants.js";
import { complex, type Complex } from "../../core/complex.js";
import { getCellFamily } from "../../cells/registry.js";
import { splitRingResponse, ringStyleFor, type SplitRingGeometry } from "../../cells/splitRing.js";
import { evaluateMaterial, type Material } from "../../media/material.js";
import { rectTiling } from "../../cells/lattice.js";
import { axisValue } from "../../cells/cellFamily.js";
import { axisFor } from "../../plan/match/componentMapping.js";
import { SOLID_FAMILY, VACUUM_ID } from "../../plan/match/solidCandidates.js";
import type { Plan, PlanLevel, Recipe, TargetComponent } from "../../plan/planTypes.js";
import { evaluateMaterials, layerFor } from "../../plan/runPlan.js";

/** What re-evaluating a recipe needs besides the recipe: taken from the plan and the catalog. */
export interface RecipeContext {
  components: readonly TargetComponent[];
  pitchM: number;
  polarization: "Ez" | "Hz";
  catalog: readonly Material[];
  /** the plan's settings that change a material's value or a ring's style */
  settings: Plan["settings"];
  /** the design frequency (the matcher's allowed materials and the boards' surrounding gas were chosen there) */
  designFrequencyHz: number;
}

/** Achieved values of a recipe at one frequency, in the plan's component order. */
export interface RecipeValues {
  re: number[];
  im: number[];
}

/** The recipe context of a plan. */
export function recipeContext(plan: Plan, catalog: readonly Material[]): RecipeContext {
  return { components: plan.components, pitchM: plan.grid.pitchM, polarization: plan.settings.polarization, catalog, settings: plan.settings, designFrequencyHz: plan.design.frequencyHz };
}

/** ε of a catalog material at f as the planner sees it (a declared layer's core: its slab mode). */
function materialEps(ctx: RecipeContext, id: string, frequencyHz: number): { eps: Complex; mu: Complex; material: Material } {
  const m = ctx.catalog.find((x) => x.id === id);
  if (!m) throw new RangeError(`recipeAtFrequency: material '${id}' is not in the catalog the plan was made with`);
  const v = evaluateMaterial(m, frequencyHz);
  const layer = ctx.settings.layer;
  if (layer && layer.coreId === id) return { eps: layerFor(layer, ctx.polarization, ctx.catalog, frequencyHz).coreEps, mu: v.mu, material: m };
  return { eps: v.eps, mu: v.mu, material: m };
}

/** σ of a metal for ring and wire losses: its DC conductivity, else ωε₀·Im ε at f (as the matcher does). */
function conductivityAt(metal: Material, eps: Complex, frequencyHz: number): number {
  return metal.conductivitySPerM ?? 2 * Math.PI * frequencyHz * EPS0_F_PER_M * eps.im;
}

/**
 * The recipe's achieved values at `frequencyHz` (see file comment). Throws RangeError when the
 * recipe names a material missing from the catalog or a family the registry does not know (the
 * plan was made with another catalog: a programmer error here).
 */
export function recipeAtFrequency(recipe: Recipe, ctx: RecipeContext, frequencyHz: number): RecipeValues {
  const comps = ctx.components;
  const re = new Array<number>(comps.length), im = new Array<number>(comps.length);
  const put = (k: number, v: Complex): void => { re[k] = v.re; im[k] = v.im; };
  if (recipe.family === SOLID_FAMILY) {
    const m = recipe.host === VACUUM_ID ? { eps: complex(1), mu: complex(1) } : materialEps(ctx, recipe.host, frequencyHz);
    comps.forEach((c, k) => put(k, c.kind === "eps" ? m.eps : m.mu));
    return { re, im };
  }
  if (recipe.family === "split-ring") return splitRingAt(recipe, ctx, frequencyHz);
  const family = getCellFamily(recipe.family);
  const host = materialEps(ctx, recipe.host, frequencyHz);
  const inc = materialEps(ctx, recipe.inclusion, frequencyHz);
  // rect recipes: the device cell holds m × n circles (levelCandidates.ts), the family's pitch is p/m
  const tiling = recipe.aspect !== undefined ? rectTiling(recipe.aspect) : null;
  const context = { pitchM: tiling ? ctx.pitchM / tiling.m : ctx.pitchM, frequencyHz, conductivitySPerM: inc.material.conductivitySPerM, ...(recipe.aspect !== undefined ? { aspect: recipe.aspect } : {}) };
  const ap = family.effectivePermittivity(host.eps, inc.eps, recipe.fillFraction, recipe.lattice, context);
  const o = recipe.orientation ?? "z";
  comps.forEach((c, k) => put(k, c.kind === "eps" ? axisValue(ap, axisFor(family, o, c.axis, recipe.lattice)) : complex(1)));
  return { re, im };
}

/** Split rings on boards (levelCandidates.ts, splitRing()): the built geometry's μ(f) and the board/air mix's ε(f). */
function splitRingAt(recipe: Recipe, ctx: RecipeContext, frequencyHz: number): RecipeValues {
  const comps = ctx.components;
  const d = recipe.dimensions;
  const a = ctx.pitchM;
  const host = materialEps(ctx, recipe.host, frequencyHz);
  const metal = materialEps(ctx, recipe.inclusion, frequencyHz);
  const boardM = d.board_thickness_m;
  const boardFill = boardM / a;
  // the boards stand in the first allowed gas at the design frequency (as the matcher chose it)
  const gas = evaluateMaterials(ctx.catalog, ctx.settings.materials, ctx.designFrequencyHz).find((m) => m.material.class === "gas");
  let cellEps = host.eps;
  if (boardFill < 1 && gas) {
    const g = materialEps(ctx, gas.material.id, frequencyHz).eps;
    cellEps = { re: boardFill * host.eps.re + (1 - boardFill) * g.re, im: boardFill * host.eps.im + (1 - boardFill) * g.im };
  }
  const style = ringStyleFor({
    pitchM: a, frequencyHz: ctx.designFrequencyHz, targetMu: 0, conductivitySPerM: 0,
    hostEpsRe: materialEps(ctx, recipe.host, ctx.designFrequencyHz).eps.re, hostClass: host.material.class, processId: ctx.settings.process ?? undefined,
  });
  const geometry: SplitRingGeometry = {
    ringStyle: style,
    pitchM: a,
    ringRadiusM: d.ring_radius_m,
    ringWidthM: d.ring_width_m,
    ringGapM: d.ring_gap_m,
    ...(d.split_gap_m !== undefined ? { splitGapM: d.split_gap_m } : {}),
    // a board thinner than the cell was designed as such; a full cell as a thick board (designSplitRing)
    ...(style === "printed" && boardFill < 1 ? { boardThicknessM: boardM } : {}),
  };
  const sigma = conductivityAt(metal.material, metal.eps, frequencyHz);
  const mu = splitRingResponse(geometry, sigma, frequencyHz, host.eps).mu;
  const magnetic = comps.findIndex((c) => c.kind === "mu" && c.axis === recipe.orientation);
  const re = new Array<number>(comps.length), im = new Array<number>(comps.length);
  comps.forEach((c, k) => {
    const v = c.kind === "eps" ? cellEps : k === magnetic ? mu : complex(1);
    re[k] = v.re; im[k] = v.im;
  });
  return { re, im };
}

/**
 * The plan as built, seen at `frequencyHz`: the same levels, cells and recipes, each recipe's
 * achieved values replaced by its values at f. The plan itself is not changed.
 */
export function planAtFrequency(plan: Plan, catalog: readonly Material[], frequencyHz: number): Plan {
  const ctx = recipeContext(plan, catalog);
  const levels = plan.levels.map((l): PlanLevel => {
    if (!l.recipe) return l;
    const v = recipeAtFrequency(l.recipe, ctx, frequencyHz);
    return { ...l, recipe: { ...l.recipe, achieved: v.re, achievedIm: v.im } };
  });
  return { ...plan, levels };
}
