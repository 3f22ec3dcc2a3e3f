/**
 * A small synthetic plan for session tests: the session only lays plans out, so the numbers here
 * are arbitrary labels for the screens to show, not physics (no test checks a physical value
 * against them). 8 × 5 lattice, the two top corners outside the device, three levels in vertical
 * bands, the right band flagged "subunity", level 3 without a recipe.
 */
import type { Plan, PlanSettings, Recipe } from "../../../src/plan/planTypes.js";
import { FLAG_BIT } from "../../../src/plan/flags.js";

export const SYNTHETIC_SETTINGS: PlanSettings = {
  polarization: "Ez",
  scheme: "unit-mu",
  unitAxis: "larger",
  backgroundIndex: 1,
  levels: null,
  tolerance: 0.05,
  materials: null,
  families: null,
  process: null,
  lattice: null,
  maxAnisotropy: 10,
  lossBudgetDb: null,
  bandwidth: null,
};

function recipe(fill: number, achieved: number[], relError: number): Recipe {
  return {
    family: "rods-in-host",
    host: "ptfe",
    inclusion: "alumina-96",
    orientation: "z",
    lattice: "square",
    fillFraction: fill,
    dimensions: { radius_m: 0.001 * fill, wall_m: 0.0005 },
    achieved,
    achievedIm: achieved.map(() => 0),
    relError,
    lossTangent: 1e-3,
    indexIm: 1e-4,
    spread: 0.01,
    bandwidth: null,
    featureM: 0.0005,
    resonant: false,
    score: relError,
    notes: [],
  };
}

export function syntheticPlan(settings: Partial<PlanSettings> = {}): Plan {
  const nx = 8;
  const ny = 5;
  const cells: [number, number][] = [];
  for (let j = 0; j < ny; j++) for (let i = 0; i < nx; i++) if (!(j === ny - 1 && (i === 0 || i === nx - 1))) cells.push([i, j]);
  const count = cells.length;
  const pitchM = 0.002;
  const grid = {
    dimension: 2 as const,
    pitchM,
    nx,
    ny,
    nz: 1,
    originXM: 0,
    originYM: 0,
    originZM: 0,
    count,
    i: Int32Array.from(cells.map((c) => c[0])),
    j: Int32Array.from(cells.map((c) => c[1])),
    k: new Int32Array(count),
    xM: Float64Array.from(cells.map((c) => c[0] * pitchM)),
    yM: Float64Array.from(cells.map((c) => c[1] * pitchM)),
    zM: new Float64Array(count),
  };
  const level = Int32Array.from(cells.map(([i]) => (i < 3 ? 0 : i < 6 ? 1 : 2)));
  const eps = Float64Array.from(cells.map(([i, j]) => 2 + 0.25 * i + 0.01 * j));
  const mu = Float64Array.from(cells.map(([i]) => 0.2 + 0.1 * i));
  const relError = Float64Array.from(cells.map(([i, j], c) => (level[c] === 2 ? NaN : 0.001 * (i + j))));
  const flags = Uint16Array.from(cells.map(([i]) => (i >= 6 ? FLAG_BIT.subunity | FLAG_BIT.norecipe : 0)));
  const levels = [
    { index: 1, target: [2.3, 0.3], cellCount: 0, maxQuantizationError: 0.02, recipe: recipe(0.2, [2.31, 0.3], 0.004), runnersUp: [recipe(0.25, [2.4, 0.3], 0.04)], reasons: [], flags: 0, unresolvable: false },
    { index: 2, target: [3.1, 0.6], cellCount: 0, maxQuantizationError: 0.03, recipe: recipe(0.4, [3.12, 0.6], 0.006), runnersUp: [], reasons: [], flags: 0, unresolvable: false },
    { index: 3, target: [3.7, 0.85], cellCount: 0, maxQuantizationError: 0.01, recipe: null, runnersUp: [], reasons: ["no allowed pair reaches ε 3.7"], flags: FLAG_BIT.norecipe, unresolvable: false },
  ];
  for (let c = 0; c < count; c++) levels[level[c]].cellCount++;
  const regions = levels.map((l, k) => ({ index: k + 1, level: k + 1, cellCount: l.cellCount, iMin: k * 3, iMax: Math.min(nx - 1, k * 3 + 2), jMin: 0, jMax: ny - 1 }));
  return {
    design: { name: "synthetic bend", notes: "", sourcePath: "/tmp/synthetic.json", frequencyHz: 1e10, wavelengthM: 0.0299792458, transform: "synthetic" },
    settings: { ...SYNTHETIC_SETTINGS, ...settings },
    reductionBackground: { index: 1, given: false },
    reductionNotes: [],
    grid,
    components: [
      { name: "eps_z", kind: "eps", axis: "z", constant: false },
      { name: "mu_1", kind: "mu", axis: "1", constant: false },
    ],
    targets: [eps, mu],
    axisAngleRad: new Float64Array(count),
    level,
    region: Int32Array.from(level),
    quantizationError: Float64Array.from(cells.map(([i]) => 0.002 * i)),
    relError,
    zeroTargetAbsError: new Float64Array(count).fill(NaN),
    flags,
    levels,
    regions,
    quantization: { method: "synthetic", dimensions: 2, maxError: 0.03 },
    figures: {
      flagCounts: { subunity: 8, norecipe: 8 },
      flagRegions: { subunity: [3], norecipe: [3] },
      maxRelError: 0.01,
      medianRelError: 0.004,
      lossDb: 0.1,
      lossPathM: 0.016,
      lossPathDirection: [1, 0],
      lossBudgetDb: null,
      lossWithinBudget: null,
      boundaryReflection: 0.01,
      minBandwidth: null,
      bandwidthRequired: null,
      bandwidthMet: null,
      smallestFeatureM: 0.0002,
      processMinFeatureM: null,
      billOfMaterials: [],
      height: { heightM: 1e-3, source: "test" },
      largestAnisotropy: 3,
    },
    buildable: false,
    verdict: { buildable: false, missed: [{ what: "recipes", value: 8, limit: 0, text: "8 of 38 cells have no recipe" }] },
    minBackgroundIndex: null,
    remedies: null,
    warnings: [],
  };
}
