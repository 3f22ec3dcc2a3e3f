/**
 * The frequency band around a design frequency over which a response stays within a tolerance of
 * its target: walk outward from the design frequency in small relative steps until the response
 * leaves the band, then bisect the crossing. Pure numerics on a caller-supplied response.
 */
export interface ToleranceBand {
  /** band edges, Hz (NaN when the design point itself is outside the tolerance) */
  loHz: number;
  hiHz: number;
  /** (hi − lo) / design frequency; 0 when the design point is outside the tolerance */
  fractional: number;
  /** true when an edge was not found inside the searched range (design/10 … design·10) */
  openBelow: boolean;
  openAbove: boolean;
}

const SEARCH_SPAN = 10;
const MAX_STEP = 0.005;

function edge(inBand: (f: number) => boolean, f0: number, dir: 1 | -1): { edgeHz: number; open: boolean } {
  let inside = f0;
  let step = 1e-6;
  const limit = dir > 0 ? f0 * SEARCH_SPAN : f0 / SEARCH_SPAN;
  for (;;) {
    const f = dir > 0 ? inside * (1 + step) : inside / (1 + step);
    if ((dir > 0 && f >= limit) || (dir < 0 && f <= limit)) {
      return inBand(limit) ? { edgeHz: limit, open: true } : bisect(inBand, inside, limit);
    }
    if (!inBand(f)) return bisect(inBand, inside, f);
    inside = f;
    step = Math.min(MAX_STEP, step * 1.5);
  }
}

function bisect(inBand: (f: number) => boolean, inside: number, outside: number): { edgeHz: number; open: boolean } {
  let a = inside;
  let b = outside;
  for (let k = 0; k < 80 && Math.abs(b - a) > 1e-13 * Math.abs(a); k++) {
    const m = 0.5 * (a + b);
    if (inBand(m)) a = m;
    else b = m;
  }
  return { edgeHz: a, open: false };
}

/**
 * Band where |response(f) − target| ≤ toleranceAbs, contiguous around designHz.
 * `response` gives the real part of ε or μ at frequency f (Hz). Steps are at most 0.5 % of the
 * frequency, so features narrower than that (a sharp resonance) can be stepped over.
 */
export function toleranceBand(response: (frequencyHz: number) => number, designHz: number, target: number, toleranceAbs: number): ToleranceBand {
  const inBand = (f: number): boolean => Math.abs(response(f) - target) <= toleranceAbs;
  if (!inBand(designHz)) return { loHz: NaN, hiHz: NaN, fractional: 0, openBelow: false, openAbove: false };
  const lo = edge(inBand, designHz, -1);
  const hi = edge(inBand, designHz, 1);
  return { loHz: lo.edgeHz, hiHz: hi.edgeHz, fractional: (hi.edgeHz - lo.edgeHz) / designHz, openBelow: lo.open, openAbove: hi.open };
}
