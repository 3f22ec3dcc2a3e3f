/**
 * The normal of a disc's boundary in a box (discBoxNormal.ts): by construction the mean outward
 * normal of the arc inside the box. Checked against an independent quadrature of that mean over the
 * arc (the circle sampled by angle, points tested against the box — the definition itself, not the
 * chord identity the code uses: the divergence theorem, ∫_box ∇χ dA = ∮ χ n̂ ds, is what makes the
 * two agree), against symmetry (a box symmetric about a radius gets that radius), and on the cases
 * with no single direction (no arc in the box, the whole circle inside it).
 */
import { describe, expect, it } from "vitest";
import { discBoxNormal } from "../../src/verify/discBoxNormal.js";

/** Mean outward normal of the arc inside the box, by M angle samples (the definition). */
function arcMeanNormal(cx: number, cy: number, r: number, x0: number, x1: number, y0: number, y1: number, M = 400_000): [number, number] | null {
  let sx = 0, sy = 0, n = 0;
  for (let k = 0; k < M; k++) {
    const t = ((k + 0.5) / M) * 2 * Math.PI, c = Math.cos(t), s = Math.sin(t);
    const x = cx + r * c, y = cy + r * s;
    if (x > x0 && x < x1 && y > y0 && y < y1) { sx += c; sy += s; n++; }
  }
  if (n === 0) return null;
  const l = Math.hypot(sx, sy);
  return [sx / l, sy / l];
}

describe("discBoxNormal", () => {
  const out = new Float64Array(2);

  it("is the radius through the box's centre when the box is symmetric about it (on an axis, on the diagonal)", () => {
    expect(discBoxNormal(0, 0, 1, 0.9, 1.1, -0.1, 0.1, out)).toBe(true);
    expect(out[0]).toBeCloseTo(1, 14); expect(out[1]).toBeCloseTo(0, 14);
    expect(discBoxNormal(2, -1, 0.5, 1.8, 2.2, -1.55, -1.35, out)).toBe(true); // below the centre
    expect(out[0]).toBeCloseTo(0, 14); expect(out[1]).toBeCloseTo(-1, 14);
    const d = Math.SQRT1_2;
    expect(discBoxNormal(0, 0, 1, d - 0.07, d + 0.07, d - 0.07, d + 0.07, out)).toBe(true);
    expect(out[0]).toBeCloseTo(d, 14); expect(out[1]).toBeCloseTo(d, 14);
  });

  it("equals the arc-length mean of the outward normal over the arc in the box (quadrature, 60 boxes of random size and place, fixed seed)", () => {
    let seed = 20260312;
    const rnd = (): number => { seed = (seed * 1103515245 + 12345) % 2147483648; return seed / 2147483648; };
    let worst = 0, tried = 0;
    while (tried < 60) {
      const r = 0.5 + rnd(), h = r * (0.05 + 0.6 * rnd());
      const t = 2 * Math.PI * rnd(), rho = r + (rnd() - 0.5) * h;
      const xc = rho * Math.cos(t), yc = rho * Math.sin(t);
      const x0 = xc - h / 2, x1 = xc + h / 2, y0 = yc - h / 2, y1 = yc + h / 2;
      const ref = arcMeanNormal(0, 0, r, x0, x1, y0, y1);
      const ok = discBoxNormal(0, 0, r, x0, x1, y0, y1, out);
      if (!ref) { expect(ok).toBe(false); continue; }
      tried++;
      expect(ok).toBe(true);
      expect(Math.hypot(out[0], out[1])).toBeCloseTo(1, 14);
      worst = Math.max(worst, Math.abs(Math.atan2(out[0] * ref[1] - out[1] * ref[0], out[0] * ref[0] + out[1] * ref[1])));
    }
    // 400 000 angle samples place the arc's ends to 1.6e-5 rad: the mean direction to about that
    expect(worst).toBeLessThan(1e-4);
  });

  it("has no direction where the box holds no arc or the whole circle, and writes (0, 0)", () => {
    out[0] = 5; out[1] = 5;
    expect(discBoxNormal(0, 0, 1, -0.3, 0.3, -0.3, 0.3, out)).toBe(false); // box inside the disc
    expect([out[0], out[1]]).toEqual([0, 0]);
    expect(discBoxNormal(0, 0, 1, 2, 3, 2, 3, out)).toBe(false); // clear of it
    expect(discBoxNormal(0, 0, 1, -2, 2, -2, 2, out)).toBe(false); // the whole circle inside the box
    expect(discBoxNormal(0, 0, 1, -2, 2, -0.1, 0.1, out)).toBe(false); // two opposite arcs: the normals cancel
    expect([out[0], out[1]]).toEqual([0, 0]);
  });
});
