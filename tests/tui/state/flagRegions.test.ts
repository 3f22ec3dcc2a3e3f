/** The Flags screen's rows name regions and levels with the same 1-based numbers as the plan. */
import { describe, it, expect } from "vitest";
import { flagRegionRows } from "../../../src/tui/state/flagRegions.js";
import { syntheticPlan } from "../helpers/syntheticPlan.js";

describe("flagRegionRows", () => {
  it("gives each region's level as the plan numbers it (1-based), not shifted", () => {
    const plan = syntheticPlan();
    const rows = flagRegionRows(plan).filter((r) => r.region !== null);
    expect(rows.length).toBeGreaterThan(0);
    for (const row of rows) {
      const region = plan.regions.find((g) => g.index === row.region)!;
      expect(row.level).toBe(region.level);
      expect(row.level).toBeGreaterThanOrEqual(1);
      expect(row.level).toBeLessThanOrEqual(plan.levels.length);
    }
  });
});
