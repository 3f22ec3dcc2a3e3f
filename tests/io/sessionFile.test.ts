import { describe, it, expect } from "vitest";
import { readFile, writeFile, readdir } from "node:fs/promises";
import { join } from "node:path";
import { loadSessionFile, saveSessionFile } from "../../src/io/sessionFile.js";
import { InputError } from "../../src/core/errors.js";
import { tempDir } from "../helpers/tempDir.js";

describe("session file", () => {
  it("round-trips the design path and overrides", async () => {
    const dir = tempDir("cw-session-");
    const design = join(dir, "designs", "bend.json");
    const path = join(dir, "out", "session.json");
    const overrides = { scheme: "unit-mu" as const, levels: 8, tolerance: 0.03, materials: ["ptfe", "alumina-96"], process: null };
    await saveSessionFile(path, { designPath: design, overrides, view: { screen: "map", cursorI: 3, cursorJ: 4 } });
    const text = await readFile(path, "utf8");
    expect(JSON.parse(text).design).toBe("../designs/bend.json");
    const back = await loadSessionFile(path);
    expect(back.designPath).toBe(design);
    expect(back.overrides).toEqual(overrides);
    expect(back.view).toEqual({ screen: "map", cursorI: 3, cursorJ: 4 });
    // no temporary file left behind
    expect((await readdir(join(dir, "out"))).filter((f) => f.endsWith(".tmp"))).toEqual([]);
  });

  it("names the file and the JSON path of a bad value", async () => {
    const dir = tempDir("cw-session-");
    const path = join(dir, "s.json");
    await writeFile(path, JSON.stringify({ cellwrightSession: 1, design: "d.json", overrides: { levels: 0, scheme: "magic" } }));
    const err = await loadSessionFile(path).catch((e) => e);
    expect(err).toBeInstanceOf(InputError);
    const wheres = (err as InputError).issues.map((i) => i.where).sort();
    expect(wheres).toEqual([`${path}: $.overrides.levels`, `${path}: $.overrides.scheme`]);
  });

  it("refuses unknown keys, missing files and non-JSON, naming the path", async () => {
    const dir = tempDir("cw-session-");
    const path = join(dir, "s.json");
    await writeFile(path, JSON.stringify({ cellwrightSession: 1, design: "d.json", overrides: { level: 3 } }));
    const e1 = (await loadSessionFile(path).catch((e) => e)) as InputError;
    expect(e1.issues[0].where).toBe(`${path}: $.overrides`);
    await writeFile(path, "{ not json");
    const e2 = (await loadSessionFile(path).catch((e) => e)) as InputError;
    expect(e2.issues[0].where).toBe(path);
    expect(e2.issues[0].message).toMatch(/expected valid json/);
    const e3 = (await loadSessionFile(join(dir, "none.json")).catch((e) => e)) as InputError;
    expect(e3.issues[0].message).toBe("session file not found");
  });

  it("refuses a newer version with a plain message", async () => {
    const dir = tempDir("cw-session-");
    const path = join(dir, "s.json");
    await writeFile(path, JSON.stringify({ cellwrightSession: 7, design: "d.json", overrides: {} }));
    const e = (await loadSessionFile(path).catch((e) => e)) as InputError;
    expect(e.issues[0].message).toMatch(/newer/);
  });

  it("will not write an invalid override", async () => {
    const dir = tempDir("cw-session-");
    const path = join(dir, "s.json");
    await expect(saveSessionFile(path, { designPath: "/x.json", overrides: { tolerance: -1 } })).rejects.toBeInstanceOf(InputError);
    expect(await readdir(dir)).toEqual([]);
  });
});

describe("session file design path", () => {
  it("is stored absolute when the design is far from the session file", async () => {
    const dir = tempDir("cw-session-");
    const path = join(dir, "a", "b", "c", "session.json");
    const design = join(dir, "designs", "x.json");
    await saveSessionFile(path, { designPath: design, overrides: {} });
    expect(JSON.parse(await readFile(path, "utf8")).design).toBe(design);
    expect((await loadSessionFile(path)).designPath).toBe(design);
  });
});
