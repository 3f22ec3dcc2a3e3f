/**
 * The loss figure: attenuation along the worst straight line of cells. For a low-loss dielectric
 * the plane-wave attenuation is α = k·tanδ/2 with k = k0·sqrt(ε') (Pozar, "Microwave Engineering",
 * 4th ed., §1.3, low-loss dielectrics), i.e. Im n = sqrt(ε')·tanδ/2, and the power in dB falls by
 * 20·log10(e)·α·L.
 */
import { describe, it, expect } from "vitest";
import { worstStraightPath, DB_PER_NEPER } from "../../src/plan/planFigures.js";
import type { DeviceGrid } from "../../src/field/deviceGrid.js";
import { refractiveIndex } from "../../src/core/complex.js";
import { expectClose } from "../helpers/close.js";

/** An L-shaped device on a 12 × 5 lattice: the bottom row is 12 cells long, the rest 3 cells. */
function lShape(pitchM: number): DeviceGrid {
  const cells: [number, number][] = [];
  for (let j = 0; j < 5; j++) for (let i = 0; i < 12; i++) if (j === 0 || i < 3) cells.push([i, j]);
  const n = cells.length;
  return {
    dimension: 2, pitchM, nx: 12, ny: 5, nz: 1, originXM: 0, originYM: 0, originZM: 0, count: n,
    i: Int32Array.from(cells.map((c) => c[0])), j: Int32Array.from(cells.map((c) => c[1])), k: new Int32Array(n),
    xM: Float64Array.from(cells.map((c) => c[0] * pitchM)), yM: Float64Array.from(cells.map((c) => c[1] * pitchM)), zM: new Float64Array(n),
  };
}

describe("worstStraightPath", () => {
  it("gives Pozar's low-loss attenuation along the longest row of a uniform PTFE device", () => {
    const pitchM = 2e-3, f = 10e9, k0 = (2 * Math.PI * f) / 299_792_458;
    const epsR = 2.05, tanD = 2e-4; // PTFE at 10 GHz (Riddle, Baker-Jarvis, Krupka 2003)
    const grid = lShape(pitchM);
    const imN = refractiveIndex({ re: epsR, im: epsR * tanD }).im;
    expectClose(imN, (Math.sqrt(epsR) * tanD) / 2, { rel: 1e-6, label: "Im n vs low-loss form" });
    const path = worstStraightPath(grid, new Float64Array(grid.count).fill(imN), k0);
    const lengthM = 12 * pitchM;
    expectClose(path.lengthM, lengthM, { rel: 1e-12, label: "longest row" });
    expect(path.direction).toEqual([1, 0]);
    const alpha = (k0 * Math.sqrt(epsR) * tanD) / 2; // Np/m, Pozar §1.3
    expectClose(path.lossDb, DB_PER_NEPER * alpha * lengthM, { rel: 1e-6, label: "loss dB" });
    expectClose(DB_PER_NEPER, 8.685889638, { rel: 1e-9, label: "dB per neper" }); // 20·log10(e)
  });
  it("a lossless device has no loss and a lossier column wins over a longer row", () => {
    const grid = lShape(1e-3);
    expect(worstStraightPath(grid, new Float64Array(grid.count), 200).lossDb).toBe(0);
    const imN = Float64Array.from({ length: grid.count }, (_, c) => (grid.i[c] === 0 ? 1e-2 : 1e-4));
    const p = worstStraightPath(grid, imN, 200);
    expect(p.direction).toEqual([0, 1]);
    expectClose(p.lossDb, DB_PER_NEPER * 200 * 5 * 1e-2 * 1e-3, { rel: 1e-12, label: "column loss" });
  });
});

