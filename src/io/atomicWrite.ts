/**
 * Atomic file output: write to a temporary file beside the target, then rename. A crash or an
 * error never leaves a half-written file under the final name.
 */
import { createWriteStream, promises as fs } from "node:fs";
import { dirname, basename, join } from "node:path";
import { randomBytes } from "node:crypto";

function tempPathFor(path: string): string {
  return join(dirname(path), `.${basename(path)}.${process.pid}.${randomBytes(4).toString("hex")}.tmp`);
}

/** Write a whole string atomically. */
export async function writeFileAtomic(path: string, text: string): Promise<void> {
  await fs.mkdir(dirname(path) || ".", { recursive: true });
  const tmp = tempPathFor(path);
  try {
    await fs.writeFile(tmp, text, "utf8");
    await fs.rename(tmp, path);
  } catch (err) {
    await fs.rm(tmp, { force: true });
    throw err;
  }
}

/**
 * Streamed atomic write: `produce` receives a `write` function (which respects back-pressure) and
 * pushes chunks; the file appears under its final name only if `produce` resolves.
 */
export async function writeStreamAtomic(
  path: string,
  produce: (write: (chunk: string) => Promise<void> | void) => Promise<void> | void,
): Promise<void> {
  await fs.mkdir(dirname(path) || ".", { recursive: true });
  const tmp = tempPathFor(path);
  const stream = createWriteStream(tmp, { encoding: "utf8" });
  const failed = new Promise<never>((_, reject) => stream.once("error", reject));
  failed.catch(() => undefined);
  const write = (chunk: string): Promise<void> | void => {
    if (!stream.write(chunk)) {
      return Promise.race([new Promise<void>((resolve) => stream.once("drain", () => resolve())), failed]);
    }
  };
  try {
    await Promise.race([Promise.resolve(produce(write)), failed]);
    await Promise.race([new Promise<void>((resolve) => stream.end(() => resolve())), failed]);
    await fs.rename(tmp, path);
  } catch (err) {
    stream.destroy();
    await fs.rm(tmp, { force: true });
    throw err;
  }
}

/**
 * Write several files as one unit: each is written to a temp file first, and all are renamed only
 * once every one has been written. If anything fails, no final file is touched.
 */
export async function writeFilesAtomic(files: { path: string; text: string }[]): Promise<void> {
  const temps: { tmp: string; path: string }[] = [];
  try {
    for (const f of files) {
      await fs.mkdir(dirname(f.path) || ".", { recursive: true });
      const tmp = tempPathFor(f.path);
      temps.push({ tmp, path: f.path });
      await fs.writeFile(tmp, f.text, "utf8");
    }
    for (const t of temps) await fs.rename(t.tmp, t.path);
  } catch (err) {
    for (const t of temps) await fs.rm(t.tmp, { force: true });
    throw err;
  }
}
