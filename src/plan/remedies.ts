/**
 * "What would help": remedies for a plan that misses a requirement, each TRIED by re-planning the
 * same design before it is offered. A remedy is a change of the plan's settings (another
 * background index, allowing a family or every material, more or fewer levels, another scheme or
 * polarization) or of the pitch; it is kept only when the re-planned verdict is better than the
 * current one (betterThan: requirement by requirement in PRIORITY order, cells without a recipe
 * first), and it is printed with what it changes, requirement by requirement, worse ones included
 * ("recipes: 2640 → 641 cells without recipe; tolerance: met → 18.6 %"). The best MAX_SHOWN are
 * returned, ranked the same way. Nothing untried is ever returned.
 *
 * A design that names the material its device sits in (`reduction.backgroundMaterial`) cannot take a
 * bare background index (the plan refuses an index more than 1 % from the material's): its
 * background remedies name a catalog material instead, with both design keys to set, and are
 * re-planned with that design; when no catalog material lifts every ε, a note says so.
 *
 * Pure: the caller supplies `replan` (settings overrides and an optional pitch → a new Plan, or
 * null when that change cannot be planned, e.g. a new pitch for an imported field). Cost: one plan
 * per candidate, at most MAX_TRIES candidates (about as long as MAX_TRIES plans of the design).
 */
import { CELL_FAMILIES } from "../cells/registry.js";
import { InputError } from "../core/errors.js";
import { REDUCTION_SCHEMES } from "../reduce/schemes/registry.js";
import { REDUCTION_SCHEME_NAMES } from "../reduce/schemes/schemeNames.js";
import { MAX_LEVELS, type MissedRequirement, type Plan, type PlanOverrides, type RequirementName, type SchemeName } from "./planTypes.js";
import { missSeverity } from "./verdict.js";
import { F_COARSE } from "./flags.js";
import { significantAtLeast } from "../core/formatQuantity.js";

/** Largest number of re-plans one call may run. */
export const MAX_TRIES = 10;
/** Remedies offered. */
export const MAX_SHOWN = 3;

/** A change to try. */
export interface RemedyChange {
  /** what the change is, for people: "allow the split-ring family" */
  label: string;
  /** settings to override (merged over the plan's current overrides) */
  overrides: PlanOverrides;
  /** a new pitch, metres (null: keep) */
  pitchM: number | null;
  /**
   * design keys the change sets (absent: none): another background material and its index, which
   * no option gives (`overrides.backgroundIndex` carries the same index for the re-plan)
   */
  design?: { backgroundMaterial: string; backgroundIndex: number };
}

/** One requirement before and after a remedy. */
export interface RemedyEffect {
  what: RequirementName;
  before: number | null;
  after: number | null;
  limit: number;
  met: boolean;
}

/** A remedy that was tried and improves the verdict. */
export interface Remedy extends RemedyChange {
  /** buildable after the change */
  buildable: boolean;
  /** requirements missed before or after, with their figures before and after */
  effects: RemedyEffect[];
  /** requirements still missed after the change */
  missedAfter: MissedRequirement[];
  /** "recipes 432 → 0 (met); loss 6.02 → 2.1 dB (met)" */
  changes: string;
}

export interface RemedyResult {
  remedies: Remedy[];
  /** how many changes were tried by re-planning */
  tried: number;
  /** what was not tried and why, for people (absent: nothing to say) */
  notes?: string[];
}

export type Replan = (change: RemedyChange) => Plan | null;

/** What the search may know beyond the plan (the shell supplies it). */
export interface RemedyContext {
  /** the catalog's materials valid at the design frequency, with Re n (for "a lower-index material") */
  materials?: readonly { id: string; index: number }[];
  /**
   * the design's `reduction.backgroundMaterial` and the catalog's materials that can be a background
   * (dielectric, non-magnetic, valid at the design frequency) with their index there; absent when
   * the design names no background material
   */
  background?: { materialId: string; choices: readonly BackgroundChoice[] };
}

/** A catalog material that can surround the device, with its index at the design frequency. */
export interface BackgroundChoice { id: string; name: string; index: number }

/**
 * Candidate changes for a plan's misses, most promising first (at most MAX_TRIES). The changes
 * aimed at coarse cells and model uncertainty are kept in the list whatever comes before them.
 */
