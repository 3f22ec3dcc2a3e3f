/**
 * Nested-dissection ordering of a structured nx × ny grid with nine-point connectivity, and the
 * symbolic phase of a multifrontal LDLᵀ factorization over it (George, "Nested dissection of a
 * regular finite element mesh", SIAM J. Numer. Anal. 10, 345 (1973); Liu, "The multifrontal method
 * for sparse matrix solution: theory and practice", SIAM Review 34, 82 (1992)).
 *
 * Ordering: a rectangle of nodes is cut by one grid line across its longer side (the middle
 * column or row); with the nine-point stencil a single line separates the two halves (nodes two
 * columns apart are not coupled). Both halves are ordered first, recursively, then the line. A
 * rectangle of at most LEAF_NODES nodes is not cut: all its nodes form one front. Node id
 * v = i + nx·j (the verify grid's numbering).
 *
 * Fronts: every rectangle (cut or leaf) gives one front whose pivots are its separator nodes (a
 * contiguous range of new indices) and whose boundary is the ring of nodes just outside the
 * rectangle (inside the grid): those are separators of the enclosing rectangles, eliminated later,
 * and the only nodes the rectangle's nodes are coupled to. The ring is the structural boundary of
 * the nine-point pattern; couplings that happen to be zero (no cross term) cost some work, never a
 * wrong answer. Fronts come in post-order: each front's children are the fronts just before its
 * subtree's end, and each non-root front passes one update matrix to its parent (a stack).
 *
 * Cost (this file): the recursion visits O(n / LEAF_NODES) rectangles; boundary index lists total
 * O(n) entries. The symbolic figures (factor entries, work, peak memory) are exact counts for the
 * factorization of multifrontalLdlt.ts, computed before anything numeric is allocated. For a square
 * grid of n nodes they grow like n log n (factor entries) and n^1.5 (work), George's bounds;
 * tests/numerics measure the growth on a ladder of sizes.
 */
import { ProgrammerError } from "../core/errors.js";

/** Rectangles with at most this many nodes are one front (not cut further). */
export const LEAF_NODES = 16;

/** The ordering and front tree of a grid. */
export interface GridOrdering {
  nx: number;
  ny: number;
  /** number of unknowns nx·ny */
  n: number;
  /** new index → node id */
  perm: Int32Array;
  /** node id → new index */
  iperm: Int32Array;
  /** number of fronts (post-order) */
  fronts: number;
  /** first new index of each front's pivots */
  sepStart: Int32Array;
  /** number of pivots of each front */
  sepSize: Int32Array;
  /** number of boundary (later) unknowns of each front */
  boundSize: Int32Array;
  /** boundary lists: front f's boundary new indices, ascending, at boundPtr[f] … boundPtr[f+1]−1 */
  boundPtr: Int32Array;
  bound: Int32Array;
  /** number of child fronts (their updates are the top entries of the update stack) */
  children: Int32Array;
  /** offset of each front's packed factor columns (entries), length fronts + 1 */
  factorPtr: Float64Array;
  /** offset of each front's update matrix on the update stack (entries) */
  stackPtr: Float64Array;
  cost: SymbolicCost;
}

/** Exact sizes of the multifrontal factorization of a grid (complex entries; bytes for re + im). */
export interface SymbolicCost {
  unknowns: number;
  fronts: number;
  /** entries of the packed factor (L and D) */
  factorEntries: number;
  /** complex multiply-adds of the numeric factorization (partial eliminations of all fronts) */
  work: number;
  /** largest front order */
  largestFront: number;
  /** largest number of update-stack entries alive at once */
  peakStackEntries: number;
  /** bytes of the factor, the largest dense front and the peak update stack (16 bytes per entry) */
  factorBytes: number;
  workspaceBytes: number;
}

interface Rect { i0: number; i1: number; j0: number; j1: number }

