/**
 * Spherical cloak: the virtual ball r < b is blown up into the physical shell a < r' < b with
 * r' = a + r(b−a)/b. ε_r = μ_r = (b/(b−a))(r'−a)²/r'², ε_θ = ε_φ = b/(b−a)
 * (Pendry, Schurig, Smith, Science 312, 1780 (2006)). Centre in the z = 0 plane.
 */
import type { SphericalCloakSpec } from "../transformSpec.js";
import { INNER_SLACK, OUTER_SLACK, type Transform } from "./transform.js";
import { radialK3 } from "./radialJacobian.js";
import { circleBoundary } from "./circleBoundary.js";

export function sphericalCloak(spec: SphericalCloakSpec): Transform {
  const a = spec.innerRadiusM, b = spec.outerRadiusM;
  const [cx, cy] = spec.center ?? [0, 0];
  const bb = b * OUTER_SLACK, aa = a * INNER_SLACK;
  const s = (b - a) / b;
  return {
    kind: "spherical-cloak",
    dimension: 3,
    bounds: { minX: cx - b, maxX: cx + b, minY: cy - b, maxY: cy + b, minZ: -b, maxZ: b },
    contains(x, y, z) {
      const r = Math.sqrt((x - cx) * (x - cx) + (y - cy) * (y - cy) + z * z);
      return r > aa && r <= bb;
    },
    forward(out, x, y, z) {
      const dx = x - cx, dy = y - cy, r = Math.sqrt(dx * dx + dy * dy + z * z);
      if (!(r > 0 && r <= bb)) return false;
      const f = (a + r * s) / r;
      out[0] = cx + dx * f; out[1] = cy + dy * f; out[2] = z * f;
      return true;
    },
    inverse(out, x, y, z) {
      const dx = x - cx, dy = y - cy, rp = Math.sqrt(dx * dx + dy * dy + z * z);
      if (!(rp > aa && rp <= bb)) return false;
      const f = (rp - a) / s / rp;
      out[0] = cx + dx * f; out[1] = cy + dy * f; out[2] = z * f;
      return true;
    },
    jacobianK(k, x, y, z) {
      const dx = x - cx, dy = y - cy, rp = Math.sqrt(dx * dx + dy * dy + z * z);
      radialK3(k, dx, dy, z, rp, (rp - a) / s, 1 / s);
    },
    clampToInnerOffset(pt, offsetM) {
      const dx = pt[0] - cx, dy = pt[1] - cy, dz = pt[2], rp = Math.sqrt(dx * dx + dy * dy + dz * dz);
      const min = a + offsetM;
      if (rp >= min || rp === 0) return false;
      const f = min / rp;
      pt[0] = cx + dx * f; pt[1] = cy + dy * f; pt[2] = dz * f;
      return true;
    },
    // the equator (z = 0) of the outer sphere, normals in-plane
    sampleOuterBoundary: (n) => circleBoundary(cx, cy, b, n),
  };
}
