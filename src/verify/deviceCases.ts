/**
 * The cases the full-wave check compares, built from a design: the bare hidden object (cloaks),
 * the ideal device (scheme `full`), the reduced device (the chosen scheme) — both sampled from the
 * continuous map at the solver's own points (continuousScene.ts) — and the realized device from the
 * plan's levels as built (the lattice of cells with each recipe's achieved values and loss). A case
 * that cannot be computed carries the reason instead of a scene; it is never a copy of another case.
 * A carpet design (carpetGround.ts) stands on its ground plane in every case, and gets two reference
 * cases first: `flat` (the ground alone) and `bare` (the conducting bump, no cloak).
 */
import type { DeviceGrid } from "../field/deviceGrid.js";
import type { TransformSpec } from "../field/transformSpec.js";
import type { Plan } from "../plan/planTypes.js";
import type { ReducedField } from "../reduce/reducedField.js";
import { carpetGround, type CarpetGround } from "./carpetGround.js";
import { diskConductor, type Conductor } from "./conductor.js";
import { continuousScene } from "./continuousScene.js";
import { DRAWN_STEPS, drawnStepFeature } from "./drawnLadder.js";
import { geometryScene, type BulkMaterial } from "./geometryScene.js";
import { deviceBounds, deviceScene, type HiddenDisk } from "./deviceScene.js";
import { largestIndex, mapFromPlan, mapFromReduced } from "./materialMap.js";
import { emptyScene, SAMPLE_BACKGROUND, type Scene, type ScenePolarization } from "./scene.js";
import type { CaseSpec } from "./verifyDevice.js";

export interface DeviceCasesInput {
  transform: TransformSpec;
  /** the field's virtual background (design.background) */
  fieldBackground: { eps: number; mu: number };
  /** the medium around the device as the solver sees it */
  background: { eps: number; mu: number };
  polarization: ScenePolarization;
  grid: DeviceGrid;
  ideal: ReducedField;
  reduced: ReducedField;
  /** the plan of the design's realization; null when the design has none */
  plan: Plan | null;
  /** bulk materials at the design frequency by id (the plan's values), to draw the inclusions; absent: no realized-geometry case */
  materials?: ReadonlyMap<string, BulkMaterial>;
  /** true: a carpet design is checked in free space, without its ground plane (default false) */
  freeSpace?: boolean;
}

export interface DeviceCases {
  cases: CaseSpec[];
  deviceBox: { minX: number; maxX: number; minY: number; maxY: number };
  hidden: HiddenDisk | null;
  /** tensors depend on r only in the polar basis (cloaks, concentrators, rotators) */
  radial: boolean;
  /** carpet designs: the ground plane and the bump every case stands on (carpetGround.ts); null otherwise */
  ground: CarpetGround | null;
  notes: string[];
}

/** Transform kinds whose polar-basis tensors depend on r only. */
export const RADIAL_KINDS: readonly string[] = ["radial-cloak", "concentrator", "rotator"];

/** The object a transform hides (a perfect conductor filling a cloak's inner radius), or null. */
export function hiddenObject(spec: TransformSpec): HiddenDisk | null {
  if (spec.kind === "radial-cloak") return { centerM: spec.center ?? [0, 0], radiusM: spec.innerRadiusM };
  return null;
}

function bareScene(polarization: ScenePolarization, background: { eps: number; mu: number }, conductors: Conductor[], box: Scene["bounds"]): Scene {
  return { polarization, background, bounds: box, conductors, sample: (x, y) => { for (const c of conductors) if (c.signedDistanceM(x, y) < 0) return 2; return SAMPLE_BACKGROUND; } };
}