export function candidateChanges(plan: Plan, context: RemedyContext = {}): RemedyChange[] {
  const s = plan.settings;
  const missed = new Set(plan.verdict.missed.map((m) => m.what));
  const out: RemedyChange[] = [];
  const counts = plan.figures.flagCounts;
  const subunity = (counts.subunity ?? 0) > 0 || (counts.unreachable ?? 0) > 0;
  const magnetic = (counts.magnetic ?? 0) > 0;
  if (missed.has("recipes") || missed.has("tolerance")) {
    const lift = backgroundLiftIndex(plan);
    if (lift !== null) {
      // the smallest index that lifts every ε above the lowest material, then a third more (room
      // for the mixes between the materials), alone and with every material and family allowed
      const [first, second] = backgroundChoices(lift, context);
      if (first) {
        out.push(first([]));
        if (s.families !== null || s.materials !== null) out.push(first(["materials", "families"]));
      }
      if (second) out.push(second(["materials", "families"]));
    }
    if (s.families !== null) {
      const wanted = [...(magnetic ? ["split-ring"] : []), ...(subunity ? ["wire-medium"] : [])].filter((id) => !s.families!.includes(id) && CELL_FAMILIES.some((f) => f.id === id));
      for (const id of wanted) out.push({ label: `allow the ${id} family`, overrides: { families: [...s.families, id] }, pitchM: null });
      out.push({ label: "allow every cell family", overrides: { families: null }, pitchM: null });
    }
    if (s.materials !== null) out.push({ label: "allow every catalog material", overrides: { materials: null }, pitchM: null });
  }
  if (missed.has("tolerance")) {
    const now = plan.levels.length;
    const more = Math.min(MAX_LEVELS, Math.max(now + 2, now * 2));
    if (more > now) out.push({ label: `use up to ${more} levels`, overrides: { levels: more }, pitchM: null });
  }
  if (missed.has("recipes") || missed.has("tolerance") || missed.has("loss") || missed.has("bandwidth") || missed.has("anisotropy")) {
    for (const name of REDUCTION_SCHEME_NAMES) {
      const sc = REDUCTION_SCHEMES[name];
      if (name === s.scheme || !sc.polarizations.includes(s.polarization)) continue;
      out.push({ label: `reduce with the ${name} scheme`, overrides: { scheme: name as SchemeName }, pitchM: null });
    }
    const other = s.polarization === "Ez" ? "Hz" : "Ez";
    const otherScheme = REDUCTION_SCHEME_NAMES.find((n) => n === s.scheme && REDUCTION_SCHEMES[n].polarizations.includes(other))
      ?? REDUCTION_SCHEME_NAMES.find((n) => REDUCTION_SCHEMES[n].polarizations.includes(other) && n !== "full")
      ?? "full";
    out.push({ label: `serve the ${other} polarization (${otherScheme} scheme)`, overrides: { polarization: other, scheme: otherScheme as SchemeName }, pitchM: null });
  }
  if (missed.has("process") && plan.levels.length > 2) {
    for (const fewer of [Math.ceil(plan.levels.length / 2), Math.ceil(plan.levels.length / 3)]) {
      if (fewer >= 2 && fewer < plan.levels.length) out.push({ label: `use at most ${fewer} levels (larger steps between them)`, overrides: { levels: fewer }, pitchM: null });
    }
  }
  if (missed.has("process") || (counts.undersize ?? 0) > 0) {
    out.push({ label: `coarser pitch (${pitchText(plan.grid.pitchM * 1.5)})`, overrides: {}, pitchM: plan.grid.pitchM * 1.5 });
  }
  const kept = [...coarseChanges(plan, context), ...uncertaintyChanges(plan)];
  if ((counts.coarse ?? 0) > 0 && (missed.has("recipes") || missed.has("tolerance")) && !kept.some((c) => c.pitchM !== null && c.pitchM < plan.grid.pitchM)) {
    out.push({ label: `finer pitch (${pitchText(plan.grid.pitchM / 1.5)})`, overrides: {}, pitchM: plan.grid.pitchM / 1.5 });
  }
  return [...out.slice(0, MAX_TRIES - kept.length), ...kept];
}

