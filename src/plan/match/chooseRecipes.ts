/**
 * Choosing one recipe per level. Each candidate gets a base score
 *   relError/tolerance + spread/tolerance (beyond the tolerance only) + (loss in dB per free-space
 *   wavelength, 20·log10(e)·2π·Im n)/10 + 1 if resonant + 2 if its homogenization is only "warn",
 * lower being better; then the plan-wide count of distinct materials is folded in: a few sweeps
 * re-pick each level's recipe with a penalty of MATERIAL_PENALTY for every material no other level
 * already uses, until nothing changes. At equal error the plan therefore uses fewer materials.
 * The weights are our choice (documented in the README): error dominates, then material count,
 * then loss.
 */
import type { Candidate } from "./levelCandidates.js";

export const MATERIAL_PENALTY = 0.3;
/** dB of attenuation per free-space wavelength per unit Im n: 20·log10(e)·2π. */
const DB_PER_WAVELENGTH = (20 / Math.LN10) * 2 * Math.PI;
export const RUNNERS_UP = 5;

export function baseScore(c: Candidate, tolerance: number): number {
  return (
    c.relError / tolerance +
    Math.max(0, c.spread - tolerance) / tolerance +
    (DB_PER_WAVELENGTH * c.indexIm) / 10 +
    (c.resonant ? 1 : 0) +
    (c.homogenization === "warn" ? 2 : 0)
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
  const chosen: number[] = perLevel.map((list) => (list.length ? 0 : -1));
  for (let sweep = 0; sweep < 6; sweep++) {
    let changed = false;
    for (let l = 0; l < perLevel.length; l++) {
      if (chosen[l] < 0) continue;
      const used = new Map<string, number>();
      chosen.forEach((k, m) => {
        if (k >= 0 && m !== l) for (const id of materialsOf(perLevel[m][k])) used.set(id, (used.get(id) ?? 0) + 1);
      });
      let best = chosen[l], bestScore = Infinity;
      perLevel[l].forEach((c, k) => {
        const fresh = materialsOf(c).filter((id) => !used.has(id)).length;
        const s = c.score + MATERIAL_PENALTY * fresh;
        if (s < bestScore - 1e-12) { bestScore = s; best = k; }
      });
      if (best !== chosen[l]) { chosen[l] = best; changed = true; }
    }
    if (!changed) break;
  }
  return chosen;
}
