/**
 * resampleNodes.ts and the picture of a case solved on a smaller window (fieldSvg.ts). Expected
 * values are identities: bilinear interpolation reproduces a bilinear field exactly; nodes outside
 * the source grid's interior have no data (NaN), which the picture draws grey, never as "NaN".
 */
import { describe, expect, it } from "vitest";
import type { FdfdGrid } from "../../src/verify/fdfdGrid.js";
import { fieldSvg } from "../../src/verify/fieldSvg.js";
import { resampleNodes } from "../../src/verify/resampleNodes.js";

describe("resampleNodes", () => {
  it("reproduces a bilinear field exactly inside the source interior and marks the rest as no data", () => {
    const from: FdfdGrid = { nx: 41, ny: 31, h: 0.1, x0: -2, y0: -1.5, pml: 5 };
    const to: FdfdGrid = { nx: 60, ny: 60, h: 0.07, x0: -2.1, y0: -2.1, pml: 3 };
    const f = (x: number, y: number): number => 1 + 2 * x - 0.5 * y + 0.25 * x * y;
    const v = new Float64Array(from.nx * from.ny);
    for (let j = 0; j < from.ny; j++) for (let i = 0; i < from.nx; i++) v[i + from.nx * j] = f(from.x0 + i * from.h, from.y0 + j * from.h);
    const out = resampleNodes(from, v, to);
    let inside = 0, outside = 0;
    for (let j = 0; j < to.ny; j++) for (let i = 0; i < to.nx; i++) {
      const x = to.x0 + i * to.h, y = to.y0 + j * to.h, k = i + to.nx * j;
      const inInterior = x >= from.x0 + from.pml * from.h && x <= from.x0 + (from.nx - 1 - from.pml) * from.h - 1e-9 && y >= from.y0 + from.pml * from.h && y <= from.y0 + (from.ny - 1 - from.pml) * from.h - 1e-9;
      if (Number.isNaN(out[k])) { outside++; expect(inInterior, `(${x}, ${y}) has no data`).toBe(false); continue; }
      inside++;
      expect(Math.abs(out[k] - f(x, y))).toBeLessThan(1e-12);
    }
    expect(inside).toBeGreaterThan(0);
    expect(outside).toBeGreaterThan(0);
    const svg = fieldSvg(to, [{ title: "drawn", magnitude: out.map((x) => Math.abs(x)) }], new Uint8Array(to.nx * to.ny));
    expect(svg).not.toMatch(/NaN/);
    expect(svg).toContain("#d9d9d9");
  });
});
