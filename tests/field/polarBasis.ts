/** Test helper: components of a packed symmetric tensor in local polar / spherical bases. */

/** (rr, θθ, rθ, zz) of packed t in the cylindrical basis at azimuth phi. */
export function cylindrical(t: ArrayLike<number>, phi: number): { rr: number; tt: number; rt: number; zz: number } {
  const c = Math.cos(phi), s = Math.sin(phi);
  const xx = t[0], yy = t[1], xy = t[3];
  return {
    rr: xx * c * c + 2 * xy * c * s + yy * s * s,
    tt: xx * s * s - 2 * xy * c * s + yy * c * c,
    rt: (yy - xx) * c * s + xy * (c * c - s * s),
    zz: t[2],
  };
}

/** u·T·v for packed T. */
export function quad(t: ArrayLike<number>, u: number[], v: number[]): number {
  const m = [[t[0], t[3], t[4]], [t[3], t[1], t[5]], [t[4], t[5], t[2]]];
  let s = 0;
  for (let i = 0; i < 3; i++) for (let j = 0; j < 3; j++) s += u[i] * m[i][j] * v[j];
  return s;
}

/** Spherical basis (r̂, θ̂, φ̂) at a point. */
export function sphericalBasis(x: number, y: number, z: number): number[][] {
  const r = Math.hypot(x, y, z), rho = Math.hypot(x, y);
  const rh = [x / r, y / r, z / r];
  const th = [(z * x) / (r * rho), (z * y) / (r * rho), -rho / r];
  const ph = [-y / rho, x / rho, 0];
  return [rh, th, ph];
}
