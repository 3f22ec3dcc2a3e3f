import { describe, expect, it } from "vitest";
import { boundaryImpedance, reflectionFromImpedance } from "../../src/reduce/boundaryImpedance.js";
import { reductionKernel } from "../../src/reduce/reduceCell.js";
import { reductionSettings } from "../../src/reduce/reduceField.js";
import { expectClose } from "../helpers/close.js";
import { inverseMapField, linearMap, quadraticMap, radialCloakField, sphericalCloakField } from "./fixtures/fields.js";
import type { TensorField } from "../../src/field/tensorField.js";

const A = 0.0271, B = 0.0589; // Schurig et al., Science 314, 977 (2006) (from memory)

function boundaryOf(field: TensorField, polarization: "Ez" | "Hz" | "3D", scheme: string, backgroundIndex?: number) {
  return boundaryImpedance(field, reductionKernel(reductionSettings(field, { polarization, scheme, backgroundIndex })));
}

describe("boundary impedance of the linear cloak", () => {
  const exact = radialCloakField(linearMap(A, B), 0.001);

  it("ideal (full) set: Z = 1, no reflection", () => {
    // the map is the identity on r = b, so the ideal cloak is reflectionless (Pendry, Schurig, Smith 2006).
    // Samples sit 1e-9·b inside the edge, where Z = r(b−a)/(b(r−a)) differs from 1 by ~1e-9·b/(b−a).
    const z = boundaryOf(exact, "Ez", "full");
    expect(z.source).toBe("boundary-samples");
    expect(z.samples).toBe(64);
    expectClose(z.impedanceMin, 1, { abs: 1e-8 });
    expectClose(z.impedanceMax, 1, { abs: 1e-8 });
    expect(z.reflectionMax).toBeLessThan(1e-16);
  });

  it("reduced Ez set: Z = 1 − a/b (Yan, Ruan, Qiu, Opt. Express 15, 17772 (2007))", () => {
    const z = boundaryOf(exact, "Ez", "unit-mu");
    expectClose(z.impedanceMin, 1 - A / B, { rel: 1e-12 });
    expectClose(z.impedanceMax, 1 - A / B, { rel: 1e-12 });
    // R = |(Z−1)/(Z+1)|² = (a/(2b−a))²
    expectClose(z.reflectionMax, (A / (2 * B - A)) ** 2, { rel: 1e-10 });
  });

  it("non-magnetic Hz set: Z = sqrt(μ_z/ε_θ) = 1 − a/b as well (Cai et al. 2007 set; Yan, Ruan, Qiu 2007)", () => {
    const z = boundaryOf(exact, "Hz", "non-magnetic");
    expectClose(z.impedanceMean, 1 - A / B, { rel: 1e-12 });
  });

  it("matched set: Z = 1", () => {
    for (const pol of ["Ez", "Hz"] as const) {
      const z = boundaryOf(exact, pol, "matched");
      expectClose(z.impedanceMax, 1, { rel: 1e-12 });
      expectClose(z.impedanceMin, 1, { rel: 1e-12 });
    }
  });

  it("in a dielectric background of index n_b the ideal set still matches (Z_b = 1/n_b)", () => {
    const z = boundaryOf(exact, "Ez", "full", 1.6);
    expectClose(z.impedanceMean, 1, { abs: 1e-8 });
  });

  it("without boundary samples, the outer edge cells give Z within a few per cent", () => {
    // edge cells sit up to about one pitch inside r = b and their normals are estimated from the
    // staircase; the unit-mu Z is 1 − a/b everywhere with the exact normal
    const cells = radialCloakField(linearMap(A, B), 0.001, { exact: false });
    const z = boundaryOf(cells, "Ez", "unit-mu");
    expect(z.source).toBe("edge-cells");
    // every edge cell lies on the outer rim, not the inner one (r near a)
    expect(z.samples).toBeGreaterThan(100);
    expectClose(z.impedanceMean, 1 - A / B, { rel: 0.03 });
    expectClose(z.impedanceGeoMean, 1 - A / B, { rel: 0.03 });
  });
});

describe("quadratic cloak", () => {
  it("its non-magnetic set is matched at r = b because g'(b) = 1 (Cai et al., APL 91, 111105 (2007))", () => {
    const q = radialCloakField(quadraticMap(0.02, 0.06), 0.001);
    const z = boundaryOf(q, "Hz", "non-magnetic");
    // ε_θ = 1/g'(r)² → 1 at r = b, samples 1e-9·b inside
    expectClose(z.impedanceMean, 1, { abs: 1e-8 });
    expect(z.reflectionMax).toBeLessThan(1e-16);
  });
});

describe("sheared slab y' = y + s·x", () => {
  // Rahm, Cummer, Schurig, Pendry, Smith, PRL 100, 063903 (2008): ε = μ = [[1, s, 0], [s, 1+s², 0], [0, 0, 1]],
  // reflectionless at its entry and exit faces x = const. Physical → virtual: x = x', y = y' − s x',
  // K = [[1, 0], [−s, 1]].
  const s = 0.7;
  const slab = inverseMapField((_x, _y, k) => { k[0] = 1; k[1] = 0; k[2] = -s; k[3] = 1; },
    { halfWidthM: 0.01, inside: (x, y) => Math.abs(x) < 0.005 && Math.abs(y) < 0.01 }, 0.0005);
  it("the fixture reproduces the published tensor", () => {
    expectClose([slab.eps.xx[0], slab.eps.xy[0], slab.eps.yy[0], slab.eps.zz[0]], [1, s, 1 + s * s, 1], { rel: 1e-14 });
  });
  it("Z = 1 at the x faces in both polarizations (the exact normal-incidence μ_eff = det μ_t/μ_nn)", () => {
    slab.outerBoundary = {
      xM: Float64Array.from([0.005 - 1e-9, -0.005 + 1e-9]), yM: Float64Array.from([0, 0.003]),
      normalX: Float64Array.from([1, -1]), normalY: Float64Array.from([0, 0]),
    };
    for (const pol of ["Ez", "Hz"] as const) {
      const z = boundaryOf(slab, pol, "full");
      expectClose(z.impedanceMin, 1, { rel: 1e-14 });
      expectClose(z.impedanceMax, 1, { rel: 1e-14 });
    }
  });
});

describe("spherical cloak (3D)", () => {
  it("ideal set is matched at r = b: ε_θ = μ_θ (Pendry, Schurig, Smith 2006), R small on staircased edge cells", () => {
    const sphere = sphericalCloakField(1, 2, 0.2);
    const z = boundaryOf(sphere, "3D", "full");
    expect(z.source).toBe("edge-cells");
    // ε = μ everywhere, so Z = sqrt(μ_t2t2/ε_t1t1) differs from 1 only through the normal estimate
    expect(z.reflectionMax).toBeLessThan(0.01);
    expectClose(z.impedanceGeoMean, 1, { rel: 0.05 });
  });
});

describe("reflectionFromImpedance", () => {
  it("is 0 for a matched edge, 1/9 for Z = 2 or 1/2 (|Γ| = 1/3), and symmetric in Z ↔ 1/Z", () => {
    // Γ = (Z−1)/(Z+1), any transmission-line text
    expect(reflectionFromImpedance(1)).toBe(0);
    expectClose(reflectionFromImpedance(2), 1 / 9, { rel: 1e-15 });
    expectClose(reflectionFromImpedance(0.5), 1 / 9, { rel: 1e-15 });
  });
});
