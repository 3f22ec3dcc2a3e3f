import { describe, expect, it } from "vitest";
import { complex } from "../../../src/core/complex.js";
import { layerReport } from "../../../src/cells/slab/layerHost.js";
import { cutoffV, slabModes, type SlabInput } from "../../../src/cells/slab/slabModes.js";
import { expectClose } from "../../helpers/close.js";

const sym = (v: number, pol: "TE" | "TM" = "TE"): SlabInput => {
  // n1 = 1.5, n2 = 1.45, λ = 1 µm: thickness from V = k0 d √(n1² − n2²)
  const na = Math.sqrt(1.5 ** 2 - 1.45 ** 2);
  return { coreIndex: 1.5, substrateIndex: 1.45, coverIndex: 1.45, wavelengthM: 1e-6, thicknessM: (v * 1e-6) / (2 * Math.PI * na), polarization: pol };
};

describe("three-layer slab (Kogelnik & Ramaswamy, Appl. Opt. 13, 1857 (1974))", () => {
  it("symmetric slab: mode m appears at V = mπ (V = mπ/2 in terms of the half thickness)", () => {
    for (let m = 1; m <= 4; m++) {
      expectClose(cutoffV(sym(1), m), m * Math.PI, { rel: 1e-12 });
      expect(slabModes(sym(m * Math.PI * (1 - 1e-6))).indices.length).toBe(m);
      expect(slabModes(sym(m * Math.PI * (1 + 1e-6))).indices.length).toBe(m + 1);
    }
  });

  it("the normalized b–V relation V√(1−b) = mπ + atan√(b/(1−b)) + atan√((b+a)/(1−b)) holds for every mode", () => {
    const input: SlabInput = { coreIndex: 2.0, substrateIndex: 1.5, coverIndex: 1.0, thicknessM: 1.2e-6, wavelengthM: 1e-6, polarization: "TE" };
    const m = slabModes(input);
    const a = (1.5 ** 2 - 1) / (2 ** 2 - 1.5 ** 2);
    expect(m.indices.length).toBeGreaterThan(2);
    m.indices.forEach((N, k) => {
      const b = (N * N - 1.5 ** 2) / (4 - 1.5 ** 2);
      const rhs = k * Math.PI + Math.atan(Math.sqrt(b / (1 - b))) + Math.atan(Math.sqrt((b + a) / (1 - b)));
      expectClose(m.v * Math.sqrt(1 - b), rhs, { rel: 1e-10, label: `mode ${k}` });
    });
  });

  it("symmetric slab at V = 2: b of TE₀ from its closed relation tan(V√(1−b)/2) = √(b/(1−b)) (Kogelnik 1975, fig. 2.7 curve)", () => {
    const m = slabModes(sym(2));
    const b = m.b;
    expectClose(Math.tan((2 * Math.sqrt(1 - b)) / 2), Math.sqrt(b / (1 - b)), { rel: 1e-10 });
    expect(b).toBeGreaterThan(0.4);
    expect(b).toBeLessThan(0.5); // the curve reads about 0.43 at V = 2 (from memory)
  });

  it("220 nm silicon on silica under air at 1550 nm: TE₀ index near 2.85 (common practice); TM₀ lower", () => {
    // n_Si(1550 nm) = 3.4764 from the catalog's Sellmeier row (silicon-nir); n_SiO2 = 1.444 (Malitson 1965)
    const base = { coreIndex: 3.4764, substrateIndex: 1.444, coverIndex: 1.0, thicknessM: 220e-9, wavelengthM: 1550e-9 };
    const te = slabModes({ ...base, polarization: "TE" });
    const tm = slabModes({ ...base, polarization: "TM" });
    expect(te.indices.length).toBe(1);
    expectClose(te.indices[0], 2.8313, { abs: 5e-5 }); // our value, 4 digits
    expectClose(te.indices[0], 2.85, { abs: 0.03 }); // common practice ("about 2.85")
    // silica on both sides: the commonly quoted 2.848 (common practice, from memory)
    expectClose(slabModes({ ...base, coverIndex: 1.444, polarization: "TE" }).indices[0], 2.848, { abs: 0.005 });
    expect(tm.indices[0]).toBeLessThan(te.indices[0]);
  });
});

describe("layer report", () => {
  it("a thick silicon layer is multimode and says so; parallel plates warn above λ/(2n)", () => {
    const si = { id: "si", eps: complex(3.4764 ** 2), isMetal: false };
    const sio2 = { id: "sio2", eps: complex(1.444 ** 2), isMetal: false };
    const air = { id: "air", eps: complex(1), isMetal: false };
    const thick = layerReport({ core: si, thicknessM: 600e-9, below: sio2, above: air, frequencyHz: 299792458 / 1.55e-6, polarization: "Hz" });
    expect(thick.guidedModes).toBeGreaterThan(1);
    expect(thick.warnings.join(" ")).toMatch(/multimode/);
    const thin = layerReport({ core: si, thicknessM: 220e-9, below: sio2, above: air, frequencyHz: 299792458 / 1.55e-6, polarization: "Hz" });
    expect(thin.guidedModes).toBe(1);
    expectClose(thin.coreEps.re, thin.modeIndex! ** 2, { rel: 1e-12 });
    const cu = { id: "copper", eps: complex(-1e5, 1e7), isMetal: true };
    const ptfe = { id: "ptfe", eps: complex(2.05), isMetal: false };
    // 10 GHz: λ/(2n) = 10.47 mm in PTFE
    expect(layerReport({ core: ptfe, thicknessM: 5e-3, below: cu, above: cu, frequencyHz: 10e9, polarization: "Ez" }).warnings).toEqual([]);
    const wide = layerReport({ core: ptfe, thicknessM: 12e-3, below: cu, above: cu, frequencyHz: 10e9, polarization: "Ez" });
    expect(wide.guidedModes).toBe(2);
    expect(wide.warnings.join(" ")).toMatch(/higher parallel-plate mode/);
  });
});
