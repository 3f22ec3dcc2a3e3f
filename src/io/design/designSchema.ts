/**
 * The design file, validated with zod. Quantities are numbers (SI) or strings with units
 * ("10.5 GHz", "40 mm"); the parsed `Design` is SI throughout. Parse through `parseDesign`, which
 * loads mathjs when a quantity needs it (see quantitySchema.ts).
 */
import { z } from "zod";
import { positiveQuantity } from "./quantitySchema.js";
import { transformSchema } from "./transformSchema.js";
import { gridSchema } from "./gridSchema.js";
import { reductionSchema, type ReductionSpec } from "./reductionSchema.js";
import { realizationSchema, type RealizationSpec } from "./realizationSchema.js";
import type { FieldDesign, TransformSpec } from "../../field/transformSpec.js";

export type { TransformSpec } from "../../field/transformSpec.js";

export const DESIGN_KEYS = ["name", "notes", "frequency", "background", "transform", "grid", "polarization", "reduction", "realization"];
export const BACKGROUND_KEYS = ["eps", "mu"];

export const designSchema = z
  .object({
    name: z.string().min(1),
    notes: z.string().optional(),
    frequency: positiveQuantity("frequency"),
    background: z
      .object({ eps: z.number().positive().default(1), mu: z.number().positive().default(1) })
      .strict()
      .default({ eps: 1, mu: 1 }),
    transform: transformSchema,
    grid: gridSchema,
    polarization: z.enum(["Ez", "Hz"]).optional(),
    reduction: reductionSchema.optional(),
    realization: realizationSchema.optional(),
  })
  .strict();

/** A parsed design, SI throughout. */
export interface Design extends FieldDesign {
  name: string;
  notes?: string;
  frequencyHz: number;
  background: { eps: number; mu: number };
  /** discriminated on `kind`; lengths in metres, angles in radians; expression maps compiled */
  transform: TransformSpec;
  grid: { pitchM: number; origin?: [number, number]; slice?: boolean };
  polarization?: "Ez" | "Hz";
  reduction?: ReductionSpec;
  realization?: RealizationSpec;
  /** the design file as given (messages name it) */
  sourcePath: string;
}
