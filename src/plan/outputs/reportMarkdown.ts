/**
 * report.md: a short, readable report of a plan — design, reduction and its cost, levels,
 * flags with where they are, device-level figures, bill of materials, cautions and assumptions.
 */
import { EFFECTIVE_INDEX_LIMITS } from "../../cells/slab/layerHost.js";
import type { Plan } from "../planTypes.js";
import { FLAGS } from "../flags.js";
import { fmt } from "./csvText.js";
import { recipeLabel } from "./levelsCsv.js";

function si(x: number, unit: string): string {
  if (!Number.isFinite(x)) return "—";
  const a = Math.abs(x);
  const prefixes: [number, string][] = [[1e9, "G"], [1e6, "M"], [1e3, "k"], [1, ""], [1e-3, "m"], [1e-6, "µ"], [1e-9, "n"]];
  for (const [f, p] of prefixes) if (a >= f) return `${fmt(x / f, 4)} ${p}${unit}`;
  return `${fmt(x, 4)} ${unit}`;
}

function pct(x: number | null): string {
  if (x === null || !Number.isFinite(x)) return "—";
  return Math.abs(x) < 1e-8 ? "0 %" : `${fmt(x * 100, 3)} %`;
}

function regionList(ids: number[]): string {
  if (ids.length === 0) return "—";
  const shown = ids.slice(0, 12).join(", ");
  return ids.length > 12 ? `${shown} … (${ids.length} regions)` : shown;
}

/** Safety cautions that fit the design frequency. */
export function cautions(frequencyHz: number): string[] {
  const out = [
    "Measurement with radio-frequency sources: keep to the exposure limits of your local regulations and keep people out of the main beam of horns and open waveguides while transmitting.",
  ];
  if (frequencyHz > 3e13) {
    out.push("Optical and infrared sources: lasers used to test the device need eye protection rated for the wavelength and power, a controlled beam path and the laser-safety practice of your site.");
  }
  out.push(
    "Resins, solvents and etchants (printing resins, developers, PCB etchants, cleaning solvents): handle them with gloves, ventilation and the supplier's safety data sheet; cure and dispose of waste as the sheet says.",
    "These notes are general; defer to local codes and licensed practice for anything that can hurt people.",
  );
  return out;
}

