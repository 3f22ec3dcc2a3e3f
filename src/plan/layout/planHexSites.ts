/**
 * The hexagonal sites of a plan (hexSites.ts), shared by the layout files and the drawn full-wave
 * case: which cells take a hexagonal inclusion and of which kind, the built sites, and per level the
 * sites built and left out at the edge of their kind's cells. Pure.
 */
import type { Plan, Recipe } from "../planTypes.js";
import { hexSites, type HexSites } from "./hexSites.js";

const GASES = new Set(["air", "vacuum"]);

/** Families whose inclusion is a disc in the plan view (along z). */
const DISC_FAMILIES = new Set(["rods-in-host", "holes-in-slab", "wire-medium"]);

/**
 * The kind of hexagonal inclusion a recipe is — a disc along z on the hexagonal lattice — as a key
 * (family, host, inclusion: cells of one kind may stand side by side with different radii), or null.
 */
export function hexDiscKind(r: Recipe | null): string | null {
  if (!r || r.lattice !== "hex" || !DISC_FAMILIES.has(r.family) || r.orientation !== "z" || !(r.dimensions.radius_m > 0)) return null;
  return `${r.family}|${r.host}|${r.inclusion}`;
}

export interface PlanHexSites {
  sites: HexSites;
  /** per level (0-based): built sites, and sites left out because their share reaches outside their kind's cells */
  builtPerLevel: Int32Array;
  droppedPerLevel: Int32Array;
  /** the levels (0-based) whose recipes stand on the hexagonal lattice */
  hexLevels: number[];
}

/** The plan's hexagonal sites, or null when no level stands on the hexagonal lattice. */
export function planHexSites(plan: Pick<Plan, "grid" | "level" | "levels">): PlanHexSites | null {
  const keys = new Map<string, number>();
  const levelKind = plan.levels.map((lv) => {
    const k = hexDiscKind(lv.recipe);
    if (k === null) return -1;
    if (!keys.has(k)) keys.set(k, keys.size);
    return keys.get(k)!;
  });
  if (keys.size === 0) return null;
  const g = plan.grid;
  const kind = new Int32Array(g.count);
  for (let c = 0; c < g.count; c++) kind[c] = plan.level[c] >= 0 ? levelKind[plan.level[c]] : -1;
  const lut = new Int32Array(g.nx * g.ny).fill(-1); // lattice index i + nx·j → device cell
  for (let c = 0; c < g.count; c++) lut[g.i[c] + g.nx * g.j[c]] = c;
  // toward the outline: the share, or for an inclusion free in a gas host its own radius (hexSites.ts)
  const levelReach = plan.levels.map((lv) => (lv.recipe && GASES.has(lv.recipe.host) ? lv.recipe.dimensions.radius_m / g.pitchM : 0.5));
  const reach = new Float64Array(g.count).fill(0.5);
  for (let c = 0; c < g.count; c++) if (kind[c] >= 0) reach[c] = levelReach[plan.level[c]];
  const sites = hexSites(g, lut, kind, reach);
  const builtPerLevel = new Int32Array(plan.levels.length), droppedPerLevel = new Int32Array(plan.levels.length);
  for (let k = 0; k < sites.cell.length; k++) builtPerLevel[plan.level[sites.cell[k]]]++;
  for (let c = 0; c < g.count; c++) if (sites.droppedInCell[c]) droppedPerLevel[plan.level[c]] += sites.droppedInCell[c];
  const hexLevels = levelKind.flatMap((k, l) => (k >= 0 ? [l] : []));
  return { sites, builtPerLevel, droppedPerLevel, hexLevels };
}

/** The stderr/report line for the sites left out, or null when none was. */
export function droppedSitesNote(p: PlanHexSites, plan: Pick<Plan, "levels">): string | null {
  const parts: string[] = [];
  for (const l of p.hexLevels) if (p.droppedPerLevel[l]) parts.push(`level ${plan.levels[l].index}: ${p.droppedPerLevel[l]} of ${p.droppedPerLevel[l] + p.builtPerLevel[l]}`);
  if (!parts.length) return null;
  return `hexagonal sites left out at the edge of their kind's cells (their share, a disc of half a pitch, would reach a cell built another way, or they would cross the device outline): ${parts.join(", ")}`;
}
