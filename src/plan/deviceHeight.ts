/**
 * The device's height along z (a 2D device is invariant along z, so its height is a choice of the
 * build, not of the field): `realization.height` when the design gives it, otherwise a default
 * from how it is made —
 * - a declared layer (realization.layer): the layer's thickness;
 * - printed-circuit etching of a pattern in the plane: a standard 1.6 mm board (common practice);
 * - otherwise (and for split rings on standing boards) the largest whole number of cells not above half a free-space wavelength, at least
 *   one cell (common practice: a 2D device is measured between parallel plates spaced below half a
 *   wavelength, where only the fundamental mode propagates).
 * Used by the bill of materials (volumes a buyer orders) and the printed part (layout.stl).
 */
import type { PlanSettings } from "./planTypes.js";

export const BOARD_THICKNESS_M = 1.6e-3;

export interface DeviceHeight {
  heightM: number;
  /** where the figure comes from, for the report */
  source: string;
}

export function deviceHeight(settings: Pick<PlanSettings, "heightM" | "layer" | "process">, pitchM: number, wavelengthM: number, standingBoards = false): DeviceHeight {
  if (settings.heightM != null) return { heightM: settings.heightM, source: "realization.height" };
  if (settings.layer) return { heightM: settings.layer.thicknessM, source: "the layer's thickness, realization.layer" };
  if (settings.process === "pcb-etching" && !standingBoards) return { heightM: BOARD_THICKNESS_M, source: "a standard 1.6 mm board, the default for printed-circuit etching" };
  const cells = Math.max(1, Math.floor(wavelengthM / (2 * pitchM) + 1e-9));
  return { heightM: cells * pitchM, source: `${cells} cell${cells === 1 ? "" : "s"} high, the whole cells within half a free-space wavelength: the default when realization.height is not given` };
}
