import { describe, it, expect } from "vitest";
import fc from "fast-check";
import {
  binOf,
  cellUnderCursor,
  chooseLayout,
  continuousScaleOf,
  heatMapText,
  latticeLookup,
  legendOf,
  moveCursor,
  renderHeatMap,
  VALUE_GLYPHS,
  MISSING_GLYPH,
  CONSTANT_GLYPH,
  CONSTANT_COLOUR,
  CURSOR_GLYPH,
  type MapLattice,
} from "../../../src/tui/state/heatMap.js";

/** Full nx × ny lattice, cells listed row-major (j, then i). */
function fullLattice(nx: number, ny: number): MapLattice {
  const i = new Int32Array(nx * ny);
  const j = new Int32Array(nx * ny);
  for (let c = 0; c < nx * ny; c++) {
    i[c] = c % nx;
    j[c] = Math.floor(c / nx);
  }
  return { nx, ny, count: nx * ny, i, j };
}

describe("chooseLayout", () => {
  it("uses two characters per cell when the lattice fits", () => {
    expect(chooseLayout(10, 5, 80, 20)).toEqual({ cellWidth: 2, blockX: 1, blockY: 1, cols: 10, rows: 5 });
  });
  it("falls back to one character per cell with blocks twice as tall", () => {
    // 60 cells wide do not fit at 2 chars in 80 columns; at 1 char, 40 rows need blocks 2 tall
    expect(chooseLayout(60, 40, 80, 20)).toEqual({ cellWidth: 1, blockX: 1, blockY: 2, cols: 60, rows: 20 });
  });
  it("always fits the space it is given (property)", () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 2000 }), fc.integer({ min: 1, max: 2000 }), fc.integer({ min: 4, max: 300 }), fc.integer({ min: 2, max: 100 }), (nx, ny, w, h) => {
        const l = chooseLayout(nx, ny, w, h);
        expect(l.cols * l.cellWidth).toBeLessThanOrEqual(w);
        expect(l.rows).toBeLessThanOrEqual(h);
        expect(l.cols).toBe(Math.ceil(nx / l.blockX));
        expect(l.rows).toBe(Math.ceil(ny / l.blockY));
        // aspect kept: a map cell covers blockX/cellWidth lattice cells per character width and blockY per two
        expect(l.blockY * l.cellWidth).toBe(2 * l.blockX);
      }),
      { seed: 42, numRuns: 200 },
    );
  });
});

describe("scale and bins", () => {
  it("puts the minimum in the first bin and the maximum in the last", () => {
    const s = continuousScaleOf([2, 3, 4, NaN, 10]);
    if (s.kind !== "continuous") throw new Error("expected continuous");
    expect(s.min).toBe(2);
    expect(s.max).toBe(10);
    expect(s.log).toBe(false);
    expect(binOf(s, 2)).toBe(0);
    expect(binOf(s, 10)).toBe(VALUE_GLYPHS.length - 1);
    expect(binOf(s, NaN)).toBe(-1);
    // (6 − 2)/(10 − 2) = 0.5 → bin floor(0.5·8) = 4
    expect(binOf(s, 6)).toBe(4);
  });
  it("switches to a log scale over a wide positive span", () => {
    const s = continuousScaleOf([0.01, 100]);
    expect(s.kind === "continuous" && s.log).toBe(true);
    // log10 midpoint of 1e-2 … 1e2 is 1 → bin 4 of 8
    if (s.kind === "continuous") expect(binOf(s, 1)).toBe(4);
  });
  it("calls a field constant when its spread is floating-point noise, and draws it as one flat fill", () => {
    expect(continuousScaleOf([3, 3, 3])).toEqual({ kind: "constant", value: 3 });
    expect(continuousScaleOf([0, 0, NaN])).toEqual({ kind: "constant", value: 0 });
    // 2.2 built up from sums differs from 2.2 in the last bits: still constant, not noise in 8 bins
    const noisy = [2.2, 0.1 + 0.1 + 2, 2.2 * (1 + 4e-16), 2.2 * (1 - 3e-16)];
    const s = continuousScaleOf(noisy);
    expect(s.kind).toBe("constant");
    // a real spread of one part in 1e4 keeps the ramp
    expect(continuousScaleOf([2.2, 2.2 * (1 + 1e-4)]).kind).toBe("continuous");
    const lattice = fullLattice(4, 1);
    const view = renderHeatMap(lattice, noisy, s, "mean", chooseLayout(4, 1, 80, 5), null);
    expect(heatMapText(view)).toEqual([CONSTANT_GLYPH.repeat(8)]);
    expect(view.legend).toEqual([{ glyph: CONSTANT_GLYPH, colour: CONSTANT_COLOUR, label: "constant 2.20" }]);
  });
  it("legend lists every glyph with a numeric range, and the missing glyph when needed", () => {
    const legend = legendOf({ kind: "continuous", min: 0, max: 8, log: false }, true);
    expect(legend.map((e) => e.glyph)).toEqual([...VALUE_GLYPHS, MISSING_GLYPH]);
    expect(legend[0].label).toBe("0 – 1.00");
    expect(legend[7].label).toBe("7.00 – 8.00");
    expect(legend[8].label).toBe("no value");
    const compact = legendOf({ kind: "continuous", min: 0, max: 8, log: false }, false, { compact: true, format: (v) => v.toFixed(1) });
    expect(compact.map((e) => e.label)).toEqual(["0.0", "1.0", "2.0", "3.0", "4.0", "5.0", "6.0", "7.0 – 8.0"]);
  });
});

