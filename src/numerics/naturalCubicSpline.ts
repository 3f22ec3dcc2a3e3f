/**
 * Natural cubic spline through tabulated points (x strictly increasing): the second derivatives at
 * the nodes from the tridiagonal system with zero end moments (Thomas algorithm), and evaluation
 * S(t) = A·y_k + B·y_{k+1} + ((A³ − A)·M_k + (B³ − B)·M_{k+1})·h²/6 with A = (x_{k+1} − t)/h,
 * B = 1 − A (Press et al., "Numerical Recipes", 3rd ed., 2007, §3.3, eqs. 3.3.3 and 3.3.7).
 * Outside [x_0, x_{n−1}] the end cubic is extended. Our own: a dozen lines, used by the solved-cell
 * tables (homogenization, rectangular lattices, wire cut-off), where an npm dependency would add
 * more than it saves. Pure; O(n) to prepare, O(n) search per evaluation (tables hold < 100 nodes).
 */

/** Second derivatives M_k of the natural cubic spline through (x, y); M_0 = M_{n−1} = 0. */
export function naturalSplineMoments(x: ArrayLike<number>, y: ArrayLike<number>): Float64Array {
  const n = x.length;
  const m = new Float64Array(n), c = new Float64Array(n), d = new Float64Array(n);
  for (let i = 1; i < n - 1; i++) {
    const h0 = x[i] - x[i - 1], h1 = x[i + 1] - x[i];
    const a = h0 / 6, b = (h0 + h1) / 3, cc = h1 / 6;
    const r = (y[i + 1] - y[i]) / h1 - (y[i] - y[i - 1]) / h0;
    const denom = b - a * c[i - 1];
    c[i] = cc / denom;
    d[i] = (r - a * d[i - 1]) / denom;
  }
  for (let i = n - 2; i >= 1; i--) m[i] = d[i] - c[i] * m[i + 1];
  return m;
}

/** The spline through (x, y) with moments `m` (from naturalSplineMoments) at `t`. */
export function naturalSplineAt(x: ArrayLike<number>, y: ArrayLike<number>, m: ArrayLike<number>, t: number): number {
  let k = 0;
  while (k < x.length - 2 && t > x[k + 1]) k++;
  const h = x[k + 1] - x[k];
  const a = (x[k + 1] - t) / h, b = (t - x[k]) / h;
  return a * y[k] + b * y[k + 1] + (((a * a * a - a) * m[k] + (b * b * b - b) * m[k + 1]) * h * h) / 6;
}
