/**
 * The definition of the CSV number text: ECMAScript Number.prototype.toPrecision (ECMA-262
 * §21.1.3.5) with trailing zeros and the exponent's "+" removed — what `fmt` in csvText.ts and
 * `writeDecimal` in decimalBytes.ts must produce. Finite inputs only.
 */
export function precisionReference(x: number, digits: number): string {
  const s = x.toPrecision(digits);
  const trim = (t: string) => (t.includes(".") ? t.replace(/0+$/, "").replace(/\.$/, "") : t);
  if (s.includes("e")) {
    const [m, e] = s.split("e");
    return `${trim(m)}e${e.replace("+", "")}`;
  }
  return trim(s);
}
