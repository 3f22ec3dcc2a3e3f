/**
 * Per-cell flags: one bit each in a Uint16Array, with a one-word name of our own and a meaning
 * (the README lists them). A cell may carry several.
 */
export const FLAGS = [
  { name: "subunity", meaning: "a permittivity below 1 is needed (no ordinary dielectric mix gives it)" },
  { name: "magnetic", meaning: "a relative permeability other than 1 is needed (only resonant cells give it)" },
  { name: "anisotropic", meaning: "the in-plane anisotropy ratio is above the design's maxAnisotropy" },
  { name: "unreachable", meaning: "the target lies outside the bounds of every allowed material pair" },
  { name: "undersize", meaning: "a recipe needs a feature or gap below the process limit" },
  { name: "coarse", meaning: "the pitch is above λ/10 in the cell's densest material and, for rods and holes along z, the lowest band departs from the long-wavelength index by more than the tolerance (refused beyond λ/4)" },
  { name: "uncertain", meaning: "the cell model's own uncertainty exceeds the tolerance (solved cell not converged, or no solved model covers the cell and the closed forms disagree, or the resonant model's standard forms disagree): verify with a full-wave unit-cell simulation" },
  { name: "capped", meaning: "the target was capped or offset at a singularity of the map" },
  { name: "norecipe", meaning: "no allowed material, family and lattice reaches the target" },
  { name: "inexact", meaning: "the achieved value is off the cell's target by more than the tolerance" },
  { name: "narrowband", meaning: "a resonant recipe holds the target over less than the required bandwidth" },
] as const;

export type FlagName = (typeof FLAGS)[number]["name"];

/** Bit of each flag. */
export const FLAG_BIT = Object.fromEntries(FLAGS.map((f, k) => [f.name, 1 << k])) as Record<FlagName, number>;

export const F_SUBUNITY = FLAG_BIT.subunity;
export const F_MAGNETIC = FLAG_BIT.magnetic;
export const F_ANISOTROPIC = FLAG_BIT.anisotropic;
export const F_UNREACHABLE = FLAG_BIT.unreachable;
export const F_UNDERSIZE = FLAG_BIT.undersize;
export const F_COARSE = FLAG_BIT.coarse;
export const F_UNCERTAIN = FLAG_BIT.uncertain;
export const F_CAPPED = FLAG_BIT.capped;
export const F_NORECIPE = FLAG_BIT.norecipe;
export const F_INEXACT = FLAG_BIT.inexact;
export const F_NARROWBAND = FLAG_BIT.narrowband;

/** Flags that explain why a cell's achieved value may be off its target. */
export const EXPLAINS_ERROR = F_NORECIPE | F_INEXACT | F_CAPPED | F_UNREACHABLE | F_NARROWBAND;

/** Names of the flags set in `mask`, in table order. */
export function flagNames(mask: number): FlagName[] {
  const out: FlagName[] = [];
  for (let k = 0; k < FLAGS.length; k++) if (mask & (1 << k)) out.push(FLAGS[k].name);
  return out;
}

/** "subunity;magnetic" for the build list ("" when none). Memoised per mask (few distinct masks). */
const joined = new Map<number, string>();
export function flagList(mask: number): string {
  let s = joined.get(mask);
  if (s === undefined) {
    s = flagNames(mask).join(";");
    joined.set(mask, s);
  }
  return s;
}

/** Count of cells per flag name (every flag present, zero included). */
export function countFlags(flags: Uint16Array): Record<FlagName, number> {
  const counts = new Float64Array(FLAGS.length);
  for (let c = 0; c < flags.length; c++) {
    const m = flags[c];
    if (m === 0) continue;
    for (let k = 0; k < FLAGS.length; k++) if (m & (1 << k)) counts[k]++;
  }
  return Object.fromEntries(FLAGS.map((f, k) => [f.name, counts[k]])) as Record<FlagName, number>;
}
