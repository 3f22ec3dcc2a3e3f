/**
 * The medium the device is embedded in, as the reduction sees it.
 *
 * Without a background index the field is used as computed (its virtual-space background ε_b, μ_b).
 * With a background index n_b the device sits in a non-magnetic dielectric of index n_b: the
 * transform's virtual space becomes ε_b = n_b², μ_b = 1, so every ε of the field is multiplied by
 * n_b²/ε_b(field) and every μ by 1/μ_b(field) (ε' = J ε_b Jᵀ/det J is linear in ε_b; design brief
 * §2). The carpet cloak of Li and Pendry, PRL 101, 203901 (2008) is designed this way (n² = n_b²/det J).
 * Every scheme's ε then scales by n_b² and its μ not at all, which is what `minBackgroundIndex` uses.
 */
export interface BackgroundMedium {
  /** factor on the field's ε */
  epsScale: number;
  /** factor on the field's μ */
  muScale: number;
  /** index n = sqrt(ε_b μ_b) of the background */
  index: number;
  /** wave impedance relative to vacuum, sqrt(μ_b/ε_b) */
  impedance: number;
}

/**
 * Background for a field whose virtual-space background is (`eps`, `mu`) and an optional
 * background index (> 0). Example: backgroundMedium({eps: 1, mu: 1}, 1.5) → epsScale 2.25, muScale 1,
 * index 1.5, impedance 1/1.5.
 */
export function backgroundMedium(fieldBackground: { eps: number; mu: number }, backgroundIndex?: number): BackgroundMedium {
  if (backgroundIndex === undefined) {
    return {
      epsScale: 1,
      muScale: 1,
      index: Math.sqrt(fieldBackground.eps * fieldBackground.mu),
      impedance: Math.sqrt(fieldBackground.mu / fieldBackground.eps),
    };
  }
  return {
    epsScale: (backgroundIndex * backgroundIndex) / fieldBackground.eps,
    muScale: 1 / fieldBackground.mu,
    index: backgroundIndex,
    impedance: 1 / backgroundIndex,
  };
}
