/**
 * Lattice geometry and sums for the wire-lattice cut-off (wireLatticeCutoff.ts).
 *
 * - Primitive and reciprocal vectors of the square and hexagonal lattices (spacing a = 1).
 * - J₀ by the polynomial approximations of Abramowitz & Stegun, "Handbook of Mathematical
 *   Functions", 1964, eq. 9.4.1 (|x| ≤ 3, error < 5e-8) and 9.4.3 (x ≥ 3, error < 1.6e-8).
 * - E₁ (exponential integral): power series (A&S 5.1.11) for x ≤ 1, continued fraction (A&S 5.1.22)
 *   beyond.
 * - The constant C₀ of the periodic static Green's function with a neutralizing background,
 *   G(ρ) = (1/A)Σ_{G≠0} e^{iG·ρ}/G² = −ln ρ/(2π) + ρ²/(4A) + C₀ + (harmonic terms vanishing at 0),
 *   by Ewald's split (Ewald 1921; the 2D form as in Linton, "Lattice sums for the Helmholtz
 *   equation", SIAM Rev. 52, 630 (2010), sec. 4, taken to k = 0):
 *   C₀ = (1/A)Σ_{G≠0} e^{−G²/4η²}/G² + (1/4π)Σ_{R≠0} E₁(η²R²) − (γ + 2 ln η)/(4π) − 1/(4η²A).
 *   For the square lattice 2πC₀ + ln 2π equals the static thin-wire constant c = −2 ln η(i)
 *   ≈ 0.527344 (η: Dedekind eta), which the tests check.
 */
export type WireLattice = "square" | "hex";

export interface LatticeVectors {
  /** primitive vectors a1, a2 (a = 1) */
  a1: [number, number];
  a2: [number, number];
  b1: [number, number];
  b2: [number, number];
  /** cell area */
  area: number;
}

export function latticeVectors(lattice: WireLattice): LatticeVectors {
  const a1: [number, number] = [1, 0];
  const a2: [number, number] = lattice === "square" ? [0, 1] : [0.5, Math.sqrt(3) / 2];
  const area = a1[0] * a2[1] - a1[1] * a2[0];
  const s = (2 * Math.PI) / area;
  return { a1, a2, b1: [a2[1] * s, -a2[0] * s], b2: [-a1[1] * s, a1[0] * s], area };
}

/** J₀(x), A&S 9.4.1 / 9.4.3. */
export function besselJ0(x: number): number {
  const ax = Math.abs(x);
  if (ax <= 3) {
    const y = (ax / 3) ** 2;
    return 1 + y * (-2.2499997 + y * (1.2656208 + y * (-0.3163866 + y * (0.0444479 + y * (-0.0039444 + y * 0.00021)))));
  }
  const y = 3 / ax;
  const f0 = 0.79788456 + y * (-0.00000077 + y * (-0.0055274 + y * (-0.00009512 + y * (0.00137237 + y * (-0.00072805 + y * 0.00014476)))));
  const t0 = ax - 0.78539816 + y * (-0.04166397 + y * (-0.00003954 + y * (0.00262573 + y * (-0.00054125 + y * (-0.00029333 + y * 0.00013558)))));
  return (f0 * Math.cos(t0)) / Math.sqrt(ax);
}

const EULER_GAMMA = 0.5772156649015329;

/** E₁(x) for x > 0 (A&S 5.1.11 series; 5.1.22 continued fraction, Lentz's evaluation). */
export function expIntE1(x: number): number {
  if (x <= 1) {
    let sum = 0, term = 1;
    for (let k = 1; k < 60; k++) {
      term *= -x / k;
      const add = -term / k;
      sum += add;
      if (Math.abs(add) < 1e-17 * Math.abs(sum)) break;
    }
    return -EULER_GAMMA - Math.log(x) + sum;
  }
  // E1(x) = e^{-x} / (x + 1/(1 + 1/(x + 2/(1 + 2/(x + …))))) via the even form
  let b = x + 1, c = 1e300, d = 1 / b, h = d;
  for (let i = 1; i < 200; i++) {
    const an = -i * i;
    b += 2;
    d = 1 / (an * d + b);
    c = b + an / c;
    const del = c * d;
    h *= del;
    if (Math.abs(del - 1) < 1e-16) break;
  }
  return h * Math.exp(-x);
}

/** C₀ of the lattice (module comment), with a = 1. */
export function staticGreenConstant(lattice: WireLattice): number {
  const v = latticeVectors(lattice);
  const eta = Math.sqrt(Math.PI / v.area);
  let recip = 0, real = 0;
  const M = 12;
  for (let i = -M; i <= M; i++) {
    for (let j = -M; j <= M; j++) {
      if (i === 0 && j === 0) continue;
      const gx = i * v.b1[0] + j * v.b2[0], gy = i * v.b1[1] + j * v.b2[1];
      const g2 = gx * gx + gy * gy;
      recip += Math.exp(-g2 / (4 * eta * eta)) / g2;
      const rx = i * v.a1[0] + j * v.a2[0], ry = i * v.a1[1] + j * v.a2[1];
      real += expIntE1(eta * eta * (rx * rx + ry * ry));
    }
  }
  return recip / v.area + real / (4 * Math.PI) - (EULER_GAMMA + 2 * Math.log(eta)) / (4 * Math.PI) - 1 / (4 * eta * eta * v.area);
}
