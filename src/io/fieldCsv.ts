/**
 * Per-cell field CSV: written by `field --out` (atomically, streamed in chunks) and read back for
 * `imported` designs (streamed with csv-parse). Columns:
 *   i, j, [k,] x_m, y_m, [z_m,] eps_xx, eps_yy, eps_zz, eps_xy, eps_xz, eps_yz, mu_xx … mu_yz,
 *   eps_p1, eps_p2, eps_p3, mu_p1, mu_p2, mu_p3, eps_anisotropy, mu_anisotropy, det_j, capped
 * (k and z_m only for 3D grids). On import only x_m, y_m and the six eps components are required;
 * missing mu columns mean μ = 1; principal values and anisotropy are recomputed; det_j and capped
 * are kept when present. Numbers are written in JavaScript's shortest round-trip form; undefined
 * values (anisotropy of a cell that is not positive definite) are left empty.
 */
import { createReadStream } from "node:fs";
import { stat } from "node:fs/promises";
import { relative, isAbsolute } from "node:path";
import { InputError, unknownWithSuggestion } from "../core/errors.js";
import { SYM_COMPONENTS, allocSymField } from "../core/symTensor.js";
import type { TensorField } from "../field/tensorField.js";
import { computeTensorField } from "../field/computeTensorField.js";
import { inferGrid } from "../field/inferGrid.js";
import { fieldFromArrays } from "../field/fieldFromArrays.js";
import type { FieldDesign } from "../field/transformSpec.js";
import { writeStreamAtomic } from "./atomicWrite.js";
import { memoryBudget } from "./memoryLimit.js";
import { cellBudgetProblem, type MemoryPurpose } from "../core/memoryBudget.js";

const EPS_COLUMNS = SYM_COMPONENTS.map((c) => `eps_${c}`);
const MU_COLUMNS = SYM_COMPONENTS.map((c) => `mu_${c}`);
const DERIVED = ["eps_p1", "eps_p2", "eps_p3", "mu_p1", "mu_p2", "mu_p3", "eps_anisotropy", "mu_anisotropy"];

/** Header of the CSV `field --out` writes. */
export function fieldCsvColumns(dimension: 2 | 3): string[] {
  const pos = dimension === 3 ? ["i", "j", "k", "x_m", "y_m", "z_m"] : ["i", "j", "x_m", "y_m"];
  return [...pos, ...EPS_COLUMNS, ...MU_COLUMNS, ...DERIVED, "det_j", "capped"];
}

/** Undefined values (NaN, or the infinite anisotropy of a cell that is not positive definite) are empty. */
const num = (v: number): string => (Number.isFinite(v) ? String(v) : "");

/** Write the per-cell CSV atomically (nothing appears under `path` unless every row was written). */
export async function writeFieldCsv(path: string, field: TensorField): Promise<void> {
  const g = field.grid;
  const three = g.dimension === 3;
  const { eps, mu } = field;
  const [e1, e2, e3] = field.epsPrincipal, [m1, m2, m3] = field.muPrincipal;
  await writeStreamAtomic(path, async (write) => {
    await write(fieldCsvColumns(g.dimension).join(",") + "\n");
    const CHUNK = 2048;
    for (let start = 0; start < g.count; start += CHUNK) {
      const lines: string[] = [];
      const end = Math.min(g.count, start + CHUNK);
      for (let c = start; c < end; c++) {
        const pos = three
          ? `${g.i[c]},${g.j[c]},${g.k[c]},${num(g.xM[c])},${num(g.yM[c])},${num(g.zM[c])}`
          : `${g.i[c]},${g.j[c]},${num(g.xM[c])},${num(g.yM[c])}`;
        lines.push([
          pos,
          num(eps.xx[c]), num(eps.yy[c]), num(eps.zz[c]), num(eps.xy[c]), num(eps.xz[c]), num(eps.yz[c]),
          num(mu.xx[c]), num(mu.yy[c]), num(mu.zz[c]), num(mu.xy[c]), num(mu.xz[c]), num(mu.yz[c]),
          num(e1[c]), num(e2[c]), num(e3[c]), num(m1[c]), num(m2[c]), num(m3[c]),
          num(field.epsAnisotropy[c]), num(field.muAnisotropy[c]), num(field.detJ[c]), String(field.capped[c]),
        ].join(","));
      }
      await write(lines.join("\n") + "\n");
    }
  });
}

