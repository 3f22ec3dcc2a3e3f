/**
 * Registry of commands, loaded lazily so that `cellwright --help` and light commands never pay
 * for mathjs or ink. Add a command: write cli/commands/<name>.ts exporting `command`, then add a
 * line here. The order here is the order of `cellwright --help`: the workflow, first to last.
 */
import type { Command } from "../command.js";

export const COMMANDS: Record<string, { summary: string; load: () => Promise<Command> }> = {
  start: { summary: "plan a built-in demo design and show where the outputs are", load: () => import("./start.js").then((m) => m.command) },
  session: { summary: "interactive session: compare schemes, explore maps, tune levels and export (needs a terminal)", load: () => import("./session.js").then((m) => m.command) },
  field: { summary: "compute the material tensors of a design", load: () => import("./field.js").then((m) => m.command) },
  reduce: { summary: "compare tensor simplifications per polarization, or apply one per cell", load: () => import("./reduce.js").then((m) => m.command) },
  material: { summary: "list the material catalog or evaluate a material at a frequency", load: () => import("./material.js").then((m) => m.command) },
  mix: { summary: "effective permittivity of a two-phase mixture, or the fill fraction for a target", load: () => import("./mix.js").then((m) => m.command) },
  cell: { summary: "design one unit cell: dimensions, effective ε or μ, process and homogenization checks", load: () => import("./cell.js").then((m) => m.command) },
  plan: { summary: "plan a device: levels, recipes, flags, build list, report and maps", load: () => import("./plan.js").then((m) => m.command) },
  verify: { summary: "2D full-wave check: ideal, reduced, realized and drawn devices, with uncertainties", load: () => import("./verify.js").then((m) => m.command) },
};
