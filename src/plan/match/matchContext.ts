/** What the matcher needs to know besides a level's target. */
import type { Complex } from "../../core/complex.js";
import type { CellFamily } from "../../cells/cellFamily.js";
import type { Lattice } from "../../cells/lattice.js";
import type { Process } from "../../cells/process.js";
import type { Material, MaterialValue } from "../../media/material.js";
import type { Polarization, TargetComponent } from "../planTypes.js";

/** A material evaluated at the design frequency. */
export interface EvaluatedMaterial {
  material: Material;
  value: MaterialValue;
  eps: Complex;
  isMetal: boolean;
  isFluid: boolean;
}

export interface MatchContext {
  polarization: Polarization;
  components: TargetComponent[];
  pitchM: number;
  frequencyHz: number;
  tolerance: number;
  materials: EvaluatedMaterial[];
  /** true when the design (or an override) names the allowed materials; false: the whole catalog */
  materialsChosen: boolean;
  families: CellFamily[];
  /** required lattice, or null for any the family supports (rect only when required) */
  lattice: Lattice | null;
  /** rect lattices: the aspects (b/a) to try, each a tiling of the square device cell */
  aspects?: readonly number[];
  /**
   * rect lattices: how many fill tables (homogenize/rectCircleTable.ts, 1–20 s each) this plan may
   * still solve; tables already solved cost nothing. Counted, so the result never depends on a clock.
   */
  rectTables?: { left: number };
  /**
   * rect lattices: the largest angle (rad, ≤ π/4) between a cell's principal axis 1 and the grid
   * axis its lattice stands on, over the level's cells (plan/latticeMisalignment.ts); a rect
   * recipe's error is then that of its tensor turned by this angle. 0 or absent: aligned.
   */
  turnRad?: number;
  process: Process | null;
  /** required fractional bandwidth, or null */
  bandwidth: number | null;
  /** index of the medium the device sits in (1: vacuum); a cell may be left as that medium */
  backgroundIndex?: number;
}
