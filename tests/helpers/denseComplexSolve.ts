// Test reference: a dense solve, independent of the banded and sparse solvers under test.
/** Dense complex Gaussian elimination with partial pivoting (Golub & Van Loan, "Matrix Computations", 2013, Alg. 3.4.1). */
export function denseSolve(aRe: number[][], aIm: number[][], bRe: number[], bIm: number[]): [number[], number[]] {
  const n = bRe.length;
  const Ar = aRe.map((r) => r.slice()), Ai = aIm.map((r) => r.slice()), xr = bRe.slice(), xi = bIm.slice();
  for (let k = 0; k < n; k++) {
    let p = k;
    for (let r = k + 1; r < n; r++) if (Math.hypot(Ar[r][k], Ai[r][k]) > Math.hypot(Ar[p][k], Ai[p][k])) p = r;
    [Ar[k], Ar[p]] = [Ar[p], Ar[k]]; [Ai[k], Ai[p]] = [Ai[p], Ai[k]]; [xr[k], xr[p]] = [xr[p], xr[k]]; [xi[k], xi[p]] = [xi[p], xi[k]];
    const d2 = Ar[k][k] ** 2 + Ai[k][k] ** 2;
    for (let r = k + 1; r < n; r++) {
      const lr = (Ar[r][k] * Ar[k][k] + Ai[r][k] * Ai[k][k]) / d2, li = (Ai[r][k] * Ar[k][k] - Ar[r][k] * Ai[k][k]) / d2;
      for (let c = k; c < n; c++) { Ar[r][c] -= lr * Ar[k][c] - li * Ai[k][c]; Ai[r][c] -= lr * Ai[k][c] + li * Ar[k][c]; }
      xr[r] -= lr * xr[k] - li * xi[k]; xi[r] -= lr * xi[k] + li * xr[k];
    }
  }
  for (let r = n - 1; r >= 0; r--) {
    let sr = xr[r], si = xi[r];
    for (let c = r + 1; c < n; c++) { sr -= Ar[r][c] * xr[c] - Ai[r][c] * xi[c]; si -= Ar[r][c] * xi[c] + Ai[r][c] * xr[c]; }
    const d2 = Ar[r][r] ** 2 + Ai[r][r] ** 2;
    xr[r] = (sr * Ar[r][r] + si * Ai[r][r]) / d2; xi[r] = (si * Ar[r][r] - sr * Ai[r][r]) / d2;
  }
  return [xr, xi];
}
