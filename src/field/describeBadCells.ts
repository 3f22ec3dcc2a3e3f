/** The message for cells where a map folds (det J ≤ 0), is singular or is undefined. */
import type { DeviceGrid } from "./deviceGrid.js";

export interface BadCell {
  cell: number;
  /** det K at the cell (≤ 0, infinite or NaN) */
  detK: number;
}

const mm = (m: number): string => `${Number((m * 1000).toPrecision(6))} mm`;

/** "the map folds (det J ≤ 0) at 12 cells, first: cell (3, 4) at (1.5 mm, 2 mm), …; expected …" */
export function describeBadCells(bad: BadCell[], total: number, grid: DeviceGrid, what: string, hasInnerOffset: boolean): string {
  const folds = bad.some((b) => b.detK < 0);
  const undefinedMap = bad.some((b) => Number.isNaN(b.detK));
  const kind = folds
    ? "folds (det J ≤ 0)"
    : undefinedMap
      ? "is not defined (its Jacobian is not finite)"
      : "is singular (det K = 0, det J infinite)";
  const list = bad
    .map((b) => {
      const c = b.cell;
      const idx = grid.dimension === 3 ? `(${grid.i[c]}, ${grid.j[c]}, ${grid.k[c]})` : `(${grid.i[c]}, ${grid.j[c]})`;
      const at = grid.dimension === 3 ? `(${mm(grid.xM[c])}, ${mm(grid.yM[c])}, ${mm(grid.zM[c])})` : `(${mm(grid.xM[c])}, ${mm(grid.yM[c])})`;
      return `cell ${idx} at ${at}`;
    })
    .join("; ");
  const hint = folds
    ? "expected an orientation-preserving map (det J > 0 everywhere in the device)"
    : undefinedMap
      ? "expected a map with a finite Jacobian in every cell"
      : hasInnerOffset
        ? "set transform.innerOffset to keep cells away from the singular boundary"
        : "expected a region that keeps cells off the singular points of the map";
  return `the map${what} ${kind} at ${total} cell${total === 1 ? "" : "s"}, first ${list}; ${hint}`;
}
