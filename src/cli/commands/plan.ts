/**
 * `cellwright plan <design.json>`: the main job — from the design's tensor field to a cell-by-cell
 * build list, levels, report, summary and maps in one output folder (written as one unit).
 * Exit 0: every cell has a recipe; 2: outputs complete but some cells have none; 1: bad input
 * (nothing written).
 */
import { InputError } from "../../core/errors.js";
import { expectedTimeWarning, planSeconds } from "../../core/timeEstimate.js";
import { loadDesign } from "../../io/design/loadDesign.js";
import { loadFieldForDesign } from "../../io/fieldCsv.js";
import { loadMaterialCatalog } from "../../io/materialCatalog.js";
import { preparePlanOutputs, writePlanOutputs } from "../../io/planOutputs.js";
import { checkOutputSet } from "../../io/outputSet.js";
import { loadProcessCatalog } from "../../io/processCatalog.js";
import { loadSessionFile } from "../../io/sessionFile.js";
import { planSummary } from "../../plan/outputs/planSummary.js";
import { planFromField } from "../../plan/runPlan.js";
import type { Plan, PlanOverrides } from "../../plan/planTypes.js";
import { flagOption, stringOption } from "../args.js";
import type { CliIo } from "../cliIo.js";
import type { Command, ParsedArgs } from "../command.js";
import { EXIT_INPUT, EXIT_INTERRUPTED, EXIT_NOT_BUILDABLE, EXIT_OK } from "../run.js";
import { runInterruptible } from "../interruptible.js";
import { givenBackgroundIndex } from "../../plan/resolveSettings.js";
import { checkBackgroundMaterialBeforeReduction } from "../../verify/sweep/backgroundAtFrequency.js";
import { join, resolve } from "node:path";

export const DEFAULT_OUT_DIR = "cellwright-out";

/** Command-line overrides (--levels, --tolerance, --polarization, --scheme). */
export function optionOverrides(args: ParsedArgs): PlanOverrides {
  const o: PlanOverrides = {};
  const levels = stringOption(args, "levels");
  if (levels !== undefined) {
    const v = Number(levels);
    if (!Number.isInteger(v) || v < 1 || v > 256) throw new InputError({ where: "--levels", message: `expected a whole number from 1 to 256, got '${levels}'` });
    o.levels = v;
  }
  const tol = stringOption(args, "tolerance");
  if (tol !== undefined) {
    const v = Number(tol.trim().endsWith("%") ? Number(tol.trim().slice(0, -1)) / 100 : tol);
    if (!(v > 0 && v <= 1)) throw new InputError({ where: "--tolerance", message: `expected a relative error in (0, 1], e.g. 0.03 or 3%, got '${tol}'` });
    o.tolerance = v;
  }
  const pol = stringOption(args, "polarization");
  if (pol !== undefined) {
    if (pol !== "Ez" && pol !== "Hz") throw new InputError({ where: "--polarization", message: `expected Ez or Hz, got '${pol}'` });
    o.polarization = pol;
  }
  const scheme = stringOption(args, "scheme");
  if (scheme !== undefined) {
    const names = ["full", "unit-mu", "non-magnetic", "isotropic", "matched"] as const;
    if (!(names as readonly string[]).includes(scheme)) throw new InputError({ where: "--scheme", message: `expected one of ${names.join(", ")}, got '${scheme}'` });
    o.scheme = scheme as (typeof names)[number];
  }
  const nb = stringOption(args, "background-index");
  if (nb !== undefined) {
    const v = Number(nb);
    if (!(Number.isFinite(v) && v >= 1)) throw new InputError({ where: "--background-index", message: `expected an index of 1 or more, got '${nb}'` });
    o.backgroundIndex = v;
  }
  return o;
}

