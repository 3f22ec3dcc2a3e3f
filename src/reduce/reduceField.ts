/**
 * Reduce a material field for one polarization with one scheme: the components the polarization
 * sees, per cell, after the scheme's scale (and, with a background index, in that background).
 */
import { InputError } from "../core/errors.js";
import { readSym } from "../core/symTensor.js";
import type { TensorField } from "../field/tensorField.js";
import { backgroundMedium } from "./backgroundMedium.js";
import { boundaryImpedance } from "./boundaryImpedance.js";
import { componentNames, type Polarization } from "./polarization.js";
import { newCellReduction, reductionKernel } from "./reduceCell.js";
import type { ReducedField, ReductionSettings } from "./reducedField.js";
import { resolveScheme } from "./schemes/registry.js";

/** Default |μ − 1| above which a cell counts as magnetic (0.1 %; our choice, adjustable). */
export const DEFAULT_MU_TOLERANCE = 1e-3;

export interface ReduceOptions {
  polarization: Polarization;
  scheme: string;
  /** unit-mu / matched in Ez: which principal value of μ_t becomes 1 (default "larger") */
  unitAxis?: "larger" | "smaller";
  /** index of the non-magnetic dielectric the device sits in (replaces the field's background) */
  backgroundIndex?: number;
  /** |μ − 1| above this counts as magnetic (default DEFAULT_MU_TOLERANCE) */
  muTolerance?: number;
  /** where the polarization and scheme came from, for messages ("--scheme", "design.json: $.reduction.scheme") */
  where?: { polarization?: string; scheme?: string; backgroundIndex?: string };
}

/**
 * Check the options against the field and work out the settings, including the matched scheme's
 * boundary constant. Polarization "3D" (no reduction: all twelve components) is accepted on any
 * grid — a z = 0 slice of a 3D device is not z-invariant, so callers pick "3D" for it. Throws
 * InputError for Ez/Hz on a 3D grid,
 * a scheme that does not apply to the polarization (the message lists the valid ones), a background
 * index that is not a positive number, or a matched scheme on a field with no outer boundary.
 */
export function reductionSettings(field: TensorField, options: ReduceOptions): ReductionSettings {
  const pol = options.polarization;
  const wherePol = options.where?.polarization ?? "polarization";
  if (field.grid.dimension === 3 && pol !== "3D") {
    throw new InputError({ where: wherePol, message: `a 3D design has no polarization reduction (got '${pol}'); only scheme 'full' applies` });
  }
  const scheme = resolveScheme(options.scheme, pol, options.where?.scheme ?? "reduction.scheme");
  const nb = options.backgroundIndex;
  if (nb !== undefined && !(nb > 0 && Number.isFinite(nb))) {
    throw new InputError({ where: options.where?.backgroundIndex ?? "reduction.backgroundIndex", message: `expected a positive background index, got ${nb}` });
  }
  const tol = options.muTolerance ?? DEFAULT_MU_TOLERANCE;
  if (!(tol >= 0 && Number.isFinite(tol))) {
    throw new InputError({ where: "muTolerance", message: `expected a tolerance ≥ 0, got ${tol}` });
  }
  const bg = backgroundMedium(field.background, nb);
  const settings: ReductionSettings = {
    polarization: pol,
    scheme: scheme.name,
    unitAxis: options.unitAxis ?? "larger",
    muTolerance: tol,
    backgroundIndex: bg.index,
    backgroundImpedance: bg.impedance,
    epsScale: bg.epsScale,
    muScale: bg.muScale,
    matchScale: 1,
    // with a background index every ε is n_b²·(vacuum value); without one, the field's own
    // background enters as ε_b (full: ε ∝ ε_b) or as n² = ε_b μ_b (the scaled schemes, which
    // only depend on the products of ε and μ)
    epsAtUnitIndex: nb !== undefined
      ? 1 / (nb * nb)
      : scheme.name === "full" ? 1 / field.background.eps : 1 / (field.background.eps * field.background.mu),
  };
  if (scheme.matchBoundary) {
    // Z of the base set at the boundary; Ez: Z ∝ α, Hz: Z ∝ 1/α (in-plane × α, out-of-plane × 1/α)
    const base = boundaryImpedance(field, reductionKernel(settings));
    if (base.source === "none" || !(base.impedanceGeoMean > 0)) {
      throw new InputError({ where: options.where?.scheme ?? "reduction.scheme", message: "scheme 'matched' needs the device's outer boundary, and none was found" });
    }
    settings.matchScale = pol === "Ez" ? 1 / base.impedanceGeoMean : base.impedanceGeoMean;
  }
  return settings;
}

