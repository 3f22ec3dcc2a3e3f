import { describe, expect, it } from "vitest";
import { InputError } from "../../src/core/errors.js";
import type { DeviceGrid } from "../../src/field/deviceGrid.js";
import { cylinderSeries, seriesScatteringWidth } from "../../src/verify/cylinderSeries.js";
import { fieldSvg } from "../../src/verify/fieldSvg.js";
import type { MaterialMap } from "../../src/verify/materialMap.js";
import { verifyDevice } from "../../src/verify/verifyDevice.js";
import { expectClose } from "../helpers/close.js";

const C0 = 299_792_458;

/** Cells of pitch p whose centres lie in the annulus rIn < r ≤ rOut (a device lattice like the field engine's). */
function annulusGrid(p: number, rIn: number, rOut: number): DeviceGrid {
  const n = Math.ceil((2 * rOut) / p);
  const origin = -((n - 1) * p) / 2;
  const is: number[] = [], js: number[] = [], xs: number[] = [], ys: number[] = [];
  for (let j = 0; j < n; j++) for (let i = 0; i < n; i++) {
    const x = origin + i * p, y = origin + j * p, r = Math.hypot(x, y);
    if (r > rIn && r <= rOut) { is.push(i); js.push(j); xs.push(x); ys.push(y); }
  }
  return {
    dimension: 2, pitchM: p, nx: n, ny: n, nz: 1, originXM: origin, originYM: origin, originZM: 0, count: is.length,
    i: Int32Array.from(is), j: Int32Array.from(js), k: new Int32Array(is.length),
    xM: Float64Array.from(xs), yM: Float64Array.from(ys), zM: new Float64Array(is.length),
  };
}

function uniformMap(count: number, b: number, t: number): MaterialMap {
  return { b: new Float64Array(count).fill(b), txx: new Float64Array(count).fill(t), tyy: new Float64Array(count).fill(t), txy: new Float64Array(count), missing: 0 };
}

const f = 10e9, lambda = C0 / f;

describe("verifyDevice", () => {
  it("a dielectric rod built of cells: σ near the exact series (same tolerance reasoning as the cylinder test, plus the cell staircase)", () => {
    const R = 0.4 * lambda;
    const grid = annulusGrid(lambda / 40, 0, R);
    const map = uniformMap(grid.count, 2.5, 1);
    const r = verifyDevice({ grid, polarization: "Ez", background: { eps: 1, mu: 1 }, frequencyHz: f, cases: [{ name: "ideal", map }, { name: "reduced", map }, { name: "realized", map }], hidden: null, resolution: 16 });
    const series = seriesScatteringWidth(cylinderSeries({ polarization: "Ez", radiusM: R, k0: (2 * Math.PI) / lambda, background: { eps: 1, mu: 1 }, interior: { kind: "dielectric", eps: 2.5, mu: 1 } }));
    expectClose(r.cases[0].scatteringWidthM, series, { rel: 0.04, label: "σ of a rod of cells" });
    expectClose(r.cases[0].scatteringPerWidth, r.cases[0].scatteringWidthM / r.deviceWidthM, { rel: 1e-12, label: "normalization" });
    // identical maps: identical fields
    expect(r.cases[1].fieldErrorVsIdeal).toBe(0);
    expect(r.cases[2].fieldErrorVsIdeal).toBe(0);
    expect(r.cases[0].fieldErrorVsIdeal).toBeNull();
    expect(Math.abs(r.cases[0].absorptionWidthM) / r.cases[0].scatteringWidthM).toBeLessThan(1e-9);
    expect(r.observationNodes).toBeGreaterThan(100);
  });

  it("a shell matching the background leaves the bare conductor's scattering unchanged (σ/σ_bare = 1); a different shell changes it", () => {
    const a = 0.25 * lambda, b = 0.5 * lambda;
    const grid = annulusGrid(lambda / 30, a, b);
    const hidden = { centerM: [0, 0] as [number, number], radiusM: a };
    const r = verifyDevice({
      grid, polarization: "Ez", background: { eps: 1, mu: 1 }, frequencyHz: f, hidden, resolution: 12,
      cases: [{ name: "ideal", map: uniformMap(grid.count, 1, 1) }, { name: "reduced", map: uniformMap(grid.count, 3, 1) }],
    });
    expect(r.cases.map((c) => c.name)).toEqual(["bare", "ideal", "reduced"]);
    expectClose(r.cases[1].vsBare!, 1, { rel: 1e-9, label: "background shell" });
    expect(Math.abs(r.cases[2].vsBare! - 1)).toBeGreaterThan(0.05);
    expect(r.cases[2].fieldErrorVsIdeal!).toBeGreaterThan(0.05);
  });

  it("refuses a resolution below 10 points per wavelength and grids beyond the solver's limits", () => {
    const grid = annulusGrid(lambda / 20, 0, lambda);
    const cases = [{ name: "ideal" as const, map: uniformMap(grid.count, 2, 1) }];
    const base = { grid, polarization: "Ez" as const, background: { eps: 1, mu: 1 }, frequencyHz: f, cases, hidden: null };
    expect(() => verifyDevice({ ...base, resolution: 6 })).toThrow(InputError);
    // 80 λ across at index 4 and 24 points per wavelength: about 7700² nodes, far beyond the default 8 GB;
    // refused before anything is allocated, naming the estimate and the largest resolution that fits
    const big = annulusGrid(lambda / 2, 0, 40 * lambda);
    try {
      verifyDevice({ ...base, grid: big, resolution: 24, cases: [{ name: "ideal", map: uniformMap(big.count, 4, 1) }] });
      expect.unreachable("expected a refusal");
    } catch (e) {
      expect(e).toBeInstanceOf(InputError);
      const issue = (e as InputError).issues[0];
      expect(issue.where).toBe("--resolution");
      expect(issue.message).toMatch(/needs about [\d.]+ GB for the direct solver .* more than the 8\.0 GB allowed; the largest resolution that fits is 1\d points per wavelength/);
    }
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
