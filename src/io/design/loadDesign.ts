/**
 * Read and validate a design file. JSON syntax errors carry line and column; schema problems are
 * collected as InputError issues with where = "<file>: $.a.b[0]" and a short expected-message;
 * unknown keys get a "did you mean". Expression maps are compiled here (mathjs, once); an
 * imported field's `file` is resolved relative to the design file.
 */
import { promises as fs } from "node:fs";
import { dirname, resolve } from "node:path";
import type { z } from "zod";
import { InputError, unknownWithSuggestion, type InputIssue } from "../../core/errors.js";
import { TRANSFORM_KINDS } from "../../field/transforms/registry.js";
import type { TransformSpec } from "../../field/transformSpec.js";
import { compileExpressionMap } from "../expressionMap.js";
import { findJsonProblem } from "../jsonProblem.js";
import { resolveQuasiConformal, resolveLaplaceShell, type ParsedQuasiConformal, type ParsedLaplaceShell } from "./computedMapSpecs.js";
import { prepareQuantities, quantitiesNeedMath, resetQuantityNeeds } from "./quantitySchema.js";
import { designSchema, DESIGN_KEYS, BACKGROUND_KEYS, type Design } from "./designSchema.js";
import { TRANSFORM_KEYS } from "./transformSchema.js";
import { GRID_KEYS } from "./gridSchema.js";
import { REGION_SHAPES } from "./regionSchema.js";
import { reductionSchema } from "./reductionSchema.js";
import { realizationSchema } from "./realizationSchema.js";

/** "$.transform.region.polygon[2]" */
export function jsonPath(path: readonly PropertyKey[]): string {
  return "$" + path.map((p) => (typeof p === "number" ? `[${p}]` : `.${String(p)}`)).join("");
}

function valueAt(json: unknown, path: readonly PropertyKey[]): unknown {
  let v: any = json;
  for (const p of path) {
    if (v === null || typeof v !== "object") return undefined;
    v = v[p as any];
  }
  return v;
}

/** A JSON value for a message: short, on one line, its type named when it is not a scalar. */
export function describeValue(value: unknown): string {
  if (value === undefined) return "nothing (the key is missing)";
  if (Array.isArray(value)) return `an array of ${value.length}`;
  if (value !== null && typeof value === "object") return "an object";
  const text = JSON.stringify(value) ?? String(value);
  return text.length > 60 ? `${text.slice(0, 57)}…"` : text;
}

const LENGTH_KEYS = ["innerRadius", "outerRadius", "compressedRadius", "referenceRadius", "radius", "length", "height", "shift", "innerOffset", "pitch"];
const ANGLE_KEYS = ["angle"];

/**
 * "bare numbers are SI" spelled out for the keys a message is about whose JSON value is a bare
 * number: 60 for innerRadius is 60 m, "90" for angle is 90 rad.
 */
function bareNumberHint(json: unknown, path: readonly PropertyKey[], message: string): string {
  const parent = valueAt(json, path.slice(0, -1));
  if (parent === null || typeof parent !== "object") return "";
  const last = String(path[path.length - 1]);
  const keys = Object.keys(parent).filter((k) => k === last || new RegExp(`\\b${k}\\b`).test(message));
  const hints: string[] = [];
  for (const k of keys) {
    const v = (parent as Record<string, unknown>)[k];
    const bare = typeof v === "number" || (typeof v === "string" && v.trim() !== "" && Number.isFinite(Number(v)));
    if (!bare) continue;
    if (LENGTH_KEYS.includes(k)) hints.push(`${k} ${JSON.stringify(v)} is a bare number, read as ${Number(v)} m (bare numbers are SI); write e.g. '${Number(v)} mm' for millimetres`);
    if (ANGLE_KEYS.includes(k)) hints.push(`${k} ${JSON.stringify(v)} is a bare number, read as ${Number(v)} rad (bare numbers are SI); write '${Number(v)} deg' for degrees`);
  }
  return hints.length ? ` (${hints.join("; ")})` : "";
}

