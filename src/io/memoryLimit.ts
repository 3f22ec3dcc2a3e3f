/**
 * The memory a command may use: CELLWRIGHT_MEMORY_LIMIT (bytes, or "4 GB", "512 MB"), else 75 %
 * of the smaller of the machine's memory and the process's container limit.
 */
import { totalmem } from "node:os";
import { InputError } from "../core/errors.js";
import type { CellBudget, MemoryPurpose } from "../core/memoryBudget.js";

const UNITS: Record<string, number> = { "": 1, b: 1, kb: 2 ** 10, mb: 2 ** 20, gb: 2 ** 30, tb: 2 ** 40 };

export function memoryBudget(purpose: MemoryPurpose): CellBudget {
  const env = process.env.CELLWRIGHT_MEMORY_LIMIT;
  if (env !== undefined && env.trim() !== "") {
    const m = /^\s*([\d.]+(?:e\d+)?)\s*([kmgt]?b?)\s*$/i.exec(env);
    const bytes = m ? Number(m[1]) * UNITS[m[2].toLowerCase()] : NaN;
    if (!(bytes > 0)) throw new InputError({ where: "CELLWRIGHT_MEMORY_LIMIT", message: `expected a size such as '4 GB', got '${env}'` });
    return { purpose, budgetBytes: bytes, source: "CELLWRIGHT_MEMORY_LIMIT" };
  }
  const constrained = (process as unknown as { constrainedMemory?: () => number | undefined }).constrainedMemory?.() ?? 0;
  const total = constrained > 0 ? Math.min(constrained, totalmem()) : totalmem();
  return { purpose, budgetBytes: 0.75 * total, source: `75 % of this machine's ${Number((total / 2 ** 30).toPrecision(3))} GB; set CELLWRIGHT_MEMORY_LIMIT to change it` };
}
