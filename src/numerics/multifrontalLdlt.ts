/**
 * Multifrontal LDLᵀ factorization of a sparse complex symmetric matrix over a nested-dissection
 * front tree (gridNestedDissection.ts), and the triangular solves with it. Kernels: they trust
 * their input (sparseLdltSolve.ts is the checking wrapper).
 *
 * Method (Duff & Reid, ACM TOMS 9, 302 (1983); Liu, SIAM Review 34, 82 (1992)): fronts in
 * post-order; each front is a dense symmetric matrix over its pivots and its boundary, assembled
 * from the matrix entries of its pivot columns plus its children's update matrices (extend-add);
 * the pivots are eliminated (A = L D Lᵀ without pivoting, Golub & Van Loan, "Matrix Computations",
 * 4th ed., 2013, §4.1.2; for complex symmetric matrices with the plain transpose), the pivot
 * columns are kept as the factor, and the Schur complement over the boundary goes to the parent.
 * The dense elimination is right-looking in panels of four pivots so the trailing update streams
 * four factor columns at once (fewer loads per multiply-add than a rank-one update).
 *
 * No pivoting: the FDFD operator with a PML is complex symmetric with a complex-shifted spectrum
 * and factors stably in practice in the natural orders; a pivot with |d| ≤ 1e-14 · max|A_vv| stops
 * the factorization and is reported as a non-answer (`ok: false`), never divided by.
 *
 * Cost: the work and entries are exactly SymbolicCost.work and .factorEntries of the ordering
 * (n^1.5 and n log n for a square grid of n nodes). Memory: 16 bytes per factor entry, plus one
 * dense front of the largest order and the peak update stack (SymbolicCost.workspaceBytes), plus an
 * Int32Array of n positions.
 */
import type { GridOrdering } from "./gridNestedDissection.js";
import type { SparseSymmetricMatrix } from "./sparseSymmetricMatrix.js";

export interface LdltFactor {
  ordering: GridOrdering;
  /** packed factor columns per front (column k of front f: rows k … nf−1, the first is D_k) */
  re: Float64Array;
  im: Float64Array;
}

export type FactorResult =
  | { ok: true; factor: LdltFactor; pivotRatio: number }
  | { ok: false; reason: string; badUnknown: number; pivotRatio: number };

/** Relative size below which a pivot counts as zero. */
export const TINY_PIVOT = 1e-14;

/**
 * Factor `a` (n = ordering.n) over `ordering`. `onProgress(fraction of work)` is called about a
 * hundred times. A tiny pivot returns ok: false with the node id (matrix column) where it fell.
 */
