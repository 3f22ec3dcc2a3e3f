/**
 * Wave impedance of a reduced set at the device's outer boundary and the normal-incidence power
 * reflection it causes against the background, R = |(Z − Z_b)/(Z + Z_b)|².
 *
 * Normal incidence along the outward normal n, t = ẑ × n:
 * - Ez: Z = sqrt(μ_eff/ε_zz), μ_eff = 1/(μ_t⁻¹)_tt = det μ_t / (n·μ_t·n)   (= μ_tt when μ_t is
 *   diagonal in (n, t), e.g. μ_θ at a circular edge: Z = sqrt(μ_θ/ε_z), Yan, Ruan, Qiu, Opt. Express
 *   15, 17772 (2007)). The exact form keeps the sheared slab y' = y + a·x reflectionless at its
 *   x-faces, as it must be (Rahm et al., PRL 100, 063903 (2008)).
 * - Hz: Z = sqrt(μ_zz/ε_eff), ε_eff = det ε_t / (n·ε_t·n).
 * - 3D: for the two transverse directions t1, t2 ⟂ n, Z1 = sqrt(μ_t2t2/ε_t1t1) and Z2 = sqrt(μ_t1t1/ε_t2t2)
 *   (exact when ε and μ are diagonal in (n, t1, t2), as for the spherical cloak); the worse is reported.
 * Z is reported relative to the background's impedance (Z/Z_b), so a matched edge reads 1.
 */
import { readSym } from "../core/symTensor.js";
import type { TensorField } from "../field/tensorField.js";
import { outerEdgeCells } from "./outerEdgeCells.js";
import { FLAG_UNDEFINED } from "./reducedField.js";
import { newCellReduction, type CellReduction, type ReductionKernel } from "./reduceCell.js";

export interface BoundaryImpedance {
  /** where the boundary came from: the field's exact boundary samples, the outer edge cells, or nothing */
  source: "boundary-samples" | "edge-cells" | "none";
  /** points used */
  samples: number;
  /** points where the reduction was undefined (or the point fell outside the device) */
  skipped: number;
  /** Z/Z_b over the boundary */
  impedanceMin: number;
  impedanceMax: number;
  impedanceMean: number;
  /** geometric mean of Z/Z_b (what the matched scheme divides out) */
  impedanceGeoMean: number;
  /** power reflection at normal incidence, worst and mean over the boundary */
  reflectionMax: number;
  reflectionMean: number;
  /** position of the worst point, metres */
  worstXM: number;
  worstYM: number;
  worstZM: number;
}

/** Power reflection |(z − 1)/(z + 1)|² for a relative impedance z = Z/Z_b. */
export function reflectionFromImpedance(z: number): number {
  const g = (z - 1) / (z + 1);
  return g * g;
}

/**
 * Relative impedance Z/Z_b (the worse of the two in 3D) of one reduced point for outward normal
 * (nx, ny, nz); NaN when undefined.
 */
export function pointImpedance(r: CellReduction, polarization: string, nx: number, ny: number, nz: number, backgroundImpedance: number): number {
  const c = r.components;
  if (polarization === "Ez" || polarization === "Hz") {
    const len = Math.hypot(nx, ny);
    const ux = nx / len, uy = ny / len;
    const pxx = c[1], pyy = c[2], pxy = c[3];
    const det = pxx * pyy - pxy * pxy;
    const pnn = ux * ux * pxx + 2 * ux * uy * pxy + uy * uy * pyy;
    const z = polarization === "Ez" ? Math.sqrt(det / (pnn * c[0])) : Math.sqrt((c[0] * pnn) / det);
    return z / backgroundImpedance;
  }
  // 3D: transverse basis t1, t2 ⟂ n
  const len = Math.hypot(nx, ny, nz);
  const ux = nx / len, uy = ny / len, uz = nz / len;
  // t1 = normalize(a × n) with a the axis least aligned with n
  let ax = 0, ay = 0, az = 0;
  if (Math.abs(ux) <= Math.abs(uy) && Math.abs(ux) <= Math.abs(uz)) ax = 1;
  else if (Math.abs(uy) <= Math.abs(uz)) ay = 1;
  else az = 1;
  let t1x = ay * uz - az * uy, t1y = az * ux - ax * uz, t1z = ax * uy - ay * ux;
  const l1 = Math.hypot(t1x, t1y, t1z);
  t1x /= l1; t1y /= l1; t1z /= l1;
  const t2x = uy * t1z - uz * t1y, t2y = uz * t1x - ux * t1z, t2z = ux * t1y - uy * t1x;
  const quad = (o: number, x: number, y: number, z: number) =>
    x * x * c[o] + y * y * c[o + 1] + z * z * c[o + 2] + 2 * (x * y * c[o + 3] + x * z * c[o + 4] + y * z * c[o + 5]);
  const e1 = quad(0, t1x, t1y, t1z), e2 = quad(0, t2x, t2y, t2z);
  const m1 = quad(6, t1x, t1y, t1z), m2 = quad(6, t2x, t2y, t2z);
  const z1 = Math.sqrt(m2 / e1) / backgroundImpedance;
  const z2 = Math.sqrt(m1 / e2) / backgroundImpedance;
  return reflectionFromImpedance(z1) >= reflectionFromImpedance(z2) ? z1 : z2;
}

