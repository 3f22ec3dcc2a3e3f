/**
 * Runs the frequencies of a sweep on a pool of worker threads (node:worker_threads), one frequency
 * per task, each worker started once with the sweep's context; or in this thread when the pool has
 * one worker (a single frequency, or memory allows only one) or when the compiled worker file is not
 * there (running from the TypeScript sources, as the tests do). Results come back in frequency
 * order. The first error stops the pool (remaining tasks are dropped, workers terminated) and is
 * rethrown as the kind it was: an input error, a numerical failure, or a bug.
 */
import { existsSync } from "node:fs";
import { fileURLToPath } from "node:url";
import { Worker } from "node:worker_threads";
import { InputError, type InputIssue } from "../core/errors.js";
import { NumericalFailure } from "../numerics/numericalFailure.js";
import { solveSweepPoint, type SweepContext, type SweepPoint } from "../verify/sweep/sweepPoint.js";

export interface SweepTask { index: number; frequencyHz: number }

/** What a worker starts with: the context, its transform null when it must be loaded again from the design. */
export interface WorkerData {
  context: Omit<SweepContext, "transform"> & { transform: SweepContext["transform"] | null };
  designPath: string;
  cwd: string;
}

/** The worker's start data: the transform is sent when it clones, else loaded again from the design file. */
function workerData(context: SweepContext, designPath: string, cwd: string): WorkerData {
  try {
    structuredClone(context.transform);
    return { context, designPath, cwd };
  } catch {
    return { context: { ...context, transform: null }, designPath, cwd };
  }
}

export type ErrorData =
  | { kind: "input"; issues: InputIssue[] }
  | { kind: "numerical"; where: string; message: string; unknown: number }
  | { kind: "bug"; message: string; stack: string };

/** An error as plain data (to cross a thread boundary). */
export function errorAsData(err: unknown): ErrorData {
  if (err instanceof InputError) return { kind: "input", issues: err.issues };
  if (err instanceof NumericalFailure) return { kind: "numerical", where: err.where, message: err.message, unknown: err.unknown };
  const e = err as Error;
  return { kind: "bug", message: e?.message ?? String(err), stack: e?.stack ?? "" };
}

/** The error back from data; input errors name the frequency they happened at. */
export function errorFromData(d: ErrorData, frequencyText: string): Error {
  if (d.kind === "input") return new InputError(d.issues.map((i) => ({ where: i.where, message: `${i.message} (at ${frequencyText} of the sweep)` })));
  if (d.kind === "numerical") return new NumericalFailure(d.where, `${d.message} (at ${frequencyText} of the sweep)`, d.unknown);
  const e = new Error(`${d.message} (in the sweep worker at ${frequencyText})`);
  e.stack = d.stack;
  return e;
}

/** The compiled worker file next to this module, or null when running from the sources. */
export function sweepWorkerFile(): string | null {
  const path = fileURLToPath(new URL("./sweepWorker.js", import.meta.url));
  return import.meta.url.endsWith(".js") && existsSync(path) ? path : null;
}

export interface PoolOptions {
  workers: number;
  /** the design file, for workers that must load a transform again (it holds compiled functions) */
  designPath: string;
  cwd: string;
  /** called after each frequency is done */
  onDone?: (done: number, total: number, frequencyHz: number) => void;
  /** aborting terminates the workers and rejects with an AbortError */
  signal?: AbortSignal;
  /** formats a frequency for messages */
  formatHz: (hz: number) => string;
}

/** Solve every frequency (see file comment). Returns the points in the order of `frequenciesHz`; `threads` says how they ran. */
export async function runSweepPool(context: SweepContext, frequenciesHz: readonly number[], options: PoolOptions): Promise<{ points: SweepPoint[]; threads: number }> {
  const file = sweepWorkerFile();
  const n = frequenciesHz.length;
  const workers = Math.max(1, Math.min(options.workers, n));
  if (workers === 1 || file === null) {
    const points: SweepPoint[] = [];
    for (let k = 0; k < n; k++) {
      if (options.signal?.aborted) throw abortError();
      try {
        points.push(solveSweepPoint(context, frequenciesHz[k]));
      } catch (err) {
        throw errorFromData(errorAsData(err), options.formatHz(frequenciesHz[k]));
      }
      options.onDone?.(k + 1, n, frequenciesHz[k]);
      // let a pending Ctrl+C be seen between frequencies
      await new Promise<void>((r) => setImmediate(r));
    }
    return { points, threads: 0 };
  }
  const points = new Array<SweepPoint | undefined>(n);
  const pool: Worker[] = [];
  let next = 0, done = 0;
  const start = workerData(context, options.designPath, options.cwd);
  try {
    await new Promise<void>((resolve, reject) => {
      let failed = false;
      const fail = (err: Error): void => { if (!failed) { failed = true; reject(err); } };
      options.signal?.addEventListener("abort", () => fail(abortError()), { once: true });
      const feed = (w: Worker): void => {
        if (failed) return;
        if (next < n) { const index = next++; w.postMessage({ index, frequencyHz: frequenciesHz[index] } satisfies SweepTask); }
      };
      for (let k = 0; k < workers; k++) {
        const w = new Worker(file, { workerData: start });
        pool.push(w);
        w.on("message", (m: { index: number; point?: SweepPoint; error?: ErrorData }) => {
          if (m.error) { fail(errorFromData(m.error, options.formatHz(frequenciesHz[m.index]))); return; }
          points[m.index] = m.point!;
          done++;
          options.onDone?.(done, n, frequenciesHz[m.index]);
          if (done === n) resolve();
          else feed(w);
        });
        w.on("error", (err) => fail(err instanceof Error ? err : new Error(String(err))));
        w.on("exit", (code) => { if (done < n && code !== 0) fail(new Error(`a sweep worker stopped with exit code ${code}`)); });
        feed(w);
      }
    });
  } finally {
    await Promise.all(pool.map((w) => w.terminate()));
  }
  return { points: points as SweepPoint[], threads: workers };
}

function abortError(): Error {
  const e = new Error("interrupted; nothing was written");
  e.name = "AbortError";
  return e;
}
