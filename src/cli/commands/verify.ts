/**
 * `cellwright verify <design.json>`: the 2D full-wave check — the bare hidden object, the ideal
 * (scheme full), reduced (chosen scheme) and realized (the plan's levels as built) devices solved
 * with the FDFD solver of src/verify on a ladder of grids, each figure extrapolated with an
 * uncertainty; plane wave at any angle or a Gaussian beam; with --out an SVG of |field|.
 */
import { isVolumeDevice } from "../../field/isVolumeDevice.js";
import { resolve } from "node:path";
import { InputError } from "../../core/errors.js";
import { expectedTimeWarning } from "../../core/timeEstimate.js";
import { writeFileAtomic } from "../../io/atomicWrite.js";
import { loadDesign } from "../../io/design/loadDesign.js";
import { loadFieldForDesign } from "../../io/fieldCsv.js";
import { loadMaterialCatalog } from "../../io/materialCatalog.js";
import { loadProcessCatalog } from "../../io/processCatalog.js";
import { parseQuantity } from "../../io/quantity.js";
import { planFromField } from "../../plan/runPlan.js";
import { givenBackgroundIndex, resolveSettings } from "../../plan/resolveSettings.js";
import { reduceField } from "../../reduce/reduceField.js";
import { deviceCases } from "../../verify/deviceCases.js";
import { bulkMaterials } from "../../verify/bulkMaterials.js";
import { carpetGround } from "../../verify/carpetGround.js";
import { SPEED_OF_LIGHT_M_PER_S } from "../../core/physicalConstants.js";
import { fieldSvg } from "../../verify/fieldSvg.js";
import { formatLength } from "../../verify/formatQuantity.js";
import { formatFrequencyPrecise, formatPoint } from "../../core/formatQuantity.js";
import type { Illumination } from "../../verify/illumination.js";
import { DEFAULT_ACCURACY } from "../../verify/verifyDevice.js";
import { DEFAULT_SOLVER_BYTES, formatBytes } from "../../verify/assemble.js";
import { workerBaselineBytes } from "../../verify/sweep/sweepConcurrency.js";
import { memoryBudget } from "../../io/memoryLimit.js";
import { METHOD_OPTIONS, runCheck, type CheckCase, type CheckResult, type MethodOption } from "../../verify/runCheck.js";
import { flagOption, stringOption } from "../args.js";
import { parseSweep, parseThreshold, parseWorkers, runVerifySweep, SWEEP_CSV, SWEEP_SVG } from "./verifySweep.js";
import type { CliIo } from "../cliIo.js";
import type { Command, ParsedArgs } from "../command.js";
import { EXIT_OK } from "../run.js";
import { optionOverrides } from "./plan.js";
import { checkBackgroundMaterialBeforeReduction, type BackgroundDispersion } from "../../verify/sweep/backgroundAtFrequency.js";
import type { Material } from "../../media/material.js";

export const VERIFY_SVG = "verify-fields.svg";

const jn = (v: number | null | undefined): number | null => (v !== null && v !== undefined && Number.isFinite(v) ? v : null);

