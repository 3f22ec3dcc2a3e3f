/**
 * Which layout files a plan gets, chosen by its process: GDSII for lithography (holes, posts and
 * rods in a thin layer), DXF for laser cutting, CNC milling and printed-circuit work, STL for 3D
 * printing (the printed part: plan/layout/printedPart.ts). Without a process both 2D formats are
 * written.
 */
export type LayoutFormat = "gds" | "dxf" | "stl";

const BY_PROCESS: Record<string, LayoutFormat[]> = {
  "deep-uv-lithography": ["gds"],
  "electron-beam-lithography": ["gds"],
  "laser-cutting": ["dxf"],
  "cnc-milling": ["dxf"],
  "pcb-etching": ["dxf"],
  "fused-filament": ["stl"],
  "stereolithography": ["stl"],
  "ceramic-stereolithography": ["stl"],
  "two-photon-lithography": ["stl"],
};

/** File name of each format. */
export const LAYOUT_FILE: Record<LayoutFormat, string> = { gds: "layout.gds", dxf: "layout.dxf", stl: "layout.stl" };

export function layoutFormats(process: string | null): { formats: LayoutFormat[]; note: string | null } {
  if (process === null) return { formats: ["gds", "dxf"], note: null };
  const f = BY_PROCESS[process];
  if (f) return { formats: f, note: null };
  return { formats: [], note: `process ${process} has no layout format` };
}
