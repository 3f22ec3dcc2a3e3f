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
  /** required lattice, or null for any the family supports */
  lattice: Lattice | null;
  process: Process | null;
  /** required fractional bandwidth, or null */
  bandwidth: number | null;
  /** index of the medium the device sits in (1: vacuum); a cell may be left as that medium */
  backgroundIndex?: number;
}
