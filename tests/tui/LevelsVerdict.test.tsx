/** The Levels screen shows the verdict, each missed requirement and the "what would help" panel. */
import { describe, it, expect } from "vitest";
import { render } from "ink-testing-library";
import { LevelsScreen } from "../../src/tui/screens/LevelsScreen.js";
import { sessionReducer } from "../../src/tui/state/sessionReducer.js";
import { initialSessionState } from "../../src/tui/state/sessionState.js";
import { syntheticPlan, SYNTHETIC_SETTINGS } from "./helpers/syntheticPlan.js";

describe("Levels screen verdict", () => {
  it("names the missed requirements and lists the remedies tried", () => {
    const plan = syntheticPlan();
    plan.remedies = {
      tried: 5,
      remedies: [{ label: "allow every catalog material", overrides: { materials: null }, pitchM: null, buildable: true, effects: [{ what: "recipes", before: 8, after: null, limit: 0, met: true }], missedAfter: [], changes: "recipes: 8 cells without recipe → met" }],
    };
    const s0 = initialSessionState({ designPath: "/d/bend.json", outDir: "/d/out", sessionPath: "/d/out/session.json", mapArea: { width: 60, height: 10 } });
    let s = sessionReducer(s0, { type: "designLoaded", base: SYNTHETIC_SETTINGS, options: { materials: [], families: [], processes: [] } });
    s = sessionReducer(s, { type: "planReady", seq: 1, plan });
    const { lastFrame } = render(<LevelsScreen state={s} width={120} height={30} />);
    const frame = lastFrame() ?? "";
    expect(frame).toContain("NOT buildable: missed recipes");
    expect(frame).toContain("missed recipes: 8 of 38 cells have no recipe");
    expect(frame).toContain("what would help (tried by re-planning; 5 tried):");
    expect(frame).toContain("1. allow every catalog material (buildable): recipes: 8 cells without recipe → met");
  });
});
