/** realization.height: parsed and checked at the edge, defaults from how the device is made. */
import { describe, it, expect } from "vitest";
import { parseDesign } from "../../src/io/design/loadDesign.js";
import { InputError } from "../../src/core/errors.js";
import { deviceHeight, BOARD_THICKNESS_M } from "../../src/plan/deviceHeight.js";
import { resolveSettings } from "../../src/plan/resolveSettings.js";
import { expectClose } from "../helpers/close.js";

const ok = { name: "d", frequency: "28 GHz", transform: { kind: "radial-cloak", innerRadius: "20 mm", outerRadius: "40 mm" }, grid: { pitch: "1.2 mm" } };

async function issues(json: unknown): Promise<{ where: string; message: string }[]> {
  try { await parseDesign(json, "d.json"); } catch (e) { if (e instanceof InputError) return e.issues; throw e; }
  throw new Error("expected an InputError");
}

describe("realization.height", () => {
  it("is a length in any unit, kept in metres", async () => {
    const d = await parseDesign({ ...ok, realization: { height: "4.8 mm" } }, "d.json");
    expectClose(resolveSettings(d).heightM!, 4.8e-3, { rel: 1e-12, label: "height" });
  });

  it("refuses a negative, zero or non-length height with its JSON path", async () => {
    for (const h of ["-1 mm", "0 mm", "3 GHz", "tall"]) {
      const list = await issues({ ...ok, realization: { height: h } });
      expect(list.length, String(h)).toBe(1);
      expect(list[0].where).toMatch(/\$\.realization\.height$/);
      expect(list[0].message).toMatch(/length/);
    }
  });

  it("defaults: given > layer > board for etched patterns > whole cells within λ₀/2", () => {
    const lambda = 299_792_458 / 28e9; // 10.7 mm
    const base = { heightM: null, layer: null, process: null };
    expect(deviceHeight({ ...base, heightM: 2e-3 }, 1.2e-3, lambda).heightM).toBe(2e-3);
    expect(deviceHeight({ ...base, layer: { coreId: "si", thicknessM: 220e-9, belowId: "a", aboveId: "b" } }, 1.2e-3, lambda).heightM).toBe(220e-9);
    expect(deviceHeight({ ...base, process: "pcb-etching" }, 1.2e-3, lambda).heightM).toBe(BOARD_THICKNESS_M);
    // split rings stand on boards: the board thickness is not the device height
    // λ₀/2 = 5.35 mm over a 1.2 mm pitch: 4 whole cells, 4.8 mm
    expectClose(deviceHeight({ ...base, process: "pcb-etching" }, 1.2e-3, lambda, true).heightM, 4.8e-3, { rel: 1e-12, label: "standing boards" });
    expectClose(deviceHeight(base, 1.2e-3, lambda).heightM, 4.8e-3, { rel: 1e-12, label: "whole cells" });
    // a pitch above λ₀/2 still gets one cell
    expect(deviceHeight(base, 8e-3, lambda).heightM).toBe(8e-3);
  });
});
