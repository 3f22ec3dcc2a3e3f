/**
 * Perfect electric conductors of a scene, described by a signed distance (negative inside) so the
 * solver can find where a grid link or a face crosses the conductor's surface instead of treating
 * it as a staircase of whole cells (see gridCoefficients.ts for how the crossings are used).
 * Two shapes cover the scenes the check builds: a disk (the object a cloak hides, a test cylinder)
 * and a half-plane (a ground plane).
 */

export interface Conductor {
  /** signed distance to the surface, metres: < 0 inside the conductor, > 0 outside */
  signedDistanceM(xM: number, yM: number): number;
}

/** A disk of radius `radiusM` centred at `centerM`. */
export function diskConductor(centerM: [number, number], radiusM: number): Conductor & { kind: "disk"; centerM: [number, number]; radiusM: number } {
  const [cx, cy] = centerM;
  return { kind: "disk", centerM, radiusM, signedDistanceM: (x, y) => Math.hypot(x - cx, y - cy) - radiusM };
}

/** The half-plane y < yM (a ground plane whose surface is the line y = yM). */
export function groundConductor(yM: number): Conductor & { kind: "ground"; yM: number } {
  return { kind: "ground", yM, signedDistanceM: (_x, y) => y - yM };
}

/** Smallest signed distance over several conductors (inside any of them ⇒ negative). */
export function unionDistance(conductors: readonly Conductor[], xM: number, yM: number): number {
  let d = Infinity;
  for (const c of conductors) { const v = c.signedDistanceM(xM, yM); if (v < d) d = v; }
  return d;
}

/**
 * Fraction t ∈ [0, 1] along the segment from (x0, y0) (outside) to (x1, y1) (inside) where the
 * surface is crossed, by bisection on the signed distance (40 halvings: 1e-12 of the segment).
 */
export function crossingFraction(conductors: readonly Conductor[], x0: number, y0: number, x1: number, y1: number): number {
  let lo = 0, hi = 1;
  for (let it = 0; it < 40; it++) {
    const m = 0.5 * (lo + hi);
    if (unionDistance(conductors, x0 + m * (x1 - x0), y0 + m * (y1 - y0)) < 0) hi = m; else lo = m;
  }
  return 0.5 * (lo + hi);
}

/**
 * Open (outside-the-conductor) fraction of the segment (x0, y0)–(x1, y1): the segment is cut at
 * every sign change of the distance seen on `samples` points and each crossing is located by
 * bisection, so a surface crossing the segment once or twice is measured to 1e-12.
 */
export function openFraction(conductors: readonly Conductor[], x0: number, y0: number, x1: number, y1: number, samples = 8): number {
  let open = 0;
  let tPrev = 0, dPrev = unionDistance(conductors, x0, y0);
  for (let s = 1; s <= samples; s++) {
    const t = s / samples;
    const d = unionDistance(conductors, x0 + t * (x1 - x0), y0 + t * (y1 - y0));
    if ((dPrev < 0) === (d < 0)) {
      if (d >= 0) open += t - tPrev;
    } else {
      const xa = x0 + tPrev * (x1 - x0), ya = y0 + tPrev * (y1 - y0), xb = x0 + t * (x1 - x0), yb = y0 + t * (y1 - y0);
      const f = dPrev >= 0 ? crossingFraction(conductors, xa, ya, xb, yb) : 1 - crossingFraction(conductors, xb, yb, xa, ya);
      const tc = tPrev + f * (t - tPrev);
      open += dPrev >= 0 ? tc - tPrev : t - tc;
    }
    tPrev = t; dPrev = d;
  }
  return Math.min(1, Math.max(0, open));
}
