/**
 * The material catalog (catalogs/materials.csv): read, validate every row, cache.
 *
 * Columns (header row required, any order):
 *   id, name, class, model, params, valid_min_hz, valid_max_hz, mu_r, conductivity_s_per_m, source
 * `params` is "key=value; key=value" with the model's SI keys (see src/media/dispersion/); any key
 * ending in _hz may instead be given as _thz (terahertz) or _cm1 (wavenumber in cm⁻¹, f = c·ν̃),
 * converted here. `mu_r` and `conductivity_s_per_m` may be empty. A bad row is an InputError whose
 * issues name "materials.csv:LINE:COLUMN"; all issues are reported at once.
 */
import { readFile } from "node:fs/promises";
import { fileURLToPath } from "node:url";
import { parse } from "csv-parse/sync";
import { InputError, type InputIssue, unknownWithSuggestion } from "../core/errors.js";
import { SPEED_OF_LIGHT } from "../media/dispersion/dispersionModel.js";
import { DISPERSION_MODEL_IDS, DISPERSION_MODELS, isDispersionModelId } from "../media/dispersion/registry.js";
import { checkModelInRange, validateDispersionParams } from "../media/dispersion/validateParams.js";
import { MATERIAL_CLASSES, type Material, type MaterialClass } from "../media/material.js";

export const MATERIAL_COLUMNS = [
  "id",
  "name",
  "class",
  "model",
  "params",
  "valid_min_hz",
  "valid_max_hz",
  "mu_r",
  "conductivity_s_per_m",
  "source",
] as const;
const REQUIRED = new Set(["id", "name", "class", "model", "params", "valid_min_hz", "valid_max_hz", "source"]);

/** Path of the bundled catalog, resolved from this module (works from src/io and dist/io). */
export const MATERIAL_CATALOG_URL = new URL("../../catalogs/materials.csv", import.meta.url);

/** Parse "key=value; key=value" into SI numbers, converting _thz and _cm1 keys to _hz. */
export function parseParamsCell(text: string): { params: Record<string, number>; problems: string[] } {
  const params: Record<string, number> = {};
  const problems: string[] = [];
  for (const part of text.split(";").map((s) => s.trim()).filter((s) => s !== "")) {
    const eq = part.indexOf("=");
    if (eq <= 0) {
      problems.push(`expected key=value, got '${part}'`);
      continue;
    }
    let key = part.slice(0, eq).trim();
    const raw = part.slice(eq + 1).trim();
    let value = Number(raw);
    if (raw === "" || !Number.isFinite(value)) {
      problems.push(`${key}: expected a finite number, got '${raw}'`);
      continue;
    }
    if (key.endsWith("_thz")) {
      key = `${key.slice(0, -4)}_hz`;
      value *= 1e12;
    } else if (key.endsWith("_cm1")) {
      key = `${key.slice(0, -4)}_hz`;
      value *= SPEED_OF_LIGHT * 100;
    }
    if (key in params) problems.push(`${key} given twice`);
    params[key] = value;
  }
  return { params, problems };
}

/**
 * Validate and convert catalog rows (pure). `rows[0]` is the header; `lineNumbers[k]` is the file
 * line of rows[k] (default k + 1). Throws one InputError listing every problem, each at
 * "fileLabel:LINE:COLUMN".
 */
