/**
 * A dispersive background in the frequency sweep. A design may name the catalog material its
 * device is embedded in (`reduction.backgroundMaterial`); its index at the design frequency is the
 * reduction's background index (checked within BACKGROUND_INDEX_TOLERANCE), and at every other
 * frequency of a sweep the background follows the material's own dispersion model (Sellmeier,
 * Debye, Lorentz …, catalogs/materials.csv with its source):
 *
 *   ε_bg(f) = ε_bg(f₀) · s(f),   s(f) = Re ε_m(f) / Re ε_m(f₀),   μ_bg unchanged,
 *
 * so the centre of a sweep at f₀ is the single-frequency check exactly, and ε_bg(f) = Re ε_m(f)
 * where the design's index equals the material's.
 * What follows it: the medium around the device (the bare object, every case's surroundings, the
 * realized map's cells without a recipe, the drawn case's surroundings) and the ideal and reduced
 * maps, scaled by the same s: ε′ = J ε_b Jᵀ / det J is linear in ε_b, and every reduction scheme's
 * ε scales with the background's ε while its μ does not (reduce/backgroundMedium.ts), so the ideal
 * and reduced devices stay those of the background the device actually sits in at f. (The matched
 * scheme's boundary constant is kept as designed at f₀.) The realized recipes follow their own
 * materials (recipeAtFrequency.ts), the drawn inclusions theirs (bulkMaterialsAt): a host made of
 * the background's material tracks it, a device of another material does not, which is what the
 * sweep then shows.
 * Not modelled: the background's loss (Im ε). Scattering widths need a lossless surrounding medium
 * (the incident wave would decay on its way in), so the real part is taken and the loss tangent at
 * each frequency is reported beside it. A magnetic or metallic background material is refused.
 * Pure.
 */
import { InputError, closest } from "../../core/errors.js";
import { evaluateMaterial, type Material } from "../../media/material.js";
import { backgroundMedium } from "../../reduce/backgroundMedium.js";
import type { ReducedField } from "../../reduce/reducedField.js";

/** Largest relative difference between the material's index at f₀ and the design's background index. */
export const BACKGROUND_INDEX_TOLERANCE = 0.01;

/** What a sweep point needs to follow the background (plain data: it crosses to worker threads). */
export interface BackgroundDispersion {
  /** catalog id of the background material */
  materialId: string;
  /** the design frequency, where the background is the design's own */
  designFrequencyHz: number;
}

/** The background material, checked against the design (see file comment). */
export interface BackgroundMaterialInfo {
  material: Material;
  /** Re ε of the material at the design frequency */
  epsRe: number;
  /** its index √(Re ε) there */
  index: number;
}

/**
 * Whether `material` can be a background at `designFrequencyHz`: not a metal, non-magnetic, valid
 * there, Re ε > 0. Returns its Re ε and index, or the reason it cannot (a message fragment).
 */
export function materialAsBackground(material: Material, designFrequencyHz: number): { ok: true; epsRe: number; index: number } | { ok: false; message: string } {
  const id = material.id;
  if (material.class === "metal") return { ok: false, message: `'${id}' is a metal: a background must be a dielectric the wave travels in` };
  const v = evaluateMaterial(material, designFrequencyHz);
  if (material.mu && (material.mu.re !== 1 || material.mu.im !== 0)) return { ok: false, message: `'${id}' is magnetic (μ = ${material.mu.re}): only a non-magnetic background is followed` };
  if (!v.inRange) return { ok: false, message: `${v.warning ?? `'${id}' is not valid at the design frequency`}` };
  if (!(v.eps.re > 0) || !Number.isFinite(v.eps.re)) return { ok: false, message: `'${id}' has Re ε = ${v.eps.re} at the design frequency: expected a dielectric (Re ε > 0)` };
  return { ok: true, epsRe: v.eps.re, index: Math.sqrt(v.eps.re) };
}

/** The catalog's materials that can be a background at `designFrequencyHz` (materialAsBackground), with their index there, lowest index first. */
export function backgroundMaterialChoices(catalog: readonly Material[], designFrequencyHz: number): { id: string; name: string; index: number }[] {
  const out: { id: string; name: string; index: number }[] = [];
  for (const m of catalog) {
    const r = materialAsBackground(m, designFrequencyHz);
    if (r.ok) out.push({ id: m.id, name: m.name, index: r.index });
  }
  return out.sort((a, b) => a.index - b.index || (a.id < b.id ? -1 : 1));
}

/**
 * Look up and check the background material `id` (`where` names the JSON path): in the catalog, not a
 * metal, non-magnetic, valid at the design frequency, its index within 1 % of `backgroundIndex`
 * (the reduction's background index, `indexWhere` naming where it came from). Throws InputError.
 */
