/** The design's `reduction` key: which simplification of the tensors the device accepts. */
import { z } from "zod";
import { REDUCTION_SCHEME_NAMES, type ReductionSchemeName } from "../../reduce/schemes/schemeNames.js";

export { REDUCTION_SCHEME_NAMES, type ReductionSchemeName };

export const reductionSchema = z
  .object({
    /** full, unit-mu (Ez), non-magnetic (Hz), isotropic, matched; see src/reduce/schemes */
    scheme: z.enum(REDUCTION_SCHEME_NAMES),
    /** for unit-mu (and matched in Ez): which principal value of the in-plane μ becomes 1 */
    unitAxis: z.enum(["larger", "smaller"]).optional(),
    /** index of the non-magnetic dielectric the device sits in (ε × n_b², replacing the design's background) */
    backgroundIndex: z.number().positive().optional(),
    /**
     * catalog id of the material the device is embedded in: its index at the design frequency must
     * be the background index (within 1 %); `verify --sweep` follows its dispersion
     * (verify/sweep/backgroundAtFrequency.ts)
     */
    backgroundMaterial: z.string().min(1).optional(),
    /** permittivity floor used for the minimum background index (default 1) */
    epsFloor: z.number().positive().optional(),
    /** |μ − 1| above this counts as magnetic (default 0.001) */
    muTolerance: z.number().nonnegative().optional(),
  })
  .strict();

export type ReductionSpec = z.infer<typeof reductionSchema>;