describe("renderHeatMap", () => {
  it("draws one glyph pair per cell, top row = largest y, outside cells blank", () => {
    // 3 × 2 lattice, device = all but the top-right cell; value = i
    const full = fullLattice(3, 2);
    const keep = [0, 1, 2, 3, 4];
    const lattice: MapLattice = { nx: 3, ny: 2, count: 5, i: keep.map((c) => full.i[c]), j: keep.map((c) => full.j[c]) };
    const values = keep.map((c) => full.i[c]);
    const scale = { kind: "continuous" as const, min: 0, max: 2, log: false };
    const view = renderHeatMap(lattice, values, scale, "mean", chooseLayout(3, 2, 80, 10), null);
    // values 0, 1, 2 → bins 0, 4, 7 = glyphs ·, +, @
    expect(heatMapText(view)).toEqual(["··++  ", "··++@@"]);
    expect(view.cursorCell).toBeNull();
  });

  it("summarises blocks by mean, max or mode when downsampling", () => {
    const lattice = fullLattice(4, 4);
    const values = Array.from({ length: 16 }, (_, c) => (c % 4 < 2 && c < 8 ? 1 : 0)); // bottom-left 2×2 block = 1
    const layout = { cellWidth: 1 as const, blockX: 2, blockY: 2, cols: 2, rows: 2 };
    const cont = { kind: "continuous" as const, min: 0, max: 1, log: false };
    expect(heatMapText(renderHeatMap(lattice, values, cont, "mean", layout, null))).toEqual(["··", "@·"]);
    const mixed = values.slice();
    mixed[0] = 0; // block mean 0.75 → bin 6, block max 1 → bin 7
    expect(heatMapText(renderHeatMap(lattice, mixed, cont, "mean", layout, null))[1]).toBe("#·");
    expect(heatMapText(renderHeatMap(lattice, mixed, cont, "max", layout, null))[1]).toBe("@·");
    const cat = { kind: "categorical" as const, labels: ["a", "b"], glyphs: ["a", "b"] };
    expect(heatMapText(renderHeatMap(lattice, mixed, cat, "mode", layout, null))).toEqual(["aa", "ba"]);
  });

  it("marks missing values and the cursor cell", () => {
    const lattice = fullLattice(2, 1);
    const view = renderHeatMap(lattice, [NaN, 1], { kind: "continuous", min: 0, max: 1, log: false }, "mean", chooseLayout(2, 1, 80, 5), { i: 1, j: 0 });
    // the cursor is a glyph of its own, not only inverse colours
    expect(heatMapText(view)).toEqual([`${MISSING_GLYPH}${MISSING_GLYPH}${CURSOR_GLYPH}${CURSOR_GLYPH}`]);
    expect(view.rows[0].filter((r) => r.inverse).map((r) => r.text)).toEqual([`${CURSOR_GLYPH}${CURSOR_GLYPH}`]);
    expect(view.legend.at(-1)?.glyph).toBe(MISSING_GLYPH);
  });

  it("keeps each row's width equal to cols × cellWidth (property)", () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 120 }), fc.integer({ min: 1, max: 90 }), (nx, ny) => {
        const lattice = fullLattice(nx, ny);
        const values = Array.from({ length: nx * ny }, (_, c) => Math.sin(c));
        const layout = chooseLayout(nx, ny, 60, 20);
        const text = heatMapText(renderHeatMap(lattice, values, continuousScaleOf(values), "mean", layout, { i: 0, j: 0 }));
        expect(text.length).toBe(layout.rows);
        for (const line of text) expect([...line].length).toBe(layout.cols * layout.cellWidth);
      }),
      { seed: 42, numRuns: 200 },
    );
  });
});

describe("cursor", () => {
  it("moves by one map cell, clamped at the edges", () => {
    const lattice = fullLattice(10, 10);
    const layout = { cellWidth: 1 as const, blockX: 2, blockY: 4, cols: 5, rows: 3 };
    let cur = moveCursor(lattice, layout, { i: 0, j: 9 }, 0, 0);
    expect(cur).toEqual({ i: 0, j: 8 });
    cur = moveCursor(lattice, layout, cur, 1, 1);
    expect(cur).toEqual({ i: 2, j: 4 });
    cur = moveCursor(lattice, layout, cur, 99, 99);
    expect(cur.i).toBeLessThan(10);
    expect(cur.j).toBeGreaterThanOrEqual(0);
    cur = moveCursor(lattice, layout, cur, -99, -99);
    expect(cur).toEqual({ i: 0, j: 8 });
  });

  it("finds the device cell under the cursor, or the nearest one of its block", () => {
    // device = the lattice's left column only
    const lattice: MapLattice = { nx: 4, ny: 2, count: 2, i: [0, 0], j: [0, 1] };
    const lookup = latticeLookup(lattice);
    expect(Array.from(lookup)).toEqual([0, -1, -1, -1, 1, -1, -1, -1]);
    const one = { cellWidth: 2 as const, blockX: 1, blockY: 1, cols: 4, rows: 2 };
    expect(cellUnderCursor(lattice, lookup, one, { i: 0, j: 1 })).toBe(1);
    expect(cellUnderCursor(lattice, lookup, one, { i: 3, j: 1 })).toBe(-1);
    const two = { cellWidth: 1 as const, blockX: 2, blockY: 2, cols: 2, rows: 1 };
    expect(cellUnderCursor(lattice, lookup, two, { i: 1, j: 1 })).toBe(1);
    expect(cellUnderCursor(lattice, lookup, two, { i: 1, j: 0 })).toBe(0);
  });
});