export function factorMultifrontal(a: SparseSymmetricMatrix, ord: GridOrdering, onProgress?: (fraction: number) => void): FactorResult {
  const { n, iperm, perm, fronts, sepStart, sepSize, boundSize, boundPtr, bound, children, factorPtr, stackPtr, cost } = ord;
  const { colPtr, rowIdx } = a;
  const aRe = a.re, aIm = a.im;
  let dMax = 0;
  for (let v = 0; v < n; v++) for (let e = colPtr[v]; e < colPtr[v + 1]; e++) if (rowIdx[e] === v) dMax = Math.max(dMax, Math.hypot(aRe[e], aIm[e]));
  const tiny = TINY_PIVOT * (dMax || 1);
  if (!(cost.factorEntries < 2 ** 31 && cost.largestFront ** 2 < 2 ** 31)) {
    return { ok: false, reason: `the factor would have ${cost.factorEntries.toExponential(2)} entries, beyond this solver's 2^31 index range`, badUnknown: -1, pivotRatio: 0 };
  }
  const lRe = new Float64Array(cost.factorEntries), lIm = new Float64Array(cost.factorEntries);
  const nfMax = cost.largestFront;
  const fRe = new Float64Array(nfMax * nfMax), fIm = new Float64Array(nfMax * nfMax);
  const sRe = new Float64Array(cost.peakStackEntries), sIm = new Float64Array(cost.peakStackEntries);
  const pos = new Int32Array(n);
  const stackFronts = new Int32Array(fronts); // front ids whose updates are on the stack
  let stackTop = 0;
  let pMin = Infinity;
  const progressStep = cost.work / 100;
  let done = 0, nextReport = progressStep;

  for (let f = 0; f < fronts; f++) {
    const s = sepSize[f], b = boundSize[f], nf = s + b, p0 = sepStart[f], bp = boundPtr[f];
    for (let k = 0; k < s; k++) pos[p0 + k] = k;
    for (let t = 0; t < b; t++) pos[bound[bp + t]] = s + t;
    // zero the lower triangle of the front (column-major, leading dimension nf)
    for (let c = 0; c < nf; c++) for (let x = c * nf + c, end = c * nf + nf; x < end; x++) { fRe[x] = 0; fIm[x] = 0; }
    // matrix entries of the pivot columns (rows eliminated no earlier than the pivot)
    for (let k = 0; k < s; k++) {
      const v = perm[p0 + k], o = k * nf;
      for (let e = colPtr[v]; e < colPtr[v + 1]; e++) {
        const q = iperm[rowIdx[e]];
        if (q < p0 + k) continue;
        const r = pos[q];
        fRe[o + r] += aRe[e]; fIm[o + r] += aIm[e];
      }
    }
    // extend-add the children's updates (the top of the stack)
    for (let c = 0; c < children[f]; c++) {
      const g = stackFronts[--stackTop];
      const bg = boundSize[g], gp = boundPtr[g];
      let u = stackPtr[g] | 0;
      for (let cc = 0; cc < bg; cc++) {
        const col = pos[bound[gp + cc]] * nf;
        for (let rr = cc; rr < bg; rr++, u++) {
          const x = col + pos[bound[gp + rr]];
          fRe[x] += sRe[u]; fIm[x] += sIm[u];
        }
      }
    }
    // eliminate the s pivots
    const bad = partialLdlt(fRe, fIm, nf, s, tiny);
    for (let k = 0; k < (bad < 0 ? s : bad); k++) pMin = Math.min(pMin, Math.hypot(fRe[k * nf + k], fIm[k * nf + k]));
    if (bad >= 0) {
      const d = Math.hypot(fRe[bad * nf + bad], fIm[bad * nf + bad]);
      return { ok: false, reason: `zero pivot (|d| = ${d.toExponential(2)}, max |diagonal| ${dMax.toExponential(2)}) at unknown ${perm[p0 + bad]}`, badUnknown: perm[p0 + bad], pivotRatio: d / (dMax || 1) };
    }
    // keep the pivot columns
    let o = factorPtr[f] | 0;
    for (let k = 0; k < s; k++) {
      const src = k * nf;
      for (let i = k; i < nf; i++, o++) { lRe[o] = fRe[src + i]; lIm[o] = fIm[src + i]; }
    }
    // push the update (lower triangle of the boundary block)
    if (f < fronts - 1) {
      let u = stackPtr[f] | 0;
      for (let c = 0; c < b; c++) {
        const src = (s + c) * nf + s;
        for (let i = c; i < b; i++, u++) { sRe[u] = fRe[src + i]; sIm[u] = fIm[src + i]; }
      }
      stackFronts[stackTop++] = f;
    }
    if (onProgress) {
      for (let k = 0; k < s; k++) { const m = nf - k - 1; done += m + (m * (m + 1)) / 2; }
      if (done >= nextReport) { onProgress(Math.min(1, done / (cost.work || 1))); nextReport = done + progressStep; }
    }
  }
  onProgress?.(1);
  return { ok: true, factor: { ordering: ord, re: lRe, im: lIm }, pivotRatio: n ? pMin / (dMax || 1) : 1 };
}

