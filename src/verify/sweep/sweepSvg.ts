/**
 * verify-sweep.svg: the sweep's figure of merit against frequency, one line per case (markers at
 * the solved frequencies; hollow markers where the figure is not converged), axes with ticks and
 * units, a legend, the limit the realized device is held to (dashed) and the band where it holds
 * (shaded); the drawn realized case's band, where it was swept, as a bar just above the plot.
 * Pure: returns the SVG text.
 */
import type { SweepBand } from "./sweepBand.js";
import type { SweepFigure } from "./sweepSummary.js";

export interface SweepSeries {
  name: string;
  /** figure per frequency (null: not computed there) */
  values: (number | null)[];
  /** per frequency: false where not converged (hollow marker) */
  converged: (boolean | null)[];
}

const COLOURS: Record<string, string> = { flat: "#b0b0b0", bare: "#7a7a7a", ideal: "#2166ac", reduced: "#1b9e77", realized: "#d95f02", "realized-geometry": "#7b3294" };
const esc = (s: string): string => s.replace(/&/g, "&amp;").replace(/</g, "&lt;").replace(/>/g, "&gt;");
const num = (v: number): string => Number(v.toFixed(2)).toString();

/** 1, 2 or 5 × 10^k steps giving about `count` ticks over [lo, hi]. */
export function niceTicks(lo: number, hi: number, count = 5): number[] {
  if (!(hi > lo)) return [lo];
  const raw = (hi - lo) / count;
  const p = 10 ** Math.floor(Math.log10(raw));
  const step = [1, 2, 5, 10].map((m) => m * p).find((s) => s >= raw) ?? 10 * p;
  const out: number[] = [];
  for (let t = Math.ceil(lo / step - 1e-9) * step; t <= hi + step * 1e-9; t += step) out.push(Math.abs(t) < step * 1e-9 ? 0 : t);
  return out;
}

/** SI prefix scale for values up to `max`: [factor, prefix]. */
function prefix(max: number, unit: string): [number, string] {
  const table: [number, string][] = unit === "Hz"
    ? [[1e12, "THz"], [1e9, "GHz"], [1e6, "MHz"], [1e3, "kHz"], [1, "Hz"]]
    : [[1, "m"], [1e-3, "mm"], [1e-6, "µm"], [1e-9, "nm"]];
  for (const [f, p] of table) if (Math.abs(max) >= f) return [f, p];
  return table[table.length - 1];
}

const tickText = (v: number): string => Number(v.toPrecision(6)).toString();

/** The plot (see file comment). */
/** The band's edge ranges that have a width (none on a single grid). */
function edgeRanges(band: SweepBand): [number, number][] {
  return [band.lowRangeHz, band.highRangeHz].filter((r): r is [number, number] => r !== null && r[1] > r[0]);
}

