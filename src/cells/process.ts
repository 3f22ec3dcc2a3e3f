/**
 * A fabrication process (one row of catalogs/processes.csv) and the check that a cell's smallest
 * parts are within its reach.
 */
export interface Process {
  id: string;
  name: string;
  /** smallest solid feature (line, rod, strut, wall), m */
  minFeatureM: number;
  /** smallest opening between solid parts, m */
  minGapM: number;
  /** largest height-to-width ratio of a feature or opening */
  maxAspectRatio: number;
  /** material classes the process takes (polymer, resin, laminate, glass, ceramic, semiconductor, metal, liquid, gas) */
  materialClasses: string[];
  /** publication, or "common practice" */
  source: string;
}

export interface ProcessFeature {
  featureM: number;
  gapM: number;
  /** height of the features (slab or layer thickness), m, when known: checked against maxAspectRatio */
  heightM?: number;
}

export interface ProcessCheck {
  ok: boolean;
  reasons: string[];
}

const mm = (m: number): string => `${Number((m * 1e3).toPrecision(3))} mm`;

/**
 * Can `process` make a part with these smallest sizes in this material class?
 * Refuses features below minFeatureM, openings below minGapM (an opening of 0 is a closed cell —
 * fine — only 0 < gap < minGap is refused), height/width above maxAspectRatio, and materials the
 * process does not take. Example: a 0.2 mm rod with a 0.4 mm nozzle process →
 * { ok: false, reasons: ["feature 0.2 mm below the 0.4 mm minimum of fused-filament printing"] }
 */
export function checkProcess(process: Process, feature: ProcessFeature, materialClass: string): ProcessCheck {
  const reasons: string[] = [];
  const tol = 1e-12;
  if (feature.featureM > 0 && feature.featureM < process.minFeatureM * (1 - 1e-9) - tol) {
    reasons.push(`feature ${mm(feature.featureM)} below the ${mm(process.minFeatureM)} minimum of ${process.name}`);
  }
  if (feature.gapM > 0 && feature.gapM < process.minGapM * (1 - 1e-9) - tol) {
    reasons.push(`gap ${mm(feature.gapM)} below the ${mm(process.minGapM)} minimum of ${process.name}`);
  }
  if (feature.heightM !== undefined) {
    const narrowest = Math.min(...[feature.featureM, feature.gapM].filter((x) => x > 0));
    const ratio = feature.heightM / narrowest;
    if (Number.isFinite(ratio) && ratio > process.maxAspectRatio) {
      reasons.push(`aspect ratio ${Number(ratio.toPrecision(3))} above the ${process.maxAspectRatio} maximum of ${process.name}`);
    }
  }
  if (!process.materialClasses.includes(materialClass)) {
    reasons.push(`${process.name} does not take ${materialClass} (takes ${process.materialClasses.join(", ")})`);
  }
  return { ok: reasons.length === 0, reasons };
}

/** Material classes a process row may name: the material catalog's classes. */
export { MATERIAL_CLASSES, type MaterialClass } from "../media/material.js";
