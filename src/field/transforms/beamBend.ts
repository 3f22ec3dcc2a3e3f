/**
 * Beam bend: a virtual rectangle (x across the beam, y along it) is wrapped onto the annular sector
 * a ≤ r' ≤ b, 0 ≤ θ' ≤ angle about the centre: r' = x, θ' = y/R0, so arc length is kept at the
 * reference radius R0. ε_r = R0/r', ε_θ = r'/R0, ε_z = R0/r' (μ the same)
 * (Rahm, Roberts, Pendry, Smith, Opt. Express 16, 11555 (2008) — from memory; the tensors follow
 * from the general rule of Schurig, Pendry, Smith, Opt. Express 14, 9794 (2006)).
 * Physical → virtual: x = r', y = R0 θ'; K rows: n̂ᵀ, (R0/r') θ̂ᵀ, ẑᵀ.
 */
import type { BeamBendSpec } from "../transformSpec.js";
import { OUTER_SLACK, type Transform } from "./transform.js";
import { circleBoundary, edgeBoundary, joinBoundaries } from "./circleBoundary.js";
import { rowRuns, ZONE_REL } from "../rowRuns.js";

export function beamBend(spec: BeamBendSpec): Transform {
  const a = spec.innerRadiusM, b = spec.outerRadiusM, span = spec.angleRad, r0 = spec.referenceRadiusM;
  const [cx, cy] = spec.center ?? [0, 0];
  const spanS = span * OUTER_SLACK;
  const angleOf = (dx: number, dy: number): number => {
    const th = Math.atan2(dy, dx);
    return th < 0 ? th + 2 * Math.PI : th;
  };
  const inside = (dx: number, dy: number): boolean => {
    const r = Math.sqrt(dx * dx + dy * dy);
    if (!(r >= a && r <= b * OUTER_SLACK && r > 0)) return false;
    return span >= 2 * Math.PI || angleOf(dx, dy) <= spanS;
  };
  // bounding box of the sector: the corners plus every axis crossing inside the span
  let minX = Infinity, maxX = -Infinity, minY = Infinity, maxY = -Infinity;
  const add = (th: number, r: number): void => {
    const x = cx + r * Math.cos(th), y = cy + r * Math.sin(th);
    minX = Math.min(minX, x); maxX = Math.max(maxX, x); minY = Math.min(minY, y); maxY = Math.max(maxY, y);
  };
  for (const r of [a, b]) {
    add(0, r); add(Math.min(span, 2 * Math.PI), r);
    for (let q = 1; q <= 4; q++) if ((q * Math.PI) / 2 <= span) add((q * Math.PI) / 2, r);
  }
  // row test by runs: the answer can change only near the two arcs, the centre and the two edges
  const runs = rowRuns(10), half = ZONE_REL * (b + Math.abs(cx) + Math.abs(cy));
  const contains = (x: number, y: number): boolean => inside(x - cx, y - cy);
  return {
    kind: "beam-bend",
    dimension: 2,
    bounds: { minX, maxX, minY, maxY, minZ: 0, maxZ: 0 },
    contains,
    containsRow(out, y, z, x0, pitch) {
      const dy = y - cy;
      runs.reset();
      runs.ring(cx, dy, a, half);
      runs.ring(cx, dy, b * OUTER_SLACK, half);
      runs.ring(cx, dy, 0, half);
      if (span < 2 * Math.PI) { runs.line(cx, dy, 0, half); runs.line(cx, dy, spanS, half); }
      runs.fill(out, x0, pitch, y, z, contains);
    },
    forward(out, x, y, z) {
      const rp = x, th = y / r0;
      if (!(rp >= a && rp <= b && th >= 0 && th <= span)) return false;
      out[0] = cx + rp * Math.cos(th); out[1] = cy + rp * Math.sin(th); out[2] = z;
      return true;
    },
    inverse(out, x, y, z) {
      const dx = x - cx, dy = y - cy;
      if (!inside(dx, dy)) return false;
      out[0] = Math.sqrt(dx * dx + dy * dy); out[1] = r0 * angleOf(dx, dy); out[2] = z;
      return true;
    },
    jacobianK(k, x, y) {
      const dx = x - cx, dy = y - cy, rp = Math.sqrt(dx * dx + dy * dy);
      const nx = dx / rp, ny = dy / rp, q = r0 / rp;
      k[0] = nx; k[1] = ny; k[2] = 0;
      k[3] = -q * ny; k[4] = q * nx; k[5] = 0;
      k[6] = 0; k[7] = 0; k[8] = 1;
    },
    sampleOuterBoundary(n) {
      const per = Math.max(4, Math.floor(n / 4));
      const parts = [circleBoundary(cx, cy, b, per, 0, span), circleBoundary(cx, cy, a * (1 + 2e-9), per, 0, span)];
      // the inner arc's outward normal points toward the centre
      const inner = parts[1];
      for (let s = 0; s < inner.xM.length; s++) { inner.normalX[s] = -inner.normalX[s]; inner.normalY[s] = -inner.normalY[s]; }
      if (span < 2 * Math.PI) {
        const inset = 1e-9 * b, c = Math.cos(span), s = Math.sin(span);
        parts.push(edgeBoundary(cx + a, cy, cx + b, cy, 0, -1, per, inset));
        parts.push(edgeBoundary(cx + b * c, cy + b * s, cx + a * c, cy + a * s, -s, c, per, inset));
      }
      return joinBoundaries(parts);
    },
  };
}
