import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { complex } from "../../src/core/complex.js";
import { getCellFamily } from "../../src/cells/registry.js";
import { expectClose } from "../helpers/close.js";

const air = complex(1);
const alumina = complex(9.6);

describe("effective permittivity per axis", () => {
  it("rods across the axis follow Maxwell Garnett for cylinders, along it the arithmetic mean", () => {
    // Maxwell Garnett, cylinders, field across: (ε−ε_h)/(ε+ε_h) = f(ε_i−ε_h)/(ε_i+ε_h) (Sihvola 1999);
    // solved: ε = ε_h(1+fβ)/(1−fβ), β = (ε_i−ε_h)/(ε_i+ε_h). Along: fε_i + (1−f)ε_h.
    const f = 0.3;
    const beta = (9.6 - 1) / (9.6 + 1);
    const e = getCellFamily("rods-in-host").effectivePermittivity(air, alumina, f, "square");
    expectClose(e.perpendicular.re, (1 + f * beta) / (1 - f * beta), { rel: 1e-12 });
    expectClose(e.parallel.re, f * 9.6 + (1 - f), { rel: 1e-12 });
  });

  it("laminate: Wiener parallel in the layers, series across them (Wiener 1912)", () => {
    const f = 0.25;
    const e = getCellFamily("laminate").effectivePermittivity(complex(2), complex(10), f, "square");
    expectClose(e.parallel.re, 0.25 * 10 + 0.75 * 2, { rel: 1e-12 });
    expectClose(e.perpendicular.re, 1 / (0.25 / 10 + 0.75 / 2), { rel: 1e-12 });
  });

  it("isotropic families give the same value on both axes and the phases at the ends", () => {
    for (const id of ["spheres-in-host", "cubes-in-host", "strut-lattice"]) {
      const fam = getCellFamily(id);
      const e = fam.effectivePermittivity(air, alumina, 0.2, "cubic");
      expect(e.parallel).toEqual(e.perpendicular);
      // both ends: f = 0 is the host (air), f = 1 the inclusion (an identity of every mixing rule)
      expectClose(fam.effectivePermittivity(air, alumina, 0, "cubic").parallel.re, air.re, { rel: 1e-12, label: `${id} f=0` });
      expectClose(fam.effectivePermittivity(air, alumina, 1, "cubic").parallel.re, alumina.re, { rel: 1e-12, label: `${id} f=1` });
    }
  });

  it("fillForTarget inverts the forward rule inside the geometric range", () => {
    const ids = ["rods-in-host", "holes-in-slab", "spheres-in-host", "cubes-in-host", "laminate", "strut-lattice"];
    fc.assert(
      fc.property(fc.integer({ min: 0, max: ids.length - 1 }), fc.double({ min: 0.01, max: 0.99, noNaN: true }), fc.boolean(), (k, u, par) => {
        const fam = getCellFamily(ids[k]);
        const lattice = fam.lattices[0];
        const [lo, hi] = fam.fillRange(lattice);
        const fill = lo + u * (hi - lo);
        const [host, inc] = fam.id === "holes-in-slab" ? [alumina, air] : [air, alumina];
        const axis = par ? "parallel" : "perpendicular";
        const target = fam.effectivePermittivity(host, inc, fill, lattice)[axis].re;
        const r = fam.fillForTarget(host, inc, target, axis, lattice);
        return r.inRange && Math.abs(r.fill - fill) < 1e-7;
      }),
      { seed: 42, numRuns: 200 },
    );
  });

  it("a target beyond touching rods is refused with the geometric limit named", () => {
    // MG cylinders, air/alumina: at f = π/4 ε⊥ = (1+fβ)/(1−fβ) ≈ 4.51 < 6 < 9.6, so ε⊥ = 6 needs f > π/4
    const r = getCellFamily("rods-in-host").fillForTarget(air, alumina, 6, "perpendicular", "square");
    expect(r.inRange).toBe(false);
    expect(Number.isNaN(r.fill)).toBe(true);
    expect(r.ruleFill).toBeGreaterThan(Math.PI / 4);
    expect(r.reason).toMatch(/geometric limit 0\.7854 \(touching rods, square lattice\)/);
  });
});

describe("Maxwell Garnett / Bruggeman spread per axis", () => {
  it("exact axes have none; MG axes use the pair of their dimension", async () => {
    const { cellSpread } = await import("../../src/cells/mixingSpread.js");
    const lam = getCellFamily("laminate");
    expect(cellSpread(lam.effectivePermittivity(air, alumina, 0.3, "square"), air, alumina, 0.3).max).toBe(0);
    // host 1, inclusion 4, f = 1/2: MG spheres (1+2fβ)/(1−fβ) with β = (4−1)/(4+2) = 1/2 gives 2;
    // Bruggeman 3D: 0.5(4−ε)/(4+2ε) + 0.5(1−ε)/(1+2ε) = 0 ⇔ 4ε² − 5ε − 8 = 0, ε = (5+√153)/8
    // (Maxwell Garnett 1904; Bruggeman 1935, as in references.md)
    const br = (5 + Math.sqrt(153)) / 8;
    const sph = getCellFamily("spheres-in-host");
    const s = cellSpread(sph.effectivePermittivity(air, complex(4), 0.5, "cubic"), air, complex(4), 0.5);
    expectClose(s.max, (br - 2) / br, { rel: 1e-9 });
    const rods = getCellFamily("rods-in-host");
    const r = cellSpread(rods.effectivePermittivity(air, complex(4), 0.5, "square"), air, complex(4), 0.5);
    expect(r.parallel).toBe(0);
    expect(r.perpendicular).toBeGreaterThan(0);
  });
});
