/**
 * The side-by-side comparison of reduction schemes, laid out for an 80-column terminal. Pure: the
 * command line prints `lines`; the interactive session can use `rows` and `columns` directly.
 */
import { formatNumber as f } from "./formatNumber.js";
import { significantAtLeast } from "../core/formatQuantity.js";
import { polarizationSummary, type Polarization } from "./polarization.js";
import type { NamedCell, SchemeSummary } from "./schemeMetrics.js";
import { REDUCTION_SCHEMES } from "./schemes/registry.js";

export interface SchemeTableColumn {
  key: string;
  title: string;
  width: number;
  align: "left" | "right";
}

export interface SchemeTableRow {
  scheme: string;
  /** the design's own choice */
  chosen: boolean;
  /** display text per column key */
  cells: Record<string, string>;
}

export interface SchemeTable {
  title: string;
  /** cost columns (first block) and value columns (second block) */
  costColumns: SchemeTableColumn[];
  valueColumns: SchemeTableColumn[];
  rows: SchemeTableRow[];
  notes: string[];
  /** everything above, as text lines of at most 80 characters */
  lines: string[];
}

const COST: SchemeTableColumn[] = [
  { key: "scheme", title: "scheme", width: 14, align: "left" },
  { key: "epsBelowOne", title: "ε<1 cells", width: 11, align: "right" },
  { key: "magnetic", title: "μ≠1 cells", width: 11, align: "right" },
  { key: "anisotropy", title: "anisotropy", width: 11, align: "right" },
  { key: "dropped", title: "dropped", width: 8, align: "right" },
  { key: "reflection", title: "R edge", width: 8, align: "right" },
  { key: "minIndex", title: "n_b min", width: 8, align: "right" },
];

const VALUES: SchemeTableColumn[] = [
  { key: "scheme", title: "scheme", width: 14, align: "left" },
  { key: "epsRange", title: "ε range", width: 16, align: "right" },
  { key: "muRange", title: "μ range", width: 16, align: "right" },
  { key: "impedance", title: "Z/Z_b edge", width: 14, align: "right" },
  { key: "undefined", title: "undefined", width: 10, align: "right" },
];

function pad(text: string, col: SchemeTableColumn): string {
  return col.align === "left" ? text.padEnd(col.width) : text.padStart(col.width);
}

function line(marker: string, cols: SchemeTableColumn[], cells: Record<string, string>): string {
  return marker + cols.map((c, k) => (k === 0 ? pad(cells[c.key], c) : " " + pad(cells[c.key], c))).join("");
}

function countCell(n: number, fraction: number): string {
  const pct = n === 0 ? "0%" : fraction < 0.01 ? "<1%" : `${Math.round(fraction * 100)}%`;
  return `${n} ${pct.padStart(4)}`;
}

function range(r: [number, number]): string {
  if (Number.isNaN(r[0])) return "–";
  const lo = f(r[0]), hi = f(r[1]);
  return lo === hi ? lo : `${lo}…${hi}`;
}

function reflection(r: number): string {
  if (Number.isNaN(r)) return "–";
  return r < 1e-9 ? "0" : f(r, 2);
}

function where(cell: NamedCell): string {
  return `(${f(cell.xM * 1000)}, ${f(cell.yM * 1000)}) mm`;
}

/** Break `text` at spaces into lines of at most `width`, continuation lines indented by 4. */
export function wrap(text: string, width: number): string[] {
  if (text.length <= width) return [text];
  const out: string[] = [];
  let rest = text;
  let indent = "";
  while (indent.length + rest.length > width) {
    const room = width - indent.length;
    let cut = rest.lastIndexOf(" ", room);
    if (cut <= 0) cut = room;
    out.push(indent + rest.slice(0, cut).trimEnd());
    rest = rest.slice(cut).trimStart();
    indent = "    ";
  }
  out.push(indent + rest);
  return out;
}

/**
 * Table of scheme summaries. `chosen` marks the design's own scheme with "*"; `epsFloor` is the
 * floor the n_b column refers to.
 */
