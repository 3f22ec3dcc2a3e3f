/**
 * An imported field with a cell whose ε is not positive definite is not a passive transformation
 * medium: `field` warns, counts the cell, leaves it out of the anisotropy, and never prints NaN or
 * Infinity.
 */
import { describe, it, expect } from "vitest";
import { readFile, writeFile } from "node:fs/promises";
import { join, resolve } from "node:path";
import { runCli, EXIT_OK } from "../../src/cli/run.js";
import { bufferIo } from "../../src/cli/cliIo.js";
import { tempDir } from "../helpers/tempDir.js";

describe("field on an imported tensor that is not positive definite", () => {
  it("warns, counts it and keeps every printed number finite", async () => {
    const dir = tempDir("cw-npd-");
    const csv = (await readFile("demo-designs/field-imported.csv", "utf8")).split("\n");
    // third line is the first data row: make eps_xx = −1 there
    const cells = csv[2].split(",");
    cells[2] = "-1";
    csv[2] = cells.join(",");
    await writeFile(join(dir, "f.csv"), csv.join("\n"));
    const design = JSON.parse(await readFile("demo-designs/field-imported.json", "utf8"));
    design.transform.file = resolve(dir, "f.csv");
    await writeFile(join(dir, "d.json"), JSON.stringify(design));

    const human = bufferIo();
    expect(await runCli(["field", join(dir, "d.json")], human)).toBe(EXIT_OK);
    expect(human.err()).toContain("not positive definite");
    expect(human.out()).toContain("cells not positive definite");
    expect(human.out()).not.toMatch(/NaN|Infinity/);

    const json = bufferIo();
    await runCli(["field", join(dir, "d.json"), "--json"], json);
    const s = JSON.parse(json.out());
    expect(s.cellsNotPositiveDefinite.eps).toBe(1);
    // the other cells are the beam shifter's [[1, a], [a, 1 + a²]] with a = 0.25 (Rahm et al., PRL 100,
    // 063903 (2008)): eigenvalues (2 + a² ± a·sqrt(a² + 4))/2, ratio ≈ 1.28 (derived); finite, not Infinity
    const a = 0.25, hi = (2 + a * a + a * Math.sqrt(a * a + 4)) / 2, lo = (2 + a * a - a * Math.sqrt(a * a + 4)) / 2;
    expect(Math.abs(s.maxAnisotropy.eps - hi / lo)).toBeLessThan(1e-9 * (hi / lo));
  });
});
