/**
 * Field rotator (Chen, Chan, "Transformation media that rotate electromagnetic fields", Appl.
 * Phys. Lett. 90, 241105 (2007)): in a < r < b, θ' = θ + θ0 (b − r)/(b − a), r' = r. Physical →
 * virtual: θ = θ' − θ0 (b − r')/(b − a). The in-plane det K is 1.
 * K = ∂(x, y)/∂(x', y') with ∂r/∂x' = n̂, ∂θ/∂x' = θ̂'/r' + t n̂, t = θ0/(b − a).
 */
import type { RotatorSpec } from "../transformSpec.js";
import { OUTER_SLACK, type Transform } from "./transform.js";
import { annulusRegion } from "./annulusRegion.js";
import { circleBoundary } from "./circleBoundary.js";

export function rotator(spec: RotatorSpec): Transform {
  const a = spec.innerRadiusM, b = spec.outerRadiusM, th0 = spec.angleRad;
  const [cx, cy] = spec.center ?? [0, 0];
  const bb = b * OUTER_SLACK;
  const t = th0 / (b - a);
  const region = annulusRegion(cx, cy, a, bb, b);
  return {
    kind: "rotator",
    dimension: 2,
    ...region,
    forward(out, x, y, z) {
      const dx = x - cx, dy = y - cy, r = Math.sqrt(dx * dx + dy * dy);
      if (!(r > a && r <= bb)) return false;
      const phi = th0 * (b - r) / (b - a);
      const c = Math.cos(phi), s = Math.sin(phi);
      out[0] = cx + c * dx - s * dy; out[1] = cy + s * dx + c * dy; out[2] = z;
      return true;
    },
    inverse(out, x, y, z) {
      const dx = x - cx, dy = y - cy, rp = Math.sqrt(dx * dx + dy * dy);
      if (!(rp > a && rp <= bb)) return false;
      const phi = -th0 * (b - rp) / (b - a);
      const c = Math.cos(phi), s = Math.sin(phi);
      out[0] = cx + c * dx - s * dy; out[1] = cy + s * dx + c * dy; out[2] = z;
      return true;
    },
    jacobianK(k, x, y) {
      const dx = x - cx, dy = y - cy, rp = Math.sqrt(dx * dx + dy * dy);
      const nx = dx / rp, ny = dy / rp;
      const th = Math.atan2(dy, dx) - th0 * (b - rp) / (b - a);
      const c = Math.cos(th), s = Math.sin(th), rt = rp * t;
      k[0] = nx * c + ny * s - rt * nx * s; k[1] = ny * c - nx * s - rt * ny * s; k[2] = 0;
      k[3] = nx * s - ny * c + rt * nx * c; k[4] = ny * s + nx * c + rt * ny * c; k[5] = 0;
      k[6] = 0; k[7] = 0; k[8] = 1;
    },
    sampleOuterBoundary: (n) => circleBoundary(cx, cy, b, n),
  };
}
