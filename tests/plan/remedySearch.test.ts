/**
 * The remedy search tries each change by re-planning; a change the design cannot take (an
 * InputError from the re-plan) is skipped, but a programmer error or an engine error must not be
 * swallowed as "not offered" (issue 13 item 6). Identities of the search's contract, no physics.
 */
import { describe, expect, it } from "vitest";
import { findRemedies } from "../../src/plan/remedies.js";
import { InputError, ProgrammerError } from "../../src/core/errors.js";
import { syntheticPlan } from "../tui/helpers/syntheticPlan.js";

describe("findRemedies error handling", () => {
  it("skips changes whose re-plan is refused as an input error", () => {
    const plan = syntheticPlan();
    const result = findRemedies(plan, () => {
      throw new InputError({ where: "$.reduction.scheme", message: "scheme does not apply" });
    });
    expect(result.tried).toBeGreaterThan(0);
    expect(result.remedies).toEqual([]);
  });

  it("lets a programmer error through", () => {
    const plan = syntheticPlan();
    expect(() => findRemedies(plan, () => { throw new ProgrammerError("broken contract"); })).toThrow(ProgrammerError);
  });

  it("lets an engine error (TypeError, RangeError) through", () => {
    const plan = syntheticPlan();
    expect(() => findRemedies(plan, () => { throw new RangeError("Invalid typed array length"); })).toThrow(RangeError);
    expect(() => findRemedies(plan, () => { throw new TypeError("x is undefined"); })).toThrow(TypeError);
  });
});
