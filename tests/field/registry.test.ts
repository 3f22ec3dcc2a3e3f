/**
 * One sweep over the whole transform registry: every inverse undoes its forward, every closed-form
 * K matches central differences of the inverse map, and the outer boundary samples lie inside the
 * device with unit normals.
 */
import { describe, it, expect } from "vitest";
import { expectClose } from "../helpers/close.js";
import { TRANSFORMS, makeTransform } from "../../src/field/transforms/registry.js";
import type { TransformSpec } from "../../src/field/transformSpec.js";

const linearMap = (out: Float64Array, x: number, y: number): void => {
  // x = x' + 0.2 y', y = 0.9 y' + 0.1 x'^2/0.05 (an orientation-preserving test map)
  out[0] = x + 0.2 * y; out[1] = 0.9 * y + (0.1 * x * x) / 0.05;
  out[2] = 1; out[3] = 0.2; out[4] = (0.2 * x) / 0.05; out[5] = 0.9;
};

const SPECS: TransformSpec[] = [
  { kind: "radial-cloak", innerRadiusM: 0.02, outerRadiusM: 0.05, profile: "linear", center: [0.01, -0.02] },
  { kind: "radial-cloak", innerRadiusM: 0.02, outerRadiusM: 0.05, profile: "quadratic" },
  { kind: "concentrator", innerRadiusM: 0.015, compressedRadiusM: 0.03, outerRadiusM: 0.06, center: [0.005, 0] },
  { kind: "rotator", innerRadiusM: 0.025, outerRadiusM: 0.05, angleRad: 1.2 },
  { kind: "beam-shifter", lengthM: 0.06, heightM: 0.04, shiftM: 0.01 },
  { kind: "beam-bend", innerRadiusM: 0.04, outerRadiusM: 0.08, angleRad: Math.PI / 2, referenceRadiusM: 0.06, center: [0, 0.01] },
  { kind: "spherical-cloak", innerRadiusM: 0.015, outerRadiusM: 0.035 },
  {
    // a carpet 60 mm × 30 mm with a 6 mm cos² bump, virtual rectangle fitted to the module
    kind: "quasi-conformal", rectangle: { minM: [-0.03, 0], maxM: [0.03, 0.03] }, fit: "module", nodes: [41, 21],
    sides: {
      bottom: { kind: "graph", text: "bump", f: (x) => (Math.abs(x) < 0.02 ? 0.006 * Math.cos((Math.PI * x) / 0.04) ** 2 : 0) },
      right: { kind: "straight" }, top: { kind: "straight" }, left: { kind: "straight" },
    },
  },
  {
    // a concentrator between an ellipse and a circle, core magnified 1.5×
    kind: "laplace-shell", center: [0.002, 0], innerScale: 1.5, nodes: [64, 11],
    inner: { kind: "polar", text: "ellipse", r: (t) => (0.02 * 0.015) / Math.hypot(0.015 * Math.cos(t), 0.02 * Math.sin(t)) },
    outer: { kind: "polar", text: "0.05", r: () => 0.05 },
  },
  { kind: "expression", virtual: { x: "x + 0.2*y", y: "0.9*y + 0.1*x^2/0.05" }, region: { shape: "circle", centerM: [0, 0], radiusM: 0.03 }, compiled: linearMap },
];

describe("transform registry", () => {
  it("has a test spec for every kind", () => {
    expect(new Set(SPECS.map((s) => s.kind))).toEqual(new Set(Object.keys(TRANSFORMS)));
  });
  for (const spec of SPECS) {
    const t = makeTransform(spec);
    // sample points inside the device on a coarse lattice over the bounding box
    const pts: number[][] = [];
    const b = t.bounds;
    for (let i = 1; i < 12; i++) for (let j = 1; j < 12; j++) for (const z of t.dimension === 3 ? [-0.01, 0, 0.012] : [0]) {
      const x = b.minX + ((b.maxX - b.minX) * i) / 12, y = b.minY + ((b.maxY - b.minY) * j) / 12;
      if (t.contains(x, y, z)) pts.push([x, y, z]);
    }
    it(`${spec.kind}${"profile" in spec ? ` (${spec.profile})` : ""}: forward undoes inverse`, () => {
      expect(pts.length).toBeGreaterThan(10);
      const v = new Float64Array(3), back = new Float64Array(3);
      for (const [x, y, z] of pts) {
        expect(t.inverse(v, x, y, z)).toBe(true);
        expect(t.forward(back, v[0], v[1], v[2])).toBe(true);
        expectClose(Array.from(back), [x, y, z], { abs: 1e-12, label: `${spec.kind} at (${x}, ${y}, ${z})` });
      }
    });
    it(`${spec.kind}: closed-form K matches central differences of the inverse`, () => {
      const k = new Float64Array(9), p = new Float64Array(3), m = new Float64Array(3);
      const h = 1e-7;
      for (const [x, y, z] of pts) {
        t.jacobianK(k, x, y, z);
        for (let col = 0; col < (t.dimension === 3 ? 3 : 2); col++) {
          const d = [0, 0, 0]; d[col] = h;
          if (!t.inverse(p, x + d[0], y + d[1], z + d[2]) || !t.inverse(m, x - d[0], y - d[1], z - d[2])) continue;
          for (let row = 0; row < 3; row++) {
            expectClose(k[3 * row + col], (p[row] - m[row]) / (2 * h), { abs: 2e-6, rel: 1e-6, label: `${spec.kind} K[${row}][${col}]` });
          }
        }
      }
    });
    it(`${spec.kind}: outer boundary samples lie inside, with unit normals`, () => {
      const s = t.sampleOuterBoundary(64);
      expect(s.xM.length).toBeGreaterThan(8);
      for (let q = 0; q < s.xM.length; q++) {
        expect(t.contains(s.xM[q], s.yM[q], 0), `sample ${q} (${s.xM[q]}, ${s.yM[q]})`).toBe(true);
        expectClose(Math.hypot(s.normalX[q], s.normalY[q]), 1, { rel: 1e-12, label: "normal length" });
        // a step outward along the normal leaves the device
        const out = 1e-4;
        expect(t.contains(s.xM[q] + out * s.normalX[q], s.yM[q] + out * s.normalY[q], 0), `outward step at sample ${q}`).toBe(false);
      }
    });
  }
});
