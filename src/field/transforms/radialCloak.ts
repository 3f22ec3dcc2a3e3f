/**
 * Cylindrical cloak: the virtual disk r < b is blown up into the physical annulus a < r' < b.
 *
 * linear: r' = g(r) = a + r(b−a)/b (Pendry, Schurig, Smith, Science 312, 1780 (2006));
 * quadratic: g(r) = a + (1 − 2a/b) r + (a/b²) r², with g(0) = a, g(b) = b, g'(b) = 1, monotonic
 * only for b > 2a (Cai et al., Appl. Phys. Lett. 91, 111105 (2007)).
 * K in the polar basis: K_rr = 1/g'(r), K_θθ = r/r'. Singular at r' = a.
 */
import type { RadialCloakSpec } from "../transformSpec.js";
import { INNER_SLACK, OUTER_SLACK, type Transform } from "./transform.js";
import { radialK2 } from "./radialJacobian.js";
import { circleBoundary } from "./circleBoundary.js";
import { annulusRegion } from "./annulusRegion.js";

/** Profile g(r), its inverse h(r') and h'(r') for the cloak radii a < b. */
export interface RadialProfile {
  g(r: number): number;
  h(rp: number): number;
  dh(rp: number): number;
}

/** The linear or quadratic cloak profile. Throws a plain Error for b ≤ 2a with `quadratic` (the schema rejects it first). */
export function cloakProfile(profile: "linear" | "quadratic", a: number, b: number): RadialProfile {
  if (profile === "linear") {
    const s = (b - a) / b;
    return { g: (r) => a + r * s, h: (rp) => (rp - a) / s, dh: () => 1 / s };
  }
  if (!(b > 2 * a)) throw new Error("quadratic cloak profile needs outer radius > 2 × inner radius");
  const c1 = 1 - (2 * a) / b, c2 = a / (b * b);
  const h = (rp: number): number => (2 * (rp - a)) / (c1 + Math.sqrt(c1 * c1 + 4 * c2 * (rp - a)));
  return {
    g: (r) => a + c1 * r + c2 * r * r,
    h,
    dh: (rp) => 1 / (c1 + 2 * c2 * h(rp)),
  };
}

export function radialCloak(spec: RadialCloakSpec): Transform {
  const a = spec.innerRadiusM, b = spec.outerRadiusM;
  const [cx, cy] = spec.center ?? [0, 0];
  const bb = b * OUTER_SLACK, aa = a * INNER_SLACK;
  const p = cloakProfile(spec.profile, a, b);
  const linear = spec.profile === "linear";
  const s = (b - a) / b;
  const region = annulusRegion(cx, cy, aa, bb, b);
  return {
    kind: "radial-cloak",
    dimension: 2,
    ...region,
    forward(out, x, y, z) {
      const dx = x - cx, dy = y - cy, r = Math.sqrt(dx * dx + dy * dy);
      if (!(r > 0 && r <= bb)) return false;
      const f = p.g(r) / r;
      out[0] = cx + dx * f; out[1] = cy + dy * f; out[2] = z;
      return true;
    },
    inverse(out, x, y, z) {
      const dx = x - cx, dy = y - cy, rp = Math.sqrt(dx * dx + dy * dy);
      if (!(rp > aa && rp <= bb)) return false;
      const f = p.h(rp) / rp;
      out[0] = cx + dx * f; out[1] = cy + dy * f; out[2] = z;
      return true;
    },
    jacobianK(k, x, y) {
      const dx = x - cx, dy = y - cy, rp = Math.sqrt(dx * dx + dy * dy);
      if (linear) radialK2(k, dx, dy, rp, (rp - a) / s, 1 / s);
      else radialK2(k, dx, dy, rp, p.h(rp), p.dh(rp));
    },
    clampToInnerOffset(pt, offsetM) {
      const dx = pt[0] - cx, dy = pt[1] - cy, rp = Math.sqrt(dx * dx + dy * dy);
      const min = a + offsetM;
      if (rp >= min || rp === 0) return false;
      pt[0] = cx + (dx * min) / rp; pt[1] = cy + (dy * min) / rp;
      return true;
    },
    sampleOuterBoundary: (n) => circleBoundary(cx, cy, b, n),
  };
}
