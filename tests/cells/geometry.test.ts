import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { InputError } from "../../src/core/errors.js";
import { strutFill, strutWidthRatio } from "../../src/cells/families/strutLattice.js";
import { CELL_FAMILIES, getCellFamily } from "../../src/cells/registry.js";
import { expectClose } from "../helpers/close.js";

describe("geometric fill limits", () => {
  it("touching circles: π/4 in a square lattice, π/(2√3) in a hexagonal one", () => {
    // circle packing in the plane (any geometry text): r = a/2 in a cell of area a² or (√3/2)a²
    for (const id of ["rods-in-host", "holes-in-slab"]) {
      const f = getCellFamily(id);
      expectClose(f.fillRange("square")[1], Math.PI / 4, { rel: 1e-15, label: `${id} square` });
      expectClose(f.fillRange("hex")[1], Math.PI / (2 * Math.sqrt(3)), { rel: 1e-15, label: `${id} hex` });
      // at the limit the radius is half the pitch and the wall vanishes
      expectClose(f.dimensionsFromFill(Math.PI / 4, 1e-3, "square").radiusM, 0.5e-3, { rel: 1e-12 });
      expectClose(f.dimensionsFromFill(Math.PI / (2 * Math.sqrt(3)), 1e-3, "hex").radiusM, 0.5e-3, { rel: 1e-12 });
    }
  });

  it("touching spheres on a simple cubic lattice: π/6", () => {
    // (4/3)π(a/2)³/a³ = π/6 (sphere packing, simple cubic)
    expectClose(getCellFamily("spheres-in-host").fillRange("cubic")[1], Math.PI / 6, { rel: 1e-15 });
  });

  it("strut lattice: f = 3(w/a)² − 2(w/a)³ and its inverse", () => {
    // f(1/2) = 3/4 − 1/4 = 1/2; f(1) = 1; f(0.1) = 0.03 − 0.002 = 0.028 (the formula of the issue)
    expectClose(strutFill(0.5), 0.5, { abs: 1e-15 });
    expectClose(strutFill(1), 1, { abs: 1e-15 });
    expectClose(strutFill(0.1), 0.028, { rel: 1e-12 });
    const fam = getCellFamily("strut-lattice");
    expectClose(fam.dimensionsFromFill(0.028, 2e-3, "cubic").widthM, 0.2e-3, { rel: 1e-10 });
    fc.assert(fc.property(fc.double({ min: 0, max: 1, noNaN: true }), (x) => Math.abs(strutWidthRatio(strutFill(x)) - x) < 1e-7), { seed: 42, numRuns: 200 });
  });

  it("smallest features: rod diameter and wall; for holes the wall is the solid part", () => {
    // square lattice, a = 1 mm, r = 0.3 mm: f = π·0.09 ≈ 0.2827; diameter 0.6 mm, wall 0.4 mm
    const f = Math.PI * 0.09;
    const rods = getCellFamily("rods-in-host").smallestFeatureM(f, 1e-3, "square");
    expectClose([rods.featureM, rods.gapM], [0.6e-3, 0.4e-3], { rel: 1e-12 });
    const holes = getCellFamily("holes-in-slab").smallestFeatureM(f, 1e-3, "square");
    expectClose([holes.featureM, holes.gapM], [0.4e-3, 0.6e-3], { rel: 1e-12 });
  });
});

describe("dimensions ↔ fill round trip over the registry", () => {
  it("every family and lattice: fillFromDimensions(dimensionsFromFill(f)) = f", () => {
    const cases = CELL_FAMILIES.flatMap((fam) => fam.lattices.map((lattice) => ({ fam, lattice })));
    expect(cases.length).toBeGreaterThanOrEqual(CELL_FAMILIES.length);
    fc.assert(
      fc.property(
        fc.integer({ min: 0, max: cases.length - 1 }),
        fc.double({ min: 0, max: 1, noNaN: true }),
        fc.double({ min: 1e-8, max: 1, noNaN: true }),
        (k, u, pitchM) => {
          const { fam, lattice } = cases[k];
          const [lo, hi] = fam.fillRange(lattice);
          const fill = lo + u * (hi - lo);
          const dims = fam.dimensionsFromFill(fill, pitchM, lattice);
          for (const v of Object.values(dims)) if (!(v >= 0 && Number.isFinite(v))) return false;
          const back = fam.fillFromDimensions(dims, pitchM, lattice);
          const f = fam.smallestFeatureM(fill, pitchM, lattice);
          return Math.abs(back - fill) <= 1e-9 && f.featureM >= 0 && f.gapM >= 0 && f.featureM <= pitchM * (1 + 1e-12);
        },
      ),
      { seed: 42, numRuns: 400 },
    );
  });

  it("unknown family ids suggest the closest", () => {
    expect(() => getCellFamily("rod-in-host")).toThrow(InputError);
    expect(() => getCellFamily("rod-in-host")).toThrow(/did you mean rods-in-host/);
  });
});
