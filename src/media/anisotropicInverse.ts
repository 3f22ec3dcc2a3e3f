/**
 * Anisotropic inverse: one material pair, a target with two principal values, unknown fill
 * fraction AND inclusion shape. Aligned inclusions in Maxwell Garnett form give, along principal
 * axis j with depolarization factor N_j,
 *   ε_j = ε_h + f ε_h (ε_i − ε_h)/(ε_h + (1 − f) N_j (ε_i − ε_h)),
 * so for a given f each target fixes N_j = [f ε_h (ε_i − ε_h)/(ε_j − ε_h) − ε_h] / ((1 − f)(ε_i − ε_h)),
 * and the shape constraint closes the system:
 *   2D (elliptic cylinders along z, in-plane values): N_1 + N_2 = 1,
 *   3D (spheroids, value 1 along the axis, value 2 across it): N_1 + 2 N_2 = 1.
 * The root in f is found by scanning and bisection, with 0 ≤ N_j ≤ 1. The laminate is the limit
 * N ∈ {0, 1} (parallel and series means), so laminates are included. Only the real parts of the
 * phases are used to find the shape; the complex values at that shape are then reported.
 * Sources: Sihvola, "Electromagnetic Mixing Formulas and Applications", IEE (1999), ch. 4;
 * Wiener (1912) for the laminate limit; Osborn, Phys. Rev. 67, 351 (1945) for the shapes.
 */
import type { Complex } from "../core/complex.js";
import { spheroidAspectForDepolarization } from "./depolarization.js";
import { parallelMeanReal, seriesMeanReal } from "./bounds.js";
import { maxwellGarnettAxis } from "./mixing/mgEllipsoid.js";

export interface AnisotropicMatch {
  feasible: boolean;
  /** fill fraction of the inclusion phase (NaN when infeasible) */
  fill: number;
  /** depolarization factors along principal axes 1 and 2 (3D: axis, transverse) */
  depolarization: [number, number];
  /** "laminate" at the N ∈ {0, 1} limit, else the inclusion shape of that dimension */
  shape: "laminate" | "elliptic-cylinder" | "spheroid" | "none";
  /**
   * 2D: ratio of the elliptic cross-section's semi-axis along principal axis 1 to the one along
   * axis 2 (N_1 = a_2/(a_1 + a_2)); 3D: spheroid aspect (axis/equatorial). 0/Infinity at the limits.
   */
  aspect: number;
  /** true when the solution uses the second material as host (the first as inclusion) */
  hostSwapped: boolean;
  /** effective permittivities along axes 1 and 2 at the solution (complex phases) */
  achieved: [Complex, Complex];
  /** why no shape reaches both values */
  reason?: string;
}

const fmt = (x: number): string => Number(x.toPrecision(6)).toString();
const NAN: Complex = { re: NaN, im: NaN };

/** N along one axis that makes Maxwell Garnett give `t` at fill f (real phases). */
function depolarizationFor(h: number, i: number, t: number, f: number): number {
  return ((f * h * (i - h)) / (t - h) - h) / ((1 - f) * (i - h));
}

const SCAN = 4000;

function solveOrdered(host: Complex, inclusion: Complex, t1: number, t2: number, dimension: 2 | 3): { fill: number; n1: number; n2: number } | null {
  const h = host.re;
  const i = inclusion.re;
  const c = dimension === 2 ? 1 : 2;
  const nMax2 = dimension === 2 ? 1 : 0.5;
  const valid = (n1: number, n2: number) => n1 >= -1e-9 && n1 <= 1 + 1e-9 && n2 >= -1e-9 && n2 <= nMax2 + 1e-9;
  const g = (f: number) => {
    const n1 = depolarizationFor(h, i, t1, f);
    const n2 = depolarizationFor(h, i, t2, f);
    return { n1, n2, value: n1 + c * n2 - 1 };
  };
  let prevF = NaN;
  let prev: ReturnType<typeof g> | null = null;
  for (let k = 1; k < SCAN; k++) {
    const f = k / SCAN;
    const cur = g(f);
    if (prev && Number.isFinite(cur.value) && Number.isFinite(prev.value) && Math.sign(cur.value) !== Math.sign(prev.value)) {
      let a = prevF;
      let b = f;
      let ga = prev.value;
      for (let it = 0; it < 200 && b - a > 1e-15; it++) {
        const m = 0.5 * (a + b);
        const gm = g(m).value;
        if (Math.sign(gm) === Math.sign(ga)) {
          a = m;
          ga = gm;
        } else b = m;
      }
      const fill = 0.5 * (a + b);
      const sol = g(fill);
      if (valid(sol.n1, sol.n2) && Math.abs(sol.value) < 1e-8) {
        const n1 = Math.min(1, Math.max(0, sol.n1));
        const n2 = Math.min(nMax2, Math.max(0, sol.n2));
        return { fill, n1, n2 };
      }
    }
    prevF = f;
    prev = cur;
  }
  return null;
}

