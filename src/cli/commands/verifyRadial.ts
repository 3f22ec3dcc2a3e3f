/**
 * `cellwright verify --method radial`: the cases of the check solved with the exact radial solver
 * (src/verify/radialCases.ts) for cloaks and concentrators — no grid, each figure with the
 * solver's own convergence figure. Plane waves only (the devices are rotationally symmetric, so
 * the angle only turns the bistatic pattern). A case that is not radial says why.
 */
import { InputError } from "../../core/errors.js";
import type { TransformSpec } from "../../field/transformSpec.js";
import { radialCases, radialGeometry, type RadialCaseResult } from "../../verify/radialCases.js";
import { formatFrequency, formatLength } from "../../verify/formatQuantity.js";
import type { CaseSpec } from "../../verify/verifyDevice.js";
import type { CliIo } from "../cliIo.js";
import { EXIT_OK } from "../run.js";

const C0 = 299_792_458;

export interface RadialVerifyInput {
  designName: string;
  scheme: string;
  polarization: "Ez" | "Hz";
  frequencyHz: number;
  transform: TransformSpec;
  cases: CaseSpec[];
  accuracy: number;
  angleDeg: number;
  json: boolean;
  notes: string[];
}

const jn = (v: number | null): number | null => (v !== null && Number.isFinite(v) ? v : null);

/** Run, print (table or one JSON object) and return the exit code (2 when a figure is not converged). */
export function runRadialVerify(io: CliIo, r: RadialVerifyInput): number {
  const geo = radialGeometry(r.transform);
  if ("reason" in geo) throw new InputError({ where: "--method", message: `radial does not apply: ${geo.reason}` });
  const k0 = (2 * Math.PI * r.frequencyHz) / C0;
  const results = radialCases(r.transform, r.cases, k0, 1e-9, (r.angleDeg * Math.PI) / 180);
  const converged = (c: RadialCaseResult): boolean | null => (c.available ? c.uncertainty! <= r.accuracy : null);
  const allConverged = results.every((c) => !c.available || converged(c) === true);
  if (r.json) {
    io.stdout(`${JSON.stringify({
      design: r.designName, method: "radial", polarization: r.polarization, scheme: r.scheme, frequencyHz: r.frequencyHz,
      illumination: { kind: "plane", angleDeg: r.angleDeg }, accuracy: r.accuracy, converged: allConverged,
      cases: results.map((c) => ({
        name: c.name, available: c.available, reason: c.reason,
        scatteringWidthM: jn(c.scatteringWidthM), uncertainty: jn(c.uncertainty), converged: converged(c),
        vsBare: jn(c.vsBare), absorptionWidthM: jn(c.absorptionWidthM),
        bistaticM: c.bistaticM ? Array.from(c.bistaticM) : null,
      })),
      notes: r.notes,
    })}\n`);
  } else {
    const lines = [
      `${r.designName} — exact radial solution (no grid), ${r.polarization}, scheme ${r.scheme}, ${formatFrequency(r.frequencyHz)}, plane wave at ${r.angleDeg}°`,
      "",
      `${"case".padEnd(10)} ${"σ_s".padStart(12)} ${"σ/σ_bare".padStart(10)} ${"uncertainty".padStart(12)}  status`,
    ];
    for (const c of results) {
      if (!c.available) { lines.push(`${c.name.padEnd(10)} ${"—".padStart(12)} ${"—".padStart(10)} ${"—".padStart(12)}  not computed: ${c.reason}`); continue; }
      lines.push(`${c.name.padEnd(10)} ${formatLength(c.scatteringWidthM!).padStart(12)} ${(c.vsBare === null ? "—" : c.vsBare.toPrecision(4)).padStart(10)} ${c.uncertainty!.toExponential(1).padStart(12)}  ${converged(c) ? "converged" : "not converged"}`);
    }
    io.stdout(`${lines.join("\n")}\n`);
  }
  for (const n of r.notes) io.stderr(`note: ${n}\n`);
  return allConverged ? EXIT_OK : 2;
}
