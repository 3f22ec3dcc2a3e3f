/**
 * Memory estimates made before allocating: bytes per device cell for each command, measured on
 * the printed-bend demo at 8.8 × 10⁵ cells (peak resident size minus the idle process, Node 20:
 * field ≈ 110, reduce ≈ 300, plan ≈ 290 bytes per cell; the figures below double them for the
 * peaks of writing and matching). Pure: the budget itself is found by the shell (io/memoryLimit.ts).
 */
import { formatCount } from "./formatQuantity.js";

export type MemoryPurpose = "field" | "reduce" | "plan" | "verify";

export const BYTES_PER_CELL: Record<MemoryPurpose, number> = { field: 240, reduce: 600, plan: 600, verify: 600 };

export interface CellBudget {
  purpose: MemoryPurpose;
  /** bytes the command may use */
  budgetBytes: number;
  /** where the budget comes from, for messages ("75 % of this machine's 23 GB") */
  source: string;
}

const gb = (b: number): string => `${Number((b / 2 ** 30).toPrecision(3))} GB`;

/**
 * Why `cells` cells of pitch `pitchM` are too many for `budget`, or null. The message names the
 * estimate, the budget and the pitch that would fit.
 */
export function cellBudgetProblem(cells: number, pitchM: number, dimension: 2 | 3, budget: CellBudget): string | null {
  const need = cells * BYTES_PER_CELL[budget.purpose];
  if (need <= budget.budgetBytes) return null;
  const factor = dimension === 3 ? Math.cbrt(need / budget.budgetBytes) : Math.sqrt(need / budget.budgetBytes);
  return `a pitch of ${pitchM} m gives ${formatCount(cells)} cells; ${budget.purpose} needs about ${Number.isFinite(need) ? gb(need) : "more memory than can be counted"} for them ` +
    `(${BYTES_PER_CELL[budget.purpose]} bytes per cell), more than ${gb(budget.budgetBytes)} (${budget.source}); ` +
    (Number.isFinite(factor) ? `expected a pitch of at least ${Number((pitchM * factor * 1.01).toPrecision(3))} m or a smaller device` : "expected a far coarser pitch or a smaller device");
}
