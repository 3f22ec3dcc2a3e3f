/**
 * maps.svg read with fast-xml-parser (a general-purpose XML parser, dev dependency) and checked
 * against the build list: axis ticks at the positions their labels name (the map's drawn cells
 * give the scale: the leftmost and rightmost cell edges are the extreme cells' x ∓ a/2), a scale bar
 * as long as its label, the origin marked where x = y = 0 falls, and a legend naming the varying
 * component with each level's target and cell count as in levels.csv.
 */
import { describe, it, expect, beforeAll } from "vitest";
import { readFile } from "node:fs/promises";
import { join } from "node:path";
import { parse } from "csv-parse/sync";
import { XMLParser } from "fast-xml-parser";
import { runCli } from "../../../src/cli/run.js";
import { bufferIo } from "../../../src/cli/cliIo.js";
import { expectClose } from "../../helpers/close.js";
import { niceStep } from "../../../src/plan/outputs/svgMaps.js";
import { tempDir } from "../../helpers/tempDir.js";

type Row = Record<string, string>;
type El = Record<string, unknown>;

async function planned(design: string): Promise<{ svg: El; rows: Row[]; levels: Row[] }> {
  const out = tempDir("cw-svg-");
  const io = bufferIo();
  await runCli(["plan", design, "--out", out, "--json"], io);
  const text = await readFile(join(out, "maps.svg"), "utf8");
  const parser = new XMLParser({ ignoreAttributes: false, attributeNamePrefix: "", textNodeName: "#text", alwaysCreateTextNode: true, isArray: (_name: string, _path: unknown, _leaf: boolean, isAttribute: boolean) => !isAttribute });
  const doc = parser.parse(text) as { svg: El[] };
  return {
    svg: doc.svg[0],
    rows: parse(await readFile(join(out, "build-list.csv"), "utf8"), { columns: true }),
    levels: parse(await readFile(join(out, "levels.csv"), "utf8"), { columns: true }),
  };
}

const list = (e: El, tag: string): El[] => (e[tag] as El[] | undefined) ?? [];
const num = (e: El, k: string): number => Number(e[k]);
const txt = (e: El): string => String(e["#text"] ?? "");

describe("maps.svg of the printed bend (mm)", () => {
  let r: Awaited<ReturnType<typeof planned>>;
  beforeAll(async () => { r = await planned("demo-designs/plan-printed-bend.json"); }, 120_000);

  it("x ticks sit where their labels say, in millimetres, on a 1-2-5 step", () => {
    const a = 1.2; // mm, the design's pitch
    // the level map's cells: the first <g> of rects
    const cells = list(list(r.svg, "g")[0], "rect").filter((x) => num(x, "x") < 440);
    const leftPx = Math.min(...cells.map((x) => num(x, "x")));
    const rightPx = Math.max(...cells.map((x) => num(x, "x") + num(x, "width")));
    const xs = r.rows.map((x) => Number(x.x_mm));
    const xLeft = Math.min(...xs) - a / 2, xRight = Math.max(...xs) + a / 2;
    const mmPerPx = (xRight - xLeft) / (rightPx - leftPx);
    const tickLines = list(r.svg, "line").filter((x) => x.class === "tick-x" && num(x, "x1") < 440);
    const tickTexts = list(r.svg, "text").filter((x) => x.class === "tick-x" && num(x, "x") < 440);
    expect(tickTexts.length).toBeGreaterThanOrEqual(4);
    expect(tickLines.length).toBe(tickTexts.length);
    const values = tickTexts.map((t) => Number(txt(t)));
    const step = values[1] - values[0];
    expect([1, 2, 5, 10, 20, 50]).toContain(step);
    for (let k = 0; k < values.length; k++) {
      // cells are snapped to whole pixels: half a pixel on either end
      expectClose(xLeft + (num(tickTexts[k], "x") - leftPx) * mmPerPx, values[k], { abs: mmPerPx, label: `tick ${values[k]} mm` });
      expect(num(tickLines[k], "x1")).toBe(num(tickTexts[k], "x"));
    }
    const title = list(r.svg, "text").find((x) => x.class === "axis-title" && txt(x).startsWith("x ("));
    expect(txt(title!)).toContain("x (mm)");
    // the scale bar: a line as long as its label says
    const bar = list(r.svg, "g").find((x) => x.class === "scale-bar")!;
    const line = list(bar, "line")[0];
    const label = txt(list(bar, "text")[0]);
    const m = /^([\d.]+) mm$/.exec(label);
    expect(m, label).not.toBeNull();
    expectClose((num(line, "x2") - num(line, "x1")) * mmPerPx, Number(m![1]), { rel: 0.01, label: "scale bar" });
    // the origin: this bend's centre of curvature is x = y = 0, a corner of the map
    const origin = list(r.svg, "g").find((x) => x.class === "origin")!;
    const cross = list(origin, "circle")[0];
    expectClose(xLeft + (num(cross, "cx") - leftPx) * mmPerPx, 0, { abs: mmPerPx, label: "origin x" });
  });

  it("the legend names ε_z and gives each level's target and cell count", () => {
    const legend = list(r.svg, "text").filter((x) => x.class === "legend-level").map(txt);
    expect(legend.length).toBe(r.levels.length);
    r.levels.forEach((lv, k) => {
      const m = /^level (\d+): ε_z = ([\d.]+) \((\d+) cells\)$/.exec(legend[k]);
      expect(m, legend[k]).not.toBeNull();
      expect(Number(m![1])).toBe(Number(lv.level));
      expectClose(Number(m![2]), Number(lv.target_eps_z), { rel: 5e-4, label: `level ${lv.level} target` });
      expect(Number(m![3])).toBe(Number(lv.cells));
    });
  });
});

describe("maps.svg of the silicon bend (µm, Hz)", () => {
  it("ticks in micrometres and equal in-plane components read as one", async () => {
    const r = await planned("demo-designs/plan-silicon-chip-bend.json");
    const title = list(r.svg, "text").find((x) => x.class === "axis-title" && txt(x).startsWith("x ("));
    expect(txt(title!)).toContain("x (µm)");
    const legend = list(r.svg, "text").filter((x) => x.class === "legend-level").map(txt);
    expect(legend[0]).toMatch(/^level 1: ε_1 = ε_2 = [\d.]+ \(\d+ cells\)$/);
    const scale = txt(list(list(r.svg, "g").find((x) => x.class === "scale-bar")!, "text")[0]);
    expect(scale).toMatch(/^[\d.]+ µm$/);
  }, 120_000);

  it("niceStep gives 1-2-5 steps", () => {
    expect(niceStep(80, 5)).toBe(20);
    expect(niceStep(6, 5)).toBe(1);
    expectClose(niceStep(0.35, 5), 0.05, { rel: 1e-12, label: "0.35 over 5" });
  });
});
