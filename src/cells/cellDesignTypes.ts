/** Request and result of designCell (one unit cell for one target level). */
import type { Complex } from "../core/complex.js";
import type { AxisPermittivity, SmallestFeature } from "./cellFamily.js";
import type { HomogenizationCheck } from "./homogenization.js";
import type { Lattice } from "./lattice.js";
import type { PassivityBound } from "./passivity.js";
import type { Process, ProcessCheck } from "./process.js";
import type { SplitRingGeometry } from "./splitRing.js";
import type { ToleranceBand } from "./toleranceBand.js";
import type { WirePlasma } from "./wireMedium.js";

/** A phase of the cell, already evaluated at the design frequency. */
export interface CellPhase {
  id: string;
  /** relative permittivity at the design frequency */
  eps: Complex;
  /** material class (polymer, ceramic, metal, gas…), for the process check */
  class: string;
  /** DC conductivity, S/m (metals; resonant families fall back to ωε₀·Im ε) */
  conductivitySPerM?: number;
}

/** Wanted real parts. For isotropic families either axis may be given (both must then agree). */
export interface CellTarget {
  /** Re ε along the family's axis (rods, holes, wires; laminate: in the layer planes) */
  parallel?: number;
  /** Re ε across it (rect lattices: along the lattice's x axis, spacing a = pitch) */
  perpendicular?: number;
  /** rect lattices: Re ε across the rods along the lattice's y axis (spacing b = aspect·a) */
  perpendicularY?: number;
  /** Re μ along the ring axis (split-ring only) */
  mu?: number;
}

/** Split-ring sizes; any left out are designed (gap) or defaulted (radius, width: see splitRing.ts). */
export type SplitRingSizes = Partial<Omit<SplitRingGeometry, "pitchM">>;

export interface CellDesignRequest {
  familyId: string;
  lattice: Lattice;
  /** rect lattices: spacing along y over the pitch (b/a); ignored by the other lattices */
  aspect?: number;
  pitchM: number;
  frequencyHz: number;
  host: CellPhase;
  /** the inclusion phase; the metal for wire media and split rings */
  inclusion: CellPhase;
  /** design for these values … */
  target?: CellTarget;
  /** … or evaluate this fill fraction (target, when also given, is then only compared) */
  fill?: number;
  /** allowed error |achieved − target| / max(|target|, 1) on each targeted value (default 0.05) */
  tolerance?: number;
  process?: Process;
  /** height of the features (slab thickness, rod length), m, for the process's aspect-ratio limit */
  heightM?: number;
  /** split-ring sizes (split-ring family only) */
  splitRing?: SplitRingSizes;
}

export interface WireReport {
  kind: "wire-medium";
  radiusM: number;
  plasma: WirePlasma;
  effectivePlasmaHz: number;
  gammaRadPerS: number;
  skinDepthM: number;
  /** band where Re ε stays within the tolerance of the target */
  band: ToleranceBand;
  passivity: PassivityBound | null;
}

export interface RingReport {
  kind: "split-ring";
  geometry: SplitRingGeometry;
  resonanceHz: number;
  magneticPlasmaHz: number;
  muHighFrequency: number;
  gammaRadPerS: number;
  skinDepthM: number;
  band: ToleranceBand;
  passivity: PassivityBound | null;
}

export interface CellDesign {
  familyId: string;
  lattice: Lattice;
  /** rect lattices: b/a (absent or null on the others) */
  aspect?: number | null;
  pitchM: number;
  frequencyHz: number;
  hostId: string;
  inclusionId: string;
  /** fill fraction of the design (the closest reachable one when the target is out of reach); null if none */
  fill: number | null;
  dimensions: Record<string, number>;
  /** rect lattices add perpendicularY (across the rods along the lattice's y axis) */
  achieved: { parallel: Complex; perpendicular: Complex; perpendicularY?: Complex; mu: Complex };
  rules: AxisPermittivity["rules"];
  target: CellTarget;
  /** |Re achieved − target| / max(|target|, 1) per targeted value, and the largest */
  relError: { parallel?: number; perpendicular?: number; perpendicularY?: number; mu?: number; max: number };
  tolerance: number;
  feature: SmallestFeature;
  processCheck: ProcessCheck | null;
  homogenization: HomogenizationCheck & { nMax: number };
  /**
   * Model uncertainty per axis (solved axes: the solver's error estimate; closed-form axes: the
   * Maxwell Garnett/Bruggeman disagreement; resonant models: their standard forms' spread);
   * uncertain when above the tolerance
   */
  spread: { parallel: number; perpendicular: number; perpendicularY?: number; max: number; uncertain: boolean };
  /** the closed-form values where an axis is solved (null for families without a solved axis) */
  closedForm?: { parallel: Complex; perpendicular: Complex; perpendicularY?: Complex; rules: AxisPermittivity["rules"] } | null;
  resonance?: WireReport | RingReport;
  /** target reached within tolerance, process can make it, cell fine enough to homogenize */
  valid: boolean;
  /** why it is not valid */
  reasons: string[];
  /** what to watch even when valid (coarse cell, MG/Bruggeman spread, thin-wire doubt) */
  notes: string[];
}
