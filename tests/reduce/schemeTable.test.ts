import { describe, expect, it } from "vitest";
import { formatNumber } from "../../src/reduce/formatNumber.js";
import { reduceField } from "../../src/reduce/reduceField.js";
import { compareSchemes, schemeSummary } from "../../src/reduce/schemeMetrics.js";
import { schemeTable, wrap } from "../../src/reduce/schemeTable.js";
import { REDUCTION_SCHEMES } from "../../src/reduce/schemes/registry.js";
import { latticeGrid, fieldFromTensor, linearMap, radialCloakField } from "./fixtures/fields.js";

const field = radialCloakField(linearMap(0.0271, 0.0589), 0.002, { capValue: 50 });

describe("schemeTable", () => {
  for (const pol of ["Ez", "Hz"] as const) {
    it(`${pol}: one row per scheme, the chosen one starred, every line within 80 columns`, () => {
      const summaries = compareSchemes(field, pol);
      const chosen = pol === "Ez" ? "unit-mu" : "non-magnetic";
      const t = schemeTable(summaries, { polarization: pol, chosen });
      expect(t.rows.map((r) => r.scheme)).toEqual(summaries.map((s) => s.scheme));
      expect(t.rows.filter((r) => r.chosen).map((r) => r.scheme)).toEqual([chosen]);
      for (const l of t.lines) expect(l.length, l).toBeLessThanOrEqual(80);
      expect(t.lines.filter((l) => l.startsWith(`* ${chosen} `))).toHaveLength(2);
      // every scheme's one-line explanation is printed
      for (const s of summaries) expect(t.lines.some((l) => l.includes(REDUCTION_SCHEMES[s.scheme].summary))).toBe(true);
      // capped cells are named
      expect(t.notes.some((n) => /capped cells: \d+/.test(n))).toBe(true);
    });
  }

  it("cells show count and percentage; the dropped column only for isotropic", () => {
    const t = schemeTable(compareSchemes(field, "Ez"), { polarization: "Ez" });
    const full = t.rows.find((r) => r.scheme === "full")!;
    expect(full.cells.magnetic).toBe(`${field.grid.count} 100%`);
    expect(full.cells.dropped).toBe("–");
    expect(t.rows.find((r) => r.scheme === "isotropic")!.cells.dropped).not.toBe("–");
    // reduced Ez set: Z = 1 − a/b, R = (a/(2b−a))² = (27.1/90.7)² = 0.0893 (Yan, Ruan, Qiu 2007), 2 digits
    expect(t.rows.find((r) => r.scheme === "unit-mu")!.cells.reflection).toBe("0.089");
  });

  it("names undefined cells once when every scheme shares them", () => {
    const f = radialCloakField(linearMap(0.0271, 0.0589), 0.004);
    f.eps.zz[0] = NaN;
    f.mu.zz[0] = NaN;
    const t = schemeTable(compareSchemes(f, "Ez"), { polarization: "Ez" });
    expect(t.notes.filter((n) => /undefined/.test(n))).toHaveLength(1);
    expect(t.notes.join("\n")).toMatch(/undefined in every scheme: 1 cells/);
  });

  it("an empty device gives a table of dashes, not NaN", () => {
    const empty = fieldFromTensor(latticeGrid(0.001, 0.002, () => false), () => NaN);
    const s = schemeSummary(reduceField(empty, { polarization: "Ez", scheme: "full" }), empty);
    expect(s.cells).toBe(0);
    const t = schemeTable([s], { polarization: "Ez" });
    expect(t.lines.join("\n")).not.toMatch(/NaN/);
    expect(compareSchemes(empty, "Ez").skipped?.map((k) => k.scheme)).toEqual(["matched"]);
  });
});

describe("formatNumber", () => {
  it("keeps three significant digits, exponent form outside [1e-3, 1e4)", () => {
    expect(formatNumber(3.4306)).toBe("3.43");
    expect(formatNumber(0.0029137)).toBe("0.00291");
    expect(formatNumber(0.00029137)).toBe("2.91e-4");
    expect(formatNumber(1681.0000003)).toBe("1681");
    expect(formatNumber(15100)).toBe("1.51e4");
    expect(formatNumber(1)).toBe("1");
    expect(formatNumber(0)).toBe("0");
    expect(formatNumber(-0.5)).toBe("-0.5");
    expect(formatNumber(NaN)).toBe("–");
    expect(formatNumber(Infinity)).toBe("∞");
  });
});

describe("wrap", () => {
  it("breaks at spaces and indents continuation lines", () => {
    expect(wrap("short", 80)).toEqual(["short"]);
    const w = wrap("aaaa bbbb cccc dddd", 10);
    expect(w).toEqual(["aaaa bbbb", "    cccc", "    dddd"]);
    for (const l of w) expect(l.length).toBeLessThanOrEqual(10);
  });
});
