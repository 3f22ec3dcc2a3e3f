/** Human-readable lines for a cell design (pure; the command line prints them). */
import { type Complex, formatComplex } from "../core/complex.js";
import type { CellDesign } from "./cellDesignTypes.js";
import { formatFrequency as formatFrequencyCore, formatLength as formatLengthCore } from "../core/formatQuantity.js";

/** Non-finite values (no answer) print as "—", never as NaN or Infinity. */
const g = (x: number, d = 4): string => (Number.isFinite(x) ? Number(x.toPrecision(d)).toString() : "—");

/** Length in a readable unit, 4 significant digits: "1.2 mm", "350 nm". */
export const formatLength = (m: number): string => formatLengthCore(m, (v) => g(v));

/** Frequency in a readable unit, 4 significant digits: "8.2 GHz". */
export const formatFrequency = (hz: number): string => formatFrequencyCore(hz, (v) => g(v));

const c = (z: Complex): string => (Number.isFinite(z.re) && Number.isFinite(z.im) ? formatComplex(z, 5) : "—");
const pct = (x: number): string => `${g(100 * x, 3)} %`;

/** Lines describing the design, one fact per line. */
export function formatCellDesign(d: CellDesign): string[] {
  const out: string[] = [];
  out.push(`${d.familyId} (${d.lattice} lattice${d.aspect ? `, aspect b/a ${g(d.aspect)}` : ""}), pitch ${formatLength(d.pitchM)}, ${formatFrequency(d.frequencyHz)}: host ${d.hostId}, ${d.familyId === "wire-medium" || d.familyId === "split-ring" ? "metal" : "inclusion"} ${d.inclusionId}`);
  out.push(`fill fraction     ${d.fill === null ? "none" : g(d.fill, 5)}`);
  const dims = Object.entries(d.dimensions).map(([k, v]) => `${k.replace(/M$/, "")} ${formatLength(v)}`);
  if (dims.length) out.push(`dimensions        ${dims.join(", ")}`);
  const tgt = (k: "parallel" | "perpendicular" | "perpendicularY" | "mu") => (d.target[k] !== undefined ? `   target ${d.target[k]}   error ${pct(d.relError[k]!)}` : "");
  out.push(`ε parallel        ${c(d.achieved.parallel)}   (${d.rules.parallel})${tgt("parallel")}`);
  if (d.achieved.perpendicularY) {
    out.push(`ε perpendicular x ${c(d.achieved.perpendicular)}   (${d.rules.perpendicular})${tgt("perpendicular")}`);
    out.push(`ε perpendicular y ${c(d.achieved.perpendicularY)}   (${d.rules.perpendicularY ?? d.rules.perpendicular})${tgt("perpendicularY")}`);
  } else out.push(`ε perpendicular   ${c(d.achieved.perpendicular)}   (${d.rules.perpendicular})${tgt("perpendicular")}`);
  if (d.familyId === "split-ring") out.push(`μ along the rings ${c(d.achieved.mu)}   (Lorentz)${tgt("mu")}`);
  out.push(`smallest feature  ${formatLength(d.feature.featureM)}, gap ${formatLength(d.feature.gapM)}`);
  if (d.processCheck) out.push(`process           ${d.processCheck.ok ? "ok" : d.processCheck.reasons.join("; ")}`);
  out.push(`homogenization    ${d.homogenization.status}: pitch = ${g(d.homogenization.ratio, 3)} λ in the densest material (n = ${g(d.homogenization.nMax, 4)})`);
  if (d.spread.max > 0) out.push(`model uncertainty ${pct(d.spread.max)}${d.closedForm && (d.rules.perpendicular === "solved-cell" || d.rules.parallel === "solved-cell") ? " (solved cell)" : " (MG–Bruggeman spread)"}${d.spread.uncertain ? " (uncertain)" : ""}`);
  if (d.closedForm) out.push(`closed form       parallel ${c(d.closedForm.parallel)} (${d.closedForm.rules.parallel}), perpendicular ${c(d.closedForm.perpendicular)} (${d.closedForm.rules.perpendicular})${d.closedForm.perpendicularY ? " on both in-plane axes" : ""}`);
  const r = d.resonance;
  if (r?.kind === "wire-medium") {
    const p = r.plasma;
    out.push(`plasma frequency  ${p.used === "lattice" ? `lattice ${formatFrequency(p.latticeHz)} (used), ` : "not solved at this radius, "}thick-wire ${formatFrequency(p.thickWireHz)}${p.used === "thick-wire" ? " (used)" : ""}, corrected thin-wire ${formatFrequency(p.correctedHz)}, thin-wire ${formatFrequency(p.thinWireHz)}${p.thinWireApplies ? "" : " (thin-wire assumption r/a ≤ 0.01 not met)"}`);
    out.push(`damping           γ/2π = ${formatFrequency(r.gammaRadPerS / (2 * Math.PI))}, skin depth ${formatLength(r.skinDepthM)}`);
  }
  if (r?.kind === "split-ring") {
    out.push(`resonance         ${formatFrequency(r.resonanceHz)}, μ' = 0 at ${formatFrequency(r.magneticPlasmaHz)}, μ∞ = 1 − F = ${g(r.muHighFrequency)}`);
    out.push(`damping           Γ/2π = ${formatFrequency(r.gammaRadPerS / (2 * Math.PI))}, skin depth ${formatLength(r.skinDepthM)}`);
  }
  if (r) {
    const b = r.band;
    const band = b.fractional > 0 ? `${pct(b.fractional)} (${formatFrequency(b.loHz)}${b.openBelow ? " or below" : ""} – ${formatFrequency(b.hiHz)}${b.openAbove ? " or above" : ""})` : "none (the design point is outside the tolerance)";
    out.push(`band in tolerance ${band}`);
    out.push(`passivity bound   ${r.passivity ? `${pct(r.passivity.strong)} (strong), ${pct(r.passivity.weak)} (weak); lossless-window bounds, a lossy medium can exceed them` : "none (target not below the high-frequency limit)"}`);
  }
  out.push(`result            ${d.valid ? "valid" : "NOT buildable as asked"}`);
  for (const x of d.reasons) out.push(`  - ${x}`);
  for (const x of d.notes) out.push(`  note: ${x}`);
  return out;
}
