/**
 * The band over which the realized device keeps working, from a frequency sweep.
 *
 * Definition (ours; stated in the README): the figure of merit is σ/σ_bare for a device that hides
 * an object (lower is better), the delivered power for a beam (higher is better), and the
 * scattering width σ_s otherwise (lower is better). The reference is the reduced design's figure at
 * the centre frequency (the design frequency when the sweep covers it, else the sweep's middle),
 * linearly interpolated between sweep points. With a threshold factor T (default 2) the realized
 * device "works" at f when its figure is at most T × the reference (lower is better) or at least
 * the reference / T (higher is better). The band is the connected range around the centre where it
 * works; each edge is placed where the linear interpolation between the last working point and the
 * first failing one crosses the limit. An edge that reaches the end of the sweep is reported as open
 * (the band extends at least that far). When the realized device fails at the centre there is no band.
 *
 * Uncertainty of the edges: every figure comes with its absolute uncertainty u (the grid ladder's),
 * and the limit with T·u_ref (u_ref/T) from the reduced figure at the centre. The margin at f is then
 * known to ± (u + u_limit). The band is found again with every margin at its optimistic end (m + u)
 * and at its pessimistic end (m − u); each edge lies between the two, which gives its range
 * (`lowRangeHz`, `highRangeHz`). A point within its uncertainty of the limit, or two points whose
 * uncertainties span it, widen the range as far as they allow — an edge between two uncertain
 * points is as uncertain as they are. When even the centre may miss the limit the inner end of each
 * range is the centre (the band may vanish). An edge is `converged: false` when a sweep point inside
 * its range or bracketing it is not converged. On a single grid (no uncertainties) the ranges and
 * the convergence are null. `meetsLimit` says per frequency whether the realized figure meets the
 * limit: "yes", "no", or "uncertain" (the limit is within the figure's uncertainty).
 *
 * Pure; the figures come in as arrays over the sweep's frequencies (ascending).
 */

export type FigureSense = "lower-is-better" | "higher-is-better";

export interface BandInput {
  frequenciesHz: readonly number[];
  /** the realized device's figure at each frequency (null: not computed there) */
  realized: readonly (number | null)[];
  /** the reduced design's figure at each frequency */
  reduced: readonly (number | null)[];
  sense: FigureSense;
  /** factor T > 1 */
  threshold: number;
  /** the design frequency (the centre when the sweep covers it) */
  designFrequencyHz: number;
  /** absolute uncertainty of each realized figure (null: none, a single grid); omitted: none */
  realizedUncertainty?: readonly (number | null)[];
  /** absolute uncertainty of each reduced figure (for the reference at the centre); omitted: none */
  reducedUncertainty?: readonly (number | null)[];
  /** whether each realized figure converged to the accuracy asked (null: a single grid) */
  realizedConverged?: readonly (boolean | null)[];
}

export type LimitVerdict = "yes" | "no" | "uncertain";

export interface SweepBand {
  /** band edges, Hz (null when there is no band) */
  lowHz: number | null;
  highHz: number | null;
  /** the edge reached the end of the sweep: the band extends at least that far */
  openLow: boolean;
  openHigh: boolean;
  threshold: number;
  /** where the reference was taken, Hz */
  centreHz: number;
  /** the reduced design's figure at the centre */
  reference: number | null;
  /** the realized figure must stay at or below (lower-is-better) or at or above this */
  limit: number | null;
  sense: FigureSense;
  /** why there is no band (null when there is one) */
  reason: string | null;
  /** where each edge can lie within the figures' uncertainties, Hz, [from, to] (null: no band or no uncertainties) */
  lowRangeHz: [number, number] | null;
  highRangeHz: [number, number] | null;
  /** every sweep point inside or bracketing the edge's range converged (null: a single grid or no band) */
  lowConverged: boolean | null;
  highConverged: boolean | null;
  /** the band may vanish: within its uncertainty the realized figure at the centre may miss the limit */
  mayVanish: boolean;
  /** the uncertainty of the limit (T × the reference's, or / T), null without one */
  limitUncertainty: number | null;
  /** per frequency: does the realized figure meet the limit (null where it has no figure) */
  meetsLimit: (LimitVerdict | null)[];
}

/** Linear interpolation of ys at x over ascending xs (x inside [xs[0], xs[n−1]]); null when a neighbour is null. */
function interpolate(xs: readonly number[], ys: readonly (number | null)[], x: number): number | null {
  const n = xs.length;
  if (n === 1) return ys[0];
  let k = 0;
  while (k < n - 2 && xs[k + 1] < x) k++;
  const a = ys[k], b = ys[k + 1];
  if (a === null || b === null) return xs[k] === x ? a : xs[k + 1] === x ? b : null;
  const t = xs[k + 1] === xs[k] ? 0 : (x - xs[k]) / (xs[k + 1] - xs[k]);
  return a + t * (b - a);
}

/**
 * The band (see file comment). Throws RangeError for mismatched lengths, an empty or unsorted
 * sweep, or a threshold not above 1 (the shell validates --threshold first).
 */
