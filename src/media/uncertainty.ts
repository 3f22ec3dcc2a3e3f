/**
 * Model uncertainty of a mixture: how far Maxwell Garnett and Bruggeman disagree at a fill
 * fraction. Maxwell Garnett suits isolated inclusions at low fill, Bruggeman aggregates and high
 * fill; where they differ by more than the design tolerance the cell should be checked with a
 * full-wave unit-cell simulation (common practice).
 */
import { cAbs, cSub, type Complex } from "../core/complex.js";
import { maxwellGarnettAxis } from "./mixing/mgEllipsoid.js";
import { bruggemanAligned, bruggemanForward } from "./mixing/bruggeman.js";

const asComplex = (x: number | Complex): Complex => (typeof x === "number" ? { re: x, im: 0 } : x);

/**
 * Relative spread |ε_MG − ε_Br| / |ε_Br| at `fill` of inclusion in host, with the Maxwell Garnett
 * rule of the same dimension (spheres for 3, cylinders across the axis for 2; host as given) and
 * the symmetric Bruggeman rule; with `depolarization` N, both rules for aligned ellipsoids with that
 * factor along the field. 0 at f = 0 and f = 1 and for equal phases.
 * Example: mgBruggemanSpread(1, 4, 0.5, 3) → |2 − 2.1718| / 2.1718 ≈ 0.0791.
 */
export function mgBruggemanSpread(host: number | Complex, inclusion: number | Complex, fill: number, dimension: 2 | 3, depolarization?: number): number {
  const h = asComplex(host);
  const i = asComplex(inclusion);
  // aligned ellipsoids: both rules with the same depolarization factor along the field
  const N = depolarization ?? 1 / dimension;
  const mg = maxwellGarnettAxis(h, i, fill, N);
  const br = depolarization === undefined ? bruggemanForward(h, i, fill, dimension) : bruggemanAligned(h, i, fill, N);
  const scale = cAbs(br);
  return scale === 0 ? cAbs(cSub(mg, br)) : cAbs(cSub(mg, br)) / scale;
}
