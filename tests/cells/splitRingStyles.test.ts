import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { complex } from "../../src/core/complex.js";
import type { CellPhase } from "../../src/cells/cellDesignTypes.js";
import { designCell } from "../../src/cells/designCell.js";
import { printedMeanRadiusM, printedOuterRadiusM, printedRingCircuit } from "../../src/cells/printedRing.js";
import type { Process } from "../../src/cells/process.js";
import { defaultRingStyle, designSplitRing, lorentzMu, splitRingResponse, type SplitRingGeometry } from "../../src/cells/splitRing.js";
import { bufferIo } from "../../src/cli/cliIo.js";
import { EXIT_INPUT, EXIT_NOT_BUILDABLE, EXIT_OK, runCli } from "../../src/cli/run.js";
import { expectClose } from "../helpers/close.js";

// copper σ = 5.8e7 S/m (CRC handbook, from memory); a PTFE-ceramic board of ε' = 3, tan δ = 0.0013
// (the catalog's ptfe-ceramic-3 row, from memory); PCB etching 0.1 mm track and gap (catalog row, common practice)
const SIGMA = 5.8e7;
const pcb: Process = { id: "pcb-etching", name: "printed-circuit etching", minFeatureM: 0.1e-3, minGapM: 0.1e-3, maxAspectRatio: 1, materialClasses: ["metal", "laminate"], source: "common practice" };
const boardPhase: CellPhase = { id: "ptfe-ceramic-3", eps: complex(3, 3 * 0.0013), class: "laminate" };
const air: CellPhase = { id: "air", eps: complex(1), class: "gas" };
const copper: CellPhase = { id: "copper", eps: complex(1, 1e8), class: "metal", conductivitySPerM: SIGMA };

describe("ring style", () => {
  it("printed on a board, with PCB etching, or in any solid host; split cylinders in a gas (our rule)", () => {
    expect(defaultRingStyle({ hostClass: "laminate" })).toBe("printed");
    expect(defaultRingStyle({ hostClass: "gas", processId: "pcb-etching" })).toBe("printed");
    expect(defaultRingStyle({ hostClass: "ceramic" })).toBe("printed");
    expect(defaultRingStyle({ hostClass: "gas" })).toBe("split-cylinder");
    expect(defaultRingStyle({ hostEpsRe: 3 })).toBe("printed");
    expect(defaultRingStyle({ hostEpsRe: 1 })).toBe("split-cylinder");
    expect(defaultRingStyle({})).toBe("split-cylinder");
  });
});

describe("printed ring response (Lorentz form, exp(−iωt))", () => {
  const g: SplitRingGeometry = { ringStyle: "printed", pitchM: 4e-3, ringRadiusM: 1.2e-3, ringWidthM: 0.16e-3, ringGapM: 0.16e-3 };

  it("μ → 1 − F far above the resonance and → 1 far below; F is the circuit's strength", () => {
    const k = printedRingCircuit(g, 3);
    const hi = splitRingResponse(g, SIGMA, 1e13, 3);
    expectClose(hi.fill, k.strength, { rel: 1e-15 });
    expectClose(hi.mu.re, 1 - k.strength, { rel: 1e-6 });
    expectClose(splitRingResponse(g, SIGMA, 1e6, 3).mu.re, 1, { rel: 1e-6 });
  });

  it("at the resonance μ = 1 + iFω0/Γ (from the Lorentz form)", () => {
    const f0 = printedRingCircuit(g, 3).resonanceHz;
    const r = splitRingResponse(g, SIGMA, f0, 3);
    expectClose(r.mu.re, 1, { abs: 1e-9 });
    expectClose(r.mu.im, (r.fill * 2 * Math.PI * f0) / r.gammaRadPerS, { rel: 1e-9 });
  });

  it("Im μ ≥ 0 for any lossy board and frequency (passive)", () => {
    fc.assert(
      fc.property(fc.double({ min: 0.05, max: 20, noNaN: true }), fc.double({ min: 0, max: 0.05, noNaN: true }), fc.double({ min: 1, max: 12, noNaN: true }), (fRel, tanD, eps) => {
        const f0 = printedRingCircuit(g, eps).resonanceHz;
        return splitRingResponse(g, SIGMA, fRel * f0, complex(eps, eps * tanD)).mu.im >= 0;
      }),
      { seed: 42, numRuns: 200 },
    );
  });

  it("the board's loss raises Im μ", () => {
    const f = 8.5e9;
    const a = splitRingResponse(g, SIGMA, f, complex(3, 0)).mu.im;
    const b = splitRingResponse(g, SIGMA, f, complex(3, 0.0039)).mu.im;
    expect(b).toBeGreaterThan(a);
  });
});