export function schemeTable(
  summaries: readonly SchemeSummary[],
  options: { polarization: Polarization; chosen?: string; skipped?: { scheme: string; reason: string }[] },
): SchemeTable {
  const first = summaries[0];
  const cells = first?.cells ?? 0;
  const bgIndex = first?.backgroundIndex ?? 1;
  const floor = first?.epsFloor ?? 1;
  const title = `${options.polarization}: ${cells} cells, background index ${f(bgIndex)}`;
  const rows: SchemeTableRow[] = summaries.map((s) => ({
    scheme: s.scheme,
    chosen: s.scheme === options.chosen,
    cells: {
      scheme: s.scheme,
      epsBelowOne: countCell(s.cellsEpsBelowOne, s.fractionEpsBelowOne),
      magnetic: countCell(s.cellsMagnetic, s.fractionMagnetic),
      anisotropy: f(s.maxAnisotropy),
      dropped: s.scheme === "isotropic" ? f(s.maxDroppedAnisotropy) : "–",
      reflection: reflection(s.boundaryReflection),
      // rounded up: an index given back as printed still lifts every ε (significantAtLeast)
      minIndex: f(significantAtLeast(s.minBackgroundIndex, 3)),
      epsRange: range(s.epsRange),
      muRange: range(s.muRange),
      impedance: range([s.boundaryImpedance.min, s.boundaryImpedance.max]),
      undefined: String(s.undefinedCells),
    },
  }));
  const lines: string[] = [title, `  ${polarizationSummary(options.polarization)}`.slice(0, 80), ""];
  const header = (cols: SchemeTableColumn[]) => line("  ", cols, Object.fromEntries(cols.map((c) => [c.key, c.title])));
  lines.push(header(COST));
  for (const r of rows) lines.push(line(r.chosen ? "* " : "  ", COST, r.cells));
  lines.push("");
  lines.push(header(VALUES));
  for (const r of rows) lines.push(line(r.chosen ? "* " : "  ", VALUES, r.cells));
  lines.push("");

  const notes: string[] = [];
  if (rows.some((r) => r.chosen)) notes.push("* the design's own choice (reduction.scheme)");
  const b = first?.boundary;
  if (b && b.source !== "none") {
    notes.push(`R edge: worst normal-incidence power reflection at the outer edge (${b.source === "boundary-samples" ? `${b.samples} exact boundary points` : `${b.samples} edge cells, estimated`})`);
  } else if (first) {
    notes.push("R edge: no outer boundary found, reflection not estimated");
  }
  notes.push(`anisotropy: largest/smallest principal value of the kept in-plane tensor${options.polarization === "3D" ? " (3D: of ε or μ)" : ""}`);
  if (summaries.some((s) => s.scheme === "isotropic")) notes.push("dropped: largest in-plane index ratio σ1/σ2 the isotropic scheme ignores");
  notes.push(`n_b min: smallest background index with no ε below ${f(floor)}`);
  const capped = first?.capped ?? 0;
  if (capped > 0) notes.push(`capped cells: ${capped} (offset or capped at the singularity), e.g. ${first.cappedCells.slice(0, 2).map(where).join(", ")}`);
  const undefinedSame = summaries.length > 0 && summaries.every((s) => s.undefinedCells === first.undefinedCells &&
    s.undefinedList.map((c) => c.cell).join() === first.undefinedList.map((c) => c.cell).join());
  if (undefinedSame && first.undefinedCells > 0) {
    notes.push(`undefined in every scheme: ${first.undefinedCells} cells (not positive definite or not finite), e.g. ${first.undefinedList.slice(0, 2).map(where).join(", ")}`);
  } else {
    for (const s of summaries) {
      if (s.undefinedCells > 0) notes.push(`${s.scheme}: ${s.undefinedCells} cells undefined, e.g. ${s.undefinedList.slice(0, 2).map(where).join(", ")}`);
    }
  }
  if (first && first.outOfPlaneCells > 0) notes.push(`${first.outOfPlaneCells} cells couple the plane to z; the polarizations do not separate there`);
  for (const k of options.skipped ?? []) notes.push(`${k.scheme}: not computed (${k.reason})`);
  notes.push("");
  for (const s of summaries) notes.push(`  ${s.scheme.padEnd(14)}${REDUCTION_SCHEMES[s.scheme].summary}`);
  for (const n of notes) lines.push(...wrap(n, 80));
  return { title, costColumns: COST, valueColumns: VALUES, rows, notes, lines };
}
