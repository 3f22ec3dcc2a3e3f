/**
 * Polygon regions for `npm run bench`: the device grid (one row fill per lattice row) and 256
 * point tests at the boundary samples of a region of N vertices, N = 3 000, 30 000, 100 000, for
 * a star-shaped outline and a self-intersecting one (vertices at random angles: edges crossing
 * everywhere), against the plain per-point ray cast on the same grid at N = 3 000 (the method it
 * replaced: O(N) per point). Nothing here decides pass or fail.
 */
import { buildDeviceGrid } from "../field/buildDeviceGrid.js";
import { makeRegion } from "../field/region.js";

function outline(n: number, crossing: boolean): [number, number][] {
  let seed = 12345;
  const rnd = (): number => (seed = (seed * 1103515245 + 12345) % 2147483648) / 2147483648;
  const pts: [number, number][] = [];
  for (let k = 0; k < n; k++) {
    const t = crossing ? 2 * Math.PI * rnd() : (2 * Math.PI * k) / n;
    const r = crossing ? 0.02 + 0.03 * rnd() : 0.04 + 0.005 * Math.sin(37 * t);
    pts.push([r * Math.cos(t), r * Math.sin(t)]);
  }
  return pts;
}

function rayCast(pts: [number, number][], x: number, y: number): boolean {
  let inside = false;
  for (let k = 0, m = pts.length - 1; k < pts.length; m = k++) {
    const [xk, yk] = pts[k], [xm, ym] = pts[m];
    if ((yk > y) !== (ym > y) && x < xk + ((y - yk) * (xm - xk)) / (ym - yk)) inside = !inside;
  }
  return inside;
}

export async function polygonBench(log: (line: string) => void): Promise<void> {
  const pitchM = 2.5e-4; // 400 × 400 lattice over the 0.1 m box
  log("outline            vertices   index ms   grid ms   cells    256 points ms");
  let sink = 0;
  for (const crossing of [false, true]) {
    for (const n of [3000, 30000, 100000]) {
      const pts = outline(n, crossing);
      const t0 = performance.now();
      const region = makeRegion({ shape: "polygon", pointsM: pts });
      const t1 = performance.now();
      const grid = buildDeviceGrid(region.bounds, (x, y) => region.contains(x, y), { pitchM, dimension: 2, where: "bench" }, (out, y, _z, x0, p) => region.containsRow!(out, y, x0, p));
      const t2 = performance.now();
      const s = region.sampleBoundary(256);
      for (let q = 0; q < s.xM.length; q++) if (region.contains(s.xM[q], s.yM[q])) sink++;
      const t3 = performance.now();
      sink += grid.count;
      log(`${(crossing ? "self-intersecting" : "star").padEnd(18)} ${String(n).padStart(8)} ${(t1 - t0).toFixed(0).padStart(10)} ${(t2 - t1).toFixed(0).padStart(9)} ${String(grid.count).padStart(8)} ${(t3 - t2).toFixed(1).padStart(13)}`);
    }
  }
  // the per-point ray cast it replaced, on the same 400 × 400 grid at N = 3 000
  const pts = outline(3000, false);
  const t0 = performance.now();
  const region = makeRegion({ shape: "polygon", pointsM: pts });
  const grid = buildDeviceGrid(region.bounds, (x, y) => rayCast(pts, x, y), { pitchM, dimension: 2, where: "bench" });
  log(`per-point ray cast (replaced), star, 3000 vertices: grid ${(performance.now() - t0).toFixed(0)} ms, ${grid.count} cells (checksum ${sink})`);
}
