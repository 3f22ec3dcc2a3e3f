/**
 * The shared shape of every unit-cell family (one file per family in ./families, listed in
 * registry.ts). A family turns a fill fraction into dimensions for a given pitch and lattice and
 * back, knows its geometric range, its smallest feature, and which mixing rule applies along each
 * principal axis.
 *
 * Axes: every family here is uniaxial or isotropic. `parallel` is the field along the family's
 * axis (along rods, holes and wires; in the layer planes of a laminate; along the ring axis of a
 * split ring); `perpendicular` is the field across it (in the plane of a rod lattice; normal to the
 * layers). Isotropic families (spheres, cubes, strut lattice) give the same value on both.
 * On a rectangular lattice (spacing a along the lattice's x, b = aspect·a along y) the field across
 * the rods has two values: `perpendicular` along x and `perpendicularY` along y.
 */
import type { Complex } from "../core/complex.js";
import type { InverseResult, MixingRuleId } from "../media/mixing/mixingRule.js";
import type { Lattice } from "./lattice.js";

export type Axis = "parallel" | "perpendicular" | "perpendicularY";

/** Extra context the resonant families need (their response depends on pitch and frequency). */
export interface CellContext {
  pitchM?: number;
  frequencyHz?: number;
  /** DC conductivity of the metal phase (S/m); resonant families fall back to ωε₀·Im ε of the inclusion */
  conductivitySPerM?: number;
  /** rect lattices: b/a (spacing along y over spacing along x); 1 when absent */
  aspect?: number;
}

/** Where an axis value comes from: a mixing rule, a resonant model, the host, or the solved cell problem. */
export type AxisModel = MixingRuleId | "wire-medium" | "host" | "solved-cell";

export interface AxisPermittivity {
  parallel: Complex;
  /** across the rods, along the lattice's x axis (every in-plane direction on square and hex lattices) */
  perpendicular: Complex;
  /** across the rods along the lattice's y axis: rect lattices only (absent: equal to `perpendicular`) */
  perpendicularY?: Complex;
  /** mixing rule (or model) used along each axis */
  rules: { parallel: AxisModel; perpendicular: AxisModel; perpendicularY?: AxisModel };
  /**
   * Families with a solved axis (homogenize/): the closed-form values the rules give, and the
   * relative error estimate of each axis value (solver ladder + table interpolation + first-order
   * loss term; 0 for exact rules). `solvedError` is absent for families without a solved axis.
   */
  closedForm?: { parallel: Complex; perpendicular: Complex; perpendicularY?: Complex; rules: { parallel: AxisModel; perpendicular: AxisModel; perpendicularY?: AxisModel } };
  solvedError?: { parallel: number; perpendicular: number; perpendicularY?: number };
  /** the solved table does not cover this cell (near touching, contrast out of range): closed form used */
  unsolved?: string;
}

/** The value along `axis` (perpendicularY falls back to perpendicular off rect lattices). */
export function axisValue(ap: AxisPermittivity, axis: Axis): Complex {
  return axis === "perpendicularY" ? ap.perpendicularY ?? ap.perpendicular : ap[axis];
}

/** The model along `axis` (same fallback). */
export function axisRule(ap: AxisPermittivity, axis: Axis): AxisModel {
  return axis === "perpendicularY" ? ap.rules.perpendicularY ?? ap.rules.perpendicular : ap.rules[axis];
}

/** The closed-form value along `axis`, if the family reports one (same fallback). */
export function axisClosedForm(ap: AxisPermittivity, axis: Axis): { value: Complex; rule: AxisModel } | null {
  const c = ap.closedForm;
  if (!c) return null;
  if (axis === "perpendicularY") return { value: c.perpendicularY ?? c.perpendicular, rule: c.rules.perpendicularY ?? c.rules.perpendicular };
  return { value: c[axis], rule: c.rules[axis] };
}

/** The solved error estimate along `axis` (undefined without one; same fallback). */
export function axisSolvedError(ap: AxisPermittivity, axis: Axis): number | undefined {
  const e = ap.solvedError;
  if (!e) return undefined;
  return axis === "perpendicularY" ? e.perpendicularY ?? e.perpendicular : e[axis];
}

/**
 * Smallest sizes a process must make. `featureM`: the smallest solid part (inclusion diameter,
 * strut or layer width; for holes in a slab, the wall between holes). `gapM`: the smallest opening
 * between solid parts (the wall between inclusions; for holes, the hole diameter).
 */
export interface SmallestFeature {
  featureM: number;
  gapM: number;
}

/** Result of a family inverse: the rule's inverse, then checked against the geometric range. */
export interface FillResult extends InverseResult {
  /** fill fraction the mixing rule asks for before the geometric range is applied (NaN if none) */
  ruleFill: number;
  /** true when `fill` is a number inside the family's fill range */
  inRange: boolean;
}

/** Which phase the fabrication process has to shape (gases are never checked against a process). */
export type FabricatedPhase = "inclusion" | "host" | "both";

export interface CellFamily {
  id: string;
  /** one line for help texts */
  description: string;
  resonant: boolean;
  lattices: Lattice[];
  /** 2: invariant along one axis (rods, holes, layers, wires); 3: a full 3D cell */
  dimension: 2 | 3;
  /** response symmetry: isotropic families give the same ε on both axes */
  isotropic: boolean;
  /** the axis a single target applies to when none is named */
  defaultAxis: Axis;
  fabricatedPhase: FabricatedPhase;
  /**
   * geometric fill range [min, max] (max: touching inclusions, or a solid cell). `aspect`: b/a of a
   * rect lattice (ignored by the others), here and in the geometry below.
   */
  fillRange(lattice: Lattice, aspect?: number): [number, number];
  /** SI dimensions (radiusM, widthM, thicknessM…) of `fill` in a cell of `pitchM` */
  dimensionsFromFill(fill: number, pitchM: number, lattice: Lattice, aspect?: number): Record<string, number>;
  /** inverse of dimensionsFromFill */
  fillFromDimensions(dims: Record<string, number>, pitchM: number, lattice: Lattice, aspect?: number): number;
  smallestFeatureM(fill: number, pitchM: number, lattice: Lattice, aspect?: number): SmallestFeature;
  /** effective ε per principal axis at `fill` (the host is the continuous phase) */
  effectivePermittivity(host: Complex, inclusion: Complex, fill: number, lattice: Lattice, context?: CellContext): AxisPermittivity;
  /** fill fraction whose effective Re ε along `axis` equals `targetRe`, inside the family's range */
  fillForTarget(host: Complex, inclusion: Complex, targetRe: number, axis: Axis, lattice: Lattice, context?: CellContext): FillResult;
}
