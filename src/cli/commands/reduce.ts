/**
 * `cellwright reduce <design.json> [--polarization Ez|Hz] [--scheme NAME] [--background-index N]
 * [--at X,Y] [--out reduced.csv] [--json]`: compare the ways of simplifying a design's tensors for
 * one polarization, or give one scheme's per-cell values.
 */
import { isVolumeDevice } from "../../field/isVolumeDevice.js";
import { resolve } from "node:path";
import { InputError } from "../../core/errors.js";
import type { TensorField } from "../../field/tensorField.js";
import type { Design } from "../../io/design/designSchema.js";
import { loadDesign } from "../../io/design/loadDesign.js";
import { loadFieldForDesign } from "../../io/fieldCsv.js";
import { parseQuantity } from "../../io/quantity.js";
import { writeReducedCsv } from "../../io/reducedCsv.js";
import { formatNumber as f } from "../../reduce/formatNumber.js";
import { POLARIZATIONS, type Polarization } from "../../reduce/polarization.js";
import { reducePoint } from "../../reduce/reducePoint.js";
import { reduceWithSettings, reductionSettings, type ReduceOptions } from "../../reduce/reduceField.js";
import { compareSchemes, schemeSummary, type NamedCell, type SchemeSummary } from "../../reduce/schemeMetrics.js";
import { schemeTable, wrap } from "../../reduce/schemeTable.js";
import { REDUCTION_SCHEMES, schemesFor } from "../../reduce/schemes/registry.js";
import { flagOption, stringOption } from "../args.js";
import type { CliIo } from "../cliIo.js";
import type { Command, ParsedArgs } from "../command.js";
import { EXIT_OK } from "../run.js";
import { significantAtLeast } from "../../core/formatQuantity.js";
import { givenBackgroundIndex } from "../../plan/resolveSettings.js";

/** JSON-safe number: non-finite values become null. */
const jn = (v: number): number | null => (Number.isFinite(v) ? v : null);
const jr = (r: [number, number]): [number | null, number | null] => [jn(r[0]), jn(r[1])];

function positiveNumber(text: string, where: string, what: string): number {
  const v = Number(text.trim());
  if (!(v > 0 && Number.isFinite(v))) throw new InputError({ where, message: `expected ${what} (a number > 0), got '${text}'` });
  return v;
}

/** "45 mm,20 mm" → [x, y(, z)] in metres. */
async function parsePoint(text: string): Promise<number[]> {
  const parts = text.split(",");
  if (parts.length < 2 || parts.length > 3) {
    throw new InputError({ where: "--at", message: `expected X,Y such as "45 mm,20 mm", got '${text}'` });
  }
  return Promise.all(parts.map((p, k) => parseQuantity(p.trim(), "length", `--at (${"xyz"[k]})`)));
}

/** A design is three-dimensional when its grid is, or its transform is (a z = 0 slice of a sphere is not z-invariant). */

/** Lowest ε' among the design's chosen materials at its frequency (ε' > 0), or null. */
async function materialsFloor(design: Design): Promise<{ eps: number; id: string } | null> {
  const ids = design.realization?.materials;
  if (!ids || ids.length === 0) return null;
  const { loadMaterialCatalog, findMaterial } = await import("../../io/materialCatalog.js");
  const { evaluateMaterial } = await import("../../media/material.js");
  const catalog = await loadMaterialCatalog();
  let best: { eps: number; id: string } | null = null;
  ids.forEach((id, k) => {
    const m = findMaterial(catalog, id, `${design.sourcePath}: $.realization.materials[${k}]`);
    const e = evaluateMaterial(m, design.frequencyHz).eps.re;
    if (e > 0 && (!best || e < best.eps)) best = { eps: e, id };
  });
  return best;
}