/** A Float64Array that grows by doubling. */
class Column {
  data = new Float64Array(1024);
  length = 0;
  push(v: number): void {
    if (this.length === this.data.length) {
      const next = new Float64Array(this.data.length * 2);
      next.set(this.data);
      this.data = next;
    }
    this.data[this.length++] = v;
  }
  values(): Float64Array {
    return this.data.subarray(0, this.length);
  }
}

export interface ReadFieldOptions {
  /** name of the file in messages (default: the path) */
  label?: string;
  /** the design's pitch: the inferred pitch must match it (and is used for single-cell files) */
  expectedPitchM?: number;
  /** where to blame a pitch mismatch */
  pitchWhere?: string;
  background?: { eps: number; mu: number };
}

/**
 * Stream a field CSV into a TensorField. Throws InputError naming "<file>:<line>:<column>" for a
 * bad value, "<file>:1" for a bad header, "<file>:<line>" for a row off the grid or repeated.
 */
export async function readFieldCsv(path: string, options: ReadFieldOptions = {}): Promise<TensorField> {
  const label = options.label ?? path;
  // the CSV parser is loaded only when a CSV is read: computed designs never pay for it
  const { parse } = await import("csv-parse");
  const source = createReadStream(path);
  const parser = source.pipe(
    parse({ info: true, relax_column_count: true, skip_empty_lines: true, trim: true, comment: "#", comment_no_infix: true }),
  );
  // pipe() does not forward read errors: hand them to the parser so the loop below rejects
  source.on("error", (err: NodeJS.ErrnoException) =>
    parser.destroy(new InputError({ where: label, message: `cannot read the file (${err.code ?? err.message})` })));
  let header: string[] | null = null;
  let want: { name: string; index: number; optional: boolean }[] = [];
  let cols: Column[] = [];
  const lines = new Column();
  let width = 0;
  let hasMu = false, zIndex = -1;
  try {
    for await (const { record, info } of parser as AsyncIterable<{ record: string[]; info: { lines: number } }>) {
      const line = info.lines;
      if (!header) {
        header = record;
        width = record.length;
        const known = [...fieldCsvColumns(3)];
        for (const name of record) {
          if (!known.includes(name)) throw new InputError({ where: `${label}:${line}`, message: `${unknownWithSuggestion("column", name, known)}` });
        }
        const missing = ["x_m", "y_m", ...EPS_COLUMNS].filter((c) => !record.includes(c));
        if (missing.length) throw new InputError({ where: `${label}:${line}`, message: `missing column${missing.length > 1 ? "s" : ""} ${missing.join(", ")}; expected x_m, y_m and the six eps components` });
        const muGiven = MU_COLUMNS.filter((c) => record.includes(c));
        if (muGiven.length > 0 && muGiven.length < 6) {
          throw new InputError({ where: `${label}:${line}`, message: `missing columns ${MU_COLUMNS.filter((c) => !record.includes(c)).join(", ")}; expected all six mu components or none (μ = 1)` });
        }
        hasMu = muGiven.length === 6;
        zIndex = record.indexOf("z_m");
        const names = ["x_m", "y_m", ...EPS_COLUMNS, ...(hasMu ? MU_COLUMNS : []), "det_j", "capped"];
        want = names.map((name) => ({ name, index: record.indexOf(name), optional: name === "det_j" || name === "capped" }));
        cols = want.map(() => new Column());
        continue;
      }
      if (record.length !== width) {
        throw new InputError({ where: `${label}:${line}`, message: `expected ${width} columns as in the header, got ${record.length}` });
      }
      for (let w = 0; w < want.length; w++) {
        const { name, index, optional } = want[w];
        if (index < 0) { cols[w].push(name === "capped" ? 0 : NaN); continue; }
        const text = record[index];
        if (optional && text === "") { cols[w].push(name === "capped" ? 0 : NaN); continue; }
        const v = Number(text);
        if (text === "" || !Number.isFinite(v) || (name === "capped" && v !== 0 && v !== 1)) {
          throw new InputError({
            where: `${label}:${line}:${index + 1}`,
            message: `expected ${name === "capped" ? "0 or 1" : "a finite number"} in column ${name}, got '${text}'`,
          });
        }
        cols[w].push(v);
      }
      if (zIndex >= 0 && Number(record[zIndex]) !== 0) {
        throw new InputError({ where: `${label}:${line}:${zIndex + 1}`, message: "expected z_m = 0: only 2D fields can be imported" });
      }
      lines.push(line);
    }
  } catch (err) {
    if (err instanceof InputError) throw err;
    const e = err as NodeJS.ErrnoException & { lines?: number };
    if (e.code === "ENOENT") throw new InputError({ where: label, message: "file not found; expected a field CSV" });
    if (typeof e.code === "string" && e.code.startsWith("CSV_")) {
      throw new InputError({ where: `${label}${e.lines ? `:${e.lines}` : ""}`, message: `malformed CSV: ${e.message.charAt(0).toLowerCase()}${e.message.slice(1)}` });
    }
    throw err;
  }
  if (!header) throw new InputError({ where: label, message: "empty file; expected a header row and one row per cell" });
  const n = lines.length;
  if (n === 0) throw new InputError({ where: label, message: "no rows; expected one row per cell" });
  const col = (name: string): Float64Array => cols[want.findIndex((w) => w.name === name)].values();
  const lineOf = lines.values();
  const { grid, order } = inferGrid(col("x_m"), col("y_m"), (r) => `${label}:${lineOf[r]}`, options.expectedPitchM ?? NaN);
  if (!Number.isFinite(grid.pitchM)) {
    throw new InputError({ where: label, message: "cannot infer the pitch from a single cell; expected at least two cells" });
  }
  if (options.expectedPitchM !== undefined && Math.abs(grid.pitchM - options.expectedPitchM) > 1e-6 * options.expectedPitchM) {
    throw new InputError({
      where: options.pitchWhere ?? label,
      message: `the imported field has a pitch of ${grid.pitchM} m; expected the design's grid pitch to match (got ${options.expectedPitchM} m)`,
    });
  }
  const eps = allocSymField(n), mu = allocSymField(n);
  const detJ = new Float64Array(n), capped = new Uint8Array(n);
  const srcDet = col("det_j"), srcCap = col("capped");
  for (const c of SYM_COMPONENTS) {
    const e = col(`eps_${c}`), m = hasMu ? col(`mu_${c}`) : null;
    const unit = c === "xx" || c === "yy" || c === "zz" ? 1 : 0;
    for (let q = 0; q < n; q++) {
      eps[c][q] = e[order[q]];
      mu[c][q] = m ? m[order[q]] : unit;
    }
  }
  for (let q = 0; q < n; q++) { detJ[q] = srcDet[order[q]]; capped[q] = srcCap[order[q]]; }
  return fieldFromArrays("imported", grid, options.background ?? { eps: 1, mu: 1 }, eps, mu, detJ, capped);
}

