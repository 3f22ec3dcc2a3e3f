/**
 * Principal values (ascending) of packed symmetric tensors, with a fast closed form for the
 * block-diagonal (xy | z) case of 2D devices and cyclic Jacobi (core/eigen.ts) otherwise; and the
 * cap on the largest principal value.
 */
import { sym3Eigen } from "../core/eigen.js";
import type { SymTensorField } from "../core/symTensor.js";

/** Ascending principal values of packed tensor t into out[0..2]. Allocation-free. */
export function principal3(out: Float64Array, t: Float64Array): Float64Array {
  if (t[4] !== 0 || t[5] !== 0) return sym3Eigen(out, t);
  const a = t[0], c = t[1], b = t[3], z = t[2];
  const mean = 0.5 * (a + c), d = 0.5 * (a - c);
  const half = Math.sqrt(d * d + b * b);
  let v0 = mean - half, v1 = mean + half, v2 = z;
  if (v2 < v1) { const s = v1; v1 = v2; v2 = s; if (v1 < v0) { const q = v0; v0 = v1; v1 = q; } }
  out[0] = v0; out[1] = v1; out[2] = v2;
  return out;
}

const vec = new Float64Array(9);

/**
 * Lower every principal value of t above `cap` to `cap`, keeping the principal axes:
 * t ← t − Σ (λ_k − cap) v_k v_kᵀ over λ_k > cap. Updates t and its principal values `vals`
 * (ascending, re-sorted). Returns true when anything changed.
 */
export function capPrincipal(t: Float64Array, vals: Float64Array, cap: number): boolean {
  if (!(vals[2] > cap)) return false;
  sym3Eigen(vals, t, vec);
  for (let k = 0; k < 3; k++) {
    const excess = vals[k] - cap;
    if (!(excess > 0)) continue;
    const x = vec[k], y = vec[3 + k], z = vec[6 + k];
    t[0] -= excess * x * x; t[1] -= excess * y * y; t[2] -= excess * z * z;
    t[3] -= excess * x * y; t[4] -= excess * x * z; t[5] -= excess * y * z;
    vals[k] = cap;
  }
  // re-sort (capped values are the largest, so at most a swap among equals is needed)
  if (vals[0] > vals[1]) { const s = vals[0]; vals[0] = vals[1]; vals[1] = s; }
  if (vals[1] > vals[2]) { const s = vals[1]; vals[1] = vals[2]; vals[2] = s; }
  if (vals[0] > vals[1]) { const s = vals[0]; vals[0] = vals[1]; vals[1] = s; }
  return true;
}

/**
 * Fill principal values and anisotropy ratios (largest/smallest; Infinity when the smallest is
 * ≤ 0) for every cell of a field.
 */
export function fillPrincipal(
  field: SymTensorField,
  p: [Float64Array, Float64Array, Float64Array],
  anisotropy: Float64Array,
): void {
  const t = new Float64Array(6), v = new Float64Array(3);
  const n = anisotropy.length;
  for (let c = 0; c < n; c++) {
    t[0] = field.xx[c]; t[1] = field.yy[c]; t[2] = field.zz[c]; t[3] = field.xy[c]; t[4] = field.xz[c]; t[5] = field.yz[c];
    principal3(v, t);
    p[0][c] = v[0]; p[1][c] = v[1]; p[2][c] = v[2];
    anisotropy[c] = v[0] > 0 ? v[2] / v[0] : Infinity;
  }
}
