import { describe, expect, it } from "vitest";
import { ProgrammerError } from "../../src/core/errors.js";
import { evaluateMaterial, type Material } from "../../src/media/material.js";
import { expectClose } from "../helpers/close.js";

const ptfeLike: Material = {
  id: "test-dielectric",
  name: "test dielectric",
  class: "polymer",
  model: "constant",
  params: { eps_r: 2.05, tan_delta: 0.0002 },
  validMinHz: 1e8,
  validMaxHz: 1e11,
  source: "test row: the values of Riddle et al. 2003 for PTFE",
};

describe("evaluateMaterial", () => {
  it("gives ε, μ = 1, tan δ = ε''/ε' and n = sqrt(ε) inside the range", () => {
    const v = evaluateMaterial(ptfeLike, 1e10);
    expectClose([v.eps.re, v.eps.im], [2.05, 2.05 * 0.0002], { rel: 1e-14, label: "ε" });
    expect(v.mu).toEqual({ re: 1, im: 0 });
    expectClose(v.lossTangent, 0.0002, { rel: 1e-12 });
    // n ≈ sqrt(ε') (1 + i tanδ/2) for small tan δ (first-order expansion of the square root)
    expectClose([v.n.re, v.n.im], [Math.sqrt(2.05), Math.sqrt(2.05) * 0.0001], { rel: 1e-7, label: "n" });
    expect(v.inRange).toBe(true);
    expect(v.warning).toBeUndefined();
  });

  it("outside the valid range: still a value, inRange false and a warning naming the range", () => {
    const v = evaluateMaterial(ptfeLike, 5e11);
    expect(v.inRange).toBe(false);
    expect(v.warning).toMatch(/test-dielectric: 500 GHz is outside the valid range 100 MHz – 100 GHz/);
    expect(evaluateMaterial(ptfeLike, 1e8).inRange).toBe(true); // edges are inside
    expect(evaluateMaterial(ptfeLike, 1e11).inRange).toBe(true);
  });

  it("metals: tan δ stays non-negative (ε''/|ε'|) and n has Im n ≥ 0", () => {
    const metal: Material = { ...ptfeLike, id: "m", class: "metal", model: "drude", params: { eps_inf: 1, plasma_hz: 2e15, gamma_hz: 6e12 }, validMinHz: 1e6, validMaxHz: 3e14 };
    const v = evaluateMaterial(metal, 3e14);
    expect(v.eps.re).toBeLessThan(0);
    expect(v.lossTangent).toBeGreaterThan(0);
    expect(v.n.im).toBeGreaterThan(0);
  });

  it("uses μ when the row gives one: n = sqrt(εμ)", () => {
    const v = evaluateMaterial({ ...ptfeLike, params: { eps_r: 4, tan_delta: 0 }, mu: { re: 2.25, im: 0 } }, 1e9);
    expectClose(v.n.re, 3, { rel: 1e-14 });
  });

  it("rejects a non-positive or non-finite frequency as a programmer error", () => {
    for (const f of [0, -1, NaN, Infinity]) expect(() => evaluateMaterial(ptfeLike, f)).toThrow(ProgrammerError);
  });
});
