/**
 * The session at 80 × 24 as a user meets it: keys typed in one burst and keys typed while plans
 * are still computing all arrive; the footer keeps undo, save and export in view; pickers keep ids
 * and names apart; the tab, the selected row and the map cursor show without colour; a constant
 * quantity is one flat fill.
 */
import { describe, it, expect, afterEach } from "vitest";
import { render, cleanup } from "ink-testing-library";
import { SessionApp } from "../../src/tui/SessionApp.js";
import { initialSessionState } from "../../src/tui/state/sessionState.js";
import { CONSTANT_GLYPH, CURSOR_GLYPH } from "../../src/tui/state/heatMap.js";
import type { PlanOverrides } from "../../src/plan/planTypes.js";
import { fakeServices } from "./helpers/fakeServices.js";

const SIZE = { columns: 80, rows: 24 };
const KEY = { down: "\u001B[B", enter: "\r", escape: "\u001B" };
const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

afterEach(() => cleanup());

async function waitFor(lastFrame: () => string | undefined, test: (f: string) => boolean, what: string, timeoutMs = 5000): Promise<string> {
  const t0 = Date.now();
  for (;;) {
    const f = lastFrame() ?? "";
    if (f.trim() !== "" && test(f)) return f;
    if (Date.now() - t0 > timeoutMs) throw new Error(`timed out waiting for ${what}; last frame:\n${f || "(empty frame)"}`);
    await sleep(15);
  }
}

/** Fake services; `planMs` makes every plan take that long (keys then arrive while plans compute). */
function start(opts: { overrides?: PlanOverrides; planMs?: number; constantEps?: boolean } = {}) {
  const services = fakeServices();
  const open = services.open.bind(services);
  const plan = services.plan.bind(services);
  services.open = async () => {
    const r = await open();
    r.options.processes = [
      { id: "two-photon-lithography", label: "two-photon lithography" },
      { id: "stereolithography", label: "stereolithography (SLA), resin vat" },
      { id: "a-process-id-much-longer-than-any-column-could-hold", label: "a process name that is also far too long for the line it sits on" },
    ];
    return r;
  };
  services.plan = async (overrides, onProgress) => {
    const p = await plan(overrides, onProgress);
    if (opts.planMs) await sleep(opts.planMs);
    if (opts.constantEps) p.targets[0].fill(2.5);
    return p;
  };
  const initial = initialSessionState({ designPath: "/d/bend.json", outDir: "/out", sessionPath: "/out/session.json", overrides: opts.overrides });
  const app = render(<SessionApp initial={initial} services={services} inputActive size={SIZE} />);
  return { app, services };
}

function lines(frame: string): string[] {
  return frame.split("\n");
}

