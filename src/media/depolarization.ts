/**
 * Depolarization factors of ellipsoids (field along a principal axis): N_x + N_y + N_z = 1,
 * sphere 1/3 each, a needle 0 along its axis, a flat disk 1 across it.
 * Sources: Osborn, "Demagnetizing factors of the general ellipsoid", Phys. Rev. 67, 351 (1945);
 * Stoner, Phil. Mag. 36, 803 (1945).
 */
import { ProgrammerError } from "../core/errors.js";
import { integrateAdaptive } from "./gaussKronrod.js";

/** Σ_{k≥0} (±x)^k/(2k+3), the regular part of the spheroid formulas near the sphere. */
function seriesNearSphere(x: number): number {
  let sum = 0;
  let term = 1;
  for (let k = 0; k < 60; k++) {
    const add = term / (2 * k + 3);
    sum += add;
    if (Math.abs(add) < 1e-18) break;
    term *= x;
  }
  return sum;
}

/**
 * Depolarization factors of a spheroid with aspect = (semi-axis along the symmetry axis) /
 * (equatorial semi-axis): prolate aspect > 1, oblate < 1, sphere 1/3.
 * Prolate, e = sqrt(1 − 1/m²): N_axis = (1 − e²)/(2e³)·(ln((1 + e)/(1 − e)) − 2e).
 * Oblate, e = sqrt(1/m² − 1): N_axis = (1 + e²)/e³·(e − arctan e).
 * Near m = 1 the same formulas are summed as series (N = (1 − e²)Σ e^{2k}/(2k+3), resp.
 * (1 + e²)Σ (−e²)^k/(2k+3)) to avoid cancellation. transverse = (1 − N_axis)/2.
 * aspect = Infinity gives the needle {0, 1/2}; aspect = 0 the disk {1, 0}.
 * Example: spheroidDepolarization(2).axis → 0.17356 (Osborn 1945, prolate m = 2).
 */
export function spheroidDepolarization(aspect: number): { axis: number; transverse: number } {
  if (!(aspect >= 0)) throw new ProgrammerError("spheroidDepolarization needs an aspect ratio ≥ 0", { aspect });
  let axis: number;
  if (aspect === Infinity) axis = 0;
  else if (aspect === 0) axis = 1;
  else if (aspect >= 1) {
    // q = 1 − e² taken as 1/m² directly, and ln((1+e)/(1−e)) = 2 ln((1+e)·m): no overflow or 0·∞
    // for needles (m up to 1e308)
    const q = 1 / (aspect * aspect);
    const e2 = 1 - q;
    const e = Math.sqrt(e2);
    axis = e < 0.1 ? q * seriesNearSphere(e2) : (q / (e * e2)) * (Math.log1p(e) + Math.log(aspect) - e);
  } else {
    // (1 + e²)/(e·e²)·(e − atan e) = (1 + 1/e²)·(1 − atan(e)/e): finite for flat disks (e² = ∞)
    const e2 = 1 / (aspect * aspect) - 1;
    const e = Math.sqrt(e2);
    axis = e < 0.1 ? (1 + e2) * seriesNearSphere(-e2) : (1 + 1 / e2) * (1 - Math.atan(e) / e);
  }
  return { axis, transverse: (1 - axis) / 2 };
}

/**
 * The spheroid aspect ratio whose axial depolarization factor is `axisFactor` (0..1), by bisection
 * on log(aspect) (N_axis falls monotonically with the aspect). 0 → Infinity (needle), 1 → 0 (disk).
 */
export function spheroidAspectForDepolarization(axisFactor: number): number {
  if (!(axisFactor >= 0 && axisFactor <= 1)) throw new ProgrammerError("depolarization factor must lie in [0, 1]", { axisFactor });
  if (axisFactor === 0) return Infinity;
  if (axisFactor === 1) return 0;
  let lo = -60; // log(aspect)
  let hi = 60;
  for (let k = 0; k < 200 && hi - lo > 1e-14; k++) {
    const mid = 0.5 * (lo + hi);
    if (spheroidDepolarization(Math.exp(mid)).axis > axisFactor) lo = mid;
    else hi = mid;
  }
  return Math.exp(0.5 * (lo + hi));
}

/**
 * Depolarization factors [N_x, N_y, N_z] of an ellipsoid with semi-axes a, b, c (> 0, any unit):
 *   N_x = (abc/2) ∫₀^∞ ds / ((s + a²) sqrt((s + a²)(s + b²)(s + c²))), likewise for y, z,
 * integrated numerically (adaptive Gauss–Kronrod) after scaling the largest semi-axis to 1 and
 * substituting s = ((1 − u)/u)², which maps [0, ∞) to (0, 1] with a smooth integrand.
 * Example: ellipsoidDepolarization(1, 1, 1) → [1/3, 1/3, 1/3].
 */
export function ellipsoidDepolarization(a: number, b: number, c: number): [number, number, number] {
  for (const x of [a, b, c]) if (!(x > 0) || !Number.isFinite(x)) throw new ProgrammerError("ellipsoid semi-axes must be finite and > 0", { a, b, c });
  const s0 = Math.max(a, b, c);
  const ax = [a / s0, b / s0, c / s0];
  const sq = ax.map((x) => x * x);
  const prod = ax[0] * ax[1] * ax[2];
  const factor = (j: number): number => {
    const integrand = (u: number): number => {
      if (u <= 0) return 0;
      const t = (1 - u) / u;
      const s = t * t;
      const dsdu = (2 * t) / (u * u);
      const r = Math.sqrt((s + sq[0]) * (s + sq[1]) * (s + sq[2]));
      return dsdu / ((s + sq[j]) * r);
    };
    return (prod / 2) * integrateAdaptive(integrand, 0, 1, 1e-13, 1e-16, 20000).value;
  };
  return [factor(0), factor(1), factor(2)];
}
