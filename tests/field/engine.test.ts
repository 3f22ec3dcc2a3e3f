/**
 * computeTensorField behaviour: expression maps reproduce the built-in cloak, folding maps are
 * errors naming cells, the inner offset and cap are applied and counted, grid membership.
 */
import { describe, it, expect } from "vitest";
import { expectClose } from "../helpers/close.js";
import { computeTensorField } from "../../src/field/computeTensorField.js";
import { summarizeField } from "../../src/field/summarizeField.js";
import { InputError } from "../../src/core/errors.js";
import { parseDesign } from "../../src/io/design/loadDesign.js";

const base = { name: "t", frequency: "10 GHz", grid: { pitch: "2 mm" } };

describe("expression maps", () => {
  it("reproduce the built-in linear cloak (same ε', μ' within 1e-9)", async () => {
    // the linear cloak's physical → virtual map r = b(r' − a)/(b − a) written out in x, y
    // (Pendry, Schurig, Smith, Science 312, 1780 (2006))
    const a = 0.02, b = 0.05;
    const f = `(${b} / (${b} - ${a})) * (1 - ${a} / sqrt(x^2 + y^2))`;
    const expr = await parseDesign({
      ...base, background: { eps: 2, mu: 1.5 },
      transform: { kind: "expression", virtual: { x: `x * ${f}`, y: `y * ${f}` }, region: { annulus: { innerRadius: a, outerRadius: b } } },
    }, "expr.json");
    const builtin = await parseDesign({
      ...base, background: { eps: 2, mu: 1.5 },
      transform: { kind: "radial-cloak", innerRadius: a, outerRadius: b },
    }, "cloak.json");
    const fe = computeTensorField(expr), fb = computeTensorField(builtin);
    expect(fe.grid.count).toBe(fb.grid.count);
    expect(Array.from(fe.grid.xM)).toEqual(Array.from(fb.grid.xM));
    for (const c of ["xx", "yy", "zz", "xy", "xz", "yz"] as const) {
      expectClose(fe.eps[c], fb.eps[c], { rel: 1e-9, abs: 1e-9, label: `eps_${c}` });
      expectClose(fe.mu[c], fb.mu[c], { rel: 1e-9, abs: 1e-9, label: `mu_${c}` });
    }
    expectClose(fe.detJ, fb.detJ, { rel: 1e-9, label: "det J" });
  });

  it("with atan2 (lifted by the chain rule) reproduce the built-in rotator", async () => {
    // rotator θ = θ' − θ0 (b − r')/(b − a) (Chen, Chan, Appl. Phys. Lett. 90, 241105 (2007))
    const a = 0.025, b = 0.05, th0 = Math.PI / 3;
    const r = "sqrt(x^2 + y^2)";
    const th = `atan2(y, x) - ${th0} * (${b} - ${r}) / (${b} - ${a})`;
    const expr = await parseDesign({
      ...base,
      transform: { kind: "expression", virtual: { x: `${r} * cos(${th})`, y: `${r} * sin(${th})` }, region: { annulus: { innerRadius: a, outerRadius: b } } },
    }, "expr.json");
    const builtin = await parseDesign({ ...base, transform: { kind: "rotator", innerRadius: a, outerRadius: b, angle: th0 } }, "rot.json");
    const fe = computeTensorField(expr), fb = computeTensorField(builtin);
    expect(fe.grid.count).toBe(fb.grid.count);
    for (const c of ["xx", "yy", "zz", "xy"] as const) expectClose(fe.eps[c], fb.eps[c], { rel: 1e-9, abs: 1e-9, label: `eps_${c}` });
  });

  it("a folding map is an error naming the expression and the first cells", async () => {
    // dX/dx = 1 − 3x²/R² < 0 for |x| > R/√3: the map folds inside the disk
    const d = await parseDesign({
      ...base, transform: { kind: "expression", virtual: { x: "x - x^3 / 0.02^2", y: "y" }, region: { circle: { radius: "30 mm" } } },
    }, "fold.json");
    let err: unknown;
    try { computeTensorField(d); } catch (e) { err = e; }
    expect(err).toBeInstanceOf(InputError);
    const issue = (err as InputError).issues[0];
    expect(issue.where).toBe("fold.json: $.transform.virtual");
    expect(issue.message).toMatch(/^the map \(x = 'x - x\^3 \/ 0\.02\^2', y = 'y'\) folds \(det J ≤ 0\) at \d+ cells, first cell \(\d+, \d+\) at/);
  });

  it("a map whose Jacobian is undefined at a cell (abs(x) at x = 0) is an error naming the expression", async () => {
    const d = await parseDesign({
      ...base, transform: { kind: "expression", virtual: { x: "x + abs(x) * 0.1", y: "y" }, region: { rectangle: { min: ["-5 mm", "-5 mm"], max: ["5 mm", "5 mm"] } } },
    }, "kink.json");
    expect(() => computeTensorField(d)).toThrow(/kink\.json: \$\.transform\.virtual: the map \(x = 'x \+ abs\(x\) \* 0\.1', y = 'y'\) is not defined/);
  });

  it("compiled derivatives that disagree with central differences are an error naming the expression", () => {
    // a deliberately wrong derivative: X = x² but ∂X/∂x reported as 1
    const wrong = (out: Float64Array, x: number, y: number): void => {
      out[0] = x * x; out[1] = y; out[2] = 1; out[3] = 0; out[4] = 0; out[5] = 1;
    };
    const spec = { kind: "expression" as const, virtual: { x: "x^2", y: "y" }, region: { shape: "rectangle" as const, minM: [0.01, 0] as [number, number], maxM: [0.02, 0.01] as [number, number] }, compiled: wrong };
    expect(() => computeTensorField({ name: "w", sourcePath: "w.json", background: { eps: 1, mu: 1 }, transform: spec, grid: { pitchM: 0.002 } }))
      .toThrow(/w\.json: \$\.transform\.virtual: the symbolic derivative ∂x\/∂x' of 'x\^2' is 1 but central differences give/);
  });
});

describe("singular inner boundary", () => {
  it("innerOffset moves near cells out and counts them; cap limits the largest principal value", async () => {
    const a = 0.02, b = 0.05;
    const d = await parseDesign({ ...base, transform: { kind: "radial-cloak", innerRadius: a, outerRadius: b, innerOffset: "1 mm", cap: 20 } }, "c.json");
    const f = computeTensorField(d);
    const s = summarizeField(f);
    let near = 0, overCap = 0;
    for (let c = 0; c < f.grid.count; c++) {
      const r = Math.hypot(f.grid.xM[c], f.grid.yM[c]);
      if (r < a + 0.001) near++;
      // uncapped ε_θ = r'/(r' − a) at the evaluation radius (Pendry et al. 2006)
      const re = Math.max(r, a + 0.001);
      if (re / (re - a) > 20) {
        expect(f.capped[c], `cell ${c} exceeds the cap`).toBe(1);
        overCap++;
      }
    }
    expect(near).toBeGreaterThan(0);
    expect(s.capped).toBeGreaterThanOrEqual(near);
    expect(overCap).toBeGreaterThan(0);
    expect(s.capValue).toBe(20);
    let maxP = 0;
    for (let c = 0; c < f.grid.count; c++) maxP = Math.max(maxP, f.epsPrincipal[2][c], f.muPrincipal[2][c]);
    expectClose(maxP, 20, { rel: 1e-12, label: "largest principal value after the cap" });
    // a cell at the offset radius: ε_r = (r'−a)/r' with r' = a + offset (Pendry et al. 2006)
    const c0 = Array.from(f.grid.xM).findIndex((x, c) => Math.hypot(x, f.grid.yM[c]) < a + 0.001);
    expectClose(f.epsPrincipal[0][c0], 0.001 / 0.021, { rel: 1e-9, label: "eps_r at the offset" });
  });

  it("without offset or cap nothing is capped", async () => {
    const d = await parseDesign({ ...base, transform: { kind: "radial-cloak", innerRadius: 0.02, outerRadius: 0.05 } }, "c.json");
    expect(summarizeField(computeTensorField(d)).capped).toBe(0);
  });
});

describe("device grid", () => {
  it("keeps exactly the cells whose centre lies in the device, row-major", async () => {
    const d = await parseDesign({ ...base, transform: { kind: "radial-cloak", innerRadius: 0.02, outerRadius: 0.05 } }, "c.json");
    const f = computeTensorField(d);
    const g = f.grid;
    let expected = 0;
    for (let j = 0; j < g.ny; j++) for (let i = 0; i < g.nx; i++) {
      const x = g.originXM + i * g.pitchM, y = g.originYM + j * g.pitchM, r = Math.hypot(x, y);
      if (r > 0.02 * (1 + 1e-9) && r <= 0.05 * (1 + 1e-12)) expected++;
    }
    expect(g.count).toBe(expected);
    for (let c = 1; c < g.count; c++) expect(g.j[c] * g.nx + g.i[c]).toBeGreaterThan(g.j[c - 1] * g.nx + g.i[c - 1]);
    // lattice centred on the device centre by default: a cell centre sits at (0, 0)
    expectClose(g.originXM + Math.round(-g.originXM / g.pitchM) * g.pitchM, 0, { abs: 1e-15, label: "origin" });
  });

  it("spherical cloak: 3D lattice by default, the z = 0 plane with grid.slice", async () => {
    const t = { kind: "spherical-cloak", innerRadius: "10 mm", outerRadius: "20 mm" };
    const full = computeTensorField(await parseDesign({ ...base, transform: t }, "s.json"));
    const slice = computeTensorField(await parseDesign({ ...base, transform: t, grid: { pitch: "2 mm", slice: true } }, "s.json"));
    expect(full.grid.dimension).toBe(3);
    expect(full.grid.nz).toBeGreaterThan(1);
    expect(slice.grid.dimension).toBe(2);
    expect(Array.from(slice.grid.zM).every((z) => z === 0)).toBe(true);
    const inPlane = Array.from(full.grid.zM).filter((z) => Math.abs(z) < 1e-15).length;
    expect(slice.grid.count).toBe(inPlane);
  });

  it("a pitch larger than the device leaves no cell: an error naming $.grid", async () => {
    const d = await parseDesign({ ...base, grid: { pitch: "1 m" }, transform: { kind: "radial-cloak", innerRadius: 0.02, outerRadius: 0.05 } }, "c.json");
    expect(() => computeTensorField(d)).toThrow(/c\.json: \$\.grid: no cell centre/);
  });
});

describe("shared arrays (memory at 1e6 cells)", () => {
  it("a 2D map in vacuum shares μ' with ε' (μ' = (μ_b/ε_b) ε') and one zero array for xz, yz", async () => {
    const d = await parseDesign({ name: "t", frequency: "10 GHz", transform: { kind: "radial-cloak", innerRadius: "20 mm", outerRadius: "50 mm" }, grid: { pitch: "5 mm" } }, "t.json");
    const f = computeTensorField(d);
    expect(f.mu).toBe(f.eps);
    expect(f.eps.xz).toBe(f.eps.yz);
    expect(f.eps.xz.every((v) => v === 0)).toBe(true);
    // a magnetic background keeps separate μ arrays, scaled by μ_b/ε_b
    const d2 = await parseDesign({ name: "t", frequency: "10 GHz", background: { eps: 2, mu: 3 }, transform: { kind: "radial-cloak", innerRadius: "20 mm", outerRadius: "50 mm" }, grid: { pitch: "5 mm" } }, "t.json");
    const f2 = computeTensorField(d2);
    expect(f2.mu.xx).not.toBe(f2.eps.xx);
    const every7 = (a: Float64Array) => Array.from(a).filter((_, c) => c % 7 === 0);
    expectClose(every7(f2.mu.xx), every7(f2.eps.xx).map((v) => 1.5 * v), { rel: 1e-12, label: "μ'_xx = 1.5 ε'_xx" });
  });
});
