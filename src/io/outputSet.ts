/**
 * An output set: several files written into one folder as ONE unit that a reader can verify, even
 * when the process is killed (SIGKILL, power loss) half-way.
 *
 * 1. Before anything is computed into the folder, `checkOutputFolder` refuses a path that cannot be
 *    a folder and a final name taken by a folder or special file (an input error naming it), and
 *    removes temporary files left by an earlier run that was killed (their names carry the dead
 *    process id); the folder itself is created only when writing starts.
 * 2. Every file is streamed to a temporary name (`.<name>.cellwright-<pid>-<hex>.tmp`) while its
 *    size and CRC-32 are counted.
 * 3. The old manifest is removed, the files are renamed to their final names, and the manifest
 *    (`manifest.json`: every file's name, size and CRC-32) is written last, itself atomically.
 *
 * A set is complete exactly when `manifest.json` exists and every file it lists has its size and
 * checksum (`checkOutputSet`, `cellwright plan --check DIR`). A run killed before step 3 leaves the
 * previous set untouched (its temporary files are cleaned by the next run); one killed during step
 * 3 leaves no manifest, so the mixed folder fails the check. Why not one folder rename: the output
 * folder also holds files that are not ours (the session file, the user's notes), and POSIX cannot
 * swap a non-empty folder in one rename. CRC-32 (zlib) rather than a cryptographic hash: it is a
 * check against accidents, not tampering, and costs a third of SHA-256 on a 10⁶-cell build list.
 *
 * The list of files is data (`OutputFile[]`), so new outputs (layout files) join the set without
 * touching this file; chunks may be text or bytes.
 */
import { createWriteStream, promises as fs } from "node:fs";
import { basename, join, resolve } from "node:path";
import { randomBytes } from "node:crypto";
import { crc32 } from "node:zlib";
import { InputError } from "../core/errors.js";

export type OutputChunk = string | Uint8Array;

/** One file of an output set: its name in the folder and how to produce its bytes. */
export interface OutputFile {
  name: string;
  produce(write: (chunk: OutputChunk) => Promise<void>): Promise<void> | void;
}

export interface ManifestEntry {
  name: string;
  bytes: number;
  crc32: string;
}

export interface Manifest {
  cellwrightOutputSet: 1;
  files: ManifestEntry[];
}

export const MANIFEST_NAME = "manifest.json";

const TEMP_PATTERN = /^\..+\.cellwright-(\d+)-[0-9a-f]+\.tmp$/;

export interface WriteSetOptions {
  /** aborting stops the write and removes every temporary file */
  signal?: AbortSignal;
  /**
   * Called before each step: "write <name>", "switch" (old manifest removed), "rename <name>"
   * (after that rename), "manifest" (set complete). For progress and for kill tests.
   */
  onStep?: (step: string) => void;
}

export function abortError(): Error {
  const e = new Error("interrupted; no output was written");
  e.name = "AbortError";
  return e;
}

/** Whether process `pid` exists (this one included; EPERM: it exists but is someone else's). */
export function isAlive(pid: number): boolean {
  if (pid === process.pid) return true;
  try {
    process.kill(pid, 0);
    return true;
  } catch (err) {
    return (err as NodeJS.ErrnoException).code === "EPERM";
  }
}

/**
 * Check `dir` before anything is computed into it, without creating it (a later input error must
 * leave nothing behind): a path that cannot be a folder, or a final name taken by a folder or
 * special file, is an error naming the path; temporary files of killed runs are removed.
 * Returns the absolute folder.
 */
export async function checkOutputFolder(dir: string, names: readonly string[]): Promise<string> {
  const folder = resolve(dir);
  let st;
  try {
    st = await fs.stat(folder);
  } catch (err) {
    // missing is fine (created when writing); ENAMETOOLONG, ELOOP, ENOTDIR … name the path
    if ((err as NodeJS.ErrnoException).code === "ENOENT") return folder;
    throw err;
  }
  if (!st.isDirectory()) throw new InputError({ where: folder, message: "is a file; expected an output folder" });
  for (const name of [...names, MANIFEST_NAME]) {
    const path = join(folder, name);
    const entry = await fs.lstat(path).catch(() => null);
    if (entry && !entry.isFile()) {
      throw new InputError({ where: path, message: "a folder or special file has the name of an output; expected a file or nothing there" });
    }
  }
  for (const entry of await fs.readdir(folder)) {
    const m = TEMP_PATTERN.exec(entry);
    if (m && !isAlive(Number(m[1]))) await fs.rm(join(folder, entry), { force: true, recursive: true });
  }
  return folder;
}

/** `checkOutputFolder`, then create the folder: just before writing. */
export async function prepareOutputFolder(dir: string, names: readonly string[]): Promise<string> {
  const folder = await checkOutputFolder(dir, names);
  await fs.mkdir(folder, { recursive: true });
  return folder;
}

/**
 * Stream chunks into `path` with the abort signal; returns size and CRC-32. Each chunk's promise
 * settles once the stream is done with its bytes, so a producer may reuse its buffer, and the
 * stream never holds more than the chunk in flight.
 */
