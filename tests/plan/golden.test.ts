import { describe, it, expect } from "vitest";
import { readFile, writeFile } from "node:fs/promises";
import { join } from "node:path";
import { parse } from "csv-parse/sync";
import { runCli } from "../../src/cli/run.js";
import { bufferIo } from "../../src/cli/cliIo.js";
import { expectClose } from "../helpers/close.js";
import { tempDir } from "../helpers/tempDir.js";

const DESIGN = "tests/plan/golden/small-bend.json";
const GOLDEN = "tests/plan/golden/small-bend-build-list.csv";

/** Symmetric Bruggeman, 3D, real phases: 2ε² − bε − ε1ε2 = 0, b = (3f−1)ε1 + (2−3f)ε2 (Bruggeman 1935). */
function bruggeman3d(e1: number, e2: number, f: number): number {
  const b = (3 * f - 1) * e1 + (2 - 3 * f) * e2;
  return (b + Math.sqrt(b * b + 8 * e1 * e2)) / 4;
}

describe("golden build list of a small design", () => {
  it("matches the committed file and independent spot checks", async () => {
    const out = tempDir("cw-golden-");
    const io = bufferIo();
    const code = await runCli(["plan", DESIGN, "--out", out], io);
    expect(code, io.err()).toBe(0);
    const text = await readFile(join(out, "build-list.csv"), "utf8");
    if (process.env.UPDATE_GOLDEN) await writeFile(GOLDEN, text);
    const golden = await readFile(GOLDEN, "utf8");
    const header = golden.split("\n")[0];
    expect(header).toBe(
      "cell,i,j,x_mm,y_mm,axis_deg,region,level,target_eps_z,target_mu_1,target_mu_2,achieved_eps_z,achieved_mu_1,achieved_mu_2," +
        "rel_error,quantization_error,zero_target_abs_error,family,host,inclusion,lattice,orientation,fill_fraction,width_mm,loss_tangent,flags",
    );
    expect(text).toBe(golden);
    const rows: Record<string, string>[] = parse(golden, { columns: true });
    // regions are numbered in level order
    const levelOfRegion = new Map(rows.map((r) => [Number(r.region), Number(r.level)]));
    const ids = [...levelOfRegion.keys()].sort((a, b) => a - b);
    ids.forEach((id, k) => { if (k > 0) expect(levelOfRegion.get(id)!).toBeGreaterThanOrEqual(levelOfRegion.get(ids[k - 1])!); });
    expect(rows.length).toBeGreaterThan(24);
    expect(rows.length).toBeLessThan(100);
    for (const r of rows.filter((_, k) => k % 7 === 0)) {
      const x = Number(r.x_mm) / 1000, y = Number(r.y_mm) / 1000;
      const radius = Math.hypot(x, y);
      // Li, Pendry, PRL 101, 203901 (2008): n² = n_b²/det J; for r' = x, θ' = y/R0, det J = r'/R0,
      // so ε_z = 1.2²·0.08/r (x_mm, y_mm are printed to 6 significant digits)
      expectClose(Number(r.target_eps_z), (1.44 * 0.08) / radius, { rel: 1e-5, label: `target row ${r.cell}` });
      // achieved: symmetric Bruggeman of resin (ε' 2.8) in air (ε' 1.00054), catalog values; the
      // loss (tan δ 0.03) shifts Re ε by O(tan²δ), hence 1e-3
      const f = Number(r.fill_fraction);
      expect(r.host).toBe("air");
      expect(r.inclusion).toBe("photopolymer-resin");
      expectClose(Number(r.achieved_eps_z), bruggeman3d(2.8, 1.00054, f), { rel: 1e-3, label: `achieved row ${r.cell}` });
      // strut lattice: f = 3(w/a)² − 2(w/a)³ (inclusion–exclusion of three square bars), a = 6 mm
      const w = Number(r.width_mm) / 6;
      expectClose(3 * w * w - 2 * w * w * w, f, { rel: 1e-4, label: `fill row ${r.cell}` });
      // error of the row, recomputed: |ε − ε_t|/|ε_t| with ε complex; Im ε = tan δ_eff · Re ε from
      // the row's own loss_tangent column (the same definition: |Im/Re| of the effective ε)
      const re = Number(r.achieved_eps_z), t = Number(r.target_eps_z), im = Number(r.loss_tangent) * re;
      expectClose(Number(r.rel_error), Math.hypot(re - t, im) / t, { rel: 2e-3, abs: 2e-6, label: `error row ${r.cell}` });
      // the quantization error alone: the level's real value against the cell's target cannot exceed it
      expect(Number(r.quantization_error)).toBeLessThanOrEqual(Number(r.rel_error) + 1e-3);
      expect(Number(r.level)).toBeLessThanOrEqual(4);
    }
  }, 30_000);
});
