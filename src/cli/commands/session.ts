/**
 * `cellwright session [design.json]`: the interactive session in the terminal — compare reduction
 * schemes, look at the device as heat maps, change levels, tolerance, materials, families and
 * process, see the plan update, and export the same outputs as `cellwright plan`. Needs an
 * interactive terminal; ink and react are loaded only here, only then.
 */
import { existsSync } from "node:fs";
import { join, resolve } from "node:path";
import { InputError } from "../../core/errors.js";
import { loadSessionFile, SESSION_FILE_NAME, type SessionView } from "../../io/sessionFile.js";
import { loadDesign } from "../../io/design/loadDesign.js";
import type { PlanOverrides } from "../../plan/planTypes.js";
import { flagOption, stringOption } from "../args.js";
import type { CliIo } from "../cliIo.js";
import type { Command, ParsedArgs } from "../command.js";
import { EXIT_INPUT, EXIT_OK } from "../run.js";
import { DEFAULT_OUT_DIR } from "./plan.js";
import { START_DEMO } from "./start.js";

/** What the command says when there is no terminal to draw on. */
export function noTerminalMessage(designArg: string | undefined): string {
  const design = designArg ?? "<design.json>";
  return [
    "error: cellwright session needs an interactive terminal (stdin and stdout must both be one).",
    "to plan without a terminal (scripts, CI, pipes), use the command line:",
    `  cellwright plan ${design} --out DIR            (add --session FILE to reuse saved session choices)`,
    "",
  ].join("\n");
}

export interface SessionStart {
  designPath: string;
  outDir: string;
  sessionPath: string;
  overrides: PlanOverrides;
  view?: SessionView;
  note?: string;
}

/**
 * Where the session starts: the design (the argument, the session file's design, or the built-in
 * demo), the output folder, the session file, and the choices to resume (from --session FILE, or
 * from the output folder's session file when it belongs to the same design, unless --fresh).
 */
export async function sessionStart(args: ParsedArgs, io: CliIo): Promise<SessionStart> {
  const designArg = args.positionals[0];
  const outDir = resolve(io.cwd, stringOption(args, "out") ?? DEFAULT_OUT_DIR);
  const sessionOpt = stringOption(args, "session");
  const sessionPath = sessionOpt !== undefined ? resolve(io.cwd, sessionOpt) : join(outDir, SESSION_FILE_NAME);
  const fresh = flagOption(args, "fresh");
  let designPath = designArg !== undefined ? resolve(io.cwd, designArg) : undefined;
  if (!existsSync(sessionPath) || fresh) {
    if (sessionOpt !== undefined && designPath === undefined && !existsSync(sessionPath)) {
      throw new InputError({ where: sessionPath, message: "session file not found (give a design to start a new one there)" });
    }
    designPath ??= START_DEMO;
    return { designPath, outDir, sessionPath, overrides: {}, note: designArg === undefined ? "built-in demo design; give a design file to open your own" : undefined };
  }
  const saved = await loadSessionFile(sessionPath);
  if (designPath !== undefined && resolve(saved.designPath) !== designPath) {
    if (sessionOpt !== undefined) {
      throw new InputError({ where: sessionPath, message: `this session file is for ${saved.designPath}, not ${designPath}` });
    }
    // the output folder holds another design's session: start fresh (saving will replace it)
    return { designPath, outDir, sessionPath, overrides: {}, note: `${sessionPath} belongs to another design; saving here replaces it` };
  }
  if (!existsSync(saved.designPath)) {
    throw new InputError({ where: `${sessionPath}: $.design`, message: `design file not found: ${saved.designPath}` });
  }
  return {
    designPath: saved.designPath,
    outDir,
    sessionPath,
    overrides: saved.overrides,
    view: saved.view,
    note: `resumed the choices saved in ${sessionPath}`,
  };
}

export const command: Command = {
  name: "session",
  summary: "interactive session: compare schemes, explore maps, tune levels and export (needs a terminal)",
  usage: "session [design.json] [--out DIR] [--session FILE] [--fresh]",
  details: [
    "Opens the design (or the built-in demo) in the terminal. Keys are listed on screen; press ? for all",
    "of them. e exports build-list.csv, levels.csv, report.md, maps.svg, summary.json and session.json",
    "into the output folder; `cellwright plan --session DIR/session.json` reproduces that export.",
    "Reopening with the same design and output folder resumes the saved choices (--fresh ignores them).",
  ].join("\n"),
  options: [
    { name: "out", type: "string", valueName: "DIR", description: `output folder for exports and the session file (default ./${DEFAULT_OUT_DIR})` },
    { name: "session", type: "string", valueName: "FILE", description: `session file to resume and save (default DIR/${SESSION_FILE_NAME})` },
    { name: "fresh", type: "boolean", description: "start from the design's own choices, ignoring a saved session" },
  ],
  maxPositionals: 1,
  async run(args: ParsedArgs, io: CliIo): Promise<number> {
    if (!io.isTTY) {
      io.stderr(noTerminalMessage(args.positionals[0]));
      return EXIT_INPUT;
    }
    const start = await sessionStart(args, io);
    if (!existsSync(start.designPath)) throw new InputError({ where: start.designPath, message: "design file not found" });
    // A design with mistakes is reported in full before the screen opens, as `plan` would; a
    // background material too (same check and message as plan's, with the session's choices)
    const design = await loadDesign(start.designPath, io.cwd);
    if (design.reduction?.backgroundMaterial !== undefined) {
      const [{ loadMaterialCatalog }, { checkSessionBackground }] = await Promise.all([import("../../io/materialCatalog.js"), import("../../tui/planSession.js")]);
      checkSessionBackground(design, await loadMaterialCatalog(), start.overrides, start.sessionPath);
    }
    const { runSession } = await import("../../tui/runSession.js");
    const { unsaved } = await runSession({ ...start, cwd: io.cwd });
    io.stderr(
      unsaved
        ? "session closed; the last changes were not saved\n"
        : existsSync(start.sessionPath)
          ? `session closed; choices saved in ${start.sessionPath}\n`
          : "session closed\n",
    );
    return EXIT_OK;
  },
};
