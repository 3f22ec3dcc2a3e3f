/**
 * The shape of one command of the command line. Each command lives in its own file under
 * cli/commands/ and is listed (lazily loaded) in cli/commands/index.ts.
 */
import type { CliIo } from "./cliIo.js";

export interface OptionSpec {
  /** long name without dashes: "frequency" → --frequency */
  name: string;
  type: "string" | "boolean";
  short?: string;
  /** value placeholder for help: "F" → --frequency F */
  valueName?: string;
  description: string;
  multiple?: boolean;
}

export interface ParsedArgs {
  positionals: string[];
  /** option values by long name; booleans are true when given */
  options: Record<string, string | boolean | string[] | undefined>;
}

export interface Command {
  name: string;
  /** one line for the command list */
  summary: string;
  /** usage line after "cellwright ": "field <design.json> [--out FILE] [--at X,Y] [--json]" */
  usage: string;
  /** a few lines of explanation printed by --help */
  details?: string;
  options: OptionSpec[];
  /** most positionals accepted (default 1) */
  maxPositionals?: number;
  /** returns the process exit code */
  run(args: ParsedArgs, io: CliIo): Promise<number>;
}
