/**
 * The length unit the outputs a person reads are written in, fitted to the design: micrometres for
 * optical and infrared work (free-space wavelength below 100 µm), millimetres otherwise (microwave,
 * millimetre-wave, terahertz down to 100 µm). Column names carry it (`x_um`, `radius_um`, `x_mm`…).
 */
export interface DesignUnit {
  /** column suffix: "um" or "mm" */
  suffix: "um" | "mm";
  /** printed symbol: "µm" or "mm" */
  symbol: "µm" | "mm";
  /** how many of the unit make one metre */
  perM: number;
}

export const MICROMETRE: DesignUnit = { suffix: "um", symbol: "µm", perM: 1e6 };
export const MILLIMETRE: DesignUnit = { suffix: "mm", symbol: "mm", perM: 1e3 };

/** The unit for a design of free-space wavelength `wavelengthM`. */
export function designUnit(wavelengthM: number): DesignUnit {
  return wavelengthM < 100e-6 ? MICROMETRE : MILLIMETRE;
}

/** "radius_m" → "radius_um" (a recipe dimension key in metres → its column in the design unit). */
export function unitColumn(keyM: string, unit: DesignUnit): string {
  return keyM.endsWith("_m") ? `${keyM.slice(0, -2)}_${unit.suffix}` : keyM;
}
