import { describe, expect, it } from "vitest";
import { homogenizationCheck } from "../../src/cells/homogenization.js";
import { checkProcess, type Process } from "../../src/cells/process.js";
import { processCheckFor, shapedPart } from "../../src/cells/cellChecks.js";
import { expectClose } from "../helpers/close.js";

const fff: Process = {
  id: "fused-filament", name: "fused-filament printing", minFeatureM: 0.4e-3, minGapM: 0.3e-3, maxAspectRatio: 20,
  materialClasses: ["polymer"], source: "common practice",
};

describe("checkProcess", () => {
  it("accepts features at or above the limits in a material it takes", () => {
    expect(checkProcess(fff, { featureM: 0.4e-3, gapM: 0.3e-3 }, "polymer")).toEqual({ ok: true, reasons: [] });
  });

  it("refuses a feature below the process limit, a narrow gap, a steep aspect ratio and a foreign material", () => {
    const r = checkProcess(fff, { featureM: 0.2e-3, gapM: 0.1e-3, heightM: 5e-3 }, "ceramic");
    expect(r.ok).toBe(false);
    expect(r.reasons).toHaveLength(4);
    expect(r.reasons[0]).toMatch(/feature 0\.2 mm below the 0\.4 mm minimum/);
    expect(r.reasons[1]).toMatch(/gap 0\.1 mm below the 0\.3 mm minimum/);
    expect(r.reasons[2]).toMatch(/aspect ratio 50 above the 20 maximum/);
    expect(r.reasons[3]).toMatch(/does not take ceramic/);
  });

  it("a closed cell (no gap) is not a gap problem", () => {
    expect(checkProcess(fff, { featureM: 1e-3, gapM: 0 }, "polymer").ok).toBe(true);
  });
});

describe("homogenizationCheck", () => {
  // thresholds λ/10 (ok) and λ/4 (warn) in the densest material: common practice; λ/10 guidance
  // after Smith, Pendry, JOSA B 23, 391 (2006)
  it("ratio = pitch·n·f/c", () => {
    const r = homogenizationCheck(1e-3, 10e9, 3);
    expectClose(r.ratio, (1e-3 * 3 * 10e9) / 299792458, { rel: 1e-15 });
    // 0.100069… is just above λ/10
    expect(r.status).toBe("warn");
  });

  it("ok below λ/10, warn up to λ/4, refuse beyond", () => {
    const lambda = 299792458 / 10e9; // 30 mm in vacuum
    expect(homogenizationCheck(0.09 * lambda, 10e9, 1).status).toBe("ok");
    expect(homogenizationCheck(0.2 * lambda, 10e9, 1).status).toBe("warn");
    expect(homogenizationCheck(0.3 * lambda, 10e9, 1).status).toBe("refuse");
    // n = 2 halves the wavelength in the material
    expect(homogenizationCheck(0.09 * lambda, 10e9, 2).status).toBe("warn");
  });
});

describe("processCheckFor: the process shapes the solid phase", () => {
  // what a printer can make is decided by the solid it deposits (common practice): air rods in a
  // polymer host are holes, so the polymer walls between them are the smallest solid feature and the
  // rods' diameter is the opening
  const airRods = { featureM: 0.5e-3, gapM: 0.1e-3 }; // rod diameter 0.5 mm, wall 0.1 mm

  it("air rods in polymer: the 0.1 mm wall is the feature, checked against the polymer", () => {
    expect(shapedPart("inclusion", "polymer", "gas", airRods)).toEqual({ classes: ["polymer"], feature: { featureM: 0.1e-3, gapM: 0.5e-3 } });
    const r = processCheckFor(fff, "inclusion", "polymer", "gas", airRods)!;
    expect(r.ok).toBe(false);
    expect(r.reasons).toEqual([expect.stringMatching(/feature 0\.1 mm below the 0\.4 mm minimum/)]);
  });

  it("polymer rods in air: the rods are the feature, the wall the gap; a foreign solid is named", () => {
    expect(processCheckFor(fff, "inclusion", "gas", "polymer", airRods)).toEqual({ ok: false, reasons: [expect.stringMatching(/gap 0\.1 mm below the 0\.3 mm minimum/)] });
    expect(processCheckFor(fff, "inclusion", "gas", "ceramic", { featureM: 1e-3, gapM: 1e-3 })!.reasons).toEqual([expect.stringMatching(/does not take ceramic/)]);
  });

  it("both phases fluid: nothing to shape is refused, not passed", () => {
    expect(shapedPart("inclusion", "gas", "liquid", airRods)).toBeNull();
    expect(processCheckFor(fff, "inclusion", "gas", "liquid", airRods)!.ok).toBe(false);
  });

  it("a laminate checks each solid layer's class once; no process, no check", () => {
    expect(shapedPart("both", "polymer", "polymer", airRods)!.classes).toEqual(["polymer"]);
    expect(processCheckFor(undefined, "both", "polymer", "ceramic", airRods)).toBeNull();
  });
});
