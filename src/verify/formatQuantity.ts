/** Short SI formatting for the check's notes and table (3 significant digits, readable unit). */

const sig = (v: number): string => Number(v.toPrecision(3)).toString();

/** Example: formatLength(0.0012) → "1.2 mm"; formatLength(3.9e-8) → "39 nm". */
export function formatLength(m: number): string {
  if (!Number.isFinite(m)) return "—";
  const a = Math.abs(m);
  if (a === 0) return "0 m";
  if (a >= 1) return `${sig(m)} m`;
  if (a >= 1e-3) return `${sig(m * 1e3)} mm`;
  if (a >= 1e-6) return `${sig(m * 1e6)} µm`;
  return `${sig(m * 1e9)} nm`;
}

/** Example: formatFrequency(1.934e14) → "193 THz". */
export function formatFrequency(hz: number): string {
  if (!Number.isFinite(hz)) return "—";
  for (const [f, u] of [[1e12, "THz"], [1e9, "GHz"], [1e6, "MHz"], [1e3, "kHz"]] as const) if (Math.abs(hz) >= f) return `${sig(hz / f)} ${u}`;
  return `${sig(hz)} Hz`;
}
