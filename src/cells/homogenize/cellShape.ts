/**
 * Geometry of a 2D periodic cell for the cell problem: the rectangular computational cell (Lx × Ly,
 * in units of the pitch a), a point test "is this point in the inclusion phase", and the interface
 * normal near a point (for the sub-pixel smoothing of cellProblem.ts).
 *
 * Lattices (nearest-neighbour spacing a = 1):
 * - square: cell 1 × 1, one circle at the centre;
 * - hex: the rectangular cell 1 × √3 holding two sites (centre and corners), so the grid stays
 *   rectangular and periodic; fill f = 2πr²/√3 (the same as πr²/((√3/2)a²) per site);
 * - rect: cell 1 × b (b = aspect ratio ≥ or ≤ 1), one circle at the centre, f = πr²/b.
 * Shapes: circles (rods or holes), a laminate (a slab of thickness t normal to x), and a
 * checkerboard (the test geometry of Dykhne's exact result).
 */
import { ProgrammerError } from "../../core/errors.js";

export type CellLatticeKind = "square" | "hex" | "rect";

export interface CellShape {
  /** computational cell size in units of the pitch */
  lx: number;
  ly: number;
  /** exact area fraction of the inclusion phase */
  fill: number;
  /** true when (x, y) (cell coordinates, 0 ≤ x < lx, 0 ≤ y < ly) is in the inclusion */
  inside(x: number, y: number): boolean;
  /** unit normal of the nearest interface at (x, y), written into out[0], out[1] */
  normal(x: number, y: number, out: Float64Array): void;
  /** distance from (x, y) to the nearest interface (a lower bound is enough) */
  distance(x: number, y: number): number;
  /** exact inclusion fraction of the rectangle centred at (cx, cy) with sides (w, h), when known in closed form */
  exactFraction?(cx: number, cy: number, w: number, h: number): number;
  /** true when the cell is mirror-symmetric in x and y (the tensor is then diagonal) */
  diagonal: boolean;
  /** square symmetry (xx = yy) */
  squareSymmetric: boolean;
}

/** Largest circle fill of a lattice (touching circles). */
export function maxCircleFill(lattice: CellLatticeKind, aspect = 1): number {
  if (lattice === "square") return Math.PI / 4;
  if (lattice === "hex") return Math.PI / (2 * Math.sqrt(3));
  const rMax = 0.5 * Math.min(1, aspect);
  return (Math.PI * rMax * rMax) / aspect;
}

/** Circle radius (units of the pitch) of a circle fill on a lattice. */
export function circleRadius(lattice: CellLatticeKind, fill: number, aspect = 1): number {
  const area = lattice === "hex" ? Math.sqrt(3) / 2 : lattice === "rect" ? aspect : 1;
  return Math.sqrt((fill * area) / Math.PI);
}

/** Circles of the inclusion phase on a lattice. */
export function circleCell(lattice: CellLatticeKind, fill: number, aspect = 1): CellShape {
  if (!(fill >= 0 && fill < maxCircleFill(lattice, aspect))) throw new ProgrammerError(`circleCell: fill ${fill} outside [0, ${maxCircleFill(lattice, aspect)})`);
  const r = circleRadius(lattice, fill, aspect);
  const lx = 1;
  const ly = lattice === "hex" ? Math.sqrt(3) : lattice === "rect" ? aspect : 1;
  const centres: number[] = lattice === "hex" ? [0.5, 0.5 * ly, 0, 0, 1, 0, 0, ly, 1, ly] : [0.5, 0.5 * ly];
  const nearest = (x: number, y: number): number => {
    let best = 0, bestD = Infinity;
    for (let c = 0; c < centres.length; c += 2) {
      const d = Math.hypot(x - centres[c], y - centres[c + 1]);
      if (d < bestD) { bestD = d; best = c; }
    }
    return best;
  };
  return {
    lx, ly, fill,
    inside(x, y) {
      const c = nearest(x, y);
      return Math.hypot(x - centres[c], y - centres[c + 1]) < r;
    },
    normal(x, y, out) {
      const c = nearest(x, y);
      const dx = x - centres[c], dy = y - centres[c + 1];
      const d = Math.hypot(dx, dy);
      if (d === 0) { out[0] = 1; out[1] = 0; return; }
      out[0] = dx / d; out[1] = dy / d;
    },
    distance(x, y) {
      const c = nearest(x, y);
      return Math.abs(Math.hypot(x - centres[c], y - centres[c + 1]) - r);
    },
    diagonal: true,
    squareSymmetric: lattice !== "rect",
  };
}

/** A laminate: inclusion layer of thickness `fill` (units of the pitch) normal to x, centred. */
export function laminateCell(fill: number): CellShape {
  const x0 = 0.5 - fill / 2, x1 = 0.5 + fill / 2;
  return {
    lx: 1, ly: 1, fill,
    inside: (x) => x >= x0 && x < x1,
    normal(_x, _y, out) { out[0] = 1; out[1] = 0; },
    distance: (x) => Math.min(Math.abs(x - x0), Math.abs(x - x1)),
    exactFraction(cx, _cy, w) {
      // overlap of [cx − w/2, cx + w/2] (periodic) with [x0, x1]
      let s = 0;
      for (const shift of [-1, 0, 1]) s += Math.max(0, Math.min(cx + w / 2, x1 + shift) - Math.max(cx - w / 2, x0 + shift));
      return s / w;
    },
    diagonal: true,
    squareSymmetric: false,
  };
}

/** Checkerboard: the inclusion fills two diagonally opposite quarters of the 1 × 1 cell. */
export function checkerboardCell(): CellShape {
  return {
    lx: 1, ly: 1, fill: 0.5,
    inside: (x, y) => (x < 0.5) !== (y < 0.5),
    normal(x, y, out) {
      const dx = Math.min(Math.abs(x - 0.5), x, 1 - x), dy = Math.min(Math.abs(y - 0.5), y, 1 - y);
      if (dx < dy) { out[0] = 1; out[1] = 0; } else { out[0] = 0; out[1] = 1; }
    },
    distance: (x, y) => Math.min(Math.abs(x - 0.5), x, 1 - x, Math.abs(y - 0.5), y, 1 - y),
    diagonal: true,
    squareSymmetric: true,
  };
}
