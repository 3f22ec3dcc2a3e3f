/**
 * The layer a planar device is made in (`realization.layer`: core material, thickness, materials
 * below and above), and what it does to the recipes:
 *
 * - Dielectric claddings (a thin film, e.g. 220 nm silicon on silica under air): the wave is the
 *   slab's guided mode, so a 2D recipe mixes effective indices (the effective-index method; Tamir,
 *   "Integrated Optics", 1975; common practice for planar photonic devices): the core material is
 *   replaced by N², N the slab's fundamental mode index for the polarization the device serves
 *   (Hz: in-plane E → TE modes; Ez: E normal to the film → TM modes), found exactly by slabModes.ts.
 *   Other phases (e.g. air holes etched through the film) keep their bulk values.
 *   Known limits (stated in the report): the method ignores the vertical field's change inside the
 *   patterned regions (holes pull the mode down into the substrate), radiation out of the film at
 *   sharp features, and the coupling between the TE and TM families at oblique edges; it
 *   overestimates the index contrast of etched regions by a few per cent (Qiu, "Effective index
 *   method for heterostructure-slab-waveguide-based two-dimensional photonic crystals", Appl. Phys.
 *   Lett. 81, 1163 (2002)).
 * - Metal plates on both sides (a parallel-plate microwave device): the Ez polarization runs on
 *   the plates' TEM mode, which sees the bulk values; the TM_m modes appear once the spacing
 *   exceeds mλ/(2n) (Pozar, "Microwave Engineering", 4th ed., 2012, sec. 3.2; from memory), so the plan warns
 *   when d·n_max > λ/2. In the Hz polarization a parallel-plate guide has no mode below
 *   d·n = λ/2 (its TE₁ cut-off) — warned as well.
 */
import { cSqrt, type Complex } from "../../core/complex.js";
import { C0 } from "../physicalConstants.js";
import { slabModes, type SlabPolarization } from "./slabModes.js";

export interface LayerPhase {
  id: string;
  eps: Complex;
  isMetal: boolean;
}

export interface LayerInput {
  core: LayerPhase;
  thicknessM: number;
  below: LayerPhase;
  above: LayerPhase;
  frequencyHz: number;
  /** the device's polarization: Hz (in-plane E) or Ez (E normal to the layer) */
  polarization: "Ez" | "Hz";
}

export interface LayerReport {
  kind: "slab" | "parallel-plate";
  polarization: SlabPolarization | "TEM";
  /** fundamental mode index (slab), or the core's bulk index (parallel plate TEM); null when none is guided */
  modeIndex: number | null;
  guidedModes: number;
  /** ε the core phase is mixed with: N² (slab) or the bulk value */
  coreEps: Complex;
  /** V and the next mode's cut-off V (slab) */
  v: number | null;
  nextCutoffV: number | null;
  warnings: string[];
}

/** How close to a cut-off counts as "near" (V within 10 % of it): common practice. */
export const NEAR_CUTOFF = 0.1;

const fmt = (x: number): string => Number(x.toPrecision(4)).toString();