function summaryJson(s: SchemeSummary) {
  const cell = (c: NamedCell) => ({ cell: c.cell, i: c.i, j: c.j, k: c.k, x_m: c.xM, y_m: c.yM, z_m: c.zM });
  return {
    scheme: s.scheme,
    cellsEpsBelowOne: s.cellsEpsBelowOne,
    fractionEpsBelowOne: s.fractionEpsBelowOne,
    cellsEpsBelowFloor: s.cellsEpsBelowFloor,
    cellsMagnetic: s.cellsMagnetic,
    fractionMagnetic: s.fractionMagnetic,
    maxAnisotropy: jn(s.maxAnisotropy),
    maxDroppedAnisotropy: jn(s.maxDroppedAnisotropy),
    boundaryReflection: jn(s.boundaryReflection),
    boundaryReflectionMean: jn(s.boundaryReflectionMean),
    boundaryImpedance: { min: jn(s.boundaryImpedance.min), max: jn(s.boundaryImpedance.max), mean: jn(s.boundaryImpedance.mean) },
    boundarySource: s.boundary.source,
    boundarySamples: s.boundary.samples,
    ranges: Object.fromEntries(Object.entries(s.ranges).map(([k, r]) => [k, jr(r)])),
    epsRange: jr(s.epsRange),
    muRange: jr(s.muRange),
    scaleRange: jr(s.scaleRange),
    capped: s.capped,
    cappedCells: s.cappedCells.map(cell),
    undefinedCells: s.undefinedCells,
    undefinedList: s.undefinedList.map(cell),
    outOfPlaneCells: s.outOfPlaneCells,
    minBackgroundIndex: jn(s.minBackgroundIndex),
    matchScale: s.matchScale,
  };
}

function schemeReport(design: Design, s: SchemeSummary, outPath?: string): string {
  const where = (c: NamedCell) => `(${f(c.xM * 1000)}, ${f(c.yM * 1000)}) mm`;
  const pct = (x: number) => (x === 0 ? "0%" : x < 0.01 ? "<1%" : `${Math.round(x * 100)}%`);
  const lines = [
    design.name,
    `  ${s.polarization}, scheme ${s.scheme}: ${REDUCTION_SCHEMES[s.scheme].summary}`,
    `  ${s.cells} cells, background index ${f(s.backgroundIndex)}${s.scheme === "matched" ? `, matching constant ${f(s.matchScale)}` : ""}`,
    "",
    `  ${"component".padEnd(12)}${"min".padStart(12)}${"max".padStart(12)}`,
    ...Object.entries(s.ranges).map(([k, r]) => `  ${k.padEnd(12)}${f(r[0]).padStart(12)}${f(r[1]).padStart(12)}`),
    "",
    `  cells needing ε < 1: ${s.cellsEpsBelowOne} (${pct(s.fractionEpsBelowOne)})`,
    `  cells needing μ ≠ 1: ${s.cellsMagnetic} (${pct(s.fractionMagnetic)}; |μ − 1| > ${f(s.muTolerance)})`,
    `  largest anisotropy of the kept in-plane tensor: ${f(s.maxAnisotropy)}`,
  ];
  if (s.scheme === "isotropic") lines.push(`  largest anisotropy dropped (σ1/σ2): ${f(s.maxDroppedAnisotropy)}`);
  const b = s.boundary;
  if (b.source === "none") lines.push("  outer edge: not found; reflection not estimated");
  else {
    lines.push(...wrap(`  outer edge: Z/Z_b ${f(b.impedanceMin)}…${f(b.impedanceMax)}, power reflection worst ${f(b.reflectionMax, 2)}, mean ${f(b.reflectionMean, 2)} (${b.source === "boundary-samples" ? `${b.samples} exact boundary points` : `${b.samples} edge cells, estimated`})`, 80));
  }
  lines.push(`  smallest background index with no ε below ${f(s.epsFloor)}: ${f(significantAtLeast(s.minBackgroundIndex, 3))}`);
  lines.push(`  capped cells: ${s.capped}${s.capped ? `, e.g. ${s.cappedCells.slice(0, 3).map(where).join(", ")}` : ""}`);
  lines.push(`  cells with no reduced value: ${s.undefinedCells}${s.undefinedCells ? `, e.g. ${s.undefinedList.slice(0, 3).map(where).join(", ")}` : ""}`);
  if (s.outOfPlaneCells) lines.push(`  cells coupling the plane to z: ${s.outOfPlaneCells} (the polarizations do not separate there)`);
  if (outPath) lines.push(`  wrote ${outPath}`);
  return lines.join("\n") + "\n";
}