/** The machine-readable summary printed by --json. */
export function verifySummary(design: string, scheme: string, r: CheckResult, outputs: string[], warnings: string[] = []): Record<string, unknown> {
  return {
    design,
    method: r.method,
    methodReason: r.methodReason,
    polarization: r.polarization,
    scheme,
    frequencyHz: r.frequencyHz,
    illumination: r.illumination.kind === "plane"
      ? { kind: "plane", angleDeg: (r.illumination.angleRad * 180) / Math.PI }
      : { kind: "beam", angleDeg: (r.illumination.angleRad * 180) / Math.PI, waistM: r.illumination.waistM, focusM: r.illumination.focusM },
    accuracy: r.accuracy,
    resolutions: r.resolutions,
    grid: r.grid ? { nx: r.grid.nx, ny: r.grid.ny, stepM: r.grid.h, pmlNodes: r.grid.pml } : null,
    densestIndex: r.densestIndex,
    backgroundIndex: r.backgroundIndex,
    marginM: r.marginM,
    scene: r.groundYM !== null ? { kind: "ground", groundYM: r.groundYM } : { kind: "free" },
    converged: checkConverged(r),
    cases: r.cases.map((c) => ({
      name: c.name,
      method: c.method,
      methodReason: c.methodReason,
      available: c.available,
      reason: c.reason,
      scatteringWidthM: jn(c.scatteringWidthM),
      uncertainty: jn(c.uncertainty),
      scatteringWidthUncertaintyM: jn(c.scatteringWidthUncertaintyM),
      scatteringWidthBelowM: jn(c.scatteringWidthBelowM),
      converged: c.converged,
      vsBare: jn(c.vsBare),
      vsBareUncertainty: jn(c.vsBareUncertainty),
      absorptionWidthM: jn(c.absorptionWidthM),
      powerBalance: jn(c.powerBalance),
      fieldErrorVsIdeal: jn(c.fieldErrorVsIdeal),
      deliveredPower: jn(c.deliveredPower),
      deliveredPowerUncertainty: jn(c.deliveredPowerUncertainty),
      deviationDeg: jn(c.deviationDeg),
      lobes: c.lobes ? c.lobes.map((l) => ({ directionDeg: jn(l.directionDeg), share: jn(l.share) })) : null,
      ladder: c.ladder.map((p) => ({ resolution: p.resolution, stepM: p.stepM, scatteringWidthM: jn(p.scatteringWidthM), vsBare: jn(p.vsBare), deliveredPower: jn(p.deliveredPower) })),
      ...(c.bistaticM ? { bistaticM: Array.from(c.bistaticM, (v) => jn(v) ?? 0) } : {}),
    })),
    homogenizationError: r.homogenizationError && {
      difference: jn(r.homogenizationError.difference), differenceUncertainty: jn(r.homogenizationError.differenceUncertainty),
      differenceScale: r.homogenizationError.differenceScale, differenceScaleM: jn(r.homogenizationError.differenceScaleM),
      differences: r.homogenizationError.differences.map((v) => jn(v) ?? 0), converged: r.homogenizationError.converged,
      relative: jn(r.homogenizationError.relative), uncertainty: jn(r.homogenizationError.uncertainty),
      vsBareDifference: jn(r.homogenizationError.vsBareDifference), deliveredPowerDifference: jn(r.homogenizationError.deliveredPowerDifference),
      deliveredPowerDifferenceUncertainty: jn(r.homogenizationError.deliveredPowerDifferenceUncertainty),
      stepM: r.homogenizationError.stepM, resolutions: r.homogenizationError.resolutions,
      stepsM: r.homogenizationError.stepsM, stepsAcrossFeature: r.homogenizationError.stepsAcrossFeature,
      featureM: r.homogenizationError.featureM, ratios: r.homogenizationError.ratios.map((v) => jn(v) ?? 0),
    },
    notes: r.notes,
    warnings,
    outputs,
  };
}

/** Every figure within --accuracy: each computed case and the homogenization error (exit code 2 otherwise). */
export function checkConverged(r: CheckResult): boolean {
  return r.cases.every((c) => !c.available || c.converged !== false) && r.homogenizationError?.converged !== false;
}