/** What each key expects, for "missing" messages. */
const EXPECTED: Record<string, string> = {
  name: "a string naming the design",
  frequency: "a frequency such as '10 GHz'",
  transform: `an object with a kind (${TRANSFORM_KINDS.join(", ")})`,
  grid: "an object such as { \"pitch\": \"3 mm\" }",
  pitch: "a length such as '3 mm'",
  kind: `one of ${TRANSFORM_KINDS.join(", ")}`,
  innerRadius: "a length such as '20 mm'",
  outerRadius: "a length such as '40 mm'",
  compressedRadius: "a length such as '30 mm'",
  referenceRadius: "a length such as '30 mm'",
  radius: "a length such as '20 mm'",
  length: "a length such as '60 mm'",
  height: "a length such as '40 mm'",
  shift: "a length such as '10 mm'",
  angle: "an angle such as '90 deg'",
  virtual: "an object { \"x\": \"…\", \"y\": \"…\" } of expressions in x, y (metres)",
  x: "an expression of x and y (metres)",
  y: "an expression of x and y (metres)",
  region: `an object with one of ${REGION_SHAPES.join(", ")}`,
  file: "the path of a field CSV",
  min: "a point [x, y]",
  max: "a point [x, y]",
  scheme: "a reduction scheme name",
};

/** Keys known at a JSON path (for unknown-key suggestions), or null when not tracked. */
function knownKeys(json: unknown, path: readonly PropertyKey[]): string[] | null {
  const p = path.join(".");
  if (p === "") return DESIGN_KEYS;
  if (p === "grid") return GRID_KEYS;
  if (p === "background") return BACKGROUND_KEYS;
  if (p === "reduction") return Object.keys(reductionSchema.shape);
  if (p === "realization") return Object.keys(realizationSchema.shape);
  if (p === "transform") {
    const kind = valueAt(json, ["transform", "kind"]);
    return typeof kind === "string" ? TRANSFORM_KEYS[kind] ?? null : null;
  }
  const kind = valueAt(json, ["transform", "kind"]);
  if (kind === "quasi-conformal") {
    if (p === "transform.virtual") return ["rectangle", "fit"];
    if (p === "transform.virtual.rectangle") return ["min", "max"];
    if (p === "transform.sides") return ["bottom", "right", "top", "left"];
    if (/^transform\.sides\.(bottom|right|top|left)$/.test(p)) return ["x", "y", "points"];
  }
  if (kind === "laplace-shell" && /^transform\.(inner|outer)$/.test(p)) return ["r", "points"];
  if (p === "transform.virtual") return ["x", "y"];
  if (p === "transform.region") return [...REGION_SHAPES];
  if (p === "transform.region.circle") return ["center", "radius"];
  if (p === "transform.region.annulus") return ["center", "innerRadius", "outerRadius"];
  if (p === "transform.region.rectangle") return ["min", "max"];
  return null;
}

/** Turn one zod issue into our issues (unknown keys become one issue each). */
function toIssues(file: string, json: unknown, issue: z.core.$ZodIssue): InputIssue[] {
  const path = issue.path;
  const here = `${file}: ${jsonPath(path)}`;
  if (issue.code === "unrecognized_keys") {
    const known = knownKeys(json, path) ?? [];
    return issue.keys.map((k) => ({ where: `${file}: ${jsonPath([...path, k])}`, message: unknownWithSuggestion("key", k, known) }));
  }
  const value = valueAt(json, path);
  const last = path[path.length - 1];
  const expected = typeof last === "string" ? EXPECTED[last] : undefined;
  if (value === undefined && (issue.code === "invalid_type" || issue.code === "invalid_union")) {
    return [{ where: here, message: `missing; expected ${expected ?? (issue.code === "invalid_type" ? `a ${issue.expected}` : "a value")}` }];
  }
  if (last === "kind" && path.length === 2 && path[0] === "transform") {
    if (typeof value !== "string") return [{ where: here, message: `expected a transform kind (${TRANSFORM_KINDS.join(", ")}) as a string, got ${describeValue(value)}` }];
    return [{ where: here, message: unknownWithSuggestion("transform kind", describeValue(value).slice(1, -1), TRANSFORM_KINDS) }];
  }
  if (issue.code === "invalid_union" && expected) {
    return [{ where: here, message: `expected ${expected}, got ${describeValue(value)}` }];
  }
  if (issue.code === "invalid_type") {
    const got = Array.isArray(value) ? "an array" : value === null ? "null" : `a ${typeof value}`;
    return [{ where: here, message: `expected ${expected ?? `a ${issue.expected}`}, got ${got}` }];
  }
  if (issue.code === "invalid_value") {
    return [{ where: here, message: `expected one of ${issue.values.map((v) => JSON.stringify(v)).join(", ")}, got ${describeValue(value)}` }];
  }
  const message = issue.message.charAt(0).toLowerCase() + issue.message.slice(1);
  return [{ where: here, message: `${message}${issue.code === "custom" ? bareNumberHint(json, path, message) : ""}` }];
}

