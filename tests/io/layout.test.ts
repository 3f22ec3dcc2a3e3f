/**
 * Layout files read back. DXF: with dxf-parser (a general-purpose npm DXF reader, dev dependency).
 * GDSII: no general-purpose GDSII reader is published on npm, so the file is read here with a
 * record reader written from the published stream format (Calma GDSII Stream Format Manual,
 * release 6.0, 1987: record = uint16 length, record type, data type; 8-byte reals excess-64 base 16),
 * sharing no code with the writer. Both are checked against the build list (square-lattice levels:
 * one polygon per cell at its position; hexagonal-lattice levels: one polygon per built site of the
 * hexagonal lattice, src/plan/layout/hexSites.ts; circle areas πr²) and each level's drawn area
 * fraction against its fill fraction. Hexagonal layouts are also checked against each other (GDSII
 * and DXF) and against the drawn full-wave case's sites (verify's realized-geometry scene).
 */
import { describe, it, expect, beforeAll } from "vitest";
import { readFile } from "node:fs/promises";
import { join } from "node:path";
import { parse } from "csv-parse/sync";
import * as dxfParserModule from "dxf-parser";

// the package's CommonJS build exports the class itself; its ES build exports it by name
const DxfParser = ((dxfParserModule as unknown as { DxfParser?: unknown }).DxfParser ?? (dxfParserModule as unknown as { default: unknown }).default) as typeof dxfParserModule.DxfParser;
import { runCli } from "../../src/cli/run.js";
import { bufferIo } from "../../src/cli/cliIo.js";
import { expectClose } from "../helpers/close.js";
import { loadDesign } from "../../src/io/design/loadDesign.js";
import { loadFieldForDesign } from "../../src/io/fieldCsv.js";
import { loadMaterialCatalog } from "../../src/io/materialCatalog.js";
import { loadProcessCatalog } from "../../src/io/processCatalog.js";
import { planFromField } from "../../src/plan/runPlan.js";
import { bulkMaterials } from "../../src/verify/bulkMaterials.js";
import { geometryScene } from "../../src/verify/geometryScene.js";
import { tempDir } from "../helpers/tempDir.js";

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
  const out = tempDir("cw-layout-");
  const io = bufferIo();
  const code = await runCli(["plan", design, "--out", out, "--layout", "--json", ...extra], io);
  const rows: Record<string, string>[] = parse(await readFile(join(out, "build-list.csv"), "utf8"), { columns: true });
  const levels: Record<string, string>[] = parse(await readFile(join(out, "levels.csv"), "utf8"), { columns: true });
  return { out, rows, levels, code, err: io.err() };
}

/**
 * Checks of a hexagonal-lattice layout against the build list, sharing no code with the planner:
 * every polygon's centre lies on one hexagonal lattice of the pitch through the grid's centre (the
 * middle of the build list's i, j ranges), on the layer of the cell containing it (a centre on a
 * cell edge: the cell nearer the grid's centre line); no two overlap (centres a pitch apart or
 * more, radii below a/2), with walls no thinner than their recipes'; and each one's share — the points within a/2 of its centre, or for rods in
 * air toward the outside of the device its own radius — lies in cells of the same kind. Returns per
 * level the polygons' area and count, and the narrowest wall between neighbours. Lengths in the file's unit (`unit` per metre).
 */
