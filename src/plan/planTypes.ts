/**
 * Types of the planner: the settings a plan is made with (the design's `reduction` and
 * `realization` keys, resolved, possibly overridden), and the plan itself — levels, regions,
 * per-cell flags, recipes and device-level figures. The command line and the interactive session
 * both call `planFromField` (plan/runPlan.ts) and read these types.
 */
import type { DeviceGrid } from "../field/deviceGrid.js";
import type { RemedyResult } from "./remedies.js";

export type Polarization = "Ez" | "Hz";
export type SchemeName = "full" | "unit-mu" | "non-magnetic" | "isotropic" | "matched";
export type LatticeName = "square" | "hex" | "rect" | "cubic";

/** Resolved choices of one plan. Every field has a value (defaults applied). */
export interface PlanSettings {
  polarization: Polarization;
  scheme: SchemeName;
  /** for unit-mu: which in-plane principal value is set to 1 */
  unitAxis: "larger" | "smaller";
  /** index of the dielectric the device is embedded in (1 = vacuum); scales ε and μ */
  backgroundIndex: number;
  /** largest number of distinct recipes; null = as few as `tolerance` allows (up to MAX_LEVELS) */
  levels: number | null;
  /** largest relative error accepted on any target component (default 0.05) */
  tolerance: number;
  /** allowed material ids; null = every catalog material valid at the design frequency */
  materials: string[] | null;
  /** allowed cell family ids; null = all (resonant families only where needed) */
  families: string[] | null;
  /** fabrication process id; null = no process limit (flagged in the report) */
  process: string | null;
  /** lattice; null = every lattice the families support except rect (rect only when asked for) */
  lattice: LatticeName | null;
  /** rect lattices: the fixed aspect b/a (realization.aspect); null = the planner tries PLAN_RECT_ASPECTS */
  aspect?: number | null;
  /** largest in-plane anisotropy ratio accepted (default 10) */
  maxAnisotropy: number;
  /** largest attenuation along the longest straight path, dB; null = not checked */
  lossBudgetDb: number | null;
  /** fractional bandwidth the device must work over; null = not checked */
  bandwidth: number | null;
  /** the layer the device is made in (realization.layer); null = bulk materials */
  layer?: LayerSetting | null;
  /** height of the device along z, metres (realization.height); null = the default of plan/deviceHeight.ts */
  heightM?: number | null;
}

export type { LayerReport } from "../cells/slab/layerHost.js";
import type { LayerReport } from "../cells/slab/layerHost.js";

/** realization.layer, SI. */
export interface LayerSetting {
  coreId: string;
  thicknessM: number;
  belowId: string;
  aboveId: string;
}

/** A partial PlanSettings overriding what the design says (command-line options, session edits). */
export type PlanOverrides = Partial<PlanSettings>;

/** Upper limit of levels when only a tolerance is given. */
export const MAX_LEVELS = 64;
export const DEFAULT_TOLERANCE = 0.05;
export const DEFAULT_MAX_ANISOTROPY = 10;

/** Stages reported to the progress callback, in order. */
export type PlanStage = "reduce" | "quantize" | "regions" | "match" | "flags" | "figures";
export type PlanProgress = (stage: PlanStage, fraction: number) => void;

/**
 * One target component of the plan, in the principal frame of the cell:
 * Ez: eps_z, mu_1 (smaller in-plane principal value), mu_2 (larger); Hz: mu_z, eps_1, eps_2.
 */
export interface TargetComponent {
  /** column stem in the build list: "eps_z", "mu_1" … */
  name: string;
  kind: "eps" | "mu";
  /** "z" (out of plane), "1" (smaller in-plane), "2" (larger in-plane) */
  axis: "z" | "1" | "2";
  /** true when every device cell has the same value (then it is not clustered) */
  constant: boolean;
}

