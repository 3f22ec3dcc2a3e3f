/**
 * Where the circles of a rect-lattice recipe stand in their device cell — one rule shared by the
 * layout files (layoutShapes.ts, printedPart.ts) and the drawn full-wave case
 * (src/verify/geometryScene.ts), so the shop and the check build the same rods and holes. Pure.
 *
 * A rect recipe of aspect b/a = m/n (cells/lattice.ts rectTiling) tiles the square device cell of
 * pitch p with m × n circles: spacing a = p/m along the lattice's x axis, b = p/n along its y axis.
 * The lattice's x axis lies along the cell's principal axis 1, snapped to the grid axis (x or y)
 * nearer it (as laminates are: plan/latticeMisalignment.ts counts the turn in rel_error). So a cell
 * whose axis 1 is nearer grid x holds m columns and n rows of circles, one whose axis 1 is nearer
 * grid y n columns and m rows; circle (i, j) of a cell centred at (X, Y) with mx columns and my rows
 * stands at (X − p/2 + (i + ½)·p/mx, Y − p/2 + (j + ½)·p/my). The circles of neighbouring cells of
 * the same tiling and orientation continue one lattice across the cell edges (the half spacing at
 * each edge adds up to one spacing), so the area fraction is m·n·πr²/p² = πr²/(a·b), the recipe's
 * fill, in every cell.
 */

/** Does principal axis 1 (at axisRad + π/2; axisRad is axis 2's angle) lie nearer grid x than grid y? */
export const axis1AlongX = (axisRad: number): boolean => Math.abs(Math.cos(axisRad + Math.PI / 2)) >= Math.abs(Math.sin(axisRad + Math.PI / 2));

/**
 * Columns (along grid x) and rows (along grid y) of circles in a cell of a rect recipe tiled m × n,
 * whose principal axis 2 stands at `axisRad` from +x, into out[0], out[1].
 * Example: tile { m: 2, n: 1 }, axisRad = π/2 (axis 1 along x) → [2, 1]; axisRad = 0 → [1, 2].
 */
export function rectCellCounts(tile: { m: number; n: number }, axisRad: number, out: Int32Array): Int32Array {
  const alongX = axis1AlongX(axisRad);
  out[0] = alongX ? tile.m : tile.n;
  out[1] = alongX ? tile.n : tile.m;
  return out;
}

/** Coordinate (metres) of circle k of `count` along one grid axis in the cell centred at `centreM`: centre − p/2 + (k + ½)·p/count. */
export const rectSiteM = (centreM: number, k: number, count: number, pitchM: number): number => centreM - pitchM / 2 + ((k + 0.5) * pitchM) / count;
