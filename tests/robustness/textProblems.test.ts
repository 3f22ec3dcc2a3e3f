import { describe, expect, it } from "vitest";
import { textProblems } from "./invariants.js";

describe("the output checker itself", () => {
  it("lets a message echo the user's own quoted value and still catches leaks", () => {
    expect(textProblems("", 'error: design.json: $.realization.process: expected one of a, b, got "Infinity"')).toEqual([]);
    expect(textProblems("", "error: --scheme: got 'NaN'")).toEqual([]);
    expect(textProblems("", "width Infinity mm")).not.toEqual([]);
    expect(textProblems("", "expected one of a, b, got undefined")).not.toEqual([]);
    expect(textProblems("", "got 'x' and then NaN")).not.toEqual([]);
  });
});
