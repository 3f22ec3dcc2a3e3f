import { describe, it } from "vitest";
import { reduceField } from "../../src/reduce/reduceField.js";
import { expectClose } from "../helpers/close.js";
import { inverseMapField } from "./fixtures/fields.js";

/**
 * Li, Pendry, "Hiding under the carpet: a new strategy for cloaking", PRL 101, 203901 (2008):
 * with μ = 1 (E along z) a 2D map needs n² = n_b²/det J, and the in-plane anisotropy that is
 * dropped is α = σ1/σ2, σ the singular values of J (equivalently of K = J⁻¹).
 */
function singularRatio(k: ArrayLike<number>): number {
  // σ² are the eigenvalues of KᵀK: (S ± sqrt(S² − 4 det²))/2 with S = Σ k_ij²
  const S = k[0] ** 2 + k[1] ** 2 + k[2] ** 2 + k[3] ** 2;
  const det = k[0] * k[3] - k[1] * k[2];
  const root = Math.sqrt(S * S - 4 * det * det);
  return Math.sqrt((S + root) / (S - root));
}

describe("isotropic scheme (Li, Pendry 2008)", () => {
  it("uniform compression y' = s·y: n² = n_b²/s and α = 1/s, both polarizations", () => {
    const s = 0.8, nb = 1.4;
    // physical → virtual: y = y'/s, K = diag(1, 1/s), det J = s
    const field = inverseMapField((_x, _y, k) => { k[0] = 1; k[1] = 0; k[2] = 0; k[3] = 1 / s; },
      { halfWidthM: 0.01, inside: () => true }, 0.002);
    for (const pol of ["Ez", "Hz"] as const) {
      const red = reduceField(field, { polarization: pol, scheme: "isotropic", backgroundIndex: nb });
      const n2 = pol === "Ez" ? red.components.eps_zz : red.components.eps_xx;
      const mu = pol === "Ez" ? red.components.mu_xx : red.components.mu_zz;
      const ones = new Float64Array(red.count).fill(1);
      expectClose(n2, new Float64Array(red.count).fill(nb * nb / s), { rel: 1e-14, label: `${pol} n²` });
      expectClose(mu, ones, { rel: 1e-14, label: `${pol} μ` });
      expectClose(red.droppedAnisotropy, new Float64Array(red.count).fill(1 / s), { rel: 1e-14, label: `${pol} α` });
      expectClose(red.anisotropy, ones, { rel: 1e-15, label: "kept anisotropy" });
    }
  });

  it("nearly conformal map (w = z + κz², plus a small shear): n² = n_b²/det J, α = σ1/σ2 per cell", () => {
    // G(x') = Re/Im(z' + κz'²) + (δ y'², 0): K = [[p, −q + 2δy], [q, p]], p = 1 + 2κx, q = 2κy
    const kappa = 8, delta = 0.6, nb = 1.2;
    const jac = (x: number, y: number, k: Float64Array | number[]) => {
      const p = 1 + 2 * kappa * x, q = 2 * kappa * y;
      k[0] = p; k[1] = -q + 2 * delta * y; k[2] = q; k[3] = p;
    };
    const field = inverseMapField(jac, { halfWidthM: 0.02, inside: (x, y) => x * x + y * y < 0.02 ** 2 }, 0.001);
    const k = [0, 0, 0, 0];
    for (const pol of ["Ez", "Hz"] as const) {
      const red = reduceField(field, { polarization: pol, scheme: "isotropic", backgroundIndex: nb });
      for (let c = 0; c < red.count; c++) {
        jac(field.grid.xM[c], field.grid.yM[c], k);
        const detK = k[0] * k[3] - k[1] * k[2]; // = 1/det J
        const n2 = pol === "Ez" ? red.components.eps_zz[c] : red.components.eps_xx[c];
        expectClose(n2, nb * nb * detK, { rel: 1e-13, label: `${pol} n² cell ${c}` });
        expectClose(red.droppedAnisotropy[c], singularRatio(k), { rel: 1e-12, label: `${pol} α cell ${c}` });
      }
    }
  });
});