/** Build the cases (see file comment). */
export function deviceCases(input: DeviceCasesInput): DeviceCases {
  const { transform, polarization, background, grid, plan } = input;
  const bg = polarization === "Ez" ? { b: background.eps, t: background.mu } : { b: background.mu, t: background.eps };
  const hidden = hiddenObject(transform);
  const ground = input.freeSpace ? null : carpetGround(transform).ground;
  const conductors: Conductor[] = hidden ? [diskConductor(hidden.centerM, hidden.radiusM)] : ground ? [ground.bump] : [];
  const box = deviceBounds(grid);
  if (ground) {
    const b = ground.bumpBox;
    box.minX = Math.min(box.minX, b.minX); box.maxX = Math.max(box.maxX, b.maxX);
    box.minY = Math.min(box.minY, b.minY); box.maxY = Math.max(box.maxY, b.maxY);
  }
  if (hidden) {
    const [cx, cy] = hidden.centerM, r = hidden.radiusM;
    box.minX = Math.min(box.minX, cx - r); box.maxX = Math.max(box.maxX, cx + r);
    box.minY = Math.min(box.minY, cy - r); box.maxY = Math.max(box.maxY, cy + r);
  }
  const notes: string[] = [];
  const idealMap = mapFromReduced(input.ideal, bg), reducedMap = mapFromReduced(input.reduced, bg);
  const cases: CaseSpec[] = [];
  if (hidden) {
    const r = hidden.radiusM, [cx, cy] = hidden.centerM;
    cases.push({ name: "bare", scene: bareScene(polarization, background, conductors, { minX: cx - r, maxX: cx + r, minY: cy - r, maxY: cy + r }), indexHint: 0 });
  }
  if (ground) {
    // the flat ground alone (the reference the cloak should reproduce), then the bump alone
    cases.push({ name: "flat", scene: emptyScene(polarization, background), indexHint: 0 });
    cases.push({ name: "bare", scene: bareScene(polarization, background, conductors, { ...ground.bumpBox }), indexHint: 0 });
    notes.push(`ground-plane scene: a perfect conductor below y = ${Number(ground.groundYM.toPrecision(4))} m and under the bottom side (a bump ${Number(ground.heightM.toPrecision(3))} m high); cases flat (ground alone), bare (bump alone), then the cloaks`);
  }
  const sceneOf = (red: ReducedField, map: ReturnType<typeof mapFromReduced>): Scene => {
    if (transform.kind === "imported") return deviceScene(grid, polarization, background, map, hidden);
    const s = continuousScene({ transform, fieldBackground: input.fieldBackground, background, settings: red.settings, conductors });
    // the continuous map's own box may be tighter than the cells'; keep the union so nothing is cut
    s.bounds.minX = Math.min(s.bounds.minX, box.minX); s.bounds.maxX = Math.max(s.bounds.maxX, box.maxX);
    s.bounds.minY = Math.min(s.bounds.minY, box.minY); s.bounds.maxY = Math.max(s.bounds.maxY, box.maxY);
    return s;
  };
  if (transform.kind === "imported") notes.push("imported tensor field: the ideal and reduced maps are sampled from the design's cells (no continuous map to sample)");
  cases.push({ name: "ideal", scene: sceneOf(input.ideal, idealMap), indexHint: largestIndex(idealMap) });
  cases.push({ name: "reduced", scene: sceneOf(input.reduced, reducedMap), indexHint: largestIndex(reducedMap) });
  if (plan) {
    const m = mapFromPlan(plan, bg);
    if (m.missing > 0) notes.push(`realized: ${m.missing} device cells have no recipe and were left as background`);
    cases.push({ name: "realized", scene: deviceScene(grid, polarization, background, m, hidden, ground ? [ground.bump] : []), indexHint: largestIndex(m) });
    if (!input.materials) cases.push({ name: "realized-geometry", scene: null, reason: "no material values to draw the inclusions with", indexHint: 0 });
    else {
      const d = geometryScene({ plan, materials: input.materials, polarization, background, hidden, extraConductors: ground ? [ground.bump] : [] });
      if (!d.ok) cases.push({ name: "realized-geometry", scene: null, reason: d.reason, indexHint: 0 });
      else {
        notes.push(...d.notes);
        // the step follows the smallest feature, at most a quarter pitch (a disc's outline wants ≥ 8 steps per pitch)
        const featureM = drawnStepFeature(d.smallestFeatureM, grid.pitchM);
        cases.push({ name: "realized-geometry", scene: d.scene, indexHint: d.indexHint, maxStepM: featureM / DRAWN_STEPS[0], featureM });
      }
    }
  } else {
    cases.push({ name: "realized", scene: null, reason: "the design has no realization (no \"realization\" key): there is nothing built to check", indexHint: 0 });
  }
  return { cases, deviceBox: box, hidden, radial: RADIAL_KINDS.includes(transform.kind), ground, notes };
}
