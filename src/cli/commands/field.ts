/**
 * `cellwright field <design.json> [--out field.csv] [--at X,Y] [--json]`: the material tensors of
 * a design — a summary of the whole field, the per-cell CSV, or the exact tensors at one point.
 */
import { resolve } from "node:path";
import { InputError } from "../../core/errors.js";
import { SYM_COMPONENTS, symToObject } from "../../core/symTensor.js";
import { principal3 } from "../../field/principalValues.js";
import { summarizeField, type FieldSummary } from "../../field/summarizeField.js";
import type { TensorField } from "../../field/tensorField.js";
import type { ComputedMapInfo } from "../../field/maps/computedMapInfo.js";
import { loadDesign } from "../../io/design/loadDesign.js";
import type { Design } from "../../io/design/designSchema.js";
import { loadFieldForDesign, writeFieldCsv } from "../../io/fieldCsv.js";
import { parseQuantity } from "../../io/quantity.js";
import type { Command, ParsedArgs } from "../command.js";
import type { CliIo } from "../cliIo.js";
import { flagOption, stringOption } from "../args.js";

const g = (v: number): string => (Number.isFinite(v) ? String(Number(v.toPrecision(5))) : "—");

/** "45 mm,20 mm" → [x, y(, z)] in metres. */
async function parsePoint(text: string): Promise<number[]> {
  const parts = text.split(",");
  if (parts.length < 2 || parts.length > 3) {
    throw new InputError({ where: "--at", message: `expected X,Y such as "45 mm,20 mm", got '${text}'` });
  }
  return Promise.all(parts.map((p, k) => parseQuantity(p.trim(), "length", `--at (${"xyz"[k]})`)));
}

function describeTransform(design: Design): string {
  const t = design.transform;
  const mm = (m: number): string => `${g(m * 1000)} mm`;
  switch (t.kind) {
    case "radial-cloak": return `radial cloak (${t.profile}), a = ${mm(t.innerRadiusM)}, b = ${mm(t.outerRadiusM)}`;
    case "concentrator": return `concentrator, R1 = ${mm(t.innerRadiusM)}, R2 = ${mm(t.compressedRadiusM)}, R3 = ${mm(t.outerRadiusM)}`;
    case "rotator": return `rotator, a = ${mm(t.innerRadiusM)}, b = ${mm(t.outerRadiusM)}, ${g((t.angleRad * 180) / Math.PI)} deg`;
    case "beam-shifter": return `beam shifter, ${mm(t.lengthM)} × ${mm(t.heightM)}, shift ${mm(t.shiftM)}`;
    case "beam-bend": return `beam bend, ${mm(t.innerRadiusM)}–${mm(t.outerRadiusM)}, ${g((t.angleRad * 180) / Math.PI)} deg, R0 = ${mm(t.referenceRadiusM)}`;
    case "spherical-cloak": return `spherical cloak, a = ${mm(t.innerRadiusM)}, b = ${mm(t.outerRadiusM)}`;
    case "expression": return `expression map x = ${t.virtual.x}, y = ${t.virtual.y}`;
    case "quasi-conformal": {
      const sides = (["bottom", "right", "top", "left"] as const).filter((n) => t.sides[n].kind !== "straight");
      return `quasi-conformal map of a rectangle, ${sides.length ? `${sides.join(", ")} side${sides.length > 1 ? "s" : ""} replaced` : "no side replaced"}${t.fit === "module" ? ", width fitted to the module" : ""}`;
    }
    case "laplace-shell": return `laplace-shell ${t.innerScale === 0 ? "cloak" : `concentrator (inner scale ${g(t.innerScale)})`} between two curves around (${mm(t.center[0])}, ${mm(t.center[1])})`;
    case "imported": return `imported field`;
  }
}

