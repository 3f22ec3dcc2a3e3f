import { describe, expect, it } from "vitest";
import { InputError } from "../../src/core/errors.js";
import { reduceField } from "../../src/reduce/reduceField.js";
import { FLAG_EPS_BELOW_ONE, FLAG_MAGNETIC, FLAG_UNDEFINED } from "../../src/reduce/reducedField.js";
import { expectClose } from "../helpers/close.js";
import { toCylindrical } from "./fixtures/cylindrical.js";
import { linearMap, quadraticMap, radialCloakField, sphericalCloakField } from "./fixtures/fields.js";

// Schurig et al., "Metamaterial electromagnetic cloak at microwave frequencies", Science 314, 977
// (2006): a = 27.1 mm, b = 58.9 mm (from memory; any a < b exercises the same closed forms).
const A = 0.0271, B = 0.0589;
const cloak = radialCloakField(linearMap(A, B), 0.001);
// Cartesian storage holds the small principal value of a strongly anisotropic tensor only to an
// absolute ~1e-16 × the large one (near r = a the ratio reaches ~1e8), so tolerances below scale
// with the cell's anisotropy where a small principal value enters.
const EPS = 1e-14;

function eachCell(f: (c: number, r: number, phi: number) => void): void {
  for (let c = 0; c < cloak.grid.count; c++) f(c, Math.hypot(cloak.grid.xM[c], cloak.grid.yM[c]), Math.atan2(cloak.grid.yM[c], cloak.grid.xM[c]));
}

describe("linear cylindrical cloak, Ez / unit-mu", () => {
  const red = reduceField(cloak, { polarization: "Ez", scheme: "unit-mu" });

  it("gives the published reduced set μ_r = ((r−a)/r)², μ_θ = 1, ε_z = (b/(b−a))² in every cell", () => {
    // Schurig et al., Science 314, 977 (2006), reduced parameters for E along z
    const epsZ = (B / (B - A)) ** 2;
    eachCell((c, r, phi) => {
      const m = toCylindrical(red.components.mu_xx[c], red.components.mu_yy[c], red.components.mu_xy[c], phi);
      expectClose(m.r, ((r - A) / r) ** 2, { rel: 1e-12, abs: 1e-14, label: `mu_r at r=${r}` });
      expectClose(m.t, 1, { rel: 1e-12, label: `mu_theta at r=${r}` });
      expectClose(m.rt, 0, { abs: 1e-12, label: `mu_rθ at r=${r}` });
      expectClose(red.components.eps_zz[c], epsZ, { rel: 1e-12, label: `eps_zz at r=${r}` });
    });
  });

  it("ε_z = 3.4306 for the experiment's radii", () => {
    // references.md: the formula gives 3.4306 for a = 27.1 mm, b = 58.9 mm (Schurig et al. quote 3.423 — rounded differently)
    expectClose(red.components.eps_zz[0], 3.4306, { abs: 5e-5 });
  });

  it("μ_r spans roughly 0.003…0.28 over the shell, the experiment's quoted range", () => {
    // Schurig et al. 2006 quote μ_r from about 0.003 to 0.28 (from memory). The upper end is the
    // formula at r = b: ((b−a)/b)² = 0.2915; the lower end depends on the innermost cell.
    let lo = Infinity, hi = -Infinity;
    for (let c = 0; c < red.count; c++) { lo = Math.min(lo, red.principal[0][c]); hi = Math.max(hi, red.principal[0][c]); }
    expect(hi).toBeLessThan(((B - A) / B) ** 2);
    expectClose(hi, 0.28, { rel: 0.05 });
    expect(lo).toBeLessThan(0.003);
  });

  it("leaves one magnetic component: every cell magnetic, none needs ε < 1", () => {
    for (let c = 0; c < red.count; c++) {
      expect(red.flags[c] & FLAG_MAGNETIC).toBe(FLAG_MAGNETIC);
      expect(red.flags[c] & FLAG_EPS_BELOW_ONE).toBe(0);
    }
  });

  it("`smaller` makes the smaller principal μ (μ_r) equal to 1 instead", () => {
    // same scaling rule with α = 1/μ_r: μ_θ ← μ_θ/μ_r = (r/(r−a))², ε_z ← ε_z μ_r = (b/(b−a))²((r−a)/r)²
    const small = reduceField(cloak, { polarization: "Ez", scheme: "unit-mu", unitAxis: "smaller" });
    eachCell((c, r, phi) => {
      const m = toCylindrical(small.components.mu_xx[c], small.components.mu_yy[c], small.components.mu_xy[c], phi);
      const cond = (r / (r - A)) ** 2; // μ_θ/μ_r of the ideal cloak
      expectClose(m.r, 1, { rel: EPS * cond });
      expectClose(m.t, (r / (r - A)) ** 2, { rel: EPS * cond });
      expectClose(small.components.eps_zz[c], (B / (B - A)) ** 2 * ((r - A) / r) ** 2, { rel: EPS * cond });
    });
  });
});

