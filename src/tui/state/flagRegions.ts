/**
 * The Flags screen's list: for every flag that occurs, the regions (connected zones of one level,
 * as the plan found them) where it occurs, largest first, each with a cell to jump to on the map.
 */
import { FLAGS } from "../../plan/flags.js";
import type { Plan } from "../../plan/planTypes.js";
import { formatLength } from "./formatValue.js";

export interface FlagRegionRow {
  flag: string;
  meaning: string;
  /** 1-based region number, or null on the flag's header row */
  region: number | null;
  /** level of the region (1-based), null on the header row */
  level: number | null;
  /** flagged cells (in the region, or in all on the header row) */
  cells: number;
  /** where the flagged cells lie, in metres: "x 2.0 … 9.0 mm, y −3.0 … 3.0 mm" */
  where: string;
  /** device cell to put the map cursor on */
  jumpCell: number;
}

const cache = new WeakMap<Plan, FlagRegionRow[]>();

function span(lo: number, hi: number): string {
  return lo === hi ? formatLength(lo) : `${formatLength(lo)} … ${formatLength(hi)}`;
}

/** Rows of the Flags screen: a header row per flag that occurs, then its regions. */
export function flagRegionRows(plan: Plan): FlagRegionRow[] {
  const hit = cache.get(plan);
  if (hit) return hit;
  const { count, i, j, xM, yM } = plan.grid;
  const regions = plan.regions.length;
  const rows: FlagRegionRow[] = [];
  const n = new Float64Array(regions + 1);
  const si = new Float64Array(regions + 1);
  const sj = new Float64Array(regions + 1);
  const xLo = new Float64Array(regions + 1);
  const xHi = new Float64Array(regions + 1);
  const yLo = new Float64Array(regions + 1);
  const yHi = new Float64Array(regions + 1);
  const best = new Int32Array(regions + 1);
  const bestD = new Float64Array(regions + 1);
  FLAGS.forEach((flag, k) => {
    const bit = 1 << k;
    n.fill(0);
    si.fill(0);
    sj.fill(0);
    xLo.fill(Infinity);
    yLo.fill(Infinity);
    xHi.fill(-Infinity);
    yHi.fill(-Infinity);
    // slot `regions` collects the flag over the whole device
    for (let c = 0; c < count; c++) {
      if (!(plan.flags[c] & bit)) continue;
      const r = plan.region[c];
      for (const s of r >= 0 && r < regions ? [r, regions] : [regions]) {
        n[s]++;
        si[s] += i[c];
        sj[s] += j[c];
        if (xM[c] < xLo[s]) xLo[s] = xM[c];
        if (xM[c] > xHi[s]) xHi[s] = xM[c];
        if (yM[c] < yLo[s]) yLo[s] = yM[c];
        if (yM[c] > yHi[s]) yHi[s] = yM[c];
      }
    }
    if (n[regions] === 0) return;
    best.fill(-1);
    bestD.fill(Infinity);
    for (let c = 0; c < count; c++) {
      if (!(plan.flags[c] & bit)) continue;
      const r = plan.region[c];
      for (const s of r >= 0 && r < regions ? [r, regions] : [regions]) {
        const d = (i[c] - si[s] / n[s]) ** 2 + (j[c] - sj[s] / n[s]) ** 2;
        if (d < bestD[s]) {
          bestD[s] = d;
          best[s] = c;
        }
      }
    }
    const where = (s: number) => `x ${span(xLo[s], xHi[s])}, y ${span(yLo[s], yHi[s])}`;
    rows.push({ flag: flag.name, meaning: flag.meaning, region: null, level: null, cells: n[regions], where: where(regions), jumpCell: best[regions] });
    const order: number[] = [];
    for (let r = 0; r < regions; r++) if (n[r] > 0) order.push(r);
    order.sort((a, b) => n[b] - n[a] || a - b);
    for (const r of order) {
      const reg = plan.regions[r];
      rows.push({ flag: flag.name, meaning: flag.meaning, region: reg.index, level: reg.level /* Region.level is already 1-based */, cells: n[r], where: where(r), jumpCell: best[r] });
    }
  });
  cache.set(plan, rows);
  return rows;
}
