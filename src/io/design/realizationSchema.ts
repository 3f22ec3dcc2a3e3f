/** The design's `realization` key: what the shop may use to build the device. */
import { z } from "zod";
import { closest } from "../../core/errors.js";
import { positiveQuantity } from "./quantitySchema.js";
import { rectTiling } from "../../cells/lattice.js";

export const LAYER_KEYS = ["core", "thickness", "below", "above"];

/**
 * The layer the device is made in: core material id, its thickness, and the materials below and
 * above (metal on both sides: parallel plates). The planner then mixes the core's slab mode index
 * (cells/slab/layerHost.ts).
 */
const layerSchema = z.strictObject({
  core: z.string().min(1),
  thickness: positiveQuantity("length"),
  below: z.string().min(1),
  above: z.string().min(1),
});

const shape = {
  /** material ids allowed (host and inclusions); default: every catalog material valid at the frequency */
  materials: z.array(z.string()).min(1).optional(),
  /** unit-cell family ids allowed; default: every non-resonant family, resonant ones where needed */
  families: z.array(z.string()).min(1).optional(),
  /** fabrication process id */
  process: z.string().optional(),
  lattice: z.enum(["square", "hex", "rect", "cubic"]).optional(),
  /**
   * rect lattices: b/a, a ratio m/n of whole numbers up to 4 (m × n circles per device cell); absent:
   * the planner tries 1, 1/3, 1/2, 2/3, 3/2, 2, 3 (cells/lattice.ts PLAN_RECT_ASPECTS)
   */
  aspect: z.number().positive().refine((v) => rectTiling(v) !== null, {
    message: "expected a ratio m/n of whole numbers from 1 to 4 (m × n circles tile a square cell), e.g. 2, 0.5, 1.5 or 0.75",
  }).optional(),
  /** largest number of distinct cell recipes */
  levels: z.number().int().min(1).max(256).optional(),
  /** largest relative error accepted on any target component */
  tolerance: z.number().positive().max(1).optional(),
  maxAnisotropy: z.number().min(1).optional(),
  lossBudgetDb: z.number().nonnegative().optional(),
  /** fractional bandwidth the device must work over, e.g. 0.1 */
  bandwidth: z.number().positive().max(2).optional(),
  /** the thin film (or plate pair) the device is made in */
  layer: layerSchema.optional(),
  /** height of the device along z (the bill of materials and the printed part); default from the process (plan/deviceHeight.ts) */
  height: positiveQuantity("length").optional(),
};

export const REALIZATION_KEYS = Object.keys(shape);

/** "unknown key 'levles'; did you mean levels?" for each unknown key. */
function unknownKeysMessage(keys: readonly string[]): string {
  return keys
    .map((k) => {
      const near = closest(k, REALIZATION_KEYS, 2);
      return `unknown key '${k}'${near.length ? `; did you mean ${near.join(" or ")}?` : ""}`;
    })
    .join("; ");
}

export const realizationSchema = z.strictObject(shape, {
  error: (issue) =>
    issue.code === "unrecognized_keys" ? unknownKeysMessage((issue as unknown as { keys: string[] }).keys) : undefined,
}).superRefine((r, ctx) => {
  if (r.aspect !== undefined && r.lattice !== "rect") ctx.addIssue({ code: "custom", path: ["aspect"], message: "an aspect applies to lattice \"rect\" only" });
});

export type RealizationSpec = z.infer<typeof realizationSchema>;
