import { describe, expect, it } from "vitest";
import { runCli } from "../../src/cli/run.js";
import { bufferIo } from "../../src/cli/cliIo.js";
import { expectClose } from "../helpers/close.js";

async function cellJson(argv: string[]): Promise<{ code: number; out: Record<string, any>; err: string }> {
  const io = bufferIo();
  const code = await runCli(["cell", ...argv, "--json"], io);
  return { code, out: JSON.parse(io.out()), err: io.err() };
}

describe("cell: solved values, layer and wire cut-off in --json", () => {
  it("holes in a 220 nm silicon film: solved perpendicular, closed form beside it, slab mode index, band index", async () => {
    const { out } = await cellJson(["holes-in-slab", "--lattice", "hex", "--pitch", "100 nm", "--wavelength", "1550 nm", "--host", "silicon-nir", "--inclusion", "air", "--target", "5",
      "--layer-core", "silicon-nir", "--layer-thickness", "220 nm", "--layer-below", "fused-silica-optical", "--layer-above", "air"]);
    expect(out.rules.perpendicular).toBe("solved-cell");
    expectClose(out.achieved.perpendicular.re, 5, { rel: 1e-9 });
    expect(out.closedForm.rules.perpendicular).toBe("mg-cylinder");
    // Kogelnik three-layer slab, TE₀ of 220 nm Si on SiO₂ under air at 1550 nm (see slabModes.test.ts)
    expectClose(out.layer.modeIndex, 2.8313, { abs: 2e-4 });
    expect(out.layer.guidedModes).toBe(1);
    expectClose(out.host.eps.re, out.layer.modeIndex ** 2, { rel: 1e-9 });
    expect(out.bandIndex.directions).toHaveLength(2);
    expect(out.spatialDispersion).toBeLessThan(0.05);
  });

  it("wire medium: plasmaFrequencyHz is the lattice value, the thin-wire forms beside it", async () => {
    const { out } = await cellJson(["wire-medium", "--target", "-1", "--pitch", "5 mm", "--frequency", "10 GHz"]);
    expectClose(out.achieved.parallel.re, -1, { rel: 1e-9 });
    expect(out.plasmaModel).toBe("lattice");
    expect(out.plasmaFrequencyHz).toBeGreaterThan(14e9);
    expect(out.thinWireForms.thickWireHz).toBeGreaterThan(out.plasmaFrequencyHz);
  });

  it("wire medium below its plasma frequency (ε' = −30): the size check uses the propagating phases' wavelength, not |ε| as an index", async () => {
    // ε < 0 carries no wave (Belov et al., Phys. Rev. B 67, 113103 (2003): the local wire-medium model
    // needs a ≪ λ in the host); 4 mm at 10 GHz is 0.133 λ0, and the densest propagating phase is the
    // cell's ε across the wires (Maxwell Garnett, ≈ 1.72): 4 mm · 1.31 / 30 mm = 0.175 — above λ/10, below λ/4
    const r = await cellJson(["wire-medium", "--target", "-30", "--pitch", "4 mm", "--frequency", "10 GHz"]);
    expect(r.code, r.err).toBe(0);
    expect(r.out.valid).toBe(true);
    expect(r.out.homogenization.status).toBe("warn");
    expectClose(r.out.homogenization.nMax, Math.sqrt(r.out.achieved.perpendicular.re), { rel: 1e-6 });
    expectClose(r.out.homogenization.ratio, (4e-3 * r.out.homogenization.nMax * 10e9) / 299792458, { rel: 1e-9 });
    // the decay length c/(ω√|ε'|) = 0.87 mm is stated
    expect(r.out.notes.join(" ")).toMatch(/decays over δ = 0\.000871/);
    // a positive effective ε still counts by its index: a ε' = 0.5 wire medium at 12 mm pitch (0.4 λ0) is refused
    const coarse = await cellJson(["wire-medium", "--target", "0.5", "--pitch", "12 mm", "--frequency", "10 GHz"]);
    expect(coarse.out.homogenization.status).toBe("refuse");
  });

  it("--frequency and --wavelength are exclusive; --layer-* come all together", async () => {
    const io = bufferIo();
    expect(await runCli(["cell", "rods-in-host", "--pitch", "1 mm", "--frequency", "10 GHz", "--wavelength", "3 cm", "--host", "air", "--inclusion", "alumina-96", "--fill", "0.2"], io)).toBe(1);
    const io2 = bufferIo();
    expect(await runCli(["cell", "rods-in-host", "--pitch", "1 mm", "--frequency", "10 GHz", "--host", "air", "--inclusion", "alumina-96", "--fill", "0.2", "--layer-core", "alumina-96"], io2)).toBe(1);
    expect(io2.err()).toMatch(/layer-thickness/);
  });
});
