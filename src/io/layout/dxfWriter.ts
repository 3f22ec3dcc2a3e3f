/**
 * DXF writer (laser cutting, CNC milling, printed-circuit work), on the npm package dxf-writer: a
 * 2D drawing in millimetres ($INSUNITS = millimetres), one layer per level named `LEVEL_<n>`, each
 * cell's shape one closed LWPOLYLINE (circles as 64-vertex polygons of the circle's area:
 * plan/layout/layoutShapes.ts). Coordinates are the build list's positions in millimetres.
 */
import Drawing from "dxf-writer";
import type { Layout } from "../../plan/layout/layoutShapes.js";

/** Layer name of a level. */
export function dxfLayerName(level: number): string {
  return `LEVEL_${level}`;
}

/** The layout as DXF text. */
export function dxfText(layout: Layout): string {
  const d = new Drawing();
  d.setUnits("Millimeters");
  const colours = [Drawing.ACI.RED, Drawing.ACI.YELLOW, Drawing.ACI.GREEN, Drawing.ACI.CYAN, Drawing.ACI.BLUE, Drawing.ACI.MAGENTA];
  layout.levels.forEach((lv, k) => {
    d.addLayer(dxfLayerName(lv.level), colours[k % colours.length], "CONTINUOUS");
  });
  for (const lv of layout.levels) {
    d.setActiveLayer(dxfLayerName(lv.level));
    for (const p of lv.polygons) {
      const pts: [number, number][] = [];
      for (let k = 0; k < p.xy.length; k += 2) pts.push([p.xy[k] * 1e3, p.xy[k + 1] * 1e3]);
      d.drawPolyline(pts, true);
    }
  }
  return d.toDxfString();
}
