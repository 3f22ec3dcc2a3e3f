import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { reduceField } from "../../src/reduce/reduceField.js";
import { compareSchemes, minBackgroundIndex, schemeSummary } from "../../src/reduce/schemeMetrics.js";
import { expectClose } from "../helpers/close.js";
import { linearMap, quadraticMap, radialCloakField, sphericalCloakField } from "./fixtures/fields.js";

const A = 0.0271, B = 0.0589; // Schurig et al., Science 314, 977 (2006) (from memory)

describe("schemeSummary on the linear cloak", () => {
  const field = radialCloakField(linearMap(A, B), 0.002);

  it("Ez/unit-mu: no ε < 1, every cell magnetic, anisotropy = largest (r/(r−a))², R = (a/(2b−a))²", () => {
    const s = schemeSummary(reduceField(field, { polarization: "Ez", scheme: "unit-mu" }), field);
    expect(s.cells).toBe(field.grid.count);
    expect(s.cellsEpsBelowOne).toBe(0);
    expect(s.cellsMagnetic).toBe(field.grid.count);
    // kept μ_t principal values ((r−a)/r)² and 1 (Schurig et al. 2006): ratio (r/(r−a))², largest at the innermost cell
    let rMin = Infinity;
    for (let c = 0; c < field.grid.count; c++) rMin = Math.min(rMin, Math.hypot(field.grid.xM[c], field.grid.yM[c]));
    expectClose(s.maxAnisotropy, (rMin / (rMin - A)) ** 2, { rel: 1e-6 });
    // Z = 1 − a/b at the outer edge (Yan, Ruan, Qiu 2007)
    expectClose(s.boundaryReflection, (A / (2 * B - A)) ** 2, { rel: 1e-10 });
    expectClose(s.ranges.eps_zz[0], (B / (B - A)) ** 2, { rel: 1e-12 });
    expectClose(s.ranges.eps_zz[1], (B / (B - A)) ** 2, { rel: 1e-12 });
    expectClose(s.muRange[1], 1, { rel: 1e-12 });
    expect(s.undefinedCells).toBe(0);
    expect(s.capped).toBe(0);
  });

  it("Hz/non-magnetic: no magnetic cell; ε_r < 1 where (b/(b−a))(r−a)/r < 1", () => {
    const s = schemeSummary(reduceField(field, { polarization: "Hz", scheme: "non-magnetic" }), field);
    expect(s.cellsMagnetic).toBe(0);
    // Cai et al. 2007: ε_r = (b/(b−a))²((r−a)/r)² < 1 ⇔ r < a·b/a = ... ⇔ r < ab/(b − (b−a)) = b·a/a; count directly
    let expected = 0;
    for (let c = 0; c < field.grid.count; c++) {
      const r = Math.hypot(field.grid.xM[c], field.grid.yM[c]);
      if ((B / (B - A)) * (r - A) / r < 1) expected++;
    }
    expect(s.cellsEpsBelowOne).toBe(expected);
    expectClose(s.fractionEpsBelowOne, expected / field.grid.count, { rel: 1e-15 });
  });

  it("names the capped cells", () => {
    // the fixture clips principal values above 20; the largest is μ_θ = r/(r−a) → ∞ at r = a
    const capped = radialCloakField(linearMap(A, B), 0.002, { capValue: 20 });
    const s = schemeSummary(reduceField(capped, { polarization: "Ez", scheme: "full" }), capped);
    const expected: number[] = [];
    for (let c = 0; c < capped.grid.count; c++) {
      const r = Math.hypot(capped.grid.xM[c], capped.grid.yM[c]);
      if (r / (r - A) > 20) expected.push(c);
    }
    expect(expected.length).toBeGreaterThan(10);
    expect(s.capped).toBe(expected.length);
    expect(s.cappedCells.map((n) => n.cell)).toEqual(expected.slice(0, 10));
    const first = s.cappedCells[0];
    expect(first.xM).toBe(capped.grid.xM[expected[0]]);
    // capped cells are still reduced (the capped values are what will be built), not undefined
    expect(s.undefinedCells).toBe(0);
  });

  it("counts and names undefined cells and leaves them out of ranges", () => {
    const f = radialCloakField(linearMap(A, B), 0.004);
    f.mu.zz[2] = Infinity;
    const s = schemeSummary(reduceField(f, { polarization: "Hz", scheme: "non-magnetic" }), f);
    expect(s.undefinedCells).toBe(1);
    expect(s.undefinedList[0].cell).toBe(2);
    expect(Number.isFinite(s.ranges.eps_xx[0]) && Number.isFinite(s.ranges.eps_xx[1])).toBe(true);
  });
});