describe("linear cylindrical cloak, Hz / non-magnetic", () => {
  it("gives ε_r = (b/(b−a))²((r−a)/r)², ε_θ = (b/(b−a))², μ_z = 1", () => {
    // Cai, Chettiar, Kildishev, Shalaev, "Optical cloaking with metamaterials", Nature Photonics 1, 224 (2007)
    const red = reduceField(cloak, { polarization: "Hz", scheme: "non-magnetic" });
    const k = (B / (B - A)) ** 2;
    eachCell((c, r, phi) => {
      const e = toCylindrical(red.components.eps_xx[c], red.components.eps_yy[c], red.components.eps_xy[c], phi);
      expectClose(e.r, k * ((r - A) / r) ** 2, { rel: 1e-12, abs: 1e-14, label: "eps_r" });
      expectClose(e.t, k, { rel: 1e-12, label: "eps_theta" });
      expect(red.components.mu_zz[c]).toBe(1);
      expect(red.flags[c] & FLAG_MAGNETIC).toBe(0);
    });
  });

  it("at several radii, by the exact point evaluator", async () => {
    const { reductionSettings } = await import("../../src/reduce/reduceField.js");
    const { reducePoint } = await import("../../src/reduce/reducePoint.js");
    const s = reductionSettings(cloak, { polarization: "Hz", scheme: "non-magnetic" });
    const k = (B / (B - A)) ** 2;
    for (const r of [0.03, 0.04, 0.05, 0.058]) {
      const p = reducePoint(cloak, s, r, 0, 0);
      // on the x axis ε_xx = ε_r, ε_yy = ε_θ (Cai et al. 2007)
      expectClose(p.components.eps_xx, k * ((r - A) / r) ** 2, { rel: 1e-12, label: `eps_r(${r})` });
      expectClose(p.components.eps_yy, k, { rel: 1e-12, label: `eps_theta(${r})` });
      expectClose(p.components.mu_zz, 1, { rel: 1e-15 });
      expect(p.source).toBe("exact");
    }
  });
});

describe("quadratic cloak, Hz / non-magnetic", () => {
  it("gives ε_r = (r/r')², ε_θ = 1/g'(r)², μ_z = 1", () => {
    // Cai et al., "Nonmagnetic cloak with minimized scattering", APL 91, 111105 (2007); b > 2a
    const map = quadraticMap(0.02, 0.06);
    const field = radialCloakField(map, 0.001);
    const red = reduceField(field, { polarization: "Hz", scheme: "non-magnetic" });
    for (let c = 0; c < red.count; c++) {
      const x = field.grid.xM[c], y = field.grid.yM[c];
      const rp = Math.hypot(x, y), r = map.gInverse(rp);
      const e = toCylindrical(red.components.eps_xx[c], red.components.eps_yy[c], red.components.eps_xy[c], Math.atan2(y, x));
      expectClose(e.r, (r / rp) ** 2, { rel: 1e-10, abs: 1e-14, label: "eps_r" });
      expectClose(e.t, 1 / map.gPrime(r) ** 2, { rel: 1e-10, label: "eps_theta" });
    }
  });
});