/** Number of ring nodes of [i0,i1) × [j0,j1) inside the nx × ny grid. */
function ringCount(nx: number, ny: number, r: Rect): number {
  const a0 = Math.max(0, r.i0 - 1), a1 = Math.min(nx, r.i1 + 1);
  const b0 = Math.max(0, r.j0 - 1), b1 = Math.min(ny, r.j1 + 1);
  return (a1 - a0) * (b1 - b0) - (r.i1 - r.i0) * (r.j1 - r.j0);
}

/** Complex multiply-adds of eliminating s pivots from a dense symmetric front of order nf. */
export function frontWork(s: number, nf: number): number {
  // pivot k: scale nf−k−1 entries and update the lower triangle of order nf−k−1
  let w = 0;
  for (let k = 0; k < s; k++) { const m = nf - k - 1; w += m + (m * (m + 1)) / 2; }
  return w;
}

/** Packed entries of s factor columns of a front of order nf (column k holds rows k … nf−1). */
export const frontFactorEntries = (s: number, nf: number): number => s * nf - (s * (s - 1)) / 2;

/** Packed entries of the update matrix (lower triangle) of order b. */
export const updateEntries = (b: number): number => (b * (b + 1)) / 2;

/**
 * Walk the dissection in post-order, calling visit(rect, sepRect, childCount) per front; sepRect
 * is the separator (a line, or the whole rectangle for a leaf).
 */
function dissect(nx: number, ny: number, visit: (r: Rect, sep: Rect, children: number) => void): void {
  const walk = (r: Rect): boolean => {
    const w = r.i1 - r.i0, h = r.j1 - r.j0;
    if (w <= 0 || h <= 0) return false;
    if (w * h <= LEAF_NODES) { visit(r, r, 0); return true; }
    let children = 0;
    let sep: Rect;
    if (w >= h) {
      const m = r.i0 + (w >> 1);
      if (walk({ i0: r.i0, i1: m, j0: r.j0, j1: r.j1 })) children++;
      if (walk({ i0: m + 1, i1: r.i1, j0: r.j0, j1: r.j1 })) children++;
      sep = { i0: m, i1: m + 1, j0: r.j0, j1: r.j1 };
    } else {
      const m = r.j0 + (h >> 1);
      if (walk({ i0: r.i0, i1: r.i1, j0: r.j0, j1: m })) children++;
      if (walk({ i0: r.i0, i1: r.i1, j0: m + 1, j1: r.j1 })) children++;
      sep = { i0: r.i0, i1: r.i1, j0: m, j1: m + 1 };
    }
    visit(r, sep, children);
    return true;
  };
  walk({ i0: 0, i1: nx, j0: 0, j1: ny });
}

function checkGrid(nx: number, ny: number): void {
  if (!(Number.isInteger(nx) && Number.isInteger(ny) && nx >= 1 && ny >= 1 && nx * ny < 2 ** 31)) {
    throw new ProgrammerError(`grid ordering: expected positive integer sizes with nx·ny < 2^31, got ${nx} × ${ny}`);
  }
}

/**
 * The symbolic cost of factoring an nx × ny grid, without building the ordering (arithmetic only,
 * O(nx·ny / LEAF_NODES) steps): for refusing a grid before allocating it.
 */
export function gridFactorCost(nx: number, ny: number): SymbolicCost {
  checkGrid(nx, ny);
  let fronts = 0, factorEntries = 0, work = 0, largest = 0, sp = 0, peak = 0;
  const pending: number[] = []; // update sizes on the stack
  dissect(nx, ny, (r, sep, children) => {
    const s = (sep.i1 - sep.i0) * (sep.j1 - sep.j0);
    const b = ringCount(nx, ny, r);
    const nf = s + b;
    for (let c = 0; c < children; c++) sp -= pending.pop()!;
    factorEntries += frontFactorEntries(s, nf);
    work += frontWork(s, nf);
    largest = Math.max(largest, nf);
    const u = updateEntries(b);
    pending.push(u); sp += u;
    peak = Math.max(peak, sp);
    fronts++;
  });
  return costOf(nx * ny, fronts, factorEntries, work, largest, peak);
}

