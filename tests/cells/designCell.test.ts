import { describe, expect, it } from "vitest";
import { complex } from "../../src/core/complex.js";
import type { CellPhase } from "../../src/cells/cellDesignTypes.js";
import { designCell } from "../../src/cells/designCell.js";
import type { Process } from "../../src/cells/process.js";
import { expectClose } from "../helpers/close.js";

const air: CellPhase = { id: "air", eps: complex(1), class: "gas" };
const alumina: CellPhase = { id: "alumina", eps: complex(9.6, 0.003), class: "ceramic" };
const silicon: CellPhase = { id: "silicon", eps: complex(11.68), class: "semiconductor" };
const copper: CellPhase = { id: "copper", eps: complex(1, 1e8), class: "metal", conductivitySPerM: 5.8e7 };
const ebl: Process = { id: "ebl", name: "electron-beam lithography", minFeatureM: 20e-9, minGapM: 20e-9, maxAspectRatio: 10, materialClasses: ["semiconductor"], source: "common practice" };

describe("designCell, mixing families", () => {
  it("rods for an in-plane target: fill from the solved cell, radius from the fill, closed form beside it", () => {
    const d = designCell({ familyId: "rods-in-host", lattice: "square", pitchM: 0.8e-3, frequencyHz: 10e9, host: air, inclusion: alumina, target: { perpendicular: 2 } });
    // the solved fill reproduces the square-array closed form of Perrins, McKenzie & McPhedran
    // (Proc. R. Soc. A 369, 207 (1979)) within the solver's stated error
    const T = (1 + 9.6) / (1 - 9.6);
    const f = d.fill!;
    const perrins = 1 - (2 * f) / (T + f - (0.305827 * f ** 4 * T) / (T * T - 1.402958 * f ** 8) - (0.013362 * f ** 8) / T);
    expectClose(perrins, 2, { rel: 2e-3 });
    // MG cylinders at that fill (Sihvola 1999) is the closed form reported beside it
    const beta = (9.6 - 1) / (9.6 + 1);
    expectClose(d.closedForm!.perpendicular.re, (1 + f * beta) / (1 - f * beta), { rel: 1e-6 }); // real-part formula; the loss moves Re ε by ~1e-8
    expect(d.rules.perpendicular).toBe("solved-cell");
    expectClose(d.dimensions.radiusM, 0.8e-3 * Math.sqrt(d.fill! / Math.PI), { rel: 1e-12 });
    expectClose(d.achieved.perpendicular.re, 2, { rel: 1e-9 });
    expect(d.valid).toBe(true);
    // n_max = sqrt(9.6) ≈ 3.1: 0.8 mm · 3.1 · 10 GHz / c ≈ 0.083 < 0.1
    expect(d.homogenization.status).toBe("ok");
    expect(d.spread.max).toBeGreaterThan(0);
  });

  it("holes in silicon at 1550 nm: valid with electron-beam lithography, refused by a coarser process", () => {
    const base = { familyId: "holes-in-slab", lattice: "hex" as const, pitchM: 110e-9, frequencyHz: 299792458 / 1550e-9, host: silicon, inclusion: air, target: { perpendicular: 8 } };
    const ok = designCell({ ...base, process: ebl });
    expect(ok.valid).toBe(true);
    expect(ok.processCheck?.ok).toBe(true);
    const coarse = designCell({ ...base, process: { ...ebl, minFeatureM: 200e-9, name: "coarse" } });
    expect(coarse.valid).toBe(false);
    expect(coarse.reasons.join(" ")).toMatch(/below the .* minimum of coarse/);
  });

  it("a target beyond the geometric limit: closest reachable fill, not valid, reason given", () => {
    const d = designCell({ familyId: "rods-in-host", lattice: "square", pitchM: 1e-3, frequencyHz: 10e9, host: air, inclusion: alumina, target: { perpendicular: 6 } });
    expect(d.valid).toBe(false);
    expectClose(d.fill!, Math.PI / 4, { rel: 1e-12 });
    expect(d.reasons[0]).toMatch(/geometric limit/);
  });

  it("two targets on a laminate: the fill minimizing the larger error lies between the single-axis fills", () => {
    const host = { ...air, eps: complex(2) };
    const inc = { ...alumina, eps: complex(10) };
    const d = designCell({ familyId: "laminate", lattice: "square", pitchM: 1e-3, frequencyHz: 1e9, host, inclusion: inc, target: { parallel: 5, perpendicular: 3 } });
    // single-axis fills: parallel 5 = 2 + 8f → f = 0.375; series 1/3 = f/10 + (1−f)/2 → f = 0.4167
    expect(d.fill!).toBeGreaterThan(0.375 - 1e-9);
    expect(d.fill!).toBeLessThan(0.4167 + 1e-4);
    expectClose(d.relError.parallel!, d.relError.perpendicular!, { rel: 1e-6 });
  });

  it("a coarse cell is refused by the homogenization check", () => {
    const d = designCell({ familyId: "spheres-in-host", lattice: "cubic", pitchM: 10e-3, frequencyHz: 10e9, host: air, inclusion: alumina, fill: 0.3 });
    expect(d.homogenization.status).toBe("refuse");
    expect(d.valid).toBe(false);
  });
});

describe("designCell, resonant families", () => {
  it("wire medium for ε = −1 reports plasma, band and passivity bound", () => {
    const d = designCell({ familyId: "wire-medium", lattice: "square", pitchM: 5e-3, frequencyHz: 5e9, host: air, inclusion: copper, target: { parallel: -1 } });
    expect(d.resonance?.kind).toBe("wire-medium");
    expectClose(d.achieved.parallel.re, -1, { abs: 1e-8 });
    expect(d.achieved.parallel.im).toBeGreaterThan(0);
    const r = d.resonance!;
    expect(r.passivity).not.toBeNull();
    expect(r.band.fractional).toBeGreaterThan(0);
    expect(r.band.fractional).toBeLessThanOrEqual(r.passivity!.weak);
  });

  it("split ring for μ = 0.5 in a dense stack", () => {
    const d = designCell({ familyId: "split-ring", lattice: "cubic", pitchM: 10e-3, frequencyHz: 3e9, host: air, inclusion: copper, target: { mu: 0.5 }, splitRing: { stackSpacingM: 1e-3 } });
    expect(d.resonance?.kind).toBe("split-ring");
    expectClose(d.achieved.mu.re, 0.5, { abs: 0.05 });
    expect(d.achieved.mu.im).toBeGreaterThan(0);
    expectClose(d.resonance!.passivity!.highFrequencyLimit, 1 - d.fill!, { rel: 1e-12 });
  });
});
