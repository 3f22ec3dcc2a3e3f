/** Small helpers for CSV text: quoting and compact number formatting. */

/** Quote a CSV field when it holds a comma, quote or line break (RFC 4180). */
export function csvField(text: string): string {
  return /[",\r\n]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}

/**
 * A number with `digits` significant digits, without trailing zeros or exponent noise:
 * fmt(0.123456789) → "0.123457"; fmt(1.5e-7) → "1.5e-7"; NaN → "" (an empty CSV cell).
 */
export function fmt(x: number, digits = 6): string {
  if (!Number.isFinite(x)) return "";
  if (x === 0) return "0";
  const s = x.toPrecision(digits);
  if (s.indexOf("e") >= 0) {
    const [m, e] = s.split("e");
    return `${trimZeros(m)}e${e.startsWith("+") ? e.slice(1) : e}`;
  }
  return trimZeros(s);
}

function trimZeros(s: string): string {
  if (s.indexOf(".") < 0) return s;
  let end = s.length;
  while (s.charCodeAt(end - 1) === 48) end--;
  if (s.charCodeAt(end - 1) === 46) end--;
  return s.slice(0, end);
}

/** "radiusM" → "radius_m", "wallM" → "wall_m", "thicknessM" → "thickness_m". */
export function dimensionColumn(key: string): string {
  const base = key.endsWith("M") ? `${key.slice(0, -1)}_m` : key;
  return base.replace(/([a-z0-9])([A-Z])/g, "$1_$2").toLowerCase();
}
