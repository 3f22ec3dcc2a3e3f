import { describe, it, expect, afterEach } from "vitest";
import { render, cleanup } from "ink-testing-library";
import { SessionApp } from "../../src/tui/SessionApp.js";
import { initialSessionState, type SessionState } from "../../src/tui/state/sessionState.js";
import { fakeServices } from "./helpers/fakeServices.js";

const KEY = { up: "\u001B[A", down: "\u001B[B", right: "\u001B[C", left: "\u001B[D", enter: "\r", escape: "\u001B" };

afterEach(() => cleanup());

/** Poll the last frame until `test` holds; fails on timeout (and on an empty frame) with the frame shown. */
async function waitFor(lastFrame: () => string | undefined, test: (f: string) => boolean, what: string, timeoutMs = 4000): Promise<string> {
  const t0 = Date.now();
  for (;;) {
    const f = lastFrame() ?? "";
    if (f.trim() !== "" && test(f)) return f;
    if (Date.now() - t0 > timeoutMs) throw new Error(`timed out waiting for ${what}; last frame:\n${f || "(empty frame)"}`);
    await new Promise((r) => setTimeout(r, 15));
  }
}

function start(size = { columns: 100, rows: 30 }) {
  const services = fakeServices();
  let exited: SessionState | null = null;
  const initial = initialSessionState({ designPath: "/d/bend.json", outDir: "/out", sessionPath: "/out/session.json" });
  const app = render(<SessionApp initial={initial} services={services} inputActive size={size} onExit={(s) => (exited = s)} />);
  const press = async (...keys: string[]) => {
    for (const k of keys) {
      app.stdin.write(k);
      await new Promise((r) => setTimeout(r, 20));
    }
  };
  return { app, services, press, exited: () => exited };
}

