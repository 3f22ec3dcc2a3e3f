/**
 * Quantities with units at the edge: "10.5 GHz", "3 mm", "1550 nm", "90 deg". Bare numbers are SI.
 * Parsing uses mathjs units, loaded lazily (mathjs costs ~0.7 s to load) and only when a value is
 * not a plain number with one of the common units (quickQuantity.ts).
 */
import { InputError } from "../core/errors.js";
import { getMath } from "./mathjs.js";
import { quickQuantity } from "./quickQuantity.js";

export type Dimension = "length" | "frequency" | "angle" | "dimensionless" | "temperature";

const BASE: Record<Exclude<Dimension, "dimensionless">, { si: string; example: string }> = {
  length: { si: "m", example: "'3 mm'" },
  frequency: { si: "Hz", example: "'10 GHz'" },
  angle: { si: "rad", example: "'90 deg'" },
  temperature: { si: "degC", example: "'25 degC'" },
};

/** Name of the physical dimension of a mathjs unit, for messages. */
function describeUnit(math: Awaited<ReturnType<typeof getMath>>, u: any): string {
  for (const [name, { si }] of Object.entries(BASE)) {
    if (u.equalBase(math.unit(si))) return `a ${name}`;
  }
  return `'${u.formatUnits()}'`;
}

/**
 * Parse `value` (number in SI, or string with a unit) as `dimension`; returns the SI value.
 * Throws InputError naming `where` when the value is not a finite quantity of that dimension.
 * Example: await parseQuantity("10.5 GHz", "frequency", "$.frequency") → 10500000000
 */
export async function parseQuantity(value: unknown, dimension: Dimension, where: string): Promise<number> {
  try {
    return parseQuantityWith(null, value, dimension, where);
  } catch (err) {
    if (!(err instanceof NeedsMathjs)) throw err;
  }
  return parseQuantityWith(await getMath(), value, dimension, where);
}

/** Thrown by `parseQuantityWith(null, …)` when the value needs mathjs (not a user error). */
export class NeedsMathjs extends Error {
  constructor() {
    super("this quantity needs mathjs");
  }
}

/**
 * Synchronous variant: plain numbers and the common units (quickQuantity.ts) without mathjs; with
 * `math` null, anything else throws `NeedsMathjs` so the caller can load it and ask again.
 */
export function parseQuantityWith(math: any, value: unknown, dimension: Dimension, where: string): number {
  if (typeof value === "number") {
    if (!Number.isFinite(value)) throw new InputError({ where, message: `expected a finite number, got ${value}` });
    return value;
  }
  if (typeof value !== "string") {
    throw new InputError({ where, message: `expected a ${dimension} as a number (SI) or a string with a unit` });
  }
  const text = value.trim();
  if (text === "") throw new InputError({ where, message: `expected a ${dimension}, got an empty string` });
  const plain = Number(text);
  if (Number.isFinite(plain)) return plain;
  if (dimension === "dimensionless") {
    throw new InputError({ where, message: `expected a plain number, got '${value}'` });
  }
  const quick = quickQuantity(text, dimension);
  if (quick !== undefined) return quick;
  if (!math) throw new NeedsMathjs();
  let u: any;
  try {
    u = math.unit(text);
  } catch {
    throw new InputError({ where, message: `expected a ${dimension} such as ${BASE[dimension].example}, got '${value}'` });
  }
  const base = BASE[dimension];
  const ref = math.unit(base.si);
  if (!u.equalBase(ref)) {
    throw new InputError({ where, message: `expected a ${dimension} such as ${base.example}, got ${describeUnit(math, u)} '${value}'` });
  }
  if (u.value === null || u.value === undefined) {
    throw new InputError({ where, message: `expected a number with the unit, got '${value}'` });
  }
  const si = u.toNumber(base.si);
  if (!Number.isFinite(si)) throw new InputError({ where, message: `expected a finite ${dimension}, got '${value}'` });
  return si;
}
