/**
 * Physically meaningful scales for a transformation-optics device: its size against the vacuum
 * wavelength. A device far below a wavelength is a quasi-static problem (the effective-medium and
 * ray pictures behind the reduction do not apply, and the grid step of a check would be absurd);
 * one of more than 10⁴ wavelengths needs more cells than any homogenized lattice can hold. These
 * limits are common practice for this tool's range, not a law: outside them the inputs almost
 * always hold a unit mistake (1 Hz for 1 GHz, metres for millimetres).
 */
import { SPEED_OF_LIGHT_M_PER_S } from "./physicalConstants.js";

/** Smallest device size, in vacuum wavelengths (common practice). */
export const MIN_DEVICE_WAVELENGTHS = 0.01;
/** Largest device size, in vacuum wavelengths (common practice). */
export const MAX_DEVICE_WAVELENGTHS = 1e4;

const g = (v: number): string => String(Number(v.toPrecision(3)));

/**
 * Why `sizeM` at `frequencyHz` is not a meaningful device size, or null when it is. `what` names
 * the length in the message ("the device", "the pitch").
 * Example: deviceScaleProblem(0.1, 1, "the device") → "the device is 3.34e-10 wavelengths across …"
 */
export function deviceScaleProblem(sizeM: number, frequencyHz: number, what: string): string | null {
  const wavelengthM = SPEED_OF_LIGHT_M_PER_S / frequencyHz;
  const ratio = sizeM / wavelengthM;
  if (ratio >= MIN_DEVICE_WAVELENGTHS && ratio <= MAX_DEVICE_WAVELENGTHS) return null;
  const figure = Number.isFinite(ratio) ? `${g(ratio)} wavelengths` : "beyond the number range of wavelengths";
  return `${what} is ${figure} across (${g(sizeM)} m at ${g(frequencyHz)} Hz, vacuum wavelength ${g(wavelengthM)} m); ` +
    `expected between 1/100 and 10⁴ wavelengths: check the frequency and the length units`;
}