/** Largest ratio parallel/series over f ∈ (0, 1): the most anisotropy a laminate of the pair gives. */
export function laminateMaxAnisotropy(eps1: number, eps2: number): number {
  let best = 1;
  for (let k = 1; k < 1000; k++) {
    const f = k / 1000;
    const par = parallelMeanReal(eps1, eps2, f);
    const ser = seriesMeanReal(eps1, eps2, f);
    best = Math.max(best, par / ser);
  }
  return best;
}

/**
 * Fill fraction and shape of aligned inclusions (or a laminate) of one material pair that give
 * the two principal values `target` = [ε_1, ε_2] (real parts). Tries `host` as host first, then
 * the other way round. dimension 2: in-plane principal values of elliptic cylinders along z;
 * dimension 3: spheroids, ε_1 along the symmetry axis, ε_2 across it. Infeasible results carry the
 * reason (a value outside the pair's range, or more anisotropy than the laminate gives).
 * Example: the laminate of 1 and 4 at f = 1/2 has [ε_∥, ε_⊥] = [2.5, 1.6]; in 2D
 * anisotropicInverse(1, 4, [2.5, 1.6], 2) → fill 0.5, depolarization [0, 1], shape "laminate".
 */
export function anisotropicInverse(host: number | Complex, inclusion: number | Complex, target: [number, number], dimension: 2 | 3): AnisotropicMatch {
  const h: Complex = typeof host === "number" ? { re: host, im: 0 } : host;
  const i: Complex = typeof inclusion === "number" ? { re: inclusion, im: 0 } : inclusion;
  const [t1, t2] = target;
  const fail = (reason: string): AnisotropicMatch => ({
    feasible: false, fill: NaN, depolarization: [NaN, NaN], shape: "none", aspect: NaN, hostSwapped: false, achieved: [NAN, NAN], reason,
  });
  if (!(h.re > 0) || !(i.re > 0)) return fail("the shape solve needs positive real parts for both phases");
  const lo = Math.min(h.re, i.re);
  const hi = Math.max(h.re, i.re);
  for (const t of target) {
    if (t < lo || t > hi) return fail(`target ${fmt(t)} is outside the range ${fmt(lo)}–${fmt(hi)} of this pair`);
  }
  if (h.re === i.re) return t1 === h.re && t2 === h.re ? { feasible: true, fill: 0, depolarization: dimension === 2 ? [0.5, 0.5] : [1 / 3, 1 / 3], shape: dimension === 2 ? "elliptic-cylinder" : "spheroid", aspect: 1, hostSwapped: false, achieved: [h, h] } : fail("the two phases are equal");
  for (const swapped of [false, true]) {
    const hh = swapped ? i : h;
    const ii = swapped ? h : i;
    // a target equal to the host value needs f = 0 and then both must equal it
    if (t1 === hh.re || t2 === hh.re) {
      if (t1 === hh.re && t2 === hh.re) return { feasible: true, fill: swapped ? 1 : 0, depolarization: [NaN, NaN], shape: "none", aspect: NaN, hostSwapped: swapped, achieved: [hh, hh] };
      continue;
    }
    const sol = solveOrdered(hh, ii, t1, t2, dimension);
    if (!sol) continue;
    const laminate = (sol.n1 < 1e-9 || sol.n1 > 1 - 1e-9) && (sol.n2 < 1e-9 || sol.n2 > 1 - 1e-9);
    if (laminate) {
      sol.n1 = Math.round(sol.n1);
      sol.n2 = Math.round(sol.n2);
    }
    const aspect = dimension === 2 ? (sol.n1 === 0 ? Infinity : sol.n2 / sol.n1) : spheroidAspectForDepolarization(sol.n1);
    return {
      feasible: true,
      fill: sol.fill,
      depolarization: [sol.n1, sol.n2],
      shape: laminate ? "laminate" : dimension === 2 ? "elliptic-cylinder" : "spheroid",
      aspect,
      hostSwapped: swapped,
      achieved: [maxwellGarnettAxis(hh, ii, sol.fill, sol.n1), maxwellGarnettAxis(hh, ii, sol.fill, sol.n2)],
    };
  }
  const ratio = Math.max(t1, t2) / Math.min(t1, t2);
  const lam = laminateMaxAnisotropy(h.re, i.re);
  if (ratio > lam * (1 + 1e-9)) {
    return fail(`no shape reaches both ${fmt(t1)} and ${fmt(t2)}: their ratio ${fmt(ratio)} exceeds the largest anisotropy ${fmt(lam)} a laminate of this pair gives`);
  }
  return fail(`no fill fraction and ${dimension === 2 ? "elliptic-cylinder" : "spheroid"} shape reaches both ${fmt(t1)} and ${fmt(t2)} with this pair (the pair lies outside what aligned inclusions give at any single fill fraction)`);
}