function humanSummary(design: Design, field: TensorField, s: FieldSummary, outPath?: string): string {
  const grid = field.grid;
  const lines: string[] = [];
  lines.push(`${design.name}`);
  lines.push(`  ${describeTransform(design)}`.slice(0, 80));
  lines.push(`  ${s.cells} cells, pitch ${g(grid.pitchM * 1000)} mm, ${grid.dimension === 3 ? "3D grid" : "2D grid"}` +
    `, background eps ${g(field.background.eps)}, mu ${g(field.background.mu)}`);
  lines.push("");
  lines.push(`  component        eps min      eps max       mu min       mu max`);
  for (const c of SYM_COMPONENTS) {
    lines.push(`  ${c.padEnd(12)}${[s.eps.min[c], s.eps.max[c], s.mu.min[c], s.mu.max[c]].map((v) => g(v).padStart(13)).join("")}`);
  }
  lines.push("");
  lines.push(`  largest anisotropy (max/min principal value): eps ${g(s.maxAnisotropy.eps)}, mu ${g(s.maxAnisotropy.mu)}`);
  lines.push(`  cells with a principal value below 1: eps ${s.cellsWithPrincipalBelowOne.eps}, mu ${s.cellsWithPrincipalBelowOne.mu}`);
  const npd = s.cellsNotPositiveDefinite;
  if (npd.eps + npd.mu > 0) lines.push(`  cells not positive definite (a principal value ≤ 0): eps ${npd.eps}, mu ${npd.mu}; their anisotropy is undefined and left out`);
  const t = design.transform;
  const offset = "innerOffsetM" in t && t.innerOffsetM ? `inner offset ${g(t.innerOffsetM * 1000)} mm` : "";
  const cap = s.capValue !== null ? `cap ${g(s.capValue)} on the largest principal value` : "";
  if (offset || cap) lines.push(`  capped cells: ${s.capped} (${[offset, cap].filter(Boolean).join(", ")})`);
  else lines.push(`  capped cells: none (no innerOffset or cap set)`);
  if (field.map) {
    const m = field.map;
    lines.push(`  computed map: solver grid ${m.nodes[0]} × ${m.nodes[1]}, linear-solve residual ${m.residual.toExponential(1)}, Jacobian error ≈ ${g(m.jacobianErrorEstimate)} (relative, from a half-resolution solve)`);
    if (m.conformalModule !== null && m.conformalModuleBounds && m.virtualAspect !== null) {
      lines.push(`  conformal module ${g(m.conformalModule)} (between ${g(m.conformalModuleBounds[0])} and ${g(m.conformalModuleBounds[1])}), virtual aspect ${g(m.virtualAspect)}`);
    }
    lines.push(`  anisotropy of the map (ratio of principal stretches): max ${g(m.maxAnisotropy)}, mean ${g(m.meanAnisotropy)}`);
  }
  if (outPath) lines.push(`  wrote ${outPath}`);
  return lines.join("\n") + "\n";
}

/** The `map` object of field --json (module and aspect as height/width of the Dirichlet pair). */
function mapJson(m: ComputedMapInfo): Record<string, unknown> {
  const out: Record<string, unknown> = {
    conformalModule: m.conformalModule, conformalModuleBounds: m.conformalModuleBounds, virtualAspect: m.virtualAspect,
    maxAnisotropy: m.maxAnisotropy, meanAnisotropy: m.meanAnisotropy, nodes: m.nodes, residual: m.residual,
    jacobianErrorEstimate: m.jacobianErrorEstimate,
  };
  if (m.virtualRectangle) out.virtualRectangle = { min_m: m.virtualRectangle.minM, max_m: m.virtualRectangle.maxM };
  return out;
}