/** Solve the layer (see the module comment). Never throws for physical inputs: problems are warnings. */
export function layerReport(input: LayerInput): LayerReport {
  const lambda = C0 / input.frequencyHz;
  const nCore = cSqrt(input.core.eps).re;
  const warnings: string[] = [];
  if (input.below.isMetal && input.above.isMetal) {
    const d = input.thicknessM;
    const ratio = (2 * d * nCore) / lambda;
    if (input.polarization === "Ez") {
      const higher = Math.floor(ratio);
      if (higher >= 1) warnings.push(`layer: the plate spacing ${fmt(d * 1e3)} mm allows ${higher} higher parallel-plate mode(s) (TM₁ cut-off at spacing λ/(2n) = ${fmt((lambda / (2 * nCore)) * 1e3)} mm): keep the spacing below it`);
      else if (ratio > 1 - NEAR_CUTOFF) warnings.push(`layer: the plate spacing is within ${NEAR_CUTOFF * 100} % of the TM₁ cut-off`);
      return { kind: "parallel-plate", polarization: "TEM", modeIndex: nCore, guidedModes: 1 + higher, coreEps: input.core.eps, v: null, nextCutoffV: null, warnings };
    }
    const modes = Math.floor(ratio);
    if (modes === 0) warnings.push(`layer: with the field in the plane of the plates no mode propagates below a spacing of λ/(2n) = ${fmt((lambda / (2 * nCore)) * 1e3)} mm`);
    return { kind: "parallel-plate", polarization: "TE", modeIndex: modes === 0 ? null : nCore * Math.sqrt(1 - (1 / ratio) ** 2), guidedModes: modes, coreEps: input.core.eps, v: null, nextCutoffV: null, warnings };
  }
  const pol: SlabPolarization = input.polarization === "Hz" ? "TE" : "TM";
  const ns = cSqrt(input.below.eps).re;
  const nc = cSqrt(input.above.eps).re;
  if (input.below.isMetal || input.above.isMetal) {
    warnings.push("layer: a single metal cladding is outside the slab model (two dielectric claddings, or metal plates on both sides); bulk values are used");
    return { kind: "slab", polarization: pol, modeIndex: null, guidedModes: 0, coreEps: input.core.eps, v: null, nextCutoffV: null, warnings };
  }
  if (!(nCore > Math.max(ns, nc))) {
    warnings.push(`layer: the core ${input.core.id} (n = ${fmt(nCore)}) does not guide between ${input.below.id} and ${input.above.id}; bulk values are used`);
    return { kind: "slab", polarization: pol, modeIndex: null, guidedModes: 0, coreEps: input.core.eps, v: null, nextCutoffV: null, warnings };
  }
  const m = slabModes({ coreIndex: nCore, substrateIndex: ns, coverIndex: nc, thicknessM: input.thicknessM, wavelengthM: lambda, polarization: pol });
  if (m.indices.length === 0) {
    warnings.push(`layer: the ${fmt(input.thicknessM * 1e9)} nm ${input.core.id} layer guides no ${pol} mode (V = ${fmt(m.v)} below the cut-off ${fmt(m.fundamentalCutoffV)}); bulk values are used`);
    return { kind: "slab", polarization: pol, modeIndex: null, guidedModes: 0, coreEps: input.core.eps, v: m.v, nextCutoffV: m.nextCutoffV, warnings };
  }
  if (m.indices.length > 1) warnings.push(`layer: the ${fmt(input.thicknessM * 1e9)} nm ${input.core.id} layer is multimode (${m.indices.length} ${pol} modes, indices ${m.indices.map(fmt).join(", ")}); the plan uses the fundamental`);
  if (m.v < m.fundamentalCutoffV * (1 + NEAR_CUTOFF) + 0.1) warnings.push(`layer: the fundamental ${pol} mode is near cut-off (V = ${fmt(m.v)}, cut-off ${fmt(m.fundamentalCutoffV)}): weakly confined`);
  if (m.nextCutoffV < m.v * (1 + NEAR_CUTOFF)) warnings.push(`layer: V = ${fmt(m.v)} is within ${NEAR_CUTOFF * 100} % of the next mode's cut-off ${fmt(m.nextCutoffV)}`);
  const N = m.indices[0];
  // the loss of the core carries over in proportion (first order): ε_eff = N²(1 + i·ε″/ε′)
  const coreEps = { re: N * N, im: (N * N * input.core.eps.im) / input.core.eps.re };
  return { kind: "slab", polarization: pol, modeIndex: N, guidedModes: m.indices.length, coreEps, v: m.v, nextCutoffV: m.nextCutoffV, warnings };
}

/** The effective-index method's limits, one sentence for reports. */
export const EFFECTIVE_INDEX_LIMITS =
  "Effective-index method: the core is replaced by its slab mode index; it ignores the change of the vertical mode profile in etched regions, radiation out of the film at sharp features and TE–TM coupling at oblique edges, and overstates the index contrast of etched regions by a few per cent (Qiu, Appl. Phys. Lett. 81, 1163 (2002)).";
