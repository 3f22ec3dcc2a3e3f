/**
 * Generated robustness cases (fast-check): mutated demo designs, broken JSON text, imported field
 * CSVs and command-line arguments. Each case is written into its own temporary folder, run
 * in-process through the command line, and held to the invariants of invariants.ts. Used by
 * robustness.test.ts (a few hundred cases inside `npm test`) and by `npm run fuzz` (any number,
 * with a table of failure kinds).
 *
 * Grids are kept small (demo pitches are coarsened before mutating) so a case takes milliseconds
 * to a second; `verify` and `session` are left out (the full-wave check has its own tests and the
 * session needs a terminal).
 */
import fc from "fast-check";
import { mkdirSync, mkdtempSync, readFileSync, readdirSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join, resolve } from "node:path";
import { run, runProblems } from "./invariants.js";

const DEMO_DIR = resolve("demo-designs");
/** Demo designs with a pitch that keeps every case small (a few hundred cells). */
const DEMOS: Record<string, string> = {
  "field-radial-cloak.json": "4 mm",
  "field-concentrator.json": "4 mm",
  "field-rotator.json": "4 mm",
  "field-beam-shifter.json": "4 mm",
  "field-beam-bend.json": "6 mm",
  "field-expression.json": "8 mm",
  "field-spherical-cloak.json": "10 mm",
  "plan-microwave-mast-cloak.json": "",
  "plan-printed-bend.json": "3 mm",
  "plan-silicon-chip-bend.json": "",
  "plan-concentrator-subunity.json": "",
};

export interface FuzzCase {
  kind: "design" | "json" | "csv" | "args" | "verify";
  /** files to write into the case folder: name → text */
  files: Record<string, string>;
  /** argv; "@/" is replaced by the case folder */
  argv: string[];
}

function demoJson(name: string): any {
  const d = JSON.parse(readFileSync(join(DEMO_DIR, name), "utf8"));
  if (DEMOS[name]) d.grid.pitch = DEMOS[name];
  else if (typeof d.grid?.pitch === "string") {
    // plan demos: four times coarser than designed keeps them quick
    const m = /^([\d.e+-]+)\s*(\S+)$/.exec(d.grid.pitch);
    if (m) d.grid.pitch = `${Number(m[1]) * 4} ${m[2]}`;
  }
  return d;
}

/** Values that have broken parsers before: edge numbers, bare numbers, wrong types, odd strings. */
const nasty = fc.oneof(
  fc.constantFrom<unknown>(0, -1, 1, 2, 1e-300, 1e300, -1e300, 1e-12, 0.5, 60, 90, 360, 1e9, -0),
  fc.constantFrom<unknown>("", " ", "0", "90", "60", "-2 mm", "1e-30 mm", "1e300 m", "1e-300 m", "0 mm", "2 mm", "50 mm",
    "1 Hz", "10 GHz", "1e30 Hz", "90 deg", "1e400", "NaN", "Infinity", "abc", "3 kg", "x", "x^2", "1/0", "ptfe", "air",
    "Ez", "Hz", "full", "unit-mu", "isotropic", "matched", "non-magnetic", "linear", "quadratic", "\u0000", "\uFEFF", "🙂"),
  fc.constantFrom<unknown>(null, true, false, [], {}, [1], [0, 0], ["1 mm", "2 mm"], { a: 1 }, [[0, 0], [1, 0], [0, 1]]),
  fc.double({ noNaN: true }),
  fc.string({ maxLength: 12 }),
);

