/**
 * `cellwright start` (what `npm start` runs): plans a built-in demo design into ./cellwright-out and
 * prints where the outputs are. On an interactive terminal, when the interactive session is
 * installed, it opens the session on the same demo instead.
 */
import { fileURLToPath } from "node:url";
import { flagOption, stringOption } from "../args.js";
import type { CliIo } from "../cliIo.js";
import type { Command, ParsedArgs } from "../command.js";
import { COMMANDS } from "./index.js";
import { DEFAULT_OUT_DIR, runPlanCommand } from "./plan.js";

/** The built-in demo: a printed 12 GHz beam bend that meets its own requirements (exit 0). */
export const START_DEMO = fileURLToPath(new URL("../../../demo-designs/plan-printed-bend.json", import.meta.url));

export const command: Command = {
  name: "start",
  summary: "plan a built-in demo design and show where the outputs are",
  usage: "start [--out DIR] [--json] [--batch]",
  details: "Plans demo-designs/plan-printed-bend.json. On a terminal with the interactive session available, opens it instead (--batch: always plan).",
  options: [
    { name: "out", type: "string", valueName: "DIR", description: `output folder (default ./${DEFAULT_OUT_DIR})` },
    { name: "json", type: "boolean", description: "print the summary as one JSON object on stdout" },
    { name: "batch", type: "boolean", description: "plan and write the outputs even on an interactive terminal" },
  ],
  maxPositionals: 0,
  async run(args: ParsedArgs, io: CliIo): Promise<number> {
    const json = flagOption(args, "json");
    const session = COMMANDS.session;
    if (io.isTTY && !json && !flagOption(args, "batch") && session) {
      const cmd = await session.load();
      return cmd.run({ positionals: [START_DEMO], options: {} }, io);
    }
    const out = stringOption(args, "out") ?? DEFAULT_OUT_DIR;
    if (!json) io.stderr(`planning the built-in demo ${START_DEMO}\n`);
    const code = await runPlanCommand(START_DEMO, {}, out, json, io);
    if (!json) io.stdout(`open report.md for the plan and maps.svg for the level and flag maps.\n`);
    return code;
  },
};
