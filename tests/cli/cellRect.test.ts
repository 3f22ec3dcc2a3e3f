import { describe, expect, it } from "vitest";
import { runCli } from "../../src/cli/run.js";
import { bufferIo } from "../../src/cli/cliIo.js";
import { complex } from "../../src/core/complex.js";
import { rodsInHost } from "../../src/cells/families/rodsInHost.js";
import { holesInSlab } from "../../src/cells/families/holesInSlab.js";
import { solvedInPlane } from "../../src/cells/homogenize/homogenizationTable.js";
import { rectCircleNode, rectErrorEnvelope } from "../../src/cells/homogenize/rectCircleTable.js";
import { expectClose } from "../helpers/close.js";

async function cell(argv: string[], json = true): Promise<{ code: number; out: string; err: string }> {
  const io = bufferIo();
  const code = await runCli(["cell", ...argv, ...(json ? ["--json"] : [])], io);
  return { code, out: io.out(), err: io.err() };
}

describe("rect lattices in the rods and holes families", () => {
  it("geometry: touching at r = min(a, b)/2, f = πr²/(ab), the y spacing among the dimensions, round trip", () => {
    // circle packing on a rectangular lattice (geometry)
    expectClose(rodsInHost.fillRange("rect", 2)[1], Math.PI / 8, { rel: 1e-14 });
    expectClose(rodsInHost.fillRange("rect", 0.5)[1], Math.PI / 8, { rel: 1e-14 });
    const d = rodsInHost.dimensionsFromFill(0.3, 1e-3, "rect", 2);
    expectClose(d.radiusM, Math.sqrt((0.3 * 2e-6) / Math.PI), { rel: 1e-14 });
    expectClose(d.spacingYM, 2e-3, { rel: 1e-14 });
    expectClose(rodsInHost.fillFromDimensions(d, 1e-3, "rect", 2), 0.3, { rel: 1e-14 });
    // the wall is taken across the shorter spacing
    const w = holesInSlab.smallestFeatureM(0.3, 1e-3, "rect", 0.5);
    expectClose(w.featureM, 0.5e-3 - 2 * Math.sqrt((0.3 * 0.5e-6) / Math.PI), { rel: 1e-12 });
  });

  it("aspect 1 is the square lattice (shipped table), and xx ≠ yy from the solved table otherwise", () => {
    const host = complex(2.05, 0.0004), inc = complex(9.4, 0.0056);
    const sq = rodsInHost.effectivePermittivity(host, inc, 0.4, "square");
    const r1 = rodsInHost.effectivePermittivity(host, inc, 0.4, "rect", { aspect: 1 });
    expect(r1.perpendicular).toEqual(sq.perpendicular);
    expect(r1.perpendicularY).toEqual(sq.perpendicular);
    const r2 = rodsInHost.effectivePermittivity(host, inc, 0.3, "rect", { aspect: 2 });
    expect(r2.rules.perpendicularY).toBe("solved-cell");
    const node = rectCircleNode(9.4 / 2.05, 0.3, 2);
    expectClose(r2.perpendicular.re, 2.05 * node.xx, { rel: rectErrorEnvelope(9.4 / 2.05), label: "xx" });
    expectClose(r2.perpendicularY!.re, 2.05 * node.yy, { rel: rectErrorEnvelope(9.4 / 2.05), label: "yy" });
    expect(r2.perpendicular.re).toBeGreaterThan(r2.perpendicularY!.re);
    // loss to first order in Im u, as the square table does (Bergman 1978: F analytic in u)
    const sqLoss = solvedInPlane("square", host, inc, 0.3).eps.im;
    expect(r2.perpendicular.im).toBeGreaterThan(0);
    expectClose(r2.perpendicular.im, sqLoss, { rel: 0.5, label: "same order as the square lattice's loss" });
  });

  it("fillForTarget on either in-plane axis hits the target (inverse undoes forward)", () => {
    const host = complex(8, 0), air = complex(1, 0);
    for (const axis of ["perpendicular", "perpendicularY"] as const) {
      const r = holesInSlab.fillForTarget(host, air, 5, axis, "rect", { aspect: 2 });
      expect(r.inRange).toBe(true);
      const e = holesInSlab.effectivePermittivity(host, air, r.fill, "rect", { aspect: 2 });
      expectClose((axis === "perpendicular" ? e.perpendicular : e.perpendicularY!).re, 5, { rel: 1e-9, label: axis });
    }
  });

  it("cell --lattice rect --aspect 2 --json: both in-plane components, target on perpendicular-y met", async () => {
    const { code, out } = await cell(["holes-in-slab", "--lattice", "rect", "--aspect", "2", "--pitch", "60 nm", "--wavelength", "1550 nm", "--host", "silicon-nir", "--inclusion", "air",
      "--target", "5", "--axis", "perpendicular-y", "--layer-core", "silicon-nir", "--layer-thickness", "220 nm", "--layer-below", "fused-silica-optical", "--layer-above", "air"]);
    const j = JSON.parse(out);
    expect(j.lattice).toBe("rect");
    expect(j.aspect).toBe(2);
    expectClose(j.achieved.perpendicularY.re, 5, { rel: 1e-9 });
    expect(j.achieved.perpendicular.re).toBeGreaterThan(j.achieved.perpendicularY.re);
    expect(j.rules.perpendicularY).toBe("solved-cell");
    expect(j.closedForm.perpendicularY.re).toBe(j.closedForm.perpendicular.re);
    expectClose(j.dimensions.spacingYM, 120e-9, { rel: 1e-12 });
    expect(j.spread.perpendicularY).toBeGreaterThan(0);
    expect(code).toBe(0);
  });

  it("the homogenization check uses the longer spacing", async () => {
    const a = JSON.parse((await cell(["rods-in-host", "--lattice", "rect", "--aspect", "3", "--pitch", "1 mm", "--frequency", "10 GHz", "--host", "ptfe", "--inclusion", "alumina-96", "--fill", "0.1"])).out);
    const s = JSON.parse((await cell(["rods-in-host", "--lattice", "square", "--pitch", "3 mm", "--frequency", "10 GHz", "--host", "ptfe", "--inclusion", "alumina-96", "--fill", "0.1"])).out);
    expectClose(a.homogenization.ratio, s.homogenization.ratio, { rel: 1e-12 });
  });

  it("option errors name the option", async () => {
    const base = ["rods-in-host", "--pitch", "1 mm", "--frequency", "10 GHz", "--host", "ptfe", "--inclusion", "alumina-96", "--fill", "0.1"];
    const r1 = await cell([...base, "--lattice", "rect"], false);
    expect(r1.code).toBe(1);
    expect(r1.err).toContain("--aspect");
    const r2 = await cell([...base, "--aspect", "2"], false);
    expect(r2.code).toBe(1);
    expect(r2.err).toContain("only with --lattice rect");
    const r3 = await cell([...base, "--lattice", "rect", "--aspect", "9"], false);
    expect(r3.code).toBe(1);
    expect(r3.err).toContain("0.25…4");
    const r4 = await cell(["rods-in-host", "--pitch", "1 mm", "--frequency", "10 GHz", "--host", "ptfe", "--inclusion", "alumina-96", "--target", "3", "--axis", "perpendicular-y"], false);
    expect(r4.code).toBe(1);
    expect(r4.err).toContain("needs --lattice rect");
  });
});
