/** Names of the reduction schemes, as written in a design's `reduction.scheme` and on the command line. */
export const REDUCTION_SCHEME_NAMES = ["full", "unit-mu", "non-magnetic", "isotropic", "matched"] as const;
export type ReductionSchemeName = (typeof REDUCTION_SCHEME_NAMES)[number];
