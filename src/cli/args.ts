/** Strict option parsing for one command, turning mistakes into InputErrors with suggestions. */
import { parseArgs } from "node:util";
import { InputError, unknownWithSuggestion } from "../core/errors.js";
import type { Command, ParsedArgs } from "./command.js";

/**
 * Join "--name -3" into "--name=-3" for string options whose value is a negative number (or a
 * complex number such as "-10+1i"), which node's parser would otherwise take for an option.
 */
function joinNegativeValues(command: Command, argv: string[]): string[] {
  const stringOptions = new Set(command.options.filter((o) => o.type === "string").map((o) => `--${o.name}`));
  const out: string[] = [];
  for (let k = 0; k < argv.length; k++) {
    const token = argv[k];
    const next = argv[k + 1];
    if (stringOptions.has(token) && next !== undefined && /^-(\d|\.\d)/.test(next)) {
      out.push(`${token}=${next}`);
      k++;
    } else out.push(token);
  }
  return out;
}

export function parseCommandArgs(command: Command, rawArgv: string[]): ParsedArgs {
  const argv = joinNegativeValues(command, rawArgv);
  const options: Record<string, { type: "string" | "boolean"; short?: string; multiple?: boolean }> = {
    help: { type: "boolean", short: "h" },
  };
  for (const o of command.options) {
    options[o.name] = { type: o.type, ...(o.short ? { short: o.short } : {}), ...(o.multiple ? { multiple: true } : {}) };
  }
  try {
    const parsed = parseArgs({ args: argv, options, allowPositionals: true, strict: true });
    const max = command.maxPositionals ?? 1;
    if (parsed.positionals.length > max) {
      throw new InputError({
        where: command.name,
        message: `expected at most ${max} argument${max === 1 ? "" : "s"}, got ${parsed.positionals.length}: ${parsed.positionals.join(" ")}`,
      });
    }
    // an empty value is never meaningful ("--mu-tolerance ''" must not read as 0)
    for (const [name, value] of Object.entries(parsed.values)) {
      const values = Array.isArray(value) ? value : [value];
      if (values.some((v) => typeof v === "string" && v.trim() === "")) {
        throw new InputError({ where: `--${name}`, message: "expected a value, got an empty string" });
      }
    }
    return { positionals: parsed.positionals, options: parsed.values as ParsedArgs["options"] };
  } catch (err) {
    if (err instanceof InputError) throw err;
    const msg = (err as Error).message ?? String(err);
    const unknown = /Unknown option '(-{1,2}[^']+)'/.exec(msg);
    if (unknown) {
      const name = unknown[1].replace(/^-+/, "");
      const known = command.options.map((o) => o.name);
      throw new InputError({ where: command.name, message: unknownWithSuggestion("option", `--${name}`, known.map((k) => `--${k}`)) });
    }
    const missing = /Option '(-[^']+)'.*argument missing/.exec(msg);
    if (missing) throw new InputError({ where: missing[1], message: "expected a value after this option" });
    throw new InputError({ where: command.name, message: msg.split("\n")[0].toLowerCase() });
  }
}

/** Help text for one command. */
export function commandHelp(command: Command): string {
  const lines = [`usage: cellwright ${command.usage}`, "", command.summary];
  if (command.details) lines.push("", command.details.trimEnd());
  const rows = [
    ...command.options.map((o) => [
      `  ${o.short ? `-${o.short}, ` : ""}--${o.name}${o.type === "string" ? ` ${o.valueName ?? "VALUE"}` : ""}`,
      o.description,
    ]),
    ["  -h, --help", "show this help"],
  ];
  const width = Math.max(...rows.map((r) => r[0].length)) + 2;
  lines.push("", "options:");
  for (const [left, right] of rows) lines.push(left.padEnd(width) + right);
  return lines.join("\n") + "\n";
}

export function stringOption(args: ParsedArgs, name: string): string | undefined {
  const v = args.options[name];
  return typeof v === "string" ? v : undefined;
}

export function flagOption(args: ParsedArgs, name: string): boolean {
  return args.options[name] === true;
}
