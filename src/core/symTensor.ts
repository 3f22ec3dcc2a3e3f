/**
 * Symmetric 3×3 tensors stored as six components (xx, yy, zz, xy, xz, yz).
 *
 * A field over N cells is struct-of-arrays: one Float64Array of length N per component.
 * A single tensor is a Float64Array(6) in the same order.
 */
export const SYM_COMPONENTS = ["xx", "yy", "zz", "xy", "xz", "yz"] as const;
export type SymComponent = (typeof SYM_COMPONENTS)[number];

/** Index of each component inside a packed Float64Array(6). */
export const XX = 0, YY = 1, ZZ = 2, XY = 3, XZ = 4, YZ = 5;

export type SymTensorField = Record<SymComponent, Float64Array>;

export function allocSymField(count: number): SymTensorField {
  return {
    xx: new Float64Array(count),
    yy: new Float64Array(count),
    zz: new Float64Array(count),
    xy: new Float64Array(count),
    xz: new Float64Array(count),
    yz: new Float64Array(count),
  };
}

/**
 * A field for a tensor that is block diagonal in (xy | z) everywhere (2D devices): xz and yz are
 * one shared array of zeros. Read-only use only for those two components.
 */
export function allocPlanarSymField(count: number): SymTensorField {
  const zero = new Float64Array(count);
  return {
    xx: new Float64Array(count),
    yy: new Float64Array(count),
    zz: new Float64Array(count),
    xy: new Float64Array(count),
    xz: zero,
    yz: zero,
  };
}

/** Copy cell `index` of a field into a packed Float64Array(6) `out`; returns `out`. */
export function readSym(out: Float64Array, field: SymTensorField, index: number): Float64Array {
  out[XX] = field.xx[index];
  out[YY] = field.yy[index];
  out[ZZ] = field.zz[index];
  out[XY] = field.xy[index];
  out[XZ] = field.xz[index];
  out[YZ] = field.yz[index];
  return out;
}

/** Write packed tensor `t` into cell `index` of `field`. */
export function writeSym(field: SymTensorField, index: number, t: ArrayLike<number>): void {
  field.xx[index] = t[XX];
  field.yy[index] = t[YY];
  field.zz[index] = t[ZZ];
  field.xy[index] = t[XY];
  field.xz[index] = t[XZ];
  field.yz[index] = t[YZ];
}

/** Determinant of a packed symmetric tensor. */
export function symDet(t: ArrayLike<number>): number {
  const a = t[XX], b = t[YY], c = t[ZZ], d = t[XY], e = t[XZ], f = t[YZ];
  return a * (b * c - f * f) - d * (d * c - f * e) + e * (d * f - b * e);
}

/** Packed symmetric tensor as a plain object, for JSON output. */
export function symToObject(t: ArrayLike<number>): Record<SymComponent, number> {
  return { xx: t[XX], yy: t[YY], zz: t[ZZ], xy: t[XY], xz: t[XZ], yz: t[YZ] };
}
