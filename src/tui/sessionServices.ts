/**
 * The session's services wired to the real planner: the design is read once, plans are computed
 * in a worker thread (so keys stay live during long recomputations), the scheme comparison runs
 * on the main thread (it is a single pass over the field), and exports write exactly what
 * `cellwright plan` writes plus the session file.
 */
import { existsSync } from "node:fs";
import { fileURLToPath } from "node:url";
import { Worker } from "node:worker_threads";
import { CELL_FAMILIES } from "../cells/registry.js";
import { InputError } from "../core/errors.js";
import { writePlanOutputs } from "../io/planOutputs.js";
import { saveSessionFile } from "../io/sessionFile.js";
import type { Plan, PlanOverrides, PlanSettings, PlanStage } from "../plan/planTypes.js";
import { givenBackgroundIndex, resolveSettings } from "../plan/resolveSettings.js";
import { layoutFiles } from "../io/layout/layoutFiles.js";
import { compareSchemes } from "../reduce/schemeMetrics.js";
import { loadPlanInputs, type PlanInputs } from "./planInputs.js";
import { planSession } from "./planSession.js";
import type { SessionServices } from "./SessionApp.js";
import { schemeTableView } from "./state/schemeTableView.js";

export interface ServiceOptions {
  designPath: string;
  cwd: string;
  outDir: string;
  sessionPath: string;
  /** compute plans in a worker thread (default: when the compiled worker is available) */
  useWorker?: boolean;
}

type Pending = { resolve: (p: Plan) => void; reject: (e: unknown) => void; onProgress: (s: PlanStage, f: number) => void };

function rebuildError(data: { message: string; issues?: { where: string; message: string }[] }): Error {
  return data.issues ? new InputError(data.issues) : new Error(data.message);
}

/** Plans computed in a worker thread; requests are numbered and only the newest is computed next. */
class WorkerPlanner {
  private worker: Worker;
  private seq = 0;
  private pending = new Map<number, Pending>();

  constructor(designPath: string, cwd: string, sessionPath: string) {
    const url = new URL("./planWorker.js", import.meta.url);
    this.worker = new Worker(url);
    this.worker.unref();
    this.worker.on("message", (msg: any) => this.onMessage(msg));
    this.worker.on("error", (err) => this.failAll(err));
    this.worker.postMessage({ type: "init", designPath, cwd, sessionPath });
  }

  private failAll(err: unknown): void {
    for (const p of this.pending.values()) p.reject(err);
    this.pending.clear();
  }

  private onMessage(msg: any): void {
    if (msg.type === "initFailed") return this.failAll(rebuildError(msg.error));
    if (msg.type === "ready") return;
    const p = this.pending.get(msg.seq);
    if (!p) return;
    if (msg.type === "progress") p.onProgress(msg.stage, msg.fraction);
    else if (msg.type === "plan") {
      this.pending.delete(msg.seq);
      p.resolve(msg.plan as Plan);
    } else if (msg.type === "failed") {
      this.pending.delete(msg.seq);
      p.reject(rebuildError(msg.error));
    }
    // requests older than an answered one were collapsed by the worker: settle them as superseded
    if (msg.type === "plan" || msg.type === "failed") {
      for (const [seq, q] of this.pending) {
        if (seq < msg.seq) {
          this.pending.delete(seq);
          q.reject(new Error("superseded by a newer request"));
        }
      }
    }
  }

  plan(overrides: PlanOverrides, onProgress: (s: PlanStage, f: number) => void): Promise<Plan> {
    const seq = ++this.seq;
    return new Promise<Plan>((resolve, reject) => {
      this.pending.set(seq, { resolve, reject, onProgress });
      this.worker.postMessage({ type: "plan", seq, overrides });
    });
  }

  close(): Promise<number> {
    return this.worker.terminate();
  }
}

/** True when the compiled worker file sits beside this module (not when running from sources). */
export function workerAvailable(): boolean {
  const here = fileURLToPath(import.meta.url);
  return here.endsWith(".js") && existsSync(fileURLToPath(new URL("./planWorker.js", import.meta.url)));
}

/** Let the event loop turn (draw the progress line, read keys) before a stretch of computing. */
function yieldToEventLoop(): Promise<void> {
  return new Promise((resolve) => setImmediate(resolve));
}

/** Real services for a session on one design. `close()` stops the worker. */
export function createSessionServices(opts: ServiceOptions): SessionServices & { close(): Promise<void> } {
  let inputs: Promise<PlanInputs> | null = null;
  const load = (): Promise<PlanInputs> => (inputs ??= loadPlanInputs(opts.designPath, opts.cwd));
  const worker = (opts.useWorker ?? workerAvailable()) ? new WorkerPlanner(opts.designPath, opts.cwd, opts.sessionPath) : null;

  return {
    async open() {
      const { design, catalogs } = await load();
      const base: PlanSettings = resolveSettings(design);
      return {
        base,
        options: {
          materials: catalogs.materials.map((m) => ({ id: m.id, label: m.name })),
          families: CELL_FAMILIES.map((f) => ({ id: f.id, label: `${f.description}${f.resonant ? " (resonant)" : ""}` })),
          processes: catalogs.processes.map((p) => ({ id: p.id, label: p.name })),
        },
      };
    },

    async plan(overrides, onProgress) {
      if (worker) return worker.plan(overrides, onProgress);
      const inputs = await load();
      await yieldToEventLoop();
      return planSession(inputs, overrides, opts.sessionPath, onProgress);
    },

    async schemes(settings, overrides) {
      const { field, design } = await load();
      await yieldToEventLoop();
      // the index the plans reduce with: one the design or the session gives, 1 included; none keeps
      // the design's own background
      const backgroundIndex = givenBackgroundIndex(design, overrides);
      const summaries = compareSchemes(field, settings.polarization, {
        unitAxis: settings.unitAxis,
        ...(backgroundIndex !== undefined ? { backgroundIndex } : {}),
      });
      return schemeTableView(settings.polarization, summaries, summaries.skipped ?? []);
    },

    async exportPlan(plan, overrides, view, options) {
      // the layout files come from the same code as `plan --layout`; its notes are dropped here
      const extra = options?.layout ? layoutFiles(plan, { stderr: () => undefined }) : [];
      const paths = await writePlanOutputs(plan, opts.outDir, { extra });
      await saveSessionFile(opts.sessionPath, { designPath: opts.designPath, overrides, view });
      return [...paths, opts.sessionPath];
    },

    async saveChoices(overrides, view) {
      await saveSessionFile(opts.sessionPath, { designPath: opts.designPath, overrides, view });
      return opts.sessionPath;
    },

    async close() {
      if (worker) await worker.close();
    },
  };
}
