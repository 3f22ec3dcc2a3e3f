/**
 * The band index anchored on the solved quasi-static tensor. The plane-wave expansion
 * (lowestBand.ts) gets the RATIO n_band/n_quasiStatic right within about a tenth of the deviation at
 * M = 4 (tests: M = 4 against 6 and 8), but its absolute index carries the truncation error of the
 * inverse rule: up to 9 % in ε for air holes in ε ≈ 10 at fill 0.3 on the square lattice, 18 % along
 * the wide axis at aspect 2 (measured against the cell solver, homogenize/). So the index reported
 * to people is the solved long-wavelength index along each direction times the expansion's ratio:
 *
 *   n(dir) = n_solved(dir) · n_band(dir) / n_qs(dir),
 *
 * with n_solved from the solved in-plane tensor (principal axes along the lattice's x and y):
 * Ez (field along the circles) n² = ε_zz in every direction; Hz (field across them), a wave along
 * the unit vector (c, s) has 1/n² = c²/ε_yy + s²/ε_xx (Landau & Lifshitz, Electrodynamics of
 * Continuous Media, §97, with H along z).
 */
import type { BandIndex, BandPolarization } from "./lowestBand.js";
import { bandDirections, type BandLattice } from "./bandLattice.js";

export interface SolvedQuasiStatic {
  /** Ez: ε_zz (relative, real part) */
  zz?: number;
  /** Hz: ε along the lattice's x and y (square and hex: equal) */
  xx?: number;
  yy?: number;
}

export interface AnchoredBand {
  /** n along each direction of `band.directions` */
  index: number[];
  /** the solved long-wavelength index along each direction */
  quasiStaticIndex: number[];
}

/** Anchor `band` (solved for `lattice`, `aspect`, `pol`) on the solved tensor; null when a needed value is missing or not positive. */
export function anchoredBandIndex(band: BandIndex, lattice: BandLattice, pol: BandPolarization, solved: SolvedQuasiStatic, aspect = 1): AnchoredBand | null {
  const dirs = bandDirections(lattice, aspect);
  let qs: number[];
  if (pol === "parallel") {
    if (!(solved.zz! > 0)) return null;
    qs = dirs.map(() => Math.sqrt(solved.zz!));
  } else {
    const { xx, yy } = solved;
    if (!(xx! > 0) || !(yy! > 0)) return null;
    qs = dirs.map(({ dir }) => 1 / Math.sqrt((dir[0] * dir[0]) / yy! + (dir[1] * dir[1]) / xx!));
  }
  return { index: band.index.map((n, d) => qs[d] * (n / band.quasiStaticIndex[d])), quasiStaticIndex: qs };
}
