/**
 * Beam shifter (Rahm, Cummer, Schurig, Pendry, Smith, Phys. Rev. Lett. 100, 063903 (2008)):
 * y' = y + a x with a = shift/length over the slab 0 ≤ x' ≤ length, |y'| ≤ height/2.
 * ε = μ = [[1, a, 0], [a, 1 + a², 0], [0, 0, 1]]. Physical → virtual: y = y' − a x'.
 */
import type { BeamShifterSpec } from "../transformSpec.js";
import type { Transform } from "./transform.js";
import { edgeBoundary, joinBoundaries } from "./circleBoundary.js";

export function beamShifter(spec: BeamShifterSpec): Transform {
  const L = spec.lengthM, H = spec.heightM, slope = spec.shiftM / spec.lengthM;
  const half = H / 2;
  const inside = (x: number, y: number): boolean => x >= 0 && x <= L && y >= -half && y <= half;
  return {
    kind: "beam-shifter",
    dimension: 2,
    bounds: { minX: 0, maxX: L, minY: -half, maxY: half, minZ: 0, maxZ: 0 },
    contains: (x, y) => inside(x, y),
    forward(out, x, y, z) {
      out[0] = x; out[1] = y + slope * x; out[2] = z;
      return inside(out[0], out[1]);
    },
    inverse(out, x, y, z) {
      if (!inside(x, y)) return false;
      out[0] = x; out[1] = y - slope * x; out[2] = z;
      return true;
    },
    jacobianK(k) {
      k[0] = 1; k[1] = 0; k[2] = 0;
      k[3] = -slope; k[4] = 1; k[5] = 0;
      k[6] = 0; k[7] = 0; k[8] = 1;
    },
    sampleOuterBoundary(n) {
      const inset = 1e-9 * Math.max(L, H);
      const per = Math.max(2, Math.floor(n / 4));
      return joinBoundaries([
        edgeBoundary(0, -half, L, -half, 0, -1, per, inset),
        edgeBoundary(L, -half, L, half, 1, 0, per, inset),
        edgeBoundary(L, half, 0, half, 0, 1, per, inset),
        edgeBoundary(0, half, 0, -half, -1, 0, per, inset),
      ]);
    },
  };
}
