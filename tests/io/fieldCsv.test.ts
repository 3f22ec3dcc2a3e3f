/** Field CSV: write → import round trip, and every malformed input named by line and column. */
import { describe, it, expect, beforeAll } from "vitest";
import fc from "fast-check";
import { writeFileSync, readFileSync, existsSync } from "node:fs";
import { join } from "node:path";
import { expectClose } from "../helpers/close.js";
import { computeTensorField } from "../../src/field/computeTensorField.js";
import { readFieldCsv, writeFieldCsv, fieldCsvColumns, loadFieldForDesign } from "../../src/io/fieldCsv.js";
import { loadDesign } from "../../src/io/design/loadDesign.js";
import { SYM_COMPONENTS } from "../../src/core/symTensor.js";
import { tempDir } from "../helpers/tempDir.js";

let dir = "";
beforeAll(() => { dir = tempDir("cw-csv-"); });

const HEAD = "x_m,y_m,eps_xx,eps_yy,eps_zz,eps_xy,eps_xz,eps_yz";

async function readText(name: string, text: string) {
  const p = join(dir, name);
  writeFileSync(p, text);
  return readFieldCsv(p, { label: name });
}

describe("round trip", () => {
  it("importing a field that field --out wrote gives it back", async () => {
    await fc.assert(
      fc.asyncProperty(
        fc.double({ min: 0.005, max: 0.02, noNaN: true }), fc.double({ min: 1.5, max: 3, noNaN: true }),
        fc.double({ min: -0.01, max: 0.01, noNaN: true }), fc.double({ min: -0.01, max: 0.01, noNaN: true }),
        async (a, ratio, cx, cy) => {
          const b = a * ratio;
          const f = computeTensorField({
            name: "r", sourcePath: "r.json", background: { eps: 1, mu: 1 },
            transform: { kind: "radial-cloak", innerRadiusM: a, outerRadiusM: b, profile: "linear", center: [cx, cy], innerOffsetM: 1e-4 * b },
            grid: { pitchM: b / 10 },
          });
          const p = join(dir, "round.csv");
          await writeFieldCsv(p, f);
          const g = await readFieldCsv(p, { expectedPitchM: b / 10 });
          expect(g.grid.count).toBe(f.grid.count);
          expect(Array.from(g.grid.i)).toEqual(Array.from(f.grid.i));
          expect(Array.from(g.grid.j)).toEqual(Array.from(f.grid.j));
          expect(Array.from(g.grid.xM)).toEqual(Array.from(f.grid.xM));
          expect(Array.from(g.grid.yM)).toEqual(Array.from(f.grid.yM));
          // exact equality (the CSV keeps JavaScript's shortest round-trip digits); −0 is written as 0
          const plain = (a: Float64Array) => Array.from(a, (v) => v + 0);
          for (const c of SYM_COMPONENTS) {
            expect(plain(g.eps[c]), `eps_${c}`).toEqual(plain(f.eps[c]));
            expect(plain(g.mu[c]), `mu_${c}`).toEqual(plain(f.mu[c]));
          }
          expect(Array.from(g.detJ)).toEqual(Array.from(f.detJ));
          expect(Array.from(g.capped)).toEqual(Array.from(f.capped));
          expectClose(g.grid.pitchM, f.grid.pitchM, { rel: 1e-9, label: "pitch" });
          for (let k = 0; k < 3; k++) expectClose(g.epsPrincipal[k], f.epsPrincipal[k], { rel: 1e-9, abs: 1e-12, label: `p${k}` });
        },
      ),
      { seed: 42, numRuns: 15 },
    );
  });

  it("writes the documented header", async () => {
    const f = computeTensorField({
      name: "s", sourcePath: "s.json", background: { eps: 1, mu: 1 },
      transform: { kind: "beam-shifter", lengthM: 0.01, heightM: 0.01, shiftM: 0.002 }, grid: { pitchM: 0.002 },
    });
    const p = join(dir, "head.csv");
    await writeFieldCsv(p, f);
    const lines = readFileSync(p, "utf8").trimEnd().split("\n");
    expect(lines[0]).toBe(fieldCsvColumns(2).join(","));
    expect(lines[0].startsWith("i,j,x_m,y_m,eps_xx,eps_yy,eps_zz,eps_xy,eps_xz,eps_yz,mu_xx")).toBe(true);
    expect(lines.length - 1).toBe(f.grid.count);
  });
});

