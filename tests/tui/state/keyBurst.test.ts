import { describe, it, expect } from "vitest";
import { keyNames } from "../../../src/tui/state/keyBurst.js";
import { sessionReducer, type SessionAction } from "../../../src/tui/state/sessionReducer.js";
import { effectiveSettings, initialSessionState, type SessionState } from "../../../src/tui/state/sessionState.js";
import { syntheticPlan, SYNTHETIC_SETTINGS } from "../helpers/syntheticPlan.js";

const OPTIONS = {
  materials: [{ id: "ptfe", label: "PTFE" }, { id: "alumina-96", label: "alumina 96 %" }],
  families: [{ id: "rods-in-host", label: "rods" }],
  processes: [{ id: "cnc-milling", label: "CNC milling" }],
};

function ready(): SessionState {
  const s0 = initialSessionState({ designPath: "/d/bend.json", outDir: "/d/out", sessionPath: "/d/out/session.json" });
  const actions: SessionAction[] = [{ type: "designLoaded", base: SYNTHETIC_SETTINGS, options: OPTIONS }, { type: "planReady", seq: 1, plan: syntheticPlan() }];
  return actions.reduce(sessionReducer, s0);
}

/** Feed one input chunk as the shell does: every key it holds, in order, as a key action. */
function typeChunk(state: SessionState, input: string, key = {}): SessionState {
  return keyNames(input, key).reduce<SessionState>((s, name) => sessionReducer(s, { type: "key", name }), state);
}

describe("keys of one input chunk", () => {
  it("splits a run of characters into one key each, in order", () => {
    expect(keyNames("+++", {})).toEqual(["+", "+", "+"]);
    expect(keyNames("+]-[", {})).toEqual(["+", "]", "-", "["]);
    expect(keyNames("m \r", {})).toEqual(["m", "space", "enter"]);
    expect(keyNames("2\t3", {})).toEqual(["2", "tab", "3"]);
    expect(keyNames("q\u0003", {})).toEqual(["q", "C-c"]);
    expect(keyNames("a\u007fb", {})).toEqual(["a", "b"]); // backspace has no binding
  });
  it("keeps a single key and an escape sequence whole", () => {
    expect(keyNames("+", {})).toEqual(["+"]);
    expect(keyNames("", { upArrow: true })).toEqual(["up"]);
    expect(keyNames("[B", { downArrow: true })).toEqual(["down"]);
    expect(keyNames("", { pageDown: true })).toEqual(["pagedown"]);
    expect(keyNames("\r", { return: true })).toEqual(["enter"]);
    expect(keyNames("", { escape: true })).toEqual(["escape"]);
    expect(keyNames("", { tab: true, shift: true })).toEqual(["S-tab"]);
    expect(keyNames("c", { ctrl: true })).toEqual(["C-c"]);
    expect(keyNames("", {})).toEqual([]);
  });
  it("applies a burst like the same keys typed one by one", () => {
    const s0 = ready();
    const burst = typeChunk(s0, "+++]");
    const oneByOne = ["+", "+", "+", "]"].reduce((s, k) => typeChunk(s, k), s0);
    expect(effectiveSettings(burst)?.levels).toBe(6); // synthetic plan: 3 levels
    expect(effectiveSettings(burst)?.tolerance).toBe(0.075); // step after 0.05 (TOLERANCE_STEPS)
    expect(burst.overrides).toEqual(oneByOne.overrides);
    expect(burst.history).toHaveLength(4);
    expect(burst.planWanted).toBe(s0.planWanted + 4);
  });
  it("resolves each key against the state the previous key left (an overlay opened mid-burst takes the rest)", () => {
    const s0 = ready();
    // m opens the materials picker; in it, the down arrow moves and Space forbids; Enter applies
    let s = typeChunk(s0, "m");
    s = typeChunk(s, "", { downArrow: true });
    s = typeChunk(s, " \r");
    expect(s.overlay).toBeNull();
    expect(effectiveSettings(s)?.materials).toEqual(["ptfe"]);
    // the same keys in one chunk ("m", Space, Enter): Space toggles the first row in the picker
    const t = typeChunk(s0, "m \r");
    expect(effectiveSettings(t)?.materials).toEqual(["alumina-96"]);
    // "a" after "m" in one chunk is the picker's "design's choice", not "levels automatic"
    const u = typeChunk(typeChunk(s0, "+"), "ma");
    expect(u.overlay?.kind).toBe("picker");
    expect(effectiveSettings(u)?.levels).toBe(4);
  });
});