/** The human table. */
export function verifyTable(design: string, scheme: string, r: CheckResult): string {
  const f = (v: number | null, d = 3): string => (v === null || !Number.isFinite(v) ? "—" : Number(v.toPrecision(d)).toString());
  const pct = (v: number | null): string => (v === null || !Number.isFinite(v) ? "—" : `${Number((v * 100).toPrecision(2))} %`);
  const unc = (v: number | null): string => (v !== null && v < 1e-4 ? "< 0.01 %" : pct(v));
  const hasBare = r.cases.some((c) => c.name === "bare" && c.available);
  const beam = r.illumination.kind === "beam";
  const ground = r.groundYM !== null;
  const mixed = r.method === "radial+fdfd";
  const head = ["case", ...(mixed ? ["solver"] : []), beam ? "σ_s (beam)" : "σ_s", ...(hasBare ? ["σ/σ_bare"] : []), ...(beam ? [ground ? "specular" : "delivered", "deviation"] : []), "±", "field vs ideal", ""];
  const rows = r.cases.map((c) => c.available
    ? [c.name, ...(mixed ? [c.method ?? ""] : []), widthText(c), ...(hasBare ? [f(c.vsBare)] : []), ...(beam ? [pct(c.deliveredPower), c.deviationDeg === null ? "—" : `${c.deviationDeg.toFixed(1)}°`] : []), unc(c.uncertainty), pct(c.fieldErrorVsIdeal), c.converged === false ? "not converged" : ""]
    : [c.name, ...(mixed ? [""] : []), "—", ...(hasBare ? ["—"] : []), ...(beam ? ["—", "—"] : []), "", "", `not computed: ${c.reason}`]);
  const widths = head.map((h, k) => Math.max(h.length, ...rows.map((row) => (k === head.length - 1 ? 0 : row[k].length))));
  const line = (cells: string[]): string => ("  " + cells.map((c, k) => (k === 0 ? c.padEnd(widths[k]) : k === cells.length - 1 ? c : c.padStart(widths[k]))).join("  ")).trimEnd();
  const il = r.illumination;
  const ill = il.kind === "plane"
    ? `plane wave at ${f((il.angleRad * 180) / Math.PI)}° from +x`
    : `Gaussian beam at ${f((il.angleRad * 180) / Math.PI)}°, waist ${formatLength(il.waistM)}, focus ${formatPoint(il.focusM)}`;
  const ladder = r.resolutions.length > 1 ? `ladder ${r.resolutions.join(", ")} points per wavelength, extrapolated (accuracy ${pct(r.accuracy)})` : r.resolutions.length === 1 ? `one grid at ${r.resolutions[0]} points per wavelength` : `accuracy ${pct(r.accuracy)}`;
  const solver = r.method === "radial" ? "exact radial solver (no grid)" : r.method === "fdfd" ? "FDFD" : "exact radial solver and FDFD";
  return [
    design,
    `  ${r.polarization}, scheme ${scheme}, ${formatFrequencyPrecise(r.frequencyHz)}, ${ill}; ${solver}, ${ladder}${r.grid ? `; finest grid ${r.grid.nx} × ${r.grid.ny} nodes, step ${formatLength(r.grid.h)} (densest index ${Number(r.densestIndex.toPrecision(3))})` : ""}`,
    `  solver: ${r.methodReason}`,
    line(head),
    ...rows.map(line),
    `  σ_s: scattering width (scattered power / incident intensity), ${r.method === "radial" ? "exact per angular order" : r.method === "fdfd" ? "extrapolated to zero grid step" : "exact (radial) or extrapolated to zero grid step (fdfd)"}; ±: its relative uncertainty, against the largest of σ_s${hasBare ? ", the bare object's σ" : ""} and the device's width`,
    ...(r.cases.some((c) => c.available && c.scatteringWidthBelowM !== null) ? ["  ≈ 0 (< X): the width cannot be told from zero; X is the largest width the evidence allows (extrapolated value plus its uncertainty, at least 1e-6 of the device's width)"] : []),
    ...(beam && !ground ? ["  delivered: share of the outgoing power inside the ideal device's output lobe; deviation: output direction minus the ideal's"] : []),
    ...(ground ? [
      `  ground plane below y = ${formatLength(r.groundYM!)} (perfect conductor; the bump is part of it in every case but flat)`,
      "  specular: share of the incident beam's power reflected into the flat ground's specular lobe; deviation: reflected beam's direction minus the specular one",
    ] : []),
    ...r.cases.filter((c) => c.available && c.lobes && c.lobes.length > 1).map((c) =>
      `  ${c.name}: the beam leaves split into ${c.lobes!.length} lobes, at ${c.lobes!.map((l) => `${l.directionDeg >= 0 ? "+" : "−"}${Math.abs(l.directionDeg).toFixed(1)}° (${Math.round(l.share * 100)} % of the power)`).join(", ")}; its deviation is that of their power-weighted mean direction`),
    "  field vs ideal: relative difference of the total field from the ideal device's, outside the device's box",
    ...homogenizationLine(r),
    ...r.notes.map((n) => `  note: ${n}`),
  ].join("\n") + "\n";
}

/** σ_s for the table: "≈ 0 (< X)" when the width cannot be told from zero (widthReading.ts). */
function widthText(c: CheckCase): string {
  return c.scatteringWidthBelowM !== null ? `≈ 0 (< ${formatLength(c.scatteringWidthBelowM)})` : formatLength(c.scatteringWidthM ?? 0);
}

