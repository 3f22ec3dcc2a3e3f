/**
 * designCell for the resonant families. Wire medium: wire radius for the target ε along the wires
 * (or the given fill), plasma-frequency estimates, damping, the band within tolerance and the
 * passivity bound. Split ring: ring sizes for the target μ (or the given sizes) in the ring style
 * asked for or defaulted (printed on a board/laminate host or with PCB etching, split cylinders in
 * air; see defaultRingStyle), resonance, loss, band and passivity bound with μ∞ = 1 − F; printed
 * rings are kept at the process's minimum feature and gap. Called through designCell.
 */
import { type Complex, ONE, cMul } from "../core/complex.js";
import { ProgrammerError } from "../core/errors.js";
import { getMixingRule } from "../media/mixing/registry.js";
import type { CellFamily } from "./cellFamily.js";
import { homogenizationFor, homogenizationNote, matchError, processCheckFor, toleranceAbs } from "./cellChecks.js";
import type { CellDesign, CellDesignRequest, RingReport, SplitRingSizes, WireReport } from "./cellDesignTypes.js";
import { passivityBandwidthBound } from "./passivity.js";
import { C0, EPS0 } from "./physicalConstants.js";
import { printedDefaultSizeM, printedMeanRadiusM, printedOuterRadiusM } from "./printedRing.js";
import { defaultRingStyle, designSplitRing, ringModelSpread, splitRingBandwidth, splitRingResponse, type SplitRingGeometry, type SplitRingResponse } from "./splitRing.js";
import { cellAreaM2 } from "./lattice.js";
import { MIN_RADIUS_RATIO, wireTableMaxRatio, bandwidthWithinTolerance, radiusForTarget, wireMediumResponse } from "./wireMedium.js";

const DEFAULT_TOLERANCE = 0.05;
const fmt = (x: number): string => Number(x.toPrecision(4)).toString();
const pct = (x: number): string => `${Number((100 * x).toPrecision(3))} %`;

function conductivity(req: CellDesignRequest): number {
  const sigma = req.inclusion.conductivitySPerM ?? 2 * Math.PI * req.frequencyHz * EPS0 * req.inclusion.eps.im;
  if (!(sigma > 0)) throw new ProgrammerError(`designCell: ${req.familyId} needs a conducting inclusion (σ > 0)`, req.inclusion);
  return sigma;
}

export function designResonantCell(req: CellDesignRequest, family: CellFamily): CellDesign {
  return family.id === "wire-medium" ? designWireCell(req, family) : designRingCell(req, family);
}

