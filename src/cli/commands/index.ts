/**
 * Registry of commands, loaded lazily so that `cellwright --help` and light commands never pay
 * for mathjs or ink. Add a command: write cli/commands/<name>.ts exporting `command`, then add a
 * line here.
 */
import type { Command } from "../command.js";

export const COMMANDS: Record<string, { summary: string; load: () => Promise<Command> }> = {
  field: { summary: "compute the material tensors of a design", load: () => import("./field.js").then((m) => m.command) },
};
