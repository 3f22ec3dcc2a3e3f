import { describe, expect, it } from "vitest";
import { besselJ, besselJArray, besselJY, besselY } from "../../src/verify/bessel.js";
import { expectClose } from "../helpers/close.js";

// Abramowitz & Stegun, "Handbook of Mathematical Functions" (1964), Table 9.1 (10 decimals);
// the same digits are reproduced by scipy.special.jv/yv.
const TABLE_9_1: [number, number, number, number, number, number, number][] = [
  // x, J0, J1, J2, Y0, Y1, Y2
  [1, 0.7651976866, 0.4400505857, 0.1149034849, 0.0882569642, -0.7812128213, -1.6506826068],
  [5, -0.1775967713, -0.3275791376, 0.0465651163, -0.3085176252, 0.1478631434, 0.3676628826],
  [10, -0.2459357645, 0.0434727462, 0.2546303137, 0.0556711673, 0.2490154242, -0.0058680824],
];

describe("Bessel functions of integer order", () => {
  it("match A&S Table 9.1 at x = 1, 5, 10", () => {
    for (const [x, j0, j1, j2, y0, y1, y2] of TABLE_9_1) {
      const j = new Float64Array(3), y = new Float64Array(3);
      besselJY(2, x, j, y);
      expectClose(Array.from(j), [j0, j1, j2], { abs: 1e-10, label: `J(${x})` });
      expectClose(Array.from(y), [y0, y1, y2], { abs: 1e-10, label: `Y(${x})` });
    }
  });

  it("single-order helpers agree with the arrays", () => {
    expectClose(besselJ(1, 1), 0.4400505857, { abs: 1e-10, label: "J1(1), A&S Table 9.1" });
    expectClose(besselY(0, 1), 0.0882569642, { abs: 1e-10, label: "Y0(1), A&S Table 9.1" });
  });

  it("satisfy the Wronskian J_{n+1} Y_n − J_n Y_{n+1} = 2/(πx) (A&S 9.1.16) and J0 + 2ΣJ_2k = 1 (A&S 9.1.46)", () => {
    for (const x of [0.05, 0.5, 3, 17.3, 42, 120]) {
      const N = 25;
      const j = new Float64Array(N + 2), y = new Float64Array(N + 2);
      besselJY(N + 1, x, j, y);
      for (let n = 0; n <= N; n++) {
        if (Math.abs(y[n]) > 1e150) break; // Y overflows at high order for small x
        const w = j[n + 1] * y[n] - j[n] * y[n + 1];
        expectClose(w, 2 / (Math.PI * x), { rel: 1e-9, label: `Wronskian n=${n} x=${x}` });
      }
      const all = besselJArray(Math.ceil(x) + 60, x);
      let s = all[0];
      for (let k = 2; k < all.length; k += 2) s += 2 * all[k];
      expectClose(s, 1, { abs: 1e-13, label: `normalization x=${x}` });
    }
  });

  it("small argument: J0(x) ≈ 1 − x²/4, Y0(x) ≈ (2/π)(ln(x/2) + γ) (A&S 9.1.12, 9.1.13)", () => {
    const x = 1e-4;
    expectClose(besselJ(0, x), 1 - (x * x) / 4, { rel: 1e-15, label: "J0" });
    expectClose(besselY(0, x), (2 / Math.PI) * (Math.log(x / 2) + 0.5772156649015329), { rel: 1e-7, label: "Y0" });
  });

  it("refuses x ≤ 0 and non-finite x", () => {
    for (const x of [0, -1, NaN, Infinity]) {
      expect(() => besselJArray(2, x)).toThrow(RangeError);
      expect(() => besselJY(2, x, new Float64Array(3), new Float64Array(3))).toThrow(RangeError);
    }
  });
});