describe("compareSchemes", () => {
  it("lists every scheme valid for the polarization, in order", () => {
    const field = radialCloakField(linearMap(A, B), 0.004);
    expect(compareSchemes(field, "Ez").map((s) => s.scheme)).toEqual(["full", "unit-mu", "isotropic", "matched"]);
    expect(compareSchemes(field, "Hz").map((s) => s.scheme)).toEqual(["full", "non-magnetic", "isotropic", "matched"]);
    expect(compareSchemes(sphericalCloakField(1, 2, 0.4), "3D").map((s) => s.scheme)).toEqual(["full"]);
  });
});

describe("minBackgroundIndex", () => {
  it("Hz/non-magnetic linear cloak: sqrt(floor/min ε_r) from the closed form", () => {
    // Cai et al. 2007: min ε over the cells is ε_r at the innermost cell
    const field = radialCloakField(linearMap(A, B), 0.002);
    const red = reduceField(field, { polarization: "Hz", scheme: "non-magnetic" });
    let rMin = Infinity;
    for (let c = 0; c < field.grid.count; c++) rMin = Math.min(rMin, Math.hypot(field.grid.xM[c], field.grid.yM[c]));
    const epsMin = (B / (B - A)) ** 2 * ((rMin - A) / rMin) ** 2;
    expectClose(minBackgroundIndex(red, 2), Math.sqrt(2 / epsMin), { rel: 1e-9 });
  });

  it("is 1 when vacuum already suffices (Ez/unit-mu: ε_z = (b/(b−a))² > 1)", () => {
    const field = radialCloakField(linearMap(A, B), 0.004);
    expect(minBackgroundIndex(reduceField(field, { polarization: "Ez", scheme: "unit-mu" }))).toBe(1);
  });

  it("is the smallest index that lifts every required ε to the floor (property)", () => {
    const schemes = { Ez: ["full", "unit-mu", "isotropic", "matched"], Hz: ["full", "non-magnetic", "isotropic", "matched"] };
    fc.assert(
      fc.property(
        fc.double({ min: 0.1, max: 0.6, noNaN: true }),
        fc.constantFrom<"Ez" | "Hz">("Ez", "Hz"),
        fc.nat(3),
        fc.double({ min: 0.3, max: 6, noNaN: true }),
        fc.boolean(),
        (aOverB, pol, which, floor, quadratic) => {
          const b = 0.05, a = aOverB * b;
          const map = quadratic && aOverB < 0.45 ? quadraticMap(a, b) : linearMap(a, b);
          const field = radialCloakField(map, 0.005, { boundarySamples: 16 });
          const scheme = schemes[pol][which];
          const nb = minBackgroundIndex(reduceField(field, { polarization: pol, scheme }), floor);
          const epsMinAt = (n: number) => {
            const red = reduceField(field, { polarization: pol, scheme, backgroundIndex: n });
            let lo = Infinity;
            for (let c = 0; c < red.count; c++) lo = Math.min(lo, red.epsMin[c]);
            return lo;
          };
          // the smallest principal value of a tensor with anisotropy q comes out of its Cartesian
          // components only to ~1e-16·q relative, hence the allowance
          let q = 1;
          for (let c = 0; c < field.grid.count; c++) q = Math.max(q, field.epsAnisotropy[c]);
          const slack = 1e-13 + 1e-14 * q;
          expect(epsMinAt(nb)).toBeGreaterThanOrEqual(floor * (1 - slack));
          if (nb > 1) expect(epsMinAt(nb * (1 - 1e-6))).toBeLessThan(floor);
          else expect(epsMinAt(1)).toBeGreaterThanOrEqual(floor * (1 - slack));
        },
      ),
      { seed: 42, numRuns: 60 },
    );
  });
});
