/**
 * Solved in-plane tensor of circles (rods or holes) on a rectangular lattice, spacing a along x and
 * b = R·a along y (aspect R = b/a): ε_xx ≠ ε_yy. No shipped table (one would need a third axis, R,
 * and the square table alone took 17 min to build): instead a small table in the fill is solved on
 * first use for each (contrast u, aspect R) a caller asks for and kept in a bounded cache. A plan
 * asks for a few material pairs and aspects, so it pays a few such tables, never a grid of them.
 *
 * Each node is the cell problem (cellProblem.ts) on the ladder n, 2n, 4n cells across the shorter
 * spacing (n = 16 for contrasts 10^±1.5 while the gap between neighbours spans at least 7 cells of
 * the finest grid; else 32, the ladder of the shipped tables), Richardson-extrapolated like
 * homogenizeCell.ts. The derivative ∂F/∂u comes from the same
 * solves (the discrete energy's derivative, cellProblem.ts `energyDerivative`), for the first-order
 * loss term of lossy phases exactly as homogenizationTable.ts does for square and hex.
 * Nodes: RECT_TABLE_NODES radii spaced evenly up to the largest the finest grid resolves (gap ≥ 7
 * cells of 4n = 128 across the shorter spacing: r ≤ 0.4727·min(a, b)); natural cubic splines in the
 * fill between them.
 *
 * Cost (measured on the shared 2-core machine): about 0.1 s a node for R ≤ 2 at n = 16, 1 s at
 * n = 32; a table of RECT_TABLE_NODES nodes 1.0–2.8 s for R = 1.5…3 with the n = 16 ladder and
 * 7.5–20 s with the n = 32 ladder (contrast 50) on a lightly loaded machine, several times that
 * beside a test suite (`npm run bench`, rectTableBench.ts).
 * Error: the ladder's own estimate, floored by an envelope calibrated on the aspect-1 cell against
 * the shipped square table (itself calibrated on Perrins et al. 1979; tests/cells/homogenize/
 * rectCircleTable.test.ts measures the worst deviation per contrast). Measured: aspect 1 within
 * 6e-4…8e-4 of Perrins' closed form at f = 0.5 (contrast 10 and 0.1); Keller's theorem per
 * component holds to 3.6e-4; the n = 16 ladder agrees with homogenizeCell's n = 32 ladder to
 * 1.6e-3 at aspect 2. Between nodes the spline differs from direct solves by up to 2.7e-3 (holes in
 * ε 8, aspect 2, fill 0.33 near the top of the table) — mostly the direct solves' own fill-to-fill
 * jitter of the same size as their ladder estimate — inside the table's stated error (3.3e-3 there).
 */
import { ProgrammerError } from "../../core/errors.js";
import { cellFaces, cellWorkspace, solveCellProblem } from "./cellProblem.js";
import { circleCell } from "./cellShape.js";
import { naturalSplineAt, naturalSplineMoments } from "../../numerics/naturalCubicSpline.js";

/** Radii (in units of the shorter spacing) of the table nodes: 0 … RECT_MAX_RADIUS. */
export const RECT_TABLE_NODES = 12;
/** Largest radius over the shorter spacing the finest grid resolves (gap ≥ 7 cells of 128). */
export const RECT_MAX_RADIUS = 0.5 - 3.5 / 128;
/** Aspects the solver takes (b/a); beyond them the cell is a grating, not a lattice of circles. */
export const RECT_ASPECT_RANGE: readonly [number, number] = [0.25, 4];

/**
 * Error envelope in the contrast u. n = 16 (|log10 u| ≤ 1.5): calibrated on aspect 1 against the
 * shipped square table (worst deviation measured over fills 0.1…0.6: 9.5e-4 at |log10 u| = 0.5,
 * 2.7e-3 at 1, 3.1e-3 at 1.25, 3.6e-3 at 1.5; the test holds it). n = 32 (beyond): the square table's own envelope
 * (homogenizationTable.ts, calibrated on Perrins et al. 1979), the same ladder.
 */
