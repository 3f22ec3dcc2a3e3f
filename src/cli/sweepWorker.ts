/**
 * Worker thread of `verify --sweep`: receives the sweep's context once (workerData, a structured
 * clone of plain data), then solves one frequency per message with the pure solveSweepPoint and
 * posts the figures back. Errors travel as data (sweepPool.ts turns them back into the error kinds
 * the command line reports). Started by sweepPool.ts from the compiled dist/ tree.
 */
import { parentPort, workerData } from "node:worker_threads";
import { solveSweepPoint, type SweepContext } from "../verify/sweep/sweepPoint.js";
import { errorAsData, type SweepTask } from "./sweepPool.js";

const ctx = (workerData as { context: SweepContext }).context;
const port = parentPort;
if (!port) throw new Error("sweepWorker: expected to run as a worker thread");
port.on("message", (task: SweepTask) => {
  try {
    port.postMessage({ index: task.index, point: solveSweepPoint(ctx, task.frequencyHz) });
  } catch (err) {
    port.postMessage({ index: task.index, error: errorAsData(err) });
  }
});