function checkHexPolygons(polys: { layer: number; xy: number[] }[], rows: Record<string, string>[], aM: number, unit: number, tolerance: number): { perLevel: Map<number, { area: number; count: number }>; narrowestWall: number } {
  const a = aM * unit, h = (Math.sqrt(3) / 2) * a;
  const col = Object.keys(rows[0]).find((k) => k.startsWith("x_"))!, colY = col.replace("x_", "y_");
  const scale = unit / (col.endsWith("_um") ? 1e6 : 1e3); // build-list unit → file unit
  const byIJ = new Map(rows.map((r) => [`${r.i},${r.j}`, r]));
  const is = rows.map((r) => Number(r.i)), js = rows.map((r) => Number(r.j));
  const r0 = rows[0];
  const x0 = Number(r0[col]) * scale - Number(r0.i) * a, y0 = Number(r0[colY]) * scale - Number(r0.j) * a; // centre of cell (0, 0)
  const ci = (Math.min(...is) + Math.max(...is)) / 2, cj = (Math.min(...js) + Math.max(...js)) / 2;
  const xc = x0 + ci * a, yc = y0 + cj * a; // the grid's centre
  const kind = (r: Record<string, string> | undefined): string => (r ? `${r.family}|${r.host}|${r.inclusion}|${r.lattice}` : "outside");
  const cellOf = (x: number, y: number): Record<string, string> | undefined => byIJ.get(`${Math.round((x - x0) / a)},${Math.round((y - y0) / a)}`);
  const out = new Map<number, { area: number; count: number }>();
  const centres: [number, number][] = [];
  for (const p of polys) {
    const [cx, cy] = centroid(p.xy);
    centres.push([cx, cy]);
    // on the lattice: y = yc + m·h, x = xc + (n + (m mod 2)/2)·a
    const m = Math.round((cy - yc) / h), u = (cx - xc) / a - (((m % 2) + 2) % 2) / 2;
    expect(Math.abs(cy - yc - m * h), `row of (${cx}, ${cy})`).toBeLessThan(tolerance);
    expect(Math.abs(u - Math.round(u)) * a, `column of (${cx}, ${cy})`).toBeLessThan(tolerance);
    // the cell containing the centre (edge: toward the grid's centre line; on it: the lower cell)
    let fi = (cx - x0) / a;
    if (Math.abs(Math.abs(fi - Math.floor(fi)) - 0.5) * a < tolerance) {
      const lo = Math.floor(fi), hi = lo + 1;
      fi = Math.abs(hi - ci) < Math.abs(lo - ci) ? hi : lo;
    }
    let fj = (cy - y0) / a;
    if (Math.abs(Math.abs(fj - Math.floor(fj)) - 0.5) * a < tolerance) fj = Math.floor(fj);
    const row = byIJ.get(`${Math.round(fi)},${Math.round(fj)}`);
    expect(row, `a device cell under (${cx}, ${cy})`).toBeDefined();
    expect(p.layer, `layer of the site at (${cx}, ${cy})`).toBe(Number(row!.level));
    // the share inside cells of its kind (points just inside the share's circle, and every vertex)
    const rFile = Number(row![Object.keys(row!).find((k) => k.startsWith("radius_"))!]) * scale;
    const free = row!.host === "air" || row!.host === "vacuum";
    for (let k = 0; k < 64; k++) {
      const t = (2 * Math.PI * k) / 64;
      for (const rad of [0.5 * a * (1 - 1e-6), rFile]) {
        const c = cellOf(cx + rad * Math.cos(t), cy + rad * Math.sin(t));
        if (!c && free && rad > rFile) continue; // free rods: only the rod must stay inside the outline
        expect(kind(c), `share of (${cx}, ${cy}) at ${t.toFixed(2)} rad`).toBe(kind(row));
      }
    }
    for (let k = 0; k < p.xy.length; k += 2) expect(kind(cellOf(p.xy[k], p.xy[k + 1])), "a vertex inside its kind's cells").toBe(kind(row));
    const e = out.get(p.layer) ?? { area: 0, count: 0 };
    e.area += shoelace(p.xy); e.count++;
    out.set(p.layer, e);
  }
  // no overlap: every pair of centres at least a pitch apart (radii below a/2), by sorting on x;
  // and the wall between neighbours as placed (centre distance − both radii, radii from the
  // polygons' areas) is at least the thinner of their recipes' own walls a − 2r — the walls the
  // process check passed (levels.csv smallest_feature)
  const radii = polys.map((p) => Math.sqrt(shoelace(p.xy) / Math.PI));
  const order = centres.map((_, k) => k).sort((p, q) => centres[p][0] - centres[q][0]);
  let narrowest = Infinity;
  for (let s = 0; s < order.length; s++) {
    const k = order[s];
    for (let t = s + 1; t < order.length && centres[order[t]][0] - centres[k][0] <= a + tolerance; t++) {
      const o = order[t];
      const d = Math.hypot(centres[o][0] - centres[k][0], centres[o][1] - centres[k][1]);
      expect(d, "distance between two sites").toBeGreaterThan(a - 2 * tolerance);
      if (d > a + 2 * tolerance) continue;
      const wall = d - radii[k] - radii[o];
      expect(wall, `wall between sites at (${centres[k]}) and (${centres[o]})`).toBeGreaterThanOrEqual(Math.min(a - 2 * radii[k], a - 2 * radii[o]) - 4 * tolerance);
      narrowest = Math.min(narrowest, wall);
    }
  }
  return { perLevel: out, narrowestWall: narrowest };
}