/**
 * Eliminate the first s pivots of the dense symmetric front F (order nf, column-major, lower
 * triangle). Afterwards columns 0 … s−1 hold L below the diagonal and D on it, and the trailing
 * block holds the Schur complement. Returns −1, or the local index of a pivot with |d| ≤ tiny.
 */
export function partialLdlt(fRe: Float64Array, fIm: Float64Array, nf: number, s: number, tiny: number): number {
  for (let kb = 0; kb < s; kb += 4) {
    const ke = Math.min(kb + 4, s);
    // the panel: unblocked elimination restricted to the panel's columns
    for (let k = kb; k < ke; k++) {
      const ok = k * nf;
      const dr = fRe[ok + k], di = fIm[ok + k];
      if (!(Math.hypot(dr, di) > tiny)) return k;
      const d2 = dr * dr + di * di, idr = dr / d2, idi = -di / d2;
      // update the panel columns j ∈ (k, ke) with the unscaled column w = F[:, k]
      for (let j = k + 1; j < ke; j++) {
        const wr = fRe[ok + j], wi = fIm[ok + j];
        const ar = wr * idr - wi * idi, ai = wr * idi + wi * idr; // l_j
        const oj = j * nf;
        for (let i = j; i < nf; i++) {
          const xr = fRe[ok + i], xi = fIm[ok + i];
          fRe[oj + i] -= xr * ar - xi * ai;
          fIm[oj + i] -= xr * ai + xi * ar;
        }
      }
      // scale: l = w / d
      for (let i = k + 1; i < nf; i++) {
        const xr = fRe[ok + i], xi = fIm[ok + i];
        fRe[ok + i] = xr * idr - xi * idi;
        fIm[ok + i] = xr * idi + xi * idr;
      }
    }
    if (ke >= nf) continue;
    // trailing update: F[i, j] −= Σ_k L[i, k] · (L[j, k] d_k), i ≥ j ≥ ke
    if (ke - kb === 4) {
      const o0 = kb * nf, o1 = o0 + nf, o2 = o1 + nf, o3 = o2 + nf;
      const d0r = fRe[o0 + kb], d0i = fIm[o0 + kb], d1r = fRe[o1 + kb + 1], d1i = fIm[o1 + kb + 1];
      const d2r = fRe[o2 + kb + 2], d2i = fIm[o2 + kb + 2], d3r = fRe[o3 + kb + 3], d3i = fIm[o3 + kb + 3];
      for (let j = ke; j < nf; j++) {
        let t0 = fRe[o0 + j], u0 = fIm[o0 + j];
        const a0r = t0 * d0r - u0 * d0i, a0i = t0 * d0i + u0 * d0r;
        t0 = fRe[o1 + j]; u0 = fIm[o1 + j];
        const a1r = t0 * d1r - u0 * d1i, a1i = t0 * d1i + u0 * d1r;
        t0 = fRe[o2 + j]; u0 = fIm[o2 + j];
        const a2r = t0 * d2r - u0 * d2i, a2i = t0 * d2i + u0 * d2r;
        t0 = fRe[o3 + j]; u0 = fIm[o3 + j];
        const a3r = t0 * d3r - u0 * d3i, a3i = t0 * d3i + u0 * d3r;
        const oj = j * nf;
        for (let i = j; i < nf; i++) {
          const l0r = fRe[o0 + i], l0i = fIm[o0 + i], l1r = fRe[o1 + i], l1i = fIm[o1 + i];
          const l2r = fRe[o2 + i], l2i = fIm[o2 + i], l3r = fRe[o3 + i], l3i = fIm[o3 + i];
          fRe[oj + i] -= l0r * a0r - l0i * a0i + l1r * a1r - l1i * a1i + l2r * a2r - l2i * a2i + l3r * a3r - l3i * a3i;
          fIm[oj + i] -= l0r * a0i + l0i * a0r + l1r * a1i + l1i * a1r + l2r * a2i + l2i * a2r + l3r * a3i + l3i * a3r;
        }
      }
    } else {
      for (let k = kb; k < ke; k++) {
        const ok = k * nf, dr = fRe[ok + k], di = fIm[ok + k];
        for (let j = ke; j < nf; j++) {
          const t = fRe[ok + j], u = fIm[ok + j];
          const ar = t * dr - u * di, ai = t * di + u * dr;
          const oj = j * nf;
          for (let i = j; i < nf; i++) {
            const lr = fRe[ok + i], li = fIm[ok + i];
            fRe[oj + i] -= lr * ar - li * ai;
            fIm[oj + i] -= lr * ai + li * ar;
          }
        }
      }
    }
  }
  return -1;
}

