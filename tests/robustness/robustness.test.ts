/**
 * Generated robustness cases inside `npm test` (fixed seed): mutated demo designs, broken JSON,
 * imported CSVs and command-line arguments, each held to the invariants of invariants.ts. More
 * cases: `npm run fuzz -- --cases 10000 --seed N`.
 */
import { describe, it, expect } from "vitest";
import fc from "fast-check";
import { fuzzCase, fuzzRoot, runCase } from "./fuzzCases.js";
import { tempDir } from "../helpers/tempDir.js";

const root = fuzzRoot(tempDir("cw-fuzz-"));

describe("robustness: generated inputs keep the invariants", () => {
  it("200 cases: exit 0/1/2, errors name their place, no NaN/Infinity, full CSV rows, nothing partial", async () => {
    const failures: string[] = [];
    for (const c of fc.sample(fuzzCase, { numRuns: 200, seed: 20261202 })) {
      const problems = await runCase(c, root);
      if (problems.length) failures.push(`${c.argv.join(" ")}\n  ${problems.join("\n  ")}`);
    }
    expect(failures).toEqual([]);
  }, 600_000);
});