/** A buildable unit cell for one level. */
export interface Recipe {
  family: string;
  host: string;
  /** inclusion material id ("" for families of one material, e.g. holes-in-slab uses air) */
  inclusion: string;
  lattice: LatticeName;
  /**
   * rect lattices: b/a, the spacing along principal axis 2 over that along axis 1 (the lattice's x
   * axis lies along axis 1); the device cell holds m × n circles (cells/lattice.ts rectTiling)
   */
  aspect?: number;
  /**
   * Which way the recipe points, for anisotropic families: the axis of rods, holes, wires and
   * split rings, or a laminate's layer normal — "z", or the in-plane principal axis "1" (smaller
   * target) or "2" (larger target, at axis_deg from +x). null for isotropic families.
   */
  orientation: "z" | "1" | "2" | null;
  fillFraction: number;
  /** named dimensions with their unit in the key: { radius_m: 0.0012, wall_m: 0.0003 } */
  dimensions: Record<string, number>;
  /** achieved value of each target component (real part), same order as Plan.components */
  achieved: number[];
  /** imaginary part (loss) of each achieved component, same order */
  achievedIm: number[];
  /**
   * error of the recipe against the level's target: largest over components of
   * |achieved − target| / |target| with the achieved value complex, no floor (components whose
   * target is exactly zero are left out here; see Plan.zeroTargetAbsError)
   */
  relError: number;
  /** loss tangent of the effective medium along the dominant component */
  lossTangent: number;
  /** imaginary part of the effective index at the design frequency */
  indexIm: number;
  /** relative model uncertainty: solved-cell error estimate, MG/Bruggeman spread where no solved model applies, resonant models' spread */
  spread: number;
  /** fractional bandwidth where the target stays within tolerance (resonant families), else null */
  bandwidth: number | null;
  /** smallest feature of the cell (inclusion size or wall), metres */
  featureM: number;
  /** pitch (a rect cell: its longer spacing) over the wavelength in the cell's densest material */
  pitchRatio?: number;
  /**
   * rods and holes along z between λ/10 and λ/4 (runPlan.ts, match/bandCheck.ts): the lowest
   * band's largest departure from its long-wavelength index, or its anisotropy; Infinity when the
   * design frequency lies above the band edge
   */
  bandDeviation?: number;
  resonant: boolean;
  /** lower is better */
  score: number;
  notes: string[];
}

/** One level: a distinct target value shared by a group of cells, and its recipe. */
export interface PlanLevel {
  /** 1-based, as written in the build list */
  index: number;
  /** target value of each component (the cluster centre) */
  target: number[];
  cellCount: number;
  /** largest relative quantization error of a cell of this level (|centre − target|/|target|, no floor) */
  maxQuantizationError: number;
  /**
   * set when this level's target differs from a neighbouring level's by less than the process can
   * make (the dimensions of their recipes differ by less than the process's smallest feature)
   */
  unresolvable: boolean;
  recipe: Recipe | null;
  runnersUp: Recipe[];
  /** why no recipe was found (empty when one was) */
  reasons: string[];
  /** flag bits that hold for every cell of this level because of its recipe (or its absence) */
  flags: number;
}

/** One connected zone of cells sharing a level (4-neighbour on the lattice). */
export interface PlanRegion {
  /** 1-based */
  index: number;
  /** level of the region, 1-based like `index` */
  level: number;
  cellCount: number;
  /** lattice-index bounding box */
  iMin: number;
  iMax: number;
  jMin: number;
  jMax: number;
}

export interface BillOfMaterialsRow {
  material: string;
  /** cells that use this material (as host or inclusion) */
  cells: number;
  /** volume of the material, m³ (2D devices: over the device height) */
  volume: number;
  volumeUnit: "m3";
  /** what a buyer orders: board, film or sheet area, or a volume, in a readable unit */
  order: { quantity: number; unit: string; what: string };
}

export interface DeviceFigures {
  /** cells carrying each flag */
  flagCounts: Record<string, number>;
  /** regions where each flag occurs */
  flagRegions: Record<string, number[]>;
  maxRelError: number;
  medianRelError: number;
  /** attenuation along the longest straight path through the device, dB (∫ k0·Im n ds) */
  lossDb: number;
  /** length of that path, metres, and its direction (unit vector) */
  lossPathM: number;
  lossPathDirection: [number, number];
  /** loss budget from the settings, and whether the plan meets it */
  lossBudgetDb: number | null;
  lossWithinBudget: boolean | null;
  /** normal-incidence power reflection at the outer boundary of the chosen reduction (null if unknown) */
  boundaryReflection: number | null;
  /** narrowest bandwidth among resonant levels (null when none is resonant) */
  minBandwidth: number | null;
  bandwidthRequired: number | null;
  bandwidthMet: boolean | null;
  smallestFeatureM: number | null;
  processMinFeatureM: number | null;
  billOfMaterials: BillOfMaterialsRow[];
  /** the device height the bill of materials and the printed part use (plan/deviceHeight.ts) */
  height: { heightM: number; source: string };
  /** largest in-plane anisotropy ratio of the reduced targets */
  largestAnisotropy: number;
}