/** Short human summary for stdout. */
export function humanSummary(plan: Plan, outputs: string[]): string {
  const s = planSummary(plan, outputs);
  const flagged = Object.entries(s.flags).filter(([, n]) => n > 0).map(([k, n]) => `${k} ${n}`).join(", ");
  const pct = (x: number | null): string => (x === null ? "—" : `${Number((x * 100).toPrecision(3))} %`);
  const v = plan.verdict;
  const lines = [
    v.buildable ? `BUILDABLE: every cell has a recipe and every stated requirement is met` : `NOT BUILDABLE AS ASKED: ${v.missed.length} requirement${v.missed.length === 1 ? "" : "s"} missed`,
    ...v.missed.map((m) => `  missed ${m.what}: ${m.text}`),
    ...(plan.remedies && plan.remedies.remedies.length
      ? ["what would help (each tried by re-planning):", ...plan.remedies.remedies.map((r, k) => `  ${k + 1}. ${r.label}${r.buildable ? " — buildable" : ""}: ${r.changes}`)]
      : plan.remedies ? [`what would help: none of ${plan.remedies.tried} changes tried improves the plan`] : []),
    ...(plan.remedies?.notes ?? []).map((n) => `  note: ${n}`),
    `${s.design}`,
    `  ${s.cells} cells, ${s.levels} levels, ${s.regions} regions (${s.polarization}, ${s.scheme}, tolerance ${pct(s.tolerance)})`,
    `  error${(s.flags.norecipe ?? 0) > 0 ? " (cells with a recipe)" : ""}: largest ${pct(s.maxRelError)}, median ${pct(s.medianRelError)}; loss ${Number(s.lossDb.toPrecision(3))} dB; boundary reflection ${pct(s.boundaryReflection)}`,
    `  flags: ${flagged || "none"}`,
    `  materials: ${s.materials.join(", ") || "none"}`,
    "outputs:",
    ...outputs.map((p) => `  ${p}`),
  ];
  return lines.join("\n") + "\n";
}

/**
 * Load, plan and write; shared by `plan` and `start`. Returns the exit code. `backgroundIndexWhere`
 * names where an overriding background index came from when it is not --background-index (a session file).
 */
export async function runPlanCommand(designPath: string, overrides: PlanOverrides, outDir: string, json: boolean, io: CliIo, opts: { layout?: boolean; backgroundIndexWhere?: string } = {}): Promise<number> {
  const design = await loadDesign(designPath, io.cwd);
  // a folder that cannot take the outputs is refused before minutes of planning
  await preparePlanOutputs(resolve(io.cwd, outDir));
  const [materials, processes] = await Promise.all([loadMaterialCatalog(), loadProcessCatalog()]);
  // a background material (read by verify's sweep) is checked as every command checks it, before the
  // field is computed so a typo does not wait; against the index the plan's reduction uses (runPlan.ts)
  checkBackgroundMaterialBeforeReduction(design, overrides.backgroundIndex !== undefined && (opts.backgroundIndexWhere ?? true), materials, givenBackgroundIndex(design, overrides));
  const field = await loadFieldForDesign(design);
  const timeWarning = expectedTimeWarning(planSeconds(field.grid.count), `planning ${field.grid.count.toExponential(2)} cells and writing the outputs`);
  if (timeWarning !== null) io.stderr(`warning: ${timeWarning}\n`);
  let lastStage = "";
  const plan = planFromField(design, field, { materials, processes }, overrides, (stage) => {
    if (!json && stage !== lastStage) { io.stderr(`… ${stage}\n`); lastStage = stage; }
  });
  if (timeWarning !== null) plan.timeWarning = timeWarning;
  for (const w of plan.warnings) io.stderr(`warning: ${w}\n`);
  if (!plan.verdict.buildable) {
    if (!json) io.stderr("… trying remedies (re-planning)\n");
    // loaded only when needed (as the layout writers below): a buildable plan never pays their module load
    const { searchRemedies } = await import("../../io/planRemedies.js");
    plan.remedies = searchRemedies(plan, design, field, { materials, processes }, overrides);
  }
  const layout = opts.layout ? (await import("../../io/layout/layoutFiles.js")).layoutFiles : null;
  // Ctrl+C or a polite kill while writing: stop, remove the temporary files, write nothing.
  const written = await runInterruptible(io, (signal) =>
    writePlanOutputs(plan, resolve(io.cwd, outDir), { signal, extra: layout ? layout(plan, io) : [] }));
  if (written.interrupted) return EXIT_INTERRUPTED;
  const outputs = written.value;
  if (json) io.stdout(`${JSON.stringify(planSummary(plan, outputs))}\n`);
  else io.stdout(humanSummary(plan, outputs));
  return plan.buildable ? EXIT_OK : EXIT_NOT_BUILDABLE;
}

/** `plan --check DIR`: is DIR one complete output set? Exit 0 yes, 1 no (each problem named). */
async function runCheck(dir: string, args: ParsedArgs, io: CliIo): Promise<number> {
  if (args.positionals.length > 0) throw new InputError({ where: "--check", message: "expected only an output folder, not a design file" });
  const r = await checkOutputSet(resolve(io.cwd, dir));
  if (flagOption(args, "json")) io.stdout(`${JSON.stringify({ folder: r.folder, complete: r.ok, files: r.files, problems: r.problems })}\n`);
  else if (r.ok) io.stdout(`${r.folder}: one complete output set (${r.files.map((f) => f.name).join(", ")})\n`);
  if (r.ok) return EXIT_OK;
  for (const p of r.problems) io.stderr(`error: ${join(r.folder, p)}\n`);
  return EXIT_INPUT;
}

