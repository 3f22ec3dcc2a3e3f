/**
 * `verify --sweep "8 GHz..10 GHz:21"`: the full-wave check at every frequency of a sweep (the bare
 * object, ideal, reduced and realized devices, dispersive recipes re-evaluated at each frequency;
 * the drawn realized device where it can be drawn and its ladders fit --drawn-time; each case on
 * the solver --method picks, as the single-frequency check),
 * the band where the realized device stays within --threshold of the reduced design at the centre,
 * and with --out the files verify-sweep.csv and verify-sweep.svg written as one output set
 * (manifest.json last). Frequencies run on worker threads (sweepPool.ts), as many as the cores,
 * the frequencies and the memory budget allow (sweepConcurrency.ts).
 */
import { availableParallelism, loadavg } from "node:os";
import { resolve } from "node:path";
import { InputError } from "../../core/errors.js";
import { memoryBudget } from "../../io/memoryLimit.js";
import { checkOutputFolder, prepareOutputFolder, writeOutputSet, type OutputFile } from "../../io/outputSet.js";
import { parseQuantity } from "../../io/quantity.js";
import { formatFrequencyPrecise } from "../../core/formatQuantity.js";
import { planSweepPool, sweepPeakBytes, workerBaselineBytes } from "../../verify/sweep/sweepConcurrency.js";
import { sweepCsvText } from "../../verify/sweep/sweepCsv.js";
import { chooseSweepThreads, sweepWallSeconds } from "../../verify/sweep/sweepTime.js";
import { expectedTimeWarning, formatDuration } from "../../core/timeEstimate.js";
import { MAX_SWEEP_POINTS, sweepFrequencies, sweepFrequencyFormat } from "../../verify/sweep/sweepFrequencies.js";
import { sweepDrawnPlan } from "../../verify/sweep/sweepDrawn.js";
import { MAX_DRAWN_SECONDS } from "../../verify/drawnLadder.js";
import { DEFAULT_SOLVER_BYTES } from "../../verify/assemble.js";
import { sweepBackground, sweepCases, type SweepContext } from "../../verify/sweep/sweepPoint.js";
import { backgroundAt } from "../../verify/sweep/backgroundAtFrequency.js";
import { SPEED_OF_LIGHT_M_PER_S as C0 } from "../../core/physicalConstants.js";
import { deviceScaleProblem } from "../../verify/verifyDevice.js";
import { summarizeSweep, sweepJson, sweepSeries, sweepTable } from "../../verify/sweep/sweepSummary.js";
import { sweepSvg } from "../../verify/sweep/sweepSvg.js";
import type { CliIo } from "../cliIo.js";
import { EXIT_INTERRUPTED, EXIT_NOT_BUILDABLE, EXIT_OK } from "../run.js";
import { runInterruptible } from "../interruptible.js";
import { runSweepPool } from "../sweepPool.js";

export const SWEEP_CSV = "verify-sweep.csv";
export const SWEEP_SVG = "verify-sweep.svg";
/** Default --threshold: the realized figure within a factor 2 of the reduced design's at the centre. */
export const DEFAULT_SWEEP_THRESHOLD = 2;

export interface SweepRange { startHz: number; stopHz: number; count: number }

const FORM = "expected 'START..STOP:COUNT', e.g. '8 GHz..10 GHz:21' (COUNT frequencies from START to STOP, both included)";

/** Parse --sweep text "START..STOP:COUNT" with the project's quantity parser. */
export async function parseSweep(text: string, where = "--sweep"): Promise<SweepRange> {
  const m = /^\s*(.+?)\s*\.\.\s*(.+?)\s*:\s*([^:]+?)\s*$/.exec(text);
  if (!m) throw new InputError({ where, message: `${FORM}; got '${text}'` });
  const count = Number(m[3]);
  if (!Number.isInteger(count) || count < 1 || count > MAX_SWEEP_POINTS) {
    throw new InputError({ where, message: `expected COUNT a whole number from 1 to ${MAX_SWEEP_POINTS} (${FORM}); got '${m[3]}'` });
  }
  const startHz = await parseQuantity(m[1], "frequency", `${where} (start)`);
  const stopHz = await parseQuantity(m[2], "frequency", `${where} (stop)`);
  if (!(startHz > 0)) throw new InputError({ where, message: `expected a start frequency above 0, got '${m[1]}'` });
  if (count === 1 && stopHz !== startHz) throw new InputError({ where, message: `one frequency needs START = STOP (e.g. '9 GHz..9 GHz:1'); got '${text}'` });
  if (count > 1 && !(stopHz > startHz)) throw new InputError({ where, message: `expected STOP above START (${FORM}); got '${text}'` });
  return { startHz, stopHz, count };
}

