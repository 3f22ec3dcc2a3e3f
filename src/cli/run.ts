/**
 * Command-line dispatcher: `cellwright <command> [args] [options]`. Returns the exit code instead
 * of exiting, so tests can run it in-process.
 *
 * Exit codes: 0 success; 1 bad input (message on stderr, no output written); 2 computed but the
 * result is not buildable as asked (e.g. `plan` found cells with no recipe; outputs are complete);
 * 3 internal error (a bug: please report); 130 interrupted while writing (nothing written).
 */
import { InputError } from "../core/errors.js";
import { NumericalFailure } from "../numerics/numericalFailure.js";
import { unknownWithSuggestion } from "../core/errors.js";
import { commandHelp, parseCommandArgs } from "./args.js";
import type { CliIo } from "./cliIo.js";
import { COMMANDS } from "./commands/index.js";

export const EXIT_OK = 0;
export const EXIT_INPUT = 1;
export const EXIT_NOT_BUILDABLE = 2;
export const EXIT_INTERNAL = 3;
/** stopped by Ctrl+C or SIGTERM while writing; nothing was written (shell convention 128 + 2) */
export const EXIT_INTERRUPTED = 130;

function mainHelp(): string {
  const names = Object.keys(COMMANDS);
  const width = Math.max(...names.map((n) => n.length)) + 4;
  return [
    "cellwright: turn a transformation-optics material field into buildable metamaterial unit cells",
    "",
    "usage: cellwright <command> [design.json] [options]",
    "",
    "commands:",
    ...names.map((n) => `  ${n.padEnd(width)}${COMMANDS[n].summary}`),
    "",
    "run 'cellwright <command> --help' for the options of one command.",
    "",
  ].join("\n");
}

/** File-system errors that come from where the user asked us to read or write, not from a bug. */
const USER_FS_CODES: Record<string, string> = {
  ENOENT: "no such file or folder",
  EEXIST: "a file is in the way of a folder",
  EISDIR: "is a folder, expected a file",
  ENOTDIR: "a part of the path is a file, not a folder",
  EACCES: "permission denied",
  EPERM: "operation not permitted",
  EROFS: "read-only file system",
  ENOSPC: "no space left on the device",
  ENAMETOOLONG: "the path or one of its names is too long",
  ELOOP: "too many symbolic links (a link loop?)",
  ENOTEMPTY: "a folder that is not empty is in the way",
  EMLINK: "too many links",
  EFBIG: "file too large for this file system",
  EDQUOT: "disk quota exceeded",
};

export function reportError(err: unknown, io: CliIo): number {
  const code = (err as NodeJS.ErrnoException)?.code;
  if (code && code in USER_FS_CODES && typeof (err as NodeJS.ErrnoException).path === "string") {
    // a failed rename names the temporary file in `path` and the user's target in `dest`
    const e = err as NodeJS.ErrnoException & { dest?: string };
    const path = typeof e.dest === "string" ? e.dest : (e.path as string);
    io.stderr(`error: ${path}: cannot read or write here: ${USER_FS_CODES[code]}\n`);
    return EXIT_INPUT;
  }
  if (err instanceof InputError) {
    for (const i of err.issues) io.stderr(`error: ${i.where}: ${i.message}\n`);
    return EXIT_INPUT;
  }
  if (err instanceof NumericalFailure) {
    // valid input, no trustworthy answer: neither the user's mistake nor a bug in the caller
    io.stderr(`error: ${err.where}: numerical failure, no trustworthy answer: ${err.message}\n`);
    return EXIT_INTERNAL;
  }
  const e = err as Error;
  io.stderr(`internal error: ${e?.message ?? String(err)}\n`);
  if (process.env.CELLWRIGHT_DEBUG) io.stderr(`${e?.stack ?? ""}\n`);
  else io.stderr("this is a bug in cellwright; set CELLWRIGHT_DEBUG=1 for a stack trace\n");
  return EXIT_INTERNAL;
}

export async function runCli(argv: string[], io: CliIo): Promise<number> {
  const [name, ...rest] = argv;
  if (name === undefined || name === "--help" || name === "-h" || name === "help") {
    io.stdout(mainHelp());
    return name === undefined ? EXIT_INPUT : EXIT_OK;
  }
  if (name === "--version") {
    io.stdout("cellwright 0.1.0\n");
    return EXIT_OK;
  }
  const entry = COMMANDS[name];
  if (!entry) {
    io.stderr(`error: ${unknownWithSuggestion("command", name, Object.keys(COMMANDS))}\n`);
    io.stderr("run 'cellwright --help' for the list of commands\n");
    return EXIT_INPUT;
  }
  try {
    const command = await entry.load();
    if (rest.includes("--help") || rest.includes("-h")) {
      io.stdout(commandHelp(command));
      return EXIT_OK;
    }
    const args = parseCommandArgs(command, rest);
    return await command.run(args, io);
  } catch (err) {
    return reportError(err, io);
  }
}
