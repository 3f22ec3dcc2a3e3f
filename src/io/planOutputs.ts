/**
 * Writing a plan's outputs: build-list.csv (streamed), levels.csv, report.md, maps.svg and
 * summary.json, as ONE unit — every file goes to a temporary name in the output folder first, and
 * all are renamed to their final names only once every one is complete. On any failure (or an
 * abort) the temporary files are removed and no final file is touched.
 */
import { createWriteStream, promises as fs } from "node:fs";
import { join, resolve } from "node:path";
import { randomBytes } from "node:crypto";
import type { Plan } from "../plan/planTypes.js";
import { emitBuildList } from "../plan/outputs/buildListRows.js";
import { levelsCsvText } from "../plan/outputs/levelsCsv.js";
import { reportMarkdown } from "../plan/outputs/reportMarkdown.js";
import { mapsSvg } from "../plan/outputs/svgMaps.js";
import { planSummary } from "../plan/outputs/planSummary.js";

export const PLAN_OUTPUT_FILES = ["build-list.csv", "levels.csv", "report.md", "maps.svg", "summary.json"] as const;

export interface WriteOptions {
  /** aborting stops the write and removes every temporary file */
  signal?: AbortSignal;
  /** further files written in the same unit (layout files: GDSII, DXF), after PLAN_OUTPUT_FILES */
  extra?: { name: string; data: string | Uint8Array }[];
}

function abortError(): Error {
  const e = new Error("interrupted; no output was written");
  e.name = "AbortError";
  return e;
}

/**
 * Stream `produce`'s chunks into `path`, honouring the abort signal. Each chunk's promise settles
 * once the stream is done with its bytes (so the producer may reuse the buffer), and the stream's
 * own buffer never holds more than the chunk in flight.
 */
async function streamTo(
  path: string,
  produce: (write: (chunk: Uint8Array) => Promise<void>) => Promise<void>,
  signal?: AbortSignal,
): Promise<void> {
  const stream = createWriteStream(path, { highWaterMark: 1 << 20 });
  let failure: Error | null = null;
  stream.on("error", (e) => { failure = e; });
  const write = (chunk: Uint8Array): Promise<void> => {
    if (signal?.aborted) return Promise.reject(abortError());
    if (failure) return Promise.reject(failure);
    return new Promise<void>((res, rej) => {
      stream.write(chunk, (err?: Error | null) => (err ? rej(err) : res()));
    });
  };
  try {
    await produce(write);
    await new Promise<void>((res, rej) => {
      stream.end((err?: Error | null) => (err ? rej(err) : res()));
    });
    if (failure) throw failure;
  } catch (err) {
    stream.destroy();
    // wait until the file is really closed: a stream destroyed before its file opened would
    // otherwise create it after the caller removed the temporary files
    await new Promise<void>((res) => { if (stream.closed) res(); else stream.once("close", () => res()); });
    throw err;
  }
}

/**
 * Write every output of `plan` into `dir` (created if missing). Returns the absolute paths written,
 * in PLAN_OUTPUT_FILES order. summary.json lists those paths under `outputs`.
 */
export async function writePlanOutputs(plan: Plan, dir: string, options: WriteOptions = {}): Promise<string[]> {
  const { signal } = options;
  const folder = resolve(dir);
  await fs.mkdir(folder, { recursive: true });
  const tag = `${process.pid}.${randomBytes(4).toString("hex")}`;
  const extra = options.extra ?? [];
  const names = [...PLAN_OUTPUT_FILES, ...extra.map((e) => e.name)];
  const finals = names.map((name) => join(folder, name));
  const temps = names.map((name) => join(folder, `.${name}.${tag}.tmp`));
  // a final name taken by a folder would fail the renames half-way: refuse before writing anything
  for (const f of finals) {
    const st = await fs.stat(f).catch(() => null);
    if (st && !st.isFile()) throw new Error(`cannot write ${f}: a folder or special file has that name`);
  }
  try {
    if (signal?.aborted) throw abortError();
    await streamTo(temps[0], (write) => emitBuildList(plan, write), signal);
    const texts: (string | Uint8Array)[] = [levelsCsvText(plan), reportMarkdown(plan), mapsSvg(plan), `${JSON.stringify(planSummary(plan, finals), null, 2)}\n`, ...extra.map((e) => e.data)];
    for (let k = 0; k < texts.length; k++) {
      if (signal?.aborted) throw abortError();
      await fs.writeFile(temps[k + 1], texts[k], typeof texts[k] === "string" ? "utf8" : undefined);
    }
    if (signal?.aborted) throw abortError();
    for (let k = 0; k < temps.length; k++) await fs.rename(temps[k], finals[k]);
  } catch (err) {
    await Promise.all(temps.map((t) => fs.rm(t, { force: true })));
    throw err;
  }
  return finals;
}
