/**
 * The invariants every run of the command line must keep, whatever the input (shared by the
 * regression tests and the generated robustness cases in robustness.test.ts / `npm run fuzz`):
 * - the exit code is 0, 1, 2 (or 130 when interrupted); 3 is a bug;
 * - an input error names where (a file, a JSON path, a line or an option);
 * - no NaN, Infinity or `undefined` in human output or in any file written;
 * - every CSV row has the header's column count;
 * - after an error (exit 1) nothing new is left in the output folder, temporary files included.
 */
import { readdirSync, readFileSync, statSync } from "node:fs";
import { join } from "node:path";
import { parse } from "csv-parse/sync";
import { runCli } from "../../src/cli/run.js";
import { bufferIo } from "../../src/cli/cliIo.js";

export interface RunResult {
  code: number;
  out: string;
  err: string;
}

/** Run the command line in-process with `cwd`, collecting stdout and stderr. */
export async function run(argv: string[], cwd: string): Promise<RunResult> {
  const io = bufferIo(cwd);
  const code = await runCli(argv, io);
  return { code, out: io.out(), err: io.err() };
}

/** Every file under `dir` (relative paths), recursively. */
export function listFiles(dir: string, prefix = ""): string[] {
  const out: string[] = [];
  let names: string[];
  try { names = readdirSync(join(dir, prefix)); } catch { return out; }
  for (const name of names.sort()) {
    const rel = prefix ? join(prefix, name) : name;
    if (statSync(join(dir, rel)).isDirectory()) out.push(`${rel}/`, ...listFiles(dir, rel));
    else out.push(rel);
  }
  return out;
}

/**
 * NaN and Infinity never belong in output. "undefined" is an English word (and a reduce flag), so
 * only its JavaScript-leak shapes count: after "=", "got" or a number, or before a unit.
 */
const BAD_TOKEN = /\bNaN\b|-?\bInfinity\b|(=|\bgot|\d)[ \t]*undefined\b|\bundefined[ \t]*(m|mm|µm|nm|Hz|GHz|MHz|THz|%|deg|dB)\b|"undefined"/;

/** Problems found in a text written for people or files ("" names the stream). */
export function textProblems(name: string, text: string): string[] {
  // a message quoting the user's own value back ('got "Infinity"', 'got \'NaN\'') is an echo, not a leak
  const own = text.replace(/\bgot ("[^"\n]*"|'[^'\n]*')/g, (_, q: string) => `got ${q[0]}${"·".repeat(q.length - 2)}${q[0]}`);
  const m = BAD_TOKEN.exec(own);
  if (!m) return [];
  const start = Math.max(0, m.index - 60);
  return [`${name}: '${m[0]}' in "${text.slice(start, m.index + 40).replace(/\n/g, "⏎")}"`];
}

/** Rows whose column count differs from the header's. */
export function csvProblems(name: string, text: string): string[] {
  let rows: string[][];
  try {
    rows = parse(text, { relax_column_count: true, comment: "#", comment_no_infix: true, skip_empty_lines: true }) as string[][];
  } catch (err) {
    return [`${name}: unreadable CSV: ${(err as Error).message}`];
  }
  if (rows.length === 0) return [`${name}: empty CSV`];
  const width = rows[0].length;
  const bad = rows.findIndex((r) => r.length !== width);
  if (bad >= 0) return [`${name}: row ${bad + 1} has ${rows[bad].length} columns, the header ${width}`];
  const flags = rows[0].indexOf("flags");
  for (let r = 1; r < rows.length; r++) {
    const k = rows[r].findIndex((v, c) => v === "undefined" && c !== flags);
    if (k >= 0) return [`${name}: row ${r + 1}, column ${rows[0][k]}: 'undefined'`];
  }
  return [];
}

/** A place named at the start of every error line: file, JSON path, line or option. */
export function errorNamesPlace(err: string): boolean {
  const lines = err.split("\n").filter((l) => l.startsWith("error: "));
  return lines.length > 0 && lines.every((l) => /^error: (\S[^:]*(:\d+)*: |--?[a-z]|[a-z]+: )/.test(l));
}

/**
 * Check one run against the invariants. `outDir` is where it may have written (checked for
 * temporary files and, after an error, for anything at all when `emptyBefore`).
 */
export function runProblems(r: RunResult, outDir: string | null, emptyBefore: boolean): string[] {
  const p: string[] = [];
  if (![0, 1, 2].includes(r.code)) p.push(`exit code ${r.code}: ${r.err.slice(0, 300)}`);
  if (r.err.includes("internal error")) p.push(`internal error: ${r.err.slice(0, 300)}`);
  if (r.code === 1 && !errorNamesPlace(r.err)) p.push(`input error without a place: ${r.err.slice(0, 300)}`);
  // an error may quote what the user wrote ("got 'NaN'"): quoted text on stderr is theirs
  p.push(...textProblems("stdout", r.out), ...textProblems("stderr", r.err.replace(/'[^'\n]*'/g, "'…'")));
  if (outDir) {
    const files = listFiles(outDir);
    const temps = files.filter((f) => /\.tmp\b|\.partial|^\.cellwright-/.test(f.split("/").pop() ?? "") || f.includes("/.cellwright-"));
    if (temps.length) p.push(`temporary files left: ${temps.join(", ")}`);
    if (r.code === 1 && emptyBefore && files.length) p.push(`files written after an input error: ${files.join(", ")}`);
    for (const f of files) {
      if (f.endsWith("/")) continue;
      const text = readFileSync(join(outDir, f), "utf8");
      p.push(...textProblems(f, text));
      if (f.endsWith(".csv")) p.push(...csvProblems(f, text));
    }
  }
  return p;
}