const DESIGN_PATHS = [
  ["frequency"], ["name"], ["polarization"], ["grid", "pitch"], ["grid", "origin"], ["grid", "slice"], ["background", "eps"], ["background", "mu"],
  ["transform", "kind"], ["transform", "innerRadius"], ["transform", "outerRadius"], ["transform", "angle"], ["transform", "referenceRadius"],
  ["transform", "shift"], ["transform", "length"], ["transform", "height"], ["transform", "compressedRadius"], ["transform", "cap"],
  ["transform", "innerOffset"], ["transform", "center"], ["transform", "profile"], ["transform", "virtual", "x"], ["transform", "virtual", "y"],
  ["transform", "region"], ["reduction", "scheme"], ["reduction", "backgroundIndex"], ["reduction", "unitAxis"], ["reduction", "epsFloor"],
  ["reduction", "muTolerance"], ["realization", "levels"], ["realization", "tolerance"], ["realization", "materials"], ["realization", "families"],
  ["realization", "process"], ["realization", "lattice"], ["realization", "maxAnisotropy"], ["realization", "bandwidth"], ["realization", "lossBudgetDb"],
];

function setPath(obj: any, path: string[], value: unknown, remove: boolean): void {
  let o = obj;
  for (let k = 0; k < path.length - 1; k++) {
    if (o[path[k]] === null || typeof o[path[k]] !== "object") o[path[k]] = {};
    o = o[path[k]];
  }
  if (remove) delete o[path[path.length - 1]];
  else o[path[path.length - 1]] = value;
}

const COMMANDS_ON_DESIGNS = ["field", "reduce", "plan"] as const;
const command = fc.constantFrom(...COMMANDS_ON_DESIGNS, "field", "reduce");

/** A demo with one to three keys set to nasty values or removed, run by field, reduce or plan. */
const designCase: fc.Arbitrary<FuzzCase> = fc
  .tuple(
    fc.constantFrom(...Object.keys(DEMOS)),
    fc.array(fc.tuple(fc.constantFrom(...DESIGN_PATHS), nasty, fc.boolean()), { minLength: 1, maxLength: 3 }),
    command,
    fc.constantFrom([], ["--json"], ["--out", "@/out"], ["--scheme", "full"], ["--polarization", "Hz"]),
  )
  .map(([demo, edits, cmd, extra]) => {
    const d = demoJson(demo);
    for (const [path, value, remove] of edits) setPath(d, path, value, remove);
    const opts = cmd === "plan" ? ["--out", "@/out", ...extra.filter((e) => e !== "--out" && e !== "@/out")] : cmd === "field" ? extra.filter((e) => !e.startsWith("--scheme") && e !== "full" && e !== "--polarization" && e !== "Hz").map((e) => (e === "@/out" ? "@/out/field.csv" : e)) : extra.map((e) => (e === "@/out" ? "@/out/reduced.csv" : e));
    if (cmd === "reduce" && opts.includes("--out") && !opts.includes("--scheme")) opts.push("--scheme", "full");
    return { kind: "design" as const, files: { "design.json": JSON.stringify(d, null, 2) }, argv: [cmd, "@/design.json", ...opts] };
  });

/** Demo JSON text with a few characters inserted, deleted or replaced (or a byte-order mark). */
const jsonCase: fc.Arbitrary<FuzzCase> = fc
  .tuple(
    fc.constantFrom(...Object.keys(DEMOS)),
    fc.array(fc.tuple(fc.double({ min: 0, max: 1, noNaN: true }), fc.constantFrom("insert", "delete", "replace"), fc.constantFrom("@", "{", "}", "[", "]", ",", ":", "\"", "\n", "\uFEFF", "\\", "x", "0", " ")), { minLength: 1, maxLength: 3 }),
    command,
  )
  .map(([demo, edits, cmd]) => {
    let text = JSON.stringify(demoJson(demo), null, 2);
    for (const [at, op, ch] of edits) {
      const k = Math.floor(at * text.length);
      text = op === "insert" ? text.slice(0, k) + ch + text.slice(k) : op === "delete" ? text.slice(0, k) + text.slice(k + 1) : text.slice(0, k) + ch + text.slice(k + 1);
    }
    return { kind: "json" as const, files: { "design.json": text }, argv: cmd === "plan" ? [cmd, "@/design.json", "--out", "@/out"] : [cmd, "@/design.json"] };
  });