async function runAt(design: Design, field: TensorField, at: string, io: CliIo, json: boolean): Promise<number> {
  const [x, y, z = 0] = await parsePoint(at);
  if (!field.evaluateAt) {
    throw new InputError({ where: "--at", message: "imported fields are known only at cell centres; expected a design with a transform" });
  }
  const eps = new Float64Array(6), mu = new Float64Array(6);
  const detJ = field.evaluateAt(x, y, z, eps, mu);
  if (Number.isNaN(detJ)) {
    throw new InputError({ where: "--at", message: `the point (${x} m, ${y} m) is outside the device or on a singular boundary; expected a point inside it` });
  }
  const ep = Array.from(principal3(new Float64Array(3), eps));
  const mp = Array.from(principal3(new Float64Array(3), mu));
  if (json) {
    const out: Record<string, unknown> = { x_m: x, y_m: y };
    if (field.grid.dimension === 3) out.z_m = z;
    Object.assign(out, { eps: symToObject(eps), mu: symToObject(mu), epsPrincipal: ep, muPrincipal: mp, detJ });
    if (field.map) out.interpolated = { jacobianErrorEstimate: field.map.jacobianErrorEstimate, nodes: field.map.nodes };
    io.stdout(JSON.stringify(out) + "\n");
    return 0;
  }
  const lines = [
    `${design.name}: material at (${g(x * 1000)} mm, ${g(y * 1000)} mm${field.grid.dimension === 3 ? `, ${g(z * 1000)} mm` : ""})`,
    `  ${"".padEnd(8)}${SYM_COMPONENTS.map((c) => c.padStart(11)).join("")}`,
    `  ${"eps".padEnd(8)}${Array.from(eps).map((v) => g(v).padStart(11)).join("")}`,
    `  ${"mu".padEnd(8)}${Array.from(mu).map((v) => g(v).padStart(11)).join("")}`,
    `  principal eps ${ep.map(g).join(", ")}; mu ${mp.map(g).join(", ")}`,
    `  det J ${g(detJ)}`,
  ];
  if (field.map) lines.push(`  interpolated from the solved map (${field.map.nodes[0]} × ${field.map.nodes[1]} grid lines); Jacobian error ≈ ${g(field.map.jacobianErrorEstimate)} relative`);
  io.stdout(lines.join("\n") + "\n");
  return 0;
}

export const command: Command = {
  name: "field",
  summary: "compute the material tensors of a design (summary, per-cell CSV, or one point)",
  usage: "field <design.json> [--out field.csv] [--at X,Y] [--json]",
  details: [
    "Maps every cell of the design's grid through the transform and prints the ranges of the",
    "permittivity and permeability tensors, their anisotropy and the cells that were capped.",
    "--at gives the exact tensors at one physical point (not snapped to a cell centre); inside a",
    "computed map (quasi-conformal, laplace-shell) they are interpolated from the solved map.",
  ].join("\n"),
  options: [
    { name: "out", type: "string", valueName: "FILE", description: "write the per-cell CSV (written atomically)" },
    { name: "at", type: "string", valueName: "X,Y", description: 'tensors at one point, e.g. "45 mm,20 mm"' },
    { name: "json", type: "boolean", description: "print one JSON object on stdout" },
  ],
  async run(args: ParsedArgs, io: CliIo): Promise<number> {
    const designPath = args.positionals[0];
    if (!designPath) throw new InputError({ where: "field", message: "expected a design file: cellwright field <design.json>" });
    const out = stringOption(args, "out");
    const at = stringOption(args, "at");
    const json = flagOption(args, "json");
    if (at !== undefined) await parsePoint(at); // bad --at fails before any work
    const design = await loadDesign(designPath, io.cwd);
    const field = await loadFieldForDesign(design, "field");
    if (at !== undefined) {
      const code = await runAt(design, field, at, io, json);
      if (out) await writeFieldCsv(resolve(io.cwd, out), field);
      return code;
    }
    if (out) await writeFieldCsv(resolve(io.cwd, out), field);
    const s = summarizeField(field);
    const npd = s.cellsNotPositiveDefinite;
    if (npd.eps + npd.mu > 0) {
      io.stderr(`warning: ${design.sourcePath}: ${npd.eps} cells with ε and ${npd.mu} with μ not positive definite (a principal value ≤ 0): not a passive transformation medium\n`);
    }
    if (json) {
      io.stdout(JSON.stringify({
        cells: s.cells, eps: s.eps, mu: s.mu, maxAnisotropy: s.maxAnisotropy,
        cellsWithPrincipalBelowOne: s.cellsWithPrincipalBelowOne, cellsNotPositiveDefinite: npd, capped: s.capped, capValue: s.capValue,
        ...(field.map ? { map: mapJson(field.map) } : {}),
      }) + "\n");
    } else {
      io.stdout(humanSummary(design, field, s, out));
    }
    return 0;
  },
};
