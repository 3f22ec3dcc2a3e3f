import { describe, expect, it } from "vitest";
import { bufferIo } from "../../src/cli/cliIo.js";
import { reportError } from "../../src/cli/run.js";
import { InputError } from "../../src/core/errors.js";
import { NumericalFailure } from "../../src/numerics/numericalFailure.js";

describe("reportError: the three error channels reach the user differently", () => {
  it("a solver's numerical failure names where and says 'numerical failure', not a bug and not bad input", () => {
    const io = bufferIo();
    const code = reportError(new NumericalFailure("verify solver", "zero pivot at unknown 17", 17), io);
    expect(code).toBe(3);
    expect(io.err()).toContain("error: verify solver: numerical failure");
    expect(io.err()).toContain("zero pivot at unknown 17");
    expect(io.err()).not.toContain("this is a bug");
  });
  it("an input error is exit 1 and a plain Error is an internal error (exit 3, a bug)", () => {
    const a = bufferIo();
    expect(reportError(new InputError({ where: "design.json: $.frequency", message: "expected a frequency" }), a)).toBe(1);
    const b = bufferIo();
    expect(reportError(new Error("boom"), b)).toBe(3);
    expect(b.err()).toContain("this is a bug");
  });
});
