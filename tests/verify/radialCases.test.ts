/**
 * radialCases.ts: verify's own cases (design → transform → reduction → scenes) solved with the
 * exact radial solver.
 */
import { describe, expect, it } from "vitest";
import { computeTensorField } from "../../src/field/computeTensorField.js";
import type { FieldDesign, TransformSpec } from "../../src/field/transformSpec.js";
import { reduceField } from "../../src/reduce/reduceField.js";
import { deviceCases } from "../../src/verify/deviceCases.js";
import { radialCases } from "../../src/verify/radialCases.js";
import { expectClose } from "../helpers/close.js";

const C0 = 299_792_458;
const f = 10e9, lambda = C0 / f, k0 = (2 * Math.PI) / lambda;

function casesOf(transform: TransformSpec, scheme: "full" | "unit-mu") {
  const design: FieldDesign = { name: "t", sourcePath: "t.json", background: { eps: 1, mu: 1 }, transform, grid: { pitchM: lambda / 20 } };
  const field = computeTensorField(design);
  const ideal = reduceField(field, { polarization: "Ez", scheme: "full" });
  const reduced = reduceField(field, { polarization: "Ez", scheme, unitAxis: "larger" });
  return deviceCases({ transform, fieldBackground: design.background, background: { eps: 1, mu: 1 }, polarization: "Ez", grid: field.grid, ideal, reduced, plan: null }).cases;
}

describe("verify cases with the radial solver", () => {
  it("cloak a = λ/2, b = λ, offset 1e-3 a, Ez: bare equals the PEC series, reduced/bare = 0.326 (Yan, Ruan & Qiu 2007), ideal/bare = 0.016 (Ruan et al. 2007: → 0 with the offset), no realized case", () => {
    const spec: TransformSpec = { kind: "radial-cloak", innerRadiusM: lambda / 2, outerRadiusM: lambda, profile: "linear", innerOffsetM: 1e-3 * lambda / 2 };
    const r = radialCases(spec, casesOf(spec, "unit-mu"), k0);
    const by = (n: string) => r.find((c) => c.name === n)!;
    expect(by("bare").available).toBe(true);
    // the bare conductor against the Bessel–Hankel series is checked in radialSolver.test.ts (Balanis 2012, §11.5)
    expect(by("bare").vsBare).toBe(1);
    expectClose(by("reduced").vsBare!, 0.3259, { rel: 2e-3, label: "reduced/bare (measured 0.32593 by radialSolver.test.ts's closed-form shell)" });
    expectClose(by("ideal").vsBare!, 0.01569, { rel: 2e-2, label: "ideal/bare at offset 1e-3 a (closed-form shell: 0.01569)" });
    expect(by("reduced").uncertainty!).toBeLessThan(1e-6);
    expect(by("reduced").bistaticM!.length).toBe(360);
    expect(by("realized").available).toBe(false);
    expect(by("realized").reason).toMatch(/no realization/);
  });

  it("an ideal concentrator (R1 = λ/4, R2 = λ/2, R3 = λ) is invisible: exact transformation, no singular edge (Rahm et al., Photonics Nanostruct. 6, 87 (2008))", () => {
    const spec: TransformSpec = { kind: "concentrator", innerRadiusM: lambda / 4, compressedRadiusM: lambda / 2, outerRadiusM: lambda };
    const r = radialCases(spec, casesOf(spec, "full"), k0);
    const ideal = r.find((c) => c.name === "ideal")!;
    expect(ideal.available, ideal.reason ?? "").toBe(true);
    // compared with a PEC cylinder of the outer radius (σ_s ≈ 4.2 λ for ka = 2π): at least 1e-6 smaller
    expect(ideal.scatteringWidthM!).toBeLessThan(1e-6 * lambda);
    // and the check is not vacuous: the same shell with the core left empty scatters
    const hollow = radialCases(spec, casesOf(spec, "full").map((c) => c.name !== "ideal" || !c.scene ? c : { ...c, scene: { ...c.scene, sample: (x: number, y: number, out: Float64Array) => (Math.hypot(x, y) < lambda / 4 ? 0 : c.scene!.sample(x, y, out)) } }), k0);
    expect(hollow.find((c) => c.name === "ideal")!.scatteringWidthM!).toBeGreaterThan(1e-2 * lambda);
  });

  it("a rotator is refused with the reason, case by case", () => {
    const spec: TransformSpec = { kind: "rotator", innerRadiusM: lambda / 4, outerRadiusM: lambda / 2, angleRad: 0.5 };
    const r = radialCases(spec, casesOf(spec, "full"), k0);
    for (const c of r) { expect(c.available).toBe(false); expect(c.reason).toMatch(/not diagonal in the polar basis|no realization/); }
  });
});
