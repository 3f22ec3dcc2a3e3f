/**
 * `cellwright mix`: one mixing rule forward (fill fraction → ε_eff) or inverse (target → fill
 * fraction), with the Wiener and Hashin–Shtrikman bounds of the pair and the spread between
 * Maxwell Garnett and Bruggeman at that fill fraction. Phases are numbers ("4", "-10+1i") or
 * catalog material ids evaluated at --frequency.
 */
import { formatComplex, type Complex } from "../../core/complex.js";
import { InputError } from "../../core/errors.js";
import { findMaterial, loadMaterialCatalog } from "../../io/materialCatalog.js";
import { boundsCheck, hashinShtrikmanBounds, realBoundsApply, wienerBounds } from "../../media/bounds.js";
import { spheroidDepolarization } from "../../media/depolarization.js";
import { evaluateMaterial, type Material } from "../../media/material.js";
import type { MixingParams, MixingRuleId } from "../../media/mixing/mixingRule.js";
import { getMixingRule, MIXING_RULE_IDS } from "../../media/mixing/registry.js";
import { mgBruggemanSpread } from "../../media/uncertainty.js";
import { flagOption, stringOption } from "../args.js";
import type { CliIo } from "../cliIo.js";
import type { Command } from "../command.js";
import { EXIT_NOT_BUILDABLE, EXIT_OK } from "../run.js";
import { frequencyFromOptions } from "./material.js";

const NUMBER = String.raw`[+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?`;
const COMPLEX_RE = new RegExp(`^(${NUMBER})?(?:([+-](?:\\d+\\.?\\d*|\\.\\d+)(?:[eE][+-]?\\d+)?|[+-])?[ij])?$`);

/**
 * "4" → 4; "-10+1i" → −10 + i; "2.2+0.01j" → 2.2 + 0.01i; "3i" → 3i; undefined when the text is
 * not a number (then it may be a material id).
 */
export function parseComplexText(text: string): Complex | undefined {
  const t = text.replace(/\s+/g, "");
  if (t === "") return undefined;
  const plain = Number(t);
  if (Number.isFinite(plain) && /^[+-]?[\d.]/.test(t)) return { re: plain, im: 0 };
  // pure imaginary: "3i", "-0.5j"
  const pureIm = new RegExp(`^(${NUMBER})[ij]$`).exec(t);
  if (pureIm) return { re: 0, im: Number(pureIm[1]) };
  const m = COMPLEX_RE.exec(t);
  if (!m || m[1] === undefined || m[2] === undefined) return undefined;
  const im = m[2] === "+" ? 1 : m[2] === "-" ? -1 : Number(m[2]);
  const re = Number(m[1]);
  return Number.isFinite(re) && Number.isFinite(im) ? { re, im } : undefined;
}

const RULE_DIMENSION: Record<MixingRuleId, 2 | 3> = {
  "mg-sphere": 3,
  "mg-cylinder": 2,
  "mg-ellipsoid": 3,
  parallel: 3,
  series: 3,
  "bruggeman-3d": 3,
  "bruggeman-2d": 2,
};

interface Phase {
  value: Complex;
  material?: Material;
}

async function resolvePhase(text: string, where: string, frequencyHz: number | undefined, io: CliIo): Promise<Phase> {
  const c = parseComplexText(text);
  if (c) {
    if (c.im < 0) io.stderr(`warning: ${where}: Im ε < 0 is an active (gain) medium under exp(-iωt)\n`);
    return { value: c };
  }
  const catalog = await loadMaterialCatalog();
  const m = findMaterial(catalog, text, where);
  if (frequencyHz === undefined) throw new InputError({ where, message: `material '${text}' needs --frequency (or --wavelength) to give its permittivity` });
  const v = evaluateMaterial(m, frequencyHz);
  if (v.warning) io.stderr(`warning: ${where}: ${v.warning}\n`);
  return { value: v.eps, material: m };
}

