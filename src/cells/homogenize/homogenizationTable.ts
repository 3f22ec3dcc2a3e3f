/**
 * Solved effective in-plane permittivity of circles (rods or holes) on square and hexagonal
 * lattices, read from the shipped solved tables (squareCircleTable.ts, hexCircleTable.ts; generator
 * src/bench/buildCellTables.ts) and interpolated: natural cubic splines in the fill on each contrast
 * row (built once, on first use, per lattice), then four-point Lagrange interpolation in log10 of
 * the contrast u = ε_inc/ε_host.
 *
 * Complex permittivities: ε_eff = ε_host·F(u) with F analytic in u (Bergman 1978; Milton 2002,
 * ch. 18); for complex u = u′ + iu″ the table gives F(u′) + iu″F′(u′), exact to first order in u″.
 * The neglected term is ½u″²|F″(u′)|; `lossError` reports it (estimated from the table) so a caller
 * can refuse strongly lossy pairs.
 *
 * Validity: 10⁻³ ≤ u′ ≤ 10³ and the fill inside the table (square ≤ 0.70, hex ≤ 0.80); outside,
 * `inTable` is false and the caller falls back to a direct solve or says the cell is not solved.
 * Error: the larger of the nodes' ladder estimate and an envelope in the contrast,
 * 1e-4 + 8e-4·(log10 u)², calibrated on the square table against the published closed form of
 * Perrins, McKenzie & McPhedran (1979) for f ≤ 0.5 (where that form is good to ~1e-5): the worst
 * deviation found per contrast node is 8e-5 at |log10 u| = 0.25, 4e-4 at 1, 2.5e-3 at 2 and 7.1e-3
 * at 3, while the Richardson estimate alone under-states it by up to 36× at some nodes. The
 * interpolation error adds to it (tests compare off-node points with direct solves).
 */
import { cDiv, cMul, complex, type Complex } from "../../core/complex.js";
import { HEX_CIRCLES } from "./hexCircleTable.js";
import { SQUARE_CIRCLES } from "./squareCircleTable.js";
import { CIRCLE_TABLE_FILLS, CIRCLE_TABLE_LOG10_U } from "./circleTableNodes.js";
import { naturalSplineAt, naturalSplineMoments } from "../../numerics/naturalCubicSpline.js";

export type TableLattice = "square" | "hex";

interface Prepared {
  lu: readonly number[];
  fills: readonly number[];
  values: readonly (readonly number[])[];
  errors: readonly (readonly number[])[];
  /** spline second derivatives per row */
  m2: Float64Array[];
}

const prepared = new Map<TableLattice, Prepared>();

/** Calibrated error envelope of the solved tables in the contrast u (module comment). */
export const tableErrorEnvelope = (u: number): number => 1e-4 + 8e-4 * Math.log10(u) ** 2;

function prepare(lattice: TableLattice): Prepared {
  let p = prepared.get(lattice);
  if (!p) {
    const data = lattice === "square" ? SQUARE_CIRCLES : HEX_CIRCLES;
    const fills = CIRCLE_TABLE_FILLS[lattice];
    const values = data.values as readonly (readonly number[])[];
    p = { lu: CIRCLE_TABLE_LOG10_U[lattice], fills, values, errors: data.errors as readonly (readonly number[])[], m2: values.map((row) => naturalSplineMoments(fills, row)) };
    prepared.set(lattice, p);
  }
  return p;
}

/** Largest fill the table covers. */
export const tableMaxFill = (lattice: TableLattice): number => {
  const f = CIRCLE_TABLE_FILLS[lattice];
  return f[f.length - 1];
};

export interface TableValue {
  /** F(u′) = ε_eff/ε_host for real contrast */
  f: number;
  /** dF/du at u′ */
  dFdu: number;
  /** estimated relative error (ladder estimate of the neighbouring nodes) */
  error: number;
  inTable: boolean;
}

/** F and dF/du for real contrast u > 0 at `fill` (see the module comment for the range). */
export function circleTableValue(lattice: TableLattice, u: number, fill: number): TableValue {
  const p = prepare(lattice);
  const LU = p.lu;
  const lu = Math.log10(u);
  const inTable = lu >= LU[0] - 1e-12 && lu <= LU[LU.length - 1] + 1e-12 && fill >= 0 && fill <= tableMaxFill(lattice) + 1e-12;
  const luc = Math.min(LU[LU.length - 1], Math.max(LU[0], lu));
  const fc = Math.min(tableMaxFill(lattice), Math.max(0, fill));
  // four rows around luc
  const step = LU[1] - LU[0];
  let k0 = Math.floor((luc - LU[0]) / step) - 1;
  k0 = Math.max(0, Math.min(LU.length - 4, k0));
  const ys = [0, 0, 0, 0];
  let err = 0;
  const fk = Math.min(p.fills.length - 1, p.fills.findIndex((x) => x >= fc));
  for (let r = 0; r < 4; r++) {
    ys[r] = naturalSplineAt(p.fills, p.values[k0 + r], p.m2[k0 + r], fc);
    err = Math.max(err, p.errors[k0 + r][Math.max(0, fk)], p.errors[k0 + r][Math.max(0, fk - 1)]);
  }
  // Lagrange through (LU[k0+r], ys[r]) and its derivative in log10 u
  let val = 0, der = 0;
  for (let i = 0; i < 4; i++) {
    const xi = LU[k0 + i];
    let li = 1;
    let dli = 0;
    for (let j = 0; j < 4; j++) {
      if (j === i) continue;
      const xj = LU[k0 + j];
      li *= (luc - xj) / (xi - xj);
      let prod = 1 / (xi - xj);
      for (let m = 0; m < 4; m++) {
        if (m === i || m === j) continue;
        prod *= (luc - LU[k0 + m]) / (xi - LU[k0 + m]);
      }
      dli += prod;
    }
    val += ys[i] * li;
    der += ys[i] * dli;
  }
  // dF/du = dF/dlog10u / (u ln 10)
  return { f: val, dFdu: der / (u * Math.LN10), error: Math.max(err, tableErrorEnvelope(u)), inTable };
}

/** Complex ε_eff across the circles (in-plane) by the table; first order in Im u (module comment). */
export function solvedInPlane(lattice: TableLattice, host: Complex, inclusion: Complex, fill: number): { eps: Complex; error: number; inTable: boolean; lossError: number } {
  const u = cDiv(inclusion, host);
  const ur = u.re > 0 ? u.re : 1e-300;
  const t = circleTableValue(lattice, ur, fill);
  const F = complex(t.f, u.im * t.dFdu);
  // second-order term estimate: ½ u″² |F″| ≈ ½ u″² |ΔF′/Δu| from a neighbouring point
  const t2 = circleTableValue(lattice, ur * 1.05, fill);
  const f2 = Math.abs((t2.dFdu - t.dFdu) / (0.05 * ur));
  const lossError = (0.5 * u.im * u.im * f2) / Math.max(Math.abs(t.f), 1e-12);
  return { eps: cMul(host, F), error: t.error, inTable: t.inTable && u.re > 0, lossError };
}
