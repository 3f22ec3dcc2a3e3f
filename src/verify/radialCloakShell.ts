/**
 * The linear cylindrical cloak as a radial shell for radialSolver.ts (a < r < b, polar basis):
 *
 * ideal (Pendry, Schurig & Smith, Science 312, 1780 (2006); Ruan, Yan, Neff & Qiu, Phys. Rev. Lett.
 *   99, 113903 (2007)): μ_r = ε_r = (r−a)/r, μ_θ = ε_θ = r/(r−a), ε_z = μ_z = (b/(b−a))² (r−a)/r;
 * reduced, Ez with unit μ_θ (Cummer et al., Phys. Rev. E 74, 036621 (2006); Yan, Ruan & Qiu, Phys.
 *   Rev. Lett. 99, 233901 (2007)): μ_r = ((r−a)/r)², μ_θ = 1, ε_z = (b/(b−a))² — the same
 *   products μ_r ε_z and μ_θ ε_z as the ideal set, so the same ray paths but not the same impedance.
 *
 * The ideal set is singular at r = a (μ_r → 0, μ_θ → ∞), the reduced one has μ_r → 0 there. As in
 * the design's transform.innerOffset, the material closer than `innerOffsetM` to the inner edge is
 * the material at a + innerOffsetM (a constant layer between a and a + δ).
 */
import type { RadialShell } from "./radialSolver.js";

export type LinearCloakSet = "ideal" | "reduced-ez";

/** The shell a < r < b of the linear cloak (see file comment); innerOffsetM ≥ 0 (0 only for the reduced set). */
export function linearCloakShell(set: LinearCloakSet, innerRadiusM: number, outerRadiusM: number, innerOffsetM: number): RadialShell {
  const a = innerRadiusM, b = outerRadiusM;
  if (!(a > 0 && b > a)) throw new RangeError(`linearCloakShell: expected 0 < a < b, got a = ${a}, b = ${b}`);
  if (!(innerOffsetM >= 0 && innerOffsetM < b - a) || (set === "ideal" && innerOffsetM === 0)) {
    throw new RangeError(`linearCloakShell: expected an inner offset in ${set === "ideal" ? "(0" : "[0"}, b − a), got ${innerOffsetM}`);
  }
  const s2 = (b / (b - a)) ** 2;
  const rMin = a + innerOffsetM;
  return {
    innerRadiusM: a,
    outerRadiusM: b,
    sample(rM, out) {
      const r = Math.max(rM, rMin);
      const f = (r - a) / r;
      out[1] = 0; out[3] = 0; out[5] = 0;
      if (set === "ideal") { out[0] = s2 * f; out[2] = f; out[4] = 1 / f; } else { out[0] = s2; out[2] = f * f; out[4] = 1; }
    },
  };
}
