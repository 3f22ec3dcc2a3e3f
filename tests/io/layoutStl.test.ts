/**
 * The printed part (layout.stl) read back with @amandaghassaei/stl-parser (a general-purpose npm
 * STL reader, dev dependency), checked against the build list: the triangle count each shape and
 * face must give, the bounding box of the device's cells and height, watertightness (after merging
 * equal vertices every edge is used by exactly two triangles, once in each direction: a closed,
 * consistently oriented surface), a positive enclosed volume, and each level's printed volume
 * fraction against its fill fraction. Volumes come from the divergence theorem with F = (0, 0, z):
 * V = Σ z̄·A_xy over the triangles (A_xy the signed area of the triangle's projection), which also
 * gives the volume inside any vertical prism from the triangles inside it (the prism's walls have
 * n_z = 0), so each cell column's printed volume is the sum over the triangles above its square.
 */
import { describe, it, expect, beforeAll } from "vitest";
import { readFile, writeFile } from "node:fs/promises";
import { join } from "node:path";
import { parse } from "csv-parse/sync";
import { parseSTL } from "@amandaghassaei/stl-parser";
import { runCli } from "../../src/cli/run.js";
import { bufferIo } from "../../src/cli/cliIo.js";
import { expectClose } from "../helpers/close.js";
import { loadDesign } from "../../src/io/design/loadDesign.js";
import { loadFieldForDesign } from "../../src/io/fieldCsv.js";
import { loadMaterialCatalog } from "../../src/io/materialCatalog.js";
import { loadProcessCatalog } from "../../src/io/processCatalog.js";
import { planFromField } from "../../src/plan/runPlan.js";
import { equalAreaRadius, printedPart } from "../../src/plan/layout/printedPart.js";
import { planLayout } from "../../src/plan/layout/layoutShapes.js";
import { rectTiling } from "../../src/cells/lattice.js";
import { stlChunks } from "../../src/io/layout/stlWriter.js";
import type { Plan, Recipe } from "../../src/plan/planTypes.js";
import { tempDir } from "../helpers/tempDir.js";

type Row = Record<string, string>;

interface Analysis {
  triangles: number;
  headerCount: number;
  min: number[];
  max: number[];
  badEdges: number;
  unpairedDirected: number;
  volumeMm3: number;
  /** printed volume per cell column, keyed "i,j" of the cell square the triangle lies over */
  columnMm3: Map<string, number>;
}

/** Read an STL with the independent parser and measure it (pitch and lattice origin in mm). */
function analyse(buf: Buffer, pitchMm: number, x0Mm: number, y0Mm: number): Analysis {
  const raw = parseSTL(buf);
  // as read: three vertices per triangle, not indexed
  const v = Float64Array.from(raw.vertices);
  const n = v.length / 9;
  const headerCount = buf.readUInt32LE(80);
  let volume = 0;
  const columnMm3 = new Map<string, number>();
  for (let t = 0; t < n; t++) {
    const a = 9 * t, b = a + 3, c = a + 6;
    const ax = v[a], ay = v[a + 1], az = v[a + 2], bx = v[b], by = v[b + 1], bz = v[b + 2], cx = v[c], cy = v[c + 1], cz = v[c + 2];
    volume += (ax * (by * cz - bz * cy) - ay * (bx * cz - bz * cx) + az * (bx * cy - by * cx)) / 6;
    const axy = ((bx - ax) * (cy - ay) - (by - ay) * (cx - ax)) / 2;
    if (axy === 0) continue;
    const zBar = (az + bz + cz) / 3;
    const i = Math.round(((ax + bx + cx) / 3 - x0Mm) / pitchMm), j = Math.round(((ay + by + cy) / 3 - y0Mm) / pitchMm);
    const key = `${i},${j}`;
    columnMm3.set(key, (columnMm3.get(key) ?? 0) + zBar * axy);
  }
  const merged = raw.mergeVertices();
  const f = merged.facesIndices;
  const undirected = new Map<string, number>();
  const directed = new Set<string>();
  let duplicateDirected = 0;
  for (let t = 0; t < f.length / 3; t++) {
    for (let k = 0; k < 3; k++) {
      const p = f[3 * t + k], q = f[3 * t + ((k + 1) % 3)];
      const key = p < q ? `${p},${q}` : `${q},${p}`;
      undirected.set(key, (undirected.get(key) ?? 0) + 1);
      if (directed.has(`${p},${q}`)) duplicateDirected++;
      directed.add(`${p},${q}`);
    }
  }
  let badEdges = 0;
  for (const c of undirected.values()) if (c !== 2) badEdges++;
  let unpairedDirected = duplicateDirected;
  for (const d of directed) { const [p, q] = d.split(","); if (!directed.has(`${q},${p}`)) unpairedDirected++; }
  return { triangles: n, headerCount, min: [...raw.boundingBox.min], max: [...raw.boundingBox.max], badEdges, unpairedDirected, volumeMm3: volume, columnMm3 };
}