function number01(text: string, where: string, what: string): number {
  const v = Number(text);
  if (text.trim() === "" || !Number.isFinite(v) || v < 0 || v > 1) throw new InputError({ where, message: `expected ${what} in [0, 1], got '${text}'` });
  return v;
}

/** Spread above which a mix is flagged uncertain (5 %: common practice, a typical design tolerance). */
export const DEFAULT_SPREAD_TOLERANCE = 0.05;

const fmt = (x: number) => Number(x.toPrecision(6)).toString();
const finiteOrNull = (x: number) => (Number.isFinite(x) ? x : null);
const complexJson = (c: Complex) => ({ re: finiteOrNull(c.re), im: finiteOrNull(c.im) });

export const command: Command = {
  name: "mix",
  summary: "effective permittivity of a two-phase mixture, or the fill fraction that gives a target",
  usage: "mix --rule RULE --host EPS --inclusion EPS (--fill F | --target EPS) [--depolarization N | --aspect M] [--frequency F | --wavelength L] [--tolerance T] [--json]",
  details: [
    `RULE is one of ${MIXING_RULE_IDS.join(", ")}.`,
    "EPS is a real or complex relative permittivity ('4', '-10+1i'; exp(-iωt), so +i is loss) or a",
    "material id from 'cellwright material --list', evaluated at --frequency (or --wavelength).",
    "--fill gives ε_eff; --target solves for the fill fraction matching the target's real part (the",
    "loss follows; a given imaginary part is compared). mg-ellipsoid needs --depolarization N (field",
    "along an axis with factor N) or --aspect M (spheroid axis/equatorial ratio, field along the axis).",
    "Also printed: Wiener and Hashin–Shtrikman bounds at that fill, and the relative spread between",
    "Maxwell Garnett and Bruggeman there (large spread: verify with a full-wave unit-cell simulation).",
    "Exit 2 when the target cannot be reached with this pair and rule.",
  ].join("\n"),
  options: [
    { name: "rule", type: "string", valueName: "RULE", description: "mixing rule" },
    { name: "host", type: "string", valueName: "EPS", description: "host permittivity or material id" },
    { name: "inclusion", type: "string", valueName: "EPS", description: "inclusion permittivity or material id" },
    { name: "fill", type: "string", valueName: "F", description: "fill fraction of the inclusion, 0..1" },
    { name: "target", type: "string", valueName: "EPS", description: "target effective permittivity (solve for the fill fraction)" },
    { name: "depolarization", type: "string", valueName: "N", description: "depolarization factor along the field (mg-ellipsoid), 0..1" },
    { name: "aspect", type: "string", valueName: "M", description: "spheroid aspect ratio, field along the axis (mg-ellipsoid)" },
    { name: "frequency", type: "string", valueName: "F", description: "frequency for material ids, e.g. '10 GHz'" },
    { name: "wavelength", type: "string", valueName: "L", description: "vacuum wavelength for material ids, e.g. '1550 nm'" },
    { name: "tolerance", type: "string", valueName: "T", description: "relative MG–Bruggeman spread above which the mix is flagged uncertain (default 0.05)" },
    { name: "json", type: "boolean", description: "print one JSON object on stdout" },
  ],
  maxPositionals: 0,
  async run(args, io) {
    const ruleText = stringOption(args, "rule");
    if (ruleText === undefined) throw new InputError({ where: "--rule", message: `expected a mixing rule (${MIXING_RULE_IDS.join(", ")})` });
    const rule = getMixingRule(ruleText, "--rule");
    const hostText = stringOption(args, "host");
    const inclusionText = stringOption(args, "inclusion");
    const issues = [];
    if (hostText === undefined) issues.push({ where: "--host", message: "expected the host permittivity or a material id" });
    if (inclusionText === undefined) issues.push({ where: "--inclusion", message: "expected the inclusion permittivity or a material id" });
    const fillText = stringOption(args, "fill");
    const targetText = stringOption(args, "target");
    if ((fillText === undefined) === (targetText === undefined)) issues.push({ where: "mix", message: "give exactly one of --fill F or --target EPS" });
    const depText = stringOption(args, "depolarization");
    const aspectText = stringOption(args, "aspect");
    const params: MixingParams = {};
    if (rule.id === "mg-ellipsoid") {
      if ((depText === undefined) === (aspectText === undefined)) issues.push({ where: "--depolarization", message: "mg-ellipsoid needs exactly one of --depolarization N or --aspect M" });
    } else if (depText !== undefined || aspectText !== undefined) {
      issues.push({ where: depText !== undefined ? "--depolarization" : "--aspect", message: `only for --rule mg-ellipsoid (${rule.id} has its own geometry)` });
    }
    if (issues.length) throw new InputError(issues);
    if (depText !== undefined) params.depolarization = number01(depText, "--depolarization", "a depolarization factor");
    if (aspectText !== undefined) {
      const m = Number(aspectText);
      if (!(m > 0) || !Number.isFinite(m)) throw new InputError({ where: "--aspect", message: `expected an aspect ratio > 0, got '${aspectText}'` });
      params.depolarization = spheroidDepolarization(m).axis;
    }
    const tolText = stringOption(args, "tolerance");
    const tolerance = tolText === undefined ? DEFAULT_SPREAD_TOLERANCE : Number(tolText);
    if (!(tolerance > 0) || !Number.isFinite(tolerance)) throw new InputError({ where: "--tolerance", message: `expected a relative tolerance > 0, got '${tolText}'` });
    const fill = fillText !== undefined ? number01(fillText, "--fill", "a fill fraction") : undefined;
    let target: Complex | undefined;
    if (targetText !== undefined) {
      target = parseComplexText(targetText);
      if (!target) throw new InputError({ where: "--target", message: `expected a real or complex number such as '3.2' or '3.2+0.01i', got '${targetText}'` });
    }
    const frequencyHz = await frequencyFromOptions(args);
    const host = await resolvePhase(hostText as string, "--host", frequencyHz, io);
    const inclusion = await resolvePhase(inclusionText as string, "--inclusion", frequencyHz, io);
    const dimension = RULE_DIMENSION[rule.id];
    const json = flagOption(args, "json");

    let usedFill: number;
    let eps: Complex;
    let inverse: { target: Complex; converged: boolean; iterations: number; lossMismatch?: number; reason?: string } | undefined;
    if (fill !== undefined) {
      usedFill = fill;
      eps = rule.forward(host.value, inclusion.value, fill, params);
      if (!Number.isFinite(eps.re) || !Number.isFinite(eps.im)) {
        throw new InputError({ where: "--rule", message: `${rule.id} gives no finite effective permittivity for these phases at fill ${fill} (a phase of ε = 0 in series, or a pole of the rule); expected phases away from that` });
      }
    } else {
      const t = target as Complex;
      const r = rule.inverse(host.value, inclusion.value, t.re, params);
      usedFill = r.fill;
      eps = r.achieved;
      let reason = r.reason;
      if (Number.isNaN(r.fill)) {
        const check = boundsCheck(host.value, inclusion.value, t.re, dimension);
        if (check.message && !check.reachable) reason = check.message;
      }
      inverse = {
        target: t,
        converged: r.converged,
        iterations: r.iterations,
        ...(t.im !== 0 && Number.isFinite(r.fill) ? { lossMismatch: r.achieved.im - t.im } : {}),
        ...(reason ? { reason } : {}),
      };
    }
    const reachable = Number.isFinite(usedFill);
    const h = host.value.re;
    const i = inclusion.value.re;
    const boundsApply = realBoundsApply(host.value, inclusion.value);
    const wiener = reachable && boundsApply ? wienerBounds(h, i, usedFill) : ([NaN, NaN] as [number, number]);
    const hs = reachable && boundsApply ? hashinShtrikmanBounds(h, i, usedFill, dimension) : ([NaN, NaN] as [number, number]);
    // Laminates (parallel, series) are exact for layered cells (Wiener 1912): no model spread.
    const exact = rule.id === "parallel" || rule.id === "series";
    const spread = !reachable ? NaN : exact ? 0 : mgBruggemanSpread(host.value, inclusion.value, usedFill, dimension, rule.id === "mg-ellipsoid" ? params.depolarization : undefined);
    if (!reachable) io.stderr(`error: --target: ${inverse?.reason ?? "unreachable"}\n`);
    else if (inverse && !inverse.converged) io.stderr(`warning: --target: ${inverse.reason ?? "the iteration did not converge"}\n`);

    if (json) {
      io.stdout(
        `${JSON.stringify({
          rule: rule.id,
          host: { eps: complexJson(host.value), ...(host.material ? { material: host.material.id } : {}) },
          inclusion: { eps: complexJson(inclusion.value), ...(inclusion.material ? { material: inclusion.material.id } : {}) },
          ...(frequencyHz !== undefined ? { frequencyHz } : {}),
          ...(params.depolarization !== undefined ? { depolarization: params.depolarization } : {}),
          fill: finiteOrNull(usedFill),
          eps: complexJson(eps),
          reachable,
          bounds: {
            wiener: wiener.map(finiteOrNull),
            hashinShtrikman: hs.map(finiteOrNull),
            dimension,
            applies: boundsApply,
          },
          mgBruggemanSpread: finiteOrNull(spread),
          uncertain: reachable && spread > tolerance,
          ...(inverse
            ? {
                inverse: {
                  target: complexJson(inverse.target),
                  converged: inverse.converged,
                  iterations: inverse.iterations,
                  ...(inverse.lossMismatch !== undefined ? { lossMismatch: inverse.lossMismatch } : {}),
                  ...(inverse.reason ? { reason: inverse.reason } : {}),
                },
              }
            : {}),
        })}\n`,
      );
      return reachable ? EXIT_OK : EXIT_NOT_BUILDABLE;
    }
    const phase = (p: Phase) => `${formatComplex(p.value)}${p.material ? ` (${p.material.id})` : ""}`;
    const lines = [`${rule.id}: ${rule.description}`, `  host       ${phase(host)}`, `  inclusion  ${phase(inclusion)}`];
    if (params.depolarization !== undefined) lines.push(`  N          ${fmt(params.depolarization)}`);
    if (inverse) lines.push(`  target     ${formatComplex(inverse.target)} (real part matched)`);
    if (!reachable) {
      lines.push("  no fill fraction reaches the target");
      io.stdout(lines.join("\n") + "\n");
      return EXIT_NOT_BUILDABLE;
    }
    lines.push(`  fill       ${fmt(usedFill)}`, `  ε_eff      ${formatComplex(eps)}`);
    if (inverse) {
      lines.push(`  solve      ${inverse.iterations === 0 ? "closed form" : `${inverse.iterations} evaluations`}, ${inverse.converged ? "converged" : "NOT converged"}`);
      if (inverse.lossMismatch !== undefined) lines.push(`  loss       Im ε_eff − Im target = ${fmt(inverse.lossMismatch)}`);
    }
    if (boundsApply) {
      lines.push(`  Wiener     ${fmt(wiener[0])} – ${fmt(wiener[1])} (any geometry at this fill)`);
      lines.push(`  HS ${dimension}D      ${fmt(hs[0])} – ${fmt(hs[1])} (isotropic mixtures at this fill${rule.id === "parallel" || rule.id === "series" || rule.id === "mg-ellipsoid" ? "; this rule is anisotropic and may lie outside" : ""})`);
    } else lines.push("  bounds     not applicable (a lossy or negative phase)");
    lines.push(exact
      ? "  MG vs Br   not applicable: a laminate is exact for layered cells (Wiener)"
      : `  MG vs Br   ${fmt(spread * 100)} % relative spread at this fill${spread > tolerance ? " — uncertain: verify with a full-wave unit-cell simulation" : ""}`);
    io.stdout(lines.join("\n") + "\n");
    return EXIT_OK;
  },
};
