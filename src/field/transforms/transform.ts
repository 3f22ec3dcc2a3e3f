/**
 * The shared shape of a coordinate transform. A transform maps a physical point x' to the virtual
 * (design) point x = G(x') — `inverse` — and back — `forward` (virtual → physical). The material
 * needs K = ∂G/∂x' at physical points, which every built-in kind gives in closed form
 * (`jacobianK`); J = K⁻¹ = ∂x'/∂x and ε' = J ε_b Jᵀ / det J.
 *
 * Conventions: Pendry, Schurig, Smith, "Controlling electromagnetic fields", Science 312, 1780
 * (2006); Schurig, Pendry, Smith, Opt. Express 14, 9794 (2006). Lengths in metres, angles in
 * radians. Every method writes into caller-supplied outputs and allocates nothing.
 */
import type { BoundarySamples } from "../tensorField.js";
import type { ComputedMapInfo } from "../maps/computedMapInfo.js";

export interface Bounds3 {
  minX: number;
  maxX: number;
  minY: number;
  maxY: number;
  /** 0 and 0 for 2D devices */
  minZ: number;
  maxZ: number;
}

export interface Transform {
  kind: string;
  /** 2: invariant along z; 3: a volume device gridded in 3D (or sliced through its centre) */
  dimension: 2 | 3;
  /** bounding box of the device region in physical space */
  bounds: Bounds3;
  /** true when the physical point lies inside the device region (open at singular boundaries) */
  contains(xM: number, yM: number, zM: number): boolean;
  /**
   * Optional: `contains` for a whole row of lattice points at once, for kinds whose point test is
   * cheaper per row (large polygons): out[i] = contains(x0M + i·pitchM, yM, zM) ? 1 : 0 for
   * i < out.length, with x computed exactly so.
   */
  containsRow?(out: Uint8Array, yM: number, zM: number, x0M: number, pitchM: number): void;
  /** virtual → physical: writes x' into out[0..2]; returns false where the virtual point has no image in the device */
  forward(out: Float64Array, xM: number, yM: number, zM: number): boolean;
  /** physical → virtual (G): writes x into out[0..2]; returns false outside the device */
  inverse(out: Float64Array, xM: number, yM: number, zM: number): boolean;
  /**
   * K = ∂G/∂x' at a physical point inside the device, row-major 3×3 into k[0..8]
   * (k[3*row + col] = ∂x_row/∂x'_col).
   */
  jacobianK(k: Float64Array, xM: number, yM: number, zM: number): void;
  /**
   * For kinds with a singular inner boundary: move a point closer than `offsetM` to that boundary
   * out to distance `offsetM` (along the boundary normal), in place in p[0..2]; true when moved.
   */
  clampToInnerOffset?(p: Float64Array, offsetM: number): boolean;
  /** points just inside the outer boundary with outward unit normals, about `count` of them */
  sampleOuterBoundary(count: number): BoundarySamples;
  /** for maps computed by a solver (field/maps): module, anisotropy and solver evidence */
  computedMap?: ComputedMapInfo;
}

/** Relative distance inside the outer boundary where boundary samples are placed. */
export const BOUNDARY_INSET = 1e-9;

/** Relative slack on outer radii so points on the boundary (up to rounding) count as inside. */
export const OUTER_SLACK = 1 + 1e-12;

/**
 * Relative slack on singular inner radii: centres within 1e-9 of the radius count as on the
 * (open) singular boundary, i.e. outside the device, instead of producing det K = 0 by rounding.
 */
export const INNER_SLACK = 1 + 1e-9;
