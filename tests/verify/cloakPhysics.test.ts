/**
 * Published statements about cylindrical cloaks, reproduced with numbers on the full-wave check:
 * (the ideal cloak's approach to zero as the singular edge is approached — Ruan, Yan, Neff, Qiu,
 * Phys. Rev. Lett. 99, 113903 (2007) — is not tested here: on grids up to 48 points per wavelength
 * the FDFD ideal cloak still converges too slowly in h to separate offsets of 0.2a and 0.01a)
 * - the reduced Ez set (unit-mu: μ_r = ((r−a)/r)², μ_θ = 1, ε_z = (b/(b−a))²) is not invisible: its
 *   scattering has a finite floor, from the impedance mismatch Z = 1 − a/b at the outer boundary
 *   (Yan, Ruan, Qiu, "Scattering characteristics of simplified cylindrical invisibility cloaks",
 *   Opt. Express 15, 17772 (2007); Phys. Rev. Lett. 99, 233901 (2007));
 * - a cloak built of N homogeneous layers approaches the continuous one as N grows (the layered
 *   realization argument of the same authors; our check: the difference falls as N doubles).
 * The cloak here is the one the issue quotes: a = λ/2, b = λ, linear map, PEC core. A continuum
 * calculation (an exact radial solution, quoted in the issue) gives σ/σ_bare ≈ 0.33 for the reduced
 * set; the FDFD figures are held to that within their stated uncertainty band below.
 */
import { describe, expect, it } from "vitest";
import { computeTensorField } from "../../src/field/computeTensorField.js";
import type { FieldDesign } from "../../src/field/transformSpec.js";
import { reduceField } from "../../src/reduce/reduceField.js";
import { deviceCases } from "../../src/verify/deviceCases.js";
import type { Scene } from "../../src/verify/scene.js";
import { verifyDevice, type CaseSpec } from "../../src/verify/verifyDevice.js";

const C0 = 299_792_458;
const f = 10e9, lambda = C0 / f;
const a = lambda / 2, b = lambda;

function cloakCases(innerOffsetM: number | undefined, scheme: "full" | "unit-mu") {
  const design: FieldDesign = {
    name: "test cloak", sourcePath: "test.json", background: { eps: 1, mu: 1 },
    transform: { kind: "radial-cloak", innerRadiusM: a, outerRadiusM: b, profile: "linear", ...(innerOffsetM ? { innerOffsetM } : {}) },
    grid: { pitchM: lambda / 20 },
  };
  const field = computeTensorField(design);
  const ideal = reduceField(field, { polarization: "Ez", scheme: "full" });
  const reduced = reduceField(field, { polarization: "Ez", scheme, unitAxis: "larger" });
  return deviceCases({ transform: design.transform, fieldBackground: design.background, background: { eps: 1, mu: 1 }, polarization: "Ez", grid: field.grid, ideal, reduced, plan: null });
}

function run(cases: CaseSpec[], box: ReturnType<typeof cloakCases>["deviceBox"], resolution: number) {
  return verifyDevice({ polarization: "Ez", background: { eps: 1, mu: 1 }, frequencyHz: f, deviceBox: box, cases, resolution, marginM: 0.3 * lambda });
}

/** The reduced scene quantized into n layers of equal thickness (each evaluated at its mid-radius). */
function layered(scene: Scene, n: number): Scene {
  return {
    ...scene,
    smoothMedium: false,
    sample(x, y, out) {
      const r = Math.hypot(x, y);
      if (r <= a || r >= b) return scene.sample(x, y, out);
      const k = Math.min(n - 1, Math.floor(((r - a) / (b - a)) * n));
      const rm = a + ((k + 0.5) * (b - a)) / n;
      return scene.sample((x / r) * rm, (y / r) * rm, out);
    },
  };
}

describe("cylindrical cloak, a = λ/2, b = λ, Ez, PEC core", () => {
  it("the reduced Ez cloak has a finite floor near the continuum value ≈ 0.33, refinement does not take it to zero (Yan, Ruan, Qiu 2007)", () => {
    const c = cloakCases(undefined, "unit-mu");
    const r = verifyDevice({ polarization: "Ez", background: { eps: 1, mu: 1 }, frequencyHz: f, deviceBox: c.deviceBox, cases: c.cases.filter((x) => x.name === "bare" || x.name === "reduced"), marginM: 0.3 * lambda });
    const red = r.cases.find((x) => x.name === "reduced")!;
    // every rung well above zero; the extrapolated value within its uncertainty (plus 10 %, the
    // spread between rungs seen) of the continuum's 0.33
    for (const p of red.ladder) expect(p.vsBare!).toBeGreaterThan(0.2);
    expect(red.uncertainty).not.toBeNull();
    expect(Math.abs(red.vsBare! - 0.33)).toBeLessThan(red.uncertainty! * 1.5 + 0.1);
  });

  it("a layered reduced cloak approaches the continuous one as layers are added", () => {
    const c = cloakCases(undefined, "unit-mu");
    const bare = c.cases.find((x) => x.name === "bare")!;
    const red = c.cases.find((x) => x.name === "reduced")!;
    const cases: CaseSpec[] = [bare, red, ...[3, 6, 12].map((n) => ({ name: "realized" as const, scene: layered(red.scene!, n), indexHint: red.indexHint }))];
    // verifyDevice keys cases by name for the comparison; run the layered ones one at a time
    const ref = run([bare, red], c.deviceBox, 24).cases.find((x) => x.name === "reduced")!.vsBare!;
    const diffs = cases.slice(2).map((lc) => Math.abs(run([bare, lc], c.deviceBox, 24).cases.find((x) => x.name === "realized")!.vsBare! - ref));
    expect(diffs[1]).toBeLessThan(diffs[0]);
    expect(diffs[2]).toBeLessThan(diffs[1]);
  }, 240_000); // seven grid solves: about 25 s on an idle machine, past the 60 s default under load
});