describe("dispersion invariance", () => {
  // Scaling the in-plane tensor by α and the out-of-plane scalar by 1/α keeps the products
  // μ_r ε_z and μ_θ ε_z (Ez) and ε_r μ_z, ε_θ μ_z (Hz): design brief §2; Schurig et al. 2006.
  const cases = [
    { pol: "Ez" as const, schemes: ["full", "unit-mu", "matched"], p: ["mu_xx", "mu_yy", "mu_xy"], s: "eps_zz" },
    { pol: "Hz" as const, schemes: ["full", "non-magnetic", "matched"], p: ["eps_xx", "eps_yy", "eps_xy"], s: "mu_zz" },
  ];
  for (const k of cases) {
    for (const scheme of k.schemes) {
      it(`${k.pol}/${scheme} keeps the in-plane × out-of-plane products of the ideal cloak`, () => {
        const red = reduceField(cloak, { polarization: k.pol, scheme });
        eachCell((c, r, phi) => {
          const t = toCylindrical(red.components[k.p[0]][c], red.components[k.p[1]][c], red.components[k.p[2]][c], phi);
          const sz = red.components[k.s][c];
          // ideal linear cloak: ε_r = μ_r = (r−a)/r, ε_θ = μ_θ = r/(r−a), ε_z = μ_z = (b/(b−a))²(r−a)/r
          const ez = (B / (B - A)) ** 2 * (r - A) / r;
          expectClose(t.r * sz, ((r - A) / r) * ez, { rel: 1e-11, abs: EPS * (r / (r - A)) * ez, label: "radial product" });
          expectClose(t.t * sz, (r / (r - A)) * ez, { rel: 1e-11, label: "azimuthal product" });
        });
      });
    }
  }

  it("isotropic keeps the geometric-mean product ε_z·sqrt(μ_r μ_θ) (Ez) and μ_z·sqrt(ε_r ε_θ) (Hz)", () => {
    for (const pol of ["Ez", "Hz"] as const) {
      const red = reduceField(cloak, { polarization: pol, scheme: "isotropic" });
      eachCell((c, r) => {
        const ez = (B / (B - A)) ** 2 * (r - A) / r; // ideal ε_z; sqrt(ε_r ε_θ) = 1 (Pendry et al. 2006)
        const s = pol === "Ez" ? red.components.eps_zz[c] : red.components.mu_zz[c];
        const g = Math.sqrt(red.principal[0][c] * red.principal[1][c]);
        expectClose(s * g, ez, { rel: 1e-11 + EPS * (r / (r - A)) ** 2, label: `${pol} product` });
      });
    }
  });
});

describe("matched", () => {
  it("Ez: ε_z = μ_θ = b/(b−a), μ_r = (b/(b−a))((r−a)/r)² for the linear cloak", () => {
    // the unit-mu set (Schurig et al. 2006) times the constant b/(b−a) = 1/Z_boundary (Yan, Ruan, Qiu 2007)
    const red = reduceField(cloak, { polarization: "Ez", scheme: "matched" });
    const k = B / (B - A);
    expectClose(red.settings.matchScale, k, { rel: 1e-9 });
    eachCell((c, r, phi) => {
      const m = toCylindrical(red.components.mu_xx[c], red.components.mu_yy[c], red.components.mu_xy[c], phi);
      expectClose(red.components.eps_zz[c], k, { rel: 1e-9 });
      expectClose(m.t, k, { rel: 1e-9 });
      expectClose(m.r, k * ((r - A) / r) ** 2, { rel: 1e-9, abs: 1e-14 });
    });
  });
});

describe("background index", () => {
  it("multiplies every ε by n_b² and leaves μ as it is", () => {
    // ε' = J ε_b Jᵀ/det J with ε_b = n_b², μ_b = 1 (design brief §2)
    const base = reduceField(cloak, { polarization: "Ez", scheme: "full" });
    const lifted = reduceField(cloak, { polarization: "Ez", scheme: "full", backgroundIndex: 1.5 });
    expectClose(lifted.components.eps_zz, base.components.eps_zz.map((v) => v * 2.25), { rel: 1e-14, label: "eps_zz" });
    expectClose(lifted.components.mu_xx, base.components.mu_xx, { rel: 1e-15, label: "mu_xx" });
    expect(lifted.settings.backgroundIndex).toBe(1.5);
  });
});

