/**
 * `cellwright verify <design.json>`: the 2D full-wave check — the ideal (scheme `full`), reduced
 * (chosen scheme) and realized (the plan's achieved per-cell values) material maps simulated under a
 * plane wave along +x with the FDFD solver of src/verify; prints scattering widths and field errors,
 * and with --out writes an SVG of |field| for the cases.
 */
import { isVolumeDevice } from "../../field/isVolumeDevice.js";
import { resolve } from "node:path";
import { InputError } from "../../core/errors.js";
import { writeFileAtomic } from "../../io/atomicWrite.js";
import { loadDesign } from "../../io/design/loadDesign.js";
import { loadFieldForDesign } from "../../io/fieldCsv.js";
import { loadMaterialCatalog } from "../../io/materialCatalog.js";
import { loadProcessCatalog } from "../../io/processCatalog.js";
import { parseQuantity } from "../../io/quantity.js";
import { planFromField } from "../../plan/runPlan.js";
import { reduceField } from "../../reduce/reduceField.js";
import type { HiddenDisk } from "../../verify/deviceScene.js";
import { fieldSvg } from "../../verify/fieldSvg.js";
import { formatFrequency, formatLength } from "../../verify/formatQuantity.js";
import { mapFromPlan, mapFromReduced } from "../../verify/materialMap.js";
import { DEFAULT_RESOLUTION, verifyDevice, type VerifyResult } from "../../verify/verifyDevice.js";
import { flagOption, stringOption } from "../args.js";
import type { CliIo } from "../cliIo.js";
import type { Command, ParsedArgs } from "../command.js";
import { EXIT_OK } from "../run.js";
import { optionOverrides } from "./plan.js";

export const VERIFY_SVG = "verify-fields.svg";

const jn = (v: number | null): number | null => (v !== null && Number.isFinite(v) ? v : null);

/** The machine-readable summary printed by --json. */
export function verifySummary(design: string, scheme: string, r: VerifyResult, outputs: string[]): Record<string, unknown> {
  return {
    design,
    polarization: r.polarization,
    scheme,
    frequencyHz: r.frequencyHz,
    grid: { nx: r.grid.nx, ny: r.grid.ny, stepM: r.grid.h, pmlNodes: r.grid.pml },
    resolution: r.resolution,
    densestIndex: r.densestIndex,
    backgroundIndex: r.backgroundIndex,
    marginM: r.marginM,
    deviceWidthM: r.deviceWidthM,
    observationNodes: r.observationNodes,
    cases: r.cases.map((c) => ({
      name: c.name,
      scatteringWidthM: jn(c.scatteringWidthM),
      scatteringPerWidth: jn(c.scatteringPerWidth),
      vsBare: jn(c.vsBare),
      absorptionWidthM: jn(c.absorptionWidthM),
      fieldErrorVsIdeal: jn(c.fieldErrorVsIdeal),
      scatteredFieldRelative: jn(c.scatteredFieldRelative),
      missingCells: c.missingCells,
    })),
    notes: r.notes,
    outputs,
  };
}

/** The human table. */
export function verifyTable(design: string, scheme: string, r: VerifyResult): string {
  const f = (v: number | null, d = 3): string => (v === null || !Number.isFinite(v) ? "—" : Number(v.toPrecision(d)).toString());
  const pct = (v: number | null): string => (v === null || !Number.isFinite(v) ? "—" : `${Number((v * 100).toPrecision(3))} %`);
  const hasBare = r.cases.some((c) => c.name === "bare");
  const head = ["case", "σ/width", ...(hasBare ? ["σ/σ_bare"] : []), "|u_s|/|u_inc|", "field vs ideal"];
  const rows = r.cases.map((c) => [c.name, f(c.scatteringPerWidth), ...(hasBare ? [f(c.vsBare)] : []), pct(c.scatteredFieldRelative), pct(c.fieldErrorVsIdeal)]);
  const widths = head.map((h, k) => Math.max(h.length, ...rows.map((row) => row[k].length)));
  const line = (cells: string[]): string => "  " + cells.map((c, k) => (k === 0 ? c.padEnd(widths[k]) : c.padStart(widths[k]))).join("  ");
  return [
    design,
    `  ${r.polarization}, scheme ${scheme}, ${formatFrequency(r.frequencyHz)}; grid ${r.grid.nx} × ${r.grid.ny} nodes, step ${formatLength(r.grid.h)} (${r.resolution} points per wavelength at index ${Number(r.densestIndex.toPrecision(3))})`,
    line(head),
    ...rows.map(line),
    `  σ: scattering width; width = device extent across the beam (${formatLength(r.deviceWidthM)})`,
    ...r.notes.map((n) => `  note: ${n}`),
  ].join("\n") + "\n";
}

