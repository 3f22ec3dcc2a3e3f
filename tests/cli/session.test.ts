import { describe, it, expect } from "vitest";
import { readFile, readdir } from "node:fs/promises";
import { join, resolve } from "node:path";
import { spawnSync } from "node:child_process";
import { runCli } from "../../src/cli/run.js";
import { bufferIo, type CliIo } from "../../src/cli/cliIo.js";
import { sessionStart, noTerminalMessage } from "../../src/cli/commands/session.js";
import { createSessionServices } from "../../src/tui/sessionServices.js";
import { saveSessionFile } from "../../src/io/sessionFile.js";
import { InputError } from "../../src/core/errors.js";
import { tempDir } from "../helpers/tempDir.js";

const ROOT = resolve(import.meta.dirname, "..", "..");
const DEMO = join(ROOT, "demo-designs", "plan-microwave-mast-cloak.json");

function ttyIo(cwd: string): CliIo & { out: () => string; err: () => string } {
  return { ...bufferIo(cwd), isTTY: true };
}

describe("cellwright session without a terminal", () => {
  it("exits 1 with a message pointing to `cellwright plan`, never a stack trace (in-process)", async () => {
    const io = bufferIo();
    const code = await runCli(["session", DEMO], io);
    expect(code).toBe(1);
    expect(io.out()).toBe("");
    expect(io.err()).toBe(noTerminalMessage(DEMO));
    expect(io.err()).toContain("needs an interactive terminal");
    expect(io.err()).toContain(`cellwright plan ${DEMO}`);
    expect(io.err()).not.toMatch(/\n\s+at /);
  });

  it("says the same from a real process with piped stdin", () => {
    const r = spawnSync(process.execPath, ["--import", "tsx", join(ROOT, "src", "cli", "main.ts"), "session"], {
      cwd: ROOT,
      input: "",
      encoding: "utf8",
      env: { ...process.env, CI: "true" },
      timeout: 60_000,
    });
    expect(r.status).toBe(1);
    expect(r.stdout).toBe("");
    expect(r.stderr).toContain("cellwright session needs an interactive terminal");
    expect(r.stderr).toContain("cellwright plan <design.json> --out DIR");
    expect(r.stderr).not.toMatch(/\n\s+at /);
  });

  it("loads ink only inside run (the command module itself does not import it)", async () => {
    const text = await readFile(join(ROOT, "src", "cli", "commands", "session.ts"), "utf8");
    expect(text).not.toMatch(/from\s+["'](ink|react)["']/);
    expect(text).toMatch(/await import\("\.\.\/\.\.\/tui\/runSession\.js"\)/);
  });
});

describe("a session on a design with mistakes", () => {
  it("reports every mistake before the screen opens, exit 1, as plan would", async () => {
    const dir = tempDir("cw-sess-bad-");
    const bad = join(dir, "bad.json");
    await (await import("node:fs/promises")).writeFile(bad, JSON.stringify({ name: "x", frequency: "10 mm", transform: { kind: "rotator", innerRadius: "1 mm" }, grid: { pitch: "1 mm" } }));
    const io = { ...bufferIo(dir), isTTY: true };
    const code = await runCli(["session", bad, "--out", join(dir, "out")], io);
    expect(code).toBe(1);
    expect(io.err()).toContain("$.frequency");
    expect(io.err()).toContain("$.transform.outerRadius");
  });
});

describe("where a session starts", () => {
  it("opens the built-in demo when no design is given", async () => {
    const dir = tempDir("cw-sess-");
    const s = await sessionStart({ positionals: [], options: {} }, ttyIo(dir));
    expect(s.designPath).toMatch(/demo-designs[\\/]plan-printed-bend\.json$/);
    expect(s.outDir).toBe(join(dir, "cellwright-out"));
    expect(s.sessionPath).toBe(join(dir, "cellwright-out", "session.json"));
    expect(s.overrides).toEqual({});
  });

  it("resumes the output folder's session file for the same design, unless --fresh", async () => {
    const dir = tempDir("cw-sess-");
    const out = join(dir, "out");
    await saveSessionFile(join(out, "session.json"), { designPath: DEMO, overrides: { levels: 5 }, view: { screen: "levels" } });
    const s = await sessionStart({ positionals: [DEMO], options: { out: "out" } }, ttyIo(dir));
    expect(s.overrides).toEqual({ levels: 5 });
    expect(s.view).toEqual({ screen: "levels" });
    expect(s.note).toMatch(/resumed/);
    const fresh = await sessionStart({ positionals: [DEMO], options: { out: "out", fresh: true } }, ttyIo(dir));
    expect(fresh.overrides).toEqual({});
    // another design with the same folder: starts fresh and says the file will be replaced
    const other = join(ROOT, "demo-designs", "plan-printed-bend.json");
    const s2 = await sessionStart({ positionals: [other], options: { out: "out" } }, ttyIo(dir));
    expect(s2.overrides).toEqual({});
    expect(s2.note).toMatch(/another design/);
  });

  it("refuses an explicit session file of another design, or a missing one without a design", async () => {
    const dir = tempDir("cw-sess-");
    await saveSessionFile(join(dir, "s.json"), { designPath: DEMO, overrides: {} });
    const other = join(ROOT, "demo-designs", "plan-printed-bend.json");
    await expect(sessionStart({ positionals: [other], options: { session: "s.json" } }, ttyIo(dir))).rejects.toBeInstanceOf(InputError);
    await expect(sessionStart({ positionals: [], options: { session: "none.json" } }, ttyIo(dir))).rejects.toBeInstanceOf(InputError);
  });
});

describe("session export = cellwright plan --session", () => {
  it("writes the same build list, levels, report, maps and summary as the command line", async () => {
    const dir = tempDir("cw-sess-");
    const outA = join(dir, "from-session");
    const outB = join(dir, "from-plan");
    const services = createSessionServices({ designPath: DEMO, cwd: dir, outDir: outA, sessionPath: join(outA, "session.json"), useWorker: false });
    const { base } = await services.open();
    const overrides = { levels: 6, tolerance: base.tolerance === 0.03 ? 0.05 : 0.03 };
    const plan = await services.plan(overrides, () => undefined);
    const written = await services.exportPlan(plan, overrides, { screen: "map", mapQuantity: "level", cursorI: 1, cursorJ: 2 });
    await services.close();
    expect(written.map((p) => p.slice(outA.length + 1))).toEqual(["build-list.csv", "levels.csv", "report.md", "maps.svg", "summary.json", "manifest.json", "session.json"]);

    const io = bufferIo(dir);
    const code = await runCli(["plan", "--session", join(outA, "session.json"), "--out", outB], io);
    expect([0, 2]).toContain(code);
    for (const f of ["build-list.csv", "levels.csv", "report.md", "maps.svg"]) {
      const a = await readFile(join(outA, f), "utf8");
      const b = await readFile(join(outB, f), "utf8");
      expect(a.length, f).toBeGreaterThan(0);
      expect(a === b, `${f} differs`).toBe(true);
    }
    const sa = JSON.parse(await readFile(join(outA, "summary.json"), "utf8"));
    const sb = JSON.parse(await readFile(join(outB, "summary.json"), "utf8"));
    // the summaries differ only in the folder their output paths name
    expect(sa.outputs.map((p: string) => p.slice(outA.length))).toEqual(sb.outputs.map((p: string) => p.slice(outB.length)));
    expect({ ...sa, outputs: [] }).toEqual({ ...sb, outputs: [] });
    expect(sa.levels).toBeLessThanOrEqual(6);
    expect(sa.tolerance).toBe(overrides.tolerance);
    expect((await readdir(outA)).filter((f) => f.endsWith(".tmp"))).toEqual([]);
  });
});
