/**
 * Rods and holes for an Ez isotropic target: along z (the field along the rods sees the Wiener
 * parallel mean, exact) rather than lying in the plane when the two are close — in-plane rods have
 * no plan view and are harder to build (plan/match/chooseRecipes.ts, IN_PLANE_PENALTY).
 */
import { describe, it, expect } from "vitest";
import { readFile } from "node:fs/promises";
import { join } from "node:path";
import { parse } from "csv-parse/sync";
import { runCli } from "../../src/cli/run.js";
import { bufferIo } from "../../src/cli/cliIo.js";
import { baseScore, IN_PLANE_PENALTY } from "../../src/plan/match/chooseRecipes.js";
import type { Candidate } from "../../src/plan/match/levelCandidates.js";
import { expectClose } from "../helpers/close.js";
import { tempDir } from "../helpers/tempDir.js";

describe("rod orientation for Ez isotropic targets", () => {
  it("the printed rods fixture gets rods along z on every level (they were along 1 on two levels before)", async () => {
    const out = tempDir("cw-orient-");
    const io = bufferIo();
    await runCli(["plan", "tests/io/layout-fixtures/printed-rods.json", "--out", out, "--json"], io);
    const levels: Record<string, string>[] = parse(await readFile(join(out, "levels.csv"), "utf8"), { columns: true });
    expect(levels.length).toBe(3);
    for (const lv of levels) {
      expect(lv.family).toBe("rods-in-host");
      expect(lv.orientation).toBe("along_z");
      // along z the field sees the parallel (arithmetic, Wiener 1912) mean: ε = f ε_resin + (1 − f) ε_air
      const f = Number(lv.fill_fraction);
      expect(Math.abs(f * 2.8 + (1 - f) * 1.00054 - Number(lv.achieved_eps_z)) / Number(lv.achieved_eps_z)).toBeLessThan(1e-4);
    }
  }, 120_000);

  it("an in-plane rod scores IN_PLANE_PENALTY more than the same rod along z; isotropic families pay nothing", () => {
    const c = { family: "rods-in-host", orientation: "z", relError: 0.01, spread: 0, indexIm: 0.001, resonant: false, homogenization: "ok" } as unknown as Candidate;
    const inPlane = { ...c, orientation: "1" } as Candidate;
    expectClose(baseScore(inPlane, 0.05) - baseScore(c, 0.05), IN_PLANE_PENALTY, { rel: 1e-12, label: "in-plane penalty" });
    const sphere = { ...c, family: "spheres-in-host", orientation: null } as unknown as Candidate;
    expect(baseScore(sphere, 0.05)).toBe(baseScore(c, 0.05));
  });
});
