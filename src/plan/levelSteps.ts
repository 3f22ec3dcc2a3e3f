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

/** Error of a recipe against one cell's own targets: largest |achieved − target| / |target| (achieved complex, zero targets left out). */
function cellError(achieved: number[], achievedIm: number[], targets: Float64Array[], c: number): number {
  let e = 0;
  for (let k = 0; k < targets.length; k++) {
    const t = targets[k][c];
    if (t === 0) continue;
    const re = achieved[k] - t, im = achievedIm[k] ?? 0;
    const x = Math.sqrt(re * re + im * im) / Math.abs(t);
    if (x > e) e = x;
  }
  return e;
}

export interface StepMerge {
  /** 0-based indices of the levels merged away (their cells moved), ascending */
  removed: number[];
  /** one sentence per merge, for the report */
  notes: string[];
}

/**
 * Merge levels the process cannot tell apart when the tolerance allows: for each pair of levels
 * that `markUnresolvable` would mark (same kind of cell, every dimension within the process's
 * resolution), the cells of both are given one of the two recipes if every one of those cells then
 * stays within `tolerance` of its own target (error as the build list's `rel_error`: complex,
 * quantization included); of the two recipes the one with the smaller worst error is kept. Pairs are
 * merged best first, repeatedly, so a run of near-equal levels (ring radii 1010.3, 1011.3, 1012.8 µm
 * under 100 µm rules) becomes one level. Moves cells in `level` (in place) to the kept level's
 * index; the caller removes the levels listed in `removed` and renumbers. Pairs that would push a
 * cell over the tolerance stay separate (and stay flagged `unresolvable`).
 */
export function mergeUnresolvable(levels: PlanLevel[], level: Int32Array, targets: Float64Array[], tolerance: number, minFeatureM: number | null): StepMerge {
  const out: StepMerge = { removed: [], notes: [] };
  if (minFeatureM === null || !(minFeatureM > 0)) return out;
  const res = processResolutionM(minFeatureM);
  const cells: number[][] = levels.map(() => []);
  for (let c = 0; c < level.length; c++) if (level[c] >= 0) cells[level[c]].push(c);
  const alive = levels.map((lv) => lv.recipe !== null);
  const sameKind = (a: number, b: number): boolean => {
    const ra = levels[a].recipe!, rb = levels[b].recipe!;
    const keys = Object.keys(ra.dimensions);
    if (keys.length === 0 || rb.family !== ra.family || rb.host !== ra.host || rb.inclusion !== ra.inclusion || rb.lattice !== ra.lattice || rb.orientation !== ra.orientation) return false;
    const kb = Object.keys(rb.dimensions);
    return kb.length === keys.length && keys.every((k) => k in rb.dimensions && Math.abs(ra.dimensions[k] - rb.dimensions[k]) < res);
  };
  const worst = (keep: number, group: number[]): number => {
    const r = levels[keep].recipe!;
    let w = 0;
    for (const l of group) for (const c of cells[l]) w = Math.max(w, cellError(r.achieved, r.achievedIm, targets, c));
    return w;
  };
  for (;;) {
    let best: { keep: number; drop: number; err: number } | null = null;
    for (let a = 0; a < levels.length; a++) {
      if (!alive[a]) continue;
      for (let b = a + 1; b < levels.length; b++) {
        if (!alive[b] || !sameKind(a, b)) continue;
        for (const [keep, drop] of [[a, b], [b, a]]) {
          const err = worst(keep, [a, b]);
          if (err <= tolerance && (best === null || err < best.err)) best = { keep, drop, err };
        }
      }
    }
    if (!best) break;
    const { keep, drop, err } = best;
    for (const c of cells[drop]) level[c] = keep;
    cells[keep].push(...cells[drop]);
    cells[drop] = [];
    alive[drop] = false;
    out.removed.push(drop);
    const len = (m: number): string => (m < 1e-6 ? `${Number((m * 1e9).toPrecision(4))} nm` : m < 1e-3 ? `${Number((m * 1e6).toPrecision(4))} µm` : `${Number((m * 1e3).toPrecision(4))} mm`);
    const dims = (l: number): string => Object.entries(levels[l].recipe!.dimensions).map(([k, v]) => `${k.replace(/_m$/, "")} ${len(v)}`).join(", ");
    out.notes.push(`levels ${levels[keep].index} and ${levels[drop].index} differ by less than the process can make (${dims(drop)} vs ${dims(keep)}; resolution ${len(res)}): merged into level ${levels[keep].index}'s recipe, largest error of their cells ${Number((100 * err).toPrecision(3))} %`);
  }
  out.removed.sort((x, y) => x - y);
  return out;
}
