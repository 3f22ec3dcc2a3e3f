/**
 * A structured, boundary-fitted mesh of a quadrilateral domain: nu × nv nodes, node (i, j) at
 * index j·nu + i, built by transfinite (Coons) interpolation of the four boundary node rows
 * (Gordon & Hall, "Construction of curvilinear co-ordinate systems and applications to mesh
 * generation", Int. J. Numer. Methods Eng. 7, 461 (1973)):
 *   P(ξ, η) = (1−η)B(ξ) + ηT(ξ) + (1−ξ)L(η) + ξR(η) − [(1−ξ)(1−η)P₀₀ + ξ(1−η)P₁₀ + (1−ξ)ηP₀₁ + ξηP₁₁].
 * A domain whose interpolated mesh folds is smoothed by Winslow's elliptic equations
 * (Winslow, J. Comput. Phys. 1, 149 (1967); Thompson, Warsi & Mastin, "Numerical Grid
 * Generation", 1985, §6): α x_ξξ − 2β x_ξη + γ x_ηη = 0 with α = x_η² + y_η², β = x_ξx_η + y_ξy_η,
 * γ = x_ξ² + y_ξ², by Gauss–Seidel sweeps with the boundary fixed. Pure.
 */

export interface StructuredMesh {
  nu: number;
  nv: number;
  /** node positions in metres, index j·nu + i */
  x: Float64Array;
  y: Float64Array;
}

export interface NodeRow { x: Float64Array; y: Float64Array }

/** Coons patch through the boundary rows (bottom, top: nu nodes left → right; left, right: nv nodes bottom → top). */
export function coonsMesh(bottom: NodeRow, right: NodeRow, top: NodeRow, left: NodeRow): StructuredMesh {
  const nu = bottom.x.length, nv = left.x.length;
  const x = new Float64Array(nu * nv), y = new Float64Array(nu * nv);
  const x00 = bottom.x[0], y00 = bottom.y[0], x10 = bottom.x[nu - 1], y10 = bottom.y[nu - 1];
  const x01 = top.x[0], y01 = top.y[0], x11 = top.x[nu - 1], y11 = top.y[nu - 1];
  for (let j = 0; j < nv; j++) {
    const e = j / (nv - 1);
    for (let i = 0; i < nu; i++) {
      const s = i / (nu - 1);
      const p = j * nu + i;
      if (j === 0) { x[p] = bottom.x[i]; y[p] = bottom.y[i]; continue; }
      if (j === nv - 1) { x[p] = top.x[i]; y[p] = top.y[i]; continue; }
      if (i === 0) { x[p] = left.x[j]; y[p] = left.y[j]; continue; }
      if (i === nu - 1) { x[p] = right.x[j]; y[p] = right.y[j]; continue; }
      x[p] = (1 - e) * bottom.x[i] + e * top.x[i] + (1 - s) * left.x[j] + s * right.x[j]
        - ((1 - s) * (1 - e) * x00 + s * (1 - e) * x10 + (1 - s) * e * x01 + s * e * x11);
      y[p] = (1 - e) * bottom.y[i] + e * top.y[i] + (1 - s) * left.y[j] + s * right.y[j]
        - ((1 - s) * (1 - e) * y00 + s * (1 - e) * y10 + (1 - s) * e * y01 + s * e * y11);
    }
  }
  return { nu, nv, x, y };
}

/**
 * The first quad (index j·(nu−1) + i) whose corners do not all turn counter-clockwise, or −1.
 * A bilinear quad is one-to-one exactly when the cross products at its four corners are positive.
 */
export function firstFoldedQuad(m: StructuredMesh): number {
  const { nu, nv, x, y } = m;
  for (let j = 0; j + 1 < nv; j++) {
    for (let i = 0; i + 1 < nu; i++) {
      const a = j * nu + i, b = a + 1, c = a + nu + 1, d = a + nu;
      const cr = (p: number, q: number, r: number): number => (x[q] - x[p]) * (y[r] - y[p]) - (y[q] - y[p]) * (x[r] - x[p]);
      if (!(cr(a, b, d) > 0 && cr(b, c, a) > 0 && cr(c, d, b) > 0 && cr(d, a, c) > 0)) return j * (nu - 1) + i;
    }
  }
  return -1;
}

/** Winslow smoothing in place (boundary fixed): `sweeps` Gauss–Seidel sweeps. */
export function winslowSmooth(m: StructuredMesh, sweeps: number): void {
  const { nu, nv, x, y } = m;
  for (let it = 0; it < sweeps; it++) {
    for (let j = 1; j + 1 < nv; j++) {
      for (let i = 1; i + 1 < nu; i++) {
        const p = j * nu + i;
        const xe = 0.5 * (x[p + 1] - x[p - 1]), ye = 0.5 * (y[p + 1] - y[p - 1]);
        const xn = 0.5 * (x[p + nu] - x[p - nu]), yn = 0.5 * (y[p + nu] - y[p - nu]);
        const alpha = xn * xn + yn * yn, beta = xe * xn + ye * yn, gamma = xe * xe + ye * ye;
        const xc = 0.25 * (x[p + nu + 1] - x[p + nu - 1] - x[p - nu + 1] + x[p - nu - 1]);
        const yc = 0.25 * (y[p + nu + 1] - y[p + nu - 1] - y[p - nu + 1] + y[p - nu - 1]);
        const den = 2 * (alpha + gamma);
        if (!(den > 0)) continue;
        x[p] = (alpha * (x[p + 1] + x[p - 1]) + gamma * (x[p + nu] + x[p - nu]) - 2 * beta * xc) / den;
        y[p] = (alpha * (y[p + 1] + y[p - 1]) + gamma * (y[p + nu] + y[p - nu]) - 2 * beta * yc) / den;
      }
    }
  }
}
