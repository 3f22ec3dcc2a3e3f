/**
 * Plain recipes: a level whose target equals (within the tolerance) an allowed catalog material,
 * or the medium the device sits in, is built as a `solid` cell of that material — no inclusion,
 * no mixing rule, nothing for the process to resolve. Air and vacuum are such materials: a cell
 * asking for ε = μ = 1 is left empty.
 *
 * An empty cell is the pseudo-material `vacuum` (ε = μ = 1 exactly): always allowed, since leaving
 * a cell empty needs nothing from the shop (catalog air, ε' = 1.00054, is used where it is allowed
 * and the tolerance admits it; at equal score the catalog material comes first). Metals are never a solid recipe (their ε is far
 * below any reduced target).
 *
 * The error is the same complex relative error as every other recipe's (relativeError.ts:
 * largestErrors), so a lossy material only counts as equal when its loss is inside the tolerance.
 */
import { complex, refractiveIndex, type Complex } from "../../core/complex.js";
import type { Candidate } from "./levelCandidates.js";
import type { MatchContext } from "./matchContext.js";
import { largestErrors } from "../quantize/relativeError.js";

/** Family id of plain recipes (one material fills the cell). */
export const SOLID_FAMILY = "solid";
/** Host id of an empty cell (ε = μ = 1): nothing to build. */
export const VACUUM_ID = "vacuum";

export function solidCandidates(target: number[], ctx: MatchContext): Candidate[] {
  const out: Candidate[] = [];
  const options: { id: string; eps: Complex; mu: Complex }[] = [{ id: VACUUM_ID, eps: complex(1), mu: complex(1) }];
  for (const m of ctx.materials) if (!m.isMetal) options.push({ id: m.material.id, eps: m.eps, mu: m.value.mu });
  const re = new Array<number>(target.length), im = new Array<number>(target.length);
  for (const o of options) {
    ctx.components.forEach((c, k) => {
      const v = c.kind === "eps" ? o.eps : o.mu;
      re[k] = v.re;
      im[k] = v.im;
    });
    const { rel, zeroAbs } = largestErrors(re, im, target);
    if (rel > ctx.tolerance || zeroAbs > ctx.tolerance) continue;
    const n = refractiveIndex(o.eps, o.mu);
    out.push({
      family: SOLID_FAMILY,
      host: o.id,
      inclusion: "",
      lattice: ctx.lattice ?? "square",
      orientation: null,
      fillFraction: 0,
      dimensions: {},
      achieved: [...re],
      achievedIm: [...im],
      relError: rel,
      lossTangent: o.eps.re !== 0 ? Math.abs(o.eps.im / o.eps.re) : 0,
      indexIm: Number.isFinite(n.im) ? Math.max(0, n.im) : 0,
      spread: 0,
      bandwidth: null,
      featureM: Infinity,
      resonant: false,
      score: 0,
      notes: [o.id === VACUUM_ID ? "the cell is left empty (vacuum)" : `the cell is solid ${o.id}`],
      homogenization: "ok",
    });
  }
  return out;
}
