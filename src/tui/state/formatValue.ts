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

/** A length in metres shown in the most readable of m, mm, µm, nm. Example: formatLength(0.0012) → "1.20 mm" */
export function formatLength(m: number): string {
  if (!Number.isFinite(m)) return "—";
  const a = Math.abs(m);
  if (a === 0) return "0 m";
  if (a >= 1) return `${formatValue(m)} m`;
  if (a >= 1e-3) return `${formatValue(m * 1e3)} mm`;
  if (a >= 1e-6) return `${formatValue(m * 1e6)} µm`;
  return `${formatValue(m * 1e9)} nm`;
}

/** A fraction shown as a percentage. Example: formatPercent(0.0312) → "3.12 %" */
export function formatPercent(f: number): string {
  if (!Number.isFinite(f)) return "—";
  const pct = f * 100;
  if (pct !== 0 && Math.abs(pct) < 0.001) return pct > 0 ? "<0.001 %" : ">−0.001 %";
  return `${formatValue(pct)} %`;
}

/** A frequency shown in Hz, kHz, MHz, GHz or THz. Example: formatFrequency(1.05e10) → "10.5 GHz" */
export function formatFrequency(hz: number): string {
  if (!Number.isFinite(hz)) return "—";
  const units: [number, string][] = [[1e12, "THz"], [1e9, "GHz"], [1e6, "MHz"], [1e3, "kHz"]];
  for (const [f, u] of units) if (Math.abs(hz) >= f) return `${formatValue(hz / f)} ${u}`;
  return `${formatValue(hz)} Hz`;
}
