/**
 * `cellwright material`: list the material catalog, show one row, or evaluate a material at a
 * frequency (ε, tan δ, n, and whether the frequency is inside the model's valid range).
 */
import { formatComplex } from "../../core/complex.js";
import { InputError } from "../../core/errors.js";
import { findMaterial, loadMaterialCatalog } from "../../io/materialCatalog.js";
import { parseQuantity } from "../../io/quantity.js";
import { evaluateMaterial, MATERIAL_CLASSES, type Material } from "../../media/material.js";
import { SPEED_OF_LIGHT } from "../../media/dispersion/dispersionModel.js";
import { flagOption, stringOption } from "../args.js";
import type { CliIo } from "../cliIo.js";
import type { Command, ParsedArgs } from "../command.js";
import { EXIT_OK } from "../run.js";

function formatHz(hz: number): string {
  const units: [number, string][] = [[1e15, "PHz"], [1e12, "THz"], [1e9, "GHz"], [1e6, "MHz"], [1e3, "kHz"]];
  for (const [s, u] of units) if (hz >= s) return `${Number((hz / s).toPrecision(4))} ${u}`;
  return `${Number(hz.toPrecision(4))} Hz`;
}

const rowJson = (m: Material) => ({
  id: m.id,
  name: m.name,
  class: m.class,
  model: m.model,
  params: m.params,
  validMinHz: m.validMinHz,
  validMaxHz: m.validMaxHz,
  ...(m.mu ? { mu: m.mu } : {}),
  ...(m.conductivitySPerM !== undefined ? { conductivitySPerM: m.conductivitySPerM } : {}),
  source: m.source,
});

/** --frequency F or --wavelength L (vacuum), as Hz; undefined when neither is given. */
export async function frequencyFromOptions(args: ParsedArgs): Promise<number | undefined> {
  const f = stringOption(args, "frequency");
  const l = stringOption(args, "wavelength");
  if (f !== undefined && l !== undefined) throw new InputError({ where: "--wavelength", message: "give either --frequency or --wavelength, not both" });
  if (f !== undefined) {
    const hz = await parseQuantity(f, "frequency", "--frequency");
    if (!(hz > 0)) throw new InputError({ where: "--frequency", message: `expected a frequency > 0, got '${f}'` });
    if (!Number.isFinite(SPEED_OF_LIGHT / hz)) throw new InputError({ where: "--frequency", message: `a frequency of ${hz} Hz is a wavelength beyond the number range; expected a physical frequency such as '10 GHz'` });
    return hz;
  }
  if (l !== undefined) {
    const m = await parseQuantity(l, "length", "--wavelength");
    if (!(m > 0)) throw new InputError({ where: "--wavelength", message: `expected a wavelength > 0, got '${l}'` });
    const hz = SPEED_OF_LIGHT / m;
    if (!Number.isFinite(hz)) throw new InputError({ where: "--wavelength", message: `a wavelength of ${m} m is a frequency beyond the number range; expected a physical wavelength such as '1550 nm'` });
    return hz;
  }
  return undefined;
}

function listMaterials(catalog: readonly Material[], args: ParsedArgs, io: CliIo): number {
  const cls = stringOption(args, "class");
  if (cls !== undefined && !(MATERIAL_CLASSES as readonly string[]).includes(cls)) {
    throw new InputError({ where: "--class", message: `expected one of ${MATERIAL_CLASSES.join(", ")}, got '${cls}'` });
  }
  const rows = catalog.filter((m) => cls === undefined || m.class === cls);
  if (flagOption(args, "json")) {
    io.stdout(`${JSON.stringify({ materials: rows.map(rowJson) })}\n`);
    return EXIT_OK;
  }
  const table = rows.map((m) => [m.id, m.class, m.model, `${formatHz(m.validMinHz)} – ${formatHz(m.validMaxHz)}`, m.name]);
  const head = ["id", "class", "model", "valid range", "name"];
  const widths = head.map((h, k) => Math.max(h.length, ...table.map((r) => r[k].length)));
  const line = (r: string[]) => r.map((c, k) => (k === r.length - 1 ? c : c.padEnd(widths[k]))).join("  ");
  io.stdout([line(head), ...table.map(line)].join("\n") + "\n");
  io.stdout(`${rows.length} materials; 'cellwright material ID' shows a row and its source\n`);
  return EXIT_OK;
}

