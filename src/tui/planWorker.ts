/**
 * Worker thread of the interactive session: reads the design once, then answers plan requests so
 * that long recomputations never block the session's key handling. Requests that arrive while a
 * plan is being computed are collapsed: only the newest is computed next.
 *
 * Messages in: { type: "init", designPath, cwd, sessionPath } · { type: "plan", seq, overrides }
 * Messages out: { type: "ready" } · { type: "initFailed", error } · { type: "progress", seq, stage, fraction }
 *               · { type: "plan", seq, plan } · { type: "failed", seq, error }
 */
import { parentPort } from "node:worker_threads";
import type { PlanOverrides } from "../plan/planTypes.js";
import { loadPlanInputs, type PlanInputs } from "./planInputs.js";
import { planSession } from "./planSession.js";

export type WorkerRequest = { type: "init"; designPath: string; cwd: string; sessionPath: string } | { type: "plan"; seq: number; overrides: PlanOverrides };

/** An error as plain data (InputError issues kept) for postMessage. */
export function errorData(err: unknown): { message: string; issues?: { where: string; message: string }[] } {
  const e = err as { message?: string; issues?: { where: string; message: string }[] };
  return e?.issues ? { message: e.message ?? String(err), issues: e.issues } : { message: e?.message ?? String(err) };
}

const port = parentPort;
if (port) {
  let inputs: Promise<PlanInputs> | null = null;
  let sessionPath = "";
  let pending: { seq: number; overrides: PlanOverrides } | null = null;
  let scheduled = false;

  const runPending = async (): Promise<void> => {
    scheduled = false;
    const job = pending;
    pending = null;
    if (!job || !inputs) return;
    let loaded: PlanInputs;
    try {
      loaded = await inputs;
    } catch {
      return; // initFailed was reported
    }
    try {
      const plan = planSession(loaded, job.overrides, sessionPath, (stage, fraction) => {
        port.postMessage({ type: "progress", seq: job.seq, stage, fraction });
      });
      port.postMessage({ type: "plan", seq: job.seq, plan });
    } catch (err) {
      port.postMessage({ type: "failed", seq: job.seq, error: errorData(err) });
    }
    if (pending && !scheduled) {
      scheduled = true;
      setImmediate(runPending);
    }
  };

  port.on("message", (msg: WorkerRequest) => {
    if (msg.type === "init") {
      inputs = loadPlanInputs(msg.designPath, msg.cwd);
      sessionPath = msg.sessionPath;
      inputs.then(
        () => port.postMessage({ type: "ready" }),
        (err) => port.postMessage({ type: "initFailed", error: errorData(err) }),
      );
      return;
    }
    pending = { seq: msg.seq, overrides: msg.overrides };
    if (!scheduled) {
      scheduled = true;
      setImmediate(runPending);
    }
  });
}