export function sweepBand(input: BandInput): SweepBand {
  const { frequenciesHz: fs, realized, reduced, sense, threshold } = input;
  const n = fs.length;
  if (n === 0 || realized.length !== n || reduced.length !== n) throw new RangeError("sweepBand: expected equal, non-empty arrays");
  for (const extra of [input.realizedUncertainty, input.reducedUncertainty, input.realizedConverged]) {
    if (extra !== undefined && extra.length !== n) throw new RangeError("sweepBand: expected equal, non-empty arrays");
  }
  for (let k = 1; k < n; k++) if (!(fs[k] > fs[k - 1])) throw new RangeError("sweepBand: frequencies must ascend");
  if (!(threshold > 1) || !Number.isFinite(threshold)) throw new RangeError("sweepBand: expected a threshold factor above 1");
  const centreHz = input.designFrequencyHz >= fs[0] && input.designFrequencyHz <= fs[n - 1] ? input.designFrequencyHz : 0.5 * (fs[0] + fs[n - 1]);
  const base = { threshold, centreHz, sense, openLow: false, openHigh: false, lowRangeHz: null, highRangeHz: null, lowConverged: null, highConverged: null, mayVanish: false };
  const none = (reason: string, reference: number | null = null, limit: number | null = null, limitUncertainty: number | null = null, meetsLimit: (LimitVerdict | null)[] = realized.map(() => null)): SweepBand =>
    ({ ...base, lowHz: null, highHz: null, reference, limit, reason, limitUncertainty, meetsLimit });
  const reference = interpolate(fs, reduced, centreHz);
  if (reference === null || !Number.isFinite(reference)) return none("the reduced design has no figure at the centre frequency");
  if (!(reference > 0)) return none(`the reduced design's figure at the centre is ${reference}: no factor of it can be met`, reference);
  const limit = sense === "lower-is-better" ? reference * threshold : reference / threshold;
  const uRef = input.reducedUncertainty ? interpolate(fs, input.reducedUncertainty, centreHz) : null;
  const limitUncertainty = uRef === null ? null : sense === "lower-is-better" ? uRef * threshold : uRef / threshold;
  // margin ≥ 0 where the realized device works; its uncertainty u + u_limit (null: none known)
  const margin = (v: number | null): number | null => (v === null ? null : sense === "lower-is-better" ? limit - v : v - limit);
  const uncertain = input.realizedUncertainty !== undefined && input.realizedUncertainty.some((u) => u !== null);
  const spread = (u: number | null): number => (u ?? 0) + (limitUncertainty ?? 0);
  const margins = realized.map(margin);
  const spreads = realized.map((_, k) => spread(input.realizedUncertainty?.[k] ?? null));
  const meetsLimit = margins.map((m, k): LimitVerdict | null => (m === null ? null : !uncertain ? (m >= 0 ? "yes" : "no") : m - spreads[k] >= 0 ? "yes" : m + spreads[k] < 0 ? "no" : "uncertain"));
  const centreMargin = margin(interpolate(fs, realized, centreHz));
  if (centreMargin === null) return none("the realized device has no figure at the centre frequency", reference, limit, limitUncertainty, meetsLimit);
  const centreSpread = spread(input.realizedUncertainty ? interpolate(fs, input.realizedUncertainty, centreHz) : null);
  if (centreMargin < 0) {
    const reason = uncertain && centreMargin + centreSpread >= 0
      ? "the realized device misses the limit at the centre frequency (within its uncertainty it may meet it)"
      : "the realized device misses the limit at the centre frequency";
    return none(reason, reference, limit, limitUncertainty, meetsLimit);
  }
  // walk outward from the centre; edge where the margin crosses zero (linear in between)
  const edge = (dir: 1 | -1, shift: number): { hz: number; open: boolean } => {
    const at = (k: number): number | null => (margins[k] === null ? null : margins[k]! + shift * spreads[k]);
    let x0 = centreHz, m0 = centreMargin + shift * centreSpread;
    if (m0 < 0) return { hz: centreHz, open: false };
    let k = dir > 0 ? fs.findIndex((f) => f > centreHz) : n - 1 - [...fs].reverse().findIndex((f) => f < centreHz);
    if (dir > 0 && k < 0) return { hz: fs[n - 1], open: true };
    if (dir < 0 && k > n - 1) return { hz: fs[0], open: true };
    for (; k >= 0 && k < n; k += dir) {
      const m = at(k);
      if (m === null) return { hz: x0, open: false };
      if (m < 0) return { hz: x0 + (fs[k] - x0) * (m0 / (m0 - m)), open: false };
      x0 = fs[k]; m0 = m;
    }
    return { hz: x0, open: true };
  };
  const lo = edge(-1, 0), hi = edge(1, 0);
  const band: SweepBand = { ...base, lowHz: lo.hz, highHz: hi.hz, openLow: lo.open, openHigh: hi.open, reference, limit, reason: null, limitUncertainty, meetsLimit };
  if (!uncertain) return band;
  const loOpt = edge(-1, 1).hz, loPess = edge(-1, -1).hz, hiOpt = edge(1, 1).hz, hiPess = edge(1, -1).hz;
  band.lowRangeHz = [Math.min(loOpt, lo.hz), Math.max(loPess, lo.hz)];
  band.highRangeHz = [Math.min(hiPess, hi.hz), Math.max(hiOpt, hi.hz)];
  band.mayVanish = centreMargin - centreSpread < 0;
  // an edge is converged when every point inside its range, and the two bracketing it, converged
  const convergedOver = ([a, b]: [number, number]): boolean | null => {
    const conv = input.realizedConverged;
    if (!conv) return null;
    let i0 = 0, i1 = n - 1;
    while (i0 < n - 1 && fs[i0 + 1] <= a) i0++;
    while (i1 > 0 && fs[i1 - 1] >= b) i1--;
    let any = false;
    for (let k = i0; k <= i1; k++) {
      if (conv[k] === false) return false;
      if (conv[k] === true) any = true;
    }
    return any ? true : null;
  };
  band.lowConverged = convergedOver(band.lowRangeHz);
  band.highConverged = convergedOver(band.highRangeHz);
  return band;
}
