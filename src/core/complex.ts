/**
 * Complex numbers as plain `{ re, im }` records, for the edges of the code (material values,
 * mixing rules, dispersion models). Hot per-cell loops keep separate re/im Float64Arrays instead.
 *
 * Convention: time dependence exp(-iωt), so a passive lossy medium has Im ε ≥ 0.
 */
export interface Complex {
  re: number;
  im: number;
}

export const complex = (re: number, im = 0): Complex => ({ re, im });
export const ZERO: Complex = Object.freeze({ re: 0, im: 0 });
export const ONE: Complex = Object.freeze({ re: 1, im: 0 });

export const cAdd = (a: Complex, b: Complex): Complex => ({ re: a.re + b.re, im: a.im + b.im });
export const cSub = (a: Complex, b: Complex): Complex => ({ re: a.re - b.re, im: a.im - b.im });
export const cMul = (a: Complex, b: Complex): Complex => ({
  re: a.re * b.re - a.im * b.im,
  im: a.re * b.im + a.im * b.re,
});
export const cScale = (a: Complex, s: number): Complex => ({ re: a.re * s, im: a.im * s });
export const cConj = (a: Complex): Complex => ({ re: a.re, im: -a.im });
export const cAbs = (a: Complex): number => Math.hypot(a.re, a.im);
export const cArg = (a: Complex): number => Math.atan2(a.im, a.re);

/** a / b; dividing by exact zero gives a non-finite result the caller must check. */
export function cDiv(a: Complex, b: Complex): Complex {
  // Smith's algorithm: avoids overflow for large |b|.
  if (Math.abs(b.re) >= Math.abs(b.im)) {
    const r = b.im / b.re;
    const d = b.re + b.im * r;
    return { re: (a.re + a.im * r) / d, im: (a.im - a.re * r) / d };
  }
  const r = b.re / b.im;
  const d = b.re * r + b.im;
  return { re: (a.re * r + a.im) / d, im: (a.im * r - a.re) / d };
}

/**
 * Principal square root (Re ≥ 0; for a negative real argument the root is +i·sqrt).
 * Cancellation-free: the larger of |Re|, |Im| of the root is computed from (|z| ± Re z)/2 without
 * subtraction, the other as Im z / (2·that), so nearly real arguments (tan δ ~ 1e-6) keep their
 * small part to full precision.
 */
export function cSqrt(a: Complex): Complex {
  const m = cAbs(a);
  if (m === 0) return { re: 0, im: 0 };
  if (a.re >= 0) {
    const re = Math.sqrt((m + a.re) / 2);
    return { re, im: a.im / (2 * re) };
  }
  const imAbs = Math.sqrt((m - a.re) / 2);
  const im = a.im < 0 ? -imAbs : imAbs;
  return { re: a.im / (2 * im), im };
}

/**
 * Refractive index n = sqrt(ε μ) on the passive branch (Im n ≥ 0 for exp(-iωt)).
 * For ε = μ = 1 returns 1.
 */
export function refractiveIndex(eps: Complex, mu: Complex = ONE): Complex {
  const n = cSqrt(cMul(eps, mu));
  return n.im < 0 ? { re: -n.re, im: -n.im } : n;
}

export const isFiniteComplex = (a: Complex): boolean => Number.isFinite(a.re) && Number.isFinite(a.im);

/** Format as "a+bi" with a fixed number of significant digits, for human output. */
export function formatComplex(a: Complex, digits = 6): string {
  const re = Number(a.re.toPrecision(digits));
  const im = Number(a.im.toPrecision(digits));
  if (im === 0) return `${re}`;
  return `${re}${im < 0 ? "-" : "+"}${Math.abs(im)}i`;
}