describe("session at 80 × 24", () => {
  it("reads every key of a burst written in one chunk", async () => {
    const { app, services } = start();
    await waitFor(app.lastFrame, (s) => s.includes("plan up to date"), "first plan");
    app.stdin.write("+++"); // one terminal write: ink hands it over as one string
    const f = await waitFor(app.lastFrame, (s) => s.includes("levels ≤6 (3 used) ·") && s.includes("plan up to date"), "levels 3 + 3");
    expect(f).toContain("levels ≤6 (3 used)"); // the synthetic plan has 3 levels whatever the largest count
    expect(services.planCalls.at(-1)).toEqual({ levels: 6 });
    app.stdin.write("]-\r\u001B[A\r"); // tolerance step, one level fewer, Enter, ↑, Enter (scheme above)
    await waitFor(app.lastFrame, (s) => s.includes("levels ≤5 (3 used) ·") && s.includes("tol 7.50 %") && s.includes("full ·") && s.includes("plan up to date"), "levels 5, 7.5 %, full");
    expect(services.planCalls.at(-1)).toEqual({ levels: 5, tolerance: 0.075, scheme: "full" });
  });

  it("keeps every key typed 50 ms apart while plans are computing", async () => {
    // 8 levels and 3 % to start; each plan takes 120 ms, so most keys arrive while one computes
    const { app, services } = start({ overrides: { levels: 8, tolerance: 0.03 }, planMs: 120 });
    await waitFor(app.lastFrame, (s) => s.includes("plan up to date"), "first plan");
    for (const k of ["+", "]", "+", "+", "]", "+", "[", "+", "3"]) {
      app.stdin.write(k);
      await sleep(50);
    }
    // 8 + 5 = 13 levels; 3 % → 5 % → 7.5 % → 5 % (the tolerance steps)
    const f = await waitFor(app.lastFrame, (s) => s.includes("levels ≤13 (3 used) · tol 5.00 %") && s.includes("plan up to date"), "13 levels and 5 %");
    expect(f).toContain("[3 Levels]");
    expect(services.planCalls.at(-1)).toEqual({ levels: 13 }); // 5 % is the design's own tolerance
  });

  it("shows undo, save and export in the footer on every screen, within 80 columns", async () => {
    const { app } = start();
    await waitFor(app.lastFrame, (s) => s.includes("plan up to date"), "first plan");
    for (const [key, tab] of [["1", "[1 Reduction]"], ["2", "[2 Map]"], ["3", "[3 Levels]"], ["4", "[4 Flags]"]]) {
      app.stdin.write(key);
      const f = await waitFor(app.lastFrame, (s) => s.includes(tab), tab);
      const footer = lines(f).at(-1) ?? "";
      for (const hint of ["u undo", "s save", "e export", "+/- levels", "[/] tolerance", "?"]) expect(footer, `${tab}: ${footer}`).toContain(hint);
      expect([...footer.trimEnd()].length).toBeLessThanOrEqual(80);
      for (const line of lines(f)) expect([...line].length, line).toBeLessThanOrEqual(80);
    }
  });

  it("gives picker ids and names their own columns, cut with an ellipsis when too long", async () => {
    const { app } = start();
    await waitFor(app.lastFrame, (s) => s.includes("plan up to date"), "first plan");
    app.stdin.write("b");
    const f = await waitFor(app.lastFrame, (s) => s.includes("Fabrication process"), "process picker");
    expect(f).not.toContain("two-photon-lithographytwo-photon");
    expect(f).toMatch(/two-photon-lithography +two-photon lithography/);
    // the long id is cut to its column and its name still starts in the name column
    const long = lines(f).find((l) => l.includes("a-process-id")) ?? "";
    expect(long).toMatch(/a-process-id\S*… +a process name/);
    expect([...long].length).toBeLessThanOrEqual(80);
    // the selected row carries a marker besides the inverse colours: the first row is selected
    expect(f).toMatch(/^›\(•\) +no process limit/m);
    app.stdin.write(KEY.down);
    const g = await waitFor(app.lastFrame, (s) => /^›\( \) two-photon-lithography/m.test(s), "marker moved");
    expect(g).toMatch(/^ \(•\) +no process limit/m);
  });

  it("marks the selected tab, the selected level row and the map cursor with glyphs", async () => {
    const { app } = start();
    await waitFor(app.lastFrame, (s) => s.includes("plan up to date"), "first plan");
    let f = app.lastFrame() ?? "";
    expect(f).toContain("[1 Reduction]");
    expect(f).toContain(" 2 Map ");
    app.stdin.write("3");
    f = await waitFor(app.lastFrame, (s) => s.includes("[3 Levels]") && s.includes("3 levels, 3 regions"), "levels screen");
    expect(f).toMatch(/^›1 /m);
    expect(f).toMatch(/^ 2 /m);
    app.stdin.write(KEY.down);
    f = await waitFor(app.lastFrame, (s) => /^›2 /m.test(s), "second level selected");
    app.stdin.write("2");
    f = await waitFor(app.lastFrame, (s) => s.includes("Cell under the cursor"), "map");
    // exactly one map cell (two characters) is the cursor
    expect(f.split(CURSOR_GLYPH).length - 1).toBe(2);
  });

  it("draws a quantity that is constant over the device as one flat fill with one legend entry", async () => {
    const { app } = start({ constantEps: true });
    await waitFor(app.lastFrame, (s) => s.includes("plan up to date"), "first plan");
    app.stdin.write("2."); // Map screen, then from "level" to the next quantity, target ε_z
    const f = await waitFor(app.lastFrame, (s) => s.includes("target ε_z"), "the constant quantity");
    expect(f).toContain(`${CONSTANT_GLYPH} constant 2.50`);
    const mapRows = lines(f).filter((l) => l.includes(CONSTANT_GLYPH.repeat(4)));
    expect(mapRows.length).toBe(5); // the 8 × 5 lattice, one row each
    for (const row of mapRows) {
      const drawn = row.slice(0, 16).replace(/ /g, "").replace(new RegExp(CURSOR_GLYPH, "g"), "");
      expect(drawn).toMatch(new RegExp(`^${CONSTANT_GLYPH}+$`));
    }
    expect(f).not.toMatch(/[·:+*#@]{2}/); // no ramp glyphs on the map
  });
});

describe("the settings line", () => {
  it("drops words before values so that every setting fits 80 columns", async () => {
    const { settingsLine } = await import("../../src/tui/components/Header.js");
    const { sessionReducer } = await import("../../src/tui/state/sessionReducer.js");
    const { SYNTHETIC_SETTINGS } = await import("./helpers/syntheticPlan.js");
    const s0 = initialSessionState({ designPath: "/d/bend.json", outDir: "/out", sessionPath: "/out/session.json" });
    const base = { ...SYNTHETIC_SETTINGS, levels: 10, process: "stereolithography", materials: ["ptfe", "alumina-96", "air"], families: ["rods-in-host"] };
    const s = sessionReducer(s0, { type: "designLoaded", base, options: { materials: [], families: [], processes: [] } });
    const wide = settingsLine(s, 200);
    expect(wide).toBe("Ez · unit-mu · levels 10 · tol 5.00 % · process stereolithography · 3 materials · 1 family");
    const narrow = settingsLine(s, 80);
    expect(narrow).toBe("Ez · unit-mu · 10 lv · tol 5.00 % · stereolithography · 3 mat · 1 fam");
    expect(narrow.length).toBeLessThanOrEqual(80);
  });
});
