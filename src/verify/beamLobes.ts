/**
 * The lobes of an outgoing beam's power pattern, and its main direction, so that a beam a device
 * splits in two is reported as split rather than by one of its peaks.
 *
 * A lobe is a local maximum of the power pattern P(φ) (sampled at equal steps, circular for a full
 * turn) that reaches at least LOBE_FRACTION of the highest one (half power: the usual criterion
 * for a separate beam), together with the samples down to the first local minimum below that
 * fraction on either side. Two such peaks count as separate lobes only when the pattern dips
 * between them below LOBE_FRACTION of the lower peak; otherwise the ripple is merged into one lobe.
 * Each lobe carries its direction (peak, refined by a parabola through the three samples at the top)
 * and its share of the pattern's whole power (side and back lobes below half power belong to none,
 * so the shares add up to at most 1). The main direction is the peak's for a single lobe, and for a split beam the
 * power-weighted mean of the lobes' directions (a beam split symmetrically about its axis has its
 * main direction on the axis). Pure.
 */

/** A peak must reach this share of the highest, and the dip between two lobes fall below it. */
export const LOBE_FRACTION = 0.5;

export interface BeamLobe {
  /** direction of the lobe's peak, degrees */
  directionDeg: number;
  /** the lobe's share of the pattern's whole power (down to the minima on either side) */
  share: number;
}

export interface LobeReading {
  lobes: BeamLobe[];
  /** the peak of a single lobe; the power-weighted mean direction of several, degrees */
  mainDeg: number;
}

/**
 * Lobes of `power` sampled at angles startDeg + k·stepDeg (see file comment); `circular` when the
 * samples cover a whole turn. Returns no lobes for a pattern without power.
 * Example: two equal Gaussian lobes at ±15° on a 1° circular grid → lobes at ±15° with shares of
 * about 0.5 each, main direction 0°.
 */
export function beamLobes(power: Float64Array, startDeg: number, stepDeg: number, circular: boolean): LobeReading {
  const n = power.length;
  const at = (k: number): number => (circular ? power[((k % n) + n) % n] : k < 0 || k >= n ? -Infinity : power[k]);
  let top = 0, total = 0;
  for (let k = 0; k < n; k++) { top = Math.max(top, power[k]); total += power[k]; }
  if (!(top > 0)) return { lobes: [], mainDeg: startDeg };
  // local maxima at or above the half-power line, in order
  const peaks: number[] = [];
  for (let k = 0; k < n; k++) {
    const p = power[k];
    if (p >= LOBE_FRACTION * top && p >= at(k - 1) && p > at(k + 1)) peaks.push(k);
  }
  // merge neighbours whose dip is not deep enough (keep the higher)
  const dipBetween = (a: number, b: number): number => {
    let lo = Infinity;
    const span = b > a ? b - a : b + n - a;
    for (let s = 1; s < span; s++) lo = Math.min(lo, at(a + s));
    return lo;
  };
  const kept: number[] = [];
  for (const k of peaks) {
    const prev = kept[kept.length - 1];
    if (prev !== undefined && dipBetween(prev, k) >= LOBE_FRACTION * Math.min(power[prev], power[k])) {
      if (power[k] > power[prev]) kept[kept.length - 1] = k;
    } else kept.push(k);
  }
  if (circular && kept.length > 1) {
    const first = kept[0], last = kept[kept.length - 1];
    if (dipBetween(last, first) >= LOBE_FRACTION * Math.min(power[first], power[last])) {
      if (power[last] > power[first]) kept.shift(); else kept.pop();
    }
  }
  // each lobe runs from its peak down either side to the first local minimum below LOBE_FRACTION of
  // the peak (ripple higher up is part of the lobe), never past a neighbouring lobe's peak; the
  // power between lobes and outside them (side and back lobes) belongs to none
  const keptSet = new Set(kept);
  const side = (k: number, dir: 1 | -1): number => {
    let s = k;
    for (let steps = 0; steps < n - 1; steps++) {
      const next = s + dir;
      if (!circular && (next < 0 || next >= n)) return s;
      if (keptSet.has(((next % n) + n) % n)) return s;
      if (at(next) > at(s) && at(s) < LOBE_FRACTION * power[k]) return s - dir; // s is the minimum: not part of the lobe
      s = next;
    }
    return s;
  };
  const lobes: BeamLobe[] = kept.map((k) => {
    const from = side(k, -1), to = side(k, 1);
    let share = 0;
    for (let s = from; s <= to; s++) share += power[((s % n) + n) % n];
    const y0 = at(k - 1), y1 = power[k], y2 = at(k + 1);
    const den = y0 - 2 * y1 + y2;
    const off = Number.isFinite(den) && den !== 0 ? Math.max(-0.5, Math.min(0.5, (0.5 * (y0 - y2)) / den)) : 0;
    return { directionDeg: wrap(startDeg + (k + off) * stepDeg, circular), share: share / total };
  });
  if (lobes.length === 1) return { lobes, mainDeg: lobes[0].directionDeg };
  // power-weighted mean direction (as unit vectors, so ±180° average correctly)
  let cx = 0, cy = 0;
  for (const l of lobes) { const r = (l.directionDeg * Math.PI) / 180; cx += l.share * Math.cos(r); cy += l.share * Math.sin(r); }
  return { lobes, mainDeg: wrap((Math.atan2(cy, cx) * 180) / Math.PI, circular) };
}

/** Degrees into (−180°, 180°] on a full turn; unchanged otherwise. */
function wrap(deg: number, circular: boolean): number {
  if (!circular) return deg;
  let d = deg % 360;
  if (d > 180) d -= 360;
  if (d <= -180) d += 360;
  return d;
}