/** The report text. */
export function reportMarkdown(plan: Plan): string {
  const d = plan.design;
  const s = plan.settings;
  const f = plan.figures;
  const L: string[] = [];
  L.push(`# Build plan: ${d.name}`, "");
  if (d.notes) L.push(d.notes, "");
  L.push("## Verdict", "");
  if (plan.verdict.buildable) {
    L.push("**Buildable as asked:** every cell has a recipe and the plan meets every requirement the design states.", "");
  } else {
    L.push(`**Not buildable as asked:** ${plan.verdict.missed.length} requirement${plan.verdict.missed.length === 1 ? "" : "s"} missed.`, "");
    L.push("| requirement | figure | limit | |", "|---|---:|---:|---|");
    for (const m of plan.verdict.missed) L.push(`| ${m.what} | ${fmt(m.value, 4)} | ${fmt(m.limit, 4)} | ${m.text} |`);
    L.push("");
  }
  if (plan.remedies) {
    L.push("### What would help", "");
    if (plan.remedies.remedies.length === 0) {
      L.push(`None of the ${plan.remedies.tried} changes tried by re-planning this design improves the verdict.`, "");
    } else {
      L.push(`Each change below was tried by re-planning this design (${plan.remedies.tried} tried; the best ${plan.remedies.remedies.length} shown, best first). Figures are before → after; "met" means the requirement is met.`, "");
      plan.remedies.remedies.forEach((r, k) => L.push(`${k + 1}. **${r.label}**${r.buildable ? " (buildable as asked)" : ""}: ${r.changes}.`));
      L.push("");
    }
    for (const n of plan.remedies.notes ?? []) L.push(`Note: ${n}.`, "");
  }
  L.push(`Checked: recipes for every cell; tolerance ${pct(s.tolerance)} on the largest error (quantization and loss included); ${s.lossBudgetDb === null ? "no loss budget stated" : `loss budget ${fmt(s.lossBudgetDb, 3)} dB`}; ${s.bandwidth === null ? "no bandwidth stated" : `bandwidth ${pct(s.bandwidth)}`}; anisotropy limit ${fmt(s.maxAnisotropy, 3)}; ${s.process === null ? "no process stated" : `process ${s.process} (smallest feature, level steps)`}.`, "");
  L.push("## Design", "");
  L.push(`- source: \`${d.sourcePath}\`, transform: ${d.transform}`);
  L.push(`- design frequency ${si(d.frequencyHz, "Hz")} (free-space wavelength ${si(d.wavelengthM, "m")})`);
  L.push(`- ${plan.grid.count} device cells of pitch ${si(plan.grid.pitchM, "m")} (λ₀/${fmt(d.wavelengthM / plan.grid.pitchM, 3)})`);
  L.push("");
  L.push("## Reduction", "");
  L.push(`Polarization ${s.polarization}, scheme \`${s.scheme}\`${s.scheme === "unit-mu" ? ` (the ${s.unitAxis} in-plane μ set to 1)` : ""}, background index ${fmt(plan.reductionBackground.index, 4)}${plan.reductionBackground.given || plan.reductionBackground.index === 1 ? "" : " (the design's own background; no background index given)"}.`, "");
  for (const n of plan.reductionNotes) L.push(`- ${n}`);
  L.push(`- outer-boundary reflection (normal incidence, power): ${f.boundaryReflection === null ? "not known for this field" : pct(f.boundaryReflection)}`);
  L.push(`- largest in-plane anisotropy of the targets: ${fmt(f.largestAnisotropy, 4)} (limit ${fmt(s.maxAnisotropy, 3)})`);
  L.push("");
  L.push("## Levels", "");
  L.push(`${plan.levels.length} levels (${s.levels === null ? `as few as a ${pct(s.tolerance)} tolerance allows` : `at most ${s.levels}`}), quantized by ${plan.quantization.method}; largest quantization error ${pct(plan.quantization.maxError)}. ${plan.regions.length} connected regions.`, "");
  const comps = plan.components.map((c) => c.name);
  L.push(`| level | cells | ${comps.join(" | ")} | recipe | recipe error | quantization error | loss tan δ | flags |`);
  L.push(`|---:|---:|${comps.map(() => "---:").join("|")}|---|---:|---:|---:|---|`);
  for (const lv of plan.levels) {
    const r = lv.recipe;
    const flags = [...FLAGS.filter((_, k) => lv.flags & (1 << k)).map((x) => x.name), ...(lv.unresolvable ? ["unresolvable"] : [])].join(", ");
    L.push(`| ${lv.index} | ${lv.cellCount} | ${lv.target.map((t) => fmt(t, 4)).join(" | ")} | ${r ? recipeLabel(r) : `none: ${lv.reasons.slice(0, 2).join("; ")}`} | ${r ? pct(r.relError) : "—"} | ${pct(lv.maxQuantizationError)} | ${r ? fmt(r.lossTangent, 3) : "—"} | ${flags || "—"} |`);
  }
  L.push("", "Recipe error: the level's recipe against the level's target (complex, so its loss counts). Quantization error: the level's target against its cells' own targets, largest. A cell's error (build list `rel_error`) combines both.");
  L.push("", "Runners-up for each level are in levels.csv.");
  if (plan.levels.some((l) => l.recipe && l.recipe.orientation !== null)) {
    L.push("\"along z / 1 / 2\" is the direction of the rods, holes, wires or ring axis, or of a laminate's layer normal: z, or in-plane axis 2 (the larger target value, at the build list's axis_deg from +x) or axis 1 (perpendicular to it).");
  }
  L.push("");
  L.push("## Flags", "");
  const present = FLAGS.filter((x) => (f.flagCounts[x.name] ?? 0) > 0);
  if (present.length === 0) L.push("No cell carries a flag.");
  else {
    L.push("| flag | cells | regions | meaning |", "|---|---:|---|---|");
    for (const x of present) L.push(`| ${x.name} | ${f.flagCounts[x.name]} | ${regionList(f.flagRegions[x.name] ?? [])} | ${x.meaning} |`);
  }
  L.push("");
  L.push("## Device-level figures", "");
  const without = f.flagCounts.norecipe ?? 0;
  L.push(`- relative error of achieved vs target${without > 0 ? `, over the ${plan.grid.count - without} cells with a recipe` : ""}: largest ${pct(f.maxRelError)}, median ${pct(f.medianRelError)} (tolerance ${pct(s.tolerance)})`);
  L.push(`- loss: ${fmt(f.lossDb, 3)} dB along the worst straight row or column of cells (${si(f.lossPathM, "m")} long), ∫ k₀·Im n ds${f.lossBudgetDb === null ? " (no budget set)" : `; budget ${fmt(f.lossBudgetDb, 3)} dB: ${f.lossWithinBudget ? "met" : "**exceeded**"}`}`);
  L.push(`- narrowest bandwidth of a resonant level: ${f.minBandwidth === null ? "no resonant cells" : pct(f.minBandwidth)}${f.bandwidthRequired === null ? "" : `; required ${pct(f.bandwidthRequired)}: ${f.bandwidthMet === false ? "**not met**" : "met"}`}`);
  L.push(`- smallest feature used: ${f.smallestFeatureM === null ? "—" : si(f.smallestFeatureM, "m")}; process limit: ${f.processMinFeatureM === null ? "no process given" : si(f.processMinFeatureM, "m")}`);
  L.push("");
  L.push("## Bill of materials", "");
  if (f.billOfMaterials.length === 0) L.push("No material is used (no cell has a recipe).");
  else {
    if (plan.grid.dimension === 2) L.push(`Device height ${si(f.height.heightM, "m")}: ${f.height.source}.`, "");
    L.push("| material | cells | volume | order |", "|---|---:|---:|---|");
    for (const b of f.billOfMaterials) L.push(`| ${b.material} | ${b.cells} | ${fmt(b.volume * 1e6, 4)} cm³ | ${fmt(b.order.quantity, 3)} ${b.order.unit} (${b.order.what}) |`);
  }
  L.push("");
  if (plan.warnings.length) {
    L.push("## Warnings", "");
    for (const w of plan.warnings) L.push(`- ${w}`);
    L.push("");
  }
  L.push("## Cautions", "");
  for (const c of cautions(d.frequencyHz)) L.push(`- ${c}`);
  L.push("");
  L.push("## Assumptions", "");
  L.push(
    "- Each cell is replaced by a uniform effective medium. Rods and holes on square, hexagonal and rectangular lattices use the solved periodic cell problem (quasi-static; the closed forms are reported beside it where they differ by more than the tolerance); laminates use the exact Wiener means; 3D cells use the Maxwell Garnett and Bruggeman rules. These hold when the cell is much smaller than the wavelength inside it; the plan refuses cells coarser than λ/4 in their densest material and flags cells coarser than λ/10 — for rods and holes standing along z only where their lowest band at the design frequency departs from the long-wavelength index by more than the tolerance.",
    "- A value is uncertain when its model's uncertainty exceeds the tolerance: the solved cell's error estimate (grid ladder and table interpolation), or, where no solved model covers the cell (3D cells, circles nearly touching), the Maxwell Garnett/Bruggeman spread; for wire media the error of the lattice cut-off. Verify such cells with a full-wave unit-cell simulation before building.",
    ...(plan.layer ? [`- Layer: the core is mixed with its slab mode index ${plan.layer.modeIndex === null ? "(none guided: bulk values)" : Number(plan.layer.modeIndex.toPrecision(5))} (${plan.layer.kind === "slab" ? `${plan.layer.polarization} modes, ${plan.layer.guidedModes} guided` : `parallel plates, ${plan.layer.polarization}`}). ${plan.layer.kind === "slab" ? EFFECTIVE_INDEX_LIMITS : ""}`.trim()] : []),
    ...(plan.levels.some((l) => l.recipe?.lattice === "rect")
      ? ["- Rect-lattice cells (realization.lattice \"rect\") hold m × n rods or holes per cell, spacing p/m along the cell's principal axis 1 and p/n along axis 2 (aspect m/n); both in-plane values are solved on that lattice (a fill table per material pair and aspect). The layout snaps the lattice axes to the grid axes nearer the principal axes (the largest misalignment is printed with the layout); the planned values assume none."]
      : []),
    "- Resonant cells (wire media, split rings) follow simple analytic models; their bandwidth and loss are estimates to be confirmed by measurement or simulation.",
    ...(plan.levels.some((l) => l.recipe?.family === "split-ring")
      ? ["- Split-ring cells are printed rings (edge-coupled, quasi-static LC model) on boards standing in air, the boards across the ring axis; the cell's permittivity is the board/air laminate and the rings' own electric response is neglected. Neighbouring rings' coupling is not modelled."]
      : []),
    "- Cells are matched level by level: every cell of a level gets the same recipe, so its error is the quantization error plus the recipe's error.",
    "- The loss figure sums k₀·Im n along straight lattice rows and columns; it ignores reflections and scattering.",
  );
  L.push("");
  return L.join("\n");
}
