/**
 * Check the compiled symbolic derivatives of an expression map against central differences at a
 * few cells of the grid. A disagreement means the symbolic derivative is not the derivative of
 * the values there (e.g. a kink or a function the differentiator mishandles): an InputError
 * naming the expression. Step h = 1e-6 × device size; agreement within 1e-5 (relative to
 * max(1, |∂|)) — central differences are accurate to O(h²) for smooth maps.
 */
import { InputError } from "../core/errors.js";
import type { DeviceGrid } from "./deviceGrid.js";
import type { ExpressionSpec } from "./transformSpec.js";

export const DERIVATIVE_CHECK_TOLERANCE = 1e-5;

export function checkExpressionDerivatives(spec: ExpressionSpec, grid: DeviceGrid, where: string): void {
  const f = spec.compiled;
  const n = grid.count;
  const size = Math.max(grid.nx, grid.ny) * grid.pitchM;
  const h = 1e-6 * size;
  const v = new Float64Array(6), p = new Float64Array(6), m = new Float64Array(6);
  const picks = new Set([0, Math.floor(n / 4), Math.floor(n / 2), Math.floor((3 * n) / 4), n - 1]);
  const names = ["∂x/∂x'", "∂x/∂y'", "∂y/∂x'", "∂y/∂y'"];
  for (const c of picks) {
    // the cell centre from its lattice indices (as the grid's own xM, yM; reading those would make the whole arrays)
    const x = grid.originXM + grid.i[c] * grid.pitchM, y = grid.originYM + grid.j[c] * grid.pitchM;
    f(v, x, y);
    if (!v.every(Number.isFinite)) continue; // reported by the engine with the cell
    const numeric = [0, 0, 0, 0];
    f(p, x + h, y); f(m, x - h, y);
    numeric[0] = (p[0] - m[0]) / (2 * h); numeric[2] = (p[1] - m[1]) / (2 * h);
    f(p, x, y + h); f(m, x, y - h);
    numeric[1] = (p[0] - m[0]) / (2 * h); numeric[3] = (p[1] - m[1]) / (2 * h);
    for (let q = 0; q < 4; q++) {
      const sym = v[2 + q], num = numeric[q];
      if (!Number.isFinite(num)) continue;
      if (Math.abs(sym - num) > DERIVATIVE_CHECK_TOLERANCE * Math.max(1, Math.abs(num))) {
        const expr = q < 2 ? spec.virtual.x : spec.virtual.y;
        throw new InputError({
          where,
          message: `the symbolic derivative ${names[q]} of '${expr}' is ${sym} but central differences give ${num} at (${x} m, ${y} m); expected a map differentiable inside the region`,
        });
      }
    }
  }
}