describe("import", () => {
  it("missing mu columns mean μ = 1; the demo CSV gives the beam shifter of Rahm et al. (2008)", async () => {
    const d = await loadDesign(join(import.meta.dirname, "..", "..", "demo-designs", "field-imported.json"));
    const f = await loadFieldForDesign(d);
    expect(f.grid.count).toBe(30);
    expectClose(f.grid.pitchM, 0.002, { rel: 1e-9, label: "pitch" });
    // Rahm, Cummer, Schurig, Pendry, Smith, PRL 100, 063903 (2008): ε = [[1, a], [a, 1 + a²]], a = 0.25
    expectClose([f.eps.xx[7], f.eps.yy[7], f.eps.xy[7]], [1, 1.0625, 0.25], { rel: 1e-15, label: "eps" });
    expectClose([f.mu.xx[7], f.mu.yy[7], f.mu.zz[7], f.mu.xy[7]], [1, 1, 1, 0], { rel: 1e-15, label: "mu" });
    expect(f.evaluateAt).toBeNull();
  });

  it("a bad value names its line and column", async () => {
    await expect(readText("v.csv", `${HEAD}\n0,0,1,1,1,0,0,0\n0.001,0,1,abc,1,0,0,0\n`)).rejects.toThrow(
      "v.csv:3:4: expected a finite number in column eps_yy, got 'abc'",
    );
  });

  it("a short row names its line", async () => {
    await expect(readText("s.csv", `${HEAD}\n0,0,1,1,1,0,0,0\n0.001,0,1,1,1,0\n`)).rejects.toThrow("s.csv:3: expected 8 columns as in the header, got 6");
  });

  it("a non-uniform grid is an error naming the row", async () => {
    await expect(readText("n.csv", `${HEAD}\n0,0,1,1,1,0,0,0\n0.001,0,1,1,1,0,0,0\n0.0025,0,1,1,1,0,0,0\n`)).rejects.toThrow(
      /n\.csv:4: x_m = 0\.0025 is off the square grid of pitch 0\.001 m/,
    );
  });

  it("a repeated cell, a missing or unknown column, a partial mu set are errors", async () => {
    await expect(readText("d.csv", `${HEAD}\n0,0,1,1,1,0,0,0\n0.001,0,1,1,1,0,0,0\n0,0,1,1,1,0,0,0\n`)).rejects.toThrow(/d\.csv:4: cell at \(0 m, 0 m\) appears twice/);
    await expect(readText("m.csv", "x_m,y_m,eps_xx\n0,0,1\n")).rejects.toThrow(/m\.csv:1: missing columns eps_yy/);
    await expect(readText("u.csv", `${HEAD},eps_zx\n`)).rejects.toThrow(/u\.csv:1: unknown column 'eps_zx'; did you mean/);
    await expect(readText("p.csv", `${HEAD},mu_xx\n0,0,1,1,1,0,0,0,1\n`)).rejects.toThrow(/p\.csv:1: missing columns mu_yy/);
  });

  it("a pitch that disagrees with the design is named at $.grid.pitch", async () => {
    const p = join(dir, "pitch.csv");
    writeFileSync(p, `${HEAD}\n0,0,1,1,1,0,0,0\n0.001,0,1,1,1,0,0,0\n`);
    await expect(readFieldCsv(p, { expectedPitchM: 0.002, pitchWhere: "d.json: $.grid.pitch" })).rejects.toThrow(
      /d\.json: \$\.grid\.pitch: the imported field has a pitch of 0\.001 m/,
    );
  });

  it("a failed write leaves no file", async () => {
    const f = computeTensorField({
      name: "s", sourcePath: "s.json", background: { eps: 1, mu: 1 },
      transform: { kind: "beam-shifter", lengthM: 0.01, heightM: 0.01, shiftM: 0.002 }, grid: { pitchM: 0.002 },
    });
    const target = join(dir, "blocked", "x.csv");
    writeFileSync(join(dir, "blocked"), "a file where a directory should be");
    await expect(writeFieldCsv(target, f)).rejects.toThrow();
    expect(existsSync(target)).toBe(false);
  });
});
