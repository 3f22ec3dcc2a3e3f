/**
 * The fabrication-process catalog, catalogs/processes.csv: one process per row.
 * Columns: id, name, min_feature_m, min_gap_m, max_aspect_ratio (positive numbers, SI),
 * material_classes (';'-separated, from MATERIAL_CLASSES), source (publication or "common practice").
 * Every bad cell is reported at once with its line and column.
 */
import { readFile } from "node:fs/promises";
import { fileURLToPath } from "node:url";
import { parse } from "csv-parse/sync";
import { InputError, unknownWithSuggestion, type InputIssue } from "../core/errors.js";
import { MATERIAL_CLASSES, type Process } from "../cells/process.js";

export const PROCESS_CATALOG_URL = new URL("../../catalogs/processes.csv", import.meta.url);

const COLUMNS = ["id", "name", "min_feature_m", "min_gap_m", "max_aspect_ratio", "material_classes", "source"] as const;

/** Parse the CSV text of a process catalog; `file` names it in messages. Throws InputError with every issue. */
export function parseProcessCatalog(text: string, file = "processes.csv"): Process[] {
  const issues: InputIssue[] = [];
  let rows: string[][];
  try {
    rows = parse(text, { skip_empty_lines: true, trim: true, relax_column_count: true }) as string[][];
  } catch (err) {
    throw new InputError({ where: file, message: `not valid CSV: ${((err as Error).message ?? "").split("\n")[0].toLowerCase()}` });
  }
  if (rows.length === 0) throw new InputError({ where: file, message: "empty file; expected a header row" });
  const header = rows[0];
  const index: Record<string, number> = {};
  for (const col of COLUMNS) {
    const k = header.indexOf(col);
    if (k < 0) issues.push({ where: `${file}:1`, message: `missing column '${col}'` });
    index[col] = k;
  }
  if (issues.length) throw new InputError(issues);
  const out: Process[] = [];
  const seen = new Set<string>();
  rows.slice(1).forEach((row, k) => {
    const line = k + 2;
    const cell = (col: (typeof COLUMNS)[number]): string => row[index[col]] ?? "";
    const at = (col: (typeof COLUMNS)[number]): string => `${file}:${line}:${index[col] + 1}`;
    const num = (col: (typeof COLUMNS)[number]): number => {
      const v = Number(cell(col));
      if (cell(col) === "" || !Number.isFinite(v) || v <= 0) issues.push({ where: at(col), message: `${col}: expected a positive number, got '${cell(col)}'` });
      return v;
    };
    const id = cell("id");
    if (!/^[a-z0-9][a-z0-9-]*$/.test(id)) issues.push({ where: at("id"), message: `id: expected lower-case letters, digits and '-', got '${id}'` });
    else if (seen.has(id)) issues.push({ where: at("id"), message: `id: duplicate '${id}'` });
    seen.add(id);
    const name = cell("name");
    if (!name) issues.push({ where: at("name"), message: "name: expected a name" });
    const minFeatureM = num("min_feature_m");
    const minGapM = num("min_gap_m");
    const maxAspectRatio = num("max_aspect_ratio");
    const classes = cell("material_classes").split(";").map((s) => s.trim()).filter(Boolean);
    if (classes.length === 0) issues.push({ where: at("material_classes"), message: "material_classes: expected at least one class" });
    for (const c of classes) {
      if (!(MATERIAL_CLASSES as readonly string[]).includes(c)) issues.push({ where: at("material_classes"), message: `material_classes: ${unknownWithSuggestion("material class", c, MATERIAL_CLASSES)}` });
    }
    const source = cell("source");
    if (!source) issues.push({ where: at("source"), message: "source: expected a publication or 'common practice'" });
    out.push({ id, name, minFeatureM, minGapM, maxAspectRatio, materialClasses: classes, source });
  });
  if (issues.length) throw new InputError(issues);
  return out;
}

/** Read and parse the process catalog (the shipped one unless `path` is given). */
export async function loadProcessCatalog(path?: string): Promise<Process[]> {
  const file = path ?? fileURLToPath(PROCESS_CATALOG_URL);
  let text: string;
  try {
    text = await readFile(file, "utf8");
  } catch (err) {
    throw new InputError({ where: file, message: `cannot read the process catalog (${(err as NodeJS.ErrnoException).code ?? "error"})` });
  }
  return parseProcessCatalog(text, path ?? "catalogs/processes.csv");
}

/** The process with this id; InputError naming `where` with the closest ids when unknown. */
export function findProcess(catalog: readonly Process[], id: string, where = "--process"): Process {
  const p = catalog.find((x) => x.id === id);
  if (!p) throw new InputError({ where, message: unknownWithSuggestion("process", id, catalog.map((x) => x.id)) });
  return p;
}