const CSV_COLUMNS = ["x_m", "y_m", "eps_xx", "eps_yy", "eps_zz", "eps_xy", "eps_xz", "eps_yz"];
const cellValue = fc.oneof(
  { weight: 6, arbitrary: fc.constantFrom("1", "2", "2.5", "1.2", "4", "0", "0.5", "0.1") },
  { weight: 1, arbitrary: fc.constantFrom("-1e-12", "-3", "1e300", "1e-300", "", "abc", "NaN", "Infinity", "1e400", "0x10", " 2 ", "\"2\"") },
);

/** An imported field: a small grid (with holes, stray rows, far cells, odd values and headers). */
const csvCase: fc.Arbitrary<FuzzCase> = fc
  .tuple(
    fc.integer({ min: 1, max: 6 }),
    fc.integer({ min: 1, max: 6 }),
    fc.array(fc.array(cellValue, { minLength: 6, maxLength: 6 }), { minLength: 36, maxLength: 36 }),
    fc.constantFrom("none", "drop-column", "extra-column", "shuffle", "mu", "partial-mu", "far", "off-grid", "duplicate", "short-row", "comment", "empty", "header-only"),
    fc.constantFrom("2 mm", "1 mm", "4 mm"),
    command,
  )
  .map(([nx, ny, values, twist, pitch, cmd]) => {
    let header = [...CSV_COLUMNS];
    const rows: string[][] = [];
    for (let j = 0; j < ny; j++) for (let i = 0; i < nx; i++) rows.push([String(0.001 + 0.002 * i), String(0.001 + 0.002 * j), ...values[j * 6 + i]]);
    if (twist === "drop-column") { header = header.filter((h) => h !== "eps_zz"); for (const r of rows) r.splice(4, 1); }
    if (twist === "extra-column") { header.push("colour"); for (const r of rows) r.push("red"); }
    if (twist === "shuffle") { header = [header[1], header[0], ...header.slice(2)]; }
    if (twist === "mu") { header.push("mu_xx", "mu_yy", "mu_zz", "mu_xy", "mu_xz", "mu_yz"); for (const r of rows) r.push("1", "1", "2", "0", "0", "0"); }
    if (twist === "partial-mu") { header.push("mu_xx"); for (const r of rows) r.push("1"); }
    if (twist === "far") rows.push(["100.001", "100.001", "2", "2", "2", "0", "0", "0"]);
    if (twist === "off-grid" && rows.length > 1) rows[Math.floor(rows.length / 2)][0] = String(Number(rows[Math.floor(rows.length / 2)][0]) + 0.0003);
    if (twist === "duplicate") rows.push([...rows[0]]);
    if (twist === "short-row" && rows.length > 0) rows[rows.length - 1].pop();
    let text = [header.join(","), ...rows.map((r) => r.join(","))].join("\n") + "\n";
    if (twist === "comment") text = `# a comment\n${text}`;
    if (twist === "empty") text = "";
    if (twist === "header-only") text = `${header.join(",")}\n`;
    const design = { name: "fuzz import", frequency: "10 GHz", transform: { kind: "imported", file: "field.csv" }, grid: { pitch }, polarization: "Ez", realization: { materials: ["ptfe", "air", "alumina-96"], families: ["laminate", "rods-in-host"] } };
    return {
      kind: "csv" as const,
      files: { "field.csv": text, "design.json": JSON.stringify(design) },
      argv: cmd === "plan" ? [cmd, "@/design.json", "--out", "@/out"] : cmd === "field" ? [cmd, "@/design.json", "--out", "@/out/field.csv"] : [cmd, "@/design.json"],
    };
  });

const OPTION_VALUES = fc.constantFrom("", "0", "-1", "1e300", "1e-300", "abc", "3", "0.05", "5%", "Ez", "Hz", "full", "unit-mu", "isotropic", "larger",
  "10 GHz", "1 Hz", "1550 nm", "1e300 m", "1e-300 m", "2 mm", "1e-30 mm", "ptfe", "gold", "air", "alumina-96", "copper", "square", "hex", "cubic",
  "parallel", "perpendicular", "mg-sphere", "mg-ellipsoid", "bruggeman-2d", "series", "-10+1i", "2.2+0.01j", "1e308", "1e-308", "45 mm,20 mm", "x", "@/out");

