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

  it("--frequency and --wavelength are exclusive; --layer-* come all together", async () => {
    const io = bufferIo();
    expect(await runCli(["cell", "rods-in-host", "--pitch", "1 mm", "--frequency", "10 GHz", "--wavelength", "3 cm", "--host", "air", "--inclusion", "alumina-96", "--fill", "0.2"], io)).toBe(1);
    const io2 = bufferIo();
    expect(await runCli(["cell", "rods-in-host", "--pitch", "1 mm", "--frequency", "10 GHz", "--host", "air", "--inclusion", "alumina-96", "--fill", "0.2", "--layer-core", "alumina-96"], io2)).toBe(1);
    expect(io2.err()).toMatch(/layer-thickness/);
  });
});
