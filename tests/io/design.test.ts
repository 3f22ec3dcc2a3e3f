/** Design loading: quantities, defaults, and every error naming the file, the JSON path and what was expected. */
import { describe, it, expect, beforeAll } from "vitest";
import { writeFileSync, readdirSync } from "node:fs";
import { join, resolve } from "node:path";
import { expectClose } from "../helpers/close.js";
import { loadDesign, parseDesign } from "../../src/io/design/loadDesign.js";
import { InputError } from "../../src/core/errors.js";
import { tempDir } from "../helpers/tempDir.js";

const cloak = { kind: "radial-cloak", innerRadius: "20 mm", outerRadius: "40 mm" };
const ok = { name: "d", frequency: "10.5 GHz", transform: cloak, grid: { pitch: "3 mm" } };

async function issues(json: unknown): Promise<{ where: string; message: string }[]> {
  try {
    await parseDesign(json, "d.json");
  } catch (e) {
    if (e instanceof InputError) return e.issues;
    throw e;
  }
  throw new Error("expected an InputError");
}

describe("parseDesign", () => {
  it("parses quantities to SI and fills defaults", async () => {
    const d = await parseDesign({ ...ok, transform: { ...cloak, center: ["1 cm", 0.002] } }, "d.json");
    expectClose(d.frequencyHz, 10.5e9, { rel: 1e-15, label: "frequency" });
    expect(d.background).toEqual({ eps: 1, mu: 1 });
    expectClose(d.grid.pitchM, 0.003, { rel: 1e-15, label: "pitch" });
    const t = d.transform;
    if (t.kind !== "radial-cloak") throw new Error("kind");
    expectClose([t.innerRadiusM, t.outerRadiusM, ...(t.center ?? [])], [0.02, 0.04, 0.01, 0.002], { rel: 1e-15, label: "lengths" });
    expect(t.profile).toBe("linear");
  });

  it("parses angles to radians and wavelengths-scale lengths", async () => {
    const d = await parseDesign({ ...ok, transform: { kind: "rotator", innerRadius: "1550 nm", outerRadius: "3 um", angle: "90 deg" } }, "d.json");
    if (d.transform.kind !== "rotator") throw new Error("kind");
    expectClose(d.transform.angleRad, Math.PI / 2, { rel: 1e-15, label: "angle" });
    expectClose(d.transform.innerRadiusM, 1.55e-6, { rel: 1e-15, label: "1550 nm" });
  });

  it("a missing key names its path and what was expected", async () => {
    const { frequency: _, ...noFreq } = ok;
    expect(await issues(noFreq)).toEqual([{ where: "d.json: $.frequency", message: "missing; expected a frequency such as '10 GHz'" }]);
    expect(await issues({ ...ok, grid: {} })).toEqual([{ where: "d.json: $.grid.pitch", message: "missing; expected a length such as '3 mm'" }]);
  });

  it("a unit of the wrong dimension is named", async () => {
    expect(await issues({ ...ok, frequency: "10 mm" })).toEqual([
      { where: "d.json: $.frequency", message: "expected a frequency such as '10 GHz', got a length '10 mm'" },
    ]);
    const [i] = await issues({ ...ok, transform: { ...cloak, outerRadius: "4 GHz" } });
    expect(i.where).toBe("d.json: $.transform.outerRadius");
    expect(i.message).toMatch(/expected a length/);
  });

  it("unknown keys and kinds get a suggestion", async () => {
    expect(await issues({ ...ok, grid: { pich: "3 mm", pitch: "3 mm" } })).toEqual([
      { where: "d.json: $.grid.pich", message: expect.stringMatching(/^unknown key 'pich'; did you mean pitch/) },
    ]);
    const [k] = await issues({ ...ok, transform: { ...cloak, kind: "radial-clock" } });
    expect(k).toEqual({ where: "d.json: $.transform.kind", message: expect.stringMatching(/^unknown transform kind 'radial-clock'; did you mean radial-cloak/) });
    const [t] = await issues({ ...ok, transform: { ...cloak, innerRaduis: "1 mm" } });
    expect(t.where).toBe("d.json: $.transform.innerRaduis");
    expect(t.message).toMatch(/did you mean innerRadius/);
  });

  it("rejects the quadratic profile unless b > 2a (Cai et al., Appl. Phys. Lett. 91, 111105 (2007))", async () => {
    const [i] = await issues({ ...ok, transform: { ...cloak, profile: "quadratic" } });
    expect(i.where).toBe("d.json: $.transform.profile");
    expect(i.message).toMatch(/outerRadius > 2 × innerRadius/);
    await expect(parseDesign({ ...ok, transform: { ...cloak, outerRadius: "41 mm", profile: "quadratic" } }, "d.json")).resolves.toBeTruthy();
  });

  it("checks radius order, region shape and polygon points", async () => {
    expect((await issues({ ...ok, transform: { ...cloak, outerRadius: "10 mm" } }))[0].message).toBe("expected outerRadius > innerRadius");
    const region = { circle: { radius: "1 mm" }, rectangle: { min: [0, 0], max: [1, 1] } };
    const [r] = await issues({ ...ok, transform: { kind: "expression", virtual: { x: "x", y: "y" }, region } });
    expect(r).toEqual({ where: "d.json: $.transform.region", message: "expected exactly one of circle, annulus, rectangle, polygon, got circle and rectangle" });
  });

  it("an expression outside the whitelist is an error naming the expression", async () => {
    const [i] = await issues({ ...ok, transform: { kind: "expression", virtual: { x: "x", y: "import('fs')" }, region: { circle: { radius: 1 } } } });
    expect(i.where).toBe("d.json: $.transform.virtual.y");
    expect(i.message).toMatch(/^unusable map 'import\('fs'\)'/);
  });

  it("resolves an imported file relative to the design file", async () => {
    const d = await parseDesign({ ...ok, transform: { kind: "imported", file: "f.csv" } }, "sub/dir/d.json", "/base");
    expect(d.transform).toEqual({ kind: "imported", file: resolve("/base/sub/dir/f.csv") });
  });
});

describe("loadDesign", () => {
  let dir = "";
  beforeAll(() => { dir = tempDir("cw-design-"); });

  it("reports JSON syntax errors with line and column", async () => {
    writeFileSync(join(dir, "bad.json"), '{\n  "name": "x",\n  "frequency": 5,,\n}\n');
    await expect(loadDesign("bad.json", dir)).rejects.toThrow(/^bad\.json:3:\d+: invalid JSON/);
  });

  it("reports a missing file", async () => {
    await expect(loadDesign("nope.json", dir)).rejects.toThrow("nope.json: file not found");
  });

  it("loads every demo design", async () => {
    const demo = join(import.meta.dirname, "..", "..", "demo-designs");
    for (const f of readdirSync(demo).filter((n) => n.startsWith("field-") && n.endsWith(".json"))) {
      const d = await loadDesign(join(demo, f));
      expect(d.name.length, f).toBeGreaterThan(0);
      expect(d.notes, f).toMatch(/scenario of our own/i);
    }
  });
});