const ARG_COMMANDS: Record<string, { positional: string[]; options: string[] }> = {
  material: { positional: ["gold", "ptfe", "water", "nosuch", "silicon"], options: ["--list", "--class", "--frequency", "--wavelength", "--json"] },
  mix: { positional: [], options: ["--rule", "--host", "--inclusion", "--fill", "--target", "--depolarization", "--aspect", "--frequency", "--wavelength", "--tolerance", "--json"] },
  cell: { positional: ["rods-in-host", "holes-in-slab", "spheres-in-host", "cubes-in-host", "laminate", "strut-lattice", "wire-medium", "split-ring", "nosuch"], options: ["--pitch", "--frequency", "--lattice", "--host", "--inclusion", "--fill", "--target", "--axis", "--tolerance", "--process", "--height", "--radius", "--metal", "--ring-gap", "--json"] },
  field: { positional: ["@/../demo/field-radial-cloak.json", "@/nofile.json"], options: ["--out", "--at", "--json"] },
  reduce: { positional: ["@/../demo/field-rotator.json"], options: ["--polarization", "--scheme", "--unit-axis", "--background-index", "--eps-floor", "--mu-tolerance", "--at", "--out", "--json"] },
  plan: { positional: ["@/../demo/field-beam-shifter.json"], options: ["--out", "--json", "--levels", "--tolerance", "--polarization", "--scheme", "--background-index", "--check"] },
};

/** A command with random options and values (including empty, negative, huge and misspelt ones). */
const argsCase: fc.Arbitrary<FuzzCase> = fc
  .tuple(
    fc.constantFrom(...Object.keys(ARG_COMMANDS)),
    fc.nat(),
    fc.array(fc.tuple(fc.nat(), OPTION_VALUES, fc.boolean()), { minLength: 0, maxLength: 6 }),
  )
  .map(([cmd, pick, opts]) => {
    const spec = ARG_COMMANDS[cmd];
    const argv = [cmd];
    if (spec.positional.length) argv.push(spec.positional[pick % spec.positional.length]);
    for (const [k, value, joined] of opts) {
      const name = spec.options[k % spec.options.length];
      if (name === "--json" || name === "--list") argv.push(name);
      else if (joined) argv.push(`${name}=${value}`);
      else argv.push(name, value);
    }
    if (cmd === "plan" && !argv.includes("--out") && !argv.some((a) => a.startsWith("--out="))) argv.push("--out", "@/out");
    return { kind: "args" as const, files: {}, argv };
  });

const VERIFY_VALUES = fc.constantFrom("", "0", "-1", "1e300", "1e-300", "abc", "3", "6", "12", "0.05", "5%", "50%", "0.5%", "Ez", "Hz", "full", "unit-mu",
  "isotropic", "non-magnetic", "matched", "auto", "fdfd", "radial", "ground", "free", "20 mm", "1e-30 mm", "1e300 m", "30 deg", "90", "-45", "400",
  "10 mm, 5 mm", "10 mm, 500 mm", "8 mm, 2 mm, 1 mm", "0 s", "2 s", "10 min", "1e300 s", "9 GHz..10 GHz:2", "10 GHz..9 GHz:2", "1 Hz..2 Hz:2",
  "9 GHz..10 GHz:1", "9 GHz..10 GHz:1e9", "23 GHz..25 GHz:2", "9..10:2", "1", "2", "@/out");

const VERIFY_OPTIONS = ["--polarization", "--scheme", "--accuracy", "--resolution", "--angle", "--beam", "--scene", "--margin", "--drawn-time", "--method",
  "--sweep", "--threshold", "--workers", "--json", "--out"];