export function checkBackgroundMaterial(id: string, catalog: readonly Material[], designFrequencyHz: number, backgroundIndex: number, where: string, indexWhere: string): BackgroundMaterialInfo {
  const material = catalog.find((m) => m.id === id);
  if (!material) {
    const near = closest(id, catalog.map((m) => m.id), 3);
    throw new InputError({ where, message: `unknown material '${id}'${near.length ? `; did you mean ${near.join(", ")}?` : ""} (see cellwright material)` });
  }
  const r = materialAsBackground(material, designFrequencyHz);
  if (!r.ok) throw new InputError({ where, message: r.message });
  const { epsRe, index } = r;
  if (Math.abs(index / backgroundIndex - 1) > BACKGROUND_INDEX_TOLERANCE) {
    throw new InputError({
      where,
      message: `'${id}' has index ${index.toPrecision(5)} at the design frequency (Re ε ${epsRe.toPrecision(5)}), the device's background index is ${backgroundIndex.toPrecision(5)} (${indexWhere}): expected them equal within ${BACKGROUND_INDEX_TOLERANCE * 100} % (set reduction.backgroundIndex to ${index.toPrecision(5)})`,
    });
  }
  return { material, epsRe, index };
}

/**
 * The design's `reduction.backgroundMaterial` checked against the background index the reduction
 * uses (`checkBackgroundMaterial`), with the JSON paths and option named as every command reports
 * them; null when the design names no background material. `indexOverride` says where an index
 * that overrides the design's came from (`true`: the --background-index option; a string: that
 * place, e.g. a session file's key), false when none did.
 */
export function checkDesignBackgroundMaterial(
  design: { sourcePath: string; frequencyHz: number; reduction?: { backgroundMaterial?: string; backgroundIndex?: number } },
  indexOverride: boolean | string, catalog: readonly Material[], backgroundIndex: number,
): BackgroundMaterialInfo | null {
  const id = design.reduction?.backgroundMaterial;
  if (id === undefined) return null;
  const indexWhere = indexOverride === true ? "--background-index"
    : typeof indexOverride === "string" ? indexOverride
      : design.reduction?.backgroundIndex !== undefined ? `${design.sourcePath}: $.reduction.backgroundIndex` : `the design's background, ${design.sourcePath}: $.background`;
  return checkBackgroundMaterial(id, catalog, design.frequencyHz, backgroundIndex, `${design.sourcePath}: $.reduction.backgroundMaterial`, indexWhere);
}

/**
 * The same check from the design alone, before its field is computed: the field's background is the
 * design's (`$.background`), so the index the reduction will use is `backgroundMedium(background,
 * reductionIndex).index`, where `reductionIndex` is the background index the command hands its
 * reduction (undefined: none, the design's own background). Used by `plan`, `start`, `verify`,
 * `reduce` and the interactive session.
 */
export function checkBackgroundMaterialBeforeReduction(
  design: { sourcePath: string; frequencyHz: number; background: { eps: number; mu: number }; reduction?: { backgroundMaterial?: string; backgroundIndex?: number } },
  indexOverride: boolean | string, catalog: readonly Material[], reductionIndex: number | undefined,
): BackgroundMaterialInfo | null {
  if (design.reduction?.backgroundMaterial === undefined) return null;
  return checkDesignBackgroundMaterial(design, indexOverride, catalog, backgroundMedium(design.background, reductionIndex).index);
}

/** The background at one frequency: the scale s(f) on ε, and the material's values there. */
export interface BackgroundAt {
  /** s(f) = Re ε_m(f) / Re ε_m(f₀) */
  scale: number;
  /** the material's Re ε and loss tangent at f */
  epsRe: number;
  lossTangent: number;
  /** the model is inside its valid range at f */
  inRange: boolean;
}

/** The background material's values at `frequencyHz` (see file comment). Throws RangeError for a material missing from the catalog (checked at the edge). */
export function backgroundAt(d: BackgroundDispersion, catalog: readonly Material[], frequencyHz: number): BackgroundAt {
  const m = catalog.find((x) => x.id === d.materialId);
  if (!m) throw new RangeError(`backgroundAt: material '${d.materialId}' is not in the catalog`);
  const v = evaluateMaterial(m, frequencyHz);
  const v0 = evaluateMaterial(m, d.designFrequencyHz);
  return { scale: frequencyHz === d.designFrequencyHz ? 1 : v.eps.re / v0.eps.re, epsRe: v.eps.re, lossTangent: v.lossTangent, inRange: v.inRange };
}

/**
 * A reduced field in a background whose ε is `scale` times the one it was reduced for: every ε
 * component (and, in Hz, the in-plane principal values) times `scale`, μ unchanged; the settings
 * say the new background (epsScale, index √scale times, impedance 1/√scale times), so a continuous
 * scene evaluated from them (continuousScene.ts) gives the same values. `scale` 1 returns `red`.
 */
export function scaleReducedEps(red: ReducedField, scale: number): ReducedField {
  if (scale === 1) return red;
  const components: Record<string, Float64Array> = {};
  for (const [k, v] of Object.entries(red.components)) components[k] = k.startsWith("eps") ? v.map((x) => x * scale) : v;
  const inPlaneEps = red.polarization === "Hz";
  const root = Math.sqrt(scale);
  return {
    ...red,
    components,
    principal: inPlaneEps ? [red.principal[0].map((x) => x * scale), red.principal[1].map((x) => x * scale)] : red.principal,
    settings: { ...red.settings, epsScale: red.settings.epsScale * scale, backgroundIndex: red.settings.backgroundIndex * root, backgroundImpedance: red.settings.backgroundImpedance / root },
  };
}
