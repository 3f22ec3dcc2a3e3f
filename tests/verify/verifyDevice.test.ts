/**
 * verifyDevice: the ladder of grids, Richardson extrapolation and uncertainty, against the exact
 * cylinder series (Balanis, "Advanced Engineering Electromagnetics", 2nd ed., 2012, §11.5; Bohren &
 * Huffman 1983, §8.4); the optical theorem; cases that cannot be computed; refusals.
 */
import { describe, expect, it } from "vitest";
import { InputError } from "../../src/core/errors.js";
import { cylinderScene } from "../../src/verify/cylinderScene.js";
import { cylinderSeries, seriesScatteringWidth, type CylinderInterior } from "../../src/verify/cylinderSeries.js";
import { fieldSvg } from "../../src/verify/fieldSvg.js";
import { verifyDevice, type CaseSpec } from "../../src/verify/verifyDevice.js";
import { expectClose } from "../helpers/close.js";

const C0 = 299_792_458;
const f = 10e9, lambda = C0 / f, k0 = (2 * Math.PI) / lambda;
const vacuum = { eps: 1, mu: 1 };

function cylinderRun(pol: "Ez" | "Hz", interior: CylinderInterior, ka: number, extra: Partial<Parameters<typeof verifyDevice>[0]> = {}) {
  const a = ka / k0;
  const index = interior.kind === "pec" ? 1 : Math.sqrt(interior.eps * interior.mu);
  const cases: CaseSpec[] = [{ name: "ideal", scene: cylinderScene(pol, vacuum, a, interior), indexHint: index }];
  const r = verifyDevice({ polarization: pol, background: vacuum, frequencyHz: f, deviceBox: { minX: -a, maxX: a, minY: -a, maxY: a }, cases, marginM: 0.3 * lambda, ...extra });
  const series = seriesScatteringWidth(cylinderSeries({ polarization: pol, radiusM: a, k0, background: vacuum, interior }));
  return { r, c: r.cases[0], series };
}

describe("verifyDevice against the cylinder series at the default accuracy (2 %)", () => {
  it.each([
    ["Ez", { kind: "pec" }, 1],
    ["Ez", { kind: "pec" }, 2 * Math.PI],
    ["Hz", { kind: "pec" }, 1],
    ["Hz", { kind: "pec" }, 2 * Math.PI],
    ["Ez", { kind: "dielectric", eps: 2.5, mu: 1 }, 1],
    ["Ez", { kind: "dielectric", eps: 2.5, mu: 1 }, Math.PI],
    ["Hz", { kind: "dielectric", eps: 2.5, mu: 1 }, 1],
    ["Hz", { kind: "dielectric", eps: 2.5, mu: 1 }, Math.PI],
  ] as const)("%s %o, ka = %d: extrapolated σ within 1 % of the series, the uncertainty covers the error", (pol, interior, ka) => {
    const { c, series, r } = cylinderRun(pol, interior as CylinderInterior, ka);
    expect(r.resolutions.length).toBeGreaterThanOrEqual(3);
    const err = Math.abs(c.scatteringWidthM! / series - 1);
    expect(err, `σ ${c.scatteringWidthM} vs ${series}`).toBeLessThan(0.01);
    expect(c.uncertainty).not.toBeNull();
    expect(c.converged).toBe(true);
    // lossless: the optical theorem (extinction from the forward far field = scattering) holds on the grid
    expect(Math.abs(c.powerBalance!), "power balance").toBeLessThan(0.01);
  });

  it("the convergence order measured on a finer ladder is near the scheme's nominal order 2 (Ez conductor, cut links: Gibou et al., J. Comput. Phys. 176, 205 (2002))", () => {
    const a = 0.3 * lambda;
    const series = seriesScatteringWidth(cylinderSeries({ polarization: "Ez", radiusM: a, k0, background: vacuum, interior: { kind: "pec" } }));
    const errs: number[] = [], hs: number[] = [];
    for (const res of [30, 42, 60]) {
      const { c, r } = cylinderRun("Ez", { kind: "pec" }, k0 * a, { resolution: res });
      errs.push(Math.abs(c.scatteringWidthM! - series)); hs.push(r.grid.h);
    }
    const p1 = Math.log(errs[0] / errs[1]) / Math.log(hs[0] / hs[1]), p2 = Math.log(errs[1] / errs[2]) / Math.log(hs[1] / hs[2]);
    expect(p1).toBeGreaterThan(1.5); expect(p1).toBeLessThan(2.6);
    expect(p2).toBeGreaterThan(1.5); expect(p2).toBeLessThan(2.6);
  });
});

describe("verifyDevice cases and refusals", () => {
  it("a case without a scene is reported with its reason, never as a copy of another case", () => {
    const a = 0.2 * lambda;
    const r = verifyDevice({
      polarization: "Ez", background: vacuum, frequencyHz: f, deviceBox: { minX: -a, maxX: a, minY: -a, maxY: a }, resolution: 10,
      cases: [{ name: "ideal", scene: cylinderScene("Ez", vacuum, a, { kind: "pec" }), indexHint: 1 }, { name: "realized", scene: null, reason: "no realization", indexHint: 0 }],
    });
    expect(r.cases[1]).toMatchObject({ name: "realized", available: false, reason: "no realization", scatteringWidthM: null, vsBare: null });
    expect(r.cases[0].uncertainty).toBeNull(); // single grid: no convergence evidence
  });

  it("refuses a device below 1/100 of a wavelength and a grid the solver cannot hold, quoting the figure over its limit", () => {
    const a = 1e-3;
    const cases: CaseSpec[] = [{ name: "ideal", scene: cylinderScene("Ez", vacuum, a, { kind: "pec" }), indexHint: 1 }];
    const base = { polarization: "Ez" as const, background: vacuum, cases, deviceBox: { minX: -a, maxX: a, minY: -a, maxY: a } };
    // 1 Hz: λ = 300 000 km
    expect(() => verifyDevice({ ...base, frequencyHz: 1 })).toThrow(/below 1\/100 of a wavelength/);
    try {
      verifyDevice({ ...base, frequencyHz: 3e13, resolution: 40 });
      expect.unreachable("expected a refusal");
    } catch (e) {
      expect(e).toBeInstanceOf(InputError);
      const msg = (e as InputError).issues[0].message;
      expect(msg).toMatch(/needs about [\d.]+ GB for the direct solver \(limit 8\.0 GB\)/);
      expect(msg).toMatch(/largest resolution that fits|do not fit/);
    }
    expect(() => verifyDevice({ ...base, frequencyHz: 1e11, resolution: 3 })).toThrow(/--resolution/);
    expect(() => verifyDevice({ ...base, frequencyHz: 1e11, accuracy: 0 })).toThrow(/--accuracy/);
  });
});

describe("fieldSvg", () => {
  it("draws one panel per case with titles, on a shared scale", () => {
    const g = { nx: 30, ny: 20, h: 1, x0: 0, y0: 0, pml: 5 };
    const mag = new Float64Array(600).map((_, k) => (k % 30) / 30);
    const mask = new Uint8Array(600); mask[10 + 30 * 10] = 1;
    const svg = fieldSvg(g, [{ title: "ideal", magnitude: mag }, { title: "reduced <b>", magnitude: mag }], mask, { title: "test" });
    expect(svg.startsWith("<svg")).toBe(true);
    expect(svg.trimEnd().endsWith("</svg>")).toBe(true);
    expect(svg).toContain(">ideal<");
    expect(svg).toContain("reduced &lt;b&gt;");
    expect((svg.match(/<g /g) ?? []).length).toBe(2);
  });
});