function showRow(m: Material, json: boolean, io: CliIo): number {
  if (json) {
    io.stdout(`${JSON.stringify(rowJson(m))}\n`);
    return EXIT_OK;
  }
  const params = Object.entries(m.params).map(([k, v]) => `${k}=${v}`).join("; ");
  io.stdout(
    [
      `${m.id}: ${m.name} (${m.class})`,
      `  model        ${m.model}: ${params}`,
      `  valid        ${formatHz(m.validMinHz)} – ${formatHz(m.validMaxHz)}`,
      ...(m.conductivitySPerM !== undefined ? [`  DC σ         ${m.conductivitySPerM} S/m`] : []),
      `  source       ${m.source}`,
      "",
    ].join("\n"),
  );
  return EXIT_OK;
}

export const command: Command = {
  name: "material",
  summary: "list the material catalog or evaluate a material's permittivity at a frequency",
  usage: "material (--list | <id> [--frequency F | --wavelength L]) [--class CLASS] [--json]",
  details: [
    "With --list, prints the catalog (optionally one class). With an id alone, prints the row:",
    "dispersion model, parameters, valid range and source. With --frequency (or a vacuum",
    "--wavelength), evaluates ε = ε' + iε'' (exp(-iωt): ε'' ≥ 0 is loss), tan δ = ε''/|ε'| and",
    "n = sqrt(εμ). Outside the model's valid range the value is still printed, with a warning on",
    "stderr and inRange false.",
  ].join("\n"),
  options: [
    { name: "list", type: "boolean", description: "list the catalog" },
    { name: "class", type: "string", valueName: "CLASS", description: `only this class with --list (${MATERIAL_CLASSES.join(", ")})` },
    { name: "frequency", type: "string", valueName: "F", description: "frequency, e.g. '10 GHz' (bare numbers are Hz)" },
    { name: "wavelength", type: "string", valueName: "L", description: "vacuum wavelength instead of a frequency, e.g. '1550 nm'" },
    { name: "json", type: "boolean", description: "print one JSON object on stdout" },
  ],
  maxPositionals: 1,
  async run(args, io) {
    const catalog = await loadMaterialCatalog();
    const json = flagOption(args, "json");
    const id = args.positionals[0];
    if (flagOption(args, "list")) {
      if (id !== undefined) throw new InputError({ where: "material", message: "give either --list or a material id, not both" });
      return listMaterials(catalog, args, io);
    }
    if (id === undefined) throw new InputError({ where: "material", message: "expected a material id or --list" });
    const m = findMaterial(catalog, id);
    const frequencyHz = await frequencyFromOptions(args);
    if (frequencyHz === undefined) return showRow(m, json, io);
    const v = evaluateMaterial(m, frequencyHz);
    if (![v.eps.re, v.eps.im, v.n.re, v.n.im, v.lossTangent].every(Number.isFinite)) {
      throw new InputError({
        where: stringOption(args, "wavelength") !== undefined ? "--wavelength" : "--frequency",
        message: `${m.id}'s ${m.model} model has no finite value at ${formatHz(frequencyHz)}; expected a frequency near its valid range ${formatHz(m.validMinHz)} – ${formatHz(m.validMaxHz)}`,
      });
    }
    if (v.warning) io.stderr(`warning: ${v.warning}\n`);
    if (json) {
      io.stdout(
        `${JSON.stringify({
          id: m.id,
          name: m.name,
          frequencyHz,
          eps: v.eps,
          mu: v.mu,
          lossTangent: v.lossTangent,
          n: v.n,
          inRange: v.inRange,
          validMinHz: m.validMinHz,
          validMaxHz: m.validMaxHz,
          source: m.source,
          ...(v.warning ? { warning: v.warning } : {}),
        })}\n`,
      );
      return EXIT_OK;
    }
    io.stdout(
      [
        `${m.id}: ${m.name} at ${formatHz(frequencyHz)} (vacuum wavelength ${Number(((SPEED_OF_LIGHT / frequencyHz) * 1e6).toPrecision(5))} µm)`,
        `  ε      ${formatComplex(v.eps)}`,
        `  tan δ  ${Number(v.lossTangent.toPrecision(4))}`,
        `  n      ${formatComplex(v.n)}`,
        `  range  ${v.inRange ? "inside" : "OUTSIDE"} the model's valid range ${formatHz(m.validMinHz)} – ${formatHz(m.validMaxHz)}`,
        `  source ${m.source}`,
        "",
      ].join("\n"),
    );
    return EXIT_OK;
  },
};