/**
 * The reduced field. Per cell: components of the polarization (Ez: eps_zz, mu_xx, mu_yy, mu_xy;
 * Hz: mu_zz, eps_xx, eps_yy, eps_xy; 3D: all twelve), the kept in-plane principal values, anisotropy,
 * dropped anisotropy (isotropic), scale α and flags. Cells where the reduction is undefined carry
 * FLAG_UNDEFINED and NaN components; capped cells carry FLAG_CAPPED. Pure; one pass over the cells.
 */
export function reduceField(field: TensorField, options: ReduceOptions): ReducedField {
  return reduceWithSettings(field, reductionSettings(field, options));
}

/**
 * `reduceField` for settings already checked by `reductionSettings`. In 2D the bounds arrays are
 * views of arrays the kernel fills anyway (Ez: ε min = max = ε_z, μ min/max = the principal
 * values; Hz the other way round): at 10⁶ cells every fresh array costs more in page faults than
 * its arithmetic, so equal arrays are shared (all fields are read-only downstream).
 */
export function reduceWithSettings(field: TensorField, settings: ReductionSettings): ReducedField {
  const n = field.grid.count;
  const names = componentNames(settings.polarization);
  const planar = settings.polarization !== "3D";
  // An isotropizing scheme in 2D keeps P' = g·I: both in-plane components and both principal
  // values are g in every cell (NaN together where undefined), so they are one array, and the
  // off-diagonal one is 0 (written only where it is not +0: NaN in undefined cells), so its
  // pages are never touched in a defined field.
  const iso = planar && reductionKernel(settings).scheme.isotropize;
  const shared = iso ? new Float64Array(n) : null;
  const components: Record<string, Float64Array> = {};
  const arrays = names.map((name, k) => (components[name] = shared && (k === 1 || k === 2) ? shared : new Float64Array(n)));
  const m = arrays.length;
  const principal: [Float64Array, Float64Array] = shared ? [shared, shared] : [new Float64Array(n), new Float64Array(n)];
  const outOfPlane = arrays[0];
  const ez = settings.polarization === "Ez";
  const epsMin = planar ? (ez ? outOfPlane : principal[0]) : new Float64Array(n);
  const epsMax = planar ? (ez ? outOfPlane : principal[1]) : new Float64Array(n);
  const muMin = planar ? (ez ? principal[0] : outOfPlane) : new Float64Array(n);
  const muMax = planar ? (ez ? principal[1] : outOfPlane) : new Float64Array(n);
  const out: ReducedField = {
    polarization: settings.polarization,
    scheme: settings.scheme,
    settings,
    count: n,
    componentNames: names,
    components,
    principal,
    anisotropy: new Float64Array(n),
    droppedAnisotropy: new Float64Array(n),
    scale: new Float64Array(n),
    epsMin, epsMax, muMin, muMax,
    flags: new Uint8Array(n),
  };
  const kernel = reductionKernel(settings);
  const r = newCellReduction();
  const eps = new Float64Array(6), mu = new Float64Array(6);
  const [p0, p1] = principal;
  const { anisotropy, droppedAnisotropy, scale, flags } = out;
  const capped = field.capped;
  const rc = r.components;
  const [a0, , , a3] = arrays;
  for (let c = 0; c < n; c++) {
    readSym(eps, field.eps, c);
    readSym(mu, field.mu, c);
    kernel.apply(eps, mu, capped[c] === 1, r);
    if (iso) {
      a0[c] = rc[0];
      p0[c] = r.principalMin;
      const xy = rc[3];
      if (xy !== 0 || 1 / xy < 0) a3[c] = xy;
    } else {
      for (let k = 0; k < m; k++) arrays[k][c] = rc[k];
      p0[c] = r.principalMin;
      p1[c] = r.principalMax;
    }
    anisotropy[c] = r.anisotropy;
    droppedAnisotropy[c] = r.droppedAnisotropy;
    scale[c] = r.scale;
    if (!planar) {
      epsMin[c] = r.epsMin;
      epsMax[c] = r.epsMax;
      muMin[c] = r.muMin;
      muMax[c] = r.muMax;
    }
    flags[c] = r.flags;
  }
  return out;
}