/**
 * `verify` with random options on two small field demos (a cloak: radial and grid solvers; a
 * shifter: beams). `--resolution 6` comes first so a case that parses runs one coarse grid in
 * about a second; a later `--resolution` or `--accuracy` replaces or conflicts with it.
 */
export const verifyArgsCase: fc.Arbitrary<FuzzCase> = fc
  .tuple(
    fc.constantFrom("field-radial-cloak.json", "field-beam-shifter.json"),
    fc.array(fc.tuple(fc.nat(), VERIFY_VALUES, fc.boolean()), { minLength: 0, maxLength: 5 }),
  )
  .map(([demo, opts]) => {
    const argv = ["verify", `@/../demo/${demo}`, "--resolution", "6"];
    for (const [k, value, joined] of opts) {
      const name = VERIFY_OPTIONS[k % VERIFY_OPTIONS.length];
      if (name === "--json") argv.push(name);
      else if (joined) argv.push(`${name}=${value}`);
      else argv.push(name, value);
    }
    return { kind: "verify" as const, files: {}, argv };
  });

export const fuzzCase: fc.Arbitrary<FuzzCase> = fc.oneof(
  { weight: 4, arbitrary: designCase },
  { weight: 2, arbitrary: jsonCase },
  { weight: 2, arbitrary: csvCase },
  { weight: 3, arbitrary: argsCase },
);

/**
 * A design's own name is echoed in headings; a name that is literally "NaN" or "Infinity" is the
 * user's text, not a computed value, so it is taken out before the output is checked.
 */
function echoedNameRemoved<R extends { out: string; err: string }>(r: R, designText: string | undefined): R {
  let name: unknown;
  try { name = designText === undefined ? undefined : JSON.parse(designText).name; } catch { return r; }
  if (typeof name !== "string" || !/NaN|Infinity|undefined/.test(name)) return r;
  return { ...r, out: r.out.replaceAll(name, "<name>"), err: r.err.replaceAll(name, "<name>") };
}

/** Run one case in a fresh folder; returns the invariant problems (empty: passed). `onExit` hears the exit code. */
export async function runCase(c: FuzzCase, root: string, onExit?: (code: number) => void): Promise<string[]> {
  const dir = mkdtempSync(join(root, "case-"));
  const demo = join(root, "demo");
  try {
    for (const [name, text] of Object.entries(c.files)) writeFileSync(join(dir, name), text);
    const argv = c.argv.map((a) => a.replace("@/../demo", demo).replace(/@\//g, `${dir}/`));
    const r = echoedNameRemoved(await run(argv, dir), c.files["design.json"]);
    onExit?.(r.code);
    const out = join(dir, "out");
    const problems = runProblems(r, out, true);
    // files written next to the case (outside out/) after an input error are partial output too
    if (r.code === 1) {
      const stray = readdirSync(dir).filter((n) => !(n in c.files) && n !== "out");
      if (stray.length) problems.push(`files written after an input error: ${stray.join(", ")}`);
    }
    return problems;
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

/** A folder for a run of cases (`root`, else a new one), with the demos the argument cases read copied under demo/. */
export function fuzzRoot(root = mkdtempSync(join(tmpdir(), "cw-fuzz-"))): string {
  const demo = join(root, "demo");
  mkdirSync(demo);
  for (const name of ["field-radial-cloak.json", "field-rotator.json", "field-beam-shifter.json"]) {
    writeFileSync(join(demo, name), JSON.stringify(demoJson(name)));
  }
  return root;
}

/** A failure's kind: its first problem with numbers, paths and quoted text taken out. */
export function failureKind(problems: string[]): string {
  return problems[0]
    .replace(/\/tmp\/\S+/g, "PATH")
    .replace(/ in "[^"]*"/g, "")
    .replace(/'[^']{24,}'/g, "'…'")
    .replace(/-?\d+(\.\d+)?(e[+-]?\d+)?/gi, "N")
    .slice(0, 110);
}