/** A path relative to the working directory when that is shorter and stays inside it. */
function displayPath(file: string): string {
  const rel = relative(process.cwd(), file);
  return rel && !rel.startsWith("..") && !isAbsolute(rel) ? rel : file;
}

/**
 * The field of any design: computed for built-in kinds and expression maps, streamed from the CSV
 * for `imported`. Commands call this.
 */
export async function loadFieldForDesign(design: FieldDesign, purpose: MemoryPurpose = "plan"): Promise<TensorField> {
  const budget = memoryBudget(purpose);
  // a plan never reads det J, the principal values or the anisotropy ratios: made only if read
  if (design.transform.kind !== "imported") return computeTensorField(design, undefined, budget, { derived: purpose === "plan" ? "lazy" : "eager" });
  // a missing or unreadable file is the user's mistake, named at the design key that points to it
  try {
    const st = await stat(design.transform.file);
    if (!st.isFile()) throw new InputError({ where: `${design.sourcePath}: $.transform.file`, message: `expected a CSV file, got a folder: ${design.transform.file}` });
  } catch (err) {
    if (err instanceof InputError) throw err;
    throw new InputError({ where: `${design.sourcePath}: $.transform.file`, message: `cannot read the imported field CSV ${design.transform.file} (${(err as NodeJS.ErrnoException).code ?? "error"})` });
  }
  const field = await readFieldCsv(design.transform.file, {
    label: displayPath(design.transform.file),
    expectedPitchM: design.grid.pitchM,
    pitchWhere: `${design.sourcePath}: $.grid.pitch`,
    background: design.background,
  });
  const tooMany = cellBudgetProblem(field.grid.count, field.grid.pitchM, 2, budget);
  if (tooMany !== null) throw new InputError({ where: `${design.sourcePath}: $.transform.file`, message: tooMany });
  return computeTensorField(design, field);
}
