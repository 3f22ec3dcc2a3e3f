/**
 * Computed-map designs at the edge: side and boundary curves are compiled (io/expressionMap.ts,
 * same whitelist as maps plus max/min), the solver grid gets its default from the pitch, and the
 * sides are checked as a quadrilateral before any solve, so every problem names its JSON path in
 * the design file.
 */
import { InputError } from "../../core/errors.js";
import type { ClosedCurve, LaplaceShellSpec, QuasiConformalSpec, SideCurve, SideName } from "../../field/transformSpec.js";
import { radiusFunction, shellCurveIssues } from "../../field/maps/shellCurves.js";
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

export interface ParsedLaplaceShell {
  kind: "laplace-shell";
  center: [number, number];
  inner: { r?: string; points?: [number, number][] };
  outer: { r?: string; points?: [number, number][] };
  innerScale: number;
  nodes?: [number, number];
  innerOffset?: number;
  cap?: number;
}

/**
 * Default shell grid: half a pitch around the outer curve's circumference and across the mean
 * thickness, within 32…1025 around and 9…201 across, coarsened until the band work (the seam
 * doubles the bandwidth) stays near 4·10⁸.
 */
export function defaultShellNodes(circumferenceM: number, thicknessM: number, pitchM: number): [number, number] {
  const h = pitchM / NODES_PER_PITCH;
  let nt = Math.min(1025, Math.max(32, Math.round(circumferenceM / h)));
  let nr = Math.min(201, Math.max(9, Math.round(thicknessM / h) + 1));
  while (nt * nr * (2 * nr) ** 2 > DEFAULT_WORK_LIMIT && (nt > 32 || nr > 9)) {
    nt = Math.max(32, Math.round(nt * 0.9)); nr = Math.max(9, Math.round(nr * 0.9));
  }
  return [nt, nr];
}

/** Compile the curves, check them, fill the default grid. Throws InputError naming the file and path. */
export async function resolveLaplaceShell(t: ParsedLaplaceShell, pitchM: number, file: string): Promise<LaplaceShellSpec> {
  const curve = async (c: ParsedLaplaceShell["inner"], name: string): Promise<ClosedCurve> =>
    c.points ? { kind: "points", pointsM: c.points } : { kind: "polar", text: c.r!, r: await compileCurveExpression(c.r!, "theta", `${file}: $.transform.${name}.r`) };
  const inner = await curve(t.inner, "inner"), outer = await curve(t.outer, "outer");
  const issues = shellCurveIssues(inner, outer, t.center);
  if (issues.length) throw new InputError(issues.map((i) => ({ where: `${file}: $.transform.${i.path}`, message: i.message })));
  const fi = radiusFunction(inner, t.center[0], t.center[1]), fo = radiusFunction(outer, t.center[0], t.center[1]);
  let circ = 0, thick = 0;
  const rays = 256;
  for (let k = 0; k < rays; k++) {
    const th = (2 * Math.PI * k) / rays;
    circ += (2 * Math.PI * fo(th)) / rays;
    thick += (fo(th) - fi(th)) / rays;
  }
  const spec: LaplaceShellSpec = {
    kind: "laplace-shell", center: t.center, inner, outer, innerScale: t.innerScale,
    nodes: t.nodes ?? defaultShellNodes(circ, thick, pitchM),
  };
  if (t.innerOffset !== undefined) spec.innerOffsetM = t.innerOffset;
  if (t.cap !== undefined) spec.cap = t.cap;
  return spec;
}
