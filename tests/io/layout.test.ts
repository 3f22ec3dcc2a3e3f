/**
 * Layout files read back. DXF: with dxf-parser (a general-purpose npm DXF reader, dev dependency).
 * GDSII: no general-purpose GDSII reader is published on npm, so the file is read here with a
 * record reader written from the published stream format (Calma GDSII Stream Format Manual,
 * release 6.0, 1987: record = uint16 length, record type, data type; 8-byte reals excess-64 base 16),
 * sharing no code with the writer. Both are checked against the build list (one polygon per cell at
 * its position, circle areas πr²) and each level's drawn area fraction against its fill fraction.
 */
import { describe, it, expect, beforeAll } from "vitest";
import { mkdtemp, readFile } from "node:fs/promises";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { parse } from "csv-parse/sync";
import * as dxfParserModule from "dxf-parser";

// the package's CommonJS build exports the class itself; its ES build exports it by name
const DxfParser = ((dxfParserModule as unknown as { DxfParser?: unknown }).DxfParser ?? (dxfParserModule as unknown as { default: unknown }).default) as typeof dxfParserModule.DxfParser;
import { runCli } from "../../src/cli/run.js";
import { bufferIo } from "../../src/cli/cliIo.js";
import { expectClose } from "../helpers/close.js";

/** Independent GDSII reader: boundaries with their layer and points, and the UNITS pair. */
function readGds(buf: Uint8Array): { units: [number, number]; boundaries: { layer: number; xy: number[] }[]; structures: string[] } {
  const v = new DataView(buf.buffer, buf.byteOffset, buf.byteLength);
  const real8 = (o: number): number => {
    const b0 = v.getUint8(o);
    const sign = b0 & 0x80 ? -1 : 1;
    const exp = (b0 & 0x7f) - 64;
    let m = 0;
    for (let k = 1; k < 8; k++) m = m * 256 + v.getUint8(o + k);
    return sign * (m / 2 ** 56) * 16 ** exp;
  };
  let o = 0;
  let units: [number, number] = [NaN, NaN];
  const boundaries: { layer: number; xy: number[] }[] = [];
  const structures: string[] = [];
  let cur: { layer: number; xy: number[] } | null = null;
  let ended = false;
  while (o < buf.length) {
    const len = v.getUint16(o), type = v.getUint8(o + 2);
    expect(len).toBeGreaterThanOrEqual(4);
    const body = o + 4, end = o + len;
    if (type === 0x03) units = [real8(body), real8(body + 8)];
    else if (type === 0x06) structures.push(new TextDecoder().decode(buf.subarray(body, end)).replace(/\0+$/, ""));
    else if (type === 0x08) cur = { layer: -1, xy: [] };
    else if (type === 0x0d && cur) cur.layer = v.getInt16(body);
    else if (type === 0x10 && cur) for (let p = body; p < end; p += 4) cur.xy.push(v.getInt32(p));
    else if (type === 0x11 && cur) { boundaries.push(cur); cur = null; }
    else if (type === 0x04) ended = true;
    o = end;
  }
  expect(ended).toBe(true);
  return { units, boundaries, structures };
}

function shoelace(xy: number[]): number {
  let s = 0;
  const n = xy.length / 2;
  for (let k = 0; k < n; k++) { const j = (k + 1) % n; s += xy[2 * k] * xy[2 * j + 1] - xy[2 * j] * xy[2 * k + 1]; }
  return Math.abs(s) / 2;
}

function centroid(xy: number[]): [number, number] {
  // vertex mean: exact for the regular polygons and rectangles the writer draws
  let x = 0, y = 0;
  const n = xy.length / 2;
  for (let k = 0; k < n; k++) { x += xy[2 * k]; y += xy[2 * k + 1]; }
  return [x / n, y / n];
}

async function planWithLayout(design: string, extra: string[] = []): Promise<{ out: string; rows: Record<string, string>[]; levels: Record<string, string>[]; code: number; err: string }> {
  const out = await mkdtemp(join(tmpdir(), "cw-layout-"));
  const io = bufferIo();
  const code = await runCli(["plan", design, "--out", out, "--layout", "--json", ...extra], io);
  const rows: Record<string, string>[] = parse(await readFile(join(out, "build-list.csv"), "utf8"), { columns: true });
  const levels: Record<string, string>[] = parse(await readFile(join(out, "levels.csv"), "utf8"), { columns: true });
  return { out, rows, levels, code, err: io.err() };
}

