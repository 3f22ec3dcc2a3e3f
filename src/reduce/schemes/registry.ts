/** Registry of reduction schemes, in the order the comparison table lists them. */
import { InputError, unknownWithSuggestion } from "../../core/errors.js";
import type { Polarization } from "../polarization.js";
import { fullScheme } from "./full.js";
import { isotropicScheme } from "./isotropic.js";
import { matchedScheme } from "./matched.js";
import { nonMagneticScheme } from "./nonMagnetic.js";
import type { ReductionScheme } from "./reductionScheme.js";
import { REDUCTION_SCHEME_NAMES, type ReductionSchemeName } from "./schemeNames.js";
import { unitMuScheme } from "./unitMu.js";

export const REDUCTION_SCHEMES: Readonly<Record<ReductionSchemeName, ReductionScheme>> = {
  full: fullScheme,
  "unit-mu": unitMuScheme,
  "non-magnetic": nonMagneticScheme,
  isotropic: isotropicScheme,
  matched: matchedScheme,
};

/** Schemes valid for a polarization, in table order. */
export function schemesFor(polarization: Polarization): ReductionScheme[] {
  return REDUCTION_SCHEME_NAMES.map((n) => REDUCTION_SCHEMES[n]).filter((s) => s.polarizations.includes(polarization));
}

/**
 * The scheme called `name`, checked against the polarization. Throws InputError at `where` for an
 * unknown name or a scheme that does not apply, listing the schemes valid for that polarization.
 */
export function resolveScheme(name: string, polarization: Polarization, where = "reduction.scheme"): ReductionScheme {
  const valid = schemesFor(polarization).map((s) => s.name);
  if (!(REDUCTION_SCHEME_NAMES as readonly string[]).includes(name)) {
    throw new InputError({ where, message: `${unknownWithSuggestion("reduction scheme", name, REDUCTION_SCHEME_NAMES)} (valid for ${polarization}: ${valid.join(", ")})` });
  }
  const scheme = REDUCTION_SCHEMES[name as ReductionSchemeName];
  if (!scheme.polarizations.includes(polarization)) {
    const why = polarization === "3D"
      ? "a 3D design has no polarization reduction"
      : `scheme '${name}' does not apply to ${polarization} (it serves ${scheme.polarizations.filter((p) => p !== "3D").join(", ")})`;
    throw new InputError({ where, message: `${why}; valid for ${polarization}: ${valid.join(", ")}` });
  }
  return scheme;
}