function finish(req: CellDesignRequest, family: CellFamily, parts: Omit<CellDesign, "familyId" | "lattice" | "pitchM" | "frequencyHz" | "hostId" | "inclusionId" | "valid" | "processCheck" | "homogenization" | "spread" | "tolerance">, effective: Complex[], modelSpread = 0): CellDesign {
  const tolerance = req.tolerance ?? DEFAULT_TOLERANCE;
  const reasons = [...parts.reasons];
  const notes = [...parts.notes];
  if (parts.relError.max > tolerance) {
    const keys = (["parallel", "perpendicular", "mu"] as const).filter((k) => parts.relError[k] !== undefined);
    const k = keys.reduce((w, x) => (parts.relError[x]! > parts.relError[w]! ? x : w), keys[0]);
    const got = k === "mu" ? parts.achieved.mu.re : parts.achieved[k].re;
    if (!reasons.length) reasons.push(`${k === "mu" ? "μ'" : `${k} ε'`} ${fmt(got)} misses the target ${parts.target[k]} by ${pct(parts.relError[k]!)} (tolerance ${pct(tolerance)})`);
  }
  const processCheck = processCheckFor(req.process, family.fabricatedPhase, req.host.class, req.inclusion.class, { ...parts.feature, ...(req.heightM !== undefined ? { heightM: req.heightM } : {}) });
  if (processCheck && !processCheck.ok) reasons.push(...processCheck.reasons);
  const homogenization = homogenizationFor(req.pitchM, req.frequencyHz, [req.host], effective);
  if (homogenization.status === "refuse") reasons.push(homogenizationNote(homogenization));
  else if (homogenization.status === "warn") notes.push(homogenizationNote(homogenization));
  return {
    familyId: family.id,
    lattice: req.lattice,
    pitchM: req.pitchM,
    frequencyHz: req.frequencyHz,
    hostId: req.host.id,
    inclusionId: req.inclusion.id,
    ...parts,
    tolerance,
    processCheck,
    homogenization,
    // μ's model spread (printed rings: the two standard loop inductances) counts in max
    spread: { parallel: 0, perpendicular: 0, max: modelSpread, uncertain: modelSpread > tolerance },
    valid: reasons.length === 0,
    reasons,
    notes,
  };
}

function designWireCell(req: CellDesignRequest, family: CellFamily): CellDesign {
  const { pitchM, frequencyHz, host } = req;
  const sigma = conductivity(req);
  const tolerance = req.tolerance ?? DEFAULT_TOLERANCE;
  const target = { ...(req.target ?? {}) };
  const reasons: string[] = [];
  const notes: string[] = [];
  const lattice = req.lattice === "hex" ? "hex" : "square";
  const reAt = (r: number) => wireMediumResponse({ pitchM, radiusM: r, frequencyHz, hostEps: host.eps, conductivitySPerM: sigma, lattice }).eps;
  let radiusM: number;
  if (req.fill !== undefined) radiusM = Math.sqrt((req.fill * cellAreaM2(pitchM, lattice)) / Math.PI);
  else if (target.parallel !== undefined) {
    const r = radiusForTarget(target.parallel, pitchM, frequencyHz, host.eps, sigma, lattice);
    if (Number.isFinite(r.radiusM)) radiusM = r.radiusM;
    else {
      reasons.push(r.reason ?? `ε' = ${target.parallel} out of reach`);
      const ends = [MIN_RADIUS_RATIO * pitchM, wireTableMaxRatio(lattice) * pitchM];
      radiusM = ends.reduce((b, x) => (matchError(reAt(x), target.parallel!) < matchError(reAt(b), target.parallel!) ? x : b));
    }
  } else throw new ProgrammerError("designCell: wire-medium needs target.parallel or a fill", req);

  const resp = wireMediumResponse({ pitchM, radiusM, frequencyHz, hostEps: host.eps, conductivitySPerM: sigma, lattice });
  const fill = resp.fill;
  const perp = getMixingRule("mg-cylinder").forward(host.eps, req.inclusion.eps, Math.min(fill, Math.PI / 4));
  const achieved = { parallel: resp.eps, perpendicular: perp, mu: ONE };
  const relError: CellDesign["relError"] = { max: 0 };
  for (const a of ["parallel", "perpendicular"] as const) {
    if (target[a] === undefined) continue;
    relError[a] = matchError(achieved[a], target[a]!);
    relError.max = Math.max(relError.max, relError[a]!);
  }
  const bandTarget = target.parallel ?? resp.eps.re;
  const tolAbs = toleranceAbs(tolerance, bandTarget);
  const band = bandwidthWithinTolerance({ pitchM, radiusM, frequencyHz, hostEps: host.eps, conductivitySPerM: sigma, lattice }, bandTarget, tolAbs);
  const passivity = passivityBandwidthBound(bandTarget, tolAbs);
  const w = 2 * Math.PI * frequencyHz;
  if (resp.plasma.used !== "lattice") reasons.push(`wires of radius ${fmt(radiusM / pitchM)}·pitch are beyond the solved lattice range (r/a ≤ ${wireTableMaxRatio(lattice)}); the thick-wire form is only an estimate there`);
  else if (!resp.plasma.thinWireApplies) notes.push(`thick wires (r/a = ${fmt(radiusM / pitchM)}): the thin-wire formula is off by ${pct(Math.abs(resp.plasma.thinWireRelDiff))}; the lattice value is used`);
  if (sigma / (w * EPS0) < 100) notes.push(`the metal is not a good conductor at this frequency (σ/ωε₀ = ${fmt(sigma / (w * EPS0))}); the wire model assumes one`);
  if (resp.gammaRadPerS > 0.1 * w) notes.push(`strong damping (γ/ω = ${fmt(resp.gammaRadPerS / w)}): thin wires of this metal are lossy`);
  if (resp.eps.re < 0) {
    // below the plasma frequency: no propagating index along the wires' field, the field decays over δ
    const decayM = C0 / (w * Math.sqrt(-resp.eps.re));
    notes.push(`below the plasma frequency (ε' < 0): no propagating wave, the field decays over δ = ${fmt(decayM)} m (pitch/δ = ${fmt(pitchM / decayM)}); the cell size is judged against the wavelength in the host (Belov et al. 2003)${pitchM > decayM ? "; the decay within one cell makes the effective ε an idealization near surfaces" : ""}`);
  }
  const report: WireReport = {
    kind: "wire-medium",
    radiusM,
    plasma: resp.plasma,
    effectivePlasmaHz: resp.effectivePlasmaHz,
    gammaRadPerS: resp.gammaRadPerS,
    skinDepthM: resp.skinDepthM,
    band,
    passivity,
  };
  return finish(req, family, {
    fill,
    dimensions: { radiusM },
    achieved,
    rules: { parallel: "wire-medium", perpendicular: "mg-cylinder" },
    target,
    relError,
    feature: family.smallestFeatureM(fill, pitchM, req.lattice),
    resonance: report,
    reasons,
    notes,
  }, [resp.eps, perp]);
}

function designRingCell(req: CellDesignRequest, family: CellFamily): CellDesign {
  const { pitchM: a, frequencyHz, host } = req;
  const sigma = conductivity(req);
  const tolerance = req.tolerance ?? DEFAULT_TOLERANCE;
  const target = { ...(req.target ?? {}) };
  const sizes = { ...(req.splitRing ?? {}) };
  if (req.fill !== undefined && sizes.ringRadiusM === undefined) sizes.ringRadiusM = a * Math.sqrt(req.fill / Math.PI);
  const style = sizes.ringStyle ?? defaultRingStyle({ hostClass: host.class, processId: req.process?.id, hostEpsRe: host.eps.re });
  const printed = style === "printed";
  const reasons: string[] = [];
  const notes: string[] = [];
  let geometry: SplitRingGeometry | null;
  let resp: SplitRingResponse | null;
  // split cylinders: a given gap means evaluate; printed: evaluate when nothing is left to solve
  const evaluate = printed ? target.mu === undefined || (sizes.ringGapM !== undefined && sizes.ringRadiusM !== undefined) : sizes.ringGapM !== undefined;
  if (evaluate) {
    geometry = printed ? printedGeometry(req, sizes) : { ringStyle: "split-cylinder", pitchM: a, ringRadiusM: sizes.ringRadiusM ?? 0.3 * a, ringWidthM: sizes.ringWidthM ?? a / 20, ringGapM: sizes.ringGapM!, stackSpacingM: sizes.stackSpacingM, metalThicknessM: sizes.metalThicknessM };
    resp = splitRingResponse(geometry, sigma, frequencyHz, host.eps);
    if (!Number.isFinite(resp.resonanceHz)) reasons.push(printed ? "strips too wide for their radius: outside the printed-ring model" : `ring gap ${geometry.ringGapM} m is not below twice the ring width: outside the split-ring model`);
  } else if (target.mu !== undefined) {
    const d = designSplitRing({
      pitchM: a, frequencyHz, targetMu: target.mu, conductivitySPerM: sigma, hostEpsRe: host.eps.re, hostEpsIm: host.eps.im, ringStyle: style,
      ...(req.process ? { minFeatureM: req.process.minFeatureM, minGapM: req.process.minGapM } : {}),
      ...sizes,
    });
    geometry = d.geometry;
    resp = d.response;
    reasons.push(...d.reasons);
    notes.push(...(d.notes ?? []));
  } else throw new ProgrammerError("designCell: split-ring needs target.mu or the ring gap", req);

  if (!geometry || !resp) {
    return finish(req, family, {
      fill: null, dimensions: {}, achieved: { parallel: host.eps, perpendicular: host.eps, mu: { re: NaN, im: NaN } },
      rules: { parallel: "host", perpendicular: "host" }, target, relError: { ...(target.mu !== undefined ? { mu: Infinity } : {}), max: Infinity },
      feature: { featureM: NaN, gapM: NaN }, reasons, notes,
    }, [host.eps]);
  }
  const relError: CellDesign["relError"] = { max: 0 };
  if (target.mu !== undefined) relError.mu = relError.max = matchError(resp.mu, target.mu);
  const bandTarget = target.mu ?? resp.mu.re;
  const tolAbs = toleranceAbs(tolerance, bandTarget);
  const band: RingReport["band"] = splitRingBandwidth(resp, frequencyHz, bandTarget, tolAbs);
  const { ringRadiusM: r, ringWidthM: c, ringGapM: d } = geometry;
  const wall = a - 2 * (r + 2 * c + d);
  if (wall <= 0 && !reasons.some((x) => x.includes("do not fit"))) reasons.push(`rings (outer radius ${fmt(r + 2 * c + d)} m) do not fit a ${a} m cell`);
  const w = 2 * Math.PI * frequencyHz;
  notes.push(`Im μ = ${fmt(resp.mu.im)} at the design frequency (loss from the metal's conductivity${printed && host.eps.im > 0 ? " and the board" : ""}; Q = ω0/Γ = ${fmt((2 * Math.PI * resp.resonanceHz) / resp.gammaRadPerS)})`);
  if (resp.circuit) {
    const k = resp.circuit;
    notes.push(`printed edge-coupled rings (Marqués 2002, Baena 2005 circuit): L = ${fmt(k.inductanceH * 1e9)} nH, C = C0/4 = ${fmt(k.capacitanceF * 1e15)} fF, ε_eff = ${fmt(k.effectivePermittivity)}, F = ${fmt(resp.fill)}; coupling between neighbouring rings is neglected`);
    if (resp.gammaRadPerS > 0.1 * w) notes.push(`strong damping (Γ/ω = ${fmt(resp.gammaRadPerS / w)})`);
  }
  const report: RingReport = {
    kind: "split-ring",
    geometry,
    resonanceHz: resp.resonanceHz,
    magneticPlasmaHz: resp.magneticPlasmaHz,
    muHighFrequency: resp.muHighFrequency,
    gammaRadPerS: resp.gammaRadPerS,
    skinDepthM: resp.skinDepthM,
    band,
    passivity: passivityBandwidthBound(bandTarget, tolAbs, resp.muHighFrequency),
  };
  const dimensions: Record<string, number> = printed
    ? {
      ringRadiusM: r, meanRadiusM: printedMeanRadiusM(geometry), outerRadiusM: printedOuterRadiusM(geometry), ringWidthM: c, ringGapM: d,
      splitGapM: geometry.splitGapM ?? d, stackSpacingM: geometry.stackSpacingM ?? a,
      ...(geometry.boardThicknessM !== undefined ? { boardThicknessM: geometry.boardThicknessM } : {}),
      ...(geometry.metalThicknessM !== undefined ? { metalThicknessM: geometry.metalThicknessM } : {}),
    }
    : { ringRadiusM: r, ringWidthM: c, ringGapM: d, stackSpacingM: geometry.stackSpacingM ?? a };
  const smallestGap = Math.min(d, printed ? geometry.splitGapM ?? d : Infinity, wall > 0 ? wall : Infinity);
  const spread = ringModelSpread(geometry, resp, sigma, frequencyHz, host.eps);
  if (printed) notes.push(`model spread ${pct(spread)}: μ with the flat-strip loop inductance μ₀r0(ln(8r0/c) − ½) instead of Grover's round-wire loop with radius c/4 (the working value)`);
  return finish(req, family, {
    fill: resp.fill,
    dimensions,
    achieved: { parallel: host.eps, perpendicular: host.eps, mu: resp.mu },
    rules: { parallel: "host", perpendicular: "host" },
    target,
    relError,
    feature: { featureM: c, gapM: Math.max(0, Math.min(d, smallestGap)) },
    resonance: report,
    reasons,
    notes,
  }, [host.eps, cMul(host.eps, resp.mu)], spread);
}

/** Printed rings evaluated as given: defaults as in solvePrintedRing, radius the largest that fits. */
function printedGeometry(req: CellDesignRequest, sizes: SplitRingSizes): SplitRingGeometry {
  const a = req.pitchM;
  const c = sizes.ringWidthM ?? printedDefaultSizeM(a, req.process?.minFeatureM);
  const d = sizes.ringGapM ?? printedDefaultSizeM(a, req.process?.minGapM);
  const wall = printedDefaultSizeM(a, req.process?.minGapM);
  const g: SplitRingGeometry = { ringStyle: "printed", pitchM: a, ringRadiusM: sizes.ringRadiusM ?? (a - wall) / 2 - 2 * c - d, ringWidthM: c, ringGapM: d, splitGapM: sizes.splitGapM ?? Math.max(req.process?.minGapM ?? 0, d) };
  if (sizes.stackSpacingM !== undefined) g.stackSpacingM = sizes.stackSpacingM;
  if (sizes.metalThicknessM !== undefined) g.metalThicknessM = sizes.metalThicknessM;
  if (sizes.boardThicknessM !== undefined) g.boardThicknessM = sizes.boardThicknessM;
  return g;
}