describe("GDSII layout of the silicon chip bend (electron-beam lithography)", () => {
  let r: Awaited<ReturnType<typeof planWithLayout>>;
  beforeAll(async () => { r = await planWithLayout("demo-designs/plan-silicon-chip-bend.json"); }, 120_000);

  it("one 64-vertex hole per cell on its level's layer, at the build list's position, of area πr²", async () => {
    const gds = readGds(new Uint8Array(await readFile(join(r.out, "layout.gds"))));
    // database unit 1 nm, user unit 1 µm (manual: UNITS = db in user units, db in metres)
    expectClose(gds.units[0], 1e-3, { rel: 1e-12, label: "db unit in user units" });
    expectClose(gds.units[1], 1e-9, { rel: 1e-12, label: "db unit in metres" });
    expect(gds.structures).toEqual(["DEVICE"]);
    const drawn = r.rows.filter((x) => x.family === "holes-in-slab");
    expect(drawn.length).toBeGreaterThan(0);
    expect(gds.boundaries.length).toBe(drawn.length);
    // boundaries come in level order, cells in build-list order within a level
    const byLevel = new Map<number, Record<string, string>[]>();
    for (const row of drawn) byLevel.set(Number(row.level), [...(byLevel.get(Number(row.level)) ?? []), row]);
    let b = 0;
    for (const [level, cells] of [...byLevel].sort((x, y) => x[0] - y[0])) {
      let drawnArea = 0;
      let smallestRadiusNm = Infinity;
      for (const row of cells) {
        const poly = gds.boundaries[b++];
        expect(poly.layer).toBe(level);
        expect(poly.xy.length).toBe(2 * 65); // 64 vertices, closed by repeating the first
        expect(poly.xy.slice(0, 2)).toEqual(poly.xy.slice(-2));
        const xy = poly.xy.slice(0, -2);
        const [cx, cy] = centroid(xy);
        expectClose(cx / 1000, Number(row.x_um), { abs: 2e-3, label: `x of cell ${row.cell}` }); // nm → µm
        expectClose(cy / 1000, Number(row.y_um), { abs: 2e-3, label: `y of cell ${row.cell}` });
        const area = shoelace(xy); // nm²
        const rUm = Number(row.radius_um);
        // vertices are rounded to the 1 nm database unit: on a ~30 nm hole each moves ≤ 0.5 nm,
        // which bounds the area error by about 2·0.5/30 ≈ 3 % (1 % is what the rounding gives here)
        // the bound itself, relative: 2·0.5 nm / r
        expectClose(area, Math.PI * (rUm * 1000) ** 2, { rel: 1 / (rUm * 1000), label: `hole area of cell ${row.cell}` });
        smallestRadiusNm = Math.min(smallestRadiusNm, rUm * 1000);
        drawnArea += area;
      }
      // drawn fraction of the level's cells against its fill fraction; hex recipes on the square
      // device grid: fill × √3/2 (the hexagonal cell is √3/2 of a²)
      const lv = r.levels.find((x) => Number(x.level) === level)!;
      const a = 100; // nm, the demo's pitch
      const factor = lv.lattice === "hex" ? Math.sqrt(3) / 2 : 1;
      expectClose(drawnArea / (cells.length * a * a), Number(lv.fill_fraction) * factor, { rel: 1 / smallestRadiusNm, label: `level ${level} area fraction` }); // the same 1 nm vertex rounding bound, at the level's smallest hole
    }
    expect(b).toBe(gds.boundaries.length);
  });
});

describe("DXF layout (read with dxf-parser)", () => {
  it("closed polylines in mm, one layer per level, one per cell, fractions equal to fill", async () => {
    // the golden small bend has strut lattices (3D): not drawable in 2D; a laminate/rod design is
    const r = await planWithLayout("tests/io/layout-fixtures/rods-plate.json");
    expect(r.err).not.toContain("Error");
    const dxf = new DxfParser().parseSync(await readFile(join(r.out, "layout.dxf"), "utf8"))!;
    expect(dxf.header.$INSUNITS).toBe(4); // 4 = millimetres (DXF reference, header variables)
    const polys = dxf.entities.filter((e: { type: string }) => e.type === "LWPOLYLINE") as unknown as { layer: string; shape: boolean; vertices: { x: number; y: number }[] }[];
    const drawn = r.rows.filter((x) => x.family !== "" && x.family !== "solid");
    expect(drawn.length).toBeGreaterThan(0);
    expect(polys.length).toBe(drawn.length);
    const layers = new Set(polys.map((p) => p.layer));
    expect([...layers].sort()).toEqual([...new Set(drawn.map((x) => `LEVEL_${x.level}`))].sort());
    const pitchMm = 2; // the fixture's pitch
    const areaByLevel = new Map<string, { area: number; cells: number }>();
    for (const p of polys) {
      expect(p.shape).toBe(true); // closed
      const xy = p.vertices.flatMap((q) => [q.x, q.y]);
      const [cx, cy] = centroid(xy);
      const row = drawn.find((x) => Math.abs(Number(x.x_mm) - cx) < 1e-3 && Math.abs(Number(x.y_mm) - cy) < 1e-3);
      expect(row, `a cell at (${cx}, ${cy})`).toBeDefined();
      expect(`LEVEL_${row!.level}`).toBe(p.layer);
      const a = areaByLevel.get(p.layer) ?? { area: 0, cells: 0 };
      a.area += shoelace(xy);
      a.cells++;
      areaByLevel.set(p.layer, a);
    }
    for (const [layer, a] of areaByLevel) {
      const lv = r.levels.find((x) => `LEVEL_${x.level}` === layer)!;
      const factor = lv.lattice === "hex" ? Math.sqrt(3) / 2 : 1;
      expectClose(a.area / (a.cells * pitchMm * pitchMm), Number(lv.fill_fraction) * factor, { rel: 1e-6, label: `${layer} area fraction` });
    }
  }, 120_000);
});
