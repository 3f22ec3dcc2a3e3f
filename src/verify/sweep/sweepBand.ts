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
}

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
  for (let k = 1; k < n; k++) if (!(fs[k] > fs[k - 1])) throw new RangeError("sweepBand: frequencies must ascend");
  if (!(threshold > 1) || !Number.isFinite(threshold)) throw new RangeError("sweepBand: expected a threshold factor above 1");
  const centreHz = input.designFrequencyHz >= fs[0] && input.designFrequencyHz <= fs[n - 1] ? input.designFrequencyHz : 0.5 * (fs[0] + fs[n - 1]);
  const base = { threshold, centreHz, sense, openLow: false, openHigh: false };
  const none = (reason: string, reference: number | null = null, limit: number | null = null): SweepBand => ({ ...base, lowHz: null, highHz: null, reference, limit, reason });
  const reference = interpolate(fs, reduced, centreHz);
  if (reference === null || !Number.isFinite(reference)) return none("the reduced design has no figure at the centre frequency");
  if (!(reference > 0)) return none(`the reduced design's figure at the centre is ${reference}: no factor of it can be met`, reference);
  const limit = sense === "lower-is-better" ? reference * threshold : reference / threshold;
  // margin ≥ 0 where the realized device works
  const margin = (v: number | null): number | null => (v === null ? null : sense === "lower-is-better" ? limit - v : v - limit);
  const atCentre = margin(interpolate(fs, realized, centreHz));
  if (atCentre === null) return none("the realized device has no figure at the centre frequency", reference, limit);
  if (atCentre < 0) return none("the realized device misses the limit at the centre frequency", reference, limit);
  // walk outward from the centre; edge where the margin crosses zero (linear in between)
  const edge = (dir: 1 | -1): { hz: number; open: boolean } => {
    let x0 = centreHz, m0 = atCentre;
    let k = dir > 0 ? fs.findIndex((f) => f > centreHz) : n - 1 - [...fs].reverse().findIndex((f) => f < centreHz);
    if (dir > 0 && k < 0) return { hz: fs[n - 1], open: true };
    if (dir < 0 && k > n - 1) return { hz: fs[0], open: true };
    for (; k >= 0 && k < n; k += dir) {
      const m = margin(realized[k]);
      if (m === null) return { hz: x0, open: false };
      if (m < 0) return { hz: x0 + (fs[k] - x0) * (m0 / (m0 - m)), open: false };
      x0 = fs[k]; m0 = m;
    }
    return { hz: x0, open: true };
  };
  const lo = edge(-1), hi = edge(1);
  return { ...base, lowHz: lo.hz, highHz: hi.hz, openLow: lo.open, openHigh: hi.open, reference, limit, reason: null };
}
