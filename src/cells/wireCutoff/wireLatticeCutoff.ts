/**
 * Cut-off (plasma) wavenumber of a lattice of perfectly conducting wires for a field along them:
 * the lowest TM band at Γ, i.e. the smallest k for which the periodic problem
 *   ∇²E_z + k²E_z = 0 outside the wires, E_z = 0 on them, E_z periodic
 * has a solution. Solved by the surface-current (Galerkin) method in the plane-wave basis: a
 * current uniform around each wire radiates E_z(ρ) ∝ (1/A)Σ_G J₀(Gr)e^{iG·ρ}/(G² − k²); asking that
 * its mean over the wire surface vanish gives the dispersion equation
 *   D(k) = −1/(Ak²) + (1/A)Σ_{G≠0} J₀(Gr)²/(G² − k²) = 0,
 * whose static part is summed exactly with the periodic Green's function (double mean over the
 * circle: −ln r/(2π) + r²/(2A) + C₀, latticeSums.ts) and whose remainder
 * (k²/A)Σ_{G≠0} J₀(Gr)²/(G²(G² − k²)) converges as G⁻⁵ (truncated at |G| ≤ 2π·N, the tail bounded
 * and added). This is the method of Belov, Tretyakov, Viitanen (2002) without their thin-wire
 * approximation of the sums; the angular (multipole) components of the current beyond the uniform
 * one are neglected — by the lattice symmetry the first that couples is of order 4 (square) or 6
 * (hex) and shifts the result by O((r/a)⁸) (resp. (r/a)¹²). As r/a → 0, D(k) = 0 tends to the
 * static thin-wire form (k_p a)² = 2π/(ln(a/(2πr)) + c), c = 2πC₀ + ln 2π.
 *
 * The table (`wireCutoffTable`) holds Λ(r/a) = 2π/(A·k_p²) + ln(r) at nodes in log(r/a), built once
 * per lattice on first use (about 60 root solves), and is interpolated by a natural cubic spline.
 * Cost of one solve: about 4·10⁴ terms per evaluation of D, 40 evaluations.
 */
import { besselJ0, latticeVectors, staticGreenConstant, type WireLattice } from "./latticeSums.js";
import { naturalSplineAt, naturalSplineMoments } from "../../numerics/naturalCubicSpline.js";

const N_SHELLS = 64;

export interface CutoffSolve {
  /** k_p·a */
  kpA: number;
  /** relative size of the truncated tail of the dynamic sum (bound) */
  tailBound: number;
  iterations: number;
}

interface Prepared {
  area: number;
  c0: number;
  g2: Float64Array;
  gNorm: Float64Array;
}

const prepared = new Map<WireLattice, Prepared>();

function prepare(lattice: WireLattice): Prepared {
  let p = prepared.get(lattice);
  if (p) return p;
  const v = latticeVectors(lattice);
  const gMax = 2 * Math.PI * N_SHELLS;
  const g2: number[] = [];
  for (let i = -2 * N_SHELLS; i <= 2 * N_SHELLS; i++) {
    for (let j = -2 * N_SHELLS; j <= 2 * N_SHELLS; j++) {
      if (i === 0 && j === 0) continue;
      const gx = i * v.b1[0] + j * v.b2[0], gy = i * v.b1[1] + j * v.b2[1];
      const s = gx * gx + gy * gy;
      if (s <= gMax * gMax) g2.push(s);
    }
  }
  g2.sort((a, b) => a - b);
  const arr = Float64Array.from(g2);
  p = { area: v.area, c0: staticGreenConstant(lattice), g2: arr, gNorm: arr.map(Math.sqrt) };
  prepared.set(lattice, p);
  return p;
}

/**
 * k_p·a for wires of radius r (units of the pitch, 0 < r < 1/2) on `lattice`. Bisection for the
 * first zero of D(k) on (0, k₁) with k₁ the first reciprocal vector's length (D rises from −∞).
 */
