/** The reduced-field CSV writer (src/io/reducedCsv.ts; kept beside the reduce tests it belongs to). */
import { beforeAll, describe, expect, it } from "vitest";
import { readFileSync } from "node:fs";
import { join } from "node:path";
import { parse } from "csv-parse/sync";
import { reducedCsvColumns, writeReducedCsv } from "../../src/io/reducedCsv.js";
import { reduceField } from "../../src/reduce/reduceField.js";
import { expectClose } from "../helpers/close.js";
import { linearMap, radialCloakField, sphericalCloakField } from "./fixtures/fields.js";
import { tempDir } from "../helpers/tempDir.js";

let dir = "";
beforeAll(() => { dir = tempDir("cw-reduced-csv-"); });

describe("writeReducedCsv", () => {
  it("writes every cell with the kept components, round-tripping the numbers; undefined cells stay, empty", async () => {
    const field = radialCloakField(linearMap(0.0271, 0.0589), 0.004);
    field.mu.xx[1] = NaN;
    const red = reduceField(field, { polarization: "Ez", scheme: "unit-mu" });
    const path = join(dir, "ez.csv");
    await writeReducedCsv(path, red, field.grid);
    const rows: Record<string, string>[] = parse(readFileSync(path, "utf8"), { columns: true });
    expect(Object.keys(rows[0])).toEqual(reducedCsvColumns(red, 2));
    expect(rows).toHaveLength(field.grid.count);
    const eps = rows.map((r) => Number(r.eps_zz)).filter((_, c) => c !== 1);
    expectClose(eps, Array.from(red.components.eps_zz).filter((_, c) => c !== 1), { rel: 0, abs: 1e-300, label: "eps_zz round trip" });
    expect(rows[1].eps_zz).toBe("");
    expect(rows[1].flags).toBe("undefined");
    expect(rows[0].flags).toBe("magnetic");
  });

  it("3D: k and z_m columns and all twelve components", async () => {
    const field = sphericalCloakField(1, 2, 0.5);
    const red = reduceField(field, { polarization: "3D", scheme: "full" });
    const path = join(dir, "3d.csv");
    await writeReducedCsv(path, red, field.grid);
    const header = readFileSync(path, "utf8").split("\n")[0].split(",");
    expect(header.slice(0, 6)).toEqual(["i", "j", "k", "x_m", "y_m", "z_m"]);
    expect(header).toContain("mu_yz");
  });
});
