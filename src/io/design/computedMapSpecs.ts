/**
 * Computed-map designs at the edge: side and boundary curves are compiled (io/expressionMap.ts,
 * same whitelist as maps plus max/min), the solver grid gets its default from the pitch, and the
 * sides are checked as a quadrilateral before any solve, so every problem names its JSON path in
 * the design file.
 */
import { InputError } from "../../core/errors.js";
import type { QuasiConformalSpec, SideCurve, SideName } from "../../field/transformSpec.js";
import { quadSideIssues } from "../../field/maps/quadSides.js";
import { compileCurveExpression } from "../expressionMap.js";
import { QUAD_SIDE_NAMES } from "./transformSchema.js";

/** Solver grid lines per device cell pitch (two solver cells per device cell). */
export const NODES_PER_PITCH = 2;
/** Default grid lines along one direction are kept within these. */
export const DEFAULT_NODES_MIN = 17, DEFAULT_NODES_MAX = 401;
/** Default grids are coarsened until nu·nv·min(nu, nv)² (band factor work) is below this. */
export const DEFAULT_WORK_LIMIT = 4e8;

/**
 * Default solver grid for a domain of `widthM` × `heightM` at device pitch `pitchM`: spacing of
 * half a pitch, at least 17 and at most 401 lines a direction, coarsened evenly when the band
 * factorization would exceed about 4·10⁸ operations (a few seconds).
 * Example: defaultNodes(12e-6, 3e-6, 0.15e-6) → [161, 41]
 */
export function defaultNodes(widthM: number, heightM: number, pitchM: number): [number, number] {
  const h = pitchM / NODES_PER_PITCH;
  const clamp = (v: number): number => Math.min(DEFAULT_NODES_MAX, Math.max(DEFAULT_NODES_MIN, Math.round(v)));
  let nu = clamp(widthM / h + 1), nv = clamp(heightM / h + 1);
  while (nu * nv * Math.min(nu, nv) ** 2 > DEFAULT_WORK_LIMIT) {
    nu = Math.max(DEFAULT_NODES_MIN, Math.round(nu * 0.9)); nv = Math.max(DEFAULT_NODES_MIN, Math.round(nv * 0.9));
  }
  return [nu, nv];
}

type ParsedSide = { x?: string; y?: string; points?: [number, number][] } | undefined;

export interface ParsedQuasiConformal {
  kind: "quasi-conformal";
  virtual: { rectangle: { min: [number, number]; max: [number, number] }; fit: "none" | "module" };
  sides: Partial<Record<SideName, ParsedSide>>;
  nodes?: [number, number];
  cap?: number;
}

/** Compile the sides, fill the default grid, check the quadrilateral. Throws InputError naming the file and path. */
export async function resolveQuasiConformal(t: ParsedQuasiConformal, pitchM: number, file: string): Promise<QuasiConformalSpec> {
  const sides = {} as Record<SideName, SideCurve>;
  const where = (name: string, key?: string): string => `${file}: $.transform.sides.${name}${key ? `.${key}` : ""}`;
  for (const name of QUAD_SIDE_NAMES) {
    const s = t.sides[name];
    const horizontal = name === "bottom" || name === "top";
    if (!s) sides[name] = { kind: "straight" };
    else if (s.points) sides[name] = { kind: "points", pointsM: s.points };
    else if (s.x !== undefined && s.y !== undefined) {
      sides[name] = {
        kind: "parametric", text: [s.x, s.y],
        fx: await compileCurveExpression(s.x, "t", where(name, "x")),
        fy: await compileCurveExpression(s.y, "t", where(name, "y")),
      };
    } else {
      const text = horizontal ? s.y! : s.x!;
      sides[name] = { kind: "graph", text, f: await compileCurveExpression(text, horizontal ? "x" : "y", where(name, horizontal ? "y" : "x")) };
    }
  }
  const [x0, y0] = t.virtual.rectangle.min, [x1, y1] = t.virtual.rectangle.max;
  const spec: QuasiConformalSpec = {
    kind: "quasi-conformal",
    rectangle: { minM: [x0, y0], maxM: [x1, y1] },
    fit: t.virtual.fit,
    sides,
    nodes: t.nodes ?? defaultNodes(x1 - x0, y1 - y0, pitchM),
  };
  if (t.cap !== undefined) spec.cap = t.cap;
  const issues = quadSideIssues(spec);
  if (issues.length) throw new InputError(issues.map((i) => ({ where: `${file}: $.transform.${i.path}`, message: i.message })));
  return spec;
}
