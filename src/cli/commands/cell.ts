/**
 * `cellwright cell`: design or evaluate one unit cell of a family — dimensions, achieved ε (or μ)
 * per axis, fill fraction, feature check against a process, homogenization check, and for the
 * resonant families the band within tolerance and the passivity bound. Exit 2 when the cell is not
 * buildable as asked (target out of reach, process limit, cell too coarse).
 */
import { deviceScaleProblem } from "../../core/physicalScale.js";
import { SPEED_OF_LIGHT_M_PER_S } from "../../core/physicalConstants.js";
import { InputError, type InputIssue } from "../../core/errors.js";
import type { CellPhase, CellDesignRequest, CellTarget, SplitRingSizes } from "../../cells/cellDesignTypes.js";
import { designCell, DEFAULT_TOLERANCE } from "../../cells/designCell.js";
import { formatCellDesign } from "../../cells/formatCellDesign.js";
import { parseLattice } from "../../cells/lattice.js";
import { RECT_ASPECT_RANGE } from "../../cells/homogenize/rectCircleTable.js";
import { CELL_FAMILIES, getCellFamily } from "../../cells/registry.js";
import { RING_STYLES, type RingStyle } from "../../cells/splitRing.js";
import { findMaterial, loadMaterialCatalog } from "../../io/materialCatalog.js";
import { findProcess, loadProcessCatalog } from "../../io/processCatalog.js";
import { parseQuantity } from "../../io/quantity.js";
import { evaluateMaterial } from "../../media/material.js";
import { flagOption, stringOption } from "../args.js";
import type { CliIo } from "../cliIo.js";
import type { Command, ParsedArgs } from "../command.js";
import { EXIT_NOT_BUILDABLE, EXIT_OK } from "../run.js";
import { layerReport, type LayerReport } from "../../cells/slab/layerHost.js";
import { bandIndex } from "../../cells/band/lowestBand.js";
import { anchoredBandIndex } from "../../cells/band/anchoredBandIndex.js";
import type { CellDesign } from "../../cells/cellDesignTypes.js";


/** --frequency F or --wavelength L (vacuum), as Hz. */
async function designFrequency(args: ParsedArgs): Promise<number> {
  const f = stringOption(args, "frequency");
  const l = stringOption(args, "wavelength");
  if (f !== undefined && l !== undefined) throw new InputError({ where: "--wavelength", message: "give either --frequency or --wavelength, not both" });
  if (l !== undefined) {
    const m = await parseQuantity(l, "length", "--wavelength");
    if (!(m > 0)) throw new InputError({ where: "--wavelength", message: `expected a wavelength > 0, got '${l}'` });
    return SPEED_OF_LIGHT_M_PER_S / m;
  }
  const hz = await parseQuantity(f, "frequency", "--frequency");
  if (!(hz > 0)) throw new InputError({ where: "--frequency", message: `expected a frequency > 0, got '${f}'` });
  return hz;
}

const LAYER_FLAGS = ["layer-core", "layer-thickness", "layer-below", "layer-above"] as const;

const spreadOverMean = (x: number[]): number => (Math.max(...x) - Math.min(...x)) / (x.reduce((p, q) => p + q, 0) / x.length);

interface BandReport {
  bandIndex: {
    directions: number[]; names: string[]; quasiStatic: number; quasiStaticByDirection: number[]; anisotropy: number; excessAnisotropy: number; inBand: boolean; planeWaves: number;
    expansion: { directions: number[]; quasiStaticByDirection: number[] };
  };
  spatialDispersion: number;
}

/**
 * Band index and spatial dispersion of rods or holes on square, hex or rect lattices (null for
 * other families and lattices). The indices are anchored on the solved long-wavelength tensor
 * (cells/band/anchoredBandIndex.ts); the expansion's own values are kept beside them.
 */
