/**
 * Reused output buffers (fieldBuffers.ts) change where the tensor engine writes, never what: the
 * same bits as fresh arrays (identity), memory reused between computations, flags and shared
 * zero arrays cleared, and lattice grids whose centres are made on first read.
 */
import { describe, it, expect } from "vitest";
import { computeTensorField } from "../../src/field/computeTensorField.js";
import { fieldBuffers } from "../../src/field/fieldBuffers.js";
import type { TensorField } from "../../src/field/tensorField.js";
import { parseDesign } from "../../src/io/design/loadDesign.js";

const base = { name: "t", frequency: "10 GHz" };
const COMPONENTS = ["xx", "yy", "zz", "xy", "xz", "yz"] as const;

/** Every per-cell array of a field as bytes, for bit-for-bit comparison. */
function bits(f: TensorField): Buffer[] {
  const g = f.grid;
  const arrays: ArrayBufferView[] = [g.i, g.j, g.k, g.xM, g.yM, g.zM, f.capped, ...COMPONENTS.map((c) => f.eps[c]), ...COMPONENTS.map((c) => f.mu[c])];
  return arrays.map((a) => Buffer.from(a.buffer, a.byteOffset, a.byteLength));
}

describe("tensor engine with reused buffers", () => {
  it("gives the same bits as fresh arrays, for a capped cloak, a magnetic background and a volume device", async () => {
    const designs = [
      { ...base, grid: { pitch: "1 mm" }, transform: { kind: "radial-cloak", innerRadius: "20 mm", outerRadius: "50 mm", innerOffset: "1 mm", cap: 20 } },
      { ...base, grid: { pitch: "1.5 mm" }, background: { eps: 2, mu: 1.5 }, transform: { kind: "beam-bend", innerRadius: "60 mm", outerRadius: "80 mm", angle: "90 deg", referenceRadius: "80 mm" } },
      { ...base, grid: { pitch: "4 mm" }, transform: { kind: "spherical-cloak", innerRadius: "20 mm", outerRadius: "40 mm" } },
    ];
    const buffers = fieldBuffers();
    for (const raw of designs) {
      const d = await parseDesign(raw, "d.json");
      const fresh = bits(computeTensorField(d, undefined, undefined, { derived: "lazy" }));
      for (let run = 0; run < 2; run++) {
        const reused = bits(computeTensorField(d, undefined, undefined, { derived: "lazy", buffers }));
        expect(reused.length).toBe(fresh.length);
        reused.forEach((b, q) => expect(b.equals(fresh[q]), `array ${q}, run ${run}, ${raw.transform.kind}`).toBe(true));
      }
    }
  });

  it("makes det J, principal values and anisotropy in the tensors' pass (eager) with the bits of the lazy second pass", async () => {
    const designs = [
      { ...base, grid: { pitch: "1 mm" }, transform: { kind: "radial-cloak", innerRadius: "20 mm", outerRadius: "50 mm", innerOffset: "1 mm", cap: 20 } },
      { ...base, grid: { pitch: "1.5 mm" }, background: { eps: 2, mu: 1.5 }, transform: { kind: "beam-bend", innerRadius: "60 mm", outerRadius: "80 mm", angle: "90 deg", referenceRadius: "80 mm" } },
      { ...base, grid: { pitch: "4 mm" }, transform: { kind: "spherical-cloak", innerRadius: "20 mm", outerRadius: "40 mm" } },
    ];
    const derivedBits = (f: TensorField): Buffer[] =>
      [f.detJ, ...f.epsPrincipal, ...f.muPrincipal, f.epsAnisotropy, f.muAnisotropy].map((a) => Buffer.from(a.buffer, a.byteOffset, a.byteLength));
    for (const raw of designs) {
      const d = await parseDesign(raw, "d.json");
      const eager = computeTensorField(d, undefined, undefined, { derived: "eager" });
      const lazy = computeTensorField(d, undefined, undefined, { derived: "lazy" });
      const e = derivedBits(eager), l = derivedBits(lazy);
      expect(e.length).toBe(l.length);
      e.forEach((b, q) => expect(b.equals(l[q]), `derived array ${q}, ${raw.transform.kind}`).toBe(true));
      // not a vacuous comparison: the arrays hold the cells' values
      expect(eager.detJ.length).toBe(eager.grid.count);
      expect(eager.epsAnisotropy.every((v) => v >= 1 && Number.isFinite(v))).toBe(true);
      bits(eager).forEach((b, q) => expect(b.equals(bits(lazy)[q]), `array ${q}`).toBe(true));
    }
  });

  it("writes a second computation into the first one's memory, and clears the capped flags", async () => {
    const capped = await parseDesign({ ...base, grid: { pitch: "1 mm" }, transform: { kind: "radial-cloak", innerRadius: "20 mm", outerRadius: "50 mm", cap: 5 } }, "c.json");
    const plain = await parseDesign({ ...base, grid: { pitch: "1 mm" }, transform: { kind: "radial-cloak", innerRadius: "20 mm", outerRadius: "50 mm" } }, "r.json");
    const buffers = fieldBuffers();
    const first = computeTensorField(capped, undefined, undefined, { buffers });
    expect(first.capped.some((v) => v === 1)).toBe(true);
    const memory = first.eps.xx.buffer, flags = first.capped.buffer;
    const second = computeTensorField(plain, undefined, undefined, { buffers });
    expect(second.grid.count).toBe(first.grid.count);
    expect(second.eps.xx.buffer === memory, "same memory for eps_xx").toBe(true);
    expect(second.capped.buffer === flags, "same memory for the flags").toBe(true);
    expect(second.capped.every((v) => v === 0)).toBe(true);
    expect(Buffer.from(second.eps.xz.buffer, 0, second.eps.xz.byteLength).every((v) => v === 0)).toBe(true);
  });

  it("makes the lattice centres on first read, equal to origin + index × pitch", async () => {
    const d = await parseDesign({ ...base, grid: { pitch: "2 mm" }, transform: { kind: "radial-cloak", innerRadius: "20 mm", outerRadius: "50 mm" } }, "c.json");
    const g = computeTensorField(d).grid;
    const x = g.xM;
    expect(g.xM).toBe(x); // made once
    for (let c = 0; c < g.count; c++) {
      expect(x[c]).toBe(g.originXM + g.i[c] * g.pitchM);
      expect(g.yM[c]).toBe(g.originYM + g.j[c] * g.pitchM);
      expect(g.zM[c]).toBe(0);
    }
  });
});
