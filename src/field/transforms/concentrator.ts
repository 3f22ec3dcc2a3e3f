/**
 * Field concentrator (Rahm, Schurig, Roberts, Cummer, Smith, Pendry, Photonics Nanostruct. 6, 87
 * (2008)): the virtual disk r < R2 is compressed into the physical core r' < R1, r' = (R1/R2) r,
 * and the shell R2 < r < R3 is stretched over R1 < r' < R3,
 * r' = R1 + (r − R2)(R3 − R1)/(R3 − R2). The map is the identity at R3.
 */
import type { ConcentratorSpec } from "../transformSpec.js";
import { OUTER_SLACK, type Transform } from "./transform.js";
import { rowRuns, ZONE_REL } from "../rowRuns.js";
import { radialK2 } from "./radialJacobian.js";
import { circleBoundary } from "./circleBoundary.js";

export function concentrator(spec: ConcentratorSpec): Transform {
  const r1 = spec.innerRadiusM, r2 = spec.compressedRadiusM, r3 = spec.outerRadiusM;
  const [cx, cy] = spec.center ?? [0, 0];
  const r3s = r3 * OUTER_SLACK;
  const core = r2 / r1; // dr/dr' in the core
  const shell = (r3 - r2) / (r3 - r1); // dr/dr' in the shell
  const h = (rp: number): number => (rp < r1 ? core * rp : r2 + (rp - r1) * shell);
  const runs = rowRuns(2), half = ZONE_REL * (r3 + Math.abs(cx) + Math.abs(cy));
  const contains = (x: number, y: number): boolean => (x - cx) * (x - cx) + (y - cy) * (y - cy) <= r3s * r3s;
  return {
    kind: "concentrator",
    dimension: 2,
    bounds: { minX: cx - r3, maxX: cx + r3, minY: cy - r3, maxY: cy + r3, minZ: 0, maxZ: 0 },
    contains,
    containsRow(out, y, z, x0, pitch) {
      runs.reset();
      runs.ring(cx, y - cy, r3s, half);
      runs.fill(out, x0, pitch, y, z, contains);
    },
    forward(out, x, y, z) {
      const dx = x - cx, dy = y - cy, r = Math.sqrt(dx * dx + dy * dy);
      if (!(r <= r3s)) return false;
      const rp = r < r2 ? r / core : r1 + (r - r2) / shell;
      const f = r === 0 ? 1 / core : rp / r;
      out[0] = cx + dx * f; out[1] = cy + dy * f; out[2] = z;
      return true;
    },
    inverse(out, x, y, z) {
      const dx = x - cx, dy = y - cy, rp = Math.sqrt(dx * dx + dy * dy);
      if (!(rp <= r3s)) return false;
      const f = rp === 0 ? core : h(rp) / rp;
      out[0] = cx + dx * f; out[1] = cy + dy * f; out[2] = z;
      return true;
    },
    jacobianK(k, x, y) {
      const dx = x - cx, dy = y - cy, rp = Math.sqrt(dx * dx + dy * dy);
      if (rp < r1) {
        k[0] = core; k[1] = 0; k[2] = 0; k[3] = 0; k[4] = core; k[5] = 0; k[6] = 0; k[7] = 0; k[8] = 1;
      } else {
        radialK2(k, dx, dy, rp, h(rp), shell);
      }
    },
    sampleOuterBoundary: (n) => circleBoundary(cx, cy, r3, n),
  };
}