export const command: Command = {
  name: "plan",
  summary: "plan a device: levels, recipes, flags, build list, report and maps",
  usage: "plan (<design.json> | --check DIR) [--out DIR] [--json] [--layout] [--session FILE] [--levels N] [--tolerance T] [--polarization Ez|Hz] [--scheme NAME] [--background-index N]",
  details: [
    "Reduces the design's field, quantizes the targets into levels, groups cells into regions, finds",
    "a recipe per level and writes build-list.csv, levels.csv, report.md, maps.svg and summary.json,",
    "then manifest.json (each file's size and checksum) last; --check DIR verifies such a set.",
    "Exit codes: 0 every cell has a recipe; 2 outputs written but some cells have none; 1 bad input.",
  ].join("\n"),
  options: [
    { name: "out", type: "string", valueName: "DIR", description: `output folder (default ./${DEFAULT_OUT_DIR})` },
    { name: "json", type: "boolean", description: "print the summary as one JSON object on stdout" },
    { name: "layout", type: "boolean", description: "also write the layout for the fab, by the process: layout.gds (lithography), layout.dxf (laser, CNC, PCB), layout.stl (3D printing)" },
    { name: "session", type: "string", valueName: "FILE", description: "take the design and overrides from a saved session file" },
    { name: "levels", type: "string", valueName: "N", description: "largest number of distinct recipes (overrides the design)" },
    { name: "tolerance", type: "string", valueName: "T", description: "largest relative error accepted, e.g. 0.03 (overrides the design)" },
    { name: "polarization", type: "string", valueName: "Ez|Hz", description: "polarization the device serves (overrides the design)" },
    { name: "scheme", type: "string", valueName: "NAME", description: "reduction scheme: full, unit-mu, non-magnetic, isotropic, matched" },
    { name: "check", type: "string", valueName: "DIR", description: "verify that DIR holds one complete output set (manifest sizes and checksums)" },
    { name: "background-index", type: "string", valueName: "N", description: "embed the device in a dielectric of index N (overrides the design)" },
  ],
  async run(args: ParsedArgs, io: CliIo): Promise<number> {
    const checkDir = stringOption(args, "check");
    if (checkDir !== undefined) return runCheck(checkDir, args, io);
    const sessionPath = stringOption(args, "session");
    let designPath = args.positionals[0];
    let overrides: PlanOverrides = {};
    if (sessionPath !== undefined) {
      const session = await loadSessionFile(resolve(io.cwd, sessionPath));
      overrides = { ...session.overrides };
      if (designPath !== undefined && resolve(io.cwd, designPath) !== resolve(session.designPath)) {
        throw new InputError({ where: sessionPath, message: `this session file is for ${session.designPath}, not ${designPath}; give one of them` });
      }
      designPath ??= session.designPath;
    }
    if (designPath === undefined) throw new InputError({ where: "plan", message: "expected a design file (or --session FILE)" });
    const fromOptions = optionOverrides(args);
    const fromSession = overrides;
    overrides = { ...overrides, ...fromOptions };
    try {
      const backgroundIndexWhere = fromSession.backgroundIndex !== undefined && fromOptions.backgroundIndex === undefined ? `${sessionPath}: $.overrides.backgroundIndex` : undefined;
      return await runPlanCommand(designPath, overrides, stringOption(args, "out") ?? DEFAULT_OUT_DIR, flagOption(args, "json"), io, { layout: flagOption(args, "layout"), backgroundIndexWhere });
    } catch (err) {
      // an override that came from the session file is named there ("s.json: $.overrides.materials[1]")
      if (!(err instanceof InputError) || sessionPath === undefined) throw err;
      throw new InputError(err.issues.map((i) => {
        const m = /^(([a-zA-Z]+)\S*) \(override\)$/.exec(i.where);
        const key = m?.[2] as keyof PlanOverrides | undefined;
        return m && key && fromSession[key] !== undefined && fromOptions[key] === undefined
          ? { where: `${sessionPath}: $.overrides.${m[1]}`, message: i.message }
          : i;
      }));
    }
  },
};
