/**
 * The transformation-medium kernel: from K = ∂G/∂x' (row-major 3×3) to the material
 * ε' = J ε_b Jᵀ / det J with J = K⁻¹. Writing A = adj(K) (so K⁻¹ = A / det K),
 * J Jᵀ / det J = A Aᵀ / det K. For an isotropic background μ' = (μ_b/ε_b) ε'.
 * (Pendry, Schurig, Smith, Science 312, 1780 (2006); Schurig, Pendry, Smith, Opt. Express 14,
 * 9794 (2006).) Allocation-free.
 */

/**
 * Writes the packed symmetric S = A Aᵀ / det K (xx, yy, zz, xy, xz, yz) into `s` and returns
 * det K. When det K ≤ 0 or is not finite, `s` is left unspecified; the caller checks the return.
 */
export function materialFromK(s: Float64Array, k: Float64Array): number {
  const k0 = k[0], k1 = k[1], k2 = k[2], k3 = k[3], k4 = k[4], k5 = k[5], k6 = k[6], k7 = k[7], k8 = k[8];
  // adjugate rows: A = cofactor(K)ᵀ
  const a00 = k4 * k8 - k5 * k7, a01 = k2 * k7 - k1 * k8, a02 = k1 * k5 - k2 * k4;
  const a10 = k5 * k6 - k3 * k8, a11 = k0 * k8 - k2 * k6, a12 = k2 * k3 - k0 * k5;
  const a20 = k3 * k7 - k4 * k6, a21 = k1 * k6 - k0 * k7, a22 = k0 * k4 - k1 * k3;
  const det = k0 * a00 + k1 * a10 + k2 * a20;
  if (!(det > 0) || det === Infinity) return det;
  const inv = 1 / det;
  s[0] = (a00 * a00 + a01 * a01 + a02 * a02) * inv;
  s[1] = (a10 * a10 + a11 * a11 + a12 * a12) * inv;
  s[2] = (a20 * a20 + a21 * a21 + a22 * a22) * inv;
  s[3] = (a00 * a10 + a01 * a11 + a02 * a12) * inv;
  s[4] = (a00 * a20 + a01 * a21 + a02 * a22) * inv;
  s[5] = (a10 * a20 + a11 * a21 + a12 * a22) * inv;
  return det;
}