type BackgroundChange = (allowEvery: ("materials" | "families")[]) => RemedyChange;

/**
 * The two backgrounds to try for a plan whose ε must be lifted to `minIndex`: an index 2 % above it
 * and one a third above it; for a design that names its background material, the catalog's
 * material with the lowest index from `minIndex` up and the one nearest a third above it (null when
 * none, or the same one). Each as a change builder: alone, or allowing every material and family.
 */
function backgroundChoices(minIndex: number, context: RemedyContext): [BackgroundChange | null, BackgroundChange | null] {
  const every = (allow: ("materials" | "families")[]): PlanOverrides => Object.fromEntries(allow.map((k) => [k, null]));
  const tail = (allow: readonly string[]): string => (allow.length ? " and allow every material and family" : "");
  const bg = context.background;
  if (!bg) {
    const byIndex = (nb: number): BackgroundChange => (allow) => ({ label: `embed the device in a background of index ${nb}${tail(allow)}`, overrides: { backgroundIndex: nb, ...every(allow) }, pitchM: null });
    return [byIndex(Number((minIndex * 1.02).toPrecision(3))), byIndex(Number((minIndex * 1.33).toPrecision(3)))];
  }
  // the index as printed (5 digits, as the background check prints it) is the index re-planned
  const fits = backgroundFits(minIndex, bg);
  if (fits.length === 0) return [null, null];
  const lowest = fits.reduce((a, m) => (m.index < a.index ? m : a));
  const target = minIndex * 1.33;
  const nearest = fits.reduce((a, m) => (Math.abs(Math.log(m.index / target)) < Math.abs(Math.log(a.index / target)) ? m : a));
  const byMaterial = (m: BackgroundChoice): BackgroundChange => (allow) => {
    const n = Number(m.index.toPrecision(5));
    return {
      label: `embed the device in ${m.name}, index ${n} at the design frequency (set reduction.backgroundMaterial to "${m.id}", reduction.backgroundIndex to ${n})${allow.length ? "," : ""}${tail(allow)}`,
      overrides: { backgroundIndex: n, ...every(allow) },
      pitchM: null,
      design: { backgroundMaterial: m.id, backgroundIndex: n },
    };
  };
  return [byMaterial(lowest), nearest.id === lowest.id ? null : byMaterial(nearest)];
}

/**
 * The index a background must reach to lift every ε above the lowest allowed material, when the
 * search tries such a background (candidateChanges) or says why it cannot (backgroundNotes): cells
 * need ε below every material (flag subunity or unreachable), recipes or the tolerance are missed,
 * and the plan gives a finite index. Null when no background lift is to be tried.
 *
 * The index is not compared with a background index: the plan holds one only when cells of its own
 * reduction need ε below the floor, and it then exceeds the index of the non-magnetic background
 * that gives this reduction's ε (reduce/schemeMetrics.ts: n_b = √(floor/(k·ε_min)), k the
 * reduction's `epsAtUnitIndex`, 1/√k that background's index; ε_min < floor, so n_b > 1/√k), so
 * the change is never the background the plan already has.
 * `settings.backgroundIndex` is 1 when the design gives no index, whatever its own background (a
 * background of ε 0.64 needed index 1 and was never tried), and the index the reduction used,
 * √(ε_b μ_b), is not that background either when μ_b ≠ 1 under the full scheme, whose ε depend
 * on ε_b alone (tests/plan/remediesBackgroundLift.test.ts).
 */
function backgroundLiftIndex(plan: Plan): number | null {
  const min = plan.minBackgroundIndex;
  if (min === null || !Number.isFinite(min)) return null;
  const counts = plan.figures.flagCounts;
  if ((counts.subunity ?? 0) === 0 && (counts.unreachable ?? 0) === 0) return null;
  if (!plan.verdict.missed.some((m) => m.what === "recipes" || m.what === "tolerance")) return null;
  return min;
}

/** The catalog backgrounds other than the design's own that reach `minIndex`. */
function backgroundFits(minIndex: number, bg: NonNullable<RemedyContext["background"]>): BackgroundChoice[] {
  return bg.choices.filter((m) => m.id !== bg.materialId && m.index >= minIndex);
}

