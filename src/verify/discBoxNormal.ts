/**
 * The normal of a disc's boundary inside an axis-aligned box, in closed form — what the Kottke
 * average of an in-plane tensor across the boundary needs (Kottke, Farjadpour & Johnson, Phys. Rev.
 * E 77, 036611 (2008); Farjadpour et al., Opt. Lett. 31, 2972 (2006): the box's tensor is the
 * laminate of its two materials, harmonic across the interface normal n and arithmetic along it).
 *
 * Choice: n is the mean of the boundary's outward unit normal over the part of the circle inside the
 * box (arc-length weighted), i.e. the direction from the disc's centre to the centroid of that arc.
 * By the divergence theorem it equals −∫_box ∇χ dA (χ the disc's indicator, whose gradient is
 * −n̂ δ on the circle), and ∫_box ∂χ/∂x dA = ∫ [χ(x₁, y) − χ(x₀, y)] dy over y₀…y₁, so
 *   n ∝ (L(x₀) − L(x₁), L(y₀) − L(y₁)),
 * L(x = X) the length of the box's side at X inside the disc (a chord clipped to the side), and
 * likewise for the sides at y₀, y₁. Why this one: it is the normal averaged over the interface the
 * box actually holds (for a box cut by a short arc it agrees with the radius through the box's
 * centre to O(h/r) in angle, and unlike that radius it does not depend on where the box's centre
 * happens to lie relative to the arc); it is the exact, sampling-free limit of the least-squares
 * gradient of ε over a box of samples that the grid used before (gridCoefficients.ts), so the
 * change removes the sampling noise and nothing else; and it costs four clipped chords.
 * Nothing allocated. Pure.
 */

/** Length of [lo, hi] inside the disc along the line at distance d from its centre (chord |t − tc| < s). */
function clippedChord(d: number, r: number, tc: number, lo: number, hi: number): number {
  const q = r * r - d * d;
  if (!(q > 0)) return 0;
  const s = Math.sqrt(q);
  return Math.max(0, Math.min(hi, tc + s) - Math.max(lo, tc - s));
}

/**
 * Outward unit normal (out[0], out[1]) of the circle of centre (cx, cy) and radius r inside the box
 * [x0, x1] × [y0, y1] (see file comment). Returns false, and writes (0, 0), when the box holds no
 * part of the circle or the mean normal vanishes (the whole circle inside the box, or arcs whose
 * normals cancel): no single direction describes the interface there.
 * Example: discBoxNormal(0, 0, 1, 0.9, 1.1, -0.1, 0.1, out) → true, out = (1, 0).
 */
export function discBoxNormal(cx: number, cy: number, r: number, x0: number, x1: number, y0: number, y1: number, out: Float64Array): boolean {
  const nx = clippedChord(x0 - cx, r, cy, y0, y1) - clippedChord(x1 - cx, r, cy, y0, y1);
  const ny = clippedChord(y0 - cy, r, cx, x0, x1) - clippedChord(y1 - cy, r, cx, x0, x1);
  const len = Math.hypot(nx, ny);
  // below 1e-12 of the box's side the chords' difference is rounding, not a direction
  if (!(len > 1e-12 * Math.max(x1 - x0, y1 - y0))) { out[0] = 0; out[1] = 0; return false; }
  out[0] = nx / len; out[1] = ny / len;
  return true;
}