/** Parse --threshold: a factor above 1 (default 2). */
export function parseThreshold(text: string | undefined): number {
  if (text === undefined) return DEFAULT_SWEEP_THRESHOLD;
  const t = text.trim().replace(/^[x×]\s*|\s*[x×]$/g, "");
  const v = Number(t);
  if (!(v > 1) || !Number.isFinite(v)) throw new InputError({ where: "--threshold", message: `expected a factor above 1, e.g. 2 (the realized figure within 2× the reduced design's at the centre); got '${text}'` });
  return v;
}

/** ", band 8.48 GHz … 8.51 GHz" for the plot's subtitle (empty without a band). */
function r0band(r: { frequenciesHz: number[]; band: { lowHz: number | null; highHz: number | null } | null }): string {
  const b = r.band, hz = sweepFrequencyFormat(r.frequenciesHz);
  return b && b.lowHz !== null && b.highHz !== null ? `; band ${hz(b.lowHz)} … ${hz(b.highHz)}` : "";
}

export interface SweepRun {
  designName: string;
  /** the design file (workers load a transform with compiled functions from it again) */
  designPath: string;
  designFrequencyHz: number;
  scheme: string;
  context: SweepContext;
  range: SweepRange;
  threshold: number;
  json: boolean;
  outDir: string | undefined;
  /** notes from building the cases (at the design frequency) */
  notes: string[];
  /** --workers: threads asked for (undefined: chosen from the time estimate and the memory) */
  workers?: number;
  /** --drawn-time: estimated seconds the drawn case may take over the whole sweep (undefined: the default) */
  drawnSeconds?: number;
}

/** Parse --workers: a whole number of threads from 1 to 64. */
export function parseWorkers(text: string | undefined): number | undefined {
  if (text === undefined) return undefined;
  const v = Number(text.trim());
  if (!Number.isInteger(v) || v < 1 || v > 64) throw new InputError({ where: "--workers", message: `expected a whole number of threads from 1 to 64, got '${text}'` });
  return v;
}

