/**
 * Level steps the process cannot make. Two levels whose recipes are the same kind of cell (family,
 * materials, lattice, orientation) and whose every dimension differs by less than the process's
 * dimensional resolution would come out of the shop as the same cell: both are marked
 * `unresolvable`, and the verdict counts them as a missed process limit.
 *
 * The resolution is taken as a quarter of the process's smallest feature (our choice; common
 * practice puts the dimensional tolerance of an etch, cut or print at a fraction of its smallest
 * feature, e.g. ±25 µm on 100 µm printed-circuit rules — from memory). Without a process nothing
 * is marked.
 */
import type { PlanLevel } from "./planTypes.js";

export const RESOLUTION_PER_MIN_FEATURE = 0.25;

/** Dimensional resolution of a process whose smallest feature is `minFeatureM`. */
export function processResolutionM(minFeatureM: number): number {
  return RESOLUTION_PER_MIN_FEATURE * minFeatureM;
}

/** Marks `unresolvable` on the levels (in place). */
export function markUnresolvable(levels: PlanLevel[], minFeatureM: number | null): void {
  for (const l of levels) l.unresolvable = false;
  if (minFeatureM === null || !(minFeatureM > 0)) return;
  const res = processResolutionM(minFeatureM);
  for (let a = 0; a < levels.length; a++) {
    const ra = levels[a].recipe;
    if (!ra) continue;
    const keys = Object.keys(ra.dimensions);
    if (keys.length === 0) continue;
    for (let b = a + 1; b < levels.length; b++) {
      const rb = levels[b].recipe;
      if (!rb || rb.family !== ra.family || rb.host !== ra.host || rb.inclusion !== ra.inclusion || rb.lattice !== ra.lattice || rb.orientation !== ra.orientation) continue;
      const kb = Object.keys(rb.dimensions);
      if (kb.length !== keys.length || !keys.every((k) => k in rb.dimensions)) continue;
      if (keys.every((k) => Math.abs(ra.dimensions[k] - rb.dimensions[k]) < res)) {
        levels[a].unresolvable = true;
        levels[b].unresolvable = true;
      }
    }
  }
}
