/**
 * Worker thread of `verify --sweep`: receives the sweep's context once (workerData, a structured
 * clone of plain data; a transform with compiled functions is loaded again from the design file),
 * then solves one frequency per message with the pure solveSweepPoint and
 * posts the figures back. Errors travel as data (sweepPool.ts turns them back into the error kinds
 * the command line reports). Started by sweepPool.ts from the compiled dist/ tree.
 */
import { parentPort, workerData } from "node:worker_threads";
import { loadDesign } from "../io/design/loadDesign.js";
import { solveSweepPoint, type SweepContext } from "../verify/sweep/sweepPoint.js";
import { errorAsData, type SweepTask, type WorkerData } from "./sweepPool.js";

const data = workerData as WorkerData;
const port = parentPort;
if (!port) throw new Error("sweepWorker: expected to run as a worker thread");
// a transform holding compiled functions (computed maps, expression maps) cannot be cloned: load it again
const ready: Promise<SweepContext> = data.context.transform !== null
  ? Promise.resolve(data.context as SweepContext)
  : loadDesign(data.designPath, data.cwd).then((d) => ({ ...data.context, transform: d.transform }) as SweepContext);
port.on("message", (task: SweepTask) => {
  ready.then((ctx) => {
    port.postMessage({ index: task.index, point: solveSweepPoint(ctx, task.frequencyHz) });
  }).catch((err: unknown) => {
    port.postMessage({ index: task.index, error: errorAsData(err) });
  });
});
