import { describe, it, expect } from "vitest";
import { sessionReducer, type SessionAction } from "../../../src/tui/state/sessionReducer.js";
import { hasUnsavedChanges, initialSessionState, planIsStale, type SessionState } from "../../../src/tui/state/sessionState.js";
import { commandForKey, keyName, KEY_BINDINGS, helpSections, type CommandId } from "../../../src/tui/state/keyBindings.js";
import { syntheticPlan, SYNTHETIC_SETTINGS } from "../helpers/syntheticPlan.js";

const OPTIONS = {
  materials: [{ id: "ptfe", label: "PTFE" }, { id: "alumina-96", label: "alumina 96 %" }, { id: "fused-silica", label: "fused silica" }],
  families: [{ id: "rods-in-host", label: "rods" }, { id: "holes-in-slab", label: "holes" }],
  processes: [{ id: "cnc-milling", label: "CNC milling" }, { id: "fdm-printing", label: "FDM printing" }],
};

function run(state: SessionState, ...actions: (SessionAction | CommandId)[]): SessionState {
  return actions.reduce<SessionState>((s, a) => sessionReducer(s, typeof a === "string" ? { type: "command", command: a } : a), state);
}

/** A session whose design is read and whose first plan is on screen. */
function ready(): SessionState {
  const s0 = initialSessionState({ designPath: "/d/bend.json", outDir: "/d/out", sessionPath: "/d/out/session.json", mapArea: { width: 60, height: 10 } });
  return run(s0, { type: "designLoaded", base: SYNTHETIC_SETTINGS, options: OPTIONS }, { type: "planReady", seq: 1, plan: syntheticPlan() });
}

describe("key bindings", () => {
  it("names keys and resolves them innermost scope first", () => {
    expect(keyName("", { upArrow: true })).toBe("up");
    expect(keyName("", { tab: true, shift: true })).toBe("S-tab");
    expect(keyName("c", { ctrl: true })).toBe("C-c");
    expect(keyName(" ", {})).toBe("space");
    expect(commandForKey("up", null, "map")).toBe("up");
    expect(commandForKey("p", null, "map")).toBe("togglePolarization");
    expect(commandForKey("p", "help", "map")).toBeNull();
    expect(commandForKey("C-c", "help", "map")).toBe("quit");
    expect(commandForKey("C-c", "confirmQuit", "map")).toBe("forceQuit");
  });
  it("gives no key two meanings in one scope, and help lists every command", () => {
    const seen = new Set<string>();
    for (const b of KEY_BINDINGS) for (const k of b.keys) {
      const id = `${b.scope}:${k}`;
      expect(seen.has(id), id).toBe(false);
      seen.add(id);
    }
    const listed = helpSections().flatMap((s) => s.rows.map((r) => r.does));
    for (const b of KEY_BINDINGS) if (b.label) expect(listed).toContain(b.does);
  });
});