/** Run the sweep and print (see file comment). Returns the exit code (2 when a figure is not converged). */
export async function runVerifySweep(io: CliIo, run: SweepRun): Promise<number> {
  const { range } = run;
  const frequencies = sweepFrequencies(range.startHz, range.stopHz, range.count);
  const fmtHz = sweepFrequencyFormat(frequencies);
  const names = [SWEEP_CSV, SWEEP_SVG];
  // a folder that cannot take the outputs is refused before minutes of solving
  if (run.outDir !== undefined) await checkOutputFolder(resolve(io.cwd, run.outDir), names);
  const progress = (text: string): void => io.stderr(`… ${text}\n`);
  const budget = memoryBudget("verify");
  const baseline = workerBaselineBytes(run.context.grid.count);
  // the drawn case: swept at every frequency on a share of --drawn-time, or not at all with the reason
  const drawnPlan = sweepDrawnPlan(run.context, frequencies, run.drawnSeconds ?? MAX_DRAWN_SECONDS, Math.min(DEFAULT_SOLVER_BYTES, budget.budgetBytes - baseline));
  const context: SweepContext = { ...run.context, drawn: drawnPlan.drawn };
  // the lowest frequency has the longest wavelength: a device too small for it is refused as the single check does
  {
    const box = sweepCases(context, frequencies[0]).deviceBox;
    const bg = sweepBackground(context, frequencies[0]); // a background material at that frequency
    const lambdaB = C0 / frequencies[0] / Math.sqrt(bg.eps * bg.mu);
    const tooSmall = deviceScaleProblem(Math.max(box.maxX - box.minX, box.maxY - box.minY), lambdaB);
    if (tooSmall !== null) throw new InputError({ where: "--sweep", message: `at ${fmtHz(frequencies[0])}, ${tooSmall}` });
  }
  const peaks = frequencies.map((f) => ({ frequencyHz: f, ...sweepPeakBytes(context, f) }));
  // cores other work keeps busy do not help: without --workers, count only the idle ones (load average)
  const cores = availableParallelism();
  const idle = Math.max(1, Math.min(cores, Math.round(cores - loadavg()[0])));
  const memoryPool = planSweepPool(peaks, run.workers ?? idle, budget.budgetBytes, budget.source, baseline);
  if ("refusal" in memoryPool) throw new InputError({ where: "--sweep", message: memoryPool.refusal });
  // notes about drawing the inclusions say nothing when the drawn case is not swept (its reason does)
  const notes = "reason" in drawnPlan.drawn ? run.notes.filter((n) => !n.startsWith("realized-geometry:")) : [...run.notes];
  if (memoryPool.note) notes.push(memoryPool.note);
  // a background material followed beyond its model's valid range: said, not refused (as the recipes' materials)
  const bgd = run.context.backgroundDispersion;
  if (bgd) {
    const outside = frequencies.filter((f) => !backgroundAt(bgd, run.context.catalog, f).inRange);
    if (outside.length) notes.push(`background: '${bgd.materialId}' is outside the valid range of its dispersion model at ${outside.map((f) => fmtHz(f)).join(", ")}: its values there are extrapolated`);
  }
  // threads: as many as memory allows when asked for, else from the time estimate (sweepTime.ts)
  // the ladder may add rungs: plan for the most it may add (a needless pool costs a start-up; a
  // missing one up to half the time), and warn on that figure as the one-frequency check does
  const perFrequency = peaks.map((p) => p.secondsAtMost);
  const chosen = run.workers !== undefined
    ? { workers: memoryPool.workers, seconds: 0, note: null }
    : chooseSweepThreads(perFrequency, memoryPool.workers);
  if (chosen.note) notes.push(chosen.note);
  else if (run.workers === undefined && idle < Math.min(cores, frequencies.length) && memoryPool.workers === idle) {
    notes.push(`${cores - idle} of ${cores} cores are busy with other work (load average ${loadavg()[0].toFixed(1)}): ${idle} thread${idle === 1 ? "" : "s"} (--workers N to choose)`);
  }
  const pool = chosen.workers === memoryPool.workers ? memoryPool : planSweepPool(peaks, chosen.workers, budget.budgetBytes, budget.source, baseline) as typeof memoryPool;
  const planned = peaks.reduce((a, p) => a + p.seconds, 0);
  const atMost = peaks.reduce((a, p) => a + p.secondsAtMost, 0);
  const radialSeconds = peaks.reduce((a, p) => a + p.radialSeconds, 0);
  const drawnSeconds = peaks.reduce((a, p) => a + p.drawnSeconds, 0);
  const estimate = sweepWallSeconds(perFrequency, pool.workers);
  const parts = [
    ...(radialSeconds > 0 ? [`radial solver ${formatDuration(radialSeconds)}`] : []),
    ...(drawnSeconds > 0 ? [`drawn realized case ${formatDuration(drawnSeconds)}`] : []),
  ];
  const what = `${frequencies.length} frequenc${frequencies.length === 1 ? "y" : "ies"} on ${pool.workers} thread${pool.workers === 1 ? "" : "s"} (${atMost > 1.05 * planned ? `${formatDuration(planned)} of solving if the first rungs converge, up to ${formatDuration(atMost)} if the ladders add all their rungs` : `about ${formatDuration(planned)} of solving`}${parts.length ? `; of which ${parts.join(", ")}` : ""})`;
  const warnings: string[] = [];
  const warning = expectedTimeWarning(estimate, what);
  if (warning !== null) { warnings.push(warning); io.stderr(`warning: ${warning}\n`); }
  progress(`sweep: ${frequencies.length} frequenc${frequencies.length === 1 ? "y" : "ies"} from ${fmtHz(frequencies[0])} to ${fmtHz(frequencies[frequencies.length - 1])}, ${pool.workers} at a time`);
  const ran = await runInterruptible(io, async (signal) => {
    const pooled = await runSweepPool({ ...context, solverBytes: pool.solverBytes }, frequencies, {
      workers: pool.workers, signal, formatHz: fmtHz, designPath: run.designPath, cwd: io.cwd,
      onDone: (done, total, f) => progress(`sweep: ${done} of ${total} done (${fmtHz(f)})`),
    });
    const summary = summarizeSweep(pooled.points, { designFrequencyHz: run.designFrequencyHz, threshold: run.threshold, beam: context.illumination.kind === "beam", backgroundMaterial: context.backgroundDispersion?.materialId ?? null });
    summary.notes = [...new Set([...notes, ...summary.notes])];
    if (pooled.threads === 0 && pool.workers > 1) summary.notes.push("the worker file is not built (running from the sources): frequencies were solved one after the other");
    let written: string[] = [];
    if (run.outDir !== undefined) {
      const folder = await prepareOutputFolder(resolve(io.cwd, run.outDir), names);
      const hasBare = summary.points[0].cases.some((c) => c.name === "bare" && c.available);
      // which lines the exact radial solver drew (the others are grid figures)
      const radialNames = summary.caseNames.filter((n) => summary.points.some((p) => p.cases.some((c) => c.name === n && c.available && c.method === "radial")));
      const solvers = radialNames.length ? `; radial solver: ${radialNames.join(", ")}` : "";
      const followed = context.backgroundDispersion ? `; background ${context.backgroundDispersion.materialId} (its dispersion followed)` : "";
      const subtitle = `${context.polarization}, scheme ${run.scheme}, design frequency ${formatFrequencyPrecise(run.designFrequencyHz)}${solvers}${followed}${r0band(summary)}`;
      const files: OutputFile[] = [
        {
          name: SWEEP_CSV,
          produce: (write) => write(sweepCsvText(summary.points, {
            hasBare, beam: context.illumination.kind === "beam", figure: summary.figure, meetsLimit: summary.band?.meetsLimit ?? null,
            drawn: summary.points.some((p) => p.homogenization !== null), drawnMeetsLimit: summary.drawnBand?.meetsLimit ?? null,
            background: context.backgroundDispersion !== undefined,
          })),
        },
        { name: SWEEP_SVG, produce: (write) => write(sweepSvg(summary.frequenciesHz, sweepSeries(summary), summary.figure, summary.band, run.designName, subtitle, summary.drawnBand)) },
      ];
      written = await writeOutputSet(folder, files, { signal });
    }
    return { result: summary, outputs: written, threads: pooled.threads };
  });
  if (ran.interrupted) return EXIT_INTERRUPTED;
  const { result, outputs, threads } = ran.value;
  // with --json the notes also go to stderr (the JSON holds them too); the human table prints them itself
  if (run.json) for (const note of result.notes) io.stderr(`note: ${note}\n`);
  const sweep = { ...sweepJson(result, run.threshold), workers: pool.workers, threads };
  const ladder = context.resolution !== undefined ? `one grid at ${context.resolution} points per wavelength` : `grid ladder per frequency, accuracy ${Number(((context.accuracy ?? 0.02) * 100).toPrecision(3))} %`;
  const methods = [...new Set(result.points.map((p) => p.method))];
  const method = methods.length === 1 ? methods[0] : "radial+fdfd";
  const solverText = method === "radial" ? "exact radial solver (no grid)" : method === "fdfd" ? `FDFD, ${ladder}` : `exact radial solver and FDFD (${ladder})`;
  if (run.json) {
    io.stdout(`${JSON.stringify({
      design: run.designName, method, methodOption: context.method ?? "auto", polarization: context.polarization, scheme: run.scheme, frequencyHz: run.designFrequencyHz,
      illumination: context.illumination.kind === "plane"
        ? { kind: "plane", angleDeg: (context.illumination.angleRad * 180) / Math.PI }
        : { kind: "beam", angleDeg: (context.illumination.angleRad * 180) / Math.PI, waistM: context.illumination.waistM, focusM: context.illumination.focusM },
      accuracy: context.resolution !== undefined ? null : context.accuracy ?? 0.02,
      resolution: context.resolution ?? null,
      converged: sweep.converged,
      sweep, notes: result.notes, warnings,
      estimate: { solvingSeconds: planned, solvingSecondsAtMost: atMost, radialSeconds, drawnSeconds, wallSeconds: estimate, threads: pool.workers },
      outputs,
    })}\n`);
  } else {
    const header = `${context.polarization}, scheme ${run.scheme}, design frequency ${formatFrequencyPrecise(run.designFrequencyHz)}; ${solverText}; ${pool.workers} frequenc${pool.workers === 1 ? "y" : "ies"} at a time`;
    io.stdout(sweepTable(run.designName, header, result, run.threshold) + (outputs.length ? `outputs:\n${outputs.map((p) => `  ${p}`).join("\n")}\n` : ""));
  }
  return sweep.converged ? EXIT_OK : EXIT_NOT_BUILDABLE;
}