describe("3D design", () => {
  const sphere = sphericalCloakField(1, 2, 0.25);
  it("keeps all twelve components unchanged under `full`", () => {
    const red = reduceField(sphere, { polarization: "3D", scheme: "full" });
    expect(red.componentNames.length).toBe(12);
    expectClose(red.components.eps_xy, sphere.eps.xy, { rel: 1e-15, abs: 1e-300, label: "eps_xy" });
    expectClose(red.components.mu_zz, sphere.mu.zz, { rel: 1e-15, label: "mu_zz" });
    // ε_θ = b/(b−a) = 2 is the largest principal value in every cell (Pendry, Schurig, Smith 2006)
    expectClose(red.principal[1], new Float64Array(red.count).fill(2), { rel: 1e-12, label: "eps max" });
  });
  it("refuses a polarization or a 2D scheme, naming `full` as the only valid one", () => {
    expect(() => reduceField(sphere, { polarization: "Ez", scheme: "full" })).toThrow(/3D design has no polarization reduction.*only scheme 'full'/);
    expect(() => reduceField(sphere, { polarization: "3D", scheme: "isotropic" })).toThrow(/valid for 3D: full$/);
  });
});

describe("invalid combinations", () => {
  it("unit-mu with Hz lists the Hz schemes", () => {
    const err = (() => { try { reduceField(cloak, { polarization: "Hz", scheme: "unit-mu" }); } catch (e) { return e; } })();
    expect(err).toBeInstanceOf(InputError);
    expect((err as InputError).message).toMatch(/'unit-mu' does not apply to Hz.*valid for Hz: full, non-magnetic, isotropic, matched/);
  });
  it("non-magnetic with Ez lists the Ez schemes", () => {
    expect(() => reduceField(cloak, { polarization: "Ez", scheme: "non-magnetic" })).toThrow(/valid for Ez: full, unit-mu, isotropic, matched/);
  });
  it("an unknown scheme suggests the nearest name", () => {
    expect(() => reduceField(cloak, { polarization: "Ez", scheme: "unit_mu", where: { scheme: "--scheme" } })).toThrow(/--scheme: unknown reduction scheme 'unit_mu'; did you mean unit-mu/);
  });
  it("polarization 3D on a 2D grid (a slice of a 3D device) keeps all twelve components", () => {
    const red = reduceField(cloak, { polarization: "3D", scheme: "full" });
    expect(red.componentNames.length).toBe(12);
    expectClose(red.components.mu_xy, cloak.mu.xy, { rel: 1e-15, abs: 1e-300, label: "mu_xy" });
  });
  it("a background index must be positive", () => {
    expect(() => reduceField(cloak, { polarization: "Ez", scheme: "full", backgroundIndex: 0 })).toThrow(/positive background index/);
  });
});

describe("undefined cells", () => {
  it("non-finite or non-positive-definite input is flagged, its components NaN, never dropped", () => {
    const f = radialCloakField(linearMap(A, B), 0.004);
    f.eps.zz[3] = NaN;
    f.mu.xx[5] = -1;
    const red = reduceField(f, { polarization: "Ez", scheme: "unit-mu" });
    expect(red.count).toBe(f.grid.count);
    expect(red.flags[3] & FLAG_UNDEFINED).toBe(FLAG_UNDEFINED);
    expect(red.flags[5] & FLAG_UNDEFINED).toBe(FLAG_UNDEFINED);
    expect(Number.isNaN(red.components.eps_zz[3])).toBe(true);
    expect(red.flags[4] & FLAG_UNDEFINED).toBe(0);
  });
  it("input arrays are unchanged", () => {
    const f = radialCloakField(linearMap(A, B), 0.004);
    const before = Float64Array.from(f.mu.xx);
    reduceField(f, { polarization: "Ez", scheme: "isotropic", backgroundIndex: 2 });
    expect(f.mu.xx).toEqual(before);
  });
});
