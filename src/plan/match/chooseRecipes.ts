/**
 * Choosing one recipe per level. Each candidate gets a base score
 *   relError/tolerance + spread/tolerance (beyond the tolerance only) + (loss in dB per free-space
 *   wavelength, 20·log10(e)·2π·Im n)/10 + 1 if resonant + 2 if its homogenization is only "warn"
 *   + IN_PLANE_PENALTY for rods, holes or wires lying in the plane,
 * lower being better; then the plan-wide count of distinct materials is folded in: a few sweeps
 * re-pick each level's recipe with a penalty of MATERIAL_PENALTY for every material no other level
 * already uses, until nothing changes; then "elimination" moves try dropping one material from the
 * whole plan (every level re-picked without it) and keep the change when the total
 * Σ score + MATERIAL_PENALTY × distinct materials falls. At equal error the plan therefore uses
 * fewer materials.
 * The weights are our choice (documented in the README): error dominates, then material count,
 * then loss.
 */
import type { Candidate } from "./levelCandidates.js";

export const MATERIAL_PENALTY = 0.3;
/**
 * Rods, holes and wires lying in the plane (orientation 1 or 2) cost a quarter of the tolerance's
 * worth of error more than the same family along z: they have no plan-view layout and are harder to
 * build in a device invariant along z, so a z recipe whose error is close (within a quarter of the
 * tolerance, or a little lower loss) is preferred; a clearly better in-plane recipe still wins.
 */
export const IN_PLANE_PENALTY = 0.25;
const AXIAL_FAMILIES = new Set(["rods-in-host", "holes-in-slab", "wire-medium"]);
/** dB of attenuation per free-space wavelength per unit Im n: 20·log10(e)·2π. */
const DB_PER_WAVELENGTH = (20 / Math.LN10) * 2 * Math.PI;
export const RUNNERS_UP = 5;

export function baseScore(c: Candidate, tolerance: number): number {
  return (
    c.relError / tolerance +
    Math.max(0, c.spread - tolerance) / tolerance +
    (DB_PER_WAVELENGTH * c.indexIm) / 10 +
    (c.resonant ? 1 : 0) +
    (c.homogenization === "warn" ? 2 : 0) +
    (AXIAL_FAMILIES.has(c.family) && c.orientation !== null && c.orientation !== "z" ? IN_PLANE_PENALTY : 0)
  );
}

function materialsOf(c: Candidate): string[] {
  return c.inclusion ? [c.host, c.inclusion] : [c.host];
}

/**
 * Index of the chosen candidate of each level (-1 when a level has none). `perLevel[l]` is sorted
 * by base score on return, and each candidate's `score` holds its final score.
 */
export function chooseRecipes(perLevel: Candidate[][], tolerance: number): number[] {
  for (const list of perLevel) {
    for (const c of list) c.score = baseScore(c, tolerance);
    list.sort((a, b) => a.score - b.score || a.family.localeCompare(b.family) || a.host.localeCompare(b.host) || a.inclusion.localeCompare(b.inclusion));
  }
  let chosen: number[] = perLevel.map((list) => (list.length ? 0 : -1));
  chosen = sweep(perLevel, chosen);
  // elimination moves: drop one material from the whole plan when that lowers the total
  for (let round = 0; round < 20; round++) {
    const current = totalScore(perLevel, chosen);
    let improved = false;
    for (const m of usedMaterials(perLevel, chosen)) {
      const trial = perLevel.map((list, l) => {
        if (chosen[l] < 0) return -1;
        let best = -1;
        list.forEach((c, k) => { if (!materialsOf(c).includes(m) && (best < 0 || c.score < list[best].score)) best = k; });
        return best;
      });
      if (trial.some((k, l) => k < 0 && chosen[l] >= 0)) continue; // some level needs m
      const swept = sweep(perLevel, trial);
      if (totalScore(perLevel, swept) < current - 1e-12) { chosen = swept; improved = true; break; }
    }
    if (!improved) break;
  }
  for (let l = 0; l < perLevel.length; l++) {
    if (chosen[l] < 0) continue;
    const used = usedMaterials(perLevel, chosen, l);
    const c = perLevel[l][chosen[l]];
    c.score += MATERIAL_PENALTY * materialsOf(c).filter((id) => !used.has(id)).length;
  }
  return chosen;
}

/** Materials used by the chosen recipes (of every level but `skip`). */
function usedMaterials(perLevel: Candidate[][], chosen: number[], skip = -1): Set<string> {
  const used = new Set<string>();
  chosen.forEach((k, l) => { if (k >= 0 && l !== skip) for (const id of materialsOf(perLevel[l][k])) used.add(id); });
  return used;
}

/** Σ base scores + MATERIAL_PENALTY × distinct materials: what the choice minimises. */
export function totalScore(perLevel: Candidate[][], chosen: number[]): number {
  let t = 0;
  chosen.forEach((k, l) => { if (k >= 0) t += perLevel[l][k].score; });
  return t + MATERIAL_PENALTY * usedMaterials(perLevel, chosen).size;
}

/** Coordinate sweeps: re-pick each level given the others' materials, until nothing changes. */
function sweep(perLevel: Candidate[][], start: number[]): number[] {
  const chosen = [...start];
  for (let round = 0; round < 6; round++) {
    let changed = false;
    for (let l = 0; l < perLevel.length; l++) {
      if (chosen[l] < 0) continue;
      const used = usedMaterials(perLevel, chosen, l);
      let best = chosen[l], bestScore = Infinity;
      perLevel[l].forEach((c, k) => {
        const s = c.score + MATERIAL_PENALTY * materialsOf(c).filter((id) => !used.has(id)).length;
        if (s < bestScore - 1e-12) { bestScore = s; best = k; }
      });
      if (best !== chosen[l]) { chosen[l] = best; changed = true; }
    }
    if (!changed) break;
  }
  return chosen;
}