/** The plan's homogenization error (realized-geometry against realized) for the human table. */
function homogenizationLine(r: CheckResult): string[] {
  const e = r.homogenizationError;
  if (!e) return [];
  const sign = (v: number): string => (v >= 0 ? "+" : "−") + Math.abs(v).toPrecision(2);
  const pm = (u: number | null, scale = 1): string => (u === null ? "" : ` ± ${Number((u * scale).toPrecision(2))}`);
  const over = e.differenceScale === "bare" ? "σ_bare" : "the larger width";
  const state = e.converged === null ? " (single grid, no uncertainty)" : e.converged ? "" : " — not converged";
  return [
    `  homogenization error of the plan (realized-geometry against realized, same grids): (σ_geometry − σ_realized)/${over} ${sign(e.difference)}${pm(e.differenceUncertainty)}` +
      (e.deliveredPowerDifference !== null ? `, delivered ${sign(e.deliveredPowerDifference * 100)}${pm(e.deliveredPowerDifferenceUncertainty, 100)} points` : "") +
      (e.relative !== null ? `; σ ratio ${sign(e.relative * 100)} %${e.uncertainty === null ? "" : `${pm(e.uncertainty, 100)} %`}` : "") + state,
    `    its ladder: (σ_geometry − σ_realized)/${over} ${e.differences.map((v) => v.toFixed(4)).join(", ")}${e.ratios.length ? `, σ_geometry/σ_realized ${e.ratios.map((v) => v.toFixed(4)).join(", ")}` : ""} at ${e.stepsAcrossFeature.join(", ")} grid steps across ${formatLength(e.featureM)} (steps ${e.stepsM.map((h) => formatLength(h)).join(", ")}); ${over} = ${formatLength(e.differenceScaleM)}`,
  ];
}

/** --drawn-time: "300", "90 s", "10 min", "1 h" → seconds (a plain number is seconds); undefined when not given. */
export function parseDrawnTime(text: string | undefined): number | undefined {
  if (text === undefined) return undefined;
  const m = /^\s*(\d+(?:\.\d+)?)\s*(s|min|h)?\s*$/.exec(text);
  if (!m) throw new InputError({ where: "--drawn-time", message: `expected a time such as '10 min', '90 s' or 0, got '${text}'` });
  const v = Number(m[1]) * (m[2] === "h" ? 3600 : m[2] === "min" ? 60 : 1);
  if (!(v <= 86_400)) throw new InputError({ where: "--drawn-time", message: `expected at most a day, got '${text}'` });
  return v;
}

/** "2%" or "0.02" → 0.02. */
function parseFraction(text: string, where: string): number {
  const t = text.trim();
  const v = t.endsWith("%") ? Number(t.slice(0, -1)) / 100 : Number(t);
  if (!(v > 0 && v < 1)) throw new InputError({ where, message: `expected a fraction such as 2% or 0.02, got '${text}'` });
  return v;
}

const beamText0 = (args: ParsedArgs): string | undefined => stringOption(args, "beam");

/**
 * The beam's focus: `centreM` moved by `offsetM` across the beam (to the left of its direction)
 * and by `shiftM` along it (negative: towards the source).
 */
function beamFocus(centreM: [number, number], angleRad: number, offsetM: number, shiftM: number): [number, number] {
  const c = Math.cos(angleRad), s = Math.sin(angleRad);
  return [centreM[0] - offsetM * s + shiftM * c, centreM[1] + offsetM * c + shiftM * s];
}

/** Direction of the default beam above a ground plane: −45° (from the upper left, 45° from the normal). */
export const DEFAULT_GROUND_ANGLE_RAD = -Math.PI / 4;

/**
 * Default waist of the beam above a ground plane: its footprint on the ground (half-width w/|sin φ|)
 * covers at most a quarter of the device's width, between one and three background wavelengths.
 */
export function defaultGroundWaist(deviceWidthM: number, angleRad: number, lambdaBackgroundM: number): number {
  return Math.min(3 * lambdaBackgroundM, Math.max(lambdaBackgroundM, (deviceWidthM * Math.abs(Math.sin(angleRad))) / 4));
}