function bandFor(design: CellDesign, host: CellPhase, inclusion: CellPhase, axis: "parallel" | "perpendicular"): BandReport | null {
  if (design.familyId !== "rods-in-host" && design.familyId !== "holes-in-slab") return null;
  if (design.lattice !== "square" && design.lattice !== "hex" && design.lattice !== "rect") return null;
  if (design.fill === null || !(host.eps.re > 0) || !(inclusion.eps.re > 0)) return null;
  const k0a = (2 * Math.PI * design.frequencyHz * design.pitchM) / SPEED_OF_LIGHT_M_PER_S;
  const aspect = design.lattice === "rect" ? design.aspect ?? 1 : 1;
  const cell = { lattice: design.lattice, epsHost: host.eps.re, epsCircle: inclusion.eps.re, fill: design.fill, ...(design.lattice === "rect" ? { aspect } : {}) };
  const b = bandIndex(cell, axis, k0a);
  const a = design.achieved;
  const anchored = anchoredBandIndex(b, design.lattice, axis, { zz: a.parallel.re, xx: a.perpendicular.re, yy: (a.perpendicularY ?? a.perpendicular).re }, aspect)
    ?? { index: b.index, quasiStaticIndex: b.quasiStaticIndex };
  return {
    bandIndex: {
      directions: anchored.index, names: b.directions, quasiStatic: anchored.quasiStaticIndex[0], quasiStaticByDirection: anchored.quasiStaticIndex,
      anisotropy: spreadOverMean(anchored.index), excessAnisotropy: b.excessAnisotropy, inBand: b.inBand, planeWaves: b.planeWaves,
      expansion: { directions: b.index, quasiStaticByDirection: b.quasiStaticIndex },
    },
    spatialDispersion: b.deviation,
  };
}

function plainNumber(text: string, where: string, what: string): number {
  const v = Number(text);
  if (text.trim() === "" || !Number.isFinite(v)) throw new InputError({ where, message: `expected ${what}, got '${text}'` });
  return v;
}

async function positiveLength(args: ParsedArgs, name: string): Promise<number | undefined> {
  const t = stringOption(args, name);
  if (t === undefined) return undefined;
  const v = await parseQuantity(t, "length", `--${name}`);
  if (!(v > 0)) throw new InputError({ where: `--${name}`, message: `expected a length > 0, got '${t}'` });
  return v;
}

async function phase(id: string, where: string, frequencyHz: number, io: CliIo): Promise<CellPhase> {
  const m = findMaterial(await loadMaterialCatalog(), id, where);
  const v = evaluateMaterial(m, frequencyHz);
  if (v.warning) io.stderr(`warning: ${where}: ${v.warning}\n`);
  return { id: m.id, eps: v.eps, class: m.class, ...(m.conductivitySPerM !== undefined ? { conductivitySPerM: m.conductivitySPerM } : {}) };
}

const json = (x: unknown): string => JSON.stringify(x, (_k, v) => (typeof v === "number" && !Number.isFinite(v) ? null : v));

