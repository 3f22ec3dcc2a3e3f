/**
 * Services for frame tests: plans come from the synthetic plan (settings follow the overrides),
 * asynchronously and with progress; writes are recorded, not performed.
 */
import type { SessionServices } from "../../../src/tui/SessionApp.js";
import type { PlanOverrides } from "../../../src/plan/planTypes.js";
import { syntheticPlan, SYNTHETIC_SETTINGS } from "./syntheticPlan.js";

export interface FakeServices extends SessionServices {
  planCalls: PlanOverrides[];
  exports: { overrides: PlanOverrides; levels: number; layout?: true }[];
  saves: PlanOverrides[];
}

const tick = () => new Promise<void>((r) => setImmediate(r));

export function fakeServices(): FakeServices {
  const planCalls: PlanOverrides[] = [];
  const exports: { overrides: PlanOverrides; levels: number; layout?: true }[] = [];
  const saves: PlanOverrides[] = [];
  return {
    planCalls,
    exports,
    saves,
    async open() {
      await tick();
      return {
        base: SYNTHETIC_SETTINGS,
        options: {
          materials: [{ id: "ptfe", label: "PTFE" }, { id: "alumina-96", label: "alumina 96 %" }],
          families: [{ id: "rods-in-host", label: "rods in a host" }],
          processes: [{ id: "cnc-milling", label: "CNC milling" }],
        },
      };
    },
    async plan(overrides, onProgress) {
      planCalls.push(overrides);
      onProgress("reduce", 0);
      await tick();
      onProgress("match", 0.5);
      await tick();
      return syntheticPlan(overrides);
    },
    async schemes(settings) {
      await tick();
      const names = settings.polarization === "Ez" ? ["full", "unit-mu", "isotropic"] : ["full", "non-magnetic", "isotropic"];
      return {
        polarization: settings.polarization,
        columns: ["ε<1 cells", "edge R"],
        rows: names.map((scheme, k) => ({ scheme, summary: `summary of ${scheme}`, cells: [String(k * 7), `${k + 1}.00 %`] })),
        notes: ["a note"],
      };
    },
    async exportPlan(plan, overrides, _view, options) {
      await tick();
      exports.push({ overrides, levels: plan.settings.levels ?? -1, ...(options?.layout ? { layout: true as const } : {}) });
      return options?.layout ? ["/out/build-list.csv", "/out/layout.dxf", "/out/session.json"] : ["/out/build-list.csv", "/out/session.json"];
    },
    async saveChoices(overrides) {
      await tick();
      saves.push(overrides);
      return "/out/session.json";
    },
  };
}