/** The complete plan. Per-cell data are typed arrays of length grid.count. */
export interface Plan {
  design: {
    name: string;
    notes: string;
    sourcePath: string;
    frequencyHz: number;
    /** free-space wavelength, metres */
    wavelengthM: number;
    transform: string;
  };
  settings: PlanSettings;
  /**
   * the background the reduction used: the index given (`settings.backgroundIndex`, from the design
   * or an override), or when none was (`given` false) the design's own background's, √(ε_b μ_b)
   */
  reductionBackground: { index: number; given: boolean };
  /** why the reduction costs what it costs: short plain sentences for the report */
  reductionNotes: string[];
  grid: DeviceGrid;
  components: TargetComponent[];
  /** per component, per cell: the continuous (reduced) target */
  targets: Float64Array[];
  /** orientation of the larger in-plane principal axis, radians from x, per cell */
  axisAngleRad: Float64Array;
  /** 0-based level of each cell */
  level: Int32Array;
  /** 0-based region of each cell */
  region: Int32Array;
  /** relative quantization error of each cell (largest over components) */
  quantizationError: Float64Array;
  /**
   * error of the achieved value against the cell's own target (quantization included): largest over
   * components of |achieved − target| / |target|, achieved complex, no floor (NaN when no recipe)
   */
  relError: Float64Array;
  /**
   * |achieved| of components whose target is exactly zero, largest per cell (NaN when none); null
   * when no cell has such a component (the column is empty): a 10⁶-cell plan then allocates nothing
   */
  zeroTargetAbsError: Float64Array | null;
  /** flag bitmask of each cell, bits from plan/flags.ts */
  flags: Uint16Array;
  levels: PlanLevel[];
  regions: PlanRegion[];
  /** quantization method used, for the report */
  quantization: { method: string; dimensions: number; maxError: number };
  figures: DeviceFigures;
  /** true when every cell has a recipe and every stated requirement is met (= verdict.buildable) */
  buildable: boolean;
  /** requirements met or missed (plan/verdict.ts) */
  verdict: Verdict;
  /** smallest background index that lifts every ε above the lowest allowed material (null: none needed or none helps) */
  minBackgroundIndex: number | null;
  /** remedies tried by re-planning (plan/remedies.ts); null until the shell has looked for them */
  remedies: RemedyResult | null;
  /** warnings for the report and stderr */
  warnings: string[];
  /** the shell's time estimate when above the warning threshold (core/timeEstimate.ts); summary only */
  timeWarning?: string;
  /** the declared layer's mode (realization.layer), or null for bulk materials */
  layer?: LayerReport | null;
}

/** One requirement the plan misses: its figure and the limit it should meet. */
export interface MissedRequirement {
  /** "recipes" | "tolerance" | "loss" | "bandwidth" | "anisotropy" | "process" | "homogenization" | "model-uncertainty" */
  what: RequirementName;
  value: number;
  limit: number;
  /** a plain sentence for people */
  text: string;
  /** the levels (1-based) the miss is about, where it is about some levels only */
  levels?: number[];
  /**
   * the worst figure behind a miss whose `value` is a count or fraction (homogenization: the worst
   * band deviation against the tolerance, or the worst pitch ratio against λ/10), and its level
   */
  worst?: { figure: "band-deviation" | "pitch-ratio"; value: number; limit: number; level: number };
}

export type RequirementName = "recipes" | "tolerance" | "loss" | "bandwidth" | "anisotropy" | "process" | "homogenization" | "model-uncertainty";

export interface Verdict {
  buildable: boolean;
  missed: MissedRequirement[];
}

/** The machine-readable summary (summary.json and `plan --json`). */
export interface PlanSummary {
  design: string;
  cells: number;
  levels: number;
  regions: number;
  flags: Record<string, number>;
  maxRelError: number | null;
  medianRelError: number | null;
  lossDb: number;
  boundaryReflection: number | null;
  minBandwidth: number | null;
  materials: string[];
  /** device height along z, metres (realization.height or its default) */
  heightM: number;
  /** each material's volume and what a buyer orders (report.md has the same table) */
  billOfMaterials: { material: string; cells: number; volumeM3: number; order: { quantity: number; unit: string; what: string } }[];
  outputs: string[];
  buildable: boolean;
  verdict: { buildable: boolean; missed: { what: RequirementName; value: number; limit: number; levels?: number[]; worst?: MissedRequirement["worst"] }[] };
  /** remedies tried by re-planning, best first (absent when not looked for) */
  remedies?: {
    label: string;
    changes: string;
    buildable: boolean;
    overrides: PlanOverrides;
    pitchM: number | null;
    /** design keys the remedy sets (another background material and its index; absent: none) */
    design?: { backgroundMaterial: string; backgroundIndex: number };
    /** each changed requirement: its figure before and after (null: met) and its limit */
    effects: { what: RequirementName; before: number | null; after: number | null; limit: number }[];
  }[];
  /** what the remedy search did not try and why (absent: nothing to say) */
  remedyNotes?: string[];
  polarization: Polarization;
  scheme: SchemeName;
  tolerance: number;
  /**
   * plans with hexagonal-lattice levels: the inclusions the layout files and the drawn full-wave
   * case place (layout/planHexSites.ts): sites built, and sites left out at the edge of their kind's
   * cells, in all and per level (1-based)
   */
  hexSites?: { built: number; leftOut: number; levels: { level: number; cells: number; built: number; leftOut: number }[] };
  /** the time estimate when above 10 s, then the plan's warnings (as on stderr) */
  warnings: string[];
}