export function parseMaterialRows(rows: readonly (readonly string[])[], fileLabel: string, lineNumbers?: readonly number[]): Material[] {
  const issues: InputIssue[] = [];
  const lineOf = (k: number) => lineNumbers?.[k] ?? k + 1;
  if (rows.length === 0) throw new InputError({ where: `${fileLabel}:1:1`, message: "expected a header row" });
  const header = rows[0].map((h) => h.trim());
  const col: Record<string, number> = {};
  header.forEach((h, k) => {
    if (!(MATERIAL_COLUMNS as readonly string[]).includes(h)) {
      issues.push({ where: `${fileLabel}:${lineOf(0)}:${k + 1}`, message: unknownWithSuggestion("column", h, MATERIAL_COLUMNS) });
    } else if (h in col) {
      issues.push({ where: `${fileLabel}:${lineOf(0)}:${k + 1}`, message: `column '${h}' given twice` });
    } else col[h] = k;
  });
  for (const name of REQUIRED) if (!(name in col)) issues.push({ where: `${fileLabel}:${lineOf(0)}:1`, message: `missing column '${name}'` });
  if (issues.length) throw new InputError(issues);

  const out: Material[] = [];
  const seen = new Map<string, number>();
  for (let k = 1; k < rows.length; k++) {
    const row = rows[k];
    const line = lineOf(k);
    const at = (name: string) => `${fileLabel}:${line}:${col[name] + 1}`;
    const cell = (name: string) => (col[name] === undefined ? "" : (row[col[name]] ?? "").trim());
    const rowIssues: InputIssue[] = [];
    const bad = (name: string, message: string) => rowIssues.push({ where: at(name), message });
    if (row.length !== header.length) {
      rowIssues.push({ where: `${fileLabel}:${line}:1`, message: `expected ${header.length} columns, got ${row.length}` });
      issues.push(...rowIssues);
      continue;
    }
    const id = cell("id");
    if (!/^[a-z0-9][a-z0-9-]*$/.test(id)) bad("id", `expected a lower-case id (letters, digits, '-'), got '${id}'`);
    else if (seen.has(id)) bad("id", `duplicate id '${id}' (first on line ${seen.get(id)})`);
    else seen.set(id, line);
    const name = cell("name");
    if (name === "") bad("name", "expected a name");
    const cls = cell("class");
    if (!(MATERIAL_CLASSES as readonly string[]).includes(cls)) bad("class", unknownWithSuggestion("class", cls, MATERIAL_CLASSES));
    const source = cell("source");
    if (source === "") bad("source", "expected a source (publication, handbook, 'common practice' or 'from memory')");
    const num = (columnName: string, optional: boolean): number | undefined => {
      const t = cell(columnName);
      if (t === "" && optional) return undefined;
      const v = Number(t);
      if (t === "" || !Number.isFinite(v)) {
        bad(columnName, `expected a finite number, got '${t}'`);
        return undefined;
      }
      return v;
    };
    const validMinHz = num("valid_min_hz", false);
    const validMaxHz = num("valid_max_hz", false);
    if (validMinHz !== undefined && !(validMinHz > 0)) bad("valid_min_hz", `expected a frequency > 0 Hz, got ${validMinHz}`);
    if (validMinHz !== undefined && validMaxHz !== undefined && !(validMaxHz > validMinHz)) bad("valid_max_hz", `expected more than valid_min_hz (${validMinHz}), got ${validMaxHz}`);
    const muR = num("mu_r", true);
    if (muR !== undefined && !(muR > 0)) bad("mu_r", `expected a relative permeability > 0, got ${muR}`);
    const conductivity = num("conductivity_s_per_m", true);
    if (conductivity !== undefined && !(conductivity >= 0)) bad("conductivity_s_per_m", `expected a conductivity ≥ 0 S/m, got ${conductivity}`);
    const model = cell("model");
    let params: Record<string, number> = {};
    if (!isDispersionModelId(model)) bad("model", unknownWithSuggestion("dispersion model", model, DISPERSION_MODEL_IDS));
    else {
      const parsed = parseParamsCell(cell("params"));
      params = parsed.params;
      for (const p of parsed.problems) bad("params", p);
      if (parsed.problems.length === 0) {
        const m = DISPERSION_MODELS[model];
        for (const p of validateDispersionParams(m, params)) bad("params", p.message);
        if (rowIssues.length === 0 && validMinHz !== undefined && validMaxHz !== undefined) {
          for (const p of checkModelInRange(m, params, validMinHz, validMaxHz)) bad("params", p);
        }
      }
    }
    if (rowIssues.length) {
      issues.push(...rowIssues);
      continue;
    }
    out.push({
      id,
      name,
      class: cls as MaterialClass,
      model: model as Material["model"],
      params: Object.freeze(params),
      validMinHz: validMinHz as number,
      validMaxHz: validMaxHz as number,
      source,
      ...(muR !== undefined ? { mu: { re: muR, im: 0 } } : {}),
      ...(conductivity !== undefined ? { conductivitySPerM: conductivity } : {}),
    });
  }
  if (issues.length) throw new InputError(issues);
  return out;
}

/** Parse catalog CSV text (header first); issues name `fileLabel:LINE:COLUMN`. */
export function parseMaterialCsv(text: string, fileLabel: string): Material[] {
  let records: { record: string[]; info: { lines: number } }[];
  try {
    records = parse(text, { info: true, skip_empty_lines: true, relax_column_count: true, bom: true }) as never;
  } catch (err) {
    const e = err as { lines?: number; message?: string };
    throw new InputError({ where: `${fileLabel}:${e.lines ?? 1}:1`, message: `not valid CSV: ${(e.message ?? String(err)).toLowerCase()}` });
  }
  return parseMaterialRows(records.map((r) => r.record), fileLabel, records.map((r) => r.info.lines));
}

/** Read and validate a catalog file (not cached). */
export async function readMaterialCatalogFile(path: string | URL, fileLabel = "materials.csv"): Promise<Material[]> {
  const text = await readFile(typeof path === "string" ? path : fileURLToPath(path), "utf8");
  return parseMaterialCsv(text, fileLabel);
}

let cached: Promise<Material[]> | null = null;

/** The bundled catalog, read and validated once per process. */
export function loadMaterialCatalog(): Promise<Material[]> {
  if (!cached) {
    cached = readMaterialCatalogFile(MATERIAL_CATALOG_URL);
    cached.catch(() => {
      cached = null;
    });
  }
  return cached;
}

/** The material with this id; InputError with the closest ids when there is none. */
export function findMaterial(catalog: readonly Material[], id: string, where = "material"): Material {
  const m = catalog.find((x) => x.id === id);
  if (!m) throw new InputError({ where, message: unknownWithSuggestion("material", id, catalog.map((x) => x.id)) });
  return m;
}