function costOf(n: number, fronts: number, factorEntries: number, work: number, largest: number, peak: number): SymbolicCost {
  return {
    unknowns: n, fronts, factorEntries, work, largestFront: largest, peakStackEntries: peak,
    factorBytes: 16 * factorEntries,
    workspaceBytes: 16 * (largest * largest + peak),
  };
}

/** Build the ordering and front tree of an nx × ny grid (see file comment). */
export function gridOrdering(nx: number, ny: number): GridOrdering {
  checkGrid(nx, ny);
  const n = nx * ny;
  const perm = new Int32Array(n), iperm = new Int32Array(n);
  const rects: Rect[] = [], seps: Rect[] = [], kids: number[] = [];
  let next = 0;
  dissect(nx, ny, (r, sep, children) => {
    for (let j = sep.j0; j < sep.j1; j++) {
      for (let i = sep.i0; i < sep.i1; i++) { const v = i + nx * j; perm[next] = v; iperm[v] = next; next++; }
    }
    rects.push(r); seps.push(sep); kids.push(children);
  });
  if (next !== n) throw new ProgrammerError(`grid ordering numbered ${next} of ${n} nodes`);
  const fronts = rects.length;
  const sepStart = new Int32Array(fronts), sepSize = new Int32Array(fronts), boundSize = new Int32Array(fronts);
  const boundPtr = new Int32Array(fronts + 1), children = Int32Array.from(kids);
  let start = 0;
  for (let f = 0; f < fronts; f++) {
    const sp = seps[f];
    sepStart[f] = start;
    sepSize[f] = (sp.i1 - sp.i0) * (sp.j1 - sp.j0);
    start += sepSize[f];
    boundSize[f] = ringCount(nx, ny, rects[f]);
    boundPtr[f + 1] = boundPtr[f] + boundSize[f];
  }
  const bound = new Int32Array(boundPtr[fronts]);
  for (let f = 0; f < fronts; f++) {
    const r = rects[f];
    let o = boundPtr[f];
    for (let j = Math.max(0, r.j0 - 1); j < Math.min(ny, r.j1 + 1); j++) {
      for (let i = Math.max(0, r.i0 - 1); i < Math.min(nx, r.i1 + 1); i++) {
        if (i >= r.i0 && i < r.i1 && j >= r.j0 && j < r.j1) continue;
        bound[o++] = iperm[i + nx * j];
      }
    }
    bound.subarray(boundPtr[f], o).sort();
    if (bound[boundPtr[f]] < sepStart[f] + sepSize[f] && boundSize[f] > 0) throw new ProgrammerError("grid ordering: a boundary unknown is eliminated before its front");
  }
  // factor offsets and the update stack, in the order the numeric phase uses them
  const factorPtr = new Float64Array(fronts + 1), stackPtr = new Float64Array(fronts);
  let work = 0, largest = 0, sp = 0, peak = 0;
  const pending: number[] = [];
  for (let f = 0; f < fronts; f++) {
    const s = sepSize[f], b = boundSize[f], nf = s + b;
    for (let c = 0; c < children[f]; c++) sp -= pending.pop()!;
    factorPtr[f + 1] = factorPtr[f] + frontFactorEntries(s, nf);
    work += frontWork(s, nf);
    largest = Math.max(largest, nf);
    stackPtr[f] = sp;
    const u = updateEntries(b);
    pending.push(u); sp += u;
    peak = Math.max(peak, sp);
  }
  return {
    nx, ny, n, perm, iperm, fronts, sepStart, sepSize, boundSize, boundPtr, bound, children, factorPtr, stackPtr,
    cost: costOf(n, fronts, factorPtr[fronts], work, largest, peak),
  };
}
