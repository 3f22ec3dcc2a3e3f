#!/usr/bin/env python3
"""Side-by-side reference for `npm run bench` (verify solver): the same free-space grid with a PML
(15 points per wavelength, 12 cubic-graded PML nodes designed for R = 1e-8, point source at the
centre), assembled with the same five-point uniaxial stretched-coordinate stencil as
src/verify/stencil.ts when there are no cross terms, and solved with scipy's general sparse direct
solver (SuperLU through scipy.sparse.linalg.splu). Its default (COLAMD column ordering with partial
pivoting) took 31 s for 200 x 200 nodes here, so we use the symmetric minimum-degree ordering on
A + A^T with diagonal pivots preferred (permc_spec="MMD_AT_PLUS_A", diag_pivot_thresh=0.01,
symmetric_mode), the fair setting for a symmetric structure; `--default` runs scipy's default. Prints median
factor + solve times and the process's peak resident memory. Needs numpy and scipy; tests never
run it.  Usage: python3 bench/sparseSolveScipy.py [200 400 700 1000]
"""
import math
import resource
import sys
import time

import numpy as np
import scipy.sparse as sp
import scipy.sparse.linalg as spla


def stretch(n, pml, h, k):
    """Complex stretch at nodes and at faces i + 1/2 (as src/verify/pml.ts)."""
    L = pml * h
    sigma_max = -(3 + 1) * math.log(1e-8) / (2 * k * L)
    lo, hi = pml, n - 1 - pml
    def depth(p):
        return (lo - p) * h if p < lo else (p - hi) * h if p > hi else 0.0
    node = np.array([1 + 1j * sigma_max * (depth(i) / L) ** 3 for i in range(n)])
    face = np.array([1 + 1j * sigma_max * (depth(i + 0.5) / L) ** 3 for i in range(n)])
    return node, face


def operator(nodes, h=1 / 15, pml=12):
    k0 = 2 * math.pi
    n = nodes
    sxn, sxf = stretch(n, pml, h, k0)
    ih2 = 1 / h / h
    rows, cols, vals = [], [], []
    idx = np.arange(n * n).reshape(n, n)  # idx[j, i] = i + n j
    I, J = np.meshgrid(np.arange(n), np.arange(n))
    diag = k0 * k0 * sxn[I] * sxn[J] + 0j
    # x faces: coefficient s_y(node j) / s_x(face) between i and i+1
    ax = (sxn[J[:, :-1]] / sxf[I[:, :-1]]) * ih2
    ay = (sxn[I[:-1, :]] / sxf[J[:-1, :]]) * ih2
    d = diag.copy()
    d[:, :-1] -= ax; d[:, 1:] -= ax
    d[:-1, :] -= ay; d[1:, :] -= ay
    # walls: the face outside the grid reuses the first/last face value (as the stencil does)
    d[:, 0] -= (sxn[J[:, 0]] / sxf[0]) * ih2
    d[:, -1] -= (sxn[J[:, -1]] / sxf[n - 1]) * ih2
    d[0, :] -= (sxn[I[0, :]] / sxf[0]) * ih2
    d[-1, :] -= (sxn[I[-1, :]] / sxf[n - 1]) * ih2
    rows += [idx.ravel()]; cols += [idx.ravel()]; vals += [d.ravel()]
    for a, b, w in ((idx[:, :-1], idx[:, 1:], ax), (idx[:-1, :], idx[1:, :], ay)):
        rows += [a.ravel(), b.ravel()]; cols += [b.ravel(), a.ravel()]; vals += [w.ravel(), w.ravel()]
    A = sp.csc_matrix((np.concatenate(vals), (np.concatenate(rows), np.concatenate(cols))), shape=(n * n, n * n))
    f = np.zeros(n * n, complex)
    f[n // 2 + n * (n // 2)] = ih2
    return A, f


def main():
    default = "--default" in sys.argv
    sizes = [int(a) for a in sys.argv[1:] if a != "--default"] or [200, 400, 700]
    opts = {} if default else {"permc_spec": "MMD_AT_PLUS_A", "diag_pivot_thresh": 0.01, "options": {"SymmetricMode": True}}
    print("nodes       unknowns   splu factor s  solve s  total s  L+U M entries  residual   peak RSS MB  (medians)")
    for s in sizes:
        A, f = operator(s)
        runs = 3 if s <= 200 else 1
        tf, ts = [], []
        for _ in range(runs):
            t0 = time.perf_counter()
            lu = spla.splu(A, **opts)
            t1 = time.perf_counter()
            x = lu.solve(f)
            t2 = time.perf_counter()
            tf.append(t1 - t0); ts.append(t2 - t1)
        res = np.linalg.norm(f - A @ x) / np.linalg.norm(f)
        nnz = (lu.L.nnz + lu.U.nnz) / 1e6
        rss = resource.getrusage(resource.RUSAGE_SELF).ru_maxrss / 1024
        tot = [a + b for a, b in zip(tf, ts)]
        print(f"{s}x{s:<8} {s * s:>9} {np.median(tf):>14.2f} {np.median(ts):>8.2f} {np.median(tot):>8.2f} {nnz:>14.1f}  {res:.1e} {rss:>12.0f}   ({runs} runs)")
        del lu


if __name__ == "__main__":
    main()
