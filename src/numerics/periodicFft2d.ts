/**
 * In-place radix-2 complex FFT in one and two dimensions, on separate re/im Float64Arrays, with
 * the twiddles and bit-reversal table computed once per plan (Cooley–Tukey, iterative
 * decimation-in-time; any numerical-methods text, e.g. Press et al., "Numerical Recipes", 3rd ed.,
 * sec. 12.2). Written here because the cell solvers need a small, allocation-free kernel on typed
 * arrays and no maintained npm package offers a 2D transform on split re/im Float64Arrays.
 *
 * Convention: forward X_k = Σ_n x_n e^{−2πikn/N}; inverse with e^{+2πikn/N} and a 1/N factor.
 * Cost: O(N log N) per 1D transform, O(NxNy log(NxNy)) per 2D transform; memory: the plan holds
 * N twiddles and one column buffer.
 *
 * Example: fft1d(plan(4), [1,0,0,0], [0,0,0,0]) → re [1,1,1,1], im [0,0,0,0].
 */
import { ProgrammerError } from "../core/errors.js";

export interface FftPlan {
  n: number;
  cos: Float64Array;
  sin: Float64Array;
  rev: Uint32Array;
}

const isPow2 = (n: number): boolean => Number.isInteger(n) && n >= 1 && (n & (n - 1)) === 0;

/** A plan for transforms of length n (a power of two). Throws ProgrammerError otherwise. */
export function fftPlan(n: number): FftPlan {
  if (!isPow2(n)) throw new ProgrammerError(`fftPlan: length must be a power of two, got ${n}`);
  const cos = new Float64Array(n / 2 || 1);
  const sin = new Float64Array(n / 2 || 1);
  for (let k = 0; k < n / 2; k++) {
    cos[k] = Math.cos((2 * Math.PI * k) / n);
    sin[k] = Math.sin((2 * Math.PI * k) / n);
  }
  const rev = new Uint32Array(n);
  let bits = 0;
  while (1 << bits < n) bits++;
  for (let i = 0; i < n; i++) {
    let r = 0;
    for (let b = 0; b < bits; b++) if (i & (1 << b)) r |= 1 << (bits - 1 - b);
    rev[i] = r;
  }
  return { n, cos, sin, rev };
}

/**
 * Transform re/im in place over n elements starting at `offset` with `stride`; `inverse` uses
 * e^{+2πikn/N} and divides by N. Allocates nothing.
 */
export function fftStrided(p: FftPlan, re: Float64Array, im: Float64Array, offset: number, stride: number, inverse: boolean): void {
  const n = p.n;
  for (let i = 0; i < n; i++) {
    const j = p.rev[i];
    if (j > i) {
      const a = offset + i * stride, b = offset + j * stride;
      const tr = re[a], ti = im[a];
      re[a] = re[b]; im[a] = im[b];
      re[b] = tr; im[b] = ti;
    }
  }
  const sgn = inverse ? 1 : -1;
  for (let size = 2; size <= n; size <<= 1) {
    const half = size >> 1;
    const step = n / size;
    for (let start = 0; start < n; start += size) {
      for (let k = 0; k < half; k++) {
        const wr = p.cos[k * step], wi = sgn * p.sin[k * step];
        const a = offset + (start + k) * stride, b = offset + (start + k + half) * stride;
        const xr = re[b] * wr - im[b] * wi;
        const xi = re[b] * wi + im[b] * wr;
        re[b] = re[a] - xr; im[b] = im[a] - xi;
        re[a] += xr; im[a] += xi;
      }
    }
  }
  if (inverse) {
    const s = 1 / n;
    for (let i = 0; i < n; i++) {
      const a = offset + i * stride;
      re[a] *= s; im[a] *= s;
    }
  }
}

/** 1D transform of whole arrays (length p.n). */
export function fft1d(p: FftPlan, re: Float64Array, im: Float64Array, inverse = false): void {
  if (re.length !== p.n || im.length !== p.n) throw new ProgrammerError(`fft1d: expected arrays of length ${p.n}`);
  fftStrided(p, re, im, 0, 1, inverse);
}

export interface Fft2dPlan {
  nx: number;
  ny: number;
  px: FftPlan;
  py: FftPlan;
}

/** Plan for an nx × ny grid stored row-major with x fastest (index i + nx·j). */
export function fft2dPlan(nx: number, ny: number): Fft2dPlan {
  const px = fftPlan(nx);
  return { nx, ny, px, py: ny === nx ? px : fftPlan(ny) };
}

/** 2D transform in place (x fastest). Allocates nothing. */
export function fft2d(p: Fft2dPlan, re: Float64Array, im: Float64Array, inverse = false): void {
  const { nx, ny } = p;
  for (let j = 0; j < ny; j++) fftStrided(p.px, re, im, j * nx, 1, inverse);
  for (let i = 0; i < nx; i++) fftStrided(p.py, re, im, i, nx, inverse);
}