export const rectErrorEnvelope = (u: number): number => (Math.abs(Math.log10(u)) <= 1.5 ? 5e-4 + 3e-3 * Math.log10(u) ** 2 : 1e-4 + 8e-4 * Math.log10(u) ** 2);

export interface RectNode {
  /** F = ε_eff/ε_host along x and y (real contrast u) */
  xx: number;
  yy: number;
  /** ∂F/∂u along x and y */
  dxx: number;
  dyy: number;
  /** ladder estimate of the relative error (largest component) */
  ladderError: number;
  /** finest grid across the shorter spacing */
  finestCells: number;
  converged: boolean;
}

const pow2Round = (x: number): number => 2 ** Math.max(0, Math.round(Math.log2(x)));

/** Largest circle fill a rect cell of aspect R can be solved at (resolved gap). */
export function rectMaxSolvedFill(aspect: number): number {
  const s = Math.min(1, aspect);
  const r = RECT_MAX_RADIUS * s;
  return (Math.PI * r * r) / aspect;
}

/**
 * Solve one node: circles of fill `fill` on a rect lattice of aspect R, inclusion/host contrast u
 * (real > 0). The computation runs with the longer spacing along y (aspect ≥ 1) and swaps back.
 * Example: rectCircleNode(10, 0.5, 1).xx ≈ 2.4155 (Perrins et al. 1979, square array).
 */
export function rectCircleNode(u: number, fill: number, aspect: number): RectNode {
  if (!(u > 0) || !Number.isFinite(u)) throw new ProgrammerError(`rectCircleNode: contrast must be real and > 0, got ${u}`);
  if (!(aspect >= RECT_ASPECT_RANGE[0] && aspect <= RECT_ASPECT_RANGE[1])) throw new ProgrammerError(`rectCircleNode: aspect ${aspect} outside ${RECT_ASPECT_RANGE.join("…")}`);
  const swap = aspect < 1;
  const R = swap ? 1 / aspect : aspect;
  // fill of the same circles in the swapped cell (the same cell turned by 90°): unchanged
  if (fill <= 0) return { xx: 1, yy: 1, dxx: 0, dyy: 0, ladderError: 0, finestCells: 0, converged: true };
  const shape = circleCell("rect", fill, R);
  const r = Math.sqrt((fill * R) / Math.PI);
  if (r > RECT_MAX_RADIUS + 1e-12) throw new ProgrammerError(`rectCircleNode: fill ${fill} leaves a gap below 7 cells of the finest grid (aspect ${aspect})`);
  const gap = 1 - 2 * r;
  const n0 = gap >= 7 / 64 && Math.abs(Math.log10(u)) <= 1.5 ? 16 : 32;
  const ladder: { xx: number; yy: number; dxx: number; dyy: number; ok: boolean }[] = [];
  for (const n of [n0, 2 * n0, 4 * n0]) {
    const nx = n, ny = pow2Round(n * R);
    const faces = cellFaces(shape, nx, ny);
    const w = cellWorkspace(nx, ny, faces.hx, faces.hy);
    const sx = solveCellProblem(faces, w, 1, u, 1, 0);
    const sy = solveCellProblem(faces, w, 1, u, 0, 1);
    ladder.push({ xx: sx.fluxX, yy: sy.fluxY, dxx: sx.energyDerivative, dyy: sy.energyDerivative, ok: sx.converged && sy.converged });
  }
  const [a, b, c] = ladder;
  const rich = (k: "xx" | "yy" | "dxx" | "dyy", p: typeof a, q: typeof a) => 2 * q[k] - p[k];
  const xx = rich("xx", b, c), yy = rich("yy", b, c);
  const scale = Math.max(Math.abs(xx), Math.abs(yy));
  const err = Math.max(Math.abs(xx - rich("xx", a, b)), Math.abs(yy - rich("yy", a, b))) / scale;
  const out = { xx, yy, dxx: rich("dxx", b, c), dyy: rich("dyy", b, c) };
  const res = swap ? { xx: out.yy, yy: out.xx, dxx: out.dyy, dyy: out.dxx } : out;
  return { ...res, ladderError: err, finestCells: 4 * n0, converged: ladder.every((s) => s.ok) };
}

