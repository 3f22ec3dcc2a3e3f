/**
 * Quasi-conformal designs at the edge: every problem with the sides is one message naming the
 * design file and the JSON path of the side (or point) at fault; a good design parses into a spec
 * with compiled sides and a default solver grid from the pitch.
 */
import { describe, it, expect } from "vitest";
import { parseDesign } from "../../src/io/design/loadDesign.js";
import { InputError } from "../../src/core/errors.js";
import { computeTensorField } from "../../src/field/computeTensorField.js";

const base = (sides: unknown, extra: Record<string, unknown> = {}): unknown => ({
  name: "carpet",
  frequency: "10 GHz",
  transform: { kind: "quasi-conformal", virtual: { rectangle: { min: ["-30 mm", "0 mm"], max: ["30 mm", "30 mm"] } }, sides, ...extra },
  grid: { pitch: "2 mm" },
});

async function issues(json: unknown): Promise<{ where: string; message: string }[]> {
  try {
    await parseDesign(json, "carpet.json");
  } catch (err) {
    if (err instanceof InputError) return err.issues;
    throw err;
  }
  return [];
}

describe("quasi-conformal designs", () => {
  it("parses a carpet: compiled bump, straight other sides, default grid of half a pitch", async () => {
    const d = await parseDesign(base({ bottom: { y: "6e-3 * cos(pi * max(-0.02, min(0.02, x)) / 0.04)^2" } }), "carpet.json");
    if (d.transform.kind !== "quasi-conformal") throw new Error("kind");
    expect(d.transform.sides.left.kind).toBe("straight");
    const b = d.transform.sides.bottom;
    if (b.kind !== "graph") throw new Error("graph");
    expect(b.f(0)).toBeCloseTo(6e-3, 15);
    expect(b.f(0.025)).toBeCloseTo(0, 15);
    // 60 mm / 1 mm + 1 and 30 mm / 1 mm + 1 grid lines
    expect(d.transform.nodes).toEqual([61, 31]);
    const f = computeTensorField(d);
    expect(f.map?.nodes).toEqual([61, 31]);
  });

  it("names a bump taller than the domain", async () => {
    const i = await issues(base({ bottom: { y: "0.05 * cos(pi * x / 0.06)^2" } }));
    expect(i).toHaveLength(1);
    expect(i[0].where).toBe("carpet.json: $.transform.sides.bottom");
    expect(i[0].message).toMatch(/reaches the top side at x = .*taller than the domain/);
  });

  it("names a point list leaving the rectangle's span", async () => {
    const i = await issues(base({ bottom: { points: [["-30 mm", 0], [0, "5 mm"], ["50 mm", 0]] } }));
    expect(i[0].where).toBe("carpet.json: $.transform.sides.bottom.points[2]");
    expect(i[0].message).toMatch(/x = 0\.05 m leaves the rectangle's span -0\.03…0\.03 m/);
  });

  it("names sides that cross", async () => {
    const i = await issues(base({ left: { points: [[-0.03, 0], [0.045, 0.015], [-0.03, 0.03]] } }));
    expect(i[0].where).toBe("carpet.json: $.transform.sides.left");
    expect(i[0].message).toMatch(/the right and left sides cross near/);
  });

  it("names corners that do not meet", async () => {
    const i = await issues(base({ bottom: { y: "0.01" } }));
    expect(i[0].where).toBe("carpet.json: $.transform.sides.bottom");
    expect(i[0].message).toMatch(/bottom-left corner does not meet/);
  });

  it("names the wrong kind of side and an unusable expression", async () => {
    const a = await issues(base({ bottom: { x: "0" } }));
    expect(a[0].where).toBe("carpet.json: $.transform.sides.bottom");
    expect(a[0].message).toMatch(/expected \{ "y": "<expression of x>" \}/);
    const b = await issues(base({ bottom: { y: "foo(x)" } }));
    expect(b[0].where).toBe("carpet.json: $.transform.sides.bottom.y");
    expect(b[0].message).toMatch(/unusable curve 'foo\(x\)'/);
    const c = await issues(base({ bottom: { y: "x*q" } }));
    expect(c[0].message).toMatch(/unknown symbol 'q'; expected x \(metres\), pi or e/);
  });

  it("suggests the right key under sides and virtual", async () => {
    const i = await issues(base({ botom: { y: "0" } }));
    expect(i[0].where).toBe("carpet.json: $.transform.sides.botom");
    expect(i[0].message).toMatch(/did you mean bottom/);
  });
});
