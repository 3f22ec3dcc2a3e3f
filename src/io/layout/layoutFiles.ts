/**
 * The layout files of a plan (plan/layout/layoutFormats.ts picks them by process), shared by
 * `plan --layout` and the session's layout export: GDSII and DXF from the plan-view shapes, STL from
 * the printed part. Notes (levels not drawn, tessellation, height) go to `io.stderr`.
 */
import { InputError } from "../../core/errors.js";
import type { Plan } from "../../plan/planTypes.js";
import { planLayout } from "../../plan/layout/layoutShapes.js";
import { layoutFormats, LAYOUT_FILE } from "../../plan/layout/layoutFormats.js";
import { printedPart } from "../../plan/layout/printedPart.js";
import { gdsiiBytes } from "./gdsiiWriter.js";
import { dxfText } from "./dxfWriter.js";
import { STL_MAX_BYTES, stlBytesFor, stlChunks } from "./stlWriter.js";
import type { ExtraOutput } from "../planOutputs.js";

/**
 * The layout files the plan's process takes (plan/layout/layoutFormats.ts); notes go to stderr.
 * A printed part whose STL would exceed STL_MAX_BYTES is refused (input error at --layout, with
 * the estimate) before anything is written.
 */
export function layoutFiles(plan: Plan, io: { stderr(text: string): void }): ExtraOutput[] {
  const { formats, note } = layoutFormats(plan.settings.process);
  if (note) io.stderr(`layout: ${note}\n`);
  const out: ExtraOutput[] = [];
  const flat = formats.filter((f) => f !== "stl");
  if (flat.length) {
    const layout = planLayout(plan);
    for (const n of layout.notDrawn) io.stderr(`layout: level ${n.level} not drawn: ${n.reason}\n`);
    for (const n of layout.notes) io.stderr(`layout: ${n}\n`);
    if (layout.levels.length === 0) io.stderr("layout: no level has a plan-view shape; no 2D layout file written\n");
    else for (const f of flat) out.push({ name: LAYOUT_FILE[f], data: f === "gds" ? gdsiiBytes(layout) : dxfText(layout) });
  }
  if (formats.includes("stl")) {
    const h = plan.figures.height;
    const part = printedPart(plan, h.heightM, plan.figures.processMinFeatureM);
    for (const n of part.notDrawn) io.stderr(`layout: level ${n.level} not printed: ${n.reason}\n`);
    for (const n of part.notes) io.stderr(`layout: ${n}\n`);
    if (part.refused) io.stderr(`layout: no STL written: ${part.refused}\n`);
    else {
      const bytes = stlBytesFor(part.triangles);
      if (bytes > STL_MAX_BYTES) {
        throw new InputError({ where: "--layout", message: `the printed part's STL would be about ${Math.round(bytes / 1e6)} MB (${part.triangles} triangles for ${plan.grid.count} cells × ${part.layers} layers), over the ${STL_MAX_BYTES / 1024 / 1024} MB limit: lower realization.height or plan a smaller device` });
      }
      const facets = [part.circleVertices ? `circles as ${part.circleVertices}-gons` : "", part.sphereSubdivision ? `spheres as level-${part.sphereSubdivision} icospheres` : ""].filter(Boolean).join(", ");
      io.stderr(`layout: layout.stl: ${part.triangles} triangles (${(bytes / 1e6).toPrecision(3)} MB), ${part.layers} layer${part.layers === 1 ? "" : "s"}, ${Number((part.heightM * 1e3).toPrecision(6))} mm high (${h.source})${facets ? `; ${facets}` : ""}\n`);
      out.push({ name: LAYOUT_FILE.stl, chunks: () => stlChunks(part, plan.design.name) });
    }
  }
  return out;
}