/** "no catalog material … lifts every ε" when the design names its background and none does. */
function backgroundNotes(plan: Plan, context: RemedyContext): string[] {
  const bg = context.background;
  const min = backgroundLiftIndex(plan);
  if (!bg || min === null) return [];
  if (backgroundFits(min, bg).length > 0) return [];
  return [`no other background tried: the design names its background material ('${bg.materialId}'), and no catalog material that can surround the device has index ${significantAtLeast(min, 4)} or more at the design frequency (the index that lifts every ε above the lowest allowed material)`];
}

/** Finer pitch than needed to bring a coarse figure to its limit (no more than 4× finer, at least 1.2×). */
function finerPitchFactor(plan: Plan): number {
  const worst = plan.verdict.missed.find((m) => m.what === "homogenization")?.worst;
  let factor = 1 / 1.5;
  // the band's departure grows as (k₀a)² (cells/band/lowestBand.ts); the pitch ratio as the pitch
  if (worst?.figure === "band-deviation" && Number.isFinite(worst.value) && worst.value > 0) factor = 0.95 * Math.sqrt(worst.limit / worst.value);
  else if (worst?.figure === "pitch-ratio" && worst.value > 0) factor = 0.97 * (worst.limit / worst.value);
  return Math.min(1 / 1.2, Math.max(1 / 4, factor));
}

/**
 * Coarse cells (`homogenization`): a finer pitch (sized from the worst coarse figure), and the same
 * plan without the densest material of the coarse levels (a lower-index material shortens nothing
 * but lengthens the wavelength inside the cell).
 */
function coarseChanges(plan: Plan, context: RemedyContext): RemedyChange[] {
  if (!plan.verdict.missed.some((m) => m.what === "homogenization")) return [];
  const out: RemedyChange[] = [];
  const p = plan.grid.pitchM * finerPitchFactor(plan);
  out.push({ label: `finer pitch (${pitchText(p)})`, overrides: {}, pitchM: p });
  const index = new Map((context.materials ?? []).map((m) => [m.id, m.index]));
  let densest: string | null = null;
  for (const l of plan.levels) {
    if (!l.recipe || l.cellCount === 0 || (l.flags & F_COARSE) === 0) continue;
    for (const id of [l.recipe.host, l.recipe.inclusion]) {
      if (id && index.has(id) && (densest === null || index.get(id)! > index.get(densest)!)) densest = id;
    }
  }
  if (densest !== null) {
    const allowed = (plan.settings.materials ?? [...index.keys()]).filter((id) => id !== densest);
    if (allowed.length > 0) out.push({ label: `do without ${densest} (n = ${Number(index.get(densest)!.toPrecision(3))}), the densest material of the coarse levels`, overrides: { materials: allowed }, pitchM: null });
  }
  return out;
}

/** Model uncertainty: the same plan without the family whose model is the least certain. */
function uncertaintyChanges(plan: Plan): RemedyChange[] {
  const miss = plan.verdict.missed.find((m) => m.what === "model-uncertainty");
  if (!miss) return [];
  const worst = plan.levels.filter((l) => l.recipe && l.cellCount > 0).reduce<typeof plan.levels[number] | null>((a, l) => (!a || l.recipe!.spread > a.recipe!.spread ? l : a), null);
  const family = worst?.recipe?.family;
  if (!family || family === "solid") return [];
  const families = (plan.settings.families ?? CELL_FAMILIES.map((f) => f.id)).filter((id) => id !== family);
  if (families.length === 0) return [];
  return [{ label: `do without the ${family} family (the least certain model)`, overrides: { families }, pitchM: null }];
}

function pitchText(m: number): string {
  return m >= 1e-4 ? `${Number((m * 1e3).toPrecision(3))} mm` : `${Number((m * 1e6).toPrecision(3))} µm`;
}

/**
 * Requirements in the order they decide between two verdicts: cells without a recipe first (a plan
 * that builds fewer cells is never "better" because the cells it dropped no longer miss anything),
 * then the error, the process, the coarse cells (homogenization: the values of every figure after
 * it rest on the effective medium), the loss, the bandwidth, the anisotropy and the model uncertainty.
 */
export const PRIORITY: readonly RequirementName[] = ["recipes", "tolerance", "process", "homogenization", "loss", "bandwidth", "anisotropy", "model-uncertainty"];

