/**
 * Bounds on the effective permittivity of a two-phase mixture of real, positive phases:
 * Wiener (any geometry, anisotropic allowed) and Hashin–Shtrikman (isotropic, 2D or 3D).
 * `fill` is always the volume fraction of the second phase (the inclusion).
 */
import type { Complex } from "../core/complex.js";
import { parallelMean } from "./mixing/parallel.js";
import { seriesMean } from "./mixing/series.js";

/** Real parallel mean (1 − f)ε₁ + fε₂: the one definition is the mixing rule's (parallel.ts). */
export function parallelMeanReal(eps1: number, eps2: number, fill: number): number {
  return parallelMean({ re: eps1, im: 0 }, { re: eps2, im: 0 }, fill).re;
}

/** Real series mean 1/((1 − f)/ε₁ + f/ε₂): the one definition is the mixing rule's (series.ts). */
export function seriesMeanReal(eps1: number, eps2: number, fill: number): number {
  return seriesMean({ re: eps1, im: 0 }, { re: eps2, im: 0 }, fill).re;
}

/**
 * Wiener bounds [series, parallel] = [1/((1−f)/ε₁ + f/ε₂), (1−f)ε₁ + fε₂], sorted. Exact for a
 * laminate (field across / along the layers). Real phases (ε > 0 for the series mean to bound).
 * Source: Wiener, Abh. Math.-Phys. Kl. Sächs. Ges. Wiss. 32, 509 (1912).
 * Example: wienerBounds(1, 4, 0.5) → [1.6, 2.5].
 */
export function wienerBounds(eps1: number, eps2: number, fill: number): [number, number] {
  const par = parallelMeanReal(eps1, eps2, fill);
  const ser = seriesMeanReal(eps1, eps2, fill);
  return par >= ser ? [ser, par] : [par, ser];
}

/**
 * Hashin–Shtrikman bounds for an isotropic mixture in `dimension` dimensions, sorted. Each is the
 * Maxwell Garnett value with one phase as host (depolarization 1/d):
 *   ε_HS(host a, inclusion b, fraction f_b) = ε_a + f_b ε_a (ε_b − ε_a)/(ε_a + (1 − f_b)(ε_b − ε_a)/d).
 * The lower bound has the lower-permittivity phase as host. Real positive phases.
 * Sources: Hashin, Shtrikman, J. Appl. Phys. 33, 3125 (1962); Milton, "The Theory of Composites"
 * (2002), §23.
 * Example: hashinShtrikmanBounds(1, 4, 0.5, 3) → [2, 2.2857…] (= [2, 16/7]).
 */
export function hashinShtrikmanBounds(eps1: number, eps2: number, fill: number, dimension: 2 | 3): [number, number] {
  const mg = (a: number, b: number, fb: number) => a + (fb * a * (b - a)) / (a + ((1 - fb) * (b - a)) / dimension);
  const x = mg(eps1, eps2, fill);
  const y = mg(eps2, eps1, 1 - fill);
  return x <= y ? [x, y] : [y, x];
}

export type BoundName = "phase" | "wiener" | "hashin-shtrikman";

export interface BoundsCheckResult {
  /** the target can be reached (with some fill, or at the given fill with some geometry) */
  reachable: boolean;
  /** false when a phase is lossy or not positive: bounds on the real part then do not hold */
  applies: boolean;
  /** range of the real part allowed by the tightest bound that applies */
  lower: number;
  upper: number;
  /** which bound the target violates, and on which side */
  violated?: { bound: BoundName; side: "lower" | "upper"; value: number };
  /** one line for the user when unreachable or when the check does not apply */
  message?: string;
}

const re = (x: number | Complex): number => (typeof x === "number" ? x : x.re);
const im = (x: number | Complex): number => (typeof x === "number" ? 0 : x.im);

/** Largest tan δ of a phase for which the real-part bounds are still applied (see realBoundsApply). */
export const LOW_LOSS_LIMIT = 0.1;

/**
 * Whether bounds on Re ε apply to this pair: both real parts positive and both phases low-loss
 * (|ε''|/ε' ≤ LOW_LOSS_LIMIT). Exact for lossless phases; for low loss a mixing rule's real part
 * moves only at second order in tan δ (the rule is real-analytic), so the bounds hold to about
 * tan δ² (≤ 1 % at the limit).
 */
export function realBoundsApply(host: number | Complex, inclusion: number | Complex): boolean {
  return [host, inclusion].every((x) => re(x) > 0 && Math.abs(im(x)) <= LOW_LOSS_LIMIT * re(x));
}
const fmt = (x: number): string => Number(x.toPrecision(6)).toString();

/**
 * Is a real target reachable with this pair? Without `fill`: any fill in [0, 1], so the target
 * must lie between the two phase values. With `fill`: it must lie inside the Wiener bounds (any
 * geometry, laminates reach them) and, for an isotropic mixture (`isotropic`, default true), inside
 * the Hashin–Shtrikman bounds of `dimension`. Only real parts are compared; when
 * realBoundsApply is false (lossy or non-positive phases) `applies` is false and the target counts
 * as reachable (the bounds on Re ε do not hold; the mixing rule decides).
 */
export function boundsCheck(
  host: number | Complex,
  inclusion: number | Complex,
  targetRe: number,
  dimension: 2 | 3,
  fill?: number,
  isotropic = true,
): BoundsCheckResult {
  const h = re(host);
  const i = re(inclusion);
  if (!realBoundsApply(host, inclusion)) {
    return {
      reachable: true,
      applies: false,
      lower: -Infinity,
      upper: Infinity,
      message: "bounds on the real part hold for positive, low-loss phases only; with this pair the mixing rule alone decides reachability",
    };
  }
  const at = fill === undefined ? "" : ` at fill ${fmt(fill)}`;
  const checks: { bound: BoundName; lo: number; hi: number; name: [string, string]; why: string }[] = [];
  if (fill === undefined) {
    checks.push({ bound: "phase", lo: Math.min(h, i), hi: Math.max(h, i), name: ["smaller phase value", "larger phase value"], why: "no fill fraction goes beyond the phases of the pair" });
  } else {
    const [wl, wh] = wienerBounds(h, i, fill);
    checks.push({ bound: "wiener", lo: wl, hi: wh, name: [`lower Wiener bound${at}`, `upper Wiener bound${at}`], why: "no geometry goes beyond it" });
    if (isotropic) {
      const [hl, hh] = hashinShtrikmanBounds(h, i, fill, dimension);
      checks.push({ bound: "hashin-shtrikman", lo: hl, hi: hh, name: [`lower ${dimension}D Hashin–Shtrikman bound${at}`, `upper ${dimension}D Hashin–Shtrikman bound${at}`], why: "no isotropic mixture goes beyond it" });
    }
  }
  const tol = 1e-12 * Math.max(h, i);
  for (const c of checks) {
    if (targetRe > c.hi + tol) {
      return { reachable: false, applies: true, lower: c.lo, upper: c.hi, violated: { bound: c.bound, side: "upper", value: c.hi }, message: `target ${fmt(targetRe)} is above the ${c.name[1]} ${fmt(c.hi)} (${c.why})` };
    }
    if (targetRe < c.lo - tol) {
      return { reachable: false, applies: true, lower: c.lo, upper: c.hi, violated: { bound: c.bound, side: "lower", value: c.lo }, message: `target ${fmt(targetRe)} is below the ${c.name[0]} ${fmt(c.lo)} (${c.why})` };
    }
  }
  const last = checks[checks.length - 1];
  return { reachable: true, applies: true, lower: last.lo, upper: last.hi };
}
