/**
 * The per-cell reduction kernel: one cell's (or one point's) ε and μ in, the kept components and
 * their cost numbers out. Shared by `reduceField` (every cell), `reducePoint` (--at) and the
 * boundary-impedance estimate, so all three agree. Allocates nothing per call.
 */
import { sym3Eigen } from "../core/eigen.js";
import { hypot2 } from "../core/hypot2.js";
import { XX, YY, ZZ, XY, XZ, YZ } from "../core/symTensor.js";
import {
  FLAG_CAPPED, FLAG_EPS_BELOW_ONE, FLAG_MAGNETIC, FLAG_OUT_OF_PLANE, FLAG_UNDEFINED,
  type ReductionSettings,
} from "./reducedField.js";
import { REDUCTION_SCHEMES } from "./schemes/registry.js";

/** Output of the kernel for one cell; reused between calls. */
export interface CellReduction {
  /** kept components in the polarization's order (4 in 2D, 12 in 3D) */
  components: Float64Array;
  principalMin: number;
  principalMax: number;
  anisotropy: number;
  droppedAnisotropy: number;
  scale: number;
  epsMin: number;
  epsMax: number;
  muMin: number;
  muMax: number;
  flags: number;
}

export function newCellReduction(): CellReduction {
  return {
    components: new Float64Array(12),
    principalMin: NaN, principalMax: NaN, anisotropy: NaN, droppedAnisotropy: NaN, scale: NaN,
    epsMin: NaN, epsMax: NaN, muMin: NaN, muMax: NaN, flags: 0,
  };
}

/** Values within this relative distance of 1 count as 1 (rounding, not a requirement for ε < 1). */
export const ROUNDING_TOLERANCE = 1e-9;

/** Relative size of xz, yz below which a tensor counts as block-diagonal (plane ⟂ z). */
const COUPLING_TOLERANCE = 1e-9;

function setUndefined(out: CellReduction, n: number, flags: number): CellReduction {
  for (let k = 0; k < n; k++) out.components[k] = NaN;
  out.principalMin = out.principalMax = out.anisotropy = out.droppedAnisotropy = out.scale = NaN;
  out.epsMin = out.epsMax = out.muMin = out.muMax = NaN;
  out.flags = flags | FLAG_UNDEFINED;
  return out;
}

const epsEig = new Float64Array(3);
const muEig = new Float64Array(3);
const muPacked = new Float64Array(6);

/**
 * A kernel for fixed settings: `apply(eps, mu, capped, out)` reduces one packed ε and μ
 * (xx, yy, zz, xy, xz, yz; as the field stores them, before background replacement).
 * 2D: P = in-plane tensor (Ez: μ_t, Hz: ε_t), s = out-of-plane scalar; α = scheme scale × matchScale;
 * kept P' = αP (isotropic: sqrt(det αP)·I), s' = s/α.
 */
export function reductionKernel(settings: ReductionSettings) {
  const scheme = REDUCTION_SCHEMES[settings.scheme];
  const pol = settings.polarization;
  const unitLarger = settings.unitAxis === "larger";
  const { epsScale, muScale, muTolerance } = settings;
  const matchScale = scheme.matchBoundary ? settings.matchScale : 1;

  function apply(eps: ArrayLike<number>, mu: ArrayLike<number>, capped: boolean, out: CellReduction): CellReduction {
    let flags = capped ? FLAG_CAPPED : 0;
    const c = out.components;
    if (pol === "3D") {
      for (let k = 0; k < 6; k++) {
        c[k] = eps[k] * epsScale;
        c[6 + k] = muPacked[k] = mu[k] * muScale;
      }
      sym3Eigen(epsEig, c);
      sym3Eigen(muEig, muPacked);
      if (!(epsEig[0] > 0 && muEig[0] > 0 && Number.isFinite(epsEig[2]) && Number.isFinite(muEig[2]))) {
        return setUndefined(out, 12, flags);
      }
      out.principalMin = out.epsMin = epsEig[0];
      out.principalMax = out.epsMax = epsEig[2];
      out.muMin = muEig[0];
      out.muMax = muEig[2];
      out.anisotropy = Math.max(epsEig[2] / epsEig[0], muEig[2] / muEig[0]);
      out.droppedAnisotropy = 1;
      out.scale = 1;
    } else {
      const inPlane = pol === "Ez" ? mu : eps;
      const other = pol === "Ez" ? eps : mu;
      const pScale = pol === "Ez" ? muScale : epsScale;
      const sScale = pol === "Ez" ? epsScale : muScale;
      const pxx = inPlane[XX] * pScale, pyy = inPlane[YY] * pScale, pxy = inPlane[XY] * pScale;
      const s = other[ZZ] * sScale;
      const norm = Math.abs(pxx) + Math.abs(pyy) + Math.abs(s);
      if (
        Math.abs(eps[XZ]) + Math.abs(eps[YZ]) > COUPLING_TOLERANCE * (Math.abs(eps[XX]) + Math.abs(eps[YY]) + Math.abs(eps[ZZ])) ||
        Math.abs(mu[XZ]) + Math.abs(mu[YZ]) > COUPLING_TOLERANCE * (Math.abs(mu[XX]) + Math.abs(mu[YY]) + Math.abs(mu[ZZ]))
      ) {
        flags |= FLAG_OUT_OF_PLANE;
      }
      const mean = 0.5 * (pxx + pyy);
      const half = hypot2(0.5 * (pxx - pyy), pxy);
      const lMin = mean - half, lMax = mean + half;
      if (!(Number.isFinite(norm) && lMin > 0 && s > 0)) return setUndefined(out, 4, flags);
      const alpha = scheme.cellScale(pol, lMin, lMax, s, unitLarger) * matchScale;
      if (!(alpha > 0 && Number.isFinite(alpha))) return setUndefined(out, 4, flags);
      let qxx = alpha * pxx, qyy = alpha * pyy, qxy = alpha * pxy;
      let qMin = alpha * lMin, qMax = alpha * lMax;
      const sOut = s / alpha;
      if (scheme.isotropize) {
        const g = alpha * Math.sqrt(lMin * lMax);
        qxx = g; qyy = g; qxy = 0; qMin = g; qMax = g;
        out.droppedAnisotropy = Math.sqrt(lMax / lMin);
      } else {
        out.droppedAnisotropy = 1;
      }
      c[0] = sOut; c[1] = qxx; c[2] = qyy; c[3] = qxy;
      out.principalMin = qMin;
      out.principalMax = qMax;
      out.anisotropy = qMax / qMin;
      out.scale = alpha;
      if (pol === "Ez") {
        out.epsMin = out.epsMax = sOut;
        out.muMin = qMin; out.muMax = qMax;
      } else {
        out.muMin = out.muMax = sOut;
        out.epsMin = qMin; out.epsMax = qMax;
      }
    }
    if (out.epsMin < 1 - ROUNDING_TOLERANCE) flags |= FLAG_EPS_BELOW_ONE;
    if (Math.abs(out.muMin - 1) > muTolerance || Math.abs(out.muMax - 1) > muTolerance) flags |= FLAG_MAGNETIC;
    out.flags = flags;
    return out;
  }

  return { settings, scheme, apply };
}

export type ReductionKernel = ReturnType<typeof reductionKernel>;
