/**
 * Long work that Ctrl+C or a polite kill (SIGTERM) must stop cleanly: the work gets an AbortSignal
 * tied to both signals for its duration; an abort (an error named "AbortError") is reported once on
 * stderr and comes back as `interrupted`, every other error passes through. The handlers are removed
 * whatever happens, so a later command in the same process is not affected.
 */
import type { CliIo } from "./cliIo.js";

export type Interruptible<T> = { interrupted: true } | { interrupted: false; value: T };

export async function runInterruptible<T>(io: CliIo, work: (signal: AbortSignal) => Promise<T>): Promise<Interruptible<T>> {
  const controller = new AbortController();
  const onSignal = (): void => controller.abort();
  process.once("SIGINT", onSignal);
  process.once("SIGTERM", onSignal);
  try {
    return { interrupted: false, value: await work(controller.signal) };
  } catch (err) {
    if ((err as Error).name === "AbortError") {
      io.stderr("interrupted; no output was written\n");
      return { interrupted: true };
    }
    throw err;
  } finally {
    process.off("SIGINT", onSignal);
    process.off("SIGTERM", onSignal);
  }
}
