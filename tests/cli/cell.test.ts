import { describe, expect, it } from "vitest";
import { bufferIo } from "../../src/cli/cliIo.js";
import { EXIT_INPUT, EXIT_NOT_BUILDABLE, EXIT_OK, runCli } from "../../src/cli/run.js";
import { expectClose } from "../helpers/close.js";

async function run(argv: string[]) {
  const io = bufferIo();
  const code = await runCli(argv, io);
  return { code, out: io.out(), err: io.err() };
}

describe("cellwright cell", () => {
  it("--json prints one object with dimensions, achieved ε per axis and checks", async () => {
    const r = await run(["cell", "rods-in-host", "--pitch", "0.8 mm", "--frequency", "10 GHz", "--host", "air", "--inclusion", "alumina-96", "--target", "2", "--json"]);
    expect(r.code).toBe(EXIT_OK);
    const j = JSON.parse(r.out);
    expect(j.familyId).toBe("rods-in-host");
    expectClose(j.achieved.perpendicular.re, 2, { rel: 1e-9 });
    expect(j.dimensions.radiusM).toBeGreaterThan(0);
    expect(j.homogenization.status).toBe("ok");
    expect(j.valid).toBe(true);
  });

  it("wire medium with the documented flags: plasma estimates, band and passivity figures", async () => {
    const r = await run(["cell", "wire-medium", "--pitch", "5mm", "--radius", "1um", "--frequency", "5GHz", "--json"]);
    expect(r.code).toBe(EXIT_OK);
    const j = JSON.parse(r.out);
    expect(j.host.id).toBe("air");
    expect(j.inclusion.id).toBe("copper");
    // thin-wire plasma frequency about 8.2 GHz for a = 5 mm, r = 1 µm (Pendry et al. 1996, from memory)
    expectClose(j.resonance.plasma.thinWireHz, 8.2e9, { rel: 0.03 });
    expect(j.achieved.parallel.re).toBeLessThan(0);
    expect(j.resonance.passivity.weak).toBeGreaterThan(0);
  });

  it("human output names the process problem and exits 2", async () => {
    const r = await run(["cell", "rods-in-host", "--pitch", "2mm", "--frequency", "5GHz", "--host", "air", "--inclusion", "alumina-96", "--target", "3", "--process", "fused-filament"]);
    expect(r.code).toBe(EXIT_NOT_BUILDABLE);
    expect(r.out).toMatch(/NOT buildable/);
    expect(r.err).toMatch(/does not take ceramic/);
  });

  it("a target outside the family's reach exits 2 with the reason", async () => {
    const r = await run(["cell", "rods-in-host", "--pitch", "1mm", "--frequency", "5GHz", "--host", "air", "--inclusion", "alumina-96", "--target", "12"]);
    expect(r.code).toBe(EXIT_NOT_BUILDABLE);
    expect(r.err).toMatch(/target 12/);
  });

  it.each([
    [["cell", "rod-in-host", "--pitch", "1mm", "--frequency", "5GHz"], /unknown cell family 'rod-in-host'; did you mean rods-in-host/],
    [["cell", "rods-in-host", "--pitch", "1mm", "--frequency", "5GHz", "--host", "air", "--inclusion", "alumna-96", "--fill", "0.2"], /--inclusion: unknown material 'alumna-96'; did you mean alumina-96/],
    [["cell", "rods-in-host", "--pitch", "1mm", "--frequency", "5GHz", "--host", "air", "--inclusion", "alumina-96", "--fill", "0.2", "--process", "fdm"], /--process: unknown process 'fdm'/],
    [["cell", "rods-in-host", "--pitch", "1mm", "--frequency", "5GHz", "--host", "air", "--inclusion", "alumina-96", "--fill=-0.1"], /--fill: expected a fill fraction in \[0, 1\], got '-0.1'/],
    [["cell", "rods-in-host", "--pitch", "1mm", "--frequency", "5GHz", "--host", "air", "--inclusion", "alumina-96", "--fill", "1.5"], /--fill: expected a fill fraction in \[0, 1\], got '1.5'/],
    [["cell", "rods-in-host", "--pitch", "1mm", "--frequency", "5GHz", "--host", "air", "--inclusion", "alumina-96", "--fill", "0.9"], /--fill: 0.9 is above the geometric limit 0.7854/],
    [["cell", "rods-in-host", "--pitch", "1mm", "--frequency", "5GHz", "--host", "air", "--inclusion", "alumina-96"], /give exactly one of --fill F or --target EPS/],
    [["cell", "spheres-in-host", "--pitch", "1mm", "--frequency", "5GHz", "--lattice", "hex", "--host", "air", "--inclusion", "alumina-96", "--fill", "0.1"], /--lattice: spheres-in-host takes cubic, not hex/],
    [["cell", "wire-medium", "--pitch", "5mm", "--radius", "1um", "--frequency", "5GHz", "--metal", "ptfe"], /--metal: 'ptfe' is a polymer; expected a metal/],
    [["cell", "rods-in-host", "--pitch", "3 GHz", "--frequency", "5GHz", "--host", "air", "--inclusion", "alumina-96", "--fill", "0.2"], /--pitch: expected a length/],
  ])("bad input %j: clear message, exit 1", async (argv, message) => {
    const r = await run(argv as string[]);
    expect(r.code).toBe(EXIT_INPUT);
    expect(r.err).toMatch(message as RegExp);
    expect(r.out).toBe("");
  });
});
