import { describe, it } from "vitest";
import type { Complex } from "../../../src/core/complex.js";
import { parallel } from "../../../src/media/mixing/parallel.js";
import { series } from "../../../src/media/mixing/series.js";
import { expectClose } from "../../helpers/close.js";

const c = (re: number, im = 0): Complex => ({ re, im });

describe("laminates (Wiener 1912)", () => {
  it("parallel is f ε_i + (1 − f) ε_h and series 1/(f/ε_i + (1 − f)/ε_h), complex", () => {
    // 1 and 4 at f = 1/2: parallel 2.5, series 1/(0.125 + 0.5) = 1.6 (by hand from the formulas)
    expectClose(parallel.forward(c(1), c(4), 0.5).re, 2.5, { rel: 1e-15 });
    expectClose(series.forward(c(1), c(4), 0.5).re, 1.6, { rel: 1e-15 });
    const p = parallel.forward(c(2, 0.1), c(-10, 2), 0.25);
    expectClose([p.re, p.im], [0.25 * -10 + 0.75 * 2, 0.25 * 2 + 0.75 * 0.1], { rel: 1e-15, label: "parallel complex" });
    // series of 1 and i at 1/2: 1/(0.5/i + 0.5) = 1/(0.5 − 0.5i) = 1 + i
    const s = series.forward(c(1), c(0, 1), 0.5);
    expectClose([s.re, s.im], [1, 1], { rel: 1e-15, label: "series complex" });
  });

  it("the parallel inverse is closed form even for complex phases (Re is linear in f)", () => {
    const r = parallel.inverse(c(2, 0.1), c(10, 3), 4);
    expectClose(r.fill, 0.25, { rel: 1e-14 });
    expectClose(r.iterations, 0, { abs: 0.5, label: "iterations" });
  });
});
