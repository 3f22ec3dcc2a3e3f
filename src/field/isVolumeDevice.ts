/**
 * Whether a field belongs to a volume (3D) device: gridded in 3D, or a z = 0 slice of a 3D
 * transform (the spherical cloak), which is not invariant along z and so has no Ez/Hz reduction
 * and cannot be built as a 2D device.
 */
import type { TensorField } from "./tensorField.js";

export function isVolumeDevice(field: TensorField): boolean {
  return field.grid.dimension === 3 || field.volumeDevice === true;
}