describe("printed ring design", () => {
  const base = { frequencyHz: 8.5e9, conductivitySPerM: SIGMA, hostEpsRe: 3, ringStyle: "printed" as const, minFeatureM: 0.1e-3, minGapM: 0.1e-3 };

  it("solves the ring radius for μ' targets in a 4 mm cell, at makeable sizes, above the resonance and outside its line", () => {
    for (const t of [0.001, 0.1, 0.3, -1]) {
      const d = designSplitRing({ ...base, pitchM: 4e-3, targetMu: t });
      expect(d.geometry, `μ' = ${t}: ${d.reasons.join("; ")}`).not.toBeNull();
      const g = d.geometry!, r = d.response!;
      expect(g.ringStyle).toBe("printed");
      expectClose(r.mu.re, t, { abs: 1e-9, label: `μ' = ${t}` });
      expect(g.ringWidthM).toBeGreaterThanOrEqual(0.1e-3);
      expect(g.ringGapM).toBeGreaterThanOrEqual(0.1e-3);
      expect(g.splitGapM!).toBeGreaterThanOrEqual(0.1e-3);
      expect(4e-3 - 2 * printedOuterRadiusM(g)).toBeGreaterThanOrEqual(0.1e-3 * (1 - 1e-9));
      expect(r.resonanceHz).toBeLessThan(8.5e9);
      // outside the line |ω² − ω0²| > Γω ⟺ Im μ < 1 − Re μ (derived from the Lorentz form)
      expect(r.mu.im).toBeLessThan(1 - r.mu.re);
      // the response recomputed from the geometry alone agrees
      expectClose(splitRingResponse(g, SIGMA, 8.5e9, 3).mu.re, t, { abs: 1e-9 });
    }
  });

  it("with the radius given, solves the strip separation instead", () => {
    const first = designSplitRing({ ...base, pitchM: 4e-3, targetMu: 0.2 });
    const d = designSplitRing({ ...base, pitchM: 4e-3, targetMu: 0.2, ringRadiusM: first.geometry!.ringRadiusM * 1.02 });
    expect(d.geometry).not.toBeNull();
    expect(d.geometry!.ringRadiusM).toBe(first.geometry!.ringRadiusM * 1.02);
    expect(d.geometry!.ringGapM).toBeGreaterThan(first.geometry!.ringGapM); // a larger ring needs less capacitance
    expectClose(d.response!.mu.re, 0.2, { abs: 1e-9 });
  });

  it("in a 2.5 mm cell on ε' = 3 it says why not: the largest ring resonates above what the target needs", () => {
    const d = designSplitRing({ ...base, pitchM: 2.5e-3, targetMu: 0.29 });
    expect(d.geometry).toBeNull();
    expect(d.reasons[0]).toMatch(/largest printed ring that fits .* resonates at [\d.]+ GHz; μ' = 0\.29 at 8\.5 GHz needs its resonance at or below [\d.]+ GHz/);
    // the largest ring's resonance quoted is the circuit's (outer radius (a − wall)/2, 0.1 mm strips and separation)
    const g = { pitchM: 2.5e-3, ringRadiusM: (2.5e-3 - 0.1e-3) / 2 - 0.3e-3, ringWidthM: 0.1e-3, ringGapM: 0.1e-3 };
    const f0 = printedRingCircuit(g, 3).resonanceHz;
    expect(d.reasons[0]).toContain(`resonates at ${Number((f0 / 1e9).toPrecision(3))} GHz`);
    expect(f0).toBeGreaterThan(8.5e9);
    // the pitch it suggests works with the same strips, and 1 % less does not
    const m = /pitch of at least ([\d.]+) mm/.exec(d.reasons[0]);
    expect(m).not.toBeNull();
    const p = Number(m![1]) * 1e-3;
    const at = (pitchM: number) => designSplitRing({ ...base, pitchM, targetMu: 0.29, ringWidthM: 0.1e-3, ringGapM: 0.1e-3 }).geometry;
    expect(at(p * 1.005)).not.toBeNull();
    expect(at(p * 0.99)).toBeNull();
  });

  it("the planner's call (ε' only, no style) gets printed rings for a solid host", () => {
    const d = designSplitRing({ pitchM: 4e-3, frequencyHz: 8.5e9, targetMu: 0.1, conductivitySPerM: SIGMA, hostEpsRe: 3 });
    expect(d.geometry?.ringStyle).toBe("printed");
    expectClose(d.response!.mu.re, 0.1, { abs: 1e-9 });
  });

  it("split cylinders are kept: air host, or asked for by name", () => {
    const a = designSplitRing({ pitchM: 10e-3, frequencyHz: 3e9, targetMu: 0.3, conductivitySPerM: SIGMA, stackSpacingM: 1e-3 });
    expect(a.geometry?.ringStyle).toBe("split-cylinder");
    const b = designSplitRing({ ...base, pitchM: 2.5e-3, targetMu: 0.29, ringStyle: "split-cylinder" });
    expect(b.geometry?.ringStyle).toBe("split-cylinder");
    expect(b.reasons.join(" ")).toMatch(/below 1 nm/);
  });
});

describe("designCell with printed rings", () => {
  it("board host and PCB etching: printed geometry, SI dimensions, process ok, band within the passivity bound", () => {
    const d = designCell({ familyId: "split-ring", lattice: "cubic", pitchM: 4e-3, frequencyHz: 8.5e9, host: boardPhase, inclusion: copper, target: { mu: 0.2 }, process: pcb });
    expect(d.valid, d.reasons.join("; ")).toBe(true);
    expect(d.resonance?.kind).toBe("split-ring");
    const r = d.resonance!;
    if (r.kind !== "split-ring") throw new Error("ring report expected");
    expect(r.geometry.ringStyle).toBe("printed");
    for (const k of ["ringRadiusM", "meanRadiusM", "outerRadiusM", "ringWidthM", "ringGapM", "splitGapM", "stackSpacingM"]) expect(d.dimensions[k], k).toBeGreaterThan(0);
    expectClose(d.dimensions.meanRadiusM, printedMeanRadiusM(r.geometry), { rel: 1e-15 });
    expect(d.processCheck?.ok).toBe(true);
    expectClose(d.achieved.mu.re, 0.2, { abs: 1e-6 });
    expect(d.achieved.mu.im).toBeGreaterThan(0);
    expect(r.band.fractional).toBeGreaterThan(0);
    expect(r.band.fractional).toBeLessThanOrEqual(r.passivity!.weak);
    expectClose(r.passivity!.highFrequencyLimit, 1 - d.fill!, { rel: 1e-12 });
    expect(d.notes.join(" ")).toMatch(/printed edge-coupled rings/);
  });

  it("evaluates given printed sizes, and refuses sizes below the process", () => {
    const d = designCell({ familyId: "split-ring", lattice: "cubic", pitchM: 4e-3, frequencyHz: 8.5e9, host: boardPhase, inclusion: copper, process: pcb, splitRing: { ringStyle: "printed", ringRadiusM: 1.2e-3, ringWidthM: 0.05e-3, ringGapM: 0.1e-3 } });
    expect(d.valid).toBe(false);
    expect(d.reasons.join(" ")).toMatch(/below the 0.1 mm minimum/);
    expectClose(d.achieved.mu.re, splitRingResponse({ ringStyle: "printed", pitchM: 4e-3, ringRadiusM: 1.2e-3, ringWidthM: 0.05e-3, ringGapM: 0.1e-3 }, SIGMA, 8.5e9, boardPhase.eps).mu.re, { rel: 1e-12 });
  });

  it("air host keeps split cylinders", () => {
    const d = designCell({ familyId: "split-ring", lattice: "cubic", pitchM: 10e-3, frequencyHz: 3e9, host: air, inclusion: copper, target: { mu: 0.5 }, splitRing: { stackSpacingM: 1e-3 } });
    const r = d.resonance!;
    expect(r.kind === "split-ring" && r.geometry.ringStyle).toBe("split-cylinder");
  });

  it("no reachable ring: not valid, with the reason and no crash", () => {
    const d = designCell({ familyId: "split-ring", lattice: "cubic", pitchM: 2.5e-3, frequencyHz: 8.5e9, host: boardPhase, inclusion: copper, target: { mu: 0.29 }, process: pcb });
    expect(d.valid).toBe(false);
    expect(d.fill).toBeNull();
    expect(d.reasons[0]).toMatch(/resonates at/);
  });
});

describe("cellwright cell split-ring --ring-style", () => {
  async function run(argv: string[]) {
    const io = bufferIo();
    const code = await runCli(argv, io);
    return { code, out: io.out(), err: io.err() };
  }
  const common = ["cell", "split-ring", "--pitch", "4 mm", "--frequency", "8.5 GHz", "--host", "ptfe-ceramic-3", "--process", "pcb-etching"];

  it("printed rings by default on a laminate, designed at the process minimum", async () => {
    const r = await run([...common, "--target", "0.2", "--json"]);
    expect(r.code).toBe(EXIT_OK);
    const j = JSON.parse(r.out);
    expect(j.resonance.geometry.ringStyle).toBe("printed");
    expectClose(j.dimensions.ringWidthM, 0.1e-3, { rel: 1e-12 });
    expectClose(j.achieved.mu.re, 0.2, { abs: 1e-6 });
  });

  it("--ring-style split-cylinder on the same board gives Pendry's rings (and says they cannot be made)", async () => {
    const r = await run([...common, "--target", "0.2", "--ring-style", "split-cylinder", "--json"]);
    expect(r.code).toBe(EXIT_NOT_BUILDABLE);
    expect(JSON.parse(r.out).resonance.geometry.ringStyle).toBe("split-cylinder");
  });

  it("--board-thickness and --split-gap reach the geometry", async () => {
    const r = await run([...common, "--target", "0.2", "--board-thickness", "0.5 mm", "--split-gap", "0.2 mm", "--json"]);
    const j = JSON.parse(r.out);
    expectClose(j.dimensions.boardThicknessM, 0.5e-3, { rel: 1e-12 });
    expectClose(j.dimensions.splitGapM, 0.2e-3, { rel: 1e-12 });
  });

  it("rejects an unknown style and ring options on other families", async () => {
    const bad = await run([...common, "--target", "0.2", "--ring-style", "spiral"]);
    expect(bad.code).toBe(EXIT_INPUT);
    expect(bad.err).toMatch(/--ring-style/);
    const other = await run(["cell", "rods-in-host", "--pitch", "1 mm", "--frequency", "10 GHz", "--host", "air", "--inclusion", "alumina-96", "--target", "2", "--ring-style", "printed"]);
    expect(other.code).toBe(EXIT_INPUT);
  });
});

it("lorentzMu is shared by both styles (the printed response uses it with the circuit's F, f0, Γ)", () => {
  const g: SplitRingGeometry = { ringStyle: "printed", pitchM: 4e-3, ringRadiusM: 1.2e-3, ringWidthM: 0.16e-3, ringGapM: 0.16e-3 };
  const r = splitRingResponse(g, SIGMA, 9e9, 3);
  const m = lorentzMu(r.fill, r.resonanceHz, r.gammaRadPerS, 9e9);
  expectClose([r.mu.re, r.mu.im], [m.re, m.im], { rel: 1e-15 });
});
