/**
 * The material prescription of a device: ε' and μ' for every cell of its grid, with the
 * quantities derived from them. Produced by `computeTensorField` (field/) or by importing a CSV.
 */
import type { SymTensorField } from "../core/symTensor.js";
import type { DeviceGrid } from "./deviceGrid.js";
import type { ComputedMapInfo } from "./maps/computedMapInfo.js";

/** A closed outer boundary sampled for reflection estimates (points just inside, outward normals). */
export interface BoundarySamples {
  xM: Float64Array;
  yM: Float64Array;
  normalX: Float64Array;
  normalY: Float64Array;
}

/**
 * Evaluates the exact (uncapped) material at one physical point; writes packed ε and μ
 * (xx, yy, zz, xy, xz, yz) into the outputs and returns det J (NaN when the point is outside the
 * device or the map is singular there).
 */
export type PointEvaluator = (xM: number, yM: number, zM: number, epsOut: Float64Array, muOut: Float64Array) => number;

/**
 * Treat every array of a TensorField as read-only: the engine shares arrays that must be equal
 * (μ' with ε' when μ_b = ε_b; the zero xz/yz components of a 2D device).
 */
export interface TensorField {
  /** transform kind, or "imported" */
  source: string;
  grid: DeviceGrid;
  /** relative permittivity and permeability of the virtual-space background */
  background: { eps: number; mu: number };
  eps: SymTensorField;
  mu: SymTensorField;
  /** det J, J = ∂x'/∂x (NaN for imported fields, where it is unknown) */
  detJ: Float64Array;
  /** principal values, ascending: epsPrincipal[0][c] ≤ epsPrincipal[1][c] ≤ epsPrincipal[2][c] */
  epsPrincipal: [Float64Array, Float64Array, Float64Array];
  muPrincipal: [Float64Array, Float64Array, Float64Array];
  /** largest / smallest principal value */
  epsAnisotropy: Float64Array;
  muAnisotropy: Float64Array;
  /** 1 where the cell's values were capped (or offset) at a singularity */
  capped: Uint8Array;
  /** the cap applied to the largest component, if any */
  capValue: number | null;
  /** samples of the device's outer boundary (null when unknown, e.g. imported fields) */
  outerBoundary: BoundarySamples | null;
  /** true when the transform is a volume (3D) device, even if only its z = 0 slice was gridded */
  volumeDevice?: boolean;
  /** exact evaluation at any point (null for imported fields); interpolated for computed maps */
  evaluateAt: PointEvaluator | null;
  /** for computed maps: what the map solver reports (module, anisotropy, grid, residual) */
  map?: ComputedMapInfo;
}
