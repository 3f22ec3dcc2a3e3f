/** The design's `reduction` key: which simplification of the tensors the device accepts. */
import { z } from "zod";

export const REDUCTION_SCHEMES = ["full", "unit-mu", "non-magnetic", "isotropic", "matched"] as const;
export type ReductionSchemeName = (typeof REDUCTION_SCHEMES)[number];

export const reductionSchema = z
  .object({
    scheme: z.enum(REDUCTION_SCHEMES),
    /** for unit-mu: which principal value of the in-plane μ becomes 1 */
    unitAxis: z.enum(["larger", "smaller"]).optional(),
    /** index of the dielectric the device sits in (scales every ε and μ) */
    backgroundIndex: z.number().positive().optional(),
    /** permittivity floor used for the minimum background index (default 1) */
    epsFloor: z.number().positive().optional(),
  })
  .strict();

export type ReductionSpec = z.infer<typeof reductionSchema>;
