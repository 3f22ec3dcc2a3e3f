/**
 * Eigenvalues (and vectors) of small real symmetric matrices, allocation-free.
 *
 * 2×2: closed form. 3×3: closed form when the tensor is block diagonal in (xy | z) — the usual case
 * for 2D devices — and cyclic Jacobi rotations otherwise (converges to machine precision in a few
 * sweeps for 3×3).
 */
import { XX, YY, ZZ, XY, XZ, YZ } from "./symTensor.js";

/**
 * Eigenvalues of [[a, b], [b, c]], written ascending into out[0] ≤ out[1]. Returns out.
 * Example: sym2Eigenvalues(out, 2, 0, 1) → [1, 2].
 */
export function sym2Eigenvalues(out: Float64Array | number[], a: number, b: number, c: number): Float64Array | number[] {
  const mean = 0.5 * (a + c);
  const half = Math.hypot(0.5 * (a - c), b);
  out[0] = mean - half;
  out[1] = mean + half;
  return out;
}

/**
 * Angle θ (radians, in (-π/2, π/2]) of the eigenvector of the LARGER eigenvalue of [[a, b], [b, c]]:
 * the vector is (cos θ, sin θ).
 */
export function sym2MajorAngle(a: number, b: number, c: number): number {
  return 0.5 * Math.atan2(2 * b, a - c);
}

const scratch = new Float64Array(9);
const vecScratch = new Float64Array(9);

/**
 * Eigenvalues of a packed symmetric 3×3 tensor `t` (xx, yy, zz, xy, xz, yz), ascending in
 * out[0..2]. If `vectors` is given (Float64Array(9)), column k (vectors[3*r + k]) receives the unit
 * eigenvector of out[k]. Returns out. Non-finite input gives NaN output (callers check).
 */
export function sym3Eigen(out: Float64Array, t: ArrayLike<number>, vectors?: Float64Array): Float64Array {
  const xz = t[XZ], yz = t[YZ];
  if (xz === 0 && yz === 0) {
    // Block diagonal: 2×2 in-plane plus zz.
    const a = t[XX], b = t[XY], c = t[YY], z = t[ZZ];
    const mean = 0.5 * (a + c);
    const half = Math.hypot(0.5 * (a - c), b);
    const l0 = mean - half, l1 = mean + half;
    const th = 0.5 * Math.atan2(2 * b, a - c); // major axis angle
    const cth = Math.cos(th), sth = Math.sin(th);
    // three (value, vx, vy, vz) pairs; sort ascending
    let v0 = l0, v1 = l1, v2 = z;
    let i0 = 0, i1 = 1, i2 = 2;
    if (v0 > v1) { const s = v0; v0 = v1; v1 = s; const k = i0; i0 = i1; i1 = k; }
    if (v1 > v2) { const s = v1; v1 = v2; v2 = s; const k = i1; i1 = i2; i2 = k; }
    if (v0 > v1) { const s = v0; v0 = v1; v1 = s; const k = i0; i0 = i1; i1 = k; }
    out[0] = v0; out[1] = v1; out[2] = v2;
    if (vectors) {
      const order = [i0, i1, i2];
      for (let k = 0; k < 3; k++) {
        const which = order[k];
        const vx = which === 0 ? -sth : which === 1 ? cth : 0;
        const vy = which === 0 ? cth : which === 1 ? sth : 0;
        const vz = which === 2 ? 1 : 0;
        vectors[k] = vx; vectors[3 + k] = vy; vectors[6 + k] = vz;
      }
    }
    return out;
  }
  // Cyclic Jacobi on a full copy.
  const m = scratch;
  m[0] = t[XX]; m[1] = t[XY]; m[2] = xz;
  m[3] = t[XY]; m[4] = t[YY]; m[5] = yz;
  m[6] = xz; m[7] = yz; m[8] = t[ZZ];
  const v = vecScratch;
  v.fill(0); v[0] = 1; v[4] = 1; v[8] = 1;
  for (let sweep = 0; sweep < 50; sweep++) {
    const off = m[1] * m[1] + m[2] * m[2] + m[5] * m[5];
    const diag = m[0] * m[0] + m[4] * m[4] + m[8] * m[8];
    if (off <= 1e-30 * diag || off === 0) break;
    for (let p = 0; p < 2; p++) {
      for (let q = p + 1; q < 3; q++) {
        const apq = m[3 * p + q];
        if (apq === 0) continue;
        const app = m[3 * p + p], aqq = m[3 * q + q];
        const theta = (aqq - app) / (2 * apq);
        const tt = Math.sign(theta || 1) / (Math.abs(theta) + Math.sqrt(theta * theta + 1));
        const c = 1 / Math.sqrt(tt * tt + 1), s = tt * c;
        for (let k = 0; k < 3; k++) {
          const mkp = m[3 * k + p], mkq = m[3 * k + q];
          m[3 * k + p] = c * mkp - s * mkq;
          m[3 * k + q] = s * mkp + c * mkq;
        }
        for (let k = 0; k < 3; k++) {
          const mpk = m[3 * p + k], mqk = m[3 * q + k];
          m[3 * p + k] = c * mpk - s * mqk;
          m[3 * q + k] = s * mpk + c * mqk;
        }
        for (let k = 0; k < 3; k++) {
          const vkp = v[3 * k + p], vkq = v[3 * k + q];
          v[3 * k + p] = c * vkp - s * vkq;
          v[3 * k + q] = s * vkp + c * vkq;
        }
      }
    }
  }
  // sort ascending with vectors
  const vals = [m[0], m[4], m[8]];
  const idx = [0, 1, 2].sort((x, y) => vals[x] - vals[y]);
  out[0] = vals[idx[0]]; out[1] = vals[idx[1]]; out[2] = vals[idx[2]];
  if (vectors) {
    for (let k = 0; k < 3; k++) {
      const col = idx[k];
      vectors[k] = v[col]; vectors[3 + k] = v[3 + col]; vectors[6 + k] = v[6 + col];
    }
  }
  return out;
}
