/** Registry of the dispersion models: id → model. Add one: write its file here and list it. */
import { constant } from "./constant.js";
import { debye } from "./debye.js";
import { debyeWater } from "./debyeWater.js";
import type { DispersionModel, DispersionModelId } from "./dispersionModel.js";
import { drude } from "./drude.js";
import { drudeLorentz } from "./drudeLorentz.js";
import { lorentz } from "./lorentz.js";
import { sellmeier } from "./sellmeier.js";

export const DISPERSION_MODELS: Record<DispersionModelId, DispersionModel> = {
  constant,
  debye,
  "debye-water": debyeWater,
  lorentz,
  drude,
  "drude-lorentz": drudeLorentz,
  sellmeier,
};

export const DISPERSION_MODEL_IDS = Object.keys(DISPERSION_MODELS) as DispersionModelId[];

export function isDispersionModelId(id: string): id is DispersionModelId {
  return Object.prototype.hasOwnProperty.call(DISPERSION_MODELS, id);
}