export const command: Command = {
  name: "reduce",
  summary: "compare tensor simplifications per polarization, or apply one per cell",
  usage: "reduce <design.json> [--scheme NAME] [options]",
  details: [
    "Ez: E along z; the device acts through eps_zz and the in-plane mu.",
    "Hz: H along z; the device acts through mu_zz and the in-plane eps.",
    "Without --scheme: one row per scheme valid for the polarization, with its costs.",
    "With --scheme: that scheme's summary, and its per-cell values with --out.",
    "",
    "schemes:",
    ...Object.values(REDUCTION_SCHEMES).map((s) => `  ${s.name.padEnd(14)}${s.summary}`),
    "unit-mu is for Ez only, non-magnetic for Hz only; a 3D design takes full only.",
  ].join("\n"),
  options: [
    { name: "polarization", type: "string", valueName: "Ez|Hz", description: "field along z (default: the design's, else Ez)" },
    { name: "scheme", type: "string", valueName: "NAME", description: "one scheme instead of the comparison table" },
    { name: "unit-axis", type: "string", valueName: "larger|smaller", description: "unit-mu: principal mu set to 1" },
    { name: "background-index", type: "string", valueName: "N", description: "embed the device in a dielectric of index N" },
    { name: "eps-floor", type: "string", valueName: "E", description: "lowest buildable eps, for n_b min (default 1)" },
    { name: "mu-tolerance", type: "string", valueName: "T", description: "|mu - 1| above T is magnetic (default 0.001)" },
    { name: "at", type: "string", valueName: "X,Y", description: 'reduced components at one point, e.g. "30 mm,0 mm"' },
    { name: "out", type: "string", valueName: "FILE", description: "write the scheme's per-cell CSV (atomically)" },
    { name: "json", type: "boolean", description: "print one JSON object on stdout" },
  ],
  async run(args: ParsedArgs, io: CliIo): Promise<number> {
    const designPath = args.positionals[0];
    if (!designPath) throw new InputError({ where: "reduce", message: "expected a design file: cellwright reduce <design.json>" });
    const json = flagOption(args, "json");
    const out = stringOption(args, "out");
    const at = stringOption(args, "at");
    const polFlag = stringOption(args, "polarization");
    const schemeFlag = stringOption(args, "scheme");
    const unitAxisFlag = stringOption(args, "unit-axis");
    const nbFlag = stringOption(args, "background-index");
    const floorFlag = stringOption(args, "eps-floor");
    const tolFlag = stringOption(args, "mu-tolerance");
    // check every flag before any work
    if (polFlag !== undefined && !(POLARIZATIONS as readonly string[]).includes(polFlag)) {
      throw new InputError({ where: "--polarization", message: `expected Ez or Hz (or 3D for a 3D design), got '${polFlag}'` });
    }
    if (unitAxisFlag !== undefined && unitAxisFlag !== "larger" && unitAxisFlag !== "smaller") {
      throw new InputError({ where: "--unit-axis", message: `expected larger or smaller, got '${unitAxisFlag}'` });
    }
    const nbFromFlag = nbFlag !== undefined ? positiveNumber(nbFlag, "--background-index", "a refractive index") : undefined;
    const floorFromFlag = floorFlag !== undefined ? positiveNumber(floorFlag, "--eps-floor", "a permittivity") : undefined;
    let tolFromFlag: number | undefined;
    if (tolFlag !== undefined) {
      tolFromFlag = Number(tolFlag.trim());
      if (!(tolFromFlag >= 0 && Number.isFinite(tolFromFlag))) throw new InputError({ where: "--mu-tolerance", message: `expected a number ≥ 0, got '${tolFlag}'` });
    }
    const point = at !== undefined ? await parsePoint(at) : undefined;

    const design = await loadDesign(designPath, io.cwd);
    // the index every command reduces with: the option's, else the design's, else none (its own background)
    const nb = givenBackgroundIndex(design, { backgroundIndex: nbFromFlag });
    // a background material is checked as plan and verify check it, against the index this
    // reduction uses, before the field is computed (catalog and check loaded only when named)
    if (design.reduction?.backgroundMaterial !== undefined) {
      const [{ loadMaterialCatalog }, { checkBackgroundMaterialBeforeReduction }] = await Promise.all([
        import("../../io/materialCatalog.js"), import("../../verify/sweep/backgroundAtFrequency.js"),
      ]);
      checkBackgroundMaterialBeforeReduction(design, nbFromFlag !== undefined, await loadMaterialCatalog(), nb);
    }
    const field = await loadFieldForDesign(design, "reduce");
    const file = design.sourcePath;
    const spec = design.reduction;
    const three = isVolumeDevice(field);

    let polarization: Polarization;
    let wherePol: string;
    if (polFlag !== undefined) { polarization = polFlag as Polarization; wherePol = "--polarization"; }
    else if (design.polarization !== undefined) { polarization = design.polarization; wherePol = `${file}: $.polarization`; }
    else if (three) { polarization = "3D"; wherePol = "polarization"; }
    else {
      polarization = "Ez"; wherePol = "polarization";
      if (!json) io.stderr("note: the design names no polarization; showing Ez (use --polarization Hz for the other)\n");
    }
    if (three && polarization !== "3D") {
      throw new InputError({ where: wherePol, message: `a 3D design has no polarization reduction (got '${polarization}'); only scheme 'full' applies` });
    }
    if (!three && polarization === "3D") {
      throw new InputError({ where: wherePol, message: "a 2D design is reduced for Ez or Hz" });
    }

    const epsFloorDesign = spec?.epsFloor;
    let epsFloor = floorFromFlag ?? epsFloorDesign;
    let floorNote = floorFromFlag !== undefined ? "--eps-floor" : epsFloorDesign !== undefined ? "reduction.epsFloor" : "";
    if (epsFloor === undefined) {
      const m = await materialsFloor(design);
      if (m) { epsFloor = m.eps; floorNote = `lowest ε' among the chosen materials: ${m.id}`; }
    }
    epsFloor ??= 1;

    const base: Omit<ReduceOptions, "scheme"> = {
      polarization,
      unitAxis: (unitAxisFlag as "larger" | "smaller" | undefined) ?? spec?.unitAxis,
      backgroundIndex: nb,
      muTolerance: tolFromFlag ?? spec?.muTolerance,
      where: {
        polarization: wherePol,
        scheme: schemeFlag !== undefined ? "--scheme" : `${file}: $.reduction.scheme`,
        backgroundIndex: nbFromFlag !== undefined ? "--background-index" : `${file}: $.reduction.backgroundIndex`,
      },
    };
    // The design's own scheme counts only where it serves the polarization in use: with
    // --polarization switching to the other one, the comparison table simply has no starred row.
    const designSchemeFits = spec?.scheme !== undefined && schemesFor(polarization).some((x) => x.name === spec.scheme);
    const designScheme = polFlag !== undefined && !designSchemeFits ? undefined : spec?.scheme;
    const single = schemeFlag ?? (out !== undefined || point !== undefined ? designScheme : undefined);

    if (point !== undefined) {
      const scheme = single ?? "full";
      if (single === undefined && !json) io.stderr("note: no scheme given; showing 'full' (use --scheme NAME)\n");
      const settings = reductionSettings(field, { ...base, scheme });
      const [x, y, z = 0] = point;
      const p = reducePoint(field, settings, x, y, z);
      if (out) await writeReducedCsv(resolve(io.cwd, out), reduceWithSettings(field, settings), field.grid);
      if (json) {
        io.stdout(JSON.stringify({
          scheme: p.scheme, polarization: p.polarization, x_m: p.xM, y_m: p.yM, ...(field.grid.dimension === 3 ? { z_m: p.zM } : {}),
          components: Object.fromEntries(Object.entries(p.components).map(([k, v]) => [k, jn(v)])),
          principal: p.principal.map(jn), anisotropy: jn(p.anisotropy), droppedAnisotropy: jn(p.droppedAnisotropy),
          scale: jn(p.scale), flags: p.flags, source: p.source,
        }) + "\n");
      } else {
        const lines = [
          `${design.name}: ${p.polarization}, scheme ${p.scheme}, at (${f(x * 1000)} mm, ${f(y * 1000)} mm)${p.source === "cell" ? " — nearest cell's values" : ""}`,
          ...Object.entries(p.components).map(([k, v]) => `  ${k.padEnd(10)}${f(v, 6).padStart(14)}`),
          `  principal ${p.principal.map((v) => f(v, 6)).join(", ")}; anisotropy ${f(p.anisotropy)}; scale α ${f(p.scale, 6)}`,
        ];
        if (p.scheme === "isotropic") lines.push(`  anisotropy dropped (σ1/σ2): ${f(p.droppedAnisotropy)}`);
        if (p.flags.length) lines.push(`  flags: ${p.flags.join(";")}`);
        if (out) lines.push(`  wrote ${out}`);
        io.stdout(lines.join("\n") + "\n");
      }
      return EXIT_OK;
    }

    if (single !== undefined) {
      const settings = reductionSettings(field, { ...base, scheme: single });
      const reduced = reduceWithSettings(field, settings);
      const s = schemeSummary(reduced, field, { epsFloor });
      if (out) await writeReducedCsv(resolve(io.cwd, out), reduced, field.grid);
      if (json) {
        io.stdout(JSON.stringify({
          polarization, cells: s.cells, backgroundIndex: s.backgroundIndex, epsFloor, chosen: designScheme ?? null,
          scheme: s.scheme, schemes: [summaryJson(s)], minBackgroundIndex: jn(s.minBackgroundIndex), minBackgroundIndexScheme: s.scheme,
          ...(out ? { out } : {}),
        }) + "\n");
      } else {
        io.stdout(schemeReport(design, s, out));
        if (floorNote) io.stdout(`  (ε floor ${f(epsFloor)}: ${floorNote})\n`);
      }
      return EXIT_OK;
    }

    // the comparison table
    if (designScheme !== undefined && !schemesFor(polarization).some((s) => s.name === designScheme)) {
      // the design's own choice must fit its polarization; say which fit
      reductionSettings(field, { ...base, scheme: designScheme });
    }
    const summaries = compareSchemes(field, polarization, { ...base, epsFloor });
    let best: SchemeSummary | null = null;
    for (const s of summaries) if (Number.isFinite(s.minBackgroundIndex) && (!best || s.minBackgroundIndex < best.minBackgroundIndex)) best = s;
    if (json) {
      io.stdout(JSON.stringify({
        polarization, cells: field.grid.count, backgroundIndex: summaries[0]?.backgroundIndex ?? null, epsFloor,
        chosen: designScheme ?? null,
        schemes: summaries.map(summaryJson),
        skipped: summaries.skipped ?? [],
        minBackgroundIndex: best ? best.minBackgroundIndex : null,
        minBackgroundIndexScheme: best ? best.scheme : null,
      }) + "\n");
      return EXIT_OK;
    }
    const table = schemeTable(summaries, { polarization, chosen: designScheme, skipped: summaries.skipped });
    const lines = [design.name, ...table.lines];
    if (best) {
      lines.push("", ...wrap(`smallest background index with no ε below ${f(epsFloor)}${floorNote ? ` (${floorNote})` : ""}: ${f(significantAtLeast(best.minBackgroundIndex, 3))}, with ${best.scheme}`, 80));
    }
    if (polarization !== "3D") {
      const other = polarization === "Ez" ? "Hz" : "Ez";
      lines.push(`for ${other === "Hz" ? "H" : "E"} along z: --polarization ${other}`);
    }
    io.stdout(lines.join("\n") + "\n");
    return EXIT_OK;
  },
};
