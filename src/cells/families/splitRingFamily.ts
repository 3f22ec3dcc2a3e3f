/**
 * Split-ring resonators as a cell family: double split rings of inner radius r in a cubic cell of
 * pitch a; the fill is Pendry's F = πr²/a² (rings up to touching, F < π/4). Rings set μ along their
 * axis (splitRing.ts, used by designCell); their electric response is neglected, so ε is the
 * host's on both axes. Smallest feature from the default sizing: ring width a/20 (ours) and the
 * wall between neighbouring rings a − 2(r + 3c) with the inter-ring gap taken ≈ c; designCell
 * replaces these by the designed geometry.
 */
import type { CellFamily, FillResult } from "../cellFamily.js";

const MAX_FILL = Math.PI / 4;

export const splitRingFamily: CellFamily = {
  id: "split-ring",
  description: "double split-ring resonators, cubic lattice: μ ≠ 1 along the ring axis (resonant, Lorentz)",
  resonant: true,
  lattices: ["cubic"],
  dimension: 3,
  isotropic: false,
  defaultAxis: "parallel",
  fabricatedPhase: "inclusion",
  fillRange: () => [0, MAX_FILL],
  dimensionsFromFill: (fill, pitchM) => ({ ringRadiusM: pitchM * Math.sqrt(fill / Math.PI) }),
  fillFromDimensions: (dims, pitchM) => (Math.PI * dims.ringRadiusM ** 2) / (pitchM * pitchM),
  smallestFeatureM(fill, pitchM) {
    const c = pitchM / 20;
    const r = pitchM * Math.sqrt(fill / Math.PI);
    return { featureM: c, gapM: Math.max(0, pitchM - 2 * (r + 3 * c)) };
  },
  effectivePermittivity(host) {
    return { parallel: host, perpendicular: host, rules: { parallel: "host", perpendicular: "host" } };
  },
  fillForTarget(): FillResult {
    return { fill: NaN, achieved: { re: NaN, im: NaN }, converged: false, iterations: 0, ruleFill: NaN, inRange: false, reason: "split rings set μ, not ε; give a μ target" };
  },
};