/**
 * Boundary impedance of the reduction `kernel` applied to `field`: at the field's boundary samples
 * (exact material from `evaluateAt`) when the field has both, otherwise at its outer edge cells with
 * normals estimated from the lattice.
 */
export function boundaryImpedance(field: TensorField, kernel: ReductionKernel): BoundaryImpedance {
  const pol = kernel.settings.polarization;
  const zb = kernel.settings.backgroundImpedance;
  const r = newCellReduction();
  const eps = new Float64Array(6), mu = new Float64Array(6);
  const acc = { n: 0, skipped: 0, zMin: Infinity, zMax: -Infinity, zSum: 0, logSum: 0, rMax: -1, rSum: 0, wx: NaN, wy: NaN, wz: NaN };
  const add = (x: number, y: number, z: number, nx: number, ny: number, nz: number) => {
    if (r.flags & FLAG_UNDEFINED) { acc.skipped++; return; }
    const zr = pointImpedance(r, pol, nx, ny, nz, zb);
    if (!(zr > 0 && Number.isFinite(zr))) { acc.skipped++; return; }
    const refl = reflectionFromImpedance(zr);
    acc.n++;
    acc.zMin = Math.min(acc.zMin, zr);
    acc.zMax = Math.max(acc.zMax, zr);
    acc.zSum += zr;
    acc.logSum += Math.log(zr);
    acc.rSum += refl;
    if (refl > acc.rMax) { acc.rMax = refl; acc.wx = x; acc.wy = y; acc.wz = z; }
  };
  let source: BoundaryImpedance["source"] = "none";
  const b = field.outerBoundary;
  if (b && field.evaluateAt && field.grid.dimension === 2 && b.xM.length > 0) {
    source = "boundary-samples";
    const z0 = field.grid.originZM;
    for (let p = 0; p < b.xM.length; p++) {
      const detJ = field.evaluateAt(b.xM[p], b.yM[p], z0, eps, mu);
      if (Number.isNaN(detJ)) {
        acc.skipped++;
        continue;
      }
      kernel.apply(eps, mu, false, r);
      add(b.xM[p], b.yM[p], z0, b.normalX[p], b.normalY[p], 0);
    }
  } else {
    const edge = outerEdgeCells(field.grid);
    if (edge.cell.length > 0) source = "edge-cells";
    const g = field.grid;
    for (let e = 0; e < edge.cell.length; e++) {
      const c = edge.cell[e];
      readSym(eps, field.eps, c);
      readSym(mu, field.mu, c);
      kernel.apply(eps, mu, field.capped[c] === 1, r);
      add(g.xM[c], g.yM[c], g.zM[c], edge.normalX[e], edge.normalY[e], edge.normalZ[e]);
    }
  }
  const n = acc.n;
  return {
    source: n > 0 ? source : "none",
    samples: n,
    skipped: acc.skipped,
    impedanceMin: n ? acc.zMin : NaN,
    impedanceMax: n ? acc.zMax : NaN,
    impedanceMean: n ? acc.zSum / n : NaN,
    impedanceGeoMean: n ? Math.exp(acc.logSum / n) : NaN,
    reflectionMax: n ? acc.rMax : NaN,
    reflectionMean: n ? acc.rSum / n : NaN,
    worstXM: acc.wx,
    worstYM: acc.wy,
    worstZM: acc.wz,
  };
}
