/**
 * `verify --sweep` with a dispersive background (`reduction.backgroundMaterial`, fixture
 * tests/verify/fixtures/silica-graded-block.json: a block in fused silica at 193.5 THz): the sweep
 * says the background's ε at each frequency (JSON `sweep.background`, CSV `background_eps`, a note),
 * and solves every case in it.
 *
 * Expected values: fused silica from Malitson's Sellmeier formula, I. H. Malitson, J. Opt. Soc. Am.
 * 55, 1205 (1965) (B = 0.6961663, 0.4079426, 0.8974794; C = 0.0684043, 0.1162414, 9.896161 µm),
 * computed here; and an identity: raising every ε of a scene by a factor s (background, ideal map)
 * is the same problem at the frequency f·√s (k² = ω²με), so the ideal device's scattering width at
 * f in the background ε(f) = s·ε(f₀) equals that of the same design checked at f·√s in the fixed
 * background ε(f₀), on the same grid (its step is the same fraction of the same wavelength).
 */
import { describe, expect, it } from "vitest";
import { readFileSync, writeFileSync } from "node:fs";
import { join } from "node:path";
import { parse } from "csv-parse/sync";
import { cliInTempDir } from "../helpers/cliInTempDir.js";
import { expectClose } from "../helpers/close.js";
import { SPEED_OF_LIGHT_M_PER_S as C0 } from "../../src/core/physicalConstants.js";

const FIXTURE = join(import.meta.dirname, "..", "verify", "fixtures", "silica-graded-block.json");
const cli = cliInTempDir("verify", "cw-sweep-background-");
const F0 = 193.5e12, F1 = 185e12, F2 = 200e12;

/** Malitson 1965 (file comment): ε = n² of fused silica at frequency f. */
function malitsonEps(frequencyHz: number): number {
  const l2 = (C0 / frequencyHz * 1e6) ** 2;
  const B = [0.6961663, 0.4079426, 0.8974794], C = [0.0684043, 0.1162414, 9.896161];
  return 1 + B.reduce((a, b, k) => a + (b * l2) / (l2 - C[k] ** 2), 0);
}

describe("verify --sweep follows a dispersive background material", () => {
  it("reports the background's ε at each frequency (Malitson's fused silica) in JSON, CSV and notes", async () => {
    const r = await cli.run([FIXTURE, "--sweep", "185 THz..200 THz:2", "--resolution", "8", "--drawn-time", "0", "--json", "--out", "sw"]);
    expect([0, 2], r.err).toContain(r.code);
    const s = JSON.parse(r.out);
    const design = JSON.parse(readFileSync(FIXTURE, "utf8"));
    const nb = design.reduction.backgroundIndex as number;
    const bg = s.sweep.background;
    expect(bg.material).toBe("fused-silica-optical");
    expect(s.sweep.frequenciesHz).toEqual([F1, F2]);
    for (const [k, f] of [F1, F2].entries()) {
      // ε_bg(f) = n_b² · ε(f)/ε(f₀): Malitson's ε(f) itself to the 7 digits of the design's index
      expectClose(bg.eps[k], nb * nb * malitsonEps(f) / malitsonEps(F0), { rel: 1e-12, label: `background ε at ${f / 1e12} THz` });
      expectClose(bg.eps[k], malitsonEps(f), { rel: 2e-7, label: `against Malitson at ${f / 1e12} THz` });
      expectClose(bg.mu[k], 1, { rel: 1e-14, label: "background μ (n·z of a non-magnetic background)" });
      expect(bg.lossTangent[k]).toBe(0);
    }
    expect(bg.eps[1]).toBeGreaterThan(bg.eps[0]); // normal dispersion: ε rises with frequency
    expect(r.err).toMatch(/note: background: fused silica \(optical\) \('fused-silica-optical', sellmeier model; Malitson.*\), Re ε 2\.08523 at 193\.5 THz \(index 1\.44403, the design's 1\.44403\): followed at each frequency of the sweep/);
    const rows = parse(readFileSync(join(cli.dir, "sw", "verify-sweep.csv"), "utf8"), { columns: true }) as Record<string, string>[];
    expect(Object.keys(rows[0]).at(-1)).toBe("background_eps");
    for (const row of rows) {
      const k = Number(row.frequency_hz) === F1 ? 0 : 1;
      expectClose(Number(row.background_eps), bg.eps[k], { rel: 1e-9, label: `CSV ${row.case} at ${row.frequency_hz}` });
    }
    // without a background material the sweep lists the fixed background and adds no column
    const plain = { ...design, reduction: { ...design.reduction, backgroundMaterial: undefined }, realization: undefined };
    writeFileSync(join(cli.dir, "plain.json"), JSON.stringify(plain));
    const p = await cli.run([join(cli.dir, "plain.json"), "--sweep", "185 THz..200 THz:2", "--resolution", "8", "--json"]);
    const ps = JSON.parse(p.out);
    expect(ps.sweep.background).toEqual({ material: null, eps: [nb * nb, nb * nb].map((v) => expect.closeTo(v, 12)), mu: [expect.closeTo(1, 12), expect.closeTo(1, 12)], lossTangent: null });
  }, 300_000);

  it("solves the ideal device in the background at f: its width equals that of the design at f·√s in the fixed background", async () => {
    const design = JSON.parse(readFileSync(FIXTURE, "utf8"));
    delete design.realization;
    writeFileSync(join(cli.dir, "followed.json"), JSON.stringify(design));
    const r = await cli.run([join(cli.dir, "followed.json"), "--sweep", "200 THz..200 THz:1", "--resolution", "8", "--json"]);
    expect([0, 2], r.err).toContain(r.code);
    const s = JSON.parse(r.out);
    const scale = s.sweep.background.eps[0] / (design.reduction.backgroundIndex ** 2);
    expect(scale).toBeGreaterThan(1.0005); // the identity below is tested on a real change of ε
    // the same design at f·√s, its background fixed (no material named)
    const shifted = { ...design, frequency: `${(F2 * Math.sqrt(scale)) / 1e12} THz`, reduction: { ...design.reduction, backgroundMaterial: undefined } };
    writeFileSync(join(cli.dir, "shifted.json"), JSON.stringify(shifted));
    const one = await cli.run([join(cli.dir, "shifted.json"), "--resolution", "8", "--json"]);
    const o = JSON.parse(one.out);
    for (const name of ["ideal", "reduced"]) {
      const swept = s.sweep.cases.find((c: { name: string }) => c.name === name).scatteringWidthM[0];
      const single = o.cases.find((c: { name: string }) => c.name === name).scatteringWidthM;
      expectClose(swept, single, { rel: 1e-9, label: `${name}: σ at 200 THz in the followed background against σ at f·√s` });
    }
  }, 300_000);
});
