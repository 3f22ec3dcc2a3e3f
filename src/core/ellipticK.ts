/**
 * Complete elliptic integral of the first kind by the arithmetic–geometric mean:
 *   K(k) = ∫₀^{π/2} dθ / sqrt(1 − k² sin²θ) = π / (2·AGM(1, k')),   k' = sqrt(1 − k²)
 * (Abramowitz & Stegun, Handbook of Mathematical Functions, 17.6; Gauss). k is the modulus
 * (A&S tabulate by the modular angle α, k = sin α, and by the parameter m = k²).
 * The AGM converges quadratically: about six steps reach double precision for k' ≥ 1e-12.
 * K(k') is computed as π/(2·AGM(1, k)) directly, so ratios stay accurate for k near 0 or 1.
 */

/** Arithmetic–geometric mean of a, b ≥ 0 (0 when either is 0). */
export function agm(a: number, b: number): number {
  if (!(a >= 0) || !(b >= 0)) return NaN;
  if (a === 0 || b === 0) return 0;
  let x = a;
  let y = b;
  for (let i = 0; i < 64 && Math.abs(x - y) > 1e-15 * x; i++) {
    const m = 0.5 * (x + y);
    y = Math.sqrt(x * y);
    x = m;
  }
  return 0.5 * (x + y);
}

/** k' = sqrt(1 − k²), written (1 − k)(1 + k) so it keeps its digits near k = 1. */
export const complementaryModulus = (k: number): number => Math.sqrt((1 - k) * (1 + k));

/**
 * K(k) for the modulus 0 ≤ k ≤ 1: π/2 at k = 0, Infinity at k = 1, NaN outside [0, 1].
 * Example: ellipticK(Math.SQRT1_2) → 1.8540746773013719 (A&S table 17.1, α = 45°).
 */
export function ellipticK(k: number): number {
  if (!(k >= 0 && k <= 1)) return NaN;
  if (k === 1) return Infinity;
  return Math.PI / (2 * agm(1, complementaryModulus(k)));
}

/** K'(k) = K(k') for 0 ≤ k ≤ 1: Infinity at k = 0, π/2 at k = 1, NaN outside. */
export function ellipticKPrime(k: number): number {
  if (!(k >= 0 && k <= 1)) return NaN;
  if (k === 0) return Infinity;
  return Math.PI / (2 * agm(1, k));
}

/**
 * K(k')/K(k) for 0 < k < 1 (the conformal-mapping ratio of coplanar lines): → (2/π)·ln(4/k) as
 * k → 0 and → π/(2·ln(4/k')) as k → 1 (A&S 17.3.26). 1 at k = 1/√2. Infinity at 0, 0 at 1.
 */
export function ellipticKRatio(k: number): number {
  if (!(k >= 0 && k <= 1)) return NaN;
  if (k === 0) return Infinity;
  if (k === 1) return 0;
  return agm(1, complementaryModulus(k)) / agm(1, k);
}
