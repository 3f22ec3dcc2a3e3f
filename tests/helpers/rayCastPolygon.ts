/**
 * The plain even–odd ray cast that `field/region.ts` used before the polygon index: O(N) per
 * point. Kept here, verbatim, as the oracle the index must agree with bit for bit.
 */
export function rayCastContains(xs: ArrayLike<number>, ys: ArrayLike<number>, x: number, y: number): boolean {
  const n = xs.length;
  let inside = false;
  for (let k = 0, m = n - 1; k < n; m = k++) {
    const yk = ys[k], ym = ys[m];
    if ((yk > y) !== (ym > y)) {
      const xCross = xs[k] + ((y - yk) * (xs[m] - xs[k])) / (ym - yk);
      if (x < xCross) inside = !inside;
    }
  }
  return inside;
}