/**
 * Validate parsed JSON as a design (no file access). `sourcePath` names the file in messages;
 * an imported field's relative `file` is resolved against its directory (from `cwd`).
 * Throws InputError listing every problem.
 */
export async function parseDesign(json: unknown, sourcePath: string, cwd: string = process.cwd()): Promise<Design> {
  if (json === null || typeof json !== "object" || Array.isArray(json)) {
    throw new InputError({ where: `${sourcePath}: $`, message: "expected a JSON object with name, frequency, transform and grid" });
  }
  // common quantities parse without mathjs; a design with any other one is parsed again with it
  resetQuantityNeeds();
  let result = designSchema.safeParse(json);
  if (quantitiesNeedMath()) {
    await prepareQuantities();
    result = designSchema.safeParse(json);
  }
  if (!result.success) {
    const issues = result.error.issues.flatMap((i) => toIssues(sourcePath, json, i));
    const seen = new Set<string>();
    throw new InputError(issues.filter((i) => {
      const key = `${i.where}|${i.message}`;
      if (seen.has(key)) return false;
      seen.add(key);
      return true;
    }));
  }
  const d = result.data;
  let transform: TransformSpec;
  if (d.transform.kind === "expression") {
    const compiled = await compileExpressionMap(d.transform.virtual, `${sourcePath}: $.transform.virtual`);
    transform = { ...d.transform, compiled };
  } else if (d.transform.kind === "quasi-conformal") {
    transform = await resolveQuasiConformal(d.transform as ParsedQuasiConformal, d.grid.pitchM, sourcePath);
  } else if (d.transform.kind === "laplace-shell") {
    transform = await resolveLaplaceShell(d.transform as ParsedLaplaceShell, d.grid.pitchM, sourcePath);
  } else if (d.transform.kind === "imported") {
    transform = { kind: "imported", file: resolve(cwd, dirname(sourcePath), d.transform.file) };
  } else {
    transform = d.transform as TransformSpec;
  }
  const design: Design = {
    name: d.name,
    frequencyHz: d.frequency,
    background: { eps: d.background.eps, mu: d.background.mu },
    transform,
    grid: d.grid,
    sourcePath,
  };
  if (d.notes !== undefined) design.notes = d.notes;
  if (d.polarization !== undefined) design.polarization = d.polarization;
  if (d.reduction !== undefined) design.reduction = d.reduction;
  if (d.realization !== undefined) design.realization = d.realization;
  return design;
}

/** Line and column (1-based) of a character offset. */
function lineColumn(text: string, offset: number): { line: number; column: number } {
  let line = 1, start = 0;
  for (let k = 0; k < offset && k < text.length; k++) if (text[k] === "\n") { line++; start = k + 1; }
  return { line, column: offset - start + 1 };
}

/**
 * Read, parse and validate a design file (`path` relative to `cwd`). Messages name the path as
 * given. Throws InputError for a missing file, bad JSON (with line:column) or a schema problem.
 */
export async function loadDesign(path: string, cwd: string = process.cwd()): Promise<Design> {
  let text: string;
  try {
    text = await fs.readFile(resolve(cwd, path), "utf8");
  } catch (err) {
    const code = (err as NodeJS.ErrnoException).code;
    throw new InputError({ where: path, message: code === "ENOENT" ? "file not found; expected a design JSON file" : `cannot read the file (${code ?? "error"})` });
  }
  // a byte-order mark at the start is not part of the JSON text; RFC 8259 §8.1 lets parsers ignore it
  if (text.charCodeAt(0) === 0xfeff) text = text.slice(1);
  let json: unknown;
  try {
    json = JSON.parse(text);
  } catch {
    // our own scanner names the first character that does not fit (engines' messages vary and
    // some carry no position); the message never quotes raw text
    const problem = findJsonProblem(text) ?? { offset: text.length, message: "not valid JSON" };
    const { line, column } = lineColumn(text, problem.offset);
    throw new InputError({ where: `${path}:${line}:${column}`, message: `invalid JSON: ${problem.message}` });
  }
  return parseDesign(json, path, cwd);
}