export function solveWireCutoff(lattice: WireLattice, r: number): CutoffSolve {
  const p = prepare(lattice);
  const w = new Float64Array(p.g2.length);
  for (let n = 0; n < w.length; n++) {
    const j = besselJ0(p.gNorm[n] * r);
    w[n] = (j * j) / p.g2[n];
  }
  const statics = -Math.log(r) / (2 * Math.PI) + (r * r) / (2 * p.area) + p.c0;
  const gMax2 = p.g2[p.g2.length - 1];
  const D = (k2: number): number => {
    let s = 0;
    for (let n = 0; n < w.length; n++) s += w[n] / (p.g2[n] - k2);
    return -1 / (p.area * k2) + statics + (k2 / p.area) * s;
  };
  const k1sq = p.g2[0];
  let lo = 1e-12 * k1sq, hi = k1sq * (1 - 1e-9);
  let it = 0;
  for (; it < 200 && hi - lo > 1e-15 * hi; it++) {
    const m = 0.5 * (lo + hi);
    if (D(m) < 0) lo = m;
    else hi = m;
  }
  const k2 = 0.5 * (lo + hi);
  // tail of (k²/A)Σ J₀²/(G²(G²−k²)) beyond gMax with J₀² ≤ 1: (k²/A)·(A/2π)∫ dG/G³ = k²/(4π gMax²)
  const tail = k2 / (4 * Math.PI * gMax2);
  return { kpA: Math.sqrt(k2), tailBound: tail / Math.max(1e-300, 1 / (p.area * k2)), iterations: it };
}

/** Static thin-wire constant c = 2πC₀ + ln 2π of the lattice (square: −2 ln η(i) ≈ 0.527344). */
export const thinWireConstant = (lattice: WireLattice): number => 2 * Math.PI * prepare(lattice).c0 + Math.log(2 * Math.PI);

/** Nodes of the cut-off table in log10(r/a). */
const LOG_R = [...Array.from({ length: 40 }, (_, k) => -7 + k * 0.15), ...Array.from({ length: 17 }, (_, k) => Math.log10(0.1 + k * 0.0125))];

interface CutoffTable {
  x: Float64Array;
  y: Float64Array;
  m2: Float64Array;
}

const tables = new Map<WireLattice, CutoffTable>();

/** The cut-off table of a lattice (built on first use). */
export function wireCutoffTable(lattice: WireLattice): CutoffTable {
  let t = tables.get(lattice);
  if (t) return t;
  const x = Float64Array.from(LOG_R);
  const y = new Float64Array(x.length);
  const area = prepare(lattice).area;
  for (let i = 0; i < x.length; i++) {
    const r = 10 ** x[i];
    const s = solveWireCutoff(lattice, r);
    y[i] = (2 * Math.PI) / (area * s.kpA * s.kpA) + Math.log(r);
  }
  t = { x, y, m2: naturalSplineMoments(x, y) };
  tables.set(lattice, t);
  return t;
}

/**
 * Largest r/a the table is used for. Beyond it the neglected multipoles grow: against an
 * independent finite-difference eigen solve (bench/wire_cutoff_fd.py, Richardson over 100/200/400
 * cells per pitch) k_p·a differs by 4e-7 at r/a = 0.1, 2e-5 at 0.2, 2e-4 at 0.25 and 2e-3 at 0.3
 * (square lattice). The hexagonal lattice's band comes closer to its first folded band, so its
 * range stops at 0.2 (not yet checked against the finite-difference solve beyond).
 */
export const wireTableMaxRatio = (lattice: WireLattice): number => (lattice === "square" ? 0.3 : 0.2);
/** Largest r/a of any lattice (the table nodes reach it). */
export const WIRE_TABLE_MAX_RATIO = 0.3;
/** Relative error bound of k_p·a from the finite-difference comparison, by r/a. */
export const wireCutoffError = (ratio: number): number => (ratio <= 0.1 ? 1e-6 : ratio <= 0.2 ? 3e-5 : ratio <= 0.25 ? 3e-4 : 3e-3);
/** Smallest r/a the table covers; below it the static thin-wire limit (exact as r → 0) is used. */
export const WIRE_TABLE_MIN_RATIO = 1e-7;

/**
 * k_p·a from the table (cubic spline in log10(r/a)); below 1e-7 the thin-wire limit with the
 * lattice's own constant (the table's Λ is flat there to < 1e-9). NaN outside (0, wireTableMaxRatio].
 */
export function wireCutoffKpA(lattice: WireLattice, ratio: number): number {
  if (!(ratio > 0) || ratio > wireTableMaxRatio(lattice) * (1 + 1e-12)) return NaN;
  const t = wireCutoffTable(lattice);
  const area = prepare(lattice).area;
  const lx = Math.log10(ratio);
  let lam: number;
  if (lx <= t.x[0]) lam = t.y[0];
  else lam = naturalSplineAt(t.x, t.y, t.m2, lx);
  // Λ = 2π/(A k²) + ln r  ⇒  k² = 2π/(A(Λ − ln r))
  return Math.sqrt((2 * Math.PI) / (area * (lam - Math.log(ratio))));
}
