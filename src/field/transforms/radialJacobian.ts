/**
 * K = ∂G/∂x' for radial maps r = h(r') about a centre, in Cartesian components.
 *
 * With n̂ = x'/r' the radial unit vector, a radial map x = (h(r')/r') x' has
 * K = (h/r') I + (h'(r') − h/r') n̂ n̂ᵀ (the polar components are K_rr = h', K_θθ = h/r').
 * In 2D the z row/column is the identity; in 3D n̂ has three components.
 * Source: Schurig, Pendry, Smith, Opt. Express 14, 9794 (2006), the radial rule.
 */

/** Write K for a cylindrical radial map (2D, invariant along z) into k (row-major 3×3). */
export function radialK2(k: Float64Array, dx: number, dy: number, rp: number, h: number, dh: number): void {
  const nx = dx / rp, ny = dy / rp;
  const t = h / rp, d = dh - t;
  k[0] = t + d * nx * nx; k[1] = d * nx * ny; k[2] = 0;
  k[3] = d * nx * ny; k[4] = t + d * ny * ny; k[5] = 0;
  k[6] = 0; k[7] = 0; k[8] = 1;
}

/** Write K for a spherical radial map (3D) into k (row-major 3×3). */
export function radialK3(k: Float64Array, dx: number, dy: number, dz: number, rp: number, h: number, dh: number): void {
  const nx = dx / rp, ny = dy / rp, nz = dz / rp;
  const t = h / rp, d = dh - t;
  k[0] = t + d * nx * nx; k[1] = d * nx * ny; k[2] = d * nx * nz;
  k[3] = d * nx * ny; k[4] = t + d * ny * ny; k[5] = d * ny * nz;
  k[6] = d * nx * nz; k[7] = d * ny * nz; k[8] = t + d * nz * nz;
}

/** Write the identity into k. */
export function identityK(k: Float64Array): void {
  k[0] = 1; k[1] = 0; k[2] = 0; k[3] = 0; k[4] = 1; k[5] = 0; k[6] = 0; k[7] = 0; k[8] = 1;
}