export interface RectTable {
  u: number;
  aspect: number;
  fills: number[];
  nodes: RectNode[];
  maxFill: number;
  /** worst node error (ladder, floored by the envelope) */
  error: number;
  converged: boolean;
  m2: { xx: Float64Array; yy: Float64Array; dxx: Float64Array; dyy: Float64Array };
}

/** Build the fill table of (u, aspect) (RECT_TABLE_NODES solves; see the module comment for the cost). */
export function buildRectTable(u: number, aspect: number): RectTable {
  const s = Math.min(1, aspect);
  const fills: number[] = [];
  const nodes: RectNode[] = [];
  for (let k = 0; k < RECT_TABLE_NODES; k++) {
    const r = (RECT_MAX_RADIUS * s * k) / (RECT_TABLE_NODES - 1);
    const f = (Math.PI * r * r) / aspect;
    fills.push(f);
    nodes.push(rectCircleNode(u, f, aspect));
  }
  const col = (k: keyof Pick<RectNode, "xx" | "yy" | "dxx" | "dyy">) => nodes.map((n) => n[k]);
  return {
    u, aspect, fills, nodes, maxFill: fills[fills.length - 1],
    error: Math.max(rectErrorEnvelope(u), ...nodes.map((n) => n.ladderError)),
    converged: nodes.every((n) => n.converged),
    m2: { xx: naturalSplineMoments(fills, col("xx")), yy: naturalSplineMoments(fills, col("yy")), dxx: naturalSplineMoments(fills, col("dxx")), dyy: naturalSplineMoments(fills, col("dyy")) },
  };
}

// Bounded cache of solved tables, keyed by contrast and aspect (pure: same inputs, same table).
const CACHE_LIMIT = 48;
const cache = new Map<string, RectTable>();

/**
 * The table of (u, aspect), solved on first use. Aspects below 1 are the same cell turned by 90°:
 * they share the table of 1/aspect (rectCircleValue swaps x and y), so R and 1/R cost one table.
 */
export function rectTable(u: number, aspect: number): RectTable {
  if (aspect < 1) aspect = 1 / aspect;
  const key = `${u}|${aspect}`;
  let t = cache.get(key);
  if (!t) {
    t = buildRectTable(u, aspect);
    if (cache.size >= CACHE_LIMIT) cache.delete(cache.keys().next().value as string);
    cache.set(key, t);
  }
  return t;
}

/** True when the table of (u, aspect) is already solved (no cost to ask). */
export const rectTableReady = (u: number, aspect: number): boolean => aspect === 1 || cache.has(`${u}|${aspect < 1 ? 1 / aspect : aspect}`);

export interface RectValue {
  xx: number;
  yy: number;
  dxx: number;
  dyy: number;
  error: number;
  inTable: boolean;
}

/** F and ∂F/∂u along x and y at `fill` from the (u, aspect) table. */
export function rectCircleValue(u: number, aspect: number, fill: number): RectValue {
  const t = rectTable(u, aspect);
  const swap = aspect < 1;
  const inTable = fill >= 0 && fill <= t.maxFill + 1e-12;
  const f = Math.min(t.maxFill, Math.max(0, fill));
  const col = (k: "xx" | "yy" | "dxx" | "dyy") => t.nodes.map((n) => n[k]);
  const xx = naturalSplineAt(t.fills, col("xx"), t.m2.xx, f), yy = naturalSplineAt(t.fills, col("yy"), t.m2.yy, f);
  const dxx = naturalSplineAt(t.fills, col("dxx"), t.m2.dxx, f), dyy = naturalSplineAt(t.fills, col("dyy"), t.m2.dyy, f);
  return swap ? { xx: yy, yy: xx, dxx: dyy, dyy: dxx, error: t.error, inTable } : { xx, yy, dxx, dyy, error: t.error, inTable };
}
