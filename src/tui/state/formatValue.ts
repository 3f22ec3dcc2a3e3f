import { formatFrequency as formatFrequencyCore, formatLength as formatLengthCore } from "../../core/formatQuantity.js";

/**
 * Number formatting for the session's tables, legends and cell records: short, aligned, never
 * "NaN" (missing values print as "—").
 */

/** Three significant digits; exponent form outside 1e-3 … 1e5. Example: formatValue(0.012345) → "0.0123" */
export function formatValue(v: number, digits = 3): string {
  if (!Number.isFinite(v)) return v === Infinity ? "∞" : v === -Infinity ? "−∞" : "—";
  if (v === 0) return "0";
  const a = Math.abs(v);
  if (a >= 1e5 || a < 1e-3) return v.toExponential(digits - 1).replace("e+", "e");
  const s = v.toPrecision(digits);
  return s.includes("e") ? Number(s).toString() : s;
}

/** A length in metres shown in the most readable unit, session style. Example: formatLength(0.0012) → "1.20 mm" */
export const formatLength = (m: number): string => formatLengthCore(m, (v) => formatValue(v));

/** A fraction shown as a percentage. Example: formatPercent(0.0312) → "3.12 %" */
export function formatPercent(f: number): string {
  if (!Number.isFinite(f)) return "—";
  const pct = f * 100;
  if (pct !== 0 && Math.abs(pct) < 0.001) return pct > 0 ? "<0.001 %" : ">−0.001 %";
  return `${formatValue(pct)} %`;
}

/** A frequency shown in Hz, kHz, MHz, GHz or THz, session style. Example: formatFrequency(1.05e10) → "10.5 GHz" */
export const formatFrequency = (hz: number): string => formatFrequencyCore(hz, (v) => formatValue(v));
