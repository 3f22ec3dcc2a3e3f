/** Every unit-cell family, by id. Add a family: write families/<name>.ts, then list it here. */
import { InputError, unknownWithSuggestion } from "../core/errors.js";
import type { CellFamily } from "./cellFamily.js";
import { cubesInHost } from "./families/cubesInHost.js";
import { holesInSlab } from "./families/holesInSlab.js";
import { laminate } from "./families/laminate.js";
import { rodsInHost } from "./families/rodsInHost.js";
import { spheresInHost } from "./families/spheresInHost.js";
import { splitRingFamily } from "./families/splitRingFamily.js";
import { strutLattice } from "./families/strutLattice.js";
import { wireMediumFamily } from "./families/wireMediumFamily.js";

export const CELL_FAMILIES: readonly CellFamily[] = [
  rodsInHost,
  holesInSlab,
  spheresInHost,
  cubesInHost,
  laminate,
  strutLattice,
  wireMediumFamily,
  splitRingFamily,
];

/** The family with this id; InputError naming `where` (and the closest ids) when unknown. */
export function getCellFamily(id: string, where = "family"): CellFamily {
  const f = CELL_FAMILIES.find((x) => x.id === id);
  if (!f) throw new InputError({ where, message: unknownWithSuggestion("cell family", id, CELL_FAMILIES.map((x) => x.id)) });
  return f;
}
