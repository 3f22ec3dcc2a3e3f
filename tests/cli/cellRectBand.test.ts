/** `cell … --lattice rect`: the lowest band along Γ–X, Γ–Y, Γ–S, anchored on the solved tensor. */
import { describe, expect, it } from "vitest";
import { runCli } from "../../src/cli/run.js";
import { bufferIo } from "../../src/cli/cliIo.js";
import { expectClose } from "../helpers/close.js";

describe("cell --lattice rect: band index", () => {
  it("holes in alumina, aspect 2, 0.8 mm at 20 GHz (λ/3 in the ceramic): three directions, anchored on ε_xx, ε_yy", async () => {
    const io = bufferIo();
    const code = await runCli(["cell", "holes-in-slab", "--lattice", "rect", "--aspect", "2", "--pitch", "0.8 mm", "--frequency", "20 GHz", "--host", "alumina-96", "--inclusion", "air", "--fill", "0.3", "--json"], io);
    expect(code).toBe(2); // coarser than λ/4: refused, the band is still reported
    const out = JSON.parse(io.out());
    const b = out.bandIndex;
    expect(b.names).toEqual(["Γ–X", "Γ–Y", "Γ–S"]);
    expect(b.inBand).toBe(true);
    // Hz: a wave along x has E along y → n² = ε_yy (the solved perpendicularY), along y → ε_xx
    expectClose(b.quasiStaticByDirection[0] ** 2, out.achieved.perpendicularY.re, { rel: 1e-12, label: "Γ–X" });
    expectClose(b.quasiStaticByDirection[1] ** 2, out.achieved.perpendicular.re, { rel: 1e-12, label: "Γ–Y" });
    // the expansion's ratio is kept; its own long-wavelength index is printed beside it
    for (let d = 0; d < 3; d++) {
      expectClose(b.directions[d] / b.quasiStaticByDirection[d], b.expansion.directions[d] / b.expansion.quasiStaticByDirection[d], { rel: 1e-12, label: `ratio ${d}` });
    }
    expectClose(out.spatialDispersion, Math.max(...[0, 1, 2].map((d) => Math.abs(b.directions[d] / b.quasiStaticByDirection[d] - 1))), { rel: 1e-9, label: "spatial dispersion" });
    expect(io.err()).not.toContain("not solved for rect");
  });
});
