/**
 * The lattice of unit cells that covers a device. Square (2D) or cubic (3D) cells of one pitch
 * cover the device's bounding box; only cells whose centre lies inside the device region are kept,
 * and those are listed struct-of-arrays in row-major order (k, then j, then i).
 */
export interface DeviceGrid {
  dimension: 2 | 3;
  pitchM: number;
  /** cells of the bounding-box lattice along x, y, z (nz = 1 in 2D) */
  nx: number;
  ny: number;
  nz: number;
  /** centre of lattice cell (0, 0, 0) */
  originXM: number;
  originYM: number;
  originZM: number;
  /** number of cells inside the device */
  count: number;
  /** lattice indices of each device cell */
  i: Int32Array;
  j: Int32Array;
  k: Int32Array;
  /** cell centres, metres */
  xM: Float64Array;
  yM: Float64Array;
  zM: Float64Array;
}
