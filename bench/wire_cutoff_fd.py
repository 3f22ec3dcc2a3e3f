"""Independent check of the wire-lattice cut-off (src/cells/wireCutoff): lowest eigenvalue k^2 of
-Laplacian on the periodic square/hex cell with E_z = 0 on a perfectly conducting wire of radius r,
by second-order finite differences with Shortley-Weller boundary points (the wire boundary cut
into the grid arms), scipy.sparse eigsh, a ladder of grids and Richardson extrapolation (order 2).
Run: python3 bench/wire_cutoff_fd.py   (numpy, scipy; not needed by the tests)."""
import numpy as np, scipy.sparse as sp, scipy.sparse.linalg as sla, sys

def kp(r, n, lattice="square"):
    lx, ly = 1.0, (np.sqrt(3) if lattice == "hex" else 1.0)
    ny = int(round(n * ly))
    hx, hy = lx / n, ly / ny
    centres = [(0.5, 0.5 * ly)] + ([(0, 0), (1, 0), (0, ly), (1, ly)] if lattice == "hex" else [])
    X, Y = np.meshgrid((np.arange(n) + 0.5) * hx, (np.arange(ny) + 0.5) * hy, indexing="ij")
    def dist(x, y):
        return np.min([np.hypot(x - cx, y - cy) for cx, cy in centres], axis=0)
    inside = dist(X, Y) < r
    idx = -np.ones((n, ny), dtype=int)
    idx[~inside] = np.arange((~inside).sum())
    rows, cols, vals = [], [], []
    for i in range(n):
        for j in range(ny):
            if inside[i, j]:
                continue
            k = idx[i, j]
            diag = 0.0
            for di, dj, h in ((1, 0, hx), (-1, 0, hx), (0, 1, hy), (0, -1, hy)):
                ii, jj = (i + di) % n, (j + dj) % ny
                if not inside[ii, jj]:
                    rows.append(k); cols.append(idx[ii, jj]); vals.append(-1 / h**2)
                    diag += 1 / h**2
                else:
                    # distance along the arm to the circle: bisection
                    x0, y0 = X[i, j], Y[i, j]
                    a, b = 0.0, 1.0
                    for _ in range(60):
                        m = 0.5 * (a + b)
                        if dist(np.array(x0 + di * m * h), np.array(y0 + dj * m * h)) < r: b = m
                        else: a = m
                    t = max(0.5 * (a + b), 1e-3)
                    # Shortley-Weller: arm length t*h, value 0 there (symmetrised approximately)
                    diag += 1 / (t * h * h)
            rows.append(k); cols.append(k); vals.append(diag)
    m = (~inside).sum()
    A = sp.csr_matrix((vals, (rows, cols)), shape=(m, m))
    A = 0.5 * (A + A.T)
    w = sla.eigsh(A, k=1, sigma=0, which="LM", return_eigenvectors=False)
    return np.sqrt(w[0])

if __name__ == "__main__":
    lattice = sys.argv[1] if len(sys.argv) > 1 else "square"
    for r in (0.1, 0.2, 0.25, 0.3):
        ks = [kp(r, n, lattice) for n in (100, 200, 400)]
        rich = ks[2] + (ks[2] - ks[1]) / 3
        print(lattice, r, [round(k, 6) for k in ks], "richardson", round(rich, 6))