async function planWithLayout(design: string): Promise<{ out: string; rows: Row[]; levels: Row[]; code: number; err: string; summary: Record<string, unknown> }> {
  const out = tempDir("cw-stl-");
  const io = bufferIo();
  const code = await runCli(["plan", design, "--out", out, "--layout", "--json"], io);
  const rows: Row[] = parse(await readFile(join(out, "build-list.csv"), "utf8"), { columns: true });
  const levels: Row[] = parse(await readFile(join(out, "levels.csv"), "utf8"), { columns: true });
  return { out, rows, levels, code, err: io.err(), summary: JSON.parse(io.out()) };
}

/** Lattice indices of the build list's cells (positions are multiples of the pitch from cell (0, 0)). */
function lattice(rows: Row[], pitchMm: number): { x0: number; y0: number; key: (r: Row) => string; byKey: Map<string, Row> } {
  const r0 = rows[0];
  const x0 = Number(r0.x_mm) - Number(r0.i) * pitchMm, y0 = Number(r0.y_mm) - Number(r0.j) * pitchMm;
  const key = (r: Row): string => `${r.i},${r.j}`;
  return { x0, y0, key, byKey: new Map(rows.map((r) => [key(r), r])) };
}

/** Each level's printed volume over its cells' volume (a² × height), from the STL's columns. */
function levelFractions(a: Analysis, rows: Row[], printed: (r: Row) => boolean, pitchMm: number, heightMm: number, key: (r: Row) => string): Map<number, { drawn: number; cells: Row[] }> {
  const out = new Map<number, { drawn: number; cells: Row[] }>();
  for (const r of rows) {
    if (!printed(r)) continue;
    const l = Number(r.level);
    const e = out.get(l) ?? { drawn: 0, cells: [] };
    e.drawn += a.columnMm3.get(key(r)) ?? 0;
    e.cells.push(r);
    out.set(l, e);
  }
  for (const e of out.values()) e.drawn /= e.cells.length * pitchMm * pitchMm * heightMm;
  return out;
}

const NEIGHBOURS = [[1, 0], [-1, 0], [0, 1], [0, -1]];