async function streamTo(path: string, file: OutputFile, signal?: AbortSignal): Promise<ManifestEntry> {
  const stream = createWriteStream(path, { highWaterMark: 1 << 20 });
  let failure: Error | null = null;
  stream.on("error", (e) => { failure = e; });
  let bytes = 0;
  let crc = 0;
  const write = (chunk: OutputChunk): Promise<void> => {
    if (signal?.aborted) return Promise.reject(abortError());
    if (failure) return Promise.reject(failure);
    const buf = typeof chunk === "string" ? Buffer.from(chunk, "utf8") : chunk;
    bytes += buf.length;
    crc = crc32(buf, crc);
    return new Promise<void>((res, rej) => {
      stream.write(buf, (err?: Error | null) => (err ? rej(err) : res()));
    });
  };
  try {
    await file.produce(write);
    await new Promise<void>((res, rej) => stream.end((err?: Error | null) => (err ? rej(err) : res())));
    if (failure) throw failure;
  } catch (err) {
    stream.destroy();
    // wait until the file is really closed: a stream destroyed before its file opened would
    // otherwise create it after the caller removed the temporary files
    await new Promise<void>((res) => { if (stream.closed) res(); else stream.once("close", () => res()); });
    throw err;
  }
  return { name: file.name, bytes, crc32: (crc >>> 0).toString(16).padStart(8, "0") };
}

/**
 * Write `files` into `folder` (already prepared) as one unit, manifest last. Returns the absolute
 * paths of the files and of the manifest, in that order.
 */
export async function writeOutputSet(folder: string, files: readonly OutputFile[], options: WriteSetOptions = {}): Promise<string[]> {
  const { signal, onStep } = options;
  const tag = `cellwright-${process.pid}-${randomBytes(4).toString("hex")}`;
  const finals = files.map((f) => join(folder, f.name));
  const temps = files.map((f) => join(folder, `.${f.name}.${tag}.tmp`));
  const manifestPath = join(folder, MANIFEST_NAME);
  const manifestTemp = join(folder, `.${MANIFEST_NAME}.${tag}.tmp`);
  try {
    const entries: ManifestEntry[] = [];
    for (let k = 0; k < files.length; k++) {
      if (signal?.aborted) throw abortError();
      onStep?.(`write ${files[k].name}`);
      entries.push(await streamTo(temps[k], files[k], signal));
    }
    const manifest: Manifest = { cellwrightOutputSet: 1, files: entries };
    await fs.writeFile(manifestTemp, `${JSON.stringify(manifest, null, 2)}\n`, "utf8");
    if (signal?.aborted) throw abortError();
    // from here on the folder is a mixed set until the manifest is back
    await fs.rm(manifestPath, { force: true });
    onStep?.("switch");
    for (let k = 0; k < temps.length; k++) {
      await fs.rename(temps[k], finals[k]);
      onStep?.(`rename ${files[k].name}`);
    }
    await fs.rename(manifestTemp, manifestPath);
    onStep?.("manifest");
  } catch (err) {
    await Promise.all([...temps, manifestTemp].map((t) => fs.rm(t, { force: true })));
    throw err;
  }
  return [...finals, manifestPath];
}

export interface SetCheck {
  ok: boolean;
  folder: string;
  files: ManifestEntry[];
  problems: string[];
}

/** Verify the set in `dir` against its manifest: every listed file present with its size and CRC-32. */
export async function checkOutputSet(dir: string): Promise<SetCheck> {
  const folder = resolve(dir);
  const problems: string[] = [];
  let manifest: Manifest | null = null;
  try {
    const json = JSON.parse(await fs.readFile(join(folder, MANIFEST_NAME), "utf8"));
    if (json?.cellwrightOutputSet === 1 && Array.isArray(json.files)) manifest = json as Manifest;
    else problems.push(`${MANIFEST_NAME}: not a cellwright manifest`);
  } catch (err) {
    const code = (err as NodeJS.ErrnoException).code;
    problems.push(code === "ENOENT"
      ? `${MANIFEST_NAME}: missing; the set is incomplete (a run was stopped while switching files) or was not written by this version`
      : `${MANIFEST_NAME}: unreadable (${code ?? (err as Error).message})`);
  }
  const files = manifest?.files ?? [];
  for (const f of files) {
    if (typeof f?.name !== "string" || basename(f.name) !== f.name) { problems.push(`${MANIFEST_NAME}: bad entry ${JSON.stringify(f).slice(0, 80)}`); continue; }
    const data = await fs.readFile(join(folder, f.name)).catch(() => null);
    if (!data) { problems.push(`${f.name}: missing`); continue; }
    if (data.length !== f.bytes) { problems.push(`${f.name}: ${data.length} bytes, the manifest says ${f.bytes}`); continue; }
    const crc = (crc32(data) >>> 0).toString(16).padStart(8, "0");
    if (crc !== f.crc32) problems.push(`${f.name}: checksum ${crc}, the manifest says ${f.crc32} (a file from another run)`);
  }
  for (const entry of await fs.readdir(folder).catch(() => [] as string[])) {
    if (TEMP_PATTERN.test(entry)) problems.push(`${entry}: temporary file of a run that did not finish`);
  }
  return { ok: problems.length === 0, folder, files, problems };
}