/** How far past its limit each requirement is (0 when met), in PRIORITY order. */
function severities(missed: readonly { what: string; value: number; limit: number }[]): number[] {
  return PRIORITY.map((w) => {
    const m = missed.find((x) => x.what === w);
    return m ? missSeverity(m) : 0;
  });
}

/**
 * True when verdict `a` is strictly better than `b`: compared requirement by requirement in
 * PRIORITY order, the first that differs (by more than 1e-9) decides.
 */
export function betterThan(a: readonly MissedRequirement[], b: readonly MissedRequirement[]): boolean {
  const sa = severities(a), sb = severities(b);
  for (let k = 0; k < sa.length; k++) {
    if (sa[k] < sb[k] - 1e-9) return true;
    if (sa[k] > sb[k] + 1e-9) return false;
  }
  return false;
}

/** Requirements missed before or after whose figure changed, in PRIORITY order. */
function effectsOf(before: readonly MissedRequirement[], after: readonly MissedRequirement[]): RemedyEffect[] {
  const names = PRIORITY.filter((w) => {
    const b = before.find((m) => m.what === w), a = after.find((m) => m.what === w);
    if (!a && !b) return false;
    return !(a && b && UNIT[w](a.value) === UNIT[w](b.value)); // unchanged as printed: not a change
  });
  return names.map((what) => {
    const b = before.find((m) => m.what === what) ?? null;
    const a = after.find((m) => m.what === what) ?? null;
    return { what, before: b ? b.value : null, after: a ? a.value : null, limit: (a ?? b)!.limit, met: a === null };
  });
}

const UNIT: Record<RequirementName, (x: number) => string> = {
  recipes: (x) => `${x} cells without recipe`,
  tolerance: (x) => `${Number((x * 100).toPrecision(3))} %`,
  loss: (x) => `${Number(x.toPrecision(3))} dB`,
  bandwidth: (x) => `${Number((x * 100).toPrecision(3))} %`,
  anisotropy: (x) => `${Number(x.toPrecision(3))}`,
  process: (x) => `${x}`,
  homogenization: (x) => `${Number((x * 100).toPrecision(3))} % of cells coarse`,
  "model-uncertainty": (x) => `${Number((x * 100).toPrecision(3))} % model uncertainty`,
};

/** "recipes: 432 → 0 cells without recipe (met); loss: 6.02 → 2.1 dB (met)". */
function changesText(effects: RemedyEffect[]): string {
  return effects.map((e) => {
    const u = UNIT[e.what];
    const b = e.before === null ? "met" : u(e.before);
    const a = e.after === null ? "met" : u(e.after);
    return `${e.what}: ${b} → ${a}`;
  }).join("; ");
}

/**
 * Try each candidate change by re-planning and keep those that improve the verdict, best first
 * (at most MAX_SHOWN). `shouldStop` lets the shell end the search early (a time budget).
 */
export function findRemedies(plan: Plan, replan: Replan, shouldStop: () => boolean = () => false, context: RemedyContext = {}): RemedyResult {
  if (plan.verdict.buildable) return { remedies: [], tried: 0 };
  const before = plan.verdict.missed;
  const kept: Remedy[] = [];
  let tried = 0;
  for (const change of candidateChanges(plan, context)) {
    if (shouldStop()) break;
    let next: Plan | null;
    try {
      next = replan(change);
    } catch (err) {
      // A change the design cannot take (a scheme that does not apply, a pitch whose grid is too
      // large) is an InputError: not offered. Anything else is a bug and must surface.
      if (!(err instanceof InputError)) throw err;
      next = null;
    }
    tried++;
    if (!next || !betterThan(next.verdict.missed, before)) continue;
    const effects = effectsOf(before, next.verdict.missed);
    kept.push({ ...change, buildable: next.verdict.buildable, effects, missedAfter: next.verdict.missed, changes: changesText(effects) });
  }
  kept.sort((a, b) => (betterThan(a.missedAfter, b.missedAfter) ? -1 : betterThan(b.missedAfter, a.missedAfter) ? 1 : 0));
  const notes = backgroundNotes(plan, context);
  return { remedies: kept.slice(0, MAX_SHOWN), tried, ...(notes.length ? { notes } : {}) };
}
