/**
 * Per-cell CSV of a reduced field, written by `reduce --scheme S --out FILE` (atomically, streamed
 * in chunks). Columns:
 *   i, j, [k,] x_m, y_m, [z_m,]
 *   the kept components (Ez: eps_zz, mu_xx, mu_yy, mu_xy; Hz: mu_zz, eps_xx, eps_yy, eps_xy;
 *   3D: eps_xx … eps_yz, mu_xx … mu_yz),
 *   principal_min, principal_max (kept in-plane tensor: μ_t for Ez, ε_t for Hz; 3D: of ε),
 *   anisotropy (principal_max/principal_min), dropped_anisotropy (isotropic: σ1/σ2, else 1),
 *   scale (α: in-plane × α, out-of-plane × 1/α), eps_min, eps_max, mu_min, mu_max (kept ε and μ
 *   principal values), flags (`;`-separated: eps_below_1, magnetic, capped, undefined,
 *   out_of_plane_coupling).
 * Undefined values are empty. Numbers are written in JavaScript's shortest round-trip form.
 */
import type { DeviceGrid } from "../field/deviceGrid.js";
import { flagList, type ReducedField } from "../reduce/reducedField.js";
import { writeStreamAtomic } from "./atomicWrite.js";

const DERIVED = ["principal_min", "principal_max", "anisotropy", "dropped_anisotropy", "scale", "eps_min", "eps_max", "mu_min", "mu_max", "flags"];

/** Header of the reduced CSV. */
export function reducedCsvColumns(reduced: ReducedField, dimension: 2 | 3): string[] {
  const pos = dimension === 3 ? ["i", "j", "k", "x_m", "y_m", "z_m"] : ["i", "j", "x_m", "y_m"];
  return [...pos, ...reduced.componentNames, ...DERIVED];
}

const num = (v: number): string => (Number.isNaN(v) ? "" : String(v));

/** Write the reduced field's per-cell CSV atomically (nothing appears under `path` unless every row was written). */
export async function writeReducedCsv(path: string, reduced: ReducedField, grid: DeviceGrid): Promise<void> {
  const three = grid.dimension === 3;
  const comps = reduced.componentNames.map((n) => reduced.components[n]);
  const [p0, p1] = reduced.principal;
  await writeStreamAtomic(path, async (write) => {
    await write(reducedCsvColumns(reduced, grid.dimension).join(",") + "\n");
    const CHUNK = 2048;
    for (let start = 0; start < reduced.count; start += CHUNK) {
      const lines: string[] = [];
      const end = Math.min(reduced.count, start + CHUNK);
      for (let c = start; c < end; c++) {
        const row = three
          ? [String(grid.i[c]), String(grid.j[c]), String(grid.k[c]), num(grid.xM[c]), num(grid.yM[c]), num(grid.zM[c])]
          : [String(grid.i[c]), String(grid.j[c]), num(grid.xM[c]), num(grid.yM[c])];
        for (const a of comps) row.push(num(a[c]));
        row.push(
          num(p0[c]), num(p1[c]), num(reduced.anisotropy[c]), num(reduced.droppedAnisotropy[c]), num(reduced.scale[c]),
          num(reduced.epsMin[c]), num(reduced.epsMax[c]), num(reduced.muMin[c]), num(reduced.muMax[c]),
          flagList(reduced.flags[c]),
        );
        lines.push(row.join(","));
      }
      await write(lines.join("\n") + "\n");
    }
  });
}
