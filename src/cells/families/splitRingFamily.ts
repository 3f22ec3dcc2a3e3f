/**
 * Split-ring resonators as a cell family, one ring per cubic cell of pitch a, in two styles
 * (splitRing.ts): printed edge-coupled rings etched on boards (printedRing.ts; the default on a
 * laminate or other solid host and with PCB etching) and Pendry's stacked split cylinders (the
 * default in air). The family's fill is the area fraction πr²/a² of the inner ring radius r (rings
 * up to touching, F < π/4); the designed Lorentz strength F is reported by designCell. Rings set μ
 * along their axis; their electric response is neglected, so ε is the host's on both axes.
 * Smallest feature from the default sizing: strip width a/25 (the printed default without a
 * process, ours) and the wall between neighbouring rings a − 2(r + 3c) with the separation ≈ c;
 * designCell replaces these by the designed geometry.
 */
import type { CellFamily, FillResult } from "../cellFamily.js";

const MAX_FILL = Math.PI / 4;

export const splitRingFamily: CellFamily = {
  id: "split-ring",
  description: "split-ring resonators (printed edge-coupled rings or split cylinders), cubic lattice: μ ≠ 1 along the ring axis (resonant, Lorentz)",
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
    const c = pitchM / 25;
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