describe("session reducer", () => {
  it("starts computing and centres the cursor on the first plan", () => {
    const s0 = initialSessionState({ designPath: "/d/bend.json", outDir: "/d/out", sessionPath: "/d/out/session.json" });
    expect(s0.computing).not.toBeNull();
    const s = ready();
    expect(s.computing).toBeNull();
    // lattice centre (3.5, 2): the first of the two nearest device cells
    expect(s.cursor).toEqual({ i: 3, j: 2 });
    expect(planIsStale(s)).toBe(false);
    expect(hasUnsavedChanges(s)).toBe(false);
  });

  it("switches screens with Tab and the number keys", () => {
    let s = run(ready(), "nextScreen");
    expect(s.screen).toBe("map");
    s = run(s, "prevScreen", "prevScreen");
    expect(s.screen).toBe("flags");
    expect(run(s, "screenLevels").screen).toBe("levels");
  });

  it("chooses a scheme from the table and asks for a new plan", () => {
    let s = run(ready(), {
      type: "schemesReady",
      table: { polarization: "Ez", columns: ["R"], notes: [], rows: [{ scheme: "full", summary: "", cells: ["0"] }, { scheme: "unit-mu", summary: "", cells: ["0.1"] }] },
    });
    expect(s.schemeCursor).toBe(1); // the designer's pick (from the design) is marked
    s = run(s, "up", "choose");
    expect(s.overrides).toEqual({ scheme: "full" });
    expect(s.planWanted).toBe(2);
    expect(planIsStale(s)).toBe(true);
    expect(hasUnsavedChanges(s)).toBe(true);
    // choosing the design's own scheme again drops the override
    s = run(s, "down", "choose");
    expect(s.overrides).toEqual({});
    expect(hasUnsavedChanges(s)).toBe(false);
  });

  it("switches polarization and moves to a scheme that serves it", () => {
    const s = run(ready(), "togglePolarization");
    expect(s.overrides).toEqual({ polarization: "Hz", scheme: "non-magnetic" });
    expect(s.status).toMatch(/unit-mu does not serve Hz/);
  });

  it("changes levels and tolerance in steps, undo restores", () => {
    let s = run(ready(), "levelsUp");
    expect(s.overrides.levels).toBe(4); // 3 levels in the plan + 1
    s = run(s, "levelsDown", "levelsDown");
    expect(s.overrides.levels).toBe(2);
    s = run(s, "toleranceTighter");
    expect(s.overrides.tolerance).toBe(0.03);
    s = run(s, "toleranceLooser", "toleranceLooser");
    expect(s.overrides.tolerance).toBe(0.075);
    s = run(s, "undo");
    expect(s.overrides.tolerance).toBeUndefined(); // back to the design's 0.05
    s = run(s, "levelsAuto");
    expect(s.overrides.levels).toBeUndefined(); // the design's own choice is "automatic"
  });

  it("ignores stale plan answers and progress", () => {
    let s = run(ready(), "levelsUp", "levelsUp");
    expect(s.planWanted).toBe(3);
    s = run(s, { type: "planProgress", seq: 2, stage: "match", fraction: 0.5 });
    expect(s.computing).toEqual({ stage: "reduce", fraction: 0 });
    s = run(s, { type: "planProgress", seq: 3, stage: "match", fraction: 0.5 });
    expect(s.computing).toEqual({ stage: "match", fraction: 0.5 });
    s = run(s, { type: "planReady", seq: 2, plan: syntheticPlan({ levels: 4 }) });
    expect(s.planSeq).toBe(2);
    expect(s.computing).not.toBeNull(); // still waiting for request 3
    s = run(s, { type: "planReady", seq: 3, plan: syntheticPlan({ levels: 5 }) });
    expect(s.computing).toBeNull();
    expect(run(s, { type: "planReady", seq: 2, plan: syntheticPlan() }).plan?.settings.levels).toBe(5);
  });

  it("moves the map cursor by map cells and clamps at the edge", () => {
    let s = run(ready(), "screenMap", "left", "left", "left", "left", "left", "left");
    expect(s.cursor.i).toBe(0);
    s = run(s, "up", "up", "up", "up");
    expect(s.cursor.j).toBe(4);
    s = run(s, "right", "down");
    expect(s.cursor).toEqual({ i: 1, j: 3 });
  });

  it("cycles map quantities and finds the largest value", () => {
    let s = run(ready(), "screenMap");
    expect(s.mapQuantity).toBe("level");
    s = run(s, "prevQuantity");
    expect(s.mapQuantity).toBe("relError");
    s = run(s, "prevQuantity");
    expect(s.mapQuantity).toBe("flag:norecipe"); // wraps to the last quantity
    s = run(s, "nextQuantity", "nextQuantity", "nextQuantity");
    expect(s.mapQuantity).toBe("target:eps_z");
    s = run(s, "worstCell");
    // eps = 2 + 0.25 i + 0.01 j is largest at the largest i (7) and j inside the device (3)
    expect(s.cursor).toEqual({ i: 7, j: 3 });
  });

  it("jumps from a level or a flagged region to the map", () => {
    let s = run(ready(), "screenLevels", "down", "choose");
    expect(s.screen).toBe("map");
    expect(s.mapQuantity).toBe("level");
    // the cursor lands on a cell of the chosen level (the second: level index 1, cells with i in 3..5)
    const plan = s.plan!;
    const under = Array.from({ length: plan.grid.count }, (_, c) => c).find((c) => plan.grid.i[c] === s.cursor.i && plan.grid.j[c] === s.cursor.j);
    expect(under).not.toBeUndefined();
    expect(plan.level[under!]).toBe(1);
    expect(s.cursor.i).toBeGreaterThanOrEqual(3);
    expect(s.cursor.i).toBeLessThanOrEqual(5);
    s = run(s, "screenFlags", "choose");
    expect(s.mapQuantity).toBe("flag:subunity");
    expect(s.cursor.i).toBeGreaterThanOrEqual(6);
  });

  it("picks materials on a working copy and applies on Enter", () => {
    let s = run(ready(), "pickMaterials");
    expect(s.overlay?.kind).toBe("picker");
    s = run(s, "toggle"); // forbid ptfe
    expect(s.overrides).toEqual({});
    s = run(s, "choose");
    expect(s.overlay).toBeNull();
    expect(s.overrides.materials).toEqual(["alumina-96", "fused-silica"]);
    s = run(s, "pickMaterials", "allowAll", "choose");
    expect(s.overrides.materials).toBeUndefined();
    s = run(s, "pickMaterials", "toggle", "down", "toggle", "down", "toggle");
    expect(s.status).toMatch(/at least one/);
  });

  it("picks a process; Esc cancels", () => {
    let s = run(ready(), "pickProcess", "down", "down", "choose");
    expect(s.overrides.process).toBe("fdm-printing");
    s = run(s, "pickProcess", "up", "close");
    expect(s.overrides.process).toBe("fdm-printing");
  });

  it("asks before quitting with unsaved choices; saves then quits", () => {
    expect(run(ready(), "quit").exitNow).toBe(true);
    let s = run(ready(), "levelsUp", "quit");
    expect(s.overlay?.kind).toBe("confirmQuit");
    expect(s.exitNow).toBe(false);
    expect(run(s, "close").overlay).toBeNull();
    expect(run(s, "confirmYes").exitNow).toBe(true);
    s = run(s, "confirmSave");
    expect(s.saveWanted).toBe(true);
    expect(s.exitNow).toBe(false);
    s = run(s, { type: "saveDone", path: "/d/out/session.json", overrides: s.overrides });
    expect(s.exitNow).toBe(true);
    expect(hasUnsavedChanges(s)).toBe(false);
  });

  it("exports the plan of the latest choices and shows the paths", () => {
    let s = run(ready(), "levelsUp", "export");
    expect(s.exportWanted).toBe(2);
    s = run(s, "levelsUp");
    expect(s.exportWanted).toBe(3); // export follows the newest choices
    s = run(s, { type: "exportDone", paths: ["/d/out/build-list.csv"], overrides: s.overrides });
    expect(s.overlay).toEqual({ kind: "notice", title: "Exported", lines: ["/d/out/build-list.csv"], tone: "ok" });
    expect(hasUnsavedChanges(s)).toBe(false);
    expect(run(s, "close").overlay).toBeNull();
  });

  it("keeps the old plan on screen when a recomputation fails", () => {
    let s = run(ready(), "levelsUp", { type: "planFailed", seq: 2, message: "no material left" });
    expect(s.plan).not.toBeNull();
    expect(s.planError).toBe("no material left");
    expect(s.computing).toBeNull();
    s = run(s, "undo");
    expect(s.planWanted).toBe(3);
  });

  it("does nothing harmful before the design is read", () => {
    const s0 = initialSessionState({ designPath: "/d/x.json", outDir: "/d/out", sessionPath: "/d/out/session.json" });
    for (const c of ["levelsUp", "togglePolarization", "toleranceLooser", "pickMaterials", "up", "choose", "worstCell", "nextQuantity"] as CommandId[]) {
      const s = run(s0, c);
      expect(s.overrides).toEqual({});
      expect(s.planWanted).toBe(1);
    }
  });
});

