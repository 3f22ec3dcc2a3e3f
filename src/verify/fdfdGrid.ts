/**
 * The FDFD grid: a uniform square lattice of nodes (spacing h) covering the computational window,
 * with `pml` absorbing layers of nodes on each side. The unknown (E_z for Ez, H_z for Hz) lives on
 * the nodes; the in-plane coefficients on the faces between them (x-faces at (i+½, j), y-faces at
 * (i, j+½)) and the off-diagonal coefficient at cell centres (i+½, j+½) — a Yee-type staggering
 * (Yee, IEEE Trans. Antennas Propag. 14, 302 (1966)). Nodes beyond the last ones are held at zero
 * (a conducting wall behind the PML).
 */
export interface FdfdGrid {
  nx: number;
  ny: number;
  /** node spacing, metres */
  h: number;
  /** coordinates of node (0, 0), metres */
  x0: number;
  y0: number;
  /** PML thickness in nodes on every side */
  pml: number;
}

/** x coordinate of node column i (may be fractional for faces). */
export const nodeX = (g: FdfdGrid, i: number): number => g.x0 + i * g.h;
/** y coordinate of node row j. */
export const nodeY = (g: FdfdGrid, j: number): number => g.y0 + j * g.h;

/** True when node (i, j) lies in the PML (or on its inner edge). */
export function inPml(g: FdfdGrid, i: number, j: number): boolean {
  return i < g.pml || j < g.pml || i >= g.nx - g.pml || j >= g.ny - g.pml;
}

/**
 * A grid whose interior (outside the PML) covers [minX, maxX] × [minY, maxY] with spacing ≤ h,
 * centred on the box, with `pml` extra nodes each side.
 */
export function gridForWindow(box: { minX: number; maxX: number; minY: number; maxY: number }, h: number, pml: number): FdfdGrid {
  const w = box.maxX - box.minX, hgt = box.maxY - box.minY;
  const cx = Math.ceil(w / h) + 1, cy = Math.ceil(hgt / h) + 1;
  const nx = cx + 2 * pml, ny = cy + 2 * pml;
  const x0 = (box.minX + box.maxX) / 2 - ((nx - 1) * h) / 2;
  const y0 = (box.minY + box.maxY) / 2 - ((ny - 1) * h) / 2;
  return { nx, ny, h, x0, y0, pml };
}
