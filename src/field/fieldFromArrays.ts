/**
 * Assemble a TensorField from per-cell positions and tensors read elsewhere (an imported CSV):
 * infers nothing, only derives principal values and anisotropy ratios.
 */
import type { SymTensorField } from "../core/symTensor.js";
import type { DeviceGrid } from "./deviceGrid.js";
import type { TensorField } from "./tensorField.js";
import { fillPrincipal } from "./principalValues.js";

export function fieldFromArrays(
  source: string,
  grid: DeviceGrid,
  background: { eps: number; mu: number },
  eps: SymTensorField,
  mu: SymTensorField,
  detJ: Float64Array,
  capped: Uint8Array,
): TensorField {
  const n = grid.count;
  const epsPrincipal: [Float64Array, Float64Array, Float64Array] = [new Float64Array(n), new Float64Array(n), new Float64Array(n)];
  const muPrincipal: [Float64Array, Float64Array, Float64Array] = [new Float64Array(n), new Float64Array(n), new Float64Array(n)];
  const epsAnisotropy = new Float64Array(n), muAnisotropy = new Float64Array(n);
  fillPrincipal(eps, epsPrincipal, epsAnisotropy);
  fillPrincipal(mu, muPrincipal, muAnisotropy);
  return {
    source, grid, background, eps, mu, detJ, epsPrincipal, muPrincipal, epsAnisotropy, muAnisotropy,
    capped, capValue: null, outerBoundary: null, evaluateAt: null,
  };
}