describe("STL of the printed strut lattice (npm start demo, stereolithography)", () => {
  let r: Awaited<ReturnType<typeof planWithLayout>>;
  beforeAll(async () => { r = await planWithLayout("demo-designs/plan-printed-bend.json"); }, 120_000);

  it("is a closed, consistently oriented surface whose count, box and level fractions match the build list", async () => {
    expect(r.code, r.err).toBe(0);
    expect((r.summary.outputs as string[]).some((p) => p.endsWith("layout.stl"))).toBe(true);
    const pitch = 1.2; // mm, the design's grid.pitch
    const L = lattice(r.rows, pitch);
    const buf = await readFile(join(r.out, "layout.stl"));
    const a = analyse(buf, pitch, L.x0, L.y0);
    expect(a.headerCount).toBe(a.triangles);
    expect(buf.length).toBe(84 + 50 * a.triangles);
    expect(a.badEdges).toBe(0);
    expect(a.unpairedDirected).toBe(0);
    // the design's realization.height, 6 mm: five cells of 1.2 mm
    const layers = 5;
    const heightMm = layers * pitch;
    expectClose(a.max[2], heightMm, { rel: 1e-6, label: "top" });
    expectClose(a.min[2], 0, { abs: 1e-6, label: "bottom" });
    // the struts reach every cell face: the box is the cells' squares
    const xs = r.rows.map((x) => Number(x.x_mm)), ys = r.rows.map((x) => Number(x.y_mm));
    expectClose(a.min[0], Math.min(...xs) - pitch / 2, { abs: 1e-4, label: "x min" });
    expectClose(a.max[0], Math.max(...xs) + pitch / 2, { abs: 1e-4, label: "x max" });
    expectClose(a.min[1], Math.min(...ys) - pitch / 2, { abs: 1e-4, label: "y min" });
    expectClose(a.max[1], Math.max(...ys) + pitch / 2, { abs: 1e-4, label: "y max" });
    // count: each cell and layer 6 arms × 4 sides × 2; a face to a cell of another level a frame
    // of 8; a face to no cell the strut's end, 2; top and bottom ends 2 each
    let expected = 0;
    for (const row of r.rows) {
      expected += layers * 48 + 4;
      for (const [di, dj] of NEIGHBOURS) {
        const nb = L.byKey.get(`${Number(row.i) + di},${Number(row.j) + dj}`);
        if (!nb) expected += 2 * layers;
        else if (di + dj > 0 && nb.level !== row.level) expected += 8 * layers;
      }
    }
    expect(a.triangles).toBe(expected);
    expect(a.volumeMm3).toBeGreaterThan(0);
    // each level's solid fraction against its fill fraction (levels.csv), and against the strut
    // identity f = 3x² − 2x³, x = w/a (three square bars through the node, inclusion–exclusion).
    // Tolerance: widths are rounded to 80 nm (1e-6 of the largest coordinate) and vertices to
    // float32: about 4e-4 relative on the fill at the thinnest strut.
    const fr = levelFractions(a, r.rows, () => true, pitch, heightMm, L.key);
    expect(fr.size).toBe(r.levels.length);
    for (const lv of r.levels) {
      const got = fr.get(Number(lv.level))!;
      expectClose(got.drawn, Number(lv.fill_fraction), { rel: 1e-3, label: `level ${lv.level} printed fraction` });
      const x = Number(got.cells[0].width_mm) / pitch;
      expectClose(got.drawn, 3 * x * x - 2 * x * x * x, { rel: 2e-3, label: `level ${lv.level} strut identity` });
    }
    const total = [...a.columnMm3.values()].reduce((s, x) => s + x, 0);
    expectClose(total, a.volumeMm3, { rel: 1e-6, label: "columns add up to the enclosed volume" });
  });
});

