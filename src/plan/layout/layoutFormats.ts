/**
 * Which layout files a plan gets, chosen by its process: GDSII for lithography (holes, posts and
 * rods in a thin layer), DXF for laser cutting, CNC milling and printed-circuit work; 3D printing
 * would take STL, which is not written yet (said in the notes). Without a process both 2D formats
 * are written.
 */
export type LayoutFormat = "gds" | "dxf";

const BY_PROCESS: Record<string, LayoutFormat[]> = {
  "deep-uv-lithography": ["gds"],
  "electron-beam-lithography": ["gds"],
  "laser-cutting": ["dxf"],
  "cnc-milling": ["dxf"],
  "pcb-etching": ["dxf"],
};

/** File name of each format. */
export const LAYOUT_FILE: Record<LayoutFormat, string> = { gds: "layout.gds", dxf: "layout.dxf" };

export function layoutFormats(process: string | null): { formats: LayoutFormat[]; note: string | null } {
  if (process === null) return { formats: ["gds", "dxf"], note: null };
  const f = BY_PROCESS[process];
  if (f) return { formats: f, note: null };
  return { formats: [], note: `process ${process} prints a 3D part: its layout would be STL, which is not written yet` };
}
