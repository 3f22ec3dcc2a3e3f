/**
 * Closeness with explicit tolerances. |actual − expected| ≤ abs + rel·|expected|, element-wise;
 * the failure message names the first bad element. vitest's toBeCloseTo checks a fixed absolute
 * 0.005, which means nothing for 1e10 Hz or 1e-3 m, so tests use this instead.
 */
import { expect } from "vitest";

export interface Tolerance {
  rel?: number;
  abs?: number;
  label?: string;
}

function check(actual: number, expected: number, tol: Tolerance, where: string): string | null {
  const rel = tol.rel ?? 0;
  const abs = tol.abs ?? 0;
  if (rel === 0 && abs === 0) throw new Error("expectClose: give rel and/or abs");
  if (Number.isNaN(expected)) return Number.isNaN(actual) ? null : `${where}: expected NaN, got ${actual}`;
  if (!Number.isFinite(actual)) return `${where}: expected ${expected}, got ${actual}`;
  if (!Number.isFinite(expected)) return actual === expected ? null : `${where}: expected ${expected}, got ${actual}`;
  const err = Math.abs(actual - expected);
  const allowed = abs + rel * Math.abs(expected);
  return err <= allowed ? null : `${where}: expected ${expected} ± ${allowed.toExponential(2)}, got ${actual} (off by ${err.toExponential(3)})`;
}

export function expectClose(
  actual: number | ArrayLike<number>,
  expected: number | ArrayLike<number>,
  tol: Tolerance,
): void {
  const label = tol.label ?? "value";
  if (typeof actual === "number" || typeof expected === "number") {
    const a = typeof actual === "number" ? actual : NaN;
    const e = typeof expected === "number" ? expected : NaN;
    const msg = check(a, e, tol, label);
    expect(msg, msg ?? "").toBeNull();
    return;
  }
  expect(actual.length, `${label}: length`).toBe(expected.length);
  for (let k = 0; k < expected.length; k++) {
    const msg = check(actual[k], expected[k], tol, `${label}[${k}]`);
    if (msg) {
      expect(msg, msg).toBeNull();
      return;
    }
  }
}
