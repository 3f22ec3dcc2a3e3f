/**
 * Registry of transform kinds: each entry builds a `Transform` (forward, inverse, closed-form K,
 * region) from its validated spec. `imported` fields have no transform (io/fieldCsv.ts reads them).
 */
import type { TransformSpec } from "../transformSpec.js";
import type { Transform } from "./transform.js";
import { radialCloak } from "./radialCloak.js";
import { concentrator } from "./concentrator.js";
import { rotator } from "./rotator.js";
import { beamShifter } from "./beamShifter.js";
import { beamBend } from "./beamBend.js";
import { sphericalCloak } from "./sphericalCloak.js";
import { expressionMap } from "./expressionMap.js";
import { quasiConformal } from "./quasiConformal.js";
import { laplaceShell } from "./laplaceShell.js";
import { ProgrammerError } from "../../core/errors.js";

type Analytic = Exclude<TransformSpec, { kind: "imported" }>;

export const TRANSFORMS: { [K in Analytic["kind"]]: (spec: Extract<Analytic, { kind: K }>) => Transform } = {
  "radial-cloak": radialCloak,
  concentrator,
  rotator,
  "beam-shifter": beamShifter,
  "beam-bend": beamBend,
  "spherical-cloak": sphericalCloak,
  expression: expressionMap,
  "quasi-conformal": quasiConformal,
  "laplace-shell": laplaceShell,
};

/** All kinds a design may name, analytic ones first. */
export const TRANSFORM_KINDS = [...(Object.keys(TRANSFORMS) as Analytic["kind"][]), "imported"] as const;

/** Build the transform of a spec (not for `imported`). */
export function makeTransform(spec: TransformSpec): Transform {
  if (spec.kind === "imported") throw new ProgrammerError("imported fields have no transform; use loadFieldForDesign");
  const build = TRANSFORMS[spec.kind] as (s: Analytic) => Transform;
  return build(spec);
}