describe("what would help", () => {
  it("w on the Levels screen applies the best remedy the session can (not a new pitch), and says so when none", () => {
    expect(commandForKey("w", null, "levels")).toBe("applyRemedy");
    const plan = syntheticPlan();
    const effects = [{ what: "recipes" as const, before: 8, after: null, limit: 0, met: true }];
    plan.remedies = {
      tried: 4,
      remedies: [
        { label: "coarser pitch (3 mm)", overrides: {}, pitchM: 0.003, buildable: true, effects, missedAfter: [], changes: "recipes: 8 → met" },
        { label: "allow every catalog material", overrides: { materials: null }, pitchM: null, buildable: true, effects, missedAfter: [], changes: "recipes: 8 → met" },
      ],
    };
    const s0 = initialSessionState({ designPath: "/d/bend.json", outDir: "/d/out", sessionPath: "/d/out/session.json", mapArea: { width: 60, height: 10 } });
    let s = run(s0, { type: "designLoaded", base: { ...SYNTHETIC_SETTINGS, materials: ["ptfe"] }, options: OPTIONS }, { type: "planReady", seq: 1, plan });
    s = run(s, "screenLevels", "applyRemedy");
    expect(s.overrides.materials).toBeNull();
    expect(s.planWanted).toBe(2);
    expect(s.status).toContain("allow every catalog material");
    // a plan without remedies: the state is unchanged but for the status line
    const none = run(ready(), "screenLevels");
    const after = run(none, "applyRemedy");
    expect(after.overrides).toEqual(none.overrides);
    expect(after.planWanted).toBe(none.planWanted);
    expect(after.status).toContain("no remedy");
  });

  it("w skips a remedy that changes the design's background material (the session cannot edit the design)", () => {
    const plan = syntheticPlan();
    const effects = [{ what: "recipes" as const, before: 8, after: null, limit: 0, met: true }];
    const material = { label: "embed the device in polypropylene, index 1.5067 at the design frequency (set reduction.backgroundMaterial to \"polypropylene\", reduction.backgroundIndex to 1.5067)", overrides: { backgroundIndex: 1.5067 }, pitchM: null, design: { backgroundMaterial: "polypropylene", backgroundIndex: 1.5067 }, buildable: true, effects, missedAfter: [], changes: "recipes: 8 → met" };
    plan.remedies = { tried: 3, remedies: [material] };
    const s0 = initialSessionState({ designPath: "/d/bend.json", outDir: "/d/out", sessionPath: "/d/out/session.json", mapArea: { width: 60, height: 10 } });
    const ready1 = run(s0, { type: "designLoaded", base: SYNTHETIC_SETTINGS, options: OPTIONS }, { type: "planReady", seq: 1, plan }, "screenLevels");
    const s = run(ready1, "applyRemedy");
    expect(s.overrides).toEqual(ready1.overrides);
    expect(s.planWanted).toBe(ready1.planWanted);
    expect(s.status).toContain("background material");
    plan.remedies = { tried: 4, remedies: [material, { label: "allow every catalog material", overrides: { materials: null }, pitchM: null, buildable: false, effects, missedAfter: [], changes: "recipes: 8 → met" }] };
    const s2 = run(run(s0, { type: "designLoaded", base: { ...SYNTHETIC_SETTINGS, materials: ["ptfe"] }, options: OPTIONS }, { type: "planReady", seq: 1, plan }, "screenLevels"), "applyRemedy");
    expect(s2.overrides).toEqual({ materials: null });
  });
});
