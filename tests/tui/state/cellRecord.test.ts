/** The cell record names which way the recipe points in that cell (the shop needs it). */
import { describe, it, expect } from "vitest";
import { cellRecord } from "../../../src/tui/state/cellRecord.js";
import { syntheticPlan } from "../helpers/syntheticPlan.js";

describe("cellRecord", () => {
  it("shows the recipe's orientation: rods along z for the synthetic rods-in-host recipe", () => {
    const plan = syntheticPlan();
    const c = Array.from(plan.level).findIndex((l) => l >= 0 && plan.levels[l].recipe !== null);
    expect(c).toBeGreaterThanOrEqual(0);
    const lines = cellRecord(plan, c);
    const points = lines.find((l) => l.label === "points");
    expect(points?.value).toBe("rods along z");
  });
  it("gives the in-plane angle for axis 1 (perpendicular to axis_deg)", () => {
    const plan = syntheticPlan();
    const c = Array.from(plan.level).findIndex((l) => l >= 0 && plan.levels[l].recipe !== null);
    plan.levels[plan.level[c]].recipe!.orientation = "1";
    plan.axisAngleRad[c] = Math.PI / 6; // axis 2 at 30°, so axis 1 at 120° ≡ −60°
    const points = cellRecord(plan, c).find((l) => l.label === "points");
    expect(points?.value).toBe("rods along -60.0° from x");
  });
});
