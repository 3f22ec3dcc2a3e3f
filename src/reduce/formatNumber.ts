/**
 * Compact numbers for terminal tables: 3 significant digits, exponent form outside [1e-3, 1e4),
 * "–" for NaN, "∞" for Infinity. Example: formatNumber(0.00029137) → "2.91e-4"; formatNumber(3.4306) → "3.43".
 */
export function formatNumber(v: number, digits = 3): string {
  if (Number.isNaN(v)) return "–";
  if (v === Infinity) return "∞";
  if (v === -Infinity) return "-∞";
  if (v === 0) return "0";
  const a = Math.abs(v);
  if (a >= 1e4 || a < 1e-3) {
    const [m, e] = v.toExponential(digits - 1).split("e");
    return `${trimZeros(m)}e${Number(e)}`;
  }
  if (a >= 10 ** digits) return String(Math.round(v));
  return trimZeros(v.toPrecision(digits));
}

function trimZeros(s: string): string {
  return s.includes(".") ? s.replace(/0+$/, "").replace(/\.$/, "") : s;
}