export function sweepSvg(frequenciesHz: readonly number[], series: readonly SweepSeries[], figure: SweepFigure, band: SweepBand | null, title: string, subtitle = "", drawnBand: SweepBand | null = null): string {
  const W = 720, H = 456, left = 78, right = 170, top = 64, bottom = 58;
  const pw = W - left - right, ph = H - top - bottom;
  const f0 = frequenciesHz[0], f1 = frequenciesHz[frequenciesHz.length - 1];
  const [fs, fUnit] = prefix(Math.max(Math.abs(f0), Math.abs(f1)), "Hz");
  const span = f1 > f0 ? f1 - f0 : Math.max(f0 * 0.01, 1);
  const xLo = f1 > f0 ? f0 : f0 - span / 2, xHi = f1 > f0 ? f1 : f0 + span / 2;
  let yMax = 0;
  for (const s of series) for (const v of s.values) if (v !== null && Number.isFinite(v)) yMax = Math.max(yMax, v);
  if (band?.limit != null && Number.isFinite(band.limit)) yMax = Math.max(yMax, band.limit);
  if (figure.name === "deliveredPower") yMax = 1;
  if (!(yMax > 0)) yMax = 1;
  const [ys, yUnit] = figure.unit === "m" ? prefix(yMax, "m") : [1, ""];
  const yTicks = niceTicks(0, yMax / ys);
  if (yTicks.length > 1 && yTicks[yTicks.length - 1] < yMax / ys) yTicks.push(yTicks[yTicks.length - 1] + (yTicks[1] - yTicks[0]));
  const yTop = Math.max(yMax / ys, yTicks[yTicks.length - 1]);
  const X = (hz: number): number => left + ((hz - xLo) / (xHi - xLo)) * pw;
  const Y = (v: number): number => top + ph - ((v / ys) / yTop) * ph;
  const out: string[] = [];
  out.push(`<svg xmlns="http://www.w3.org/2000/svg" width="${W}" height="${H}" viewBox="0 0 ${W} ${H}" font-family="sans-serif" font-size="12">`);
  out.push(`<rect width="${W}" height="${H}" fill="white"/>`);
  const cut = (t: string, n: number): string => (t.length > n ? `${t.slice(0, n - 1)}…` : t);
  out.push(`<text x="16" y="22" font-size="14">${esc(cut(title, 88))}</text>`);
  if (subtitle) out.push(`<text x="16" y="42" fill="#555">${esc(cut(subtitle, 104))}</text>`);
  // band and limit
  if (band && band.lowHz !== null && band.highHz !== null) {
    const a = X(band.lowHz), b = X(band.highHz);
    out.push(`<rect x="${num(a)}" y="${top}" width="${num(Math.max(1, b - a))}" height="${ph}" fill="#fdd49e" fill-opacity="0.45"/>`);
    // where each edge can lie within the figures' uncertainties (sweepBand.ts)
    for (const r of edgeRanges(band)) {
      const ra = X(r[0]), rb = X(r[1]);
      out.push(`<rect x="${num(ra)}" y="${top}" width="${num(Math.max(1, rb - ra))}" height="${ph}" fill="#999" fill-opacity="0.25"/>`);
    }
  }
  const drawnBar = drawnBand && drawnBand.lowHz !== null && drawnBand.highHz !== null;
  if (drawnBar) {
    const a = X(drawnBand.lowHz!), b = X(drawnBand.highHz!);
    // just above the plot frame, so it hides no figure near the top of the axis
    out.push(`<rect x="${num(a)}" y="${top - 9}" width="${num(Math.max(1, b - a))}" height="6" fill="${COLOURS["realized-geometry"]}" fill-opacity="0.55"/>`);
  }
  // axes, ticks, grid
  out.push(`<g stroke="#e4e4e4">`);
  for (const t of yTicks) out.push(`<line x1="${left}" x2="${left + pw}" y1="${num(Y(t * ys))}" y2="${num(Y(t * ys))}"/>`);
  out.push(`</g>`);
  out.push(`<rect x="${left}" y="${top}" width="${pw}" height="${ph}" fill="none" stroke="#333"/>`);
  for (const t of yTicks) {
    const y = num(Y(t * ys));
    out.push(`<line x1="${left - 5}" x2="${left}" y1="${y}" y2="${y}" stroke="#333"/><text x="${left - 8}" y="${y}" text-anchor="end" dominant-baseline="middle">${tickText(t)}</text>`);
  }
  for (const t of niceTicks(xLo / fs, xHi / fs, 6)) {
    const x = num(X(t * fs));
    if (t * fs < xLo - 1e-9 * span || t * fs > xHi + 1e-9 * span) continue;
    out.push(`<line x1="${x}" x2="${x}" y1="${top + ph}" y2="${top + ph + 5}" stroke="#333"/><text x="${x}" y="${top + ph + 18}" text-anchor="middle">${tickText(t)}</text>`);
  }
  out.push(`<text x="${left + pw / 2}" y="${H - 14}" text-anchor="middle">frequency (${fUnit})</text>`);
  const yLabel = yUnit ? `${figure.label} (${yUnit})` : figure.label;
  out.push(`<text transform="translate(18 ${top + ph / 2}) rotate(-90)" text-anchor="middle">${esc(yLabel)}</text>`);
  if (band?.limit != null && Number.isFinite(band.limit)) {
    const y = num(Y(band.limit));
    out.push(`<line x1="${left}" x2="${left + pw}" y1="${y}" y2="${y}" stroke="#d95f02" stroke-dasharray="6 4"/>`);
  }
  // series
  for (const s of series) {
    const colour = COLOURS[s.name] ?? "#000";
    const pts: string[] = [];
    const runs: string[][] = [[]];
    s.values.forEach((v, k) => {
      if (v === null || !Number.isFinite(v)) { if (runs[runs.length - 1].length) runs.push([]); return; }
      const x = num(X(frequenciesHz[k])), y = num(Y(v));
      runs[runs.length - 1].push(`${x},${y}`);
      const hollow = s.converged[k] === false;
      pts.push(`<circle cx="${x}" cy="${y}" r="3" fill="${hollow ? "white" : colour}" stroke="${colour}"/>`);
    });
    const d = runs.filter((r) => r.length > 1).map((r) => `M${r.join("L")}`).join("");
    if (d) out.push(`<path d="${d}" fill="none" stroke="${colour}" stroke-width="1.8"${s.name === "bare" ? ` stroke-dasharray="3 3"` : ""}/>`);
    out.push(...pts);
  }
  // legend
  const lx = left + pw + 16;
  let ly = top + 8;
  for (const s of series) {
    const colour = COLOURS[s.name] ?? "#000";
    out.push(`<line x1="${lx}" x2="${lx + 22}" y1="${ly}" y2="${ly}" stroke="${colour}" stroke-width="2"/><circle cx="${lx + 11}" cy="${ly}" r="3" fill="${colour}"/><text x="${lx + 28}" y="${ly}" dominant-baseline="middle">${esc(s.name)}</text>`);
    ly += 20;
  }
  if (band?.limit != null && Number.isFinite(band.limit)) {
    out.push(`<line x1="${lx}" x2="${lx + 22}" y1="${ly}" y2="${ly}" stroke="#d95f02" stroke-dasharray="6 4"/><text x="${lx + 28}" y="${ly}" dominant-baseline="middle">limit (reduced ${band.sense === "lower-is-better" ? "×" : "÷"} ${tickText(band.threshold)})</text>`);
    ly += 20;
  }
  if (band && band.lowHz !== null) {
    out.push(`<rect x="${lx}" y="${ly - 7}" width="22" height="14" fill="#fdd49e" fill-opacity="0.8"/><text x="${lx + 28}" y="${ly}" dominant-baseline="middle">band</text>`);
    ly += 20;
    if (edgeRanges(band).length > 0) {
      out.push(`<rect x="${lx}" y="${ly - 7}" width="22" height="14" fill="#999" fill-opacity="0.4"/><text x="${lx + 28}" y="${ly}" dominant-baseline="middle">edge range (uncertainty)</text>`);
      ly += 20;
    }
  }
  if (drawnBar) {
    out.push(`<rect x="${lx}" y="${ly - 3}" width="22" height="6" fill="${COLOURS["realized-geometry"]}" fill-opacity="0.55"/><text x="${lx + 28}" y="${ly}" dominant-baseline="middle">band (drawn)</text>`);
    ly += 20;
  }
  out.push(`<circle cx="${lx + 11}" cy="${ly}" r="3" fill="white" stroke="#333"/><text x="${lx + 28}" y="${ly}" dominant-baseline="middle">not converged</text>`);
  out.push(`</svg>`);
  return `${out.join("\n")}\n`;
}
