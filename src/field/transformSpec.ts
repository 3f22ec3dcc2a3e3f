/**
 * Transform parameters as the field engine receives them: SI (metres, radians), already validated.
 * The design schema (io/design/transformSchema.ts) turns the user's JSON into these.
 */
import type { RegionSpec } from "./region.js";

/** Optional handling of a singular boundary, shared by the kinds that take it. */
export interface SingularityOptions {
  /** largest principal value allowed for ε' and μ'; larger ones are set to this value (cell counted as capped) */
  cap?: number;
}

export interface RadialCloakSpec extends SingularityOptions {
  kind: "radial-cloak";
  innerRadiusM: number;
  outerRadiusM: number;
  /** linear: r' = a + r(b−a)/b; quadratic: g(0)=a, g(b)=b, g'(b)=1 */
  profile: "linear" | "quadratic";
  center?: [number, number];
  /** cells whose centre is closer than this to the inner radius are evaluated at this distance */
  innerOffsetM?: number;
}

export interface ConcentratorSpec extends SingularityOptions {
  kind: "concentrator";
  /** R1: radius of the physical core */
  innerRadiusM: number;
  /** R2: the virtual radius squeezed into R1 */
  compressedRadiusM: number;
  /** R3: outer radius */
  outerRadiusM: number;
  center?: [number, number];
}

export interface RotatorSpec extends SingularityOptions {
  kind: "rotator";
  innerRadiusM: number;
  outerRadiusM: number;
  angleRad: number;
  center?: [number, number];
}

export interface BeamShifterSpec extends SingularityOptions {
  kind: "beam-shifter";
  /** along x, from x = 0 */
  lengthM: number;
  /** along y, centred on y = 0 */
  heightM: number;
  /** lateral shift at the exit face x = length */
  shiftM: number;
}

export interface BeamBendSpec extends SingularityOptions {
  kind: "beam-bend";
  innerRadiusM: number;
  outerRadiusM: number;
  /** sector angle, counter-clockwise from +x */
  angleRad: number;
  /** radius at which arc length equals the virtual length */
  referenceRadiusM: number;
  center?: [number, number];
}

export interface SphericalCloakSpec extends SingularityOptions {
  kind: "spherical-cloak";
  innerRadiusM: number;
  outerRadiusM: number;
  /** centre in the z = 0 plane */
  center?: [number, number];
  innerOffsetM?: number;
}

/**
 * A compiled expression map: writes [X, Y, ∂X/∂x, ∂X/∂y, ∂Y/∂x, ∂Y/∂y] at physical (x, y) into
 * out[0..5]. Built once at the edge (io/expressionMap.ts) from whitelisted mathjs nodes.
 */
export type CompiledMap = (out: Float64Array, xM: number, yM: number) => void;

export interface ExpressionSpec extends SingularityOptions {
  kind: "expression";
  /** virtual coordinates as expressions of the physical x, y (metres) */
  virtual: { x: string; y: string };
  region: RegionSpec;
  compiled: CompiledMap;
}

/**
 * One side of a computed quadrilateral map, in metres. `graph`: y = f(x) for bottom/top, x = f(y)
 * for left/right, over the virtual rectangle's span; `parametric`: (x(t), y(t)), t from 0 to 1
 * (bottom and top run left to right, left and right bottom to top); `points`: a polyline in that
 * direction; `straight`: the rectangle's own side. Functions are compiled at the edge
 * (io/curveExpression.ts); `text` keeps what the user wrote, for messages.
 */
export type SideCurve =
  | { kind: "straight" }
  | { kind: "graph"; text: string; f: (s: number) => number }
  | { kind: "parametric"; text: [string, string]; fx: (t: number) => number; fy: (t: number) => number }
  | { kind: "points"; pointsM: [number, number][] };

export type SideName = "bottom" | "right" | "top" | "left";

export interface QuasiConformalSpec extends SingularityOptions {
  kind: "quasi-conformal";
  /** the virtual rectangle as the user gave it; the physical domain is it with sides replaced */
  rectangle: { minM: [number, number]; maxM: [number, number] };
  /** "module": the virtual width is set so that its aspect equals the physical conformal module */
  fit: "none" | "module";
  sides: Record<SideName, SideCurve>;
  /** solver grid lines along bottom/top (nu) and along left/right (nv) */
  nodes: [number, number];
}

/** A closed curve around `center`: r(θ) (θ from +x, radians) or a point list. */
export type ClosedCurve =
  | { kind: "polar"; text: string; r: (thetaRad: number) => number }
  | { kind: "points"; pointsM: [number, number][] };

export interface LaplaceShellSpec extends SingularityOptions {
  kind: "laplace-shell";
  center: [number, number];
  inner: ClosedCurve;
  outer: ClosedCurve;
  /** virtual radius of the inner curve as a fraction of its physical radius: 0 for a cloak, > 1 for a concentrator */
  innerScale: number;
  /** solver grid lines around (nTheta) and across (nRadial) the shell */
  nodes: [number, number];
  innerOffsetM?: number;
}

export interface ImportedSpec {
  kind: "imported";
  /** absolute path of the CSV */
  file: string;
}

export type TransformSpec =
  | RadialCloakSpec
  | ConcentratorSpec
  | RotatorSpec
  | BeamShifterSpec
  | BeamBendSpec
  | SphericalCloakSpec
  | ExpressionSpec
  | QuasiConformalSpec
  | LaplaceShellSpec
  | ImportedSpec;

export type TransformKind = TransformSpec["kind"];

/** The part of a design the field engine reads (io's `Design` satisfies it). */
export interface FieldDesign {
  name: string;
  sourcePath: string;
  background: { eps: number; mu: number };
  transform: TransformSpec;
  grid: { pitchM: number; origin?: [number, number]; slice?: boolean };
}