describe("GDSII layout of the silicon chip bend (electron-beam lithography, hexagonal holes)", () => {
  let r: Awaited<ReturnType<typeof planWithLayout>>;
  beforeAll(async () => { r = await planWithLayout("demo-designs/plan-silicon-chip-bend.json"); }, 120_000);

  it("64-vertex holes of area πr² on the built hexagonal sites, on the level of the cell containing each, inside their kind's cells", async () => {
    const gds = readGds(new Uint8Array(await readFile(join(r.out, "layout.gds"))));
    // database unit 1 nm, user unit 1 µm (manual: UNITS = db in user units, db in metres)
    expectClose(gds.units[0], 1e-3, { rel: 1e-12, label: "db unit in user units" });
    expectClose(gds.units[1], 1e-9, { rel: 1e-12, label: "db unit in metres" });
    expect(gds.structures).toEqual(["DEVICE"]);
    const drawn = r.rows.filter((x) => x.family === "holes-in-slab");
    expect(drawn.length).toBeGreaterThan(0);
    expect(drawn.every((x) => x.lattice === "hex")).toBe(true);
    const polys = gds.boundaries.map((b) => {
      expect(b.xy.length).toBe(2 * 65); // 64 vertices, closed by repeating the first
      expect(b.xy.slice(0, 2)).toEqual(b.xy.slice(-2));
      return { layer: b.layer, xy: b.xy.slice(0, -2) };
    });
    // positions in nm, rounded to the 1 nm database unit: centres within 1 nm of the lattice
    const a = 100; // nm, the demo's pitch
    const { perLevel, narrowestWall: narrowest } = checkHexPolygons(polys, r.rows, 100e-9, 1e9, 1);
    // the sites built and left out, as stderr reports them, add up to the lattice's sites in the
    // level's cells: about 2/√3 per cell (site density 2/(√3 a²)), give or take the region's edge
    const note = /sites left out[^:]*: (.*)/.exec(r.err);
    const left = new Map<number, [number, number]>();
    for (const m of (note?.[1] ?? "").matchAll(/level (\d+): (\d+) of (\d+)/g)) left.set(Number(m[1]), [Number(m[2]), Number(m[3])]);
    for (const [level, e] of perLevel) {
      const lv = r.levels.find((x) => Number(x.level) === level)!;
      const rUm = Number(lv.radius_um), rNm = rUm * 1000;
      // every hole of the level has area πr² (1 nm vertex rounding: relative bound 2·0.5 nm / r)
      expectClose(e.area / e.count, Math.PI * rNm * rNm, { rel: 1 / rNm, label: `mean hole area of level ${level}` });
      // identity: over the built sites' own area (√3/2)·a² each, the drawn fraction is the fill
      expectClose(e.area / (e.count * (Math.sqrt(3) / 2) * a * a), Number(lv.fill_fraction), { rel: 1 / rNm, label: `level ${level} area fraction over its sites` });
      const cells = Number(lv.cells);
      const [dropped, all] = left.get(level) ?? [0, e.count];
      expect(all - dropped).toBe(e.count);
      expect(Math.abs(all - (2 / Math.sqrt(3)) * cells), `level ${level}: ${all} sites in ${cells} cells`).toBeLessThan(Math.max(4, 2 * Math.sqrt(cells)));
    }
    expect([...perLevel.values()].reduce((s, e) => s + e.count, 0)).toBe(gds.boundaries.length);
    // process check as placed: the narrowest wall between two holes is no thinner than the thinnest
    // feature a level's recipe has (levels.csv smallest_feature, which passed the process check),
    // and not below the electron-beam process's 20 nm (catalogs/processes.csv), 2 nm of rounding aside
    const smallest = Math.min(...r.levels.map((lv) => Number(lv.smallest_feature_um) * 1000));
    expect(narrowest).toBeGreaterThanOrEqual(smallest - 2);
    expect(narrowest).toBeGreaterThanOrEqual(20 - 2);
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

describe("hexagonal rods over a uniform block: GDSII, DXF and the drawn full-wave case agree site for site", () => {
  const DESIGN = "tests/io/layout-fixtures/hex-rods-block.json";
  let r: Awaited<ReturnType<typeof planWithLayout>>;
  beforeAll(async () => { r = await planWithLayout(DESIGN); }, 120_000);

  it("the drawn area fraction is the recipe's fill over the built sites, and the edge effect is the sites the outline leaves out", async () => {
    expect(r.levels.length).toBe(1);
    const lv = r.levels[0];
    expect(lv.lattice).toBe("hex");
    const fill = Number(lv.fill_fraction), rMm = Number(lv.radius_mm), a = 2; // mm, the fixture's pitch
    const gds = readGds(new Uint8Array(await readFile(join(r.out, "layout.gds"))));
    const gdsPolys = gds.boundaries.map((b) => ({ layer: b.layer, xy: b.xy.slice(0, -2).map((v) => v / 1e6) })); // nm → mm
    const dxf = new DxfParser().parseSync(await readFile(join(r.out, "layout.dxf"), "utf8"))!;
    const dxfPolys = (dxf.entities as unknown as { layer: string; vertices: { x: number; y: number }[] }[]).map((e) => ({ layer: Number(e.layer.replace("LEVEL_", "")), xy: e.vertices.flatMap((q) => [q.x, q.y]) }));
    // GDSII (1 nm grid) and DXF (floating mm) hold the same sites on the same layers
    expect(dxfPolys.length).toBe(gdsPolys.length);
    const fix = (v: number): string => (Math.round(v * 1e4) / 1e4 + 0).toFixed(4); // + 0: no "-0.0000"
    const key = (p: { layer: number; xy: number[] }): string => { const [x, y] = centroid(p.xy); return `${p.layer}:${fix(x)},${fix(y)}`; };
    expect(new Set(dxfPolys.map(key))).toEqual(new Set(gdsPolys.map(key)));
    const per = checkHexPolygons(dxfPolys, r.rows, 2e-3, 1e3, 1e-9).perLevel.get(1)!;
    // The block is 13 × 9 cells of 2 mm, [−13, 13] × [−9, 9] mm, the grid's centre at (0, 0). Rods
    // in air need only themselves inside the outline: the built sites are the lattice points
    // (2n + (m mod 2), √3·m) mm with |x| ≤ 13 − r, |y| ≤ 9 − r, counted here by rows (independent of
    // the planner): 9 rows (|m| ≤ 4), 13 sites on even rows, 12 on odd rows.
    let expected = 0;
    for (let m = -10; m <= 10; m++) for (let n = -10; n <= 10; n++) {
      const x = 2 * n + (((m % 2) + 2) % 2), y = Math.sqrt(3) * m;
      if (Math.abs(x) <= 13 - rMm && Math.abs(y) <= 9 - rMm) expected++;
    }
    expect(expected).toBe(5 * 13 + 4 * 12);
    expect(per.count).toBe(expected);
    // identity: each built site owns (√3/2)·a² (site density 2/(√3 a²)), so over the built sites the
    // drawn fraction is the fill (equal-area 64-gons; levels.csv prints the fill to 6 digits)
    const siteArea = (Math.sqrt(3) / 2) * a * a;
    expectClose(per.area / (per.count * siteArea), fill, { rel: 2e-6, label: "drawn fraction over the built sites" });
    // over the block (26 × 18 mm): fill × the share of the block the built sites own. That share
    // is the edge effect: 113 sites own 391.4 mm² of 468 (the block holds 135.1 sites' worth)
    const blockArea = 26 * 18;
    expectClose(per.area / blockArea, fill * (expected * siteArea) / blockArea, { rel: 2e-6, label: "drawn fraction over the block" });
    expect(per.area / blockArea).toBeLessThan(fill);
    // the stderr note counts the sites left out in the level's cells (their rods would cross the outline)
    const m = /level 1: (\d+) of (\d+)/.exec(r.err);
    expect(m, r.err).not.toBeNull();
    expect(Number(m![2]) - Number(m![1])).toBe(expected);
    // summary.json says the same
    const summary = JSON.parse(await readFile(join(r.out, "summary.json"), "utf8"));
    expect(summary.hexSites).toEqual({ built: expected, leftOut: Number(m![1]), levels: [{ level: 1, cells: 117, built: expected, leftOut: Number(m![1]) }] });
  });

  it("the drawn full-wave case (realized-geometry) stands on the same sites: rod material at every site, host at every site left out", async () => {
    const design = await loadDesign(DESIGN);
    const [field, materials, processes] = await Promise.all([loadFieldForDesign(design), loadMaterialCatalog(), loadProcessCatalog()]);
    const plan = planFromField(design, field, { materials, processes }, {});
    const bulk = bulkMaterials(materials, design.frequencyHz, plan);
    const d = geometryScene({ plan, materials: bulk, polarization: "Hz", background: { eps: 1, mu: 1 }, hidden: null });
    if (!d.ok) throw new Error(d.reason);
    const gds = readGds(new Uint8Array(await readFile(join(r.out, "layout.gds"))));
    const sites = new Set<string>();
    const out = new Float64Array(8);
    const rM = Number(r.levels[0].radius_mm) * 1e-3;
    const alumina = bulk.get("alumina-96")!.eps.re, air = bulk.get("air")!.eps.re;
    for (const b of gds.boundaries) {
      const [x, y] = centroid(b.xy.slice(0, -2)).map((v) => v * 1e-9); // nm → m
      sites.add(`${Math.round(x * 1e6)},${Math.round(y * 1e6)}`);
      // Hz samples T = ε·I: the rod's ε at the centre and just inside the rim, air just outside
      d.scene.sample(x, y, out);
      expect(out[2]).toBe(alumina);
      d.scene.sample(x + 0.99 * rM, y, out);
      expect(out[2]).toBe(alumina);
      d.scene.sample(x + 1.01 * rM, y, out);
      expect(out[2]).toBe(air);
    }
    // every other lattice point inside the block is a site left out: air there in the drawn case
    let leftOut = 0;
    for (let m = -10; m <= 10; m++) for (let n = -10; n <= 10; n++) {
      const x = (2 * n + (((m % 2) + 2) % 2)) * 1e-3, y = Math.sqrt(3) * m * 1e-3;
      if (Math.abs(x) >= 13e-3 || Math.abs(y) >= 9e-3 || sites.has(`${Math.round(x * 1e6)},${Math.round(y * 1e6)}`)) continue;
      leftOut++;
      d.scene.sample(x, y, out);
      expect(out[2], `left-out site (${x}, ${y})`).toBe(air);
    }
    expect(leftOut).toBeGreaterThan(0);
    expect(d.notes.join(" ")).toMatch(new RegExp(`\\(${gds.boundaries.length} sites built`));
  }, 60_000);
});