export const command: Command = {
  name: "verify",
  summary: "2D full-wave check: ideal vs reduced vs realized material maps under a plane wave",
  usage: "verify <design.json> [--polarization Ez|Hz] [--scheme NAME] [--resolution N] [--margin L] [--json] [--out DIR]",
  details: [
    "Simulates the device three times with a frequency-domain finite-difference solver (plane wave",
    "along +x, PML on all sides): ideal (scheme full), reduced (the chosen scheme) and realized (the",
    "plan's achieved per-cell values). A cloak's hidden region is a perfect conductor, and the bare",
    "conductor is simulated too. Prints scattering widths and field differences outside the device.",
  ].join("\n"),
  options: [
    { name: "polarization", type: "string", valueName: "Ez|Hz", description: "polarization the device serves (overrides the design)" },
    { name: "scheme", type: "string", valueName: "NAME", description: "reduction scheme: full, unit-mu, non-magnetic, isotropic, matched" },
    { name: "resolution", type: "string", valueName: "N", description: `grid points per wavelength in the densest material (default ${DEFAULT_RESOLUTION}, 10–60)` },
    { name: "margin", type: "string", valueName: "L", description: "free space around the device, e.g. '20 mm' (default half a wavelength)" },
    { name: "json", type: "boolean", description: "print the summary as one JSON object on stdout" },
    { name: "out", type: "string", valueName: "DIR", description: `write ${VERIFY_SVG} (|field| of each case) into DIR` },
  ],
  async run(args: ParsedArgs, io: CliIo): Promise<number> {
    const designPath = args.positionals[0];
    if (designPath === undefined) throw new InputError({ where: "verify", message: "expected a design file" });
    const json = flagOption(args, "json");
    const overrides = optionOverrides(args);
    const resText = stringOption(args, "resolution");
    const resolution = resText === undefined ? undefined : Number(resText);
    if (resolution !== undefined && !Number.isFinite(resolution)) throw new InputError({ where: "--resolution", message: `expected a number of points per wavelength, got '${resText}'` });
    const marginText = stringOption(args, "margin");
    const marginM = marginText === undefined ? undefined : await parseQuantity(marginText, "length", "--margin");
    const design = await loadDesign(designPath, io.cwd);
    const field = await loadFieldForDesign(design);
    const is3d = isVolumeDevice(field);
    if (is3d) throw new InputError({ where: `${design.sourcePath}: $.transform`, message: "the full-wave check is two-dimensional (devices invariant along z); a 3D design cannot be verified" });
    const progress = (text: string): void => io.stderr(`… ${text}\n`);
    progress("plan (for the realized map)");
    const [materials, processes] = await Promise.all([loadMaterialCatalog(), loadProcessCatalog()]);
    const plan = planFromField(design, field, { materials, processes }, overrides);
    const s = plan.settings;
    const backgroundIndex = s.backgroundIndex === 1 && !design.reduction?.backgroundIndex ? undefined : s.backgroundIndex;
    const ideal = reduceField(field, { polarization: s.polarization, scheme: "full", backgroundIndex });
    const reduced = reduceField(field, { polarization: s.polarization, scheme: s.scheme, unitAxis: s.unitAxis, backgroundIndex });
    const n = reduced.settings.backgroundIndex, z = reduced.settings.backgroundImpedance;
    const background = { eps: n / z, mu: n * z };
    const bg = s.polarization === "Ez" ? { b: background.eps, t: background.mu } : { b: background.mu, t: background.eps };
    let hidden: HiddenDisk | null = null;
    if (design.transform.kind === "radial-cloak") hidden = { centerM: design.transform.center ?? [0, 0], radiusM: design.transform.innerRadiusM };
    let last = "";
    const result = verifyDevice({
      grid: field.grid,
      polarization: s.polarization,
      background,
      frequencyHz: design.frequencyHz,
      cases: [
        { name: "ideal", map: mapFromReduced(ideal, bg) },
        { name: "reduced", map: mapFromReduced(reduced, bg) },
        { name: "realized", map: mapFromPlan(plan, bg) },
      ],
      hidden,
      resolution,
      marginM,
      onProgress: (step, fraction) => {
        const tag = `${step} ${Math.floor(fraction * 10) * 10} %`;
        if (tag !== last) { last = tag; progress(step === "metrics" ? "metrics" : `solve ${tag}`); }
      },
    });
    for (const note of result.notes) io.stderr(`note: ${note}\n`);
    const outputs: string[] = [];
    const outDir = stringOption(args, "out");
    if (outDir !== undefined) {
      const path = resolve(io.cwd, outDir, VERIFY_SVG);
      const svg = fieldSvg(result.grid, result.cases.map((c) => ({ title: c.name, magnitude: c.magnitude })), result.deviceMask, {
        title: `${design.name} — |${s.polarization === "Ez" ? "E_z" : "H_z"}|, ${s.polarization}, scheme ${s.scheme}`,
      });
      await writeFileAtomic(path, svg);
      outputs.push(path);
    }
    if (json) io.stdout(`${JSON.stringify(verifySummary(design.name, s.scheme, result, outputs))}\n`);
    else io.stdout(verifyTable(design.name, s.scheme, result) + (outputs.length ? `outputs:\n${outputs.map((p) => `  ${p}`).join("\n")}\n` : ""));
    return EXIT_OK;
  },
};
