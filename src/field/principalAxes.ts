/**
 * Principal axes of one cell's ε' or μ' on demand (the field stores only the values, to keep
 * per-cell memory small). Columns of `vectors` (vectors[3*row + k]) are the unit axes of the
 * ascending principal values written to `values`.
 */
import { sym3Eigen } from "../core/eigen.js";
import { readSym } from "../core/symTensor.js";
import type { TensorField } from "./tensorField.js";

const t = new Float64Array(6);

export function principalAxesAt(values: Float64Array, vectors: Float64Array, field: TensorField, which: "eps" | "mu", cell: number): void {
  readSym(t, field[which], cell);
  sym3Eigen(values, t, vectors);
}