export const command: Command = {
  name: "verify",
  summary: "2D full-wave check: ideal, reduced, realized and drawn devices, with uncertainties",
  usage: "verify <design.json> [--polarization Ez|Hz] [--scheme NAME] [--accuracy P | --resolution N] [--angle DEG] [--beam 'WAIST[, OFFSET[, SHIFT]]'] [--scene ground|free] [--margin L] [--drawn-time T] [--method auto|fdfd|radial] [--sweep 'START..STOP:COUNT' [--threshold T] [--workers N]] [--json] [--out DIR]",
  details: [
    "Solves each case with a frequency-domain finite-difference solver (PML on all sides), or, for",
    "devices whose tensors depend on the radius only (cloaks, concentrators), exactly per angular",
    "order (--method): the bare hidden object of a cloak (a perfect conductor), the ideal device",
    "(scheme full) and the reduced one (the chosen scheme), both sampled from the continuous map at",
    "the solver's own points, and the realized device (the plan's levels as built, with their loss)",
    "when the design has a realization; where the recipes' inclusions can be drawn in 2D (rods and",
    "holes along z, in-plane laminates), also the drawn structure (realized-geometry), whose",
    "difference from the homogenized one is the plan's homogenization error.",
    "By default a ladder of grids is solved and every figure is extrapolated with an uncertainty;",
    "figures whose uncertainty exceeds --accuracy are marked 'not converged' (exit code 2).",
    "A carpet design (quasi-conformal, only the bottom side replaced by a bump) stands on a perfectly",
    "conducting ground plane and is lit by a Gaussian beam from above (default 45° from the normal);",
    "the cases are then the flat ground, the bump alone, and the cloaks, and the figures are the",
    "share of the beam reflected into the flat ground's specular lobe and the reflected beam's deviation.",
  ].join("\n"),
  options: [
    { name: "polarization", type: "string", valueName: "Ez|Hz", description: "polarization the device serves (overrides the design)" },
    { name: "scheme", type: "string", valueName: "NAME", description: "reduction scheme: full, unit-mu, non-magnetic, isotropic, matched" },
    { name: "accuracy", type: "string", valueName: "P", description: `relative accuracy the grid ladder aims at (default ${DEFAULT_ACCURACY * 100}%)` },
    { name: "resolution", type: "string", valueName: "N", description: "one grid at N points per wavelength in the densest material (no ladder, no uncertainty)" },
    { name: "angle", type: "string", valueName: "DEG", description: "direction of the incident wave, degrees from +x (default 0)" },
    { name: "beam", type: "string", valueName: "W[, D[, S]]", description: "Gaussian beam of waist W, its focus offset by D across the beam from the device centre and shifted by S along it (negative: towards the source)" },
    { name: "scene", type: "string", valueName: "ground|free", description: "carpet designs: on their ground plane, lit by a beam from above (ground, default) or in free space (free)" },
    { name: "margin", type: "string", valueName: "L", description: "free space around the device, e.g. '20 mm' (default half a wavelength)" },
    { name: "drawn-time", type: "string", valueName: "T", description: "estimated time the drawn realized case (realized-geometry) may take, e.g. '10 min' or '90 s' (default 5 min; with --sweep for the whole sweep; 0: not run)" },
    { name: "method", type: "string", valueName: "auto|fdfd|radial", description: "solver: auto (default: radial where the tensors depend on r only, fdfd for the rest), fdfd (finite differences on a grid) or radial (exact, per angular order; cloaks and concentrators, plane waves)" },
    { name: "sweep", type: "string", valueName: "A..B:N", description: "solve every case at N frequencies from A to B, e.g. '8 GHz..10 GHz:21', each on the solver --method picks (dispersive recipes, the drawn case's materials and a background named by reduction.backgroundMaterial re-evaluated at each; --drawn-time is shared by the frequencies)" },
    { name: "threshold", type: "string", valueName: "T", description: "with --sweep: the band is where the realized figure stays within T× the reduced design's at the centre (default 2)" },
    { name: "workers", type: "string", valueName: "N", description: "with --sweep: frequencies solved at once, on worker threads (default: from the time estimate, the cores and the memory)" },
    { name: "json", type: "boolean", description: "print the summary as one JSON object on stdout" },
    { name: "out", type: "string", valueName: "DIR", description: `write ${VERIFY_SVG} (|field| of each case) into DIR; with --sweep ${SWEEP_CSV}, ${SWEEP_SVG} and manifest.json` },
  ],
  async run(args: ParsedArgs, io: CliIo): Promise<number> {
    const designPath = args.positionals[0];
    if (designPath === undefined) throw new InputError({ where: "verify", message: "expected a design file" });
    const json = flagOption(args, "json");
    const overrides = optionOverrides(args);
    const resText = stringOption(args, "resolution");
    const resolution = resText === undefined ? undefined : Number(resText);
    if (resolution !== undefined && !Number.isFinite(resolution)) throw new InputError({ where: "--resolution", message: `expected a number of points per wavelength, got '${resText}'` });
    const accText = stringOption(args, "accuracy");
    if (accText !== undefined && resolution !== undefined) throw new InputError({ where: "--accuracy", message: "give either --accuracy (a ladder of grids) or --resolution (one grid), not both" });
    const accuracy = accText === undefined ? undefined : parseFraction(accText, "--accuracy");
    const method = (stringOption(args, "method") ?? "auto") as MethodOption;
    if (!METHOD_OPTIONS.includes(method)) throw new InputError({ where: "--method", message: `expected ${METHOD_OPTIONS.join(", ")}, got '${method}'` });
    if (method === "radial" && beamText0(args) !== undefined) throw new InputError({ where: "--beam", message: "the radial method solves plane waves only; use --method fdfd for a beam" });
    for (const o of ["resolution", "margin"]) if (method === "radial" && stringOption(args, o) !== undefined) throw new InputError({ where: `--${o}`, message: "the radial method has no grid; drop this option or use --method fdfd" });
    const sweepText = stringOption(args, "sweep");
    if (method === "radial" && sweepText === undefined && stringOption(args, "out") !== undefined) throw new InputError({ where: "--out", message: "the radial method draws no field picture; use --method fdfd" });
    const thresholdText = stringOption(args, "threshold");
    if (thresholdText !== undefined && sweepText === undefined) throw new InputError({ where: "--threshold", message: "applies to a frequency sweep; give --sweep too" });
    const sweep = sweepText === undefined ? null : await parseSweep(sweepText);
    const threshold = parseThreshold(thresholdText);
    const workersText = stringOption(args, "workers");
    if (workersText !== undefined && sweepText === undefined) throw new InputError({ where: "--workers", message: "applies to a frequency sweep; give --sweep too" });
    const workers = parseWorkers(workersText);
    const angleText = stringOption(args, "angle");
    const angleDeg = angleText === undefined ? 0 : Number(angleText);
    if (!Number.isFinite(angleDeg)) throw new InputError({ where: "--angle", message: `expected an angle in degrees, got '${angleText}'` });
    const drawnSeconds = parseDrawnTime(stringOption(args, "drawn-time"));
    const marginText = stringOption(args, "margin");
    const marginM = marginText === undefined ? undefined : await parseQuantity(marginText, "length", "--margin");
    const sceneKind = stringOption(args, "scene");
    if (sceneKind !== undefined && sceneKind !== "ground" && sceneKind !== "free") throw new InputError({ where: "--scene", message: `expected ground or free, got '${sceneKind}'` });
    if (method === "radial" && sceneKind === "ground") throw new InputError({ where: "--scene", message: "the radial method has no ground plane; use --method fdfd" });
    const beamText = stringOption(args, "beam");
    let beam: { waistM: number; offsetM: number; shiftM: number } | null = null;
    if (beamText !== undefined) {
      const parts = beamText.split(",").map((p) => p.trim());
      if (parts.length > 3 || parts.some((p) => p === "")) throw new InputError({ where: "--beam", message: `expected 'WAIST', 'WAIST, OFFSET' or 'WAIST, OFFSET, SHIFT' (e.g. '40 mm, 5 mm, -30 mm'), got '${beamText}'` });
      const waistM = await parseQuantity(parts[0], "length", "--beam");
      const offsetM = parts[1] !== undefined ? await parseQuantity(parts[1], "length", "--beam") : 0;
      const shiftM = parts[2] !== undefined ? await parseQuantity(parts[2], "length", "--beam") : 0;
      if (!(waistM > 0)) throw new InputError({ where: "--beam", message: `expected a positive waist, got '${parts[0]}'` });
      beam = { waistM, offsetM, shiftM };
    }
    const design = await loadDesign(designPath, io.cwd);
    const s = resolveSettings(design, overrides);
    const backgroundIndex = givenBackgroundIndex(design, overrides);
    // a background material is checked as plan, reduce and the session check it, before the field and
    // the plan are computed, against the index of this command's reductions (below)
    let plan = null, bulk, catalog: Material[] = [];
    const bg = design.reduction?.backgroundMaterial === undefined ? null
      : checkBackgroundMaterialBeforeReduction(design, overrides.backgroundIndex !== undefined, (catalog = await loadMaterialCatalog()), backgroundIndex);
    const field = await loadFieldForDesign(design);
    if (isVolumeDevice(field)) throw new InputError({ where: `${design.sourcePath}: $.transform`, message: "the full-wave check is two-dimensional (devices invariant along z); a 3D design cannot be verified" });
    const progress = (text: string): void => io.stderr(`… ${text}\n`);
    if (design.realization !== undefined) {
      progress("plan (for the realized map)");
      const [materials, processes] = await Promise.all([catalog.length ? catalog : loadMaterialCatalog(), loadProcessCatalog()]);
      catalog = materials;
      plan = planFromField(design, field, { materials, processes }, overrides);
      bulk = bulkMaterials(materials, design.frequencyHz, plan);
    }
    const ideal = reduceField(field, { polarization: s.polarization, scheme: "full", backgroundIndex });
    const reduced = reduceField(field, { polarization: s.polarization, scheme: s.scheme, unitAxis: s.unitAxis, backgroundIndex });
    const n = reduced.settings.backgroundIndex, z = reduced.settings.backgroundImpedance;
    const background = { eps: n / z, mu: n * z };
    // a background material (checked above): followed across a sweep (backgroundAtFrequency.ts)
    let backgroundDispersion: BackgroundDispersion | undefined;
    let backgroundNote: string | null = null;
    const backgroundId = design.reduction?.backgroundMaterial;
    if (backgroundId !== undefined && bg !== null) {
      backgroundDispersion = { materialId: backgroundId, designFrequencyHz: design.frequencyHz };
      backgroundNote = `background: ${bg.material.name} ('${backgroundId}', ${bg.material.model} model; ${bg.material.source}), Re ε ${Number(bg.epsRe.toPrecision(6))} at ${formatFrequencyPrecise(design.frequencyHz)} (index ${bg.index.toPrecision(6)}, the design's ${n.toPrecision(6)})${sweep
        ? ": followed at each frequency of the sweep (ε_bg(f) = ε_bg(f₀)·Re ε(f)/Re ε(f₀), its loss not modelled), with the ideal and reduced maps scaled by the same factor (ε′ = J ε_b Jᵀ/det J is linear in ε_b)"
        : "; a --sweep follows its dispersion"}`;
    }
    const built = deviceCases({ transform: design.transform, fieldBackground: design.background, background, polarization: s.polarization, grid: field.grid, ideal, reduced, plan, materials: bulk, freeSpace: sceneKind === "free" });
    if (backgroundNote) built.notes.push(backgroundNote);
    if (sceneKind === "ground" && !built.ground) throw new InputError({ where: "--scene", message: `the ground-plane scene needs a carpet design: ${carpetGround(design.transform).reason}` });
    let angleRad = (angleDeg * Math.PI) / 180;
    let illumination: Illumination = { kind: "plane", angleRad };
    const ground = built.ground;
    if (ground) {
      // a carpet on its ground plane is lit by a beam from above (default 45° from the normal, from the upper left)
      if (angleText === undefined) angleRad = DEFAULT_GROUND_ANGLE_RAD;
      if (!(Math.sin(angleRad) < -0.05)) throw new InputError({ where: "--angle", message: `above a ground plane the beam must travel downwards: expected an angle between −177° and −3° (e.g. −45°, from the upper left), got ${angleText}` });
      const b = ground.bumpBox, cx = ground.centreXM;
      const lambdaB = SPEED_OF_LIGHT_M_PER_S / (design.frequencyHz * n);
      const waistM = beam?.waistM ?? defaultGroundWaist(b.maxX - b.minX, angleRad, lambdaB);
      const offsetM = beam?.offsetM ?? 0, shiftM = beam?.shiftM ?? 0;
      illumination = { kind: "beam", angleRad, waistM, focusM: beamFocus([cx, ground.groundYM], angleRad, offsetM, shiftM) };
    } else if (beam) {
      const b = built.deviceBox, cx = (b.minX + b.maxX) / 2, cy = (b.minY + b.maxY) / 2;
      // focus on the device centre, moved across the beam by the offset and along it by the shift
      illumination = { kind: "beam", angleRad, waistM: beam.waistM, focusM: beamFocus([cx, cy], angleRad, beam.offsetM, beam.shiftM) };
    }
    if (sweep) {
      const sweepGridOption = ["resolution", "margin"].find((o) => stringOption(args, o) !== undefined);
      return runVerifySweep(io, {
        designName: design.name, designPath: design.sourcePath, designFrequencyHz: design.frequencyHz, scheme: s.scheme, range: sweep, threshold, json, outDir: stringOption(args, "out"), notes: built.notes, workers, drawnSeconds,
        context: {
          transform: design.transform, fieldBackground: design.background, background, polarization: s.polarization, grid: field.grid,
          ideal, reduced, plan, catalog, illumination, resolution, accuracy, marginM, freeSpace: sceneKind === "free",
          ...(backgroundDispersion ? { backgroundDispersion } : {}),
          // as the single-frequency check, less --out (a sweep writes no field picture)
          method, gridOption: sweepGridOption ? `--${sweepGridOption}` : null,
        },
      });
    }
    let last = "";
    const warnings: string[] = [];
    const gridOption = ["resolution", "margin", "out"].find((o) => stringOption(args, o) !== undefined);
    // one solve may use the solver's own limit, or less where the machine's budget (or
    // CELLWRIGHT_MEMORY_LIMIT) minus what the command already holds is smaller
    const budget = memoryBudget("verify");
    const heldBytes = workerBaselineBytes(field.grid.count);
    const solverBytes = Math.max(0, Math.min(DEFAULT_SOLVER_BYTES, budget.budgetBytes - heldBytes));
    const solverBytesSource = solverBytes < DEFAULT_SOLVER_BYTES
      ? `the memory budget, ${budget.source}, less about ${formatBytes(heldBytes)} the command holds` : undefined;
    const result = runCheck({
      method, transform: design.transform, gridOption: gridOption && `--${gridOption}`,
      solverBytes, solverBytesSource,
      polarization: s.polarization,
      background,
      frequencyHz: design.frequencyHz,
      deviceBox: built.deviceBox,
      cases: built.cases,
      illumination,
      resolution,
      accuracy,
      marginM,
      pattern: built.radial,
      drawnSeconds,
      onEstimate: (seconds, what) => {
        const w = expectedTimeWarning(seconds, what);
        if (w !== null) { warnings.push(w); io.stderr(`warning: ${w}\n`); }
      },
      groundYM: ground?.groundYM,
      onProgress: (step, fraction) => {
        const tag = `${step} (${Math.floor(fraction * 10) * 10} % of all solves)`;
        if (tag !== last) { last = tag; progress(step === "metrics" ? "metrics" : `solve ${tag}`); }
      },
    });
    result.notes.unshift(...built.notes);
    // with --json the notes also go to stderr (the JSON holds them too); the human table prints them itself
    if (json) for (const note of result.notes) io.stderr(`note: ${note}\n`);
    const outputs: string[] = [];
    const outDir = stringOption(args, "out");
    if (outDir !== undefined && result.grid) {
      const path = resolve(io.cwd, outDir, VERIFY_SVG);
      const panels = result.cases.filter((c) => c.magnitude !== null).map((c) => ({ title: c.name, magnitude: c.magnitude! }));
      const svg = fieldSvg(result.grid, panels, result.deviceMask, {
        title: `${design.name} — |${s.polarization === "Ez" ? "E_z" : "H_z"}|, ${s.polarization}, scheme ${s.scheme}, finest grid`,
      });
      await writeFileAtomic(path, svg);
      outputs.push(path);
    }
    if (json) io.stdout(`${JSON.stringify(verifySummary(design.name, s.scheme, result, outputs, warnings))}\n`);
    else io.stdout(verifyTable(design.name, s.scheme, result) + (outputs.length ? `outputs:\n${outputs.map((p) => `  ${p}`).join("\n")}\n` : ""));
    return checkConverged(result) ? EXIT_OK : 2;
  },
};
