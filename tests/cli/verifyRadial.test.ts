/** `verify --method radial` on the demo designs (exact radial solution, no grid). */
import { describe, expect, it } from "vitest";
import { join } from "node:path";
import { DEMO_DIR, cliInTempDir } from "../helpers/cliInTempDir.js";
import { cylinderSeries, seriesScatteringWidth } from "../../src/verify/cylinderSeries.js";
import { expectClose } from "../helpers/close.js";

const DEMO = DEMO_DIR;
const CLOAK = join(DEMO, "field-radial-cloak.json"); // linear cloak a = 20 mm, b = 50 mm, 9.4 GHz, Ez
const CONCENTRATOR = join(DEMO, "field-concentrator.json");
const cli = cliInTempDir("verify", "cw-verify-radial-");
const run = cli.run;

describe("verify --method radial", () => {
  it("--json: one object; the bare mast equals the PEC series (Balanis 2012, §11.5), the cloak scatters far less, the pattern averages to σ_s and turns with --angle", async () => {
    const r = await run([CLOAK, "--method", "radial", "--json", "--angle", "30"]);
    expect(r.code, r.err).toBe(0);
    const lines = r.out.trim().split("\n");
    expect(lines).toHaveLength(1);
    const s = JSON.parse(lines[0]);
    expect(s.method).toBe("radial");
    expect(s.cases.map((c: { name: string }) => c.name)).toEqual(["bare", "ideal", "reduced", "realized"]);
    const [bare, ideal, , realized] = s.cases;
    const k0 = (2 * Math.PI * 9.4e9) / 299_792_458;
    const series = seriesScatteringWidth(cylinderSeries({ polarization: "Ez", radiusM: 0.02, k0, background: { eps: 1, mu: 1 }, interior: { kind: "pec" } }));
    expectClose(bare.scatteringWidthM, series, { rel: 1e-7, label: "bare mast" });
    expect(ideal.vsBare).toBeLessThan(0.1);
    expect(ideal.converged).toBe(true);
    expect(realized.available).toBe(false);
    expect(realized.reason).toMatch(/no realization/);
    const b: number[] = ideal.bistaticM;
    expect(b).toHaveLength(360);
    expectClose(b.reduce((x, y) => x + y, 0) / 360, ideal.scatteringWidthM, { rel: 1e-9, label: "mean of the pattern" });
    expect(b.indexOf(Math.max(...b))).toBe(30); // forward scattering follows the incidence
  });

  it("the ideal concentrator is invisible and counts as converged (uncertainty relative to 1e-6 of its width)", async () => {
    const r = await run([CONCENTRATOR, "--method", "radial", "--json"]);
    expect(r.code, r.err).toBe(0);
    const ideal = JSON.parse(r.out).cases.find((c: { name: string }) => c.name === "ideal");
    expect(ideal.scatteringWidthM).toBeLessThan(1e-12);
    expect(ideal.converged).toBe(true);
  });

  it("refuses options that need a grid or a beam, and an unknown method", async () => {
    for (const extra of [["--beam", "40 mm"], ["--resolution", "20"], ["--margin", "5 mm"], ["--out", "x"]]) {
      const r = await run([CLOAK, "--method", "radial", ...extra]);
      expect(r.code).toBe(1);
      expect(r.err).toContain(extra[0]);
    }
    const r = await run([CLOAK, "--method", "spectral"]);
    expect(r.code).toBe(1);
    expect(r.err).toMatch(/expected auto, fdfd, radial/);
  });
});
