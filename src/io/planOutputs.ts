/**
 * Writing a plan's outputs as one output set (see outputSet.ts): build-list.csv (streamed),
 * levels.csv, report.md, maps.svg and summary.json, then manifest.json last. The files are data:
 * `planOutputFiles` lists them, so a new output (a layout file) is one more entry there.
 * On any failure (or an abort) the temporary files are removed and no final file is touched.
 */
import { join } from "node:path";
import type { Plan } from "../plan/planTypes.js";
import { emitBuildList } from "../plan/outputs/buildListRows.js";
import { levelsCsvText } from "../plan/outputs/levelsCsv.js";
import { reportMarkdown } from "../plan/outputs/reportMarkdown.js";
import { mapsSvg } from "../plan/outputs/svgMaps.js";
import { planSummary } from "../plan/outputs/planSummary.js";
import { MANIFEST_NAME, checkOutputFolder, prepareOutputFolder, writeOutputSet, type OutputFile, type WriteSetOptions } from "./outputSet.js";

/** A further file written in the same unit (layout files: GDSII, DXF, STL): its data, or chunks streamed (a reused buffer each). */
export interface ExtraOutput { name: string; data?: string | Uint8Array; chunks?: () => Iterable<Uint8Array> }

export interface WriteOptions extends WriteSetOptions {
  /** further files written in the same set, before summary.json */
  extra?: readonly ExtraOutput[];
}

/** Every file of a plan's output set except the manifest, in writing order; `finals` are the paths summary.json lists. */
export function planOutputFiles(plan: Plan, finals: (names: string[]) => string[], extra: readonly ExtraOutput[] = []): OutputFile[] {
  const files: OutputFile[] = [
    { name: "build-list.csv", produce: (write) => emitBuildList(plan, write) },
    { name: "levels.csv", produce: (write) => write(levelsCsvText(plan)) },
    { name: "report.md", produce: (write) => write(reportMarkdown(plan)) },
    { name: "maps.svg", produce: (write) => write(mapsSvg(plan)) },
    ...extra.map((e): OutputFile => ({
      name: e.name,
      produce: async (write) => {
        if (e.chunks) for (const c of e.chunks()) await write(c);
        else await write(e.data ?? "");
      },
    })),
  ];
  const names = [...files.map((f) => f.name), "summary.json", MANIFEST_NAME];
  files.push({ name: "summary.json", produce: (write) => write(`${JSON.stringify(planSummary(plan, finals(names)), null, 2)}\n`) });
  return files;
}

/** Names of a plan's outputs (for checks before planning), manifest included. */
export function planOutputNames(plan?: Plan): string[] {
  const files = plan ? planOutputFiles(plan, () => []) : null;
  return files ? [...files.map((f) => f.name), MANIFEST_NAME] : ["build-list.csv", "levels.csv", "report.md", "maps.svg", "summary.json", MANIFEST_NAME];
}

/**
 * Check the output folder before planning (not created yet): names in the way refused (an input
 * error naming the path), temporary files of killed runs removed.
 */
export async function preparePlanOutputs(dir: string): Promise<string> {
  return checkOutputFolder(dir, planOutputNames());
}

/**
 * Write every output of `plan` into `dir` as one set. Returns the absolute paths written (manifest
 * last). summary.json lists those paths under `outputs`.
 */
export async function writePlanOutputs(plan: Plan, dir: string, options: WriteOptions = {}): Promise<string[]> {
  const files = planOutputFiles(plan, (names) => names.map((n) => join(folder, n)), options.extra ?? []);
  const folder = await prepareOutputFolder(dir, files.map((f) => f.name));
  return writeOutputSet(folder, files, options);
}