/**
 * Solve L D Lᵀ x = b in place in the ORIGINAL numbering: b (length n, node ids) becomes x.
 * `work` is scratch of length 2n (re then im).
 */
export function solveMultifrontal(fac: LdltFactor, bRe: Float64Array, bIm: Float64Array, work: Float64Array): void {
  const ord = fac.ordering;
  const { n, perm, fronts, sepStart, sepSize, boundSize, boundPtr, bound, factorPtr } = ord;
  const lRe = fac.re, lIm = fac.im;
  const xRe = work.subarray(0, n), xIm = work.subarray(n, 2 * n);
  for (let q = 0; q < n; q++) { xRe[q] = bRe[perm[q]]; xIm[q] = bIm[perm[q]]; }
  // forward: L y = b
  for (let f = 0; f < fronts; f++) {
    const s = sepSize[f], nf = s + boundSize[f], p0 = sepStart[f], bp = boundPtr[f] - s;
    let o = factorPtr[f] | 0;
    for (let k = 0; k < s; k++) {
      const p = p0 + k, yr = xRe[p], yi = xIm[p];
      let e = o + 1;
      for (let i = k + 1; i < s; i++, e++) {
        const lr = lRe[e], li = lIm[e];
        xRe[p0 + i] -= lr * yr - li * yi; xIm[p0 + i] -= lr * yi + li * yr;
      }
      for (let i = s; i < nf; i++, e++) {
        const g = bound[bp + i], lr = lRe[e], li = lIm[e];
        xRe[g] -= lr * yr - li * yi; xIm[g] -= lr * yi + li * yr;
      }
      o += nf - k;
    }
  }
  // D z = y
  for (let f = 0; f < fronts; f++) {
    const s = sepSize[f], nf = s + boundSize[f], p0 = sepStart[f];
    let o = factorPtr[f] | 0;
    for (let k = 0; k < s; k++) {
      const dr = lRe[o], di = lIm[o], d2 = dr * dr + di * di, p = p0 + k, yr = xRe[p], yi = xIm[p];
      xRe[p] = (yr * dr + yi * di) / d2; xIm[p] = (yi * dr - yr * di) / d2;
      o += nf - k;
    }
  }
  // backward: Lᵀ x = z
  for (let f = fronts - 1; f >= 0; f--) {
    const s = sepSize[f], nf = s + boundSize[f], p0 = sepStart[f], bp = boundPtr[f] - s;
    for (let k = s - 1; k >= 0; k--) {
      const o = (factorPtr[f] | 0) + k * nf - ((k * (k - 1)) >> 1);
      let sr = 0, si = 0, e = o + 1;
      for (let i = k + 1; i < s; i++, e++) {
        const lr = lRe[e], li = lIm[e], yr = xRe[p0 + i], yi = xIm[p0 + i];
        sr += lr * yr - li * yi; si += lr * yi + li * yr;
      }
      for (let i = s; i < nf; i++, e++) {
        const g = bound[bp + i], lr = lRe[e], li = lIm[e], yr = xRe[g], yi = xIm[g];
        sr += lr * yr - li * yi; si += lr * yi + li * yr;
      }
      xRe[p0 + k] -= sr; xIm[p0 + k] -= si;
    }
  }
  for (let q = 0; q < n; q++) { bRe[perm[q]] = xRe[q]; bIm[perm[q]] = xIm[q]; }
}
