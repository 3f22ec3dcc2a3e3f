/**
 * `npm run fuzz -- --cases N --seed S [--verify]`: run N generated robustness cases (fuzzCases.ts; with
 * --verify, `verify` with random options) and print
 * a table of failure kinds with a reproducing example each. Exit 0 when every case kept the
 * invariants, 1 otherwise.
 */
import fc from "fast-check";
import { rmSync } from "node:fs";
import { parseArgs } from "node:util";
import { failureKind, fuzzCase, fuzzRoot, runCase, verifyArgsCase, type FuzzCase } from "./fuzzCases.js";

const { values } = parseArgs({ options: { cases: { type: "string", default: "1000" }, seed: { type: "string", default: "1" }, verify: { type: "boolean", default: false } } });
const cases = Number(values.cases), seed = Number(values.seed);
if (!(Number.isInteger(cases) && cases > 0) || !Number.isInteger(seed)) {
  process.stderr.write("usage: npm run fuzz -- --cases N --seed S [--verify]\n");
  process.exit(1);
}
// the command line reports progress on stderr; keep the console for the table
const root = fuzzRoot();
const kinds = new Map<string, { count: number; example: FuzzCase; problem: string }>();
const byKind = new Map<string, number>();
const exits = new Map<number, number>();
let failed = 0;
const started = Date.now();
// --verify: only `verify` with random options (about 0.1 s a case; the other kinds take milliseconds).
// A bare number is metres, so a margin of "2" legitimately asks for a 1300² grid and 3 minutes: the
// memory limit keeps such cases to their refusal (the path under test) unless the caller set one
if (values.verify && !process.env.CELLWRIGHT_MEMORY_LIMIT) process.env.CELLWRIGHT_MEMORY_LIMIT = "200 MB";
const samples = fc.sample(values.verify ? verifyArgsCase : fuzzCase, { numRuns: cases, seed });
for (let k = 0; k < samples.length; k++) {
  const c = samples[k];
  byKind.set(c.kind, (byKind.get(c.kind) ?? 0) + 1);
  let problems: string[];
  try {
    problems = await runCase(c, root, (code) => exits.set(code, (exits.get(code) ?? 0) + 1));
  } catch (err) {
    problems = [`harness threw: ${(err as Error).message}`];
  }
  if (problems.length) {
    failed++;
    const kind = `${c.kind} ${c.argv[0]}: ${failureKind(problems)}`;
    const entry = kinds.get(kind);
    if (entry) entry.count++;
    else kinds.set(kind, { count: 1, example: c, problem: problems[0] });
  }
  if ((k + 1) % 250 === 0) process.stderr.write(`… ${k + 1}/${cases} cases, ${failed} failing, ${Math.round((Date.now() - started) / 1000)} s\n`);
}
rmSync(root, { recursive: true, force: true });
const mix = [...byKind].map(([k, n]) => `${k} ${n}`).join(", ");
const codes = [...exits].sort((a, b) => a[0] - b[0]).map(([code, n]) => `${n} × ${code}`).join(", ");
console.log(`${cases} cases (seed ${seed}; ${mix}; exit codes ${codes}), ${failed} failing, ${kinds.size} kinds, ${Math.round((Date.now() - started) / 1000)} s`);
if (kinds.size) {
  console.log("");
  console.log("| count | kind | example argv |");
  console.log("| ---: | --- | --- |");
  for (const [kind, e] of [...kinds].sort((a, b) => b[1].count - a[1].count)) {
    console.log(`| ${e.count} | ${kind.replace(/\|/g, "\\|")} | ${e.example.argv.join(" ").replace(/\|/g, "\\|").slice(0, 100)} |`);
  }
}
process.exitCode = failed ? 1 : 0;
