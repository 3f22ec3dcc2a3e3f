/** The Levels screen shows the verdict, each missed requirement and the "what would help" panel. */
import { describe, it, expect } from "vitest";
import { render } from "ink-testing-library";
import { Box } from "ink";
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
    expect(frame).toContain("what would help (tried by re-planning; 5 tried; key w applies one):");
    expect(frame).toContain("1. allow every catalog material (buildable): recipes: 8 cells without recipe → met");
  });
});

describe("Levels screen: model uncertainty", () => {
  it("shows a model-uncertainty miss like the others, with its levels", () => {
    const plan = syntheticPlan();
    plan.verdict = { buildable: false, missed: [{ what: "model-uncertainty", value: 0.3, limit: 0.05, levels: [2, 3], text: "levels 2, 3 (9 cells): model uncertainty up to 30 %" }] };
    const s0 = initialSessionState({ designPath: "/d/bend.json", outDir: "/d/out", sessionPath: "/d/out/session.json", mapArea: { width: 60, height: 10 } });
    let s = sessionReducer(s0, { type: "designLoaded", base: SYNTHETIC_SETTINGS, options: { materials: [], families: [], processes: [] } });
    s = sessionReducer(s, { type: "planReady", seq: 1, plan });
    const frame = render(<LevelsScreen state={s} width={120} height={30} />).lastFrame() ?? "";
    expect(frame).toContain("NOT buildable: missed model-uncertainty");
    expect(frame).toContain("missed model-uncertainty: levels 2, 3 (9 cells): model uncertainty up to 30 %");
  });
});

describe("Levels screen at 80 × 24 with a failing plan", () => {
  it("keeps the remedies on screen above six missed requirements, and the column titles apart", () => {
    const plan = syntheticPlan();
    const names = ["recipes", "tolerance", "loss", "bandwidth", "anisotropy", "process"] as const;
    plan.verdict = { buildable: false, missed: names.map((what, k) => ({ what, value: k + 1, limit: 0, text: `requirement ${what} missed by a long explanation that runs past the edge of the screen` })) };
    plan.remedies = {
      tried: 10,
      remedies: [1, 2, 3].map((k) => ({ label: `remedy ${k}`, overrides: { levels: 10 + k }, pitchM: null, buildable: false, effects: [], missedAfter: [], changes: `tolerance: 27.7 % → ${20 + k} %` })),
    };
    const s0 = initialSessionState({ designPath: "/d/bend.json", outDir: "/d/out", sessionPath: "/d/out/session.json", mapArea: { width: 60, height: 10 } });
    let s = sessionReducer(s0, { type: "designLoaded", base: SYNTHETIC_SETTINGS, options: { materials: [], families: [], processes: [] } });
    s = sessionReducer(s, { type: "planReady", seq: 1, plan });
    // 24 rows less the header (4 lines) and the footer (1 line)
    const { lastFrame } = render(<Box width={80}><LevelsScreen state={s} width={80} height={19} /></Box>);
    const frame = lastFrame() ?? "";
    const rows = frame.split("\n");
    expect(rows.length).toBeLessThanOrEqual(19);
    for (const k of [1, 2, 3]) expect(frame).toContain(`${k}. remedy ${k}: tolerance: 27.7 % → ${20 + k} %`);
    expect(frame).toContain("missed recipes: requirement recipes");
    expect(frame).toMatch(/recipe err +quant err +alt/);
    for (const line of rows) expect([...line].length, line).toBeLessThanOrEqual(80);
  });
});
