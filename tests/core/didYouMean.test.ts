/**
 * "Did you mean …" (src/core/didYouMean.ts): the names a user most likely meant, best first, and
 * never an unrelated one. The distance is the optimal-string-alignment distance (Damerau, "A
 * technique for computer detection and correction of spelling errors", Comm. ACM 7(3), 171 (1964):
 * one insertion, deletion, substitution or swap of adjacent letters per edit); the expected
 * distances below are counted by hand. The ranking is our own rule (file comment), checked on the
 * material catalog's ids and on a command's options.
 */
import { beforeAll, describe, expect, it } from "vitest";
import { closest, editDistance, unknownWithSuggestion } from "../../src/core/didYouMean.js";
import { loadMaterialCatalog } from "../../src/io/materialCatalog.js";
import { MATERIAL_CLASSES } from "../../src/media/material.js";
import { command as planCommand } from "../../src/cli/commands/plan.js";

let ids: string[];
beforeAll(async () => {
  ids = (await loadMaterialCatalog()).map((m) => m.id);
});

describe("editDistance (optimal string alignment)", () => {
  it.each([
    ["", "", 0],
    ["", "abc", 3],
    ["abc", "", 3],
    ["kitten", "sitting", 3], // k→s, e→i, +g: the classic Levenshtein example
    ["levles", "levels", 1], // one swap of adjacent letters
    ["ca", "abc", 3], // OSA does not edit a swapped pair again (true Damerau distance: 2)
    ["fused-silca", "fused-silica", 1],
    ["fused-silca", "fused-silica-optical", 9],
  ])("%s → %s: %i", (a, b, d) => {
    expect(editDistance(a, b)).toBe(d);
    expect(editDistance(b, a)).toBe(d);
  });
});

describe("closest: catalog ids", () => {
  it("a typo of fused silica suggests both fused silicas, the plain typo first, and no water", () => {
    // was "fused-silica, water-50c, water-5c": fused-silica-optical is 9 edits from the typed text as a whole
    expect(closest("fused-silca", ids)).toEqual(["fused-silica", "fused-silica-optical"]);
    expect(closest("fused-silica-optcal", ids)).toEqual(["fused-silica-optical", "fused-silica"]);
  });

  it("a name's beginning or one of its words finds the longer ids", () => {
    expect(closest("fused", ids)).toEqual(["fused-silica", "fused-silica-optical"]);
    expect(closest("ptf", ids)).toEqual(["ptfe", "ptfe-glass", "ptfe-ceramic-3"]);
    expect(closest("sapphire", ids)).toEqual(["sapphire-e", "sapphire-o"]);
    expect(closest("water-5", ids)).toEqual(["water-5c", "water-50c", "water"]);
    expect(closest("silica", ids).slice(0, 2)).toEqual(["fused-silica", "fused-silica-optical"]);
  });

  it("whole-name typos as before", () => {
    expect(closest("alumna-96", ids)[0]).toBe("alumina-96");
    expect(closest("aluminia-96", ids)[0]).toBe("alumina-96");
    expect(closest("ptfee", ids)[0]).toBe("ptfe");
    expect(closest("plaa", ids)).toEqual(["pla"]);
    expect(closest("ptfe-glas", ids)).toEqual(["ptfe-glass", "ptfe"]);
  });

  it("nothing unrelated: every suggestion shares a close word or beginning with the typed text", () => {
    expect(closest("xyz", ids)).toEqual([]);
    expect(closest("unobtainium", ids)).toEqual([]);
    expect(unknownWithSuggestion("material", "xyz", ids)).toBe("unknown material 'xyz'");
    for (const w of ["fused-silca", "ptf", "water-5", "alumna-96", "silica"]) {
      for (const c of closest(w, ids)) {
        const words = c.split("-");
        const runs = words.flatMap((_, i) => words.slice(i).map((__, j) => words.slice(i, i + j + 1).join("-")));
        const near = runs.some((r) => editDistance(w, r) <= Math.max(1, Math.floor(w.length / 3))) || c.startsWith(w) || w.startsWith(c);
        expect(near, `${w} → ${c}`).toBe(true);
      }
    }
  });

  it("a short list is given whole when nothing is near", () => {
    expect(unknownWithSuggestion("class", "plastic", MATERIAL_CLASSES)).toBe(`unknown class 'plastic'; expected one of ${MATERIAL_CLASSES.join(", ")}`);
    expect(unknownWithSuggestion("class", "glas", MATERIAL_CLASSES)).toBe("unknown class 'glas'; did you mean glass, gas?"); // both one edit away
  });
});

describe("closest: options", () => {
  const options = planCommand.options!.map((o) => `--${o.name}`);
  it.each([
    ["--levles", ["--levels"]],
    ["--backround-index", ["--background-index"]],
    ["--tolerence", ["--tolerance"]],
    ["--polarisation", ["--polarization"]],
    ["--jsn", ["--json"]],
    ["--output", ["--out"]],
    ["--lay", ["--layout"]],
    ["--LEVELS", ["--levels"]],
    ["--bg", []],
  ])("%s → %j", (typed, expected) => {
    expect(closest(typed, options)).toEqual(expected);
  });
});
