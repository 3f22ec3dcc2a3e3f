/**
 * The ground-plane scene against image theory: a perfectly conducting half-cylinder boss of radius a
 * on a perfectly conducting plane, lit from above. For Ez (E_z = 0 on the plane) the field above the
 * plane equals that of the full cylinder lit by the incident wave minus its mirror image, so the
 * scattered field is S(φ_inc) − S(φ_mirror), S from the exact series (Balanis, "Advanced Engineering
 * Electromagnetics", 2nd ed., 2012, §7.4 image theory and §11.5 the cylinder series).
 */
import { describe, expect, it } from "vitest";
import { diskConductor } from "../../src/verify/conductor.js";
import { cylinderSeries, seriesScatteredField } from "../../src/verify/cylinderSeries.js";
import { gridForWindow } from "../../src/verify/fdfdGrid.js";
import { gridWavenumberAt } from "../../src/verify/illumination.js";
import { groundFarField, groundFluxBox } from "../../src/verify/metrics.js";
import { SAMPLE_BACKGROUND, SAMPLE_PEC, emptyScene, type Scene } from "../../src/verify/scene.js";
import { solveScene } from "../../src/verify/solve.js";

const k0 = 2 * Math.PI; // λ0 = 1 m
const A = 0.25;

function boss(polarization: "Ez" | "Hz" = "Ez"): Scene {
  const disk = diskConductor([0, 0], A);
  return { polarization, background: { eps: 1, mu: 1 }, bounds: { minX: -A, maxX: A, minY: -A, maxY: A }, conductors: [disk], sample: (x, y) => (disk.signedDistanceM(x, y) < 0 ? SAMPLE_PEC : SAMPLE_BACKGROUND) };
}

/** Series scattered field of the full cylinder for a unit plane wave travelling along angle φ. */
function seriesAt(phi: number, xs: number[], ys: number[]): { re: Float64Array; im: Float64Array } {
  const s = cylinderSeries({ polarization: "Ez", radiusM: A, k0, background: { eps: 1, mu: 1 }, interior: { kind: "pec" } });
  const c = Math.cos(-phi), sn = Math.sin(-phi);
  const rx = xs.map((x, k) => c * x - sn * ys[k]), ry = xs.map((x, k) => sn * x + c * ys[k]);
  const re = new Float64Array(xs.length), im = new Float64Array(xs.length);
  seriesScatteredField(s, rx, ry, re, im);
  return { re, im };
}

describe("ground plane (image theory)", () => {
  it("a flat ground scatters nothing: the incident and reflected waves are grid-exact", () => {
    const g = gridForWindow({ minX: -0.6, maxX: 0.6, minY: -0.3, maxY: 0.6 }, 1 / 30, 12);
    g.y0 = -Math.round(-g.y0 / g.h) * g.h; // the plane on a node row
    const sol = solveScene(emptyScene("Ez", { eps: 1, mu: 1 }), g, k0, { illumination: { kind: "plane", angleRad: -Math.PI / 3 }, groundYM: 0 });
    let peak = 0;
    for (let k = 0; k < sol.scatteredRe.length; k++) peak = Math.max(peak, Math.hypot(sol.scatteredRe[k], sol.scatteredIm[k]));
    expect(peak).toBeLessThan(1e-9);
  });

  it("a conducting half-cylinder boss on the ground: |u_s| above the plane within 3 % of the image-theory series", () => {
    const g = gridForWindow({ minX: -0.7, maxX: 0.7, minY: -0.3, maxY: 0.7 }, 1 / 40, 14);
    g.y0 = -Math.round(-g.y0 / g.h) * g.h;
    const phi = -Math.PI / 3; // travelling down and to the right
    const sol = solveScene(boss(), g, k0, { illumination: { kind: "plane", angleRad: phi }, groundYM: 0 });
    const xs: number[] = [], ys: number[] = [], ids: number[] = [];
    for (let p = 1; p < 40; p++) {
      const th = (Math.PI * p) / 40, r = 0.45;
      const i = Math.round((r * Math.cos(th) - g.x0) / g.h), j = Math.round((r * Math.sin(th) - g.y0) / g.h);
      xs.push(g.x0 + i * g.h); ys.push(g.y0 + j * g.h); ids.push(i + g.nx * j);
    }
    const a = seriesAt(phi, xs, ys), b = seriesAt(-phi, xs, ys); // mirror direction: (cos φ, −sin φ)
    let num = 0, den = 0;
    for (let p = 0; p < xs.length; p++) {
      const re = a.re[p] - b.re[p], im = a.im[p] - b.im[p];
      num += (sol.scatteredRe[ids[p]] - re) ** 2 + (sol.scatteredIm[ids[p]] - im) ** 2;
      den += re * re + im * im;
    }
    expect(Math.sqrt(num / den)).toBeLessThan(0.03);
  });

  for (const pol of ["Ez", "Hz"] as const) {
    it(`${pol}: the far field above the plane (image-unfolded near-to-far transformation) within 3 % of image theory on the main lobes`, () => {
      // image theory: T_s(φ) = T_cyl(φ − φ_inc) + s·T_cyl(φ − φ_mirror), s = −1 (Ez) or +1 (Hz), with
      // T_cyl(ψ) = Σ_n a_n e^{inψ} the exact series of the full cylinder (Balanis 2012, §7.4 and §11.5)
      const g = gridForWindow({ minX: -0.7, maxX: 0.7, minY: -0.3, maxY: 0.7 }, 1 / 40, 14);
      g.y0 = pol === "Ez" ? -Math.round(-g.y0 / g.h) * g.h : -(Math.round(-g.y0 / g.h - 0.5) + 0.5) * g.h;
      const phi = -Math.PI / 3;
      const sol = solveScene(boss(pol), g, k0, { illumination: { kind: "plane", angleRad: phi }, groundYM: 0 });
      const box = groundFluxBox(sol, 0)!;
      expect(box).not.toBeNull();
      const M = 36, angles = new Float64Array(M).map((_, a) => (Math.PI * (a + 0.5)) / M);
      const sign = pol === "Ez" ? -1 : 1;
      const ff = groundFarField(sol, box, 0, sign, angles, (p) => gridWavenumberAt(k0, g.h, p));
      const s = cylinderSeries({ polarization: pol, radiusM: A, k0, background: { eps: 1, mu: 1 }, interior: { kind: "pec" } });
      const tCyl = (psi: number): [number, number] => {
        let re = s.aRe[0], im = s.aIm[0];
        for (let n = 1; n <= s.order; n++) { re += 2 * s.aRe[n] * Math.cos(n * psi); im += 2 * s.aIm[n] * Math.cos(n * psi); }
        return [re, im];
      };
      let peak = 0;
      const exact = angles.map((a) => { const [r1, i1] = tCyl(a - phi), [r2, i2] = tCyl(a + phi); const v = Math.hypot(r1 + sign * r2, i1 + sign * i2); peak = Math.max(peak, v); return v; });
      let checked = 0;
      for (let a = 0; a < M; a++) {
        if (exact[a] < 0.3 * peak) continue;
        checked++;
        expect(Math.abs(Math.hypot(ff.re[a], ff.im[a]) / exact[a] - 1), `φ = ${(angles[a] * 180 / Math.PI).toFixed(1)}°`).toBeLessThan(0.03);
      }
      expect(checked).toBeGreaterThan(5);
    });
  }
});