describe("interactive session (frames)", () => {
  it("opens on the scheme table with the designer's pick marked, and chooses another scheme", async () => {
    const { app, services, press } = start();
    let f = await waitFor(app.lastFrame, (s) => s.includes("Reduction schemes for Ez") && s.includes("plan up to date"), "the scheme table");
    expect(f).toMatch(/›●unit-mu/); // cursor and pick on the design's scheme
    expect(f).toContain("synthetic bend");
    await press(KEY.up, KEY.enter);
    f = await waitFor(app.lastFrame, (s) => s.includes("scheme full") && s.includes("plan up to date") && /●full/.test(s), "the new pick");
    expect(f).toContain("● unsaved");
    expect(services.planCalls.at(-1)).toEqual({ scheme: "full" });
  });

  it("switches polarization and shows the other table", async () => {
    const { app, press } = start();
    await waitFor(app.lastFrame, (s) => s.includes("plan up to date"), "first plan");
    await press("p");
    const f = await waitFor(app.lastFrame, (s) => s.includes("Reduction schemes for Hz"), "the Hz table");
    expect(f).toMatch(/●non-magnetic/);
  });

  it("moves the cursor on the map and shows the cell under it", async () => {
    const { app, press } = start();
    await waitFor(app.lastFrame, (s) => s.includes("plan up to date"), "first plan");
    await press("2");
    let f = await waitFor(app.lastFrame, (s) => s.includes("Cell under the cursor"), "the map");
    expect(f).toContain("lattice (3, 2)");
    expect(f).toContain("level (recipe number)");
    // levels 1, 2, 3 in vertical bands (i < 3, 3 ≤ i < 6, i ≥ 6), two characters per cell;
    // the top row's two corner cells lie outside the device and are blank
    expect(f).toMatch(/^ {2}111122222233 {2}/m);
    expect(f).toMatch(/^1111112222223333\s/m);
    await press(KEY.right, KEY.right, KEY.up);
    f = await waitFor(app.lastFrame, (s) => s.includes("lattice (5, 3)"), "the moved cursor");
    expect(f).toMatch(/level\s+2 of 3/);
    await press(".");
    f = await waitFor(app.lastFrame, (s) => s.includes("3/9 target ε_z"), "the next quantity");
    expect(f).toContain("· 2.00"); // legend lower edge of the first mark (min of ε = 2 + 0.25 i + 0.01 j)
  });

  it("changes the number of levels and the tolerance, with progress while computing", async () => {
    const { app, services, press } = start();
    await waitFor(app.lastFrame, (s) => s.includes("plan up to date"), "first plan");
    await press("3");
    await waitFor(app.lastFrame, (s) => s.includes("3 levels, 3 regions"), "levels screen");
    await press("+");
    const f = await waitFor(app.lastFrame, (s) => s.includes("levels ≤4 (3 used) ·") && s.includes("plan up to date"), "levels 4");
    expect(f).toContain("level 1:");
    expect(services.planCalls.at(-1)).toEqual({ levels: 4 });
    await press("[");
    await waitFor(app.lastFrame, (s) => s.includes("tol 3.00 %") && s.includes("plan up to date"), "tighter tolerance");
    expect(services.planCalls.at(-1)).toEqual({ levels: 4, tolerance: 0.03 });
    await press(KEY.down, KEY.down);
    await waitFor(app.lastFrame, (s) => s.includes("no recipe:") && s.includes("no allowed pair reaches"), "level 3 detail");
  });

  it("l on the Levels screen exports with the layout files (the plan --layout code path)", async () => {
    const { app, services, press } = start();
    await waitFor(app.lastFrame, (s) => s.includes("plan up to date"), "first plan");
    await press("l");
    // l is a Levels-screen key: elsewhere it does nothing
    expect(services.exports).toEqual([]);
    await press("3");
    await waitFor(app.lastFrame, (s) => s.includes("l layout"), "the footer names the key");
    await press("l");
    const f = await waitFor(app.lastFrame, (s) => s.includes("Exported"), "the export notice");
    expect(f).toContain("/out/layout.dxf");
    expect(services.exports).toEqual([{ overrides: {}, levels: -1, layout: true }]); // the design's own levels (no override)
  });

  it("exports and shows the paths, then quits without asking", async () => {
    const { app, services, press, exited } = start();
    await waitFor(app.lastFrame, (s) => s.includes("plan up to date"), "first plan");
    await press("+", "e");
    const f = await waitFor(app.lastFrame, (s) => s.includes("Exported"), "the export notice");
    expect(f).toContain("/out/build-list.csv");
    expect(f).toContain("/out/session.json");
    expect(services.exports).toEqual([{ overrides: { levels: 4 }, levels: 4 }]);
    await press(KEY.escape);
    await waitFor(app.lastFrame, (s) => !s.includes("Exported") && !s.includes("● unsaved"), "notice closed, nothing unsaved");
    await press("q");
    await waitFor(() => (exited() ? "exited" : ""), (s) => s === "exited", "exit");
  });

  it("asks before quitting with unsaved choices, and saves on s", async () => {
    const { app, services, press, exited } = start();
    await waitFor(app.lastFrame, (s) => s.includes("plan up to date"), "first plan");
    await press("]", "q");
    const f = await waitFor(app.lastFrame, (s) => s.includes("Quit with unsaved choices?"), "the question");
    expect(f).toContain("tolerance 0.075");
    await press("n");
    await waitFor(app.lastFrame, (s) => !s.includes("Quit with unsaved"), "question closed");
    expect(exited()).toBeNull();
    await press("q", "s");
    await waitFor(() => (exited() ? "exited" : ""), (s) => s === "exited", "exit after saving");
    expect(services.saves).toEqual([{ tolerance: 0.075 }]);
  });

  it("lists every key in the help, and jumps from a flagged region to the map", async () => {
    const { app, press } = start({ columns: 120, rows: 70 });
    await waitFor(app.lastFrame, (s) => s.includes("plan up to date"), "first plan");
    await press("?");
    const help = await waitFor(app.lastFrame, (s) => s.includes("Everywhere"), "help");
    for (const text of ["next screen", "switch polarization", "export build list", "move the cursor one map cell", "jump to the region on the map", "allow / forbid", "quit without saving"]) {
      expect(help).toContain(text);
    }
    await press(KEY.escape, "4");
    await waitFor(app.lastFrame, (s) => s.includes("Flagged cells by region"), "flags screen");
    await press(KEY.down, KEY.enter);
    const f = await waitFor(app.lastFrame, (s) => s.includes("flag subunity"), "map of the flag");
    expect(f).toMatch(/flags\s+subunity, norecipe/);
    expect(f).toContain("region 3");
  });

  it("picks allowed materials in an overlay and recomputes once on Enter", async () => {
    const { app, services, press } = start();
    await waitFor(app.lastFrame, (s) => s.includes("plan up to date"), "first plan");
    const before = services.planCalls.length;
    await press("m");
    await waitFor(app.lastFrame, (s) => s.includes("Allowed materials"), "picker");
    await press(" ");
    await waitFor(app.lastFrame, (s) => s.includes("[ ] ptfe"), "ptfe forbidden");
    expect(services.planCalls.length).toBe(before);
    await press(KEY.enter);
    await waitFor(app.lastFrame, (s) => s.includes("1 materials") && s.includes("plan up to date"), "recomputed");
    expect(services.planCalls.at(-1)).toEqual({ materials: ["alumina-96"] });
  });
});
