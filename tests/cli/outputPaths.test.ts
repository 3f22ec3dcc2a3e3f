/**
 * Where the user points us at a place we cannot read or write, that is bad input (exit 1, a message
 * naming the path), not an internal error (exit 3) — and nothing is left behind.
 */
import { describe, it, expect } from "vitest";
import { mkdir, writeFile, readdir, readFile } from "node:fs/promises";
import { join } from "node:path";
import { runCli, EXIT_INPUT } from "../../src/cli/run.js";
import { bufferIo } from "../../src/cli/cliIo.js";
import { tempDir } from "../helpers/tempDir.js";

const CLOAK = "demo-designs/field-radial-cloak.json";

describe("unusable paths are input errors", () => {
  it("--out through a file, onto a folder, and a missing imported CSV", async () => {
    const dir = tempDir("cw-paths-");
    await writeFile(join(dir, "afile"), "x");
    await mkdir(join(dir, "adir"));
    const cases: [string[], string][] = [
      [["field", CLOAK, "--out", join(dir, "afile", "f.csv")], join(dir, "afile")],
      [["reduce", CLOAK, "--scheme", "full", "--out", join(dir, "adir")], join(dir, "adir")],
      [["plan", "demo-designs/plan-silicon-chip-bend.json", "--out", join(dir, "afile")], join(dir, "afile")],
    ];
    for (const [argv, named] of cases) {
      const io = bufferIo();
      expect(await runCli(argv, io), `${argv.join(" ")}\n${io.err()}`).toBe(EXIT_INPUT);
      expect(io.err()).toContain(named);
      expect(io.err()).not.toContain("internal error");
    }
    // nothing left behind: no temporary files beside the targets
    expect((await readdir(dir)).sort()).toEqual(["adir", "afile"]);
    expect(await readdir(join(dir, "adir"))).toEqual([]);

    const imported = JSON.parse(await readFile("demo-designs/field-imported.json", "utf8"));
    imported.transform.file = join(dir, "missing.csv");
    const design = join(dir, "imported.json");
    await writeFile(design, JSON.stringify(imported));
    const io = bufferIo();
    expect(await runCli(["field", design], io)).toBe(EXIT_INPUT);
    expect(io.err()).toContain("$.transform.file");
    expect(io.err()).toContain("missing.csv");
  }, 60_000);
});