describe("STL of rods and holes along z in a printed part", () => {
  it("resin rods in air: one closed prism per cell, equal in area to the rod", async () => {
    const r = await planWithLayout("tests/io/layout-fixtures/printed-rods.json");
    expect([0, 2]).toContain(r.code);
    const pitch = 1.5;
    const L = lattice(r.rows, pitch);
    const a = analyse(await readFile(join(r.out, "layout.stl")), pitch, L.x0, L.y0);
    expect(a.badEdges).toBe(0);
    expect(a.unpairedDirected).toBe(0);
    const printed = (x: Row): boolean => x.family === "rods-in-host" && x.orientation === "along_z";
    const cells = r.rows.filter(printed);
    expect(cells.length).toBeGreaterThan(0);
    const n = Number(/circles as (\d+)-gons/.exec(r.err)?.[1]);
    // walls 2N, two caps of N − 2 each
    expect(a.triangles).toBe(cells.length * (4 * n - 4));
    // default height: 3 cells of 1.5 mm within c/(2·28 GHz)
    const heightMm = 4.5;
    expectClose(a.max[2] - a.min[2], heightMm, { rel: 1e-6, label: "height" });
    const fr = levelFractions(a, r.rows, printed, pitch, heightMm, L.key);
    for (const [level, got] of fr) {
      // square lattice: fill = πr²/a² (the polygon has the circle's area)
      const rad = Number(got.cells[0].radius_mm);
      expectClose(got.drawn, (Math.PI * rad * rad) / (pitch * pitch), { rel: 1e-3, label: `level ${level} rod area` });
      expectClose(got.drawn, Number(r.levels.find((x) => Number(x.level) === level)!.fill_fraction), { rel: 1e-3, label: `level ${level} fill` });
    }
  }, 120_000);

  it("resin with air holes: the cells join into one plate, holes cut through, unprinted cells left open", async () => {
    const r = await planWithLayout("tests/io/layout-fixtures/printed-holes.json");
    const pitch = 1.5;
    const L = lattice(r.rows, pitch);
    const a = analyse(await readFile(join(r.out, "layout.stl")), pitch, L.x0, L.y0);
    expect(a.badEdges).toBe(0);
    expect(a.unpairedDirected).toBe(0);
    const printed = (x: Row): boolean => x.family === "holes-in-slab" && x.orientation === "along_z";
    const cells = r.rows.filter(printed);
    expect(cells.length).toBeGreaterThan(0);
    const n = Number(/circles as (\d+)-gons/.exec(r.err)?.[1]);
    // hole wall 2N; top and bottom: square minus N-gon, N + 4 each; a side with no printed cell: 2
    let expected = 0;
    for (const row of cells) {
      expected += 2 * n + 2 * (n + 4);
      for (const [di, dj] of NEIGHBOURS) {
        const nb = L.byKey.get(`${Number(row.i) + di},${Number(row.j) + dj}`);
        if (!nb || !printed(nb)) expected += 2;
      }
    }
    expect(a.triangles).toBe(expected);
    const heightMm = 4.5;
    const fr = levelFractions(a, r.rows, printed, pitch, heightMm, L.key);
    for (const [level, got] of fr) {
      expectClose(got.drawn, 1 - Number(r.levels.find((x) => Number(x.level) === level)!.fill_fraction), { rel: 1e-3, label: `level ${level} resin fraction` });
    }
  }, 120_000);
});

