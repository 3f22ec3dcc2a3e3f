/**
 * `quasi-conformal`: a rectangle in virtual space mapped onto a quadrilateral in physical space
 * whose sides may be any curves, by the Laplace solve of field/maps/solveQuadMap.ts (Li & Pendry,
 * Phys. Rev. Lett. 101, 203901 (2008)). The virtual coordinates are
 *   x = x₀ᵛ + Wᵛ·û(x′, y′),  y = y₀ᵛ + Hᵛ·v̂(x′, y′),
 * so K = diag(Wᵛ, Hᵛ)·∂(û, v̂)/∂(x′, y′). The map is conformal when Hᵛ/Wᵛ equals the physical
 * module M; otherwise every cell has principal stretches in the ratio max(a/M, M/a) (a = Hᵛ/Wᵛ) in
 * the continuum. With fit = "module" the virtual width becomes Hᵛ/M, centred on the rectangle.
 * The device region is the physical domain; `inverse` and `jacobianK` come from the same C¹
 * interpolant, `forward` searches the mesh by Newton's method.
 */
import { InputError } from "../../core/errors.js";
import type { QuasiConformalSpec } from "../transformSpec.js";
import type { Transform } from "./transform.js";
import { solveQuadMap } from "../maps/solveQuadMap.js";
import { mapEvaluator, mapCellStats, meshBoundarySamples, jacobianDifference } from "../maps/structuredMapEval.js";

const fmt = (v: number): string => String(Number(v.toPrecision(5)));

export function quasiConformal(spec: QuasiConformalSpec): Transform {
  const solved = solveQuadMap(spec);
  const module = Math.sqrt(solved.moduleLower * solved.moduleUpper);
  const [rx0, ry0] = spec.rectangle.minM, [rx1, ry1] = spec.rectangle.maxM;
  const height = ry1 - ry0;
  const width = spec.fit === "module" ? height / module : rx1 - rx0;
  const x0 = 0.5 * (rx0 + rx1) - 0.5 * width, y0 = ry0;
  const ev = mapEvaluator(solved);
  const stats = mapCellStats(solved, width, height);
  if (stats.folded) {
    const f = stats.folded;
    throw new InputError({
      where: "$.transform.sides",
      message: `the computed map folds in solver cell (${f.i}, ${f.j}) near (${fmt(f.xM)} m, ${fmt(f.yM)} m) (det K = ${fmt(f.det)}); expected gentler sides or more nodes`,
    });
  }
  // evidence: the same solve at half the resolution (an eighth of the work)
  const half = (n: number): number => Math.max(5, Math.floor((n - 1) / 2) + 1);
  const coarse = solveQuadMap({ ...spec, nodes: [half(spec.nodes[0]), half(spec.nodes[1])] });
  const jacobianErrorEstimate = jacobianDifference(solved, mapEvaluator(coarse), width, height) / 3;
  const b = stats.bounds;
  const o = new Float64Array(6);
  return {
    kind: "quasi-conformal",
    dimension: 2,
    bounds: { minX: b.minX, maxX: b.maxX, minY: b.minY, maxY: b.maxY, minZ: 0, maxZ: 0 },
    contains: (x, y) => ev.at(o, x, y),
    inverse(out, x, y, z) {
      if (!ev.at(o, x, y)) return false;
      out[0] = x0 + width * o[0]; out[1] = y0 + height * o[1]; out[2] = z;
      return true;
    },
    forward(out, x, y, z) {
      const uh = (x - x0) / width, vh = (y - y0) / height;
      if (!(uh >= -1e-12 && uh <= 1 + 1e-12 && vh >= -1e-12 && vh <= 1 + 1e-12)) return false;
      if (!ev.pointOf(out, Math.min(1, Math.max(0, uh)), Math.min(1, Math.max(0, vh)))) return false;
      out[2] = z;
      return true;
    },
    jacobianK(k, x, y) {
      if (!ev.at(o, x, y)) { k.fill(NaN); return; }
      k[0] = width * o[2]; k[1] = width * o[3]; k[2] = 0;
      k[3] = height * o[4]; k[4] = height * o[5]; k[5] = 0;
      k[6] = 0; k[7] = 0; k[8] = 1;
    },
    sampleOuterBoundary: (n) => meshBoundarySamples(solved.gx, solved.gy, n),
    computedMap: {
      conformalModule: module,
      conformalModuleBounds: [solved.moduleLower, solved.moduleUpper],
      virtualAspect: height / width,
      maxAnisotropy: stats.maxAnisotropy,
      meanAnisotropy: stats.meanAnisotropy,
      nodes: [spec.nodes[0], spec.nodes[1]],
      residual: solved.residual,
      jacobianErrorEstimate,
      virtualRectangle: { minM: [x0, y0], maxM: [x0 + width, y0 + height] },
    },
  };
}