describe("billOfMaterials", () => {
  it("orders resin by volume in mL and a lithography film by its area", async () => {
    const { billOfMaterials } = await import("../../src/plan/planFigures.js");
    const classes: Record<string, string> = { "photopolymer-resin": "resin", "silicon-nir": "semiconductor" };
    const classOf = (id: string): string | undefined => classes[id];
    // 1000 cells of 1.2 mm, 4.8 mm high, struts at fill 0.25: 1000 × 1.2² × 4.8 mm³ × 0.25 = 1.728 mL
    const struts = { family: "strut-lattice", host: "air", inclusion: "photopolymer-resin", fillFraction: 0.25, dimensions: {} } as never;
    const [resin] = billOfMaterials([{ recipe: struts, cellCount: 1000 } as never], 1.2e-3, 2, (id) => id === "air", { heightM: 4.8e-3, classOf, process: "stereolithography", layer: false });
    expect(resin.order).toEqual({ quantity: expect.any(Number), unit: "mL", what: "resin volume" });
    expectClose(resin.order.quantity, 1.728, { rel: 1e-12, label: "resin mL" });
    // 400 cells of 0.5 µm holes in a 220 nm silicon film: film area 400 × 0.25 µm² = 100 µm²
    const holes = { family: "holes-in-slab", host: "silicon-nir", inclusion: "air", fillFraction: 0.3, dimensions: {} } as never;
    const [si] = billOfMaterials([{ recipe: holes, cellCount: 400 } as never], 0.5e-6, 2, (id) => id === "air", { heightM: 220e-9, classOf, process: "electron-beam-lithography", layer: true });
    expect(si.order.unit).toBe("µm²");
    expect(si.order.what).toBe("film area (wafer), 220 nm thick");
    expectClose(si.order.quantity, 100, { rel: 1e-12, label: "film area" });
    expectClose(si.volume, 0.7 * 400 * 0.25e-12 * 220e-9, { rel: 1e-12, label: "silicon volume" });
  });

  it("counts a printed split-ring cell's board and copper from its dimensions, not the ring's area fraction", async () => {
    const { billOfMaterials, PRINTED_METAL_THICKNESS_M } = await import("../../src/plan/planFigures.js");
    const a = 2.5e-3;
    const dims = { ring_radius_m: 0.7e-3, ring_width_m: 0.1e-3, ring_gap_m: 0.1e-3, board_thickness_m: 0.5e-3, split_gap_m: 0.1e-3 };
    const recipe = { family: "split-ring", host: "ptfe-ceramic-10", inclusion: "copper", lattice: "cubic", orientation: "1", fillFraction: 0.11, dimensions: dims } as never;
    const h = 4e-3;
    const classes: Record<string, string> = { "ptfe-ceramic-10": "laminate", copper: "metal" };
    const rows = billOfMaterials([{ recipe, cellCount: 10 } as never], a, 2, (id) => id === "air", { heightM: h, classOf: (id) => classes[id], process: "pcb-etching", layer: false });
    const board = rows.find((r) => r.material === "ptfe-ceramic-10")!;
    const copper = rows.find((r) => r.material === "copper")!;
    // 2D: over the device height h; the board is a slab t thick across the cell
    expectClose(board.volume, 10 * 0.5e-3 * a * h, { rel: 1e-12, label: "board" });
    // ordered as board area at its own thickness: volume / t = 10 cells × a × h = 1 cm²
    expect(board.order.unit).toBe("cm²");
    expect(board.order.what).toBe("board area, 0.5 mm thick");
    expectClose(board.order.quantity, (10 * a * h) * 1e4, { rel: 1e-12, label: "board area" });
    // two strips, mean radii r + w/2 and r + 1.5w + d: length 2π(2r + 2w + d), one ring per a of height
    const perRing = 2 * Math.PI * (2 * 0.7e-3 + 2 * 0.1e-3 + 0.1e-3) * 0.1e-3 * PRINTED_METAL_THICKNESS_M;
    expectClose(copper.volume, (10 * perRing * h) / a, { rel: 1e-12, label: "copper" });
    expect(copper.order.unit).toBe("mm³");
  });
});
