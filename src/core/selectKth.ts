/**
 * The k-th smallest entry (0-based) of a Float64Array, in expected O(n): quickselect with a
 * median-of-three pivot, partitioning `a` in place (a[k] holds the answer afterwards, smaller
 * entries before it, larger after). Replaces a full sort where one order statistic is wanted (the
 * median of 10⁶ errors). Entries must not be NaN.
 * Example: selectKth(Float64Array.of(5, 1, 4, 2, 3), 2) → 3
 */
export function selectKth(a: Float64Array, k: number): number {
  let lo = 0, hi = a.length - 1;
  while (hi > lo) {
    const mid = (lo + hi) >>> 1;
    // median of three to a[mid], then Hoare partition around its value
    if (a[mid] < a[lo]) swap(a, mid, lo);
    if (a[hi] < a[lo]) swap(a, hi, lo);
    if (a[hi] < a[mid]) swap(a, hi, mid);
    const pivot = a[mid];
    let i = lo, j = hi;
    while (i <= j) {
      while (a[i] < pivot) i++;
      while (a[j] > pivot) j--;
      if (i <= j) { swap(a, i, j); i++; j--; }
    }
    if (k <= j) hi = j;
    else if (k >= i) lo = i;
    else return a[k];
  }
  return a[k];
}

function swap(a: Float64Array, i: number, j: number): void {
  const t = a[i]; a[i] = a[j]; a[j] = t;
}
