/**
 * SVG picture of |u| (total field magnitude) for several cases side by side on one colour scale,
 * with the device outline. Pure: returns the SVG text. Each panel is at most `maxPixels` squares
 * across (block means of the FDFD nodes, PML cropped); runs of equal colour along a row are merged
 * into one rectangle to keep the file small. NaN values mean "not solved there" (the drawn case's
 * window is smaller than the main grid's) and are drawn grey.
 */
import type { FdfdGrid } from "./fdfdGrid.js";

/** Colour stops (dark blue → teal → yellow), our own perceptually ordered ramp. */
const STOPS: [number, number, number][] = [[20, 24, 82], [33, 102, 172], [38, 166, 154], [153, 204, 82], [250, 226, 60], [255, 255, 224]];
const LEVELS = 32;
/** Colour of pixels without data (a case solved on a smaller window than the picture's). */
const NO_DATA = "#d9d9d9";

function colour(t: number): string {
  const x = Math.min(1, Math.max(0, t)) * (STOPS.length - 1);
  const k = Math.min(STOPS.length - 2, Math.floor(x)), f = x - k;
  const c = STOPS[k].map((v, q) => Math.round(v + f * (STOPS[k + 1][q] - v)));
  return `#${c.map((v) => v.toString(16).padStart(2, "0")).join("")}`;
}

export interface FieldPanel {
  title: string;
  /** |u| per node, index i + nx·j */
  magnitude: Float64Array;
}

const esc = (s: string): string => s.replace(/&/g, "&amp;").replace(/</g, "&lt;").replace(/>/g, "&gt;");

/**
 * Panels of |u| on grid g (interior only), shared scale 0 … `scaleMax` (default: the largest value
 * over the panels' observation nodes, capped at 3× the incident amplitude); `mask` outlines the device.
 */
export function fieldSvg(g: FdfdGrid, panels: FieldPanel[], mask: Uint8Array, options: { title?: string; maxPixels?: number; scaleMax?: number } = {}): string {
  const maxPixels = options.maxPixels ?? 120;
  const iw = g.nx - 2 * g.pml, jh = g.ny - 2 * g.pml;
  const block = Math.max(1, Math.ceil(Math.max(iw, jh) / maxPixels));
  const pw = Math.ceil(iw / block), ph = Math.ceil(jh / block);
  const px = Math.max(2, Math.floor(240 / Math.max(pw, ph)));
  const panelW = pw * px, panelH = ph * px, gap = 16, top = 40, bottom = 44;
  let vmax = options.scaleMax ?? 0;
  const means = panels.map((p) => {
    const out = new Float64Array(pw * ph), dev = new Uint8Array(pw * ph);
    for (let b = 0; b < ph; b++) {
      for (let a = 0; a < pw; a++) {
        let s = 0, cnt = 0, d = 0;
        for (let q = 0; q < block; q++) {
          for (let p2 = 0; p2 < block; p2++) {
            const i = g.pml + a * block + p2, j = g.pml + b * block + q;
            if (i >= g.nx - g.pml || j >= g.ny - g.pml) continue;
            const v = p.magnitude[i + g.nx * j];
            if (Number.isNaN(v)) continue; // no data there (a case solved on a smaller window)
            s += v; cnt++;
            if (mask[i + g.nx * j]) d = 1;
          }
        }
        out[a + pw * b] = cnt ? s / cnt : NaN;
        dev[a + pw * b] = d;
      }
    }
    return { out, dev };
  });
  if (!(vmax > 0)) {
    for (const m of means) for (let k = 0; k < m.out.length; k++) if (!m.dev[k] && !Number.isNaN(m.out[k])) vmax = Math.max(vmax, m.out[k]);
    vmax = Math.min(vmax || 1, 3);
  }
  const width = Math.max(panels.length * panelW + (panels.length + 1) * gap, Math.ceil((options.title?.length ?? 0) * 7.2) + 2 * gap);
  const height = top + panelH + bottom;
  const parts: string[] = [
    `<svg xmlns="http://www.w3.org/2000/svg" width="${width}" height="${height}" viewBox="0 0 ${width} ${height}" font-family="sans-serif" font-size="12">`,
    `<rect width="${width}" height="${height}" fill="#ffffff"/>`,
  ];
  if (options.title) parts.push(`<text x="${gap}" y="16" font-size="13">${esc(options.title)}</text>`);
  panels.forEach((p, n) => {
    const x0 = gap + n * (panelW + gap), y0 = top;
    parts.push(`<text x="${x0}" y="${top - 6}">${esc(p.title)}</text>`, `<g shape-rendering="crispEdges">`);
    const { out, dev } = means[n];
    for (let b = 0; b < ph; b++) {
      // rows drawn with y up: pixel row b from the bottom
      const y = y0 + (ph - 1 - b) * px;
      let a = 0;
      while (a < pw) {
        // level −1: no data (drawn grey)
        const level = (v: number): number => (Number.isNaN(v) ? -1 : Math.round(Math.min(1, v / vmax) * (LEVELS - 1)));
        const lv = level(out[a + pw * b]);
        let e = a + 1;
        while (e < pw && level(out[e + pw * b]) === lv) e++;
        parts.push(`<rect x="${x0 + a * px}" y="${y}" width="${(e - a) * px}" height="${px}" fill="${lv < 0 ? NO_DATA : colour(lv / (LEVELS - 1))}"/>`);
        a = e;
      }
      for (let a2 = 0; a2 < pw; a2++) {
        // device outline: edge pixels of the mask
        if (!dev[a2 + pw * b]) continue;
        const edge = a2 === 0 || a2 === pw - 1 || b === 0 || b === ph - 1 || !dev[a2 - 1 + pw * b] || !dev[a2 + 1 + pw * b] || !dev[a2 + pw * (b - 1)] || !dev[a2 + pw * (b + 1)];
        if (edge) parts.push(`<rect x="${x0 + a2 * px + px / 4}" y="${y + px / 4}" width="${px / 2}" height="${px / 2}" fill="#ffffff" fill-opacity="0.6"/>`);
      }
    }
    parts.push(`</g>`, `<rect x="${x0}" y="${y0}" width="${panelW}" height="${panelH}" fill="none" stroke="#333"/>`);
  });
  // colour bar
  const barY = top + panelH + 8, barW = Math.min(240, width - 2 * gap);
  for (let k = 0; k < LEVELS; k++) parts.push(`<rect x="${gap + (k * barW) / LEVELS}" y="${barY}" width="${barW / LEVELS + 0.5}" height="10" fill="${colour(k / (LEVELS - 1))}"/>`);
  parts.push(`<text x="${gap}" y="${barY + 24}">|u| = 0 … ${vmax.toPrecision(3)} (incident wave = 1, travelling +x, left to right)</text>`);
  parts.push("</svg>");
  return parts.join("\n") + "\n";
}