describe("STL of spheres, voids and cubes (recipes set by hand on a planned device)", () => {
  async function handPlan(): Promise<Plan> {
    const design = await loadDesign("tests/io/layout-fixtures/printed-rods.json");
    const [field, materials, processes] = await Promise.all([loadFieldForDesign(design), loadMaterialCatalog(), loadProcessCatalog()]);
    return planFromField(design, field, { materials, processes }, {});
  }

  /** Set the levels' recipes (null: an empty cell of air), write the STL, check it closes and each printed level's fraction. */
  async function checkPart(plan: Plan, recipes: ({ recipe: Partial<Recipe>; printed: number } | null)[]): Promise<void> {
    const a = plan.grid.pitchM;
    const base = plan.levels[0].recipe!;
    recipes.forEach((r, l) => {
      plan.levels[l].recipe = r ? { ...base, lattice: "cubic", orientation: null, ...r.recipe } : { ...base, family: "solid", host: "air", inclusion: "", lattice: "cubic", orientation: null, dimensions: {}, fillFraction: 0 };
    });
    const part = printedPart(plan, 2 * a, 0.15e-3);
    expect(part.refused).toBeNull();
    expect(part.layers).toBe(2);
    const chunks: Uint8Array[] = [];
    for (const c of stlChunks(part, "hand-set recipes")) chunks.push(c.slice());
    const buf = Buffer.concat(chunks);
    const aMm = a * 1e3;
    const an = analyse(buf, aMm, plan.grid.originXM * 1e3, plan.grid.originYM * 1e3);
    expect(an.badEdges).toBe(0);
    expect(an.unpairedDirected).toBe(0);
    expect(an.headerCount).toBe(part.triangles);
    recipes.forEach((r, l) => {
      let v = 0, cells = 0;
      for (let c = 0; c < plan.grid.count; c++) {
        if (plan.level[c] !== l) continue;
        cells++;
        v += an.columnMm3.get(`${plan.grid.i[c]},${plan.grid.j[c]}`) ?? 0;
      }
      expect(cells).toBeGreaterThan(0);
      // icospheres are scaled to the sphere's volume; float32 vertices and the 40 nm dimension
      // quantum move the fraction by well under 1e-3
      expectClose(v / (cells * aMm * aMm * 2 * aMm), r ? r.printed : 0, { rel: 1e-3, abs: 1e-12, label: `level ${l + 1} printed fraction` });
    });
  }

  it("loose spheres, sphere voids and cube voids close and hold their volume", async () => {
    const plan = await handPlan();
    const a = plan.grid.pitchM;
    const r1 = 0.3 * a, r2 = 0.35 * a, s3 = 0.5 * a;
    const sphere = (r: number): number => (4 / 3) * Math.PI * (r / a) ** 3;
    const looseSpheres = { recipe: { family: "spheres-in-host", host: "air", inclusion: "photopolymer-resin", dimensions: { radius_m: r1 }, fillFraction: sphere(r1) }, printed: sphere(r1) };
    const sphereVoids = { recipe: { family: "spheres-in-host", host: "photopolymer-resin", inclusion: "air", dimensions: { radius_m: r2 }, fillFraction: sphere(r2) }, printed: 1 - sphere(r2) };
    const cubeVoids = { recipe: { family: "cubes-in-host", host: "photopolymer-resin", inclusion: "air", dimensions: { side_m: s3 }, fillFraction: (s3 / a) ** 3 }, printed: 1 - (s3 / a) ** 3 };
    const struts = (w: number) => ({ recipe: { family: "strut-lattice", host: "air", inclusion: "photopolymer-resin", dimensions: { width_m: w * a }, fillFraction: 3 * w * w - 2 * w ** 3 }, printed: 3 * w * w - 2 * w ** 3 });
    await checkPart(plan, [looseSpheres, sphereVoids, cubeVoids]);
    // empty cells on either side of solid cells, and struts meeting solid cells and each other
    await checkPart(plan, [null, sphereVoids, struts(0.3)]);
    await checkPart(plan, [struts(0.4), cubeVoids, null]);
    await checkPart(plan, [struts(0.2), struts(0.45), { recipe: { family: "solid", host: "photopolymer-resin", inclusion: "", dimensions: {}, fillFraction: 1 }, printed: 1 }]);
  }, 120_000);

  it("refuses a part whose STL would be too large, with the estimate, and writes nothing", async () => {
    const d = JSON.parse(await readFile("demo-designs/plan-printed-bend.json", "utf8"));
    d.realization.height = "2 m";
    const dir = tempDir("cw-stl-big-");
    const path = join(dir, "tall.json");
    await writeFile(path, JSON.stringify(d));
    const io = bufferIo();
    const code = await runCli(["plan", path, "--out", join(dir, "out"), "--layout"], io);
    expect(code).toBe(1);
    expect(io.err()).toMatch(/--layout: the printed part's STL would be about \d+ MB \(\d+ triangles for 1537 cells × 1667 layers\), over the 256 MB limit/);
    await expect(readFile(join(dir, "out", "summary.json"))).rejects.toThrow();
  }, 120_000);
});

describe("STL of hexagonal rods and holes: on the 2D layouts' sites, closed, holding the fill over the built sites", () => {
  /** Plan a fixture in-process and return the plan, its STL analysed, the part and the 2D layout's sites (mm). */
  async function hexPart(path: string): Promise<{ plan: Plan; an: Analysis; part: ReturnType<typeof printedPart>; sites: { x: number; y: number; level: number }[]; top: number[][] }> {
    const design = await loadDesign(path);
    const [field, materials, processes] = await Promise.all([loadFieldForDesign(design), loadMaterialCatalog(), loadProcessCatalog()]);
    const plan = planFromField(design, field, { materials, processes }, {});
    const part = printedPart(plan, plan.figures.height.heightM, plan.figures.processMinFeatureM);
    expect(part.refused).toBeNull();
    const chunks: Uint8Array[] = [];
    for (const c of stlChunks(part, "hexagonal sites")) chunks.push(c.slice());
    const buf = Buffer.concat(chunks);
    const an = analyse(buf, plan.grid.pitchM * 1e3, plan.grid.originXM * 1e3, plan.grid.originYM * 1e3);
    const sites = planLayout(plan).levels.flatMap((lv) => lv.polygons.map((p) => ({ x: p.cxM * 1e3, y: p.cyM * 1e3, level: lv.level })));
    // the vertices on the top face (z = height), as written (float32 mm)
    const raw = parseSTL(buf);
    const v = raw.vertices, H = part.heightM * 1e3;
    const seen = new Set<string>(), top: number[][] = [];
    for (let k = 0; k < v.length; k += 3) {
      if (Math.abs(v[k + 2] - H) > 1e-4) continue;
      const key = `${v[k]},${v[k + 1]}`;
      if (!seen.has(key)) { seen.add(key); top.push([v[k], v[k + 1]]); }
    }
    return { plan, an, part, sites, top };
  }

  /** Every top vertex off the cell corners belongs to a 2D-layout site: N of them per site, all at one radius R. */
  function checkSites(h: Awaited<ReturnType<typeof hexPart>>): Map<number, number> {
    const a = h.plan.grid.pitchM * 1e3, x0 = h.plan.grid.originXM * 1e3 - a / 2, y0 = h.plan.grid.originYM * 1e3 - a / 2;
    const N = h.part.circleVertices;
    const perSite = new Map<number, number[]>();
    for (const [x, y] of h.top) {
      const onCorner = Math.abs((x - x0) / a - Math.round((x - x0) / a)) < 1e-5 && Math.abs((y - y0) / a - Math.round((y - y0) / a)) < 1e-5;
      if (onCorner) continue;
      let best = -1, bd = Infinity;
      for (let s = 0; s < h.sites.length; s++) { const d = Math.hypot(x - h.sites[s].x, y - h.sites[s].y); if (d < bd) { bd = d; best = s; } }
      expect(bd, `top vertex (${x}, ${y}) near a site`).toBeLessThan(a / 2);
      perSite.set(best, [...(perSite.get(best) ?? []), bd]);
    }
    expect(perSite.size).toBe(h.sites.length);
    const radius = new Map<number, number>();
    for (const [s, ds] of perSite) {
      expect(ds.length, `vertices around site ${s}`).toBe(N);
      // float32 mm coordinates: about 1e-6 relative on a few-mm coordinate
      for (const d of ds) expectClose(d, ds[0], { abs: 1e-5, label: `radius at site ${s}` });
      const level = h.sites[s].level, r = radius.get(level);
      if (r !== undefined) expectClose(ds[0], r, { abs: 1e-5, label: `level ${level} radius` });
      radius.set(level, ds[0]);
    }
    return radius;
  }

  it("holes in a resin slab: one slab with the holes cut through at every site, volume = slab − holes", async () => {
    const h = await hexPart("tests/io/layout-fixtures/printed-hex-holes.json");
    expect(h.an.badEdges).toBe(0);
    expect(h.an.unpairedDirected).toBe(0);
    expect(h.an.headerCount).toBe(h.part.triangles);
    expect(h.part.notes.join(" ")).toMatch(/stand on the plan's built hexagonal sites/);
    const radius = checkSites(h);
    const N = h.part.circleVertices, a = h.plan.grid.pitchM * 1e3, H = h.part.heightM * 1e3;
    // an N-gon of circumradius R has area ½·N·R²·sin(2π/N) (equal to πr² of its recipe: equalAreaRadius)
    const polyArea = (R: number): number => 0.5 * N * R * R * Math.sin((2 * Math.PI) / N);
    let holes = 0;
    for (const s of h.sites) holes += polyArea(radius.get(s.level)!);
    const cells = h.plan.level.reduce((n, l) => n + (l >= 0 && h.plan.levels[l].recipe?.family === "holes-in-slab" ? 1 : 0), 0);
    expect(cells).toBe(h.plan.grid.count);
    expectClose(h.an.volumeMm3, H * (cells * a * a - holes), { rel: 1e-5, label: "slab volume minus the holes" });
    // identity per level: the holes' area over their built sites' own area, (√3/2)·a² each, is the
    // recipe's fill (air fraction); the N-gons hold πr² of the recipe's radius
    for (const lv of h.plan.levels) {
      const n = h.sites.filter((s) => s.level === lv.index).length;
      if (!n) continue;
      expectClose(polyArea(radius.get(lv.index)!) / ((Math.sqrt(3) / 2) * a * a), lv.recipe!.fillFraction, { rel: 1e-4, label: `level ${lv.index} hole fraction over its sites` });
      expectClose(polyArea(radius.get(lv.index)!), Math.PI * (lv.recipe!.dimensions.radius_m * 1e3) ** 2, { rel: 1e-4, label: `level ${lv.index} hole area` });
    }
  }, 60_000);

  it("holes next to solid resin cells and empty cells: the slab still closes, the sites near them left out", async () => {
    const design = await loadDesign("tests/io/layout-fixtures/printed-hex-holes.json");
    const [field, materials, processes] = await Promise.all([loadFieldForDesign(design), loadMaterialCatalog(), loadProcessCatalog()]);
    const plan = planFromField(design, field, { materials, processes }, {});
    expect(plan.levels.length).toBe(3);
    const base = plan.levels[0].recipe!;
    // level 2 solid resin (a full cell), level 3 empty (air): level 1 keeps its hexagonal holes
    plan.levels[1].recipe = { ...base, family: "solid", host: base.host, inclusion: "", lattice: "square", orientation: null, dimensions: {}, fillFraction: 0 };
    plan.levels[2].recipe = { ...base, family: "solid", host: "air", inclusion: "", lattice: "square", orientation: null, dimensions: {}, fillFraction: 0 };
    const part = printedPart(plan, plan.figures.height.heightM, plan.figures.processMinFeatureM);
    expect(part.refused).toBeNull();
    const chunks: Uint8Array[] = [];
    for (const c of stlChunks(part, "mixed")) chunks.push(c.slice());
    const an = analyse(Buffer.concat(chunks), plan.grid.pitchM * 1e3, plan.grid.originXM * 1e3, plan.grid.originYM * 1e3);
    expect(an.badEdges).toBe(0);
    expect(an.unpairedDirected).toBe(0);
    expect(an.headerCount).toBe(part.triangles);
    const layout = planLayout(plan);
    const holes = layout.levels.find((l) => l.level === 1)!;
    expect(holes.sites!.dropped).toBeGreaterThan(0);
    const N = part.circleVertices, a = plan.grid.pitchM * 1e3, H = part.heightM * 1e3;
    const R = equalAreaRadius(base.dimensions.radius_m * 1e3, N);
    let cells = 0;
    for (let c = 0; c < plan.grid.count; c++) if (plan.level[c] === 0 || plan.level[c] === 1) cells++;
    // printed: the hole cells and the solid cells, less the built holes (N-gons of πr² each)
    expectClose(an.volumeMm3, H * (cells * a * a - holes.polygons.length * 0.5 * N * R * R * Math.sin((2 * Math.PI) / N)), { rel: 1e-4, label: "printed volume" });
  }, 60_000);

  it("rods in air: one closed prism per site, 4N − 4 triangles each, volume = Σ πr²·height", async () => {
    const h = await hexPart("tests/io/layout-fixtures/printed-hex-rods.json");
    expect(h.an.badEdges).toBe(0);
    expect(h.an.unpairedDirected).toBe(0);
    const N = h.part.circleVertices;
    // N wall quads (2N triangles) and two caps of N − 2 triangles per rod
    expect(h.part.triangles).toBe(h.sites.length * (4 * N - 4));
    checkSites(h);
    const H = h.part.heightM * 1e3;
    let expected = 0;
    for (const s of h.sites) expected += Math.PI * (h.plan.levels[s.level - 1].recipe!.dimensions.radius_m * 1e3) ** 2 * H;
    expectClose(h.an.volumeMm3, expected, { rel: 1e-4, label: "rods' volume" });
    expect(h.part.notes.join(" ")).toMatch(/sites left out at the edge/);
  }, 60_000);

  it("rect-lattice holes (m × n per cell) and rods: closed, on the 2D layout's circle centres, holding the fill in every cell", async () => {
    const design = await loadDesign("tests/io/layout-fixtures/rect-holes.json");
    const [field, materials, processes] = await Promise.all([loadFieldForDesign(design), loadMaterialCatalog(), loadProcessCatalog()]);
    const plan = planFromField(design, field, { materials, processes }, {});
    const rect = plan.levels.filter((lv) => lv.recipe?.lattice === "rect");
    expect(rect.length).toBeGreaterThan(0);
    for (const holes of [true, false]) {
      if (!holes) for (const lv of plan.levels) if (lv.recipe && lv.recipe.family === "holes-in-slab") lv.recipe = { ...lv.recipe, family: "rods-in-host", host: "air", inclusion: lv.recipe.host };
      const part = printedPart(plan, 2 * plan.grid.pitchM, null);
      expect(part.refused).toBeNull();
      expect(part.notes.join(" ")).toMatch(/rect-lattice rods and holes: m × n per cell/);
      const chunks: Uint8Array[] = [];
      for (const c of stlChunks(part, "rect")) chunks.push(c.slice());
      const buf = Buffer.concat(chunks);
      const an = analyse(buf, plan.grid.pitchM * 1e3, plan.grid.originXM * 1e3, plan.grid.originYM * 1e3);
      expect(an.badEdges).toBe(0);
      expect(an.unpairedDirected).toBe(0);
      const N = part.circleVertices, a = plan.grid.pitchM * 1e3, H = part.heightM * 1e3;
      // the 2D layout's circles (their vertex centroids) are the printed circles' centres
      const circles = planLayout(plan).levels.flatMap((lv) => lv.polygons.map((p) => { let x = 0, y = 0; for (let k = 0; k < p.xy.length; k += 2) { x += p.xy[k]; y += p.xy[k + 1]; } return { x: (2e3 * x) / p.xy.length, y: (2e3 * y) / p.xy.length, level: lv.level }; }));
      const raw = parseSTL(buf), v = raw.vertices;
      const top = new Set<string>();
      for (let k = 0; k < v.length; k += 3) if (Math.abs(v[k + 2] - H) < 1e-4) top.add(`${v[k].toFixed(3)},${v[k + 1].toFixed(3)}`);
      let area = 0;
      for (const c of circles) {
        const r = plan.levels[c.level - 1].recipe!.dimensions.radius_m * 1e3, R = equalAreaRadius(r, N);
        expect(top.has(`${(c.x + R).toFixed(3)},${c.y.toFixed(3)}`), `a printed circle at (${c.x}, ${c.y})`).toBe(true);
        area += Math.PI * r * r;
      }
      let cells = 0;
      for (let c = 0; c < plan.grid.count; c++) if (plan.level[c] >= 0 && plan.levels[plan.level[c]].recipe?.family !== "solid") cells++;
      // identity: m·n circles of πr² in a cell of a² hold the fill (πr²/(a/m · a/n)) in every cell
      const printed = holes ? H * (cells * a * a - area) : H * area;
      expectClose(an.volumeMm3, printed, { rel: 1e-4, label: holes ? "plate minus the holes" : "the rods" });
      // per rect level: m × n circles in each of its cells, and m·n·πr²/a² is the recipe's fill
      for (const lv of rect) {
        const t = rectTiling(lv.recipe!.aspect!)!;
        const n = circles.filter((c) => c.level === lv.index).length;
        expect(n).toBe(t.m * t.n * lv.cellCount);
        const r = lv.recipe!.dimensions.radius_m * 1e3;
        expectClose((t.m * t.n * Math.PI * r * r) / (a * a), lv.recipe!.fillFraction, { rel: 1e-9, label: `level ${lv.index} fill` });
      }
    }
  }, 120_000);
});
