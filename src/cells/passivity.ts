/**
 * Passivity limit on how long a medium can hold a value below its high-frequency limit.
 *
 * In a lossless window of a passive medium d(ωε)/dω ≥ 1 (weak form) and dε/dω ≥ 2(1−ε)/ω (strong
 * form) (Landau, Lifshitz, Electrodynamics of Continuous Media, 2nd ed., §84 — from memory). With
 * ε held within ±Δε of ε₀ and the slope at its least, the fractional bandwidth is at most
 * 2Δε/(1−ε₀) (weak) or Δε/(1−ε₀) (strong). For μ replace 1 by μ's high-frequency limit μ∞ (for a
 * split ring μ∞ = 1 − F). A lossless Drude medium, ε = 1 − ωp²/ω², has dε/dω = 2(1−ε)/ω exactly:
 * it meets the strong form with equality. First-order (small Δε) statement.
 */
export interface PassivityBound {
  /** largest fractional bandwidth (Δω/ω) from the weak form, 2Δε/(L − ε₀) */
  weak: number;
  /** largest fractional bandwidth from the strong form, Δε/(L − ε₀) */
  strong: number;
  /** the high-frequency limit L used (1 for ε) */
  highFrequencyLimit: number;
}

/**
 * Fractional-bandwidth bounds for holding a value within ±deltaEps of eps0 < highFrequencyLimit.
 * Returns null when eps0 ≥ highFrequencyLimit (the argument gives no bound there) or deltaEps ≤ 0.
 * Example: passivityBandwidthBound(0.5, 0.05) → { weak: 0.2, strong: 0.1, highFrequencyLimit: 1 }
 */
export function passivityBandwidthBound(eps0: number, deltaEps: number, highFrequencyLimit = 1): PassivityBound | null {
  const gap = highFrequencyLimit - eps0;
  if (!(gap > 0) || !(deltaEps > 0)) return null;
  return { weak: (2 * deltaEps) / gap, strong: deltaEps / gap, highFrequencyLimit };
}