export const command: Command = {
  name: "cell",
  summary: "design one unit cell: dimensions, effective ε or μ, process and homogenization checks",
  usage: "cell <family> --pitch P [--lattice square|hex|rect|cubic] [--aspect R] (--frequency F | --wavelength L) --host ID --inclusion ID (--fill F | --target EPS) [--axis parallel|perpendicular|perpendicular-y] [--tolerance T] [--process ID] [--height H] [--layer-core ID --layer-thickness L --layer-below ID --layer-above ID] [--json] (resonant families: see below)",
  details: [
    `families: ${CELL_FAMILIES.map((f) => f.id).join(", ")}.`,
    "parallel = field along the rods, holes or wires (in the layer planes of a laminate); perpendicular = across.",
    "--target matches the real part of ε along --axis (default: the family's main axis); the loss follows.",
    "rods-in-host, holes-in-slab (square, hex): the field-across value is the solved periodic cell problem; the",
    "  closed form is shown beside it. Between λ/10 and λ/4 the lowest band is solved (band index, spatial dispersion).",
    "--lattice rect --aspect R (rods-in-host, holes-in-slab): spacing P along x, R·P along y (R = 0.25…4); the field",
    "  across the rods has two values, perpendicular (along x) and perpendicular-y (along y), both solved (a fill",
    "  table per material pair and aspect, solved on first use: 1–20 s). --axis perpendicular-y targets the y value.",
    "--layer-*: the device is made in a film (core, thickness, below, above): the core is mixed with its slab mode",
    "  index (effective-index method; TE modes for a field across the circles, TM along them).",
    "wire-medium: --radius R and/or --target EPS (ε along the wires), --metal ID (default copper), --host ID (default air).",
    "split-ring: --target MU (μ along the ring axis) or --ring-gap D, with optional --ring-radius, --ring-width,",
    "  --stack-spacing, --thickness; --metal ID (default copper), --host ID (default air).",
    "  --ring-style printed: edge-coupled rings etched on a board (the host is the board); the ring radius is",
    "  solved with strip width and separation at the process minimum (or --ring-width, --ring-gap); with",
    "  --ring-radius the separation is solved; --split-gap, --board-thickness. --ring-style split-cylinder:",
    "  stacked double split cylinders. Default: printed for a laminate or solid host or --process pcb-etching,",
    "  split-cylinder in air.",
    "Tolerance: |achieved − target| ≤ T·max(|target|, 1). Exit 2 when the cell is not buildable as asked.",
  ].join("\n"),
  options: [
    { name: "pitch", type: "string", valueName: "P", description: "cell pitch (lattice constant), e.g. '2 mm'" },
    { name: "lattice", type: "string", valueName: "L", description: "square, hex, rect or cubic (default: the family's first)" },
    { name: "aspect", type: "string", valueName: "R", description: "rect lattice: spacing along y over the pitch (b/a), 0.25…4" },
    { name: "frequency", type: "string", valueName: "F", description: "design frequency, e.g. '10 GHz'" },
    { name: "wavelength", type: "string", valueName: "L", description: "vacuum wavelength instead of a frequency, e.g. '1550 nm'" },
    { name: "layer-core", type: "string", valueName: "ID", description: "film material the cell is etched in (with the other --layer-* options)" },
    { name: "layer-thickness", type: "string", valueName: "L", description: "film thickness, e.g. '220 nm'" },
    { name: "layer-below", type: "string", valueName: "ID", description: "material below the film (substrate)" },
    { name: "layer-above", type: "string", valueName: "ID", description: "material above the film (cover)" },
    { name: "host", type: "string", valueName: "ID", description: "host material id (default air for wire-medium and split-ring)" },
    { name: "inclusion", type: "string", valueName: "ID", description: "inclusion material id" },
    { name: "fill", type: "string", valueName: "F", description: "fill fraction of the inclusion, 0..1 (evaluate)" },
    { name: "target", type: "string", valueName: "EPS", description: "target Re ε (Re μ for split-ring) (design)" },
    { name: "axis", type: "string", valueName: "A", description: "axis the target applies to: parallel, perpendicular (rect: along x) or perpendicular-y (rect)" },
    { name: "tolerance", type: "string", valueName: "T", description: `allowed error on the target (default ${DEFAULT_TOLERANCE})` },
    { name: "process", type: "string", valueName: "ID", description: "fabrication process id (catalogs/processes.csv)" },
    { name: "height", type: "string", valueName: "H", description: "feature height (slab thickness, rod length) for the aspect-ratio limit" },
    { name: "metal", type: "string", valueName: "ID", description: "wire or ring metal (default copper)" },
    { name: "radius", type: "string", valueName: "R", description: "wire radius (wire-medium)" },
    { name: "ring-radius", type: "string", valueName: "R", description: "inner ring radius (split-ring)" },
    { name: "ring-width", type: "string", valueName: "W", description: "ring strip width (split-ring)" },
    { name: "ring-gap", type: "string", valueName: "D", description: "gap between the two rings (split-ring; else designed)" },
    { name: "stack-spacing", type: "string", valueName: "L", description: "ring spacing along the axis (split-ring; default the pitch)" },
    { name: "thickness", type: "string", valueName: "T", description: "metal thickness (split-ring; default thick vs the skin depth)" },
    { name: "ring-style", type: "string", valueName: "S", description: "printed or split-cylinder (split-ring; default from host and process)" },
    { name: "split-gap", type: "string", valueName: "G", description: "width of the cut in each printed ring (split-ring)" },
    { name: "board-thickness", type: "string", valueName: "H", description: "board thickness under printed rings (split-ring; default thick)" },
    { name: "json", type: "boolean", description: "print one JSON object on stdout" },
  ],
  maxPositionals: 1,
  async run(args, io) {
    const familyId = args.positionals[0];
    if (familyId === undefined) throw new InputError({ where: "cell", message: `expected a family: ${CELL_FAMILIES.map((f) => f.id).join(", ")}` });
    const family = getCellFamily(familyId, "family");
    const axisGiven = stringOption(args, "axis");
    if (axisGiven !== undefined && axisGiven !== "parallel" && axisGiven !== "perpendicular" && axisGiven !== "perpendicular-y") {
      throw new InputError({ where: "--axis", message: `expected parallel, perpendicular or perpendicular-y, got '${axisGiven}'` });
    }
    const issues: InputIssue[] = [];
    const need = (name: string, what: string) => {
      if (stringOption(args, name) === undefined) issues.push({ where: `--${name}`, message: `expected ${what}` });
    };
    need("pitch", "the cell pitch, e.g. '2 mm'");
    if (stringOption(args, "frequency") === undefined && stringOption(args, "wavelength") === undefined) issues.push({ where: "--frequency", message: "expected the design frequency, e.g. '10 GHz' (or --wavelength)" });
    const layerGiven = LAYER_FLAGS.filter((o) => stringOption(args, o) !== undefined);
    if (layerGiven.length > 0 && layerGiven.length < LAYER_FLAGS.length) for (const o of LAYER_FLAGS) if (stringOption(args, o) === undefined) issues.push({ where: `--${o}`, message: "give all four --layer-* options or none" });
    if (layerGiven.length > 0 && family.resonant) issues.push({ where: "--layer-core", message: "a layer applies to dielectric families, not to resonant ones" });
    const fillText = stringOption(args, "fill");
    const targetText = stringOption(args, "target");
    const ringOnly = ["ring-radius", "ring-width", "ring-gap", "stack-spacing", "thickness", "ring-style", "split-gap", "board-thickness"];
    for (const o of ringOnly) if (family.id !== "split-ring" && stringOption(args, o) !== undefined) issues.push({ where: `--${o}`, message: "only for the split-ring family" });
    if (family.id !== "wire-medium" && stringOption(args, "radius") !== undefined) issues.push({ where: "--radius", message: "only for the wire-medium family" });
    if (!family.resonant) {
      need("host", "a host material id");
      need("inclusion", "an inclusion material id");
      if (stringOption(args, "metal") !== undefined) issues.push({ where: "--metal", message: "only for wire-medium and split-ring" });
      if ((fillText === undefined) === (targetText === undefined)) issues.push({ where: "cell", message: "give exactly one of --fill F or --target EPS" });
    } else if (family.id === "wire-medium" && fillText === undefined && targetText === undefined && stringOption(args, "radius") === undefined) {
      issues.push({ where: "cell", message: "wire-medium needs --radius R, --fill F or --target EPS" });
    } else if (family.id === "split-ring" && targetText === undefined && stringOption(args, "ring-gap") === undefined) {
      issues.push({ where: "cell", message: "split-ring needs --target MU or --ring-gap D" });
    }
    const styleText = stringOption(args, "ring-style");
    if (family.id === "split-ring" && styleText !== undefined && !(RING_STYLES as readonly string[]).includes(styleText)) {
      issues.push({ where: "--ring-style", message: `expected ${RING_STYLES.join(" or ")}, got '${styleText}'` });
    }
    if (issues.length) throw new InputError(issues);

    const latticeText = stringOption(args, "lattice");
    const lattice = latticeText === undefined ? family.lattices[0] : parseLattice(latticeText, "--lattice");
    if (!family.lattices.includes(lattice)) throw new InputError({ where: "--lattice", message: `${family.id} takes ${family.lattices.join(" or ")}, not ${lattice}` });
    const aspectText = stringOption(args, "aspect");
    if (aspectText !== undefined && lattice !== "rect") throw new InputError({ where: "--aspect", message: "only with --lattice rect" });
    if (aspectText === undefined && lattice === "rect") throw new InputError({ where: "--aspect", message: "expected the aspect R = b/a of the rect lattice (spacing along y over the pitch), e.g. '2'" });
    let aspect: number | undefined;
    if (aspectText !== undefined) {
      aspect = plainNumber(aspectText, "--aspect", "an aspect ratio b/a such as '2'");
      if (!(aspect >= RECT_ASPECT_RANGE[0] && aspect <= RECT_ASPECT_RANGE[1])) throw new InputError({ where: "--aspect", message: `expected an aspect ratio in ${RECT_ASPECT_RANGE[0]}…${RECT_ASPECT_RANGE[1]}, got '${aspectText}'` });
    }
    if (axisGiven === "perpendicular-y" && lattice !== "rect") throw new InputError({ where: "--axis", message: "perpendicular-y needs --lattice rect" });
    const pitchM = (await positiveLength(args, "pitch"))!;
    const frequencyHz = await designFrequency(args);
    const pitchScale = deviceScaleProblem(pitchM, frequencyHz, "the pitch");
    if (pitchScale !== null && pitchM * frequencyHz > SPEED_OF_LIGHT_M_PER_S) throw new InputError({ where: "--pitch", message: pitchScale });

    let fill: number | undefined;
    if (fillText !== undefined) {
      fill = plainNumber(fillText, "--fill", "a fill fraction in [0, 1]");
      if (fill < 0 || fill > 1) throw new InputError({ where: "--fill", message: `expected a fill fraction in [0, 1], got '${fillText}'` });
      const [lo, hi] = family.fillRange(lattice, aspect);
      if (fill < lo) throw new InputError({ where: "--fill", message: `${fill} is below the smallest fill ${lo} of ${family.id}` });
      if (fill > hi) throw new InputError({ where: "--fill", message: `${fill} is above the geometric limit ${Number(hi.toPrecision(4))} of ${family.id} in a ${lattice} lattice (inclusions touch)` });
    }
    const radiusM = await positiveLength(args, "radius");
    if (radiusM !== undefined) {
      if (!(radiusM < pitchM / 2)) throw new InputError({ where: "--radius", message: `expected a wire radius below half the pitch (${pitchM / 2} m), got ${radiusM} m` });
      fill = (Math.PI * radiusM * radiusM) / (pitchM * pitchM);
    }
    const target: CellTarget = {};
    if (targetText !== undefined) {
      const t = plainNumber(targetText, "--target", family.id === "split-ring" ? "a real permeability such as '0.3'" : "a real permittivity such as '3.2'");
      if (family.id === "split-ring") target.mu = t;
      else {
        const axisText = stringOption(args, "axis") ?? family.defaultAxis;
        if (axisText !== "parallel" && axisText !== "perpendicular" && axisText !== "perpendicular-y") throw new InputError({ where: "--axis", message: `expected parallel, perpendicular or perpendicular-y, got '${axisText}'` });
        if (family.id === "wire-medium" && axisText !== "parallel") throw new InputError({ where: "--axis", message: "a wire medium is designed for ε along the wires (parallel)" });
        target[axisText === "perpendicular-y" ? "perpendicularY" : axisText] = t;
      }
    }
    const tolText = stringOption(args, "tolerance");
    const tolerance = tolText === undefined ? DEFAULT_TOLERANCE : plainNumber(tolText, "--tolerance", "a tolerance > 0");
    if (!(tolerance > 0)) throw new InputError({ where: "--tolerance", message: `expected a tolerance > 0, got '${tolText}'` });
    const heightM = await positiveLength(args, "height");
    const splitRing: SplitRingSizes = {};
    type SizeKey = Exclude<keyof SplitRingSizes, "ringStyle">;
    const sizeKeys: [string, SizeKey][] = [["ring-radius", "ringRadiusM"], ["ring-width", "ringWidthM"], ["ring-gap", "ringGapM"], ["stack-spacing", "stackSpacingM"], ["thickness", "metalThicknessM"], ["split-gap", "splitGapM"], ["board-thickness", "boardThicknessM"]];
    for (const [flag, key] of sizeKeys) {
      const v = await positiveLength(args, flag);
      if (v !== undefined) splitRing[key] = v;
    }
    if (styleText !== undefined) splitRing.ringStyle = styleText as RingStyle;

    const processId = stringOption(args, "process");
    const process = processId === undefined ? undefined : findProcess(await loadProcessCatalog(), processId, "--process");
    const hostId = stringOption(args, "host") ?? "air";
    const host = await phase(hostId, "--host", frequencyHz, io);
    let inclusion: CellPhase;
    if (family.resonant) {
      const metalId = stringOption(args, "metal") ?? stringOption(args, "inclusion") ?? "copper";
      const where = stringOption(args, "metal") !== undefined ? "--metal" : "--inclusion";
      inclusion = await phase(metalId, where, frequencyHz, io);
      if (inclusion.class !== "metal") throw new InputError({ where, message: `'${metalId}' is a ${inclusion.class}; expected a metal` });
    } else inclusion = await phase(stringOption(args, "inclusion")!, "--inclusion", frequencyHz, io);

    let layer: LayerReport | null = null;
    const axisUsed = (stringOption(args, "axis") ?? family.defaultAxis) === "parallel" ? "parallel" : "perpendicular";
    if (layerGiven.length === LAYER_FLAGS.length) {
      const coreId = stringOption(args, "layer-core")!;
      const thicknessM = (await positiveLength(args, "layer-thickness"))!;
      const core = await phase(coreId, "--layer-core", frequencyHz, io);
      const below = await phase(stringOption(args, "layer-below")!, "--layer-below", frequencyHz, io);
      const above = await phase(stringOption(args, "layer-above")!, "--layer-above", frequencyHz, io);
      if (core.id !== host.id && core.id !== inclusion.id) throw new InputError({ where: "--layer-core", message: `the film '${core.id}' must be the host or the inclusion` });
      layer = layerReport({
        core: { id: core.id, eps: core.eps, isMetal: core.class === "metal" },
        thicknessM,
        below: { id: below.id, eps: below.eps, isMetal: below.class === "metal" },
        above: { id: above.id, eps: above.eps, isMetal: above.class === "metal" },
        frequencyHz,
        polarization: axisUsed === "parallel" ? "Ez" : "Hz",
      });
      for (const w of layer.warnings) io.stderr(`warning: ${w}\n`);
      if (host.id === core.id) host.eps = layer.coreEps;
      else inclusion.eps = layer.coreEps;
    }
    const request: CellDesignRequest = {
      familyId: family.id, lattice, pitchM, frequencyHz, host, inclusion, target, tolerance,
      ...(aspect !== undefined ? { aspect } : {}),
      ...(fill !== undefined ? { fill } : {}),
      ...(process ? { process } : {}),
      ...(heightM !== undefined ? { heightM } : {}),
      ...(family.id === "split-ring" ? { splitRing } : {}),
    };
    const design = designCell(request);
    const band = design.homogenization.status !== "ok" ? bandFor(design, host, inclusion, axisUsed) : null;
    if (band && !band.bandIndex.inBand) design.notes.push("the design frequency lies above the lowest band's edge: the cell is not homogenizable");
    else if (band && band.spatialDispersion > tolerance) design.notes.push(`spatial dispersion: the band index departs ${Number((100 * band.spatialDispersion).toPrecision(2))} % from the long-wavelength value (tolerance ${tolerance * 100} %)`);
    const wire = design.resonance?.kind === "wire-medium" ? design.resonance.plasma : null;
    if (flagOption(args, "json")) {
      io.stdout(`${json({
        command: "cell", ...design,
        host: { id: host.id, class: host.class, eps: host.eps }, inclusion: { id: inclusion.id, class: inclusion.class, eps: inclusion.eps }, process: process?.id ?? null,
        ...(band ? band : {}),
        ...(layer ? { layer: { modeIndex: layer.modeIndex, guidedModes: layer.guidedModes, kind: layer.kind, polarization: layer.polarization, coreEps: layer.coreEps, warnings: layer.warnings } } : {}),
        ...(wire ? { plasmaFrequencyHz: wire.latticeHz, plasmaModel: wire.used, thinWireForms: { thinWireHz: wire.thinWireHz, correctedHz: wire.correctedHz, thickWireHz: wire.thickWireHz } } : {}),
      })}\n`);
    } else {
      const lines = formatCellDesign(design);
      if (layer) lines.push(`layer             ${layer.kind === "slab" ? `${layer.polarization} slab mode index ${layer.modeIndex === null ? "none (bulk used)" : Number(layer.modeIndex.toPrecision(5))}, ${layer.guidedModes} guided` : `parallel plates, ${layer.guidedModes} mode(s)`}`);
      if (band) {
        const list = (x: number[]) => x.map((v) => (Number.isFinite(v) ? Number(v.toPrecision(4)) : "above the band edge")).join(" / ");
        const b = band.bandIndex;
        const sd = b.inBand ? `spatial dispersion ${Number((100 * band.spatialDispersion).toPrecision(2))} %` : "above the band edge: not homogenizable";
        lines.push(lattice === "rect"
          ? `band index        ${list(b.directions)} (${b.names.join(", ")}), long-wavelength ${list(b.quasiStaticByDirection)}, ${sd}`
          : `band index        ${list(b.directions)} (principal directions), long-wavelength ${Number(b.quasiStatic.toPrecision(4))}, ${sd}`);
      }
      io.stdout(`${lines.join("\n")}\n`);
    }
    if (!design.valid) for (const r of design.reasons) io.stderr(`not buildable: ${r}\n`);
    return design.valid ? EXIT_OK : EXIT_NOT_BUILDABLE;
  },
};
